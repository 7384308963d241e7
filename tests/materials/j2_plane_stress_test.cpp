// J2PlaneStress: uniaxial curves, yield surface, unloading, consistency, consistent tangent,
// dissipation.
#include "materials/j2_plane_stress.hpp"

#include "materials/steel_curve.hpp"
#include "tests/test_support.hpp"

#include <Eigen/Dense>
#include <cmath>
#include <cstdio>
#include <limits>
#include <random>

namespace rotcap {
namespace {

constexpr double kE = 210000.0, kNu = 0.3, kFy = 355.0;

SteelModel s355(SteelCurveKind kind) {
  SteelModel s;
  s.E = kE;
  s.nu = kNu;
  s.fy = kFy;
  s.fu = 490.0;
  s.kind = kind;
  s.hardening_modulus = 2100.0;  // bilinear: E/100 (EN 1993-1-5 C.6 (c), from memory)
  return s;
}

J2PlaneStress material(SteelCurveKind kind, int substeps = J2PlaneStress::Options{}.substeps) {
  J2PlaneStress::Options o;
  o.substeps = substeps;
  return J2PlaneStress(kE, kNu, hardening_curve(s355(kind)), o);
}

/// One backward-Euler step per update (the Simo-Taylor return alone).
J2PlaneStress::Options single_step() {
  J2PlaneStress::Options o;
  o.substeps = 1;
  return o;
}

// Uniaxial stress sigma_xx under strain eps_xx: g_xy = 0 keeps sigma_xy = 0 by symmetry, and
// eps_yy is found by Newton's method on sigma_yy(eps_yy) = 0 with the tangent D_yy.
struct Uniaxial {
  double stress = 0.0;
  double eps_yy = 0.0;
  LayerState state;
  ReturnStatus status = ReturnStatus::Elastic;
};

Uniaxial uniaxial(const J2PlaneStress& m, double eps_xx, const LayerState& committed,
                  double eps_yy_start) {
  Uniaxial u;
  u.eps_yy = eps_yy_start;
  Eigen::Vector3d s;
  Eigen::Matrix3d D;
  for (int it = 0; it < 50; ++it) {
    u.status = m.update(Eigen::Vector3d(eps_xx, u.eps_yy, 0.0), committed, u.state, s, &D);
    if (std::abs(s(1)) <= 1e-11 * kFy) break;
    u.eps_yy -= s(1) / D(1, 1);
  }
  EXPECT_LE(std::abs(s(1)), 1e-11 * kFy) << "uniaxial driver did not converge";
  u.stress = s(0);
  return u;
}

// Loads monotonically through every point of the hardening curve: at the total strain
// eps_i = sigma_i / E + epbar_i (uniaxial: epbar = eps_p,xx) the stress must equal sigma_i.
void expect_reproduces_curve(const J2PlaneStress& m, const char* name) {
  const HardeningCurve& c = m.curve();
  LayerState committed;
  double eps_prev = 0.0, eps_yy = 0.0, worst = 0.0;
  for (std::size_t i = 0; i < c.size(); ++i) {
    const auto& p = c.points()[i];
    const double target = p.stress / kE + p.plastic_strain;
    for (int k = 1; k <= 4; ++k) {  // sub-steps, each one committed
      const double eps = eps_prev + (target - eps_prev) * k / 4.0;
      const Uniaxial u = uniaxial(m, eps, committed, eps_yy);
      committed = u.state;
      eps_yy = u.eps_yy;
      if (k == 4) {
        EXPECT_CLOSE(u.stress, p.stress, 1e-11, 0.0) << name << " point " << i;
        EXPECT_CLOSE(u.state.equivalent_plastic_strain, p.plastic_strain, 1e-10, 1e-15)
            << name << " point " << i;
        worst = std::max(worst, std::abs(u.stress / p.stress - 1.0));
      }
    }
    eps_prev = target;
  }
  std::printf("%s: %zu curve points reproduced, max relative stress error %.2e\n", name, c.size(),
              worst);
}

TEST(J2PlaneStress, UniaxialBilinearReproducesTrueCurvePointByPoint) {
  expect_reproduces_curve(material(SteelCurveKind::bilinear), "bilinear S355 E_h=2100");
}

TEST(J2PlaneStress, UniaxialQuadlinearReproducesTrueCurvePointByPoint) {
  // S355 quad-linear: eps_sh 0.0174, eps_u 0.165, E_sh ~2280 MPa, DERIVED from the from-memory
  // Yun & Gardner (2017) formulas of docs/spec/references.md section 5.
  expect_reproduces_curve(material(SteelCurveKind::quadlinear), "quadlinear S355");
}

TEST(J2PlaneStress, UniaxialQuadlinearMapsBackToEngineeringBreakpoints) {
  // Loading to the engineering breakpoints eps_sh, C1 eps_u and eps_u and converting the
  // computed true stress back, sigma_e = sigma_t / (1 + e), e = exp(eps_xx) - 1, must give the
  // engineering stresses fy, fy + E_sh (C1 eps_u - eps_sh), fu of the quad-linear model (from
  // memory, Yun & Gardner 2017). The plastic strain origin sits at the converted yield point,
  // which shifts eps_xx by 1.5 eps_y^2 = 4.3e-6 (see steel_curve.hpp); with slopes up to
  // E_sh = 2283 MPa this moves sigma_e by < 0.02 MPa: tolerance 1e-4 relative.
  const J2PlaneStress m = material(SteelCurveKind::quadlinear);
  const SteelModel s = s355(SteelCurveKind::quadlinear);
  const QuadlinearParameters q = yun_gardner_quadlinear(s.E, s.fy, s.fu);
  const auto eng = engineering_curve(s);
  LayerState committed;
  double eps_yy = 0.0, eps_prev = 0.0;
  for (std::size_t i = 1; i < eng.size(); ++i) {
    const double target = std::log1p(eng[i].strain);
    Uniaxial u;
    for (int k = 1; k <= 20; ++k) {
      u = uniaxial(m, eps_prev + (target - eps_prev) * k / 20.0, committed, eps_yy);
      committed = u.state;
      eps_yy = u.eps_yy;
    }
    eps_prev = target;
    const double sigma_e = u.stress / (1.0 + std::expm1(target));
    std::printf("engineering point %zu: eps_e %.5f, sigma_e %.4f (expected %.4f)\n", i,
                eng[i].strain, sigma_e, eng[i].stress);
    EXPECT_CLOSE(sigma_e, eng[i].stress, 1e-4, 0.0) << "breakpoint " << i;
  }
  EXPECT_CLOSE(eng[3].stress, 490.0, 1e-15, 0.0);
  EXPECT_CLOSE(eng[2].stress, s.fy + q.E_sh * (q.c1_eps_u - q.eps_sh), 1e-15, 0.0);
}

// Strain path lambda * dir from the virgin state; returns the stress at lambda.
Eigen::Vector3d stress_along(const J2PlaneStress& m, const Eigen::Vector3d& dir, double lambda,
                             ReturnStatus* status = nullptr) {
  LayerState committed, trial;
  Eigen::Vector3d s;
  const ReturnStatus st = m.update(lambda * dir, committed, trial, s, nullptr);
  if (status) *status = st;
  return s;
}

TEST(J2PlaneStress, YieldsOnVonMisesEllipseInEquibiaxialTension) {
  // Von Mises: equibiaxial yield at s_xx = s_yy = fy (Simo & Hughes 1998, eq. for f above).
  const J2PlaneStress m(kE, kNu, HardeningCurve::perfectly_plastic(kFy));
  const Eigen::Vector3d dir(1.0, 1.0, 0.0);
  const double lambda_y = kFy * (1.0 - kNu) / kE;  // elastic: s = E/(1-nu) lambda
  ReturnStatus st;
  stress_along(m, dir, 0.999 * lambda_y, &st);
  EXPECT_EQ(st, ReturnStatus::Elastic);
  stress_along(m, dir, 1.001 * lambda_y, &st);
  EXPECT_EQ(st, ReturnStatus::Plastic);
  const Eigen::Vector3d s = stress_along(m, dir, 5.0 * lambda_y);
  EXPECT_CLOSE(s(0), kFy, 1e-12, 0.0);
  EXPECT_CLOSE(s(1), kFy, 1e-12, 0.0);
  EXPECT_CLOSE(s(2), 0.0, 0.0, 1e-12);
}

TEST(J2PlaneStress, YieldsInPureShearAtFyOverRootThree) {
  // tau_y = fy / sqrt(3) (von Mises criterion, e.g. Hill, The Mathematical Theory of
  // Plasticity, 1950).
  const J2PlaneStress m(kE, kNu, HardeningCurve::perfectly_plastic(kFy));
  const double G = m.shear_modulus();
  const double tau_y = kFy / std::sqrt(3.0);
  const Eigen::Vector3d dir(0.0, 0.0, 1.0);
  ReturnStatus st;
  stress_along(m, dir, 0.999 * tau_y / G, &st);
  EXPECT_EQ(st, ReturnStatus::Elastic);
  const Eigen::Vector3d s = stress_along(m, dir, 4.0 * tau_y / G, &st);
  EXPECT_EQ(st, ReturnStatus::Plastic);
  EXPECT_CLOSE(s(2), tau_y, 1e-12, 0.0);
  EXPECT_CLOSE(s(0), 0.0, 0.0, 1e-12);
  EXPECT_CLOSE(s(1), 0.0, 0.0, 1e-12);
}

TEST(J2PlaneStress, YieldsInUniaxialTensionAtFy) {
  // One step: the strain path of a substepped update from the virgin state is not uniaxial at its
  // intermediate points (eps_yy is only found at the end), so its epbar differs by design.
  const J2PlaneStress m(kE, kNu, HardeningCurve::perfectly_plastic(kFy), single_step());
  LayerState virgin;
  EXPECT_EQ(uniaxial(m, 0.999 * kFy / kE, virgin, 0.0).status, ReturnStatus::Elastic);
  const Uniaxial u = uniaxial(m, 3.0 * kFy / kE, virgin, 0.0);
  EXPECT_EQ(u.status, ReturnStatus::Plastic);
  EXPECT_CLOSE(u.stress, kFy, 1e-12, 0.0);
  EXPECT_CLOSE(u.state.equivalent_plastic_strain, 2.0 * kFy / kE, 1e-10, 0.0);
}

TEST(J2PlaneStress, ReturnedStressSatisfiesConsistencyToRoundOff) {
  // After every plastic return sigma_vm = sigma_y(epbar_{n+1}) to round-off, for random trial
  // strains (seeded) from random plastic committed states, on all curve kinds.
  std::mt19937 rng(20240611);
  std::uniform_real_distribution<double> u(-1.0, 1.0);
  int plastic = 0;
  double worst = 0.0;
  for (SteelCurveKind kind : {SteelCurveKind::elastic_plastic, SteelCurveKind::bilinear,
                              SteelCurveKind::quadlinear}) {
    const J2PlaneStress m = material(kind);
    for (int trial_no = 0; trial_no < 200; ++trial_no) {
      LayerState committed, trial, next;
      Eigen::Vector3d s;
      const double scale = 0.02 * std::abs(u(rng)) + 1e-4;
      m.update(scale * Eigen::Vector3d(u(rng), u(rng), u(rng)), LayerState{}, committed, s,
               nullptr);
      const Eigen::Vector3d eps = scale * Eigen::Vector3d(u(rng), u(rng), u(rng));
      if (m.update(eps, committed, next, s, nullptr) != ReturnStatus::Plastic) continue;
      ++plastic;
      const double r = J2PlaneStress::von_mises(s) /
                           m.curve().flow_stress(next.equivalent_plastic_strain) - 1.0;
      worst = std::max(worst, std::abs(r));
      EXPECT_LE(std::abs(r), 1e-12) << "kind " << steel_curve_kind_name(kind) << " #" << trial_no;
      // The stored history reproduces the returned stress: sigma = C (eps - eps_p).
      EXPECT_LE((m.stress(eps, next) - s).norm(), 1e-9 * s.norm());
    }
  }
  std::printf("consistency: %d plastic returns, max |sigma_vm/sigma_y - 1| = %.2e\n", plastic,
              worst);
  EXPECT_GT(plastic, 300);
}

TEST(J2PlaneStress, UnloadsElasticallyFromPlasticState) {
  const J2PlaneStress m = material(SteelCurveKind::bilinear);
  const double eps_y = kFy / kE;
  LayerState virgin;
  const Uniaxial loaded = uniaxial(m, 5.0 * eps_y, virgin, 0.0);
  ASSERT_EQ(loaded.status, ReturnStatus::Plastic);
  // Uniaxial unloading by 0.5 eps_y: d sigma = E d eps exactly, no further plastic strain.
  const Uniaxial back = uniaxial(m, 4.5 * eps_y, loaded.state, loaded.eps_yy);
  EXPECT_EQ(back.status, ReturnStatus::Elastic);
  EXPECT_CLOSE(loaded.stress - back.stress, kE * 0.5 * eps_y, 1e-10, 0.0);
  EXPECT_EQ(back.state.equivalent_plastic_strain, loaded.state.equivalent_plastic_strain);
  // Biaxial strain reversal: increment C d eps and tangent C.
  const Eigen::Vector3d eps(5.0 * eps_y, loaded.eps_yy, 0.0);
  const Eigen::Vector3d d(-0.3 * eps_y, 0.1 * eps_y, 0.05 * eps_y);
  LayerState trial;
  Eigen::Vector3d s0, s1;
  Eigen::Matrix3d D;
  m.update(eps, loaded.state, trial, s0, nullptr);
  EXPECT_EQ(m.update(eps + d, loaded.state, trial, s1, &D), ReturnStatus::Elastic);
  EXPECT_LE((s1 - s0 - m.elastic_matrix() * d).norm(), 1e-9 * kFy);
  EXPECT_LE((D - m.elastic_matrix()).norm(), 1e-12 * m.elastic_matrix().norm());
}

// Central differences of the update about random plastic states (the test below).
void expect_tangent_matches_central_differences(int substeps) {
  // Central differences with step h = 1e-7 on strains of order 1e-2: truncation error
  // ~ h^2/6 |sigma'''| with |sigma'''| ~ |C| / eps_c^2 (eps_c ~ 1e-3, the strain scale over
  // which the return map bends) is ~ 4e-4 MPa; round-off ~ eps_mach |sigma| / h ~ 1.5e-6 MPa.
  // Both are far below the tolerance 1e-6 |C|_max = 0.23 MPa, while a missing term of the
  // consistent tangent (e.g. theta2 = 1 - 2/3 H dgamma, up to ~10 % here, scaling a hardening
  // stiffness of ~2e3 MPa) would show as errors of order 1e2 MPa.
  // States are chosen so that epbar stays inside one segment of the piecewise-linear curve for
  // all perturbed strains (checked), i.e. away from the kinks where the tangent jumps.
  const double h = 1e-7;
  double asymmetry = 0.0;  // largest |fd - fd^T| / tol
  std::mt19937 rng(7);
  std::uniform_real_distribution<double> u(-1.0, 1.0);
  int checked = 0;
  for (SteelCurveKind kind : {SteelCurveKind::elastic_plastic, SteelCurveKind::bilinear,
                              SteelCurveKind::quadlinear}) {
    const J2PlaneStress m = material(kind, substeps);
    const double tol = 1e-6 * m.elastic_matrix().cwiseAbs().maxCoeff();
    for (int n = 0; n < 20; ++n) {
      LayerState committed, trial;
      Eigen::Vector3d s;
      m.update(0.01 * Eigen::Vector3d(u(rng), u(rng), u(rng)), LayerState{}, committed, s,
               nullptr);
      committed.initial_stress = 50.0 * Eigen::Vector3d(u(rng), u(rng), u(rng));
      const Eigen::Vector3d eps = 0.02 * Eigen::Vector3d(u(rng), u(rng), u(rng));
      Eigen::Matrix3d D;
      if (m.update(eps, committed, trial, s, &D) != ReturnStatus::Plastic) continue;
      const std::size_t seg = m.curve().segment(trial.equivalent_plastic_strain);
      bool same_segment = true;
      Eigen::Matrix3d fd;
      for (int j = 0; j < 3; ++j) {
        Eigen::Vector3d sp, sm;
        LayerState tp, tm;
        const Eigen::Vector3d e = Eigen::Vector3d::Unit(j) * h;
        const ReturnStatus a = m.update(eps + e, committed, tp, sp, nullptr);
        const ReturnStatus b = m.update(eps - e, committed, tm, sm, nullptr);
        same_segment = same_segment && a == ReturnStatus::Plastic && b == ReturnStatus::Plastic &&
                       m.curve().segment(tp.equivalent_plastic_strain) == seg &&
                       m.curve().segment(tm.equivalent_plastic_strain) == seg;
        fd.col(j) = (sp - sm) / (2.0 * h);
      }
      if (!same_segment) continue;
      ++checked;
      // One step: the consistent tangent is symmetric (associative flow). Substeps: the exact
      // derivative of the chain is not, and update() returns its symmetric part.
      const Eigen::Matrix3d expected = substeps == 1 ? fd : Eigen::Matrix3d(0.5 * (fd + fd.transpose()));
      EXPECT_LE((expected - D).cwiseAbs().maxCoeff(), tol)
          << steel_curve_kind_name(kind) << " state " << n << "\nD=\n" << D << "\nfd=\n" << fd;
      EXPECT_LE((D - D.transpose()).cwiseAbs().maxCoeff(), 1e-9 * tol);
      if (substeps > 1) asymmetry = std::max(asymmetry, (fd - fd.transpose()).cwiseAbs().maxCoeff() / tol);
    }
  }
  std::printf("tangent (%d substeps): %d plastic states checked against central differences\n", substeps, checked);
  EXPECT_GE(checked, 30);
  // The substep chain must really be tested: its derivative is unsymmetric at these large steps.
  if (substeps > 1) {
    EXPECT_GT(asymmetry, 10.0);
  }
}

TEST(J2PlaneStress, ConsistentTangentMatchesCentralDifferences) { expect_tangent_matches_central_differences(1); }

TEST(J2PlaneStress, SubstepChainTangentIsTheSymmetricPartOfCentralDifferences) {
  expect_tangent_matches_central_differences(4);
}

TEST(J2PlaneStress, SubstepsConvergeAtFirstOrderOnANonProportionalIncrement) {
  // From a state yielded in uniaxial tension, one increment turns the strain towards shear (the
  // kind of increment a buckling plate's layers see). Backward Euler is first-order accurate on
  // such a path (Simo & Hughes 1998, section 3.3), so the error of n substeps against n = 256
  // halves with each doubling of n.
  const Eigen::Vector3d start(2.0 * kFy / kE, -0.9 * kFy / kE, 0.0);
  const Eigen::Vector3d end = start + Eigen::Vector3d(0.0, 0.0, 4.0 * kFy / kE);
  auto run = [&](int substeps) {
    const J2PlaneStress m = material(SteelCurveKind::bilinear, substeps);
    LayerState committed, trial;
    Eigen::Vector3d s;
    m.update(start, LayerState{}, committed, s, nullptr);
    EXPECT_EQ(m.update(end, committed, trial, s, nullptr), ReturnStatus::Plastic);
    return s;
  };
  const Eigen::Vector3d exact = run(64);
  double error[4];
  for (int i = 0; i < 4; ++i) error[i] = (run(1 << i) - exact).norm();  // n = 1, 2, 4, 8
  std::printf("substep stress errors against n = 64 [MPa]: n=1 %.3g, 2 %.3g, 4 %.3g, 8 %.3g\n", error[0], error[1],
              error[2], error[3]);
  EXPECT_GT(error[0], 1.0);  // one step is far off on this path
  for (int i = 1; i < 4; ++i) {
    EXPECT_GT(error[i - 1] / error[i], 1.6) << "n = " << (1 << i);
    EXPECT_LT(error[i - 1] / error[i], 2.6) << "n = " << (1 << i);
  }
}

TEST(J2PlaneStress, DissipationIsNonNegativeAndBalancesWork) {
  // Random (seeded) strain path, 400 steps. Each step's plastic work sigma : d eps_p >= 0, and
  // backward Euler satisfies exactly (algebra, with sigma = C (eps - eps_p)):
  //   sum sigma_{n+1} . d eps = Psi_N - Psi_0 + D_N + sum 1/2 d sigma . C^-1 d sigma,
  // Psi = 1/2 sigma . C^-1 sigma the stored elastic energy; checked to round-off. (Per
  // backward-Euler step, so with one step per update.)
  const J2PlaneStress m = material(SteelCurveKind::quadlinear, 1);
  const Eigen::Matrix3d Cinv = m.elastic_matrix().inverse();
  std::mt19937 rng(12345);
  std::normal_distribution<double> n01(0.0, 1.0);
  LayerState committed, trial;
  Eigen::Vector3d eps = Eigen::Vector3d::Zero(), s_old = Eigen::Vector3d::Zero(), s;
  double work = 0.0, work_abs = 0.0, extra = 0.0, min_step = 0.0;
  int plastic = 0;
  for (int step = 0; step < 400; ++step) {
    const Eigen::Vector3d d = 1.5e-3 * Eigen::Vector3d(n01(rng), n01(rng), n01(rng));
    eps += d;
    if (m.update(eps, committed, trial, s, nullptr) == ReturnStatus::Plastic) ++plastic;
    const double dD = trial.dissipation - committed.dissipation;
    min_step = std::min(min_step, dD);
    EXPECT_GE(dD, 0.0) << "step " << step;
    EXPECT_GE(trial.equivalent_plastic_strain, committed.equivalent_plastic_strain);
    work += s.dot(d);
    work_abs += std::abs(s.dot(d));
    extra += 0.5 * (s - s_old).dot(Cinv * (s - s_old));
    s_old = s;
    committed = trial;
  }
  const double psi = 0.5 * s.dot(Cinv * s);
  std::printf("dissipation: %d plastic steps, D = %.4f N/mm^2, work = %.4f, min step %.2e\n",
              plastic, committed.dissipation, work, min_step);
  EXPECT_GT(plastic, 100);
  EXPECT_GT(committed.dissipation, 0.0);
  EXPECT_CLOSE(work, psi + committed.dissipation + extra, 0.0, 1e-11 * work_abs);
}

TEST(J2PlaneStress, InitialStressAddsToElasticStress) {
  const J2PlaneStress m = material(SteelCurveKind::quadlinear);
  LayerState committed, trial;
  committed.initial_stress = Eigen::Vector3d(-100.0, 20.0, 5.0);
  Eigen::Vector3d s;
  const Eigen::Vector3d eps(2e-4, -1e-4, 3e-4);
  EXPECT_EQ(m.update(eps, committed, trial, s, nullptr), ReturnStatus::Elastic);
  EXPECT_LE((s - m.elastic_matrix() * eps - committed.initial_stress).norm(), 1e-12 * kFy);
  EXPECT_EQ(trial.initial_stress, committed.initial_stress);
  // An initial stress past yield flows on the first update, even at zero strain.
  committed.initial_stress = Eigen::Vector3d(400.0, 0.0, 0.0);
  EXPECT_EQ(m.update(Eigen::Vector3d::Zero(), committed, trial, s, nullptr),
            ReturnStatus::Plastic);
  EXPECT_CLOSE(J2PlaneStress::von_mises(s), m.curve().flow_stress(trial.equivalent_plastic_strain),
               1e-12, 0.0);
}

TEST(J2PlaneStress, ReportsNonFiniteStrainAsNotConverged) {
  const J2PlaneStress m = material(SteelCurveKind::bilinear);
  LayerState committed, trial;
  Eigen::Vector3d s;
  const double nan = std::numeric_limits<double>::quiet_NaN();
  EXPECT_EQ(m.update(Eigen::Vector3d(nan, 0.0, 0.0), committed, trial, s, nullptr),
            ReturnStatus::NotConverged);
}

TEST(J2PlaneStress, RejectsBadConstants) {
  EXPECT_THROW(J2PlaneStress(-1.0, 0.3, HardeningCurve::perfectly_plastic(kFy)),
               std::invalid_argument);
  EXPECT_THROW(J2PlaneStress(kE, 0.5, HardeningCurve::perfectly_plastic(kFy)),
               std::invalid_argument);
  J2PlaneStress::Options o;
  o.tolerance = 0.0;
  EXPECT_THROW(J2PlaneStress(kE, kNu, HardeningCurve::perfectly_plastic(kFy), o),
               std::invalid_argument);
}

}  // namespace
}  // namespace rotcap
