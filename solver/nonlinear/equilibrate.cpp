#include "solver/nonlinear/equilibrate.hpp"

#include <cmath>

namespace rotcap {

EquilibrateResult equilibrate(EquilibriumProblem& problem, double force_scale, const EquilibrateOptions& options) {
  EquilibrateResult result;
  Eigen::VectorXd f, du, total = Eigen::VectorXd::Zero(problem.size());
  const Eigen::VectorXd& w = problem.arc_length_weights();
  for (int k = 0; k <= options.max_iterations; ++k) {
    if (problem.evaluate(f, true) != EvaluationStatus::Ok) {
      result.message = "evaluation failed: " + problem.last_message();
      problem.revert();
      return result;
    }
    const Eigen::VectorXd r = f - problem.fixed_load();
    result.residual_norms.push_back(r.norm());
    if (r.norm() <= options.force_tolerance * force_scale) {
      result.converged = true;
      result.iterations = k;
      result.displacement_norm = (total.array().abs() * w.array()).maxCoeff();
      problem.commit();
      return result;
    }
    if (k == options.max_iterations) break;
    problem.solve(-r, du);
    problem.update(du);
    total += du;
  }
  result.message = "no equilibrium after " + std::to_string(options.max_iterations) + " iterations";
  problem.revert();
  return result;
}

}  // namespace rotcap
