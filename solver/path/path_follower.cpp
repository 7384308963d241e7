#include "solver/path/path_follower.hpp"

#include "core/option_error.hpp"
#include "core/text_format.hpp"

#include <algorithm>
#include <cmath>

namespace rotcap {

namespace {
const LoadControl kLandingControl;

[[noreturn]] void bad(const char* key, double value, const std::string& constraint) {
  throw OptionError(std::string("analysis.") + key, format_number(value), std::string(key) + " " + constraint);
}
}  // namespace

void PathOptions::validate() const {
  if (!(force_tolerance > 0.0 && force_tolerance < 1.0))
    bad("force_tolerance", force_tolerance, "in (0, 1) (relative to the reference load norm)");
  if (!(displacement_tolerance > 0.0 && displacement_tolerance < 1.0))
    bad("displacement_tolerance", displacement_tolerance, "in (0, 1) (relative to the step's increment norm)");
  if (max_iterations < 1) bad("max_iterations", max_iterations, ">= 1");
  if (!(first_step > 0.0)) bad("first_step", first_step, "> 0");
  if (!(min_step_ratio > 0.0 && min_step_ratio <= 1.0)) bad("min_step_ratio", min_step_ratio, "in (0, 1]");
  if (!(max_step_ratio >= 1.0)) bad("max_step_ratio", max_step_ratio, ">= 1");
  if (target_iterations < 1 || target_iterations > max_iterations)
    bad("target_iterations", target_iterations,
        "in [1, max_iterations] (max_iterations = " + std::to_string(max_iterations) + ")");
  if (max_steps < 1) bad("max_steps", max_steps, ">= 1");
  if (!(curve.plastic_step > 0.0 && curve.plastic_step < 1.0))
    bad("plastic_step", curve.plastic_step, "in (0, 1) (plastic rotation per step / elastic rotation at load factor 1)");
  if (!(curve.turning_step > 0.0 && curve.turning_step <= 45.0))
    bad("turning_step", curve.turning_step, "in (0, 45] degrees");
}

const char* to_string(PathStatus status) {
  switch (status) {
    case PathStatus::Completed: return "completed";
    case PathStatus::MaxSteps: return "max_steps";
    case PathStatus::StepTooSmall: return "no_convergence";
    case PathStatus::EvaluationFailed: return "evaluation_failed";
  }
  return "unknown";
}

PathFollower::PathFollower(EquilibriumProblem& problem, const StepConstraint& constraint, PathOptions options)
    : problem_(problem), constraint_(constraint), options_(options) {
  const int n = problem_.size();
  for (Eigen::VectorXd* v : {&f_int_, &r_, &du_r_, &du_f_, &du_, &Du_, &u_total_}) v->setZero(n);
  ref_norm_ = problem_.reference_load().norm();
  if (!(ref_norm_ > 0.0)) ref_norm_ = 1.0;
}

bool PathFollower::converged(double r_norm, double du_norm, double Du_norm) const {
  return r_norm <= options_.force_tolerance * ref_norm_ &&
         du_norm <= options_.displacement_tolerance * std::max(Du_norm, 1e-300);
}

bool PathFollower::converging(const std::vector<double>& residual_norms, double du_norm, double Du_norm) const {
  const std::size_t n = residual_norms.size();
  if (n < 2 || du_norm > options_.displacement_tolerance * std::max(Du_norm, 1e-300)) return false;
  const double r1 = residual_norms[n - 1], r0 = residual_norms[n - 2];
  return r0 > 0.0 && r1 * (r1 / r0) <= options_.force_tolerance * ref_norm_;
}

bool PathFollower::factorise_at_committed(PathSummary& summary) {
  du_f_current_ = false;
  if (problem_.evaluate(f_int_, true) == EvaluationStatus::Ok) return true;
  summary.status = PathStatus::EvaluationFailed;
  summary.message = "tangent at the converged state failed: " + problem_.last_message();
  return false;
}

double PathFollower::landing_size(double size, bool& lands) const {
  lands = false;
  const double now = constraint_.controlled_value(u_total_, lambda_);
  double limit = std::numeric_limits<double>::quiet_NaN();
  if (dynamic_cast<const LoadControl*>(&constraint_)) limit = options_.max_load_factor;
  if (dynamic_cast<const DisplacementControl*>(&constraint_)) limit = options_.max_control_value;
  if (!std::isfinite(limit) || !std::isfinite(now)) return size;
  const double remaining = limit - now;
  if (std::abs(remaining) <= size * (1.0 + 1e-12)) {
    lands = true;
    return remaining;
  }
  return std::copysign(size, remaining);
}

PathFollower::Attempt PathFollower::attempt_step(const StepConstraint& constraint, double size,
                                                  ConvergedStep& record) {
  // --- predict: the last factorised tangent (the previous step's iterate before its converged one,
  // or a fresh factorisation at the committed state at the start and after a revert)
  const Eigen::VectorXd& f_ref = problem_.reference_load();
  if (!du_f_current_) problem_.solve(f_ref, du_f_);
  du_f_current_ = true;
  double dlambda = constraint.predict(du_f_, size, Du_prev_);
  if (!std::isfinite(dlambda)) return Attempt::Diverged;
  const double limit = options_.curve.rising_limit;
  if (curve_rule_ && std::isfinite(limit) && lambda_ < 0.9 * limit && dlambda > 0.5 * (limit - lambda_)) {
    size *= 0.5 * (limit - lambda_) / dlambda;  // the predictor is linear in the size
    record.step_size = size;
    dlambda = constraint.predict(du_f_, size, Du_prev_);
    if (!std::isfinite(dlambda)) return Attempt::Diverged;
  }
  const double s = std::abs(size);
  Du_ = dlambda * du_f_;
  double Dlambda = dlambda;
  problem_.update(Du_);
  record.residual_norms.clear();
  record.residual_only_evaluations = record.repeated_evaluations = 0;
  const Eigen::VectorXd& w = problem_.arc_length_weights();
  auto wnorm = [&w](const Eigen::VectorXd& v) { return std::sqrt((v.array().square() * w.array()).sum()); };
  double du_norm = wnorm(Du_);
  // --- correct: Newton with the full tangent. An iterate is evaluated residual-only when it looks
  // converged (see converging()); its tangent is assembled but factorised only when the iterate did
  // not converge: the converged iterate's tangent is never factorised, and the next predictor uses
  // the tangent of the iterate before it.
  for (int k = 0; k <= options_.max_iterations; ++k) {
    const bool residual_only = k > 0 && converging(record.residual_norms, du_norm, wnorm(Du_));
    EvaluationStatus status = EvaluationStatus::Ok;
    if (k == 0) {
      du_f_current_ = false;
      status = problem_.evaluate(f_int_, true);
    } else {
      status = residual_only ? problem_.evaluate(f_int_, false) : problem_.evaluate_deferred(f_int_);
    }
    if (status != EvaluationStatus::Ok) return Attempt::Diverged;
    if (residual_only) ++record.residual_only_evaluations;
    r_ = f_int_ - problem_.fixed_load() - (lambda_ + Dlambda) * f_ref;
    const double r_norm = r_.norm();
    if (!std::isfinite(r_norm)) return Attempt::Diverged;
    record.residual_norms.push_back(r_norm);
    if (k > 0 && converged(r_norm, du_norm, wnorm(Du_))) {
      record.iterations = k;
      record.load_factor_increment = Dlambda;
      return Attempt::Converged;
    }
    if (k == options_.max_iterations) break;
    if (k > 0) {
      if (residual_only) ++record.repeated_evaluations;
      du_f_current_ = false;
      status = residual_only ? problem_.evaluate(f_int_, true) : problem_.factorise_assembled();
      if (status != EvaluationStatus::Ok) return Attempt::Diverged;
    }
    problem_.solve(-r_, du_r_);
    problem_.solve(f_ref, du_f_);
    du_f_current_ = true;
    double delta_lambda = 0.0;
    if (!constraint.correct(du_r_, du_f_, Du_, s, delta_lambda)) return Attempt::Diverged;
    du_ = du_r_ + delta_lambda * du_f_;
    problem_.update(du_);
    Du_ += du_;
    Dlambda += delta_lambda;
    du_norm = wnorm(du_);
  }
  return Attempt::Diverged;
}

void PathFollower::start_curve_rule(double elastic_value) {
  curve_rule_.reset();
  state_.curve_elastic_value = 0.0;
  if (options_.step_rule != StepRule::curve || curve_weights_.size() != problem_.size()) return;
  if (!std::isfinite(elastic_value) || elastic_value == 0.0) return;
  curve_rule_.emplace(curve_weights_, elastic_value, options_.curve);
  state_.curve_elastic_value = elastic_value;
}

double PathFollower::curve_next_size(const ConvergedStep& record, double size) const {
  const CurveChord now = curve_rule_->chord(Du_, record.load_factor_increment);
  CurveChord before;  // Du_prev_ and state_ still hold the step before this one
  if (Du_prev_.size() == Du_.size())
    before = curve_rule_->chord(Du_prev_, state_.previous_load_factor_increment);
  double factor = curve_rule_->size_factor(now, before);
  // Safety of the iteration rule: a step that needed more than twice the target iterations shrinks.
  const int target = options_.target_iterations;
  if (record.iterations > 2 * target)
    factor = std::min(factor, std::max(0.5, std::sqrt(double(target) / record.iterations)));
  return std::clamp(size * factor, options_.min_step_ratio * state_.first_size,
                    options_.max_step_ratio * state_.first_size);
}

double PathFollower::next_size(int iterations, double size) const {
  const int target = options_.target_iterations;
  double factor = 1.0;
  if (iterations <= target / 2) factor = 2.0;
  else if (iterations <= target) factor = 1.25;
  else if (iterations > 2 * target) factor = std::max(0.5, std::sqrt(double(target) / iterations));
  return std::clamp(size * factor, options_.min_step_ratio * state_.first_size,
                    options_.max_step_ratio * state_.first_size);
}

PathSummary PathFollower::run(const Observer& observer, double lambda0) {
  PathSummary summary;
  lambda_ = lambda0;
  u_total_.setZero();
  Du_prev_.resize(0);
  if (!factorise_at_committed(summary)) return summary;
  problem_.solve(problem_.reference_load(), du_f_);
  du_f_current_ = true;
  state_ = PathState{};
  state_.first_size = options_.first_step * constraint_.measure_of(du_f_);
  state_.next_size = state_.first_size;
  start_curve_rule(curve_weights_.size() == du_f_.size() ? curve_weights_.dot(du_f_) : 0.0);
  return follow(observer, summary);
}

PathSummary PathFollower::resume(const Observer& observer, const PathState& from) {
  PathSummary summary;
  if (from.total_increment.size() != problem_.size() ||
      (from.previous_increment.size() != 0 && from.previous_increment.size() != problem_.size())) {
    summary.status = PathStatus::EvaluationFailed;
    summary.message = "the path state to resume from is of another problem";
    return summary;
  }
  state_ = from;
  start_curve_rule(from.curve_elastic_value);
  lambda_ = from.load_factor;
  u_total_ = from.total_increment;
  Du_prev_ = from.previous_increment;
  summary.steps = from.steps;
  summary.iterations = from.iterations;
  summary.cutbacks = from.cutbacks;
  summary.load_factor = from.load_factor;
  return follow(observer, summary);
}

PathSummary PathFollower::follow(const Observer& observer, PathSummary summary) {
  const double first = state_.first_size;
  const double floor = options_.min_step_ratio * first;
  double size = state_.next_size;
  int cutbacks = 0;
  while (summary.steps < options_.max_steps) {
    bool lands = false;
    const double signed_size = landing_size(size, lands);
    ConvergedStep record;
    record.step = summary.steps + 1;
    record.step_size = signed_size;
    Attempt result = attempt_step(constraint_, signed_size, record);
    // Arc length past max_load_factor: redo the step under load control, landing on the limit.
    if (result == Attempt::Converged && std::isfinite(options_.max_load_factor) &&
        !dynamic_cast<const LoadControl*>(&constraint_) &&
        lambda_ + record.load_factor_increment > options_.max_load_factor) {
      problem_.revert();
      if (!factorise_at_committed(summary)) return summary;
      record.step_size = options_.max_load_factor - lambda_;
      result = attempt_step(kLandingControl, record.step_size, record);
      lands = true;
    }
    // A converged step that turns back on the previous one (obtuse angle between the increments,
    // arc-length weights) has jumped to another part of the path: treat it as diverged.
    if (result == Attempt::Converged && Du_prev_.size() == Du_.size()) {
      const Eigen::VectorXd& w = problem_.arc_length_weights();
      if ((Du_.array() * w.array() * Du_prev_.array()).sum() < 0.0) result = Attempt::Diverged;
    }
    // A converged step that went too far along the plastic part of the monitored curve is redone
    // smaller (step_rule = curve), unless it is already at the floor.
    double retry_factor = 0.5;
    if (result == Attempt::Converged && curve_rule_ && !lands &&
        curve_rule_->too_large(curve_rule_->chord(Du_, record.load_factor_increment), retry_factor) &&
        size * retry_factor >= floor)
      result = Attempt::Diverged;
    if (result != Attempt::Converged) {
      // --- cut back: halve (or resize) and retry from the committed state
      problem_.revert();
      ++cutbacks;
      ++summary.cutbacks;
      size *= retry_factor;
      if (size < floor) {
        summary.status = PathStatus::StepTooSmall;
        summary.message = format_text(
            "no convergence at step %d after %d cut-backs: step size %g < floor %g (min_step_ratio %g x first step %g)",
            record.step, cutbacks, size, floor, options_.min_step_ratio, first);
        summary.load_factor = lambda_;
        return summary;
      }
      if (!factorise_at_committed(summary)) return summary;
      continue;
    }
    // --- commit
    problem_.commit();
    lambda_ += record.load_factor_increment;
    u_total_ += Du_;
    // --- adapt the step size (before the observer, so that state() is whole)
    size = curve_rule_ ? curve_next_size(record, std::abs(record.step_size)) : next_size(record.iterations, size);
    Du_prev_ = Du_;
    record.load_factor = lambda_;
    record.cutbacks = cutbacks;
    cutbacks = 0;
    ++summary.steps;
    summary.iterations += record.iterations;
    summary.residual_only_evaluations += record.residual_only_evaluations;
    summary.repeated_evaluations += record.repeated_evaluations;
    summary.load_factor = lambda_;
    // The last factorised tangent is the consistent tangent of the converged increment at the
    // iterate before the converged one: it is the next predictor's tangent and gives the inertia
    // count. Re-evaluating at the committed history instead would give the elastic stiffness at
    // every point that sits on its yield surface (a trial stress exactly on the surface is
    // elastic), which hid the negative pivots past a peak and cost one assembly and factorisation
    // per step.
    record.negative_pivots = problem_.negative_pivots();
    state_.load_factor = lambda_;
    state_.previous_load_factor_increment = record.load_factor_increment;
    state_.total_increment = u_total_;
    state_.previous_increment = Du_prev_;
    state_.next_size = size;
    state_.steps = summary.steps;
    state_.iterations = summary.iterations;
    state_.cutbacks = summary.cutbacks;
    const bool go_on = observer(record);
    if (!go_on || lands) {
      summary.status = PathStatus::Completed;
      summary.message = lands ? "landed on the load or displacement limit" : "stop criterion met";
      return summary;
    }
  }
  summary.status = PathStatus::MaxSteps;
  summary.message = "reached max_steps = " + std::to_string(options_.max_steps);
  return summary;
}

}  // namespace rotcap
