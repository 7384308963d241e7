// Newton's method converges quadratically on a plastic structure when the tangent is the
// consistent one (Simo & Taylor 1985, "Consistent tangent operators for rate-independent
// elastoplasticity", CMAME 48:101-118: with the algorithmic tangent of the return map the global
// Newton iteration keeps its quadratic rate; with the continuum tangent it does not).
//
// Model: the cantilever strip of cantilever_collapse_test.cpp (free edges), bilinear hardening
// H = E/100, under an oblique tip force (vertical plus half as much sideways), loaded in steps
// through first yield to 1.1 P_c. Each load step is one plain Newton solve at fixed load on the
// ShellProblem (evaluate / solve / update, the symmetric part of the corotational tangent; the skew
// part vanishes at equilibrium for force loads, corotational_kinematics.hpp), so the printed
// residual sequence is the raw iteration, not the path follower's.
//
// Switching: while the set of layer points that flow plastically changes between iterations, the
// residual is only piecewise smooth and no rate can be expected. The set is tracked per iteration
// with HistoryReplay (history_replay.hpp), which mirrors every update of the problem. The assertion
// applies to the iterations after the last change of the set and above the round-off floor:
//   rho_{k+1} <= C rho_k^2,  rho = |r| / |f_ref|,  C = 100.
// Why C = 100: Newton's error constant is ~ |K^-1| |K'| / 2 in these units; K changes by O(K) over
// a displacement of the order of the yield deflection u_y, and |K^-1 f_ref| is the elastic
// deflection under f_ref, ~u_y here, so C ~ O(1-10). A linearly converging iteration with a
// typical contraction 0.05-0.5 would need C = contraction / rho_k > 5e3 once rho_k < 1e-5, so the
// bound tells the two apart. Floor: the deformational displacements are differences of coordinates
// ~100 mm, rounded to ~1e-14 mm, times the membrane stiffness E t ~ 1e6 N/mm: ~1e-8 N per node,
// measured rho ~2e-10 (|f_ref| = 248 N). Converged: rho < 1e-9. Checked pairs: rho_k > 1e-5, so that
// C rho_k^2 = 1e-8 stays above the floor (a pair ending on the floor proves nothing either way).

#include "solver/nonlinear/shell_problem.hpp"
#include "tests/test_support.hpp"
#include "tests/verification/plastic/history_replay.hpp"
#include "tests/verification/plastic/plastic_strip.hpp"

#include <cmath>
#include <cstdio>
#include <vector>

namespace rotcap {
namespace {

using namespace rotcap::testing;

constexpr double kE = 210000.0, kNu = 0.3, kFy = 355.0, kL = 100.0, kB = 10.0, kT = 5.0;
constexpr double kC = 100.0, kConverged = 1e-9, kSmallestChecked = 1e-5;

struct Iteration {
  double rho;    // |r| / |f_ref| before the correction
  int plastic;   // layer points flowing plastically at this iterate
  int switched;  // points whose elastic / plastic state differs from the previous iterate
};

TEST(PlasticNewton, ConvergesQuadraticallyOnceThePlasticZoneIsSettled) {
  StripSpec spec;
  spec.length = kL;
  spec.width = kB;
  spec.thickness = kT;
  spec.stations = uniform_stations(kL, 10);
  ShellModel model = strip_model(spec);
  clamp_root_for_bending(model);
  const double Pc = kFy * kB * kT * kT / (4.0 * kL);
  model.loads = {{"tip", Eigen::Vector3d(0.0, 0.5 * Pc, -Pc), Eigen::Vector3d::Zero()}};
  // One backward-Euler step per layer update: its consistent tangent is exact and symmetric, which
  // quadratic convergence needs; the substep chain's tangent is the symmetric part of an
  // unsymmetric one (materials/j2_plane_stress.hpp), so with substeps Newton is a little slower.
  const SectionAssignment sections = layered_sections(model, kE, kNu, linear_hardening(kFy, kE / 100.0), kT, 5, 1);
  ShellProblemOptions po;
  po.threads = 1;
  // Incompatible modes converged to 1e-13 of their force scale, so the element's own iteration
  // leaves no floor above the global one.
  po.element.core.local_tolerance = 1e-13;
  ShellProblem problem(model, sections, po);
  HistoryReplay replay(model, sections, po.element);
  const Eigen::VectorXd& f_ref = problem.reference_load();
  Eigen::VectorXd f, du;
  int checked = 0, failures = 0;
  double worst_C = 0.0;
  for (double lambda : {0.6, 0.8, 0.9, 1.0, 1.05, 1.1}) {
    std::vector<Iteration> history;
    std::vector<LayerState> previous_trial = replay.committed_all();
    bool converged = false;
    for (int k = 0; k < 30; ++k) {
      ASSERT_EQ(problem.evaluate(f, true), EvaluationStatus::Ok) << problem.last_message();
      ASSERT_TRUE(replay.evaluate());
      const Eigen::VectorXd r = f - lambda * f_ref;
      Iteration it{r.norm() / f_ref.norm(), replay.plastic_points(), 0};
      const std::vector<LayerState>& trial = replay.trial_all();
      const std::vector<LayerState>& committed = replay.committed_all();
      for (std::size_t i = 0; i < trial.size(); ++i) {
        const bool now = trial[i].equivalent_plastic_strain > committed[i].equivalent_plastic_strain;
        const bool before = previous_trial[i].equivalent_plastic_strain > committed[i].equivalent_plastic_strain;
        it.switched += now != before;
      }
      previous_trial = trial;
      history.push_back(it);
      if (it.rho < kConverged) {
        converged = true;
        break;
      }
      problem.solve(-r, du);
      problem.update(du);
      replay.update(problem.dofs(), du);
    }
    ASSERT_TRUE(converged) << "load factor " << lambda;
    problem.commit();
    replay.commit();
    // The last iterate whose plastic set changed; quadratic rate from there on.
    std::size_t settled = 0;
    for (std::size_t k = 0; k < history.size(); ++k)
      if (history[k].switched > 0) settled = k;
    std::printf("  P/P_c = %.2f (oblique force): iteration | rho = |r|/|f_ref| | plastic points | switched | rho_k+1 / rho_k^2\n",
                lambda);
    for (std::size_t k = 0; k < history.size(); ++k) {
      const bool last = k + 1 == history.size();
      const double C = last ? 0.0 : history[k + 1].rho / (history[k].rho * history[k].rho);
      char ratio[32] = "-";
      if (!last) std::snprintf(ratio, sizeof ratio, "%.3g", C);
      std::printf("    %2zu | %.3e | %4d | %4d | %s\n", k, history[k].rho, history[k].plastic, history[k].switched, ratio);
      if (!last && k >= settled && history[k].rho > kSmallestChecked) {
        ++checked;
        worst_C = std::max(worst_C, C);
        if (C > kC) ++failures;
        EXPECT_LE(history[k + 1].rho, kC * history[k].rho * history[k].rho)
            << "load factor " << lambda << ", iteration " << k;
      }
    }
  }
  std::printf("  %d iterations checked after the plastic set settled; largest rho_k+1 / rho_k^2 = %.3g (bound %g)\n",
              checked, worst_C, kC);
  EXPECT_GE(checked, 6);  // the check must have seen iterations, not passed vacuously
  EXPECT_EQ(failures, 0);
}

}  // namespace
}  // namespace rotcap
