// Linear buckling: Euler cantilever column and the simply supported square plate in uniform
// compression, with the Sturm (inertia) check.
#include "solver/linear_buckling.hpp"

#include "tests/solver/plate_mesh.hpp"
#include "tests/test_support.hpp"

#include <cmath>
#include <cstdio>
#include <numbers>

namespace rotcap {
namespace {

using testing::rectangular_plate;
using testing::support;
constexpr double kPi = std::numbers::pi;

TEST(LinearBuckling, CantileverColumnMatchesEulerLoad) {
  // Narrow strip column L = 100, b = 10, t = 1 mm, E = 210 000 MPa, nu = 0 (a beam of
  // EI = E b t^3 / 12 about its weak axis), clamped at x = 0, free at x = L, reference load 1 N
  // compression along -x shared along the free edge.
  const double L = 100.0, b = 10.0, t = 1.0, E = 210000.0;
  ShellModel m = rectangular_plate(L, b, 20, 2, t);
  m.supports.push_back(support("x0", {"ux", "uy", "uz", "rx", "ry", "rz"}));
  GroupLoad load;
  load.group = "xa";
  load.force = Eigen::Vector3d(-1.0, 0.0, 0.0);
  m.loads.push_back(load);
  const SectionAssignment sections = SectionAssignment::elastic(m, E, 0.0);
  const BucklingResult r = solve_linear_buckling(m, sections, 2);
  ASSERT_TRUE(r.ok()) << r.message;
  ASSERT_EQ(r.load_factors.size(), 2u);
  // Euler, cantilever (effective length 2 L): P_cr = pi^2 E I / (4 L^2)
  // (Timoshenko & Gere, Theory of Elastic Stability, 2nd ed. 1961, ch. 2; CONF-2nd in
  // docs/spec/references.md). The second mode, 9 P_cr (P_n = (2n - 1)^2 pi^2 E I / (4 L^2), n = 2, same
  // chapter), is FROM MEMORY. With b/t = 10 the strong-axis mode is 100 P_cr, far above.
  const double I = b * t * t * t / 12.0;
  const double p_cr = kPi * kPi * E * I / (4.0 * L * L);
  std::printf("[ Euler cantilever 20x2 ] lambda1 = %.5f N (ref %.5f, error %.3f %%), lambda2 = %.5f N (ref %.5f, "
              "error %.3f %%), Sturm %d/%d at s = %.5f\n",
              r.load_factors[0], p_cr, 100.0 * (r.load_factors[0] / p_cr - 1.0), r.load_factors[1], 9.0 * p_cr,
              100.0 * (r.load_factors[1] / (9.0 * p_cr) - 1.0), r.sturm.negative_pivots, r.sturm.modes_below_shift,
              r.sturm.shift);
  EXPECT_CLOSE(r.load_factors[0], p_cr, 0.02, 0.0);
  EXPECT_CLOSE(r.load_factors[1], 9.0 * p_cr, 0.02, 0.0);
  EXPECT_TRUE(r.sturm.passed());
  EXPECT_EQ(r.sturm.negative_pivots, 2);
  // The first mode is out of plane (w), largest at the free end, normalised to 1.
  const Eigen::VectorXd& phi = r.modes[0];
  double tip_w = 0.0, max_inplane = 0.0;
  for (int v : m.groups.at("xa").nodes) tip_w += phi[6 * v + 2] / 3.0;
  for (int v = 0; v < m.node_count(); ++v) max_inplane = std::max(max_inplane, phi.segment<2>(6 * v).norm());
  EXPECT_CLOSE(std::abs(tip_w), 1.0, 1e-6, 0.0);
  EXPECT_LT(max_inplane, 0.1);
}

// Simply supported square plate a = b = 100 mm, t = 1 mm, E = 210 000 MPa, nu = 0.3, uniform
// compression N_xx = -1 N/mm applied on the edge x = a.
// Out of plane: uz = 0 on all four edges and the rotation about the edge normal held (rx on
// x = 0, a; ry on y = 0, b), the rotation about the edge free: the "hard" simple support, whose
// tangential slope is zero as on a Kirchhoff edge with w = 0. (With that rotation free, the
// "soft" support, a Mindlin plate has a boundary layer of width ~t that lowers k by O(t/b) and
// needs elements of size ~t to converge: measured 3.984 at 48 x 48 and still falling.)
// In plane: ux = 0 on the edge x = 0 (it reacts the load) and uy = 0 at the corner (0, 0) only;
// the plate can shorten along x and expand along y (Poisson) freely, so the prebuckling state
// is the exact uniform stress N_xx = -1, N_yy = N_xy = 0, and only rigid-body motion is held.
ShellModel square_plate(int n) {
  ShellModel m = rectangular_plate(100.0, 100.0, n, n, 1.0);
  for (const char* edge : {"x0", "xa"}) m.supports.push_back(support(edge, {"uz", "rx"}));
  for (const char* edge : {"y0", "yb"}) m.supports.push_back(support(edge, {"uz", "ry"}));
  m.supports.push_back(support("x0", {"ux"}));
  testing::add_point_group(m, "corner", {testing::plate_node(n, 0, 0)});
  m.supports.push_back(support("corner", {"uy"}));
  GroupLoad load;
  load.group = "xa";
  load.force = Eigen::Vector3d(-100.0, 0.0, 0.0);  // N_xx b = -1 N/mm * 100 mm
  m.loads.push_back(load);
  return m;
}

TEST(LinearBuckling, SimplySupportedSquarePlateGivesBucklingCoefficientFour) {
  const double a = 100.0, t = 1.0, E = 210000.0, nu = 0.3;
  const ShellModel m = square_plate(24);
  const SectionAssignment sections = SectionAssignment::elastic(m, E, nu);
  const BucklingResult r = solve_linear_buckling(m, sections, 2);
  ASSERT_TRUE(r.ok()) << r.message;
  // Prebuckling membrane state is the uniform N_xx = -1 N/mm (patch-test exact).
  for (const ShellQ4Resultants& res : r.prebuckling.resultants)
    for (const Vec6& g : res.r) {
      EXPECT_CLOSE(g[0], -1.0, 1e-8, 0.0);
      EXPECT_LT(std::abs(g[1]) + std::abs(g[2]), 1e-8);
    }
  // sigma_cr t = k pi^2 D / b^2 with D = E t^3 / (12 (1 - nu^2)) (Timoshenko & Gere 1961, ch. 9;
  // formula CONF-2nd in docs/spec/references.md). k = (m b / a + a / (m b))^2: k = 4 for m = 1 and 6.25 for
  // m = 2 half-waves on a square plate -- these k values are FROM MEMORY (docs/spec/references.md, MEMORY).
  // Transverse shear lowers the Mindlin value by about pi^2 D / (k_s G t) (2 / b^2) = 0.06 %.
  const double D = E * t * t * t / (12.0 * (1.0 - nu * nu));
  const double n_unit = kPi * kPi * D / (a * a);  // N_cr / k [N/mm]
  const double k1 = r.load_factors[0] / n_unit, k2 = r.load_factors[1] / n_unit;
  std::printf("[ SS square plate 24x24 ] k1 = %.4f (ref 4.0, error %.3f %%), k2 = %.4f (ref 6.25, error %.3f %%), "
              "Sturm %d/%d at s = %.5f\n",
              k1, 100.0 * (k1 / 4.0 - 1.0), k2, 100.0 * (k2 / 6.25 - 1.0), r.sturm.negative_pivots,
              r.sturm.modes_below_shift, r.sturm.shift);
  EXPECT_CLOSE(k1, 4.0, 0.02, 0.0);
  EXPECT_CLOSE(k2, 6.25, 0.02, 0.0);
  EXPECT_TRUE(r.sturm.passed());
  EXPECT_EQ(r.sturm.negative_pivots, 2);
  // Mode 1 is one half-wave each way: w at the centre is the largest translation (= 1).
  const int centre = testing::plate_node(24, 12, 12);
  EXPECT_CLOSE(r.modes[0][6 * centre + 2], 1.0, 1e-6, 0.0);
}

TEST(LinearBuckling, SturmCheckDetectsAMissedMode) {
  // The check on its own: from a converged 3-mode result, drop the lowest load factor as a
  // Lanczos run that missed it would. The inertia of K + s Kg still counts 3 eigenvalues below s
  // (s above lambda_3) against 2 load factors: the mismatch is caught.
  const ShellModel m = square_plate(8);
  const SectionAssignment sections = SectionAssignment::elastic(m, 210000.0, 0.3);
  const BucklingResult r = solve_linear_buckling(m, sections, 3);
  ASSERT_TRUE(r.ok()) << r.message;
  EXPECT_TRUE(r.sturm.passed());
  LinearShellSystem system(m, sections);
  const LinearStaticResult pre = solve_linear_static(system);
  ASSERT_TRUE(pre.ok()) << pre.message;
  std::vector<double> kg;
  ASSERT_TRUE(system.assemble_matrix(system.elements().geometric_stiffness_kernel(pre.resultants), kg).ok);
  const std::vector<double> missing_first(r.load_factors.begin() + 1, r.load_factors.end());
  const SturmCheck bad = sturm_check(system.pattern(), system.stiffness_values(), kg, missing_first, 1.001);
  EXPECT_TRUE(bad.done);
  EXPECT_FALSE(bad.passed());
  EXPECT_EQ(bad.negative_pivots, 3);
  EXPECT_EQ(bad.modes_below_shift, 2);
  // With all three, the same call passes; with only the lowest, the shift sits above lambda_1 only.
  EXPECT_TRUE(sturm_check(system.pattern(), system.stiffness_values(), kg, r.load_factors, 1.001).passed());
  const SturmCheck first = sturm_check(system.pattern(), system.stiffness_values(), kg, {r.load_factors[0]}, 1.001);
  EXPECT_TRUE(first.passed());
  EXPECT_EQ(first.negative_pivots, 1);
}

TEST(LinearBuckling, RejectsInvalidOptions) {
  const ShellModel m = square_plate(2);
  const SectionAssignment sections = SectionAssignment::elastic(m, 210000.0, 0.3);
  EXPECT_THROW(solve_linear_buckling(m, sections, 0), std::invalid_argument);
  BucklingOptions options;
  options.sturm_shift_ratio = 1.0;
  EXPECT_THROW(solve_linear_buckling(m, sections, 1, options), std::invalid_argument);
  options = {};
  options.basis_size = 2;
  EXPECT_THROW(solve_linear_buckling(m, sections, 2, options), std::invalid_argument);
}

}  // namespace
}  // namespace rotcap
