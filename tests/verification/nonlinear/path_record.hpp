#pragma once
// Running a ShellProblem along its path in the verification tests, and measuring how Newton
// converged: the converged steps with their residual sequences, the mean iteration count, and the
// energy norms of the corrections (NewtonRecorder).

#include "solver/nonlinear/shell_problem.hpp"
#include "solver/path/path_follower.hpp"

#include <functional>
#include <string>
#include <vector>

namespace rotcap::verification {

struct PathRecord {
  std::vector<ConvergedStep> steps;
  PathSummary summary;
  /// Newton corrections per converged step (0 without steps).
  double mean_iterations() const;
};

/// Follows the path from the committed state at load factor lambda0 with a fresh PathFollower.
/// on_step (optional) is called after each converged step, after it is recorded; false stops.
PathRecord follow_path(EquilibriumProblem& problem, const StepConstraint& constraint, const PathOptions& options,
                       double lambda0 = 0.0, const std::function<bool(const ConvergedStep&)>& on_step = {});

/// An EquilibriumProblem that forwards to another and records, for the attempt that was last
/// committed, the internal force after each update and each correction applied: enough to form the
/// energy norms |du_k+1 . r_k| of the Newton iteration afterwards (r_k = f_int,k - f_fixed -
/// lambda f_ref, for load control where lambda is the step's load factor throughout the corrector).
class NewtonRecorder final : public EquilibriumProblem {
 public:
  explicit NewtonRecorder(EquilibriumProblem& inner) : inner_(inner) {}
  int size() const override { return inner_.size(); }
  const Eigen::VectorXd& reference_load() const override { return inner_.reference_load(); }
  const Eigen::VectorXd& fixed_load() const override { return inner_.fixed_load(); }
  const Eigen::VectorXd& arc_length_weights() const override { return inner_.arc_length_weights(); }
  EvaluationStatus evaluate(Eigen::VectorXd& internal_force, bool factorise_tangent) override;
  void solve(const Eigen::VectorXd& rhs, Eigen::VectorXd& x) override { inner_.solve(rhs, x); }
  int negative_pivots() const override { return inner_.negative_pivots(); }
  void update(const Eigen::VectorXd& du) override;
  void commit() override;
  void revert() override;
  std::string last_message() const override { return inner_.last_message(); }

  /// Energy norms |du_k+1 . r_k|, k = 0, 1, ..., of the last committed load-controlled step at
  /// load factor lambda (k = 0: the residual after the predictor).
  std::vector<double> energy_norms(double lambda) const;

 private:
  EquilibriumProblem& inner_;
  std::vector<Eigen::VectorXd> forces_, updates_;                    // current attempt
  std::vector<Eigen::VectorXd> committed_forces_, committed_updates_;  // last committed attempt
};

/// Appends b's steps and counts to a (a continued run).
void append(PathRecord& a, const PathRecord& b);

/// "label: |r|/scale = 1.2e-02 3.4e-05 ..." on one line.
std::string residual_line(const std::string& label, const std::vector<double>& residual_norms, double scale);

}  // namespace rotcap::verification
