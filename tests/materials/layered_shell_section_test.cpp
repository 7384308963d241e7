// LayeredShellSection: Simpson through-thickness integration, elastic exactness, plastic bending
// of a rectangle (moment and residual curvature against closed forms), tangent, initial stress.
#include "materials/layered_shell_section.hpp"

#include "materials/elastic_shell_section.hpp"
#include "materials/section_factory.hpp"
#include "tests/test_support.hpp"

#include <Eigen/Dense>
#include <algorithm>
#include <cmath>
#include <cstdio>
#include <functional>
#include <limits>
#include <random>
#include <vector>

namespace rotcap {
namespace {

constexpr double kE = 210000.0, kNu = 0.3, kFy = 355.0, kT = 10.0;
const double kKy = 2.0 * kFy / (kE * kT);  // first-yield curvature of the rectangle, 1/mm

LayeredShellSection epp_section(int n) {
  return LayeredShellSection(J2PlaneStress(kE, kNu, HardeningCurve::perfectly_plastic(kFy)), kT,
                             {n});
}

// Any through-thickness integration of the same J2 material: the section under test, or the
// fine reference below.
using Respond = std::function<void(const Vec6&, std::span<const LayerState>,
                                   std::span<LayerState>, Vec6&, Mat6&)>;

// Reference: composite Simpson with many points (beyond the section's 3..15), same material.
struct FineStrip {
  J2PlaneStress material{kE, kNu, HardeningCurve::perfectly_plastic(kFy)};
  int n = 801;
  void respond(const Vec6& g, std::span<const LayerState> c, std::span<LayerState> tr, Vec6& r,
               Mat6& C) const {
    const double h = kT / (n - 1);
    r.setZero();
    C.setZero();
    Eigen::Vector3d s;
    Eigen::Matrix3d D;
    for (int i = 0; i < n; ++i) {
      const double z = -0.5 * kT + i * h;
      const double w = (i == 0 || i == n - 1) ? h / 3.0 : (i % 2 ? 4.0 * h / 3.0 : 2.0 * h / 3.0);
      const auto k = static_cast<std::size_t>(i);
      material.update(g.head<3>() + z * g.tail<3>(), c[k], tr[k], s, &D);
      r.head<3>() += w * s;
      r.tail<3>() += w * z * s;
      C.topLeftCorner<3, 3>() += w * D;
      C.topRightCorner<3, 3>() += w * z * D;
      C.bottomRightCorner<3, 3>() += w * z * z * D;
    }
    C.bottomLeftCorner<3, 3>() = C.topRightCorner<3, 3>().transpose();
  }
};

// Beam conditions: k_xx prescribed, the other five resultants (N_xx, N_yy, N_xy, M_yy, M_xy)
// held at zero by Newton's method on the corresponding strains, so that M_xx is the bending
// moment of a unit-width strip free to contract laterally.
struct Snapshot {
  double ratio = 0.0;  ///< k_xx / k_y
  Vec6 g = Vec6::Zero();
  Vec6 r = Vec6::Zero();
  std::vector<LayerState> state;
};

// Solves r_i(g) = 0 for the free components (all but `fixed`, -1 for none), from `committed`.
// predictor (optional) replaces the tangent of the first iteration: an unloading step must
// start from the elastic stiffness, not from the loading tangent of the yielded state.
void solve_free(const Respond& f, int fixed, const std::vector<LayerState>& committed,
                std::vector<LayerState>& trial, Vec6& g, Vec6& r,
                const Mat6* predictor = nullptr) {
  Mat6 C;
  for (int it = 0; it < 40; ++it) {
    f(g, committed, trial, r, C);
    if (it == 0 && predictor) C = *predictor;
    // Scaled residual: N / (fy t), M / (fy t^2).
    double res = 0.0;
    for (int i = 0; i < 6; ++i)
      if (i != fixed) res = std::max(res, std::abs(r(i)) / (kFy * kT * (i < 3 ? 1.0 : kT)));
    if (res <= 1e-13) return;
    std::vector<int> idx;
    for (int i = 0; i < 6; ++i)
      if (i != fixed) idx.push_back(i);
    const int m = static_cast<int>(idx.size());
    Eigen::MatrixXd K(m, m);
    Eigen::VectorXd b(m);
    for (int a = 0; a < m; ++a) {
      b(a) = -r(idx[a]);
      for (int c = 0; c < m; ++c) K(a, c) = C(idx[a], idx[c]);
    }
    const Eigen::VectorXd d = K.lu().solve(b);
    for (int a = 0; a < m; ++a) g(idx[a]) += d(a);
  }
  ADD_FAILURE() << "strip Newton loop did not converge";
}

// Monotonic bending in steps of 0.1 k_y, committed each step; snapshots at the given ratios.
std::vector<Snapshot> bend(const Respond& f, int slots, const std::vector<double>& ratios) {
  std::vector<LayerState> committed(static_cast<std::size_t>(slots)), trial = committed;
  Vec6 g = Vec6::Zero(), r;
  std::vector<Snapshot> out;
  const int steps = static_cast<int>(std::lround(ratios.back() / 0.1));
  for (int s = 1; s <= steps; ++s) {
    g(3) = 0.1 * s * kKy;
    solve_free(f, 3, committed, trial, g, r);
    committed = trial;
    for (double q : ratios)
      if (std::lround(q / 0.1) == s) out.push_back({q, g, r, committed});
  }
  return out;
}

Respond respond_of(const LayeredShellSection& s) {
  return [&s](const Vec6& g, std::span<const LayerState> c, std::span<LayerState> t, Vec6& r,
              Mat6& C) { s.respond(g, c, t, r, C); };
}

// Closed-form elastic-plastic bending of a rectangle, uniaxial fibres (Timoshenko, Strength of
// Materials, Part II, 3rd ed. 1956, chapter on plastic deformation; Neal 1977): per unit width
//   M(k) = fy t^2/4 (1 - (k_y/k)^2 / 3) for k >= k_y = 2 fy / (E t); fully plastic fy t^2/4.
double closed_form_moment(double k) {
  const double q = kKy / k;
  return kFy * kT * kT / 4.0 * (1.0 - q * q / 3.0);
}

// Error bound of composite Simpson (node spacing h = t/(n-1)) for M = int sigma z dz of that
// profile, sigma z = E k z^2 in the core |z| < z_y = fy/(E k), fy |z| outside. Two bounds, the
// smaller is used:
//  B1: sigma z = E k z^2 - E k [(|z| - z_y)_+^2 + z_y (|z| - z_y)_+]; Simpson is exact for z^2
//      and, on one panel, errs by at most h^2/6 for (x - c)_+ and 4 h^3/81 for (x - c)_+^2
//      (sup over the kink position c; elementary), two kinks: fy h^2/3 + 8 E k h^3 / 81.
//  B2: sigma z = fy |z| + b(z), b = E k z^2 - fy |z| <= 0 on the core, |b| <= fy z_y / 4,
//      int b = -fy z_y^2 / 3. The rule is exact for fy |z| when the mid-surface is a panel
//      boundary ((n-1)/2 even) and errs by fy h^2/3 otherwise; the b part errs by at most
//      max(fy z_y^2/3, fy z_y/4 * sum of weights of nodes with 0 < |z_i| < z_y).
double simpson_moment_bound(int n, double k) {
  const double h = kT / (n - 1), zy = kFy / (kE * k);
  if (zy >= 0.5 * kT) return 0.0;  // elastic: sigma z is quadratic, integrated exactly
  const double b1 = kFy * h * h / 3.0 + 8.0 * kE * k * h * h * h / 81.0;
  const bool mid_in_panel = ((n - 1) / 2) % 2 == 1;
  double w_in = 0.0;
  for (int i = 0; i < n; ++i) {
    const double z = -0.5 * kT + i * h;
    const double w = (i == 0 || i == n - 1) ? h / 3.0 : (i % 2 ? 4.0 * h / 3.0 : 2.0 * h / 3.0);
    if (std::abs(z) > 1e-12 * kT && std::abs(z) < zy) w_in += w;
  }
  const double b2 = (mid_in_panel ? kFy * h * h / 3.0 : 0.0) +
                    std::max(kFy * zy * zy / 3.0, kFy * zy / 4.0 * w_in);
  return std::min(b1, b2);
}

// The shell strip is not exactly uniaxial: its lateral strain is linear through the thickness
// (e_yy + z k_yy), the elastic core wants e_yy / e_xx = -nu and the plastic zones -1/2, so
// the layers carry small sigma_yy (with M_yy = 0 overall) and M_xx rises above the beam value.
// Envelope of this Poisson effect, 1.2e-2 (k_y/k)^2 relative, checked by
// StripUnderBeamConditionsApproachesBeamTheory with an 801-point rule (it measures 1.9e-3 at
// k = 2 k_y, 6.3e-4 at 4 k_y, 4e-6 at 20 k_y).
double poisson_allowance(double k) { return 1.2e-2 * (kKy / k) * (kKy / k); }

TEST(LayeredShellSection, SimpsonPointsSampleBothSurfaces) {
  for (int n : {3, 5, 9, 15}) {
    const LayeredShellSection s = epp_section(n);
    double sum = 0.0, first = 0.0, second = 0.0;
    for (int i = 0; i < n; ++i) {
      sum += s.layer_weight(i);
      first += s.layer_weight(i) * s.layer_position(i);
      second += s.layer_weight(i) * s.layer_position(i) * s.layer_position(i);
    }
    EXPECT_EQ(s.layer_position(0), -0.5 * kT);
    EXPECT_EQ(s.layer_position(n - 1), 0.5 * kT);
    EXPECT_EQ(s.layer_position(n / 2), 0.0);
    EXPECT_CLOSE(sum, kT, 1e-14, 0.0);
    EXPECT_CLOSE(first, 0.0, 0.0, 1e-13);
    EXPECT_CLOSE(second, kT * kT * kT / 12.0, 1e-14, 0.0);  // exact for quadratics
    EXPECT_EQ(s.layers(), n);
    EXPECT_FALSE(s.is_linear());
  }
}

TEST(LayeredShellSection, ElasticResponseEqualsClosedFormPlate) {
  // Below yield the layered section must equal the Kirchhoff plate constants
  // (ElasticShellSection, Timoshenko & Woinowsky-Krieger 1959) for every n: Simpson is exact.
  const ElasticShellSection ref(kE, kNu, kT);
  Vec6 g;
  g << 2e-4, -1e-4, 1.5e-4, 1e-5, 2e-5, -1.5e-5;  // surface strains < 4e-4 < eps_y = 1.7e-3
  Vec6 r_ref, r;
  Mat6 C_ref, C;
  ref.respond(g, {}, {}, r_ref, C_ref);
  for (int n : {3, 5, 15}) {
    const LayeredShellSection s = epp_section(n);
    std::vector<LayerState> c(static_cast<std::size_t>(n)), t = c;
    EXPECT_EQ(s.evaluate(g, c, t, r, &C), ReturnStatus::Elastic);
    for (int i = 0; i < 6; ++i)
      for (int j = 0; j < 6; ++j)
        EXPECT_CLOSE(C(i, j), C_ref(i, j), 0.0, 1e-13 * std::sqrt(C_ref(i, i) * C_ref(j, j)));
    EXPECT_LE((r - r_ref).cwiseAbs().maxCoeff(), 1e-12 * r_ref.cwiseAbs().maxCoeff());
    const SurfaceStresses a = s.surfaces(g, t), b = ref.surfaces(g, {});
    for (int k = 0; k < 3; ++k) EXPECT_LE((a.stress[k] - b.stress[k]).norm(), 1e-10) << k;
  }
  EXPECT_EQ(epp_section(5).shear_modulus(), ref.shear_modulus());
  EXPECT_EQ(epp_section(5).youngs_modulus(), kE);
  EXPECT_EQ(epp_section(5).thickness(), kT);
}

TEST(LayeredShellSection, StripUnderBeamConditionsApproachesBeamTheory) {
  // Two code paths: an 801-point Simpson integration of the same J2 law (rule error
  // < 2e-5 by simpson_moment_bound) against the beam closed form; what remains is the
  // Poisson effect of the strip (see poisson_allowance), which must vanish as k grows.
  const FineStrip fine;
  const Respond f = [&fine](const Vec6& g, std::span<const LayerState> c,
                            std::span<LayerState> t, Vec6& r,
                            Mat6& C) { fine.respond(g, c, t, r, C); };
  const std::vector<double> ratios{2.0, 3.0, 4.0, 5.0, 10.0, 20.0};
  for (const Snapshot& s : bend(f, fine.n, ratios)) {
    const double k = s.g(3), m_ref = closed_form_moment(k);
    const double err = s.r(3) / m_ref - 1.0;
    const double bound = simpson_moment_bound(fine.n, k) / m_ref;
    std::printf("fine strip k/k_y %5.1f: M/M(k) - 1 = %+.3e (allowance %.2e, rule %.1e), "
                "k_yy/k_xx = %.4f\n", s.ratio, err, poisson_allowance(k), bound, s.g(4) / k);
    EXPECT_LE(std::abs(err), poisson_allowance(k) + bound) << s.ratio;
  }
}

TEST(LayeredShellSection, RectangleInBendingApproachesPlasticMoment) {
  // M -> Mp = fy t^2 / 4 per unit width (plastic moment of a rectangle: Timoshenko, Strength of
  // Materials Part II, 1956; Neal, The Plastic Methods of Structural Analysis, 3rd ed. 1977).
  // Error measure: M / M(k) - 1 against the closed form at the same curvature; tolerance: the
  // Simpson error bound for the kinked profile plus the strip's Poisson allowance (see above).
  const double mp = kFy * kT * kT / 4.0;
  const std::vector<double> ratios{2.0, 3.0, 4.0, 5.0, 10.0, 20.0};
  std::printf("   n  k/k_y   M [N]       M(k) [N]    M/M(k)-1    M/Mp-1     bound\n");
  for (int n : {5, 9, 15}) {
    const LayeredShellSection sec = epp_section(n);
    for (const Snapshot& s : bend(respond_of(sec), n, ratios)) {
      const double k = s.g(3), m_ref = closed_form_moment(k);
      const double tol = simpson_moment_bound(n, k) + poisson_allowance(k) * m_ref +
                         1e-10 * m_ref;
      std::printf("  %2d  %5.1f  %10.3f  %10.3f  %+.3e  %+.3e  %.2e\n", n, s.ratio, s.r(3),
                  m_ref, s.r(3) / m_ref - 1.0, s.r(3) / mp - 1.0, tol / m_ref);
      EXPECT_CLOSE(s.r(3), m_ref, 0.0, tol) << "n " << n << " k/k_y " << s.ratio;
    }
  }
  // At k = 20 k_y the closed form is within 1/1200 of Mp; n = 5 and 9 put the mid-surface kink
  // on a panel boundary and the elastic core between points, so they return Mp itself.
  for (int n : {5, 9}) {
    const LayeredShellSection sec = epp_section(n);
    const Snapshot s = bend(respond_of(sec), n, {20.0}).back();
    EXPECT_CLOSE(s.r(3), mp, 1e-5, 0.0) << n;
  }
}

TEST(LayeredShellSection, UnloadingLeavesClosedFormResidualCurvature) {
  // Elastic unloading from k to M = 0 with the other resultants still zero has compliance
  // 12 / (E t^3) (E' = E for a strip free to contract), so the closed form of elastic-plastic
  // bending of a rectangle (Timoshenko, Strength of Materials Part II, 1956) gives
  //   k_res = k - M(k) / (E t^3 / 12),  M(k) = fy t^2/4 (1 - (k_y/k)^2/3),  k_y = 2 fy/(E t).
  // The error of M transfers 1:1 through that compliance, so the tolerance is the moment
  // tolerance of the test above divided by E t^3/12. Reverse yielding does not occur: the
  // surface unloading stress 6 M / t^2 <= 1.5 fy < 2 fy.
  const double D = kE * kT * kT * kT / 12.0;
  Mat6 elastic;
  Vec6 r0;
  ElasticShellSection(kE, kNu, kT).respond(Vec6::Zero(), {}, {}, r0, elastic);
  const std::vector<double> ratios{2.0, 3.0, 4.0};
  std::vector<double> worst;
  std::printf("   n  k/k_y   k_res*t (rule)   k_res*t (closed)  rel. error   tol\n");
  for (int n : {5, 9, 15}) {
    const LayeredShellSection sec = epp_section(n);
    double w = 0.0;
    for (const Snapshot& s : bend(respond_of(sec), n, ratios)) {
      std::vector<LayerState> trial = s.state;
      Vec6 g = s.g, r;
      solve_free(respond_of(sec), -1, s.state, trial, g, r, &elastic);
      Mat6 C;
      EXPECT_EQ(sec.evaluate(g, s.state, trial, r, &C), ReturnStatus::Elastic);
      const double k = s.g(3), m_ref = closed_form_moment(k);
      const double k_res = k - m_ref / D;
      const double tol = (simpson_moment_bound(n, k) + (poisson_allowance(k) + 1e-10) * m_ref) / D;
      const double rel = g(3) / k_res - 1.0;
      std::printf("  %2d  %5.1f   %.6e     %.6e      %+.3e  %.2e\n", n, s.ratio, g(3) * kT,
                  k_res * kT, rel, tol / k_res);
      EXPECT_CLOSE(g(3), k_res, 0.0, tol) << "n " << n << " k/k_y " << s.ratio;
      w = std::max(w, std::abs(rel));
    }
    worst.push_back(w);
  }
  // Convergence with n: the largest error over the three curvatures falls as n grows.
  std::printf("max |rel. error|: n=5 %.2e, n=9 %.2e, n=15 %.2e\n", worst[0], worst[1], worst[2]);
  EXPECT_GT(worst[0], worst[1]);
  EXPECT_GT(worst[1], worst[2]);
}

TEST(LayeredShellSection, TangentMatchesCentralDifferences) {
  // Central differences of respond() about random (seeded) plastic states with membrane and
  // bending strain: steps h_e = 1e-7 and h_k = 2e-7 / t (same surface strain). As for the
  // material point, truncation (~h^2 |sigma'''|) and round-off (~eps_mach |r| / h) are below
  // 1e-6 of the elastic stiffness; entries are compared against 1e-6 sqrt(C_ii C_jj) of the
  // elastic section. States where any layer's perturbed epbar changes curve segment are skipped.
  const SteelModel steel{};  // S355 quad-linear defaults
  std::mt19937 rng(99);
  std::uniform_real_distribution<double> u(-1.0, 1.0);
  const ElasticShellSection el(kE, kNu, kT);
  Vec6 r0;
  Mat6 Ce;
  el.respond(Vec6::Zero(), {}, {}, r0, Ce);
  int checked = 0;
  for (int n : {5, 9}) {
    const LayeredShellSection sec(J2PlaneStress(kE, kNu, hardening_curve(steel)), kT, {n});
    const auto slots = static_cast<std::size_t>(n);
    for (int trial_no = 0; trial_no < 12; ++trial_no) {
      std::vector<LayerState> committed(slots), trial(slots), tp(slots), tm(slots);
      Vec6 g0, g;
      Vec6 r;
      Mat6 C, unused;
      for (int i = 0; i < 6; ++i) g0(i) = (i < 3 ? 5e-3 : 1e-3) * u(rng);
      sec.respond(g0, std::vector<LayerState>(slots), committed, r, unused);
      for (int i = 0; i < 6; ++i) g(i) = g0(i) + (i < 3 ? 4e-3 : 8e-4) * u(rng);
      if (sec.evaluate(g, committed, trial, r, &C) != ReturnStatus::Plastic) continue;
      Mat6 fd;
      bool clean = true;
      for (int j = 0; j < 6; ++j) {
        const double h = j < 3 ? 1e-7 : 2e-7 / kT;
        Vec6 gp = g, gm = g, rp, rm;
        gp(j) += h;
        gm(j) -= h;
        sec.evaluate(gp, committed, tp, rp, nullptr);
        sec.evaluate(gm, committed, tm, rm, nullptr);
        for (std::size_t l = 0; l < slots; ++l) {
          const auto& curve = sec.material().curve();
          const double ep0 = committed[l].equivalent_plastic_strain;
          const bool py = trial[l].equivalent_plastic_strain > ep0;
          const bool pp = tp[l].equivalent_plastic_strain > ep0;
          const bool pm = tm[l].equivalent_plastic_strain > ep0;
          clean = clean && py == pp && py == pm &&
                  curve.segment(tp[l].equivalent_plastic_strain) ==
                      curve.segment(trial[l].equivalent_plastic_strain) &&
                  curve.segment(tm[l].equivalent_plastic_strain) ==
                      curve.segment(trial[l].equivalent_plastic_strain);
        }
        fd.col(j) = (rp - rm) / (2.0 * h);
      }
      if (!clean) continue;
      ++checked;
      // The layers integrate in substeps, whose exact tangent is not symmetric; the section
      // returns its symmetric part (materials/j2_plane_stress.hpp), so that is what is compared.
      const Mat6 fd_sym = 0.5 * (fd + fd.transpose());
      for (int i = 0; i < 6; ++i)
        for (int j = 0; j < 6; ++j)
          EXPECT_CLOSE(fd_sym(i, j), C(i, j), 0.0, 1e-6 * std::sqrt(Ce(i, i) * Ce(j, j)))
              << "n " << n << " state " << trial_no << " entry " << i << "," << j;
    }
  }
  std::printf("section tangent: %d plastic states checked\n", checked);
  EXPECT_GE(checked, 10);
}

TEST(LayeredShellSection, SelfEquilibratedInitialStressGivesZeroResultants) {
  // sigma_0(z) = s (12 z^2/t^2 - 1): int sigma_0 dz = 0 and int sigma_0 z dz = 0 exactly, and
  // Simpson integrates quadratics exactly; a per-layer pattern is made self-equilibrated for the
  // discrete rule by removing its weighted constant and linear parts. At zero strain N = M = 0 to
  // round-off; at a small strain the response is that of the stress-free elastic plate.
  const ElasticShellSection el(kE, kNu, kT);
  std::mt19937 rng(4242);
  std::uniform_real_distribution<double> u(-1.0, 1.0);
  for (int n : {3, 5, 15}) {
    const LayeredShellSection sec = epp_section(n);
    const auto slots = static_cast<std::size_t>(n);
    std::vector<LayerState> c(slots), t(slots);
    const Eigen::Vector3d amp(100.0, 40.0, 10.0);
    sec.set_initial_stress(c, [&](double z) -> Eigen::Vector3d {
      return amp * (12.0 * z * z / (kT * kT) - 1.0);
    });
    Vec6 r, r_el;
    Mat6 C, C_el;
    EXPECT_EQ(sec.evaluate(Vec6::Zero(), c, t, r, &C), ReturnStatus::Elastic);
    EXPECT_LE(r.head<3>().cwiseAbs().maxCoeff(), 1e-12 * amp(0) * kT) << n;
    EXPECT_LE(r.tail<3>().cwiseAbs().maxCoeff(), 1e-12 * amp(0) * kT * kT) << n;
    Vec6 g;
    g << 1e-4, -5e-5, 2e-5, 1e-6, -2e-6, 3e-6;
    sec.evaluate(g, c, t, r, &C);
    el.respond(g, {}, {}, r_el, C_el);
    EXPECT_LE((r - r_el).cwiseAbs().maxCoeff(), 1e-11 * amp(0) * kT * kT) << n;

    // Per-layer random pattern, projected onto discrete self-equilibrium.
    std::vector<Eigen::Vector3d> per(slots);
    for (auto& v : per) v = 80.0 * Eigen::Vector3d(u(rng), u(rng), u(rng));
    double W = 0.0, Wz = 0.0, Wzz = 0.0;
    Eigen::Vector3d S = Eigen::Vector3d::Zero(), Sz = Eigen::Vector3d::Zero();
    for (int i = 0; i < n; ++i) {
      const double w = sec.layer_weight(i), z = sec.layer_position(i);
      W += w, Wz += w * z, Wzz += w * z * z;
      S += w * per[static_cast<std::size_t>(i)];
      Sz += w * z * per[static_cast<std::size_t>(i)];
    }
    // a + b z with sum w (p - a - b z) = 0 and sum w z (p - a - b z) = 0 (Wz = 0 by symmetry,
    // kept for clarity).
    const double det = W * Wzz - Wz * Wz;
    const Eigen::Vector3d a = (S * Wzz - Sz * Wz) / det, b = (Sz * W - S * Wz) / det;
    for (int i = 0; i < n; ++i) per[static_cast<std::size_t>(i)] -= a + b * sec.layer_position(i);
    sec.set_initial_stress(c, per);
    sec.evaluate(Vec6::Zero(), c, t, r, &C);
    EXPECT_LE(r.head<3>().cwiseAbs().maxCoeff(), 1e-12 * 160.0 * kT) << n;
    EXPECT_LE(r.tail<3>().cwiseAbs().maxCoeff(), 1e-12 * 160.0 * kT * kT) << n;
    EXPECT_EQ(c[0].initial_stress, per[0]);
  }
}

TEST(LayeredShellSection, SurfacesReportBottomMiddleTopLayers) {
  const LayeredShellSection sec = epp_section(5);
  std::vector<LayerState> c(5), t(5);
  Vec6 g, r;
  Mat6 C;
  g << 1e-3, 0.0, 0.0, 4.0 * kKy, 0.0, 0.0;
  sec.respond(g, c, t, r, C);
  const SurfaceStresses s = sec.surfaces(g, t);
  const std::size_t layer[3] = {0, 2, 4};
  for (std::size_t k = 0; k < 3; ++k) {
    const LayerState& h = t[layer[k]];
    const Eigen::Vector3d eps =
        g.head<3>() + sec.layer_position(static_cast<int>(layer[k])) * g.tail<3>();
    EXPECT_LE((s.stress[k] - sec.material().stress(eps, h)).norm(), 1e-12);
    EXPECT_EQ(s.equivalent_plastic_strain[k], h.equivalent_plastic_strain);
  }
  EXPECT_GT(s.equivalent_plastic_strain[2], 0.0);   // top: tension beyond yield
  EXPECT_EQ(s.equivalent_plastic_strain[1], 0.0);   // middle: e_xx = 1e-3 < eps_y
  EXPECT_CLOSE(J2PlaneStress::von_mises(s.stress[2]), kFy, 1e-12, 0.0);
}

TEST(LayeredShellSection, NonFiniteStrainGivesNaNResultants) {
  const LayeredShellSection sec = epp_section(5);
  std::vector<LayerState> c(5), t(5);
  Vec6 g = Vec6::Zero(), r;
  Mat6 C;
  g(0) = std::numeric_limits<double>::quiet_NaN();
  sec.respond(g, c, t, r, C);
  EXPECT_TRUE(r.array().isNaN().all());
  EXPECT_EQ(sec.evaluate(g, c, t, r, &C), ReturnStatus::NotConverged);
}

TEST(LayeredShellSection, RejectsBadLayerCountsAndSlots) {
  for (int n : {1, 2, 4, 17})
    EXPECT_THROW(epp_section(n), std::invalid_argument) << n;
  EXPECT_THROW(LayeredShellSection(J2PlaneStress(kE, kNu, HardeningCurve::perfectly_plastic(kFy)),
                                   0.0),
               std::invalid_argument);
  const LayeredShellSection sec = epp_section(5);
  std::vector<LayerState> c(4), t(5);
  Vec6 r;
  Mat6 C;
  EXPECT_THROW(sec.respond(Vec6::Zero(), c, t, r, C), std::logic_error);
}

TEST(MakeShellSection, ChoosesElasticOrLayeredFromSteelModel) {
  SteelModel steel;  // S355 quad-linear
  const auto layered = make_shell_section(steel, 12.0, 7);
  EXPECT_EQ(layered->layers(), 7);
  EXPECT_FALSE(layered->is_linear());
  EXPECT_EQ(layered->thickness(), 12.0);
  steel.kind = SteelCurveKind::elastic;
  const auto elastic = make_shell_section(steel, 12.0, 7);
  EXPECT_EQ(elastic->layers(), 0);
  EXPECT_TRUE(elastic->is_linear());
  steel.kind = SteelCurveKind::quadlinear;
  steel.fu = 300.0;
  EXPECT_THROW(make_shell_section(steel, 12.0), std::invalid_argument);
  steel.fu = 490.0;
  EXPECT_THROW(make_shell_section(steel, 12.0, 6), std::invalid_argument);
}

}  // namespace
}  // namespace rotcap
