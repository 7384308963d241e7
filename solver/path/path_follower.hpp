#pragma once
// PathFollower: incremental-iterative solution of an EquilibriumProblem along its load path, with a
// StepConstraint deciding the load factor (load, displacement or arc-length control).
//
// Each step: predict (the last factorised tangent: after a converged step, that of its iterate before
// the converged one; at the start and after a cut-back, the tangent at the committed state; dlambda
// from the constraint), correct (Newton with the full tangent, two solves per iteration; an iterate
// that looks converged is evaluated without its tangent, and the converged iterate's tangent is
// never factorised), and on convergence commit and adapt the step size,
// either (step_rule = curve, with a monitored quantity set) to the shape of the monitored curve
// (CurveStepRule, solver/path/curve_step_rule.hpp), or (step_rule = iterations) to the iteration
// count I against target_iterations T: x2 for I <= T/2, x1.25 for I <= T, kept for
// T < I <= 2T, x sqrt(T/I) (at least 1/2) above (the square-root rule of Crisfield 1991, vol. 1,
// section 9.5, with a dead band: plastic steps often need a few iterations more while yield zones
// spread, and shrinking on every such step lets the size decay for good); on divergence revert and
// halve, down to a floor (min_step_ratio * first size), then stop. A converged step whose increment
// makes an obtuse angle with the previous one (it doubled back to another part of the path) is
// rejected like a diverged one.
// Convergence needs BOTH  |r| <= force_tolerance * |f_ref|  and  |du|_W <= displacement_tolerance * |Du|_W
// (du the last correction, Du the step increment, W the arc-length weights = translations).

#include "solver/path/curve_step_rule.hpp"
#include "solver/path/equilibrium_problem.hpp"
#include "solver/path/step_constraint.hpp"

#include <functional>
#include <limits>
#include <optional>
#include <string>
#include <vector>

namespace rotcap {

/// How a converged step sets the next step's size (see the header comment).
enum class StepRule { iterations, curve };

struct PathOptions {
  double force_tolerance = 1.0e-6;          ///< > 0, relative to |f_ref|
  double displacement_tolerance = 1.0e-4;   ///< > 0, relative to the step increment
  int max_iterations = 20;                  ///< >= 1 Newton corrections per attempt
  double first_step = 0.1;                  ///< > 0, load-factor size of the first step
  double min_step_ratio = 1.0e-4;           ///< in (0, 1]: cut-back floor relative to the first step
  double max_step_ratio = 10.0;             ///< >= 1: largest step relative to the first step
  int target_iterations = 6;                ///< >= 1
  StepRule step_rule = StepRule::iterations;
  CurveStepOptions curve;                   ///< step_rule = curve: the targets (plastic_step, turning_step)
  int max_steps = 500;                      ///< >= 1 converged steps
  double max_load_factor = std::numeric_limits<double>::infinity();   ///< landed on exactly
  double max_control_value = std::numeric_limits<double>::quiet_NaN();///< displacement control: landed on
  /// Throws OptionError naming the option ("analysis.first_step", the case-file key), its value
  /// and the rule. max_load_factor and max_control_value are set by the program, not checked here.
  void validate() const;
};

enum class PathStatus {
  Completed,         ///< the observer asked to stop (its criterion met) or a limit was landed on
  MaxSteps,          ///< max_steps converged steps done
  StepTooSmall,      ///< no convergence even at the smallest step: state = last converged step
  EvaluationFailed,  ///< an element or the factorisation failed at the committed state
};
const char* to_string(PathStatus status);

struct ConvergedStep {
  int step = 0;                       ///< 1, 2, ...
  double load_factor = 0.0;
  double load_factor_increment = 0.0;
  int iterations = 0;                 ///< Newton corrections of the accepted attempt
  int cutbacks = 0;                   ///< failed attempts before it
  int negative_pivots = 0;            ///< of the last factorised tangent: the corrector iterate before the converged one
  int residual_only_evaluations = 0;  ///< iterates of the accepted attempt evaluated without tangent (converging())
  int repeated_evaluations = 0;       ///< of those, not converged after all: evaluated again with the tangent
  double step_size = 0.0;             ///< in the constraint's measure
  std::vector<double> residual_norms; ///< |r| at each evaluation of the accepted attempt
};

struct PathSummary {
  PathStatus status = PathStatus::Completed;
  std::string message;
  int steps = 0;
  int iterations = 0;
  int cutbacks = 0;
  double load_factor = 0.0;
  /// Sums of ConvergedStep's counts over the steps of this call (not carried over a resume).
  int residual_only_evaluations = 0;
  int repeated_evaluations = 0;
};

/// Where a path stands after a converged step, with the step size chosen for the next one: enough,
/// with the problem's committed state, to continue the path as if it had not stopped (checkpoints).
struct PathState {
  double load_factor = 0.0;
  Eigen::VectorXd total_increment;     ///< u - u(start of the run), free DOFs
  Eigen::VectorXd previous_increment;  ///< the last converged step's increment (empty before the first)
  double next_size = 0.0;              ///< the size the next step tries, in the constraint's measure
  double first_size = 0.0;             ///< the first step's size (floor and ceiling are relative to it)
  int steps = 0, iterations = 0, cutbacks = 0;
  double previous_load_factor_increment = 0.0;  ///< of the last converged step
  double curve_elastic_value = 0.0;  ///< step_rule = curve: q_el of the monitored quantity (0: no rule)
};

class PathFollower {
 public:
  /// Called after each converged step (state committed, tangent factorised there); return false to stop.
  using Observer = std::function<bool(const ConvergedStep&)>;

  PathFollower(EquilibriumProblem& problem, const StepConstraint& constraint, PathOptions options);
  /// The monitored quantity q = weights . u of step_rule = curve (over the free DOFs); without it
  /// that rule falls back to the iteration count.
  void set_curve_monitor(Eigen::VectorXd weights) { curve_weights_ = std::move(weights); }
  /// Starts from the committed state of the problem at load factor lambda0.
  PathSummary run(const Observer& observer, double lambda0 = 0.0);
  /// Continues a path from `from` (a state() taken in an observer of an earlier run). The problem
  /// must hold the committed state of that step with the tangent factorised there
  /// (ShellProblem::restore); step numbers and the summary's counts go on from the state's.
  PathSummary resume(const Observer& observer, const PathState& from);
  /// The path after the step the observer is called for (the next size already chosen).
  const PathState& state() const { return state_; }

 private:
  enum class Attempt { Converged, Diverged, Failed };
  bool factorise_at_committed(PathSummary& summary);
  double landing_size(double size, bool& lands) const;
  Attempt attempt_step(const StepConstraint& constraint, double size, ConvergedStep& record);
  bool converged(double r_norm, double du_norm, double Du_norm) const;
  /// Whether the next iterate will likely converge: the last correction already meets the
  /// displacement test and the residual, extrapolated at the last ratio r_k^2 / r_(k-1) (conservative
  /// under quadratic convergence), meets the force test.
  bool converging(const std::vector<double>& residual_norms, double du_norm, double Du_norm) const;
  PathSummary follow(const Observer& observer, PathSummary summary);
  double next_size(int iterations, double size) const;
  /// Called after commit, before Du_prev_ and state_ take this step's values.
  double curve_next_size(const ConvergedStep& record, double size) const;
  void start_curve_rule(double elastic_value);

  EquilibriumProblem& problem_;
  const StepConstraint& constraint_;
  PathOptions options_;
  double lambda_ = 0.0;
  double ref_norm_ = 1.0;
  PathState state_;
  Eigen::VectorXd curve_weights_;
  std::optional<CurveStepRule> curve_rule_;
  // Work vectors, sized once.
  Eigen::VectorXd f_int_, r_, du_r_, du_f_, du_, Du_, Du_prev_, u_total_;
  bool du_f_current_ = false;  // du_f_ = K^-1 f_ref with the tangent solve() applies now
};

}  // namespace rotcap
