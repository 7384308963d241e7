#include "tests/verification/nonlinear/path_record.hpp"

#include <algorithm>
#include <cstdio>

namespace rotcap::verification {

double PathRecord::mean_iterations() const {
  if (steps.empty()) return 0.0;
  double sum = 0.0;
  for (const ConvergedStep& s : steps) sum += s.iterations;
  return sum / static_cast<double>(steps.size());
}

PathRecord follow_path(EquilibriumProblem& problem, const StepConstraint& constraint, const PathOptions& options,
                       double lambda0, const std::function<bool(const ConvergedStep&)>& on_step) {
  PathRecord record;
  PathFollower follower(problem, constraint, options);
  record.summary = follower.run(
      [&](const ConvergedStep& step) {
        record.steps.push_back(step);
        return on_step ? on_step(step) : true;
      },
      lambda0);
  return record;
}

void append(PathRecord& a, const PathRecord& b) {
  const int offset = a.summary.steps;
  for (ConvergedStep s : b.steps) {
    s.step += offset;
    a.steps.push_back(s);
  }
  a.summary.status = b.summary.status;
  a.summary.message = b.summary.message;
  a.summary.steps += b.summary.steps;
  a.summary.iterations += b.summary.iterations;
  a.summary.cutbacks += b.summary.cutbacks;
  a.summary.load_factor = b.summary.load_factor;
}

EvaluationStatus NewtonRecorder::evaluate(Eigen::VectorXd& internal_force, bool factorise_tangent) {
  const EvaluationStatus s = inner_.evaluate(internal_force, factorise_tangent);
  // Evaluations at the committed state (before the predictor) belong to no iteration.
  if (s == EvaluationStatus::Ok && !updates_.empty()) forces_.push_back(internal_force);
  return s;
}

void NewtonRecorder::update(const Eigen::VectorXd& du) {
  inner_.update(du);
  updates_.push_back(du);
}

void NewtonRecorder::commit() {
  inner_.commit();
  committed_forces_ = std::move(forces_);
  committed_updates_ = std::move(updates_);
  forces_.clear();
  updates_.clear();
}

void NewtonRecorder::revert() {
  inner_.revert();
  forces_.clear();
  updates_.clear();
}

std::vector<double> NewtonRecorder::energy_norms(double lambda) const {
  // updates: predictor, du_1, du_2, ...; forces: after the predictor, after du_1, ...
  std::vector<double> e;
  for (std::size_t k = 0; k + 1 < committed_updates_.size() && k < committed_forces_.size(); ++k) {
    const Eigen::VectorXd r = committed_forces_[k] - inner_.fixed_load() - lambda * inner_.reference_load();
    e.push_back(std::abs(committed_updates_[k + 1].dot(r)));
  }
  return e;
}

std::string residual_line(const std::string& label, const std::vector<double>& residual_norms, double scale) {
  std::string line = label + ": |r|/|f_ref| =";
  char buf[32];
  for (double r : residual_norms) {
    std::snprintf(buf, sizeof buf, " %.2e", r / scale);
    line += buf;
  }
  return line;
}

}  // namespace rotcap::verification
