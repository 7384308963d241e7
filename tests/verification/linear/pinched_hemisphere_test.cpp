// Pinched hemisphere with an 18 degree hole: doubly curved, nearly inextensional bending with
// rigid-body rotation of the elements (MacNeal & Harder 1985, "A proposed standard set of
// problems to test finite element accuracy", FEAD 1, 3-20). All problem data and both reference
// values are FROM MEMORY (widely quoted; docs/spec/references.md sec. 1, status MEMORY; the load
// convention is marked low confidence there).
//
// Geometry (from memory): radius R = 10, thickness t = 0.04, E = 6.825e7, nu = 0.3; a polar hole
// of 18 deg (the shell spans latitudes 0 .. 72 deg); four radial point loads of 2 at the
// equator, 90 deg apart, alternately outward and inward; top hole edge and equator free.
// Axes (ours): pole on +z; a point at longitude phi and latitude lambda is
// R (cos lambda cos phi, cos lambda sin phi, sin lambda). Quarter model 0 <= phi <= 90 deg with
// half of each load on it, i.e. 1 outward (+x) at (R, 0, 0) and 1 inward (-y) at (0, R, 0):
//   phi = 0   (symmetry plane y = 0): uy = 0, rx = rz = 0;
//   phi = 90  (symmetry plane x = 0): ux = 0, ry = rz = 0;
//   uz held at one node of the hole edge (rigid-body translation along z only: the loads are
//   horizontal, so its reaction is zero).
// Quads in latitude / longitude (each an isosceles trapezoid, so flat).
// Result: the radial displacement at the loaded points (outward at (R, 0, 0), inward at (0, R, 0);
// equal by symmetry of the loading).
#include "solver/linear_static.hpp"

#include "tests/test_support.hpp"
#include "tests/verification/linear/structured_shell.hpp"

#include <cmath>
#include <cstdio>
#include <numbers>
#include <utility>

namespace rotcap {
namespace {

constexpr double kPi = std::numbers::pi;
constexpr double kRadius = 10.0, kThickness = 0.04, kE = 6.825e7, kNu = 0.3, kTopLatitude = 72.0 * kPi / 180.0;
// Radial displacement at a loaded point: 0.094 (MacNeal & Harder 1985, with the hole); 0.0924 is
// the value commonly used for the closed (no-hole) obstacle-course version. Both FROM MEMORY
// (docs/spec/references.md sec. 1).
constexpr double kReference = 0.094, kClosedHemisphereValue = 0.0924;

// Mesh n x n over the quarter: i along longitude (0 .. 90 deg), j along latitude (0 .. 72 deg).
// Returns (outward radial displacement at (R, 0, 0), inward radial displacement at (0, R, 0)).
std::pair<double, double> radial_displacements(int n) {
  testing::StructuredShell s = testing::structured_shell(n, n, kThickness, [n](int i, int j) {
    const double phi = 0.5 * kPi * i / n, lambda = kTopLatitude * j / n;
    return Eigen::Vector3d(kRadius * std::cos(lambda) * std::cos(phi), kRadius * std::cos(lambda) * std::sin(phi),
                           kRadius * std::sin(lambda));
  });
  ShellModel& m = s.model;
  testing::hold(m, "i0", {"uy", "rx", "rz"});  // phi = 0: symmetry plane y = 0
  testing::hold(m, "in", {"ux", "ry", "rz"});  // phi = 90 deg: symmetry plane x = 0
  testing::add_node_group(m, "hole_point", s.node(0, n));
  testing::hold(m, "hole_point", {"uz"});
  testing::point_force(m, "load_out", s.node(0, 0), Eigen::Vector3d(1.0, 0.0, 0.0));
  testing::point_force(m, "load_in", s.node(n, 0), Eigen::Vector3d(0.0, -1.0, 0.0));
  const SectionAssignment sections = SectionAssignment::elastic(m, kE, kNu);
  const LinearStaticResult r = solve_linear_static(m, sections);
  EXPECT_TRUE(r.ok()) << r.message;
  if (!r.ok()) return {0.0, 0.0};
  return {r.displacements[6 * s.node(0, 0)], -r.displacements[6 * s.node(n, 0) + 1]};
}

TEST(PinchedHemisphere, MatchesTheReferenceRadialDisplacement) {
  double outward = 0.0, inward = 0.0;
  for (const int n : {8, 16, 24}) {
    std::tie(outward, inward) = radial_displacements(n);
    std::printf("[ pinched hemisphere %2dx%-2d ] u_r(out) = %.5f, -u_r(in) = %.5f; ref 0.094 (MacNeal & Harder 1985, "
                "from memory): error %+.2f %%; vs 0.0924 (closed hemisphere, from memory): %+.2f %%\n",
                n, n, outward, inward, 100.0 * (outward / kReference - 1.0),
                100.0 * (outward / kClosedHemisphereValue - 1.0));
  }
  // Within 3 % of 0.094 (MacNeal & Harder 1985, from memory) on the 24 x 24 mesh; the two loaded
  // points move equally (the quarter model is symmetric about phi = 45 deg up to the load signs).
  EXPECT_CLOSE(outward, kReference, 0.03, 0.0);
  EXPECT_CLOSE(inward, outward, 1e-6, 0.0);
}

}  // namespace
}  // namespace rotcap
