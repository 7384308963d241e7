// Initial (residual) stresses in a structural model: a cantilever I-beam hinge zone (hinge-zone
// mesher: fixed support section, rigid end section tied to a reference node), IPE 200 plate
// dimensions (h 200, b 100, tf 8.5, tw 5.6 mm; docs/spec/references.md section 7), S355, 5 layers, with
// LayerState::initial_stress set through ShellProblem::set_initial_stress.
//
// 1. Self-equilibrated patterns give zero internal force at zero displacement, to round-off:
//    (a) over the section, an ECCS-shaped flange pattern (ECCS 1984, Publ. 33, from memory,
//        docs/spec/references.md section 4): sigma_xx = s (1 - 4 |y| / b), +s at the web junction, -s at the
//        tips, s = 0.3 fy, the web unstressed: each flange's mean is zero, so N = My = Mz = 0 over
//        the section; it is uniform along x (d sigma_xx / dx = 0: in-plane equilibrium) and piecewise
//        linear in y with its kink on the junction node line; the fully fixed support takes the
//        end traction, the rigid end section has zero resultant. The elements integrate it exactly
//        (2x2 Gauss, linear in y), and a linear-in-y sigma_xx is orthogonal to the incompatible modes
//        of a rectangle (their strains are odd in the element's own coordinate along x);
//    (b) through the thickness, everywhere (flanges and web): sigma(z) = q (1 - 12 z^2 / t^2) for all
//        three components with q = (0.1, -0.05, 0.05) fy: zero N and M at every point, exactly for
//        Simpson's rule, which integrates quadratics exactly.
//    Scale: F = fy tf b = 3.0e5 N; bound 1e-11 F on the free DOFs (sums of ~10 element forces of
//    ~1e4 N each, rounded at 1e-16 relative, ~1e-11 N; the bound leaves a wide margin).
// 2. A non-equilibrated pattern (uniform flange compression 0.3 fy, web unstressed) leaves a
//    residual at the reference node (the section's net force); one Newton solve (equilibrate.hpp)
//    removes it: |r| <= 1e-10 F after at most 3 iterations (the response is elastic and nearly
//    linear). The beam lengthens until the net force vanishes: uniform strain
//    eps = -sigma_0 A_f / (E A) (A_f both flanges, A the plate model's area; derived), compared at the
//    reference node within 3 % (the fixed support restrains the flanges' Poisson expansion over a
//    length of about b next to it, which the uniform-strain estimate ignores).
// 3. History is committed only on convergence and restored by revert(): a trial displacement that
//    yields the beam leaves the committed state (max plastic strain, displacements) untouched, a
//    revert() returns the internal force to its committed value bit for bit, commit() then keeps it.

#include "model/hinge_zone/hinge_zone_mesher.hpp"
#include "solver/nonlinear/equilibrate.hpp"
#include "solver/nonlinear/shell_problem.hpp"
#include "tests/test_support.hpp"
#include "tests/verification/plastic/plastic_strip.hpp"

#include <cmath>
#include <cstdio>
#include <functional>
#include <map>
#include <memory>

namespace rotcap {
namespace {

using namespace rotcap::testing;

constexpr double kE = 210000.0, kNu = 0.3, kFy = 355.0;
constexpr double kH = 200.0, kB = 100.0, kTf = 8.5, kTw = 5.6;
constexpr double kF = kFy * kTf * kB;  // force scale [N]

HingeZoneModel beam() {
  HingeZoneSpec spec;
  spec.section.h = kH;
  spec.section.b = kB;
  spec.section.tf = kTf;
  spec.section.tw = kTw;
  spec.setup = HingeSetup::cantilever;
  spec.length = 400.0;
  spec.flange_elements = 4;
  spec.web_elements = 4;
  spec.fy = kFy;
  return build_hinge_zone(spec);
}

SectionAssignment plastic_sections(const ShellModel& m) {
  SectionAssignment a;
  std::map<double, int> by_t;
  for (int e = 0; e < m.element_count(); ++e) {
    const double t = m.elements[e].thickness;
    if (!by_t.count(t)) {
      LayeredShellSection::Options o;
      o.layers = 5;
      by_t[t] = a.add_section(std::make_unique<LayeredShellSection>(
          J2PlaneStress(kE, kNu, HardeningCurve::perfectly_plastic(kFy)), t, o));
    }
    a.assign(e, by_t[t]);
  }
  return a;
}

// Global position of Gauss point gp of element e (2x2 rule in node order, shell_q4.hpp).
Eigen::Vector3d gauss_point(const ShellModel& m, int e, int gp) {
  const double a = 1.0 / std::sqrt(3.0);
  const double xi[4] = {-a, a, a, -a}, eta[4] = {-a, -a, a, a};
  const double xn[4] = {-1, 1, 1, -1}, yn[4] = {-1, -1, 1, 1};
  Eigen::Vector3d x = Eigen::Vector3d::Zero();
  for (int k = 0; k < 4; ++k)
    x += 0.25 * (1 + xn[k] * xi[gp]) * (1 + yn[k] * eta[gp]) * m.nodes[m.elements[e].nodes[k]];
  return x;
}

// Local in-plane components [s_xx, s_yy, s_xy] of a global stress tensor S in element e's frame.
Eigen::Vector3d to_local(const ShellModel& m, int e, const Eigen::Matrix3d& S) {
  NodalCoordinates X;
  for (int k = 0; k < 4; ++k) X.col(k) = m.nodes[m.elements[e].nodes[k]];
  const Eigen::Matrix3d Q = ShellFrame::of(X).rotation;
  const Eigen::Matrix3d s = Q.transpose() * S * Q;
  return {s(0, 0), s(1, 1), s(0, 1)};
}

bool is_flange(const ShellModel& m, int e) { return m.elements[e].region <= 1; }

using Pattern = std::function<Eigen::Vector3d(int, int, int)>;

// sigma_xx(y) along the member in the flanges; web free.
Pattern flange_pattern(const ShellModel& m, const std::function<double(double y)>& sxx) {
  return [&m, sxx](int e, int gp, int) -> Eigen::Vector3d {
    if (!is_flange(m, e)) return Eigen::Vector3d::Zero();
    Eigen::Matrix3d S = Eigen::Matrix3d::Zero();
    S(0, 0) = sxx(gauss_point(m, e, gp).y());
    return to_local(m, e, S);
  };
}

TEST(InitialStress, SelfEquilibratedPatternsGiveZeroInternalForce) {
  const HingeZoneModel h = beam();
  const SectionAssignment sections = plastic_sections(h.model);
  ShellProblemOptions po;
  po.threads = 1;
  ShellProblem problem(h.model, sections, po);
  const double s = 0.3 * kFy;
  const Pattern eccs = flange_pattern(h.model, [s](double y) { return s * (1.0 - 4.0 * std::abs(y) / kB); });
  const Eigen::Vector3d q = Eigen::Vector3d(0.1, -0.05, 0.05) * kFy;
  const Pattern through = [&](int e, int, int k) -> Eigen::Vector3d {
    const auto& sec = dynamic_cast<const LayeredShellSection&>(sections.of(e));
    const double zt = sec.layer_position(k) / sec.thickness();
    return q * (1.0 - 12.0 * zt * zt);
  };
  Eigen::VectorXd f;
  for (const auto& [name, pattern] :
       {std::pair<const char*, Pattern>{"ECCS-shaped flange pattern", eccs},
        {"through-thickness quadratic", through},
        {"both", [&](int e, int gp, int k) -> Eigen::Vector3d { return eccs(e, gp, k) + through(e, gp, k); }}}) {
    problem.set_initial_stress(pattern);
    ASSERT_EQ(problem.evaluate(f, false), EvaluationStatus::Ok);
    const double reaction = problem.full_internal_force().cwiseAbs().maxCoeff();
    std::printf("  %s: max |f| at free DOFs = %.3e N = %.1e F (F = fy tf b = %.3e N); max reaction %.3e N\n",
                name, f.cwiseAbs().maxCoeff(), f.cwiseAbs().maxCoeff() / kF, kF, reaction);
    EXPECT_LT(f.cwiseAbs().maxCoeff(), 1e-11 * kF) << name;
  }
  // The check sees a pattern that is NOT equilibrated (guards against stresses being ignored).
  problem.set_initial_stress(flange_pattern(h.model, [s](double) { return -s; }));
  ASSERT_EQ(problem.evaluate(f, false), EvaluationStatus::Ok);
  std::printf("  uniform flange compression: max |f| = %.3e N\n", f.cwiseAbs().maxCoeff());
  EXPECT_GT(f.cwiseAbs().maxCoeff(), 0.1 * s * kTf * kB);
}

TEST(InitialStress, NonEquilibratedPatternIsRemovedByOneNewtonSolve) {
  const HingeZoneModel h = beam();
  const SectionAssignment sections = plastic_sections(h.model);
  ShellProblemOptions po;
  po.threads = 1;
  ShellProblem problem(h.model, sections, po);
  const double s0 = -0.3 * kFy;  // uniform compression in both flanges
  problem.set_initial_stress(flange_pattern(h.model, [s0](double) { return s0; }));
  EquilibrateOptions eo;
  eo.force_tolerance = 1e-10;
  const EquilibrateResult r = equilibrate(problem, kF, eo);
  std::printf("  equilibrate: converged %d in %d iterations; |r| =", r.converged, r.iterations);
  for (double v : r.residual_norms) std::printf(" %.3e", v);
  std::printf(" N\n");
  ASSERT_TRUE(r.converged) << r.message;
  EXPECT_LE(r.iterations, 3);
  EXPECT_GT(r.residual_norms.front(), 0.1 * std::abs(s0) * kTf * kB);
  // Uniform-strain estimate of the lengthening (derived): N = A_f (s0 + E eps) + A_w E eps = 0.
  const double Af = 2.0 * kB * kTf, A = Af + (kH - kTf) * kTw;
  const double eps = -s0 * Af / (kE * A);
  const int ref = h.model.groups.at("load_point").nodes.front();
  const double ux = problem.displacements()[kDofsPerNode * ref];
  std::printf("  reference-node ux = %.5f mm; uniform-strain estimate eps L = %.5f mm (%.2f %%)\n", ux,
              eps * h.span, 100.0 * (ux / (eps * h.span) - 1.0));
  EXPECT_CLOSE(ux, eps * h.span, 0.03, 0.0);
  EXPECT_EQ(problem.max_plastic_strain(), 0.0);  // elastic: |s0| + E eps < fy
}

TEST(InitialStress, HistoryIsCommittedOnlyOnConvergenceAndRestoredByRevert) {
  const HingeZoneModel h = beam();
  const SectionAssignment sections = plastic_sections(h.model);
  ShellProblemOptions po;
  po.threads = 1;
  ShellProblem problem(h.model, sections, po);
  const double s = 0.3 * kFy;
  problem.set_initial_stress(flange_pattern(h.model, [s](double y) { return s * (1.0 - 4.0 * std::abs(y) / kB); }));
  Eigen::VectorXd f0, f, du;
  ASSERT_EQ(problem.evaluate(f0, true), EvaluationStatus::Ok);
  const Eigen::VectorXd u0 = problem.displacements();
  // A trial that yields: 1.5 x the elastic displacement under the reference load (M = 1.5 Mp).
  problem.solve(1.5 * problem.reference_load(), du);
  problem.update(du);
  ASSERT_EQ(problem.evaluate(f, false), EvaluationStatus::Ok);
  const Eigen::VectorXd f_trial = f;
  EXPECT_EQ(problem.max_plastic_strain(), 0.0) << "trial history leaked into the committed state";
  EXPECT_EQ((problem.displacements() - u0).cwiseAbs().maxCoeff(), 0.0);
  problem.revert();
  ASSERT_EQ(problem.evaluate(f, false), EvaluationStatus::Ok);
  EXPECT_EQ((f - f0).cwiseAbs().maxCoeff(), 0.0) << "revert() did not restore the committed state";
  // Now accept the same trial as a converged step (a test of commit, not of equilibrium).
  problem.update(du);
  ASSERT_EQ(problem.evaluate(f, false), EvaluationStatus::Ok);
  EXPECT_EQ((f - f_trial).cwiseAbs().maxCoeff(), 0.0);
  problem.commit();
  const double committed_plastic = problem.max_plastic_strain();
  std::printf("  trial |f| = %.4e N; max plastic strain after commit %.4e; initial-state |f| = %.3e N\n",
              f_trial.norm(), committed_plastic, f0.norm());
  EXPECT_GT(committed_plastic, 0.0);
  // A second trial, reverted: the committed plastic state (and its internal force) comes back.
  problem.update(-0.5 * du);
  ASSERT_EQ(problem.evaluate(f, false), EvaluationStatus::Ok);
  problem.revert();
  ASSERT_EQ(problem.evaluate(f, false), EvaluationStatus::Ok);
  EXPECT_EQ(problem.max_plastic_strain(), committed_plastic);
  // The committed history now holds the step's plastic strain, so the force at the committed
  // configuration is re-evaluated from it (an elastic or vanishing return at each point): equal to
  // the force that was committed up to the return map's tolerance (1e-13 on (s_vm/s_y)^2 - 1).
  const double change = (f - f_trial).cwiseAbs().maxCoeff() / f_trial.cwiseAbs().maxCoeff();
  std::printf("  force at the committed state after commit + trial + revert: relative change %.2e\n", change);
  EXPECT_LT(change, 1e-10);
}

}  // namespace
}  // namespace rotcap
