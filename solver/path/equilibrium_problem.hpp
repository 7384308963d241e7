#pragma once
// EquilibriumProblem: the discrete equilibrium r(u, lambda) = f_int(u) - f_fixed - lambda f_ref = 0 on the
// n free DOFs, as seen by the path-following drivers. The drivers know nothing of elements: a problem
// holds a committed state (the last converged step) and a trial state that update() moves.
//
// Contract:
//  - evaluate() computes f_int at the trial state and, if asked, assembles and factorises the tangent
//    K = d f_int / d u there (negative_pivots() then counts its negative pivots, the inertia);
//  - evaluate_deferred() assembles f_int and the tangent but leaves the tangent unfactorised:
//    factorise_assembled() then factorises it, and otherwise the next evaluation discards it (solve()
//    keeps applying the tangent factorised before);
//  - solve() applies the inverse of the last factorised tangent;
//  - update(du) moves the trial state by du (translations added, rotations composed multiplicatively);
//  - commit() makes the trial state the committed one (history included); revert() discards the trial.
// Units are the problem's own (N, mm, rad for rotcap's shells).

#include <Eigen/Core>

#include <string>

namespace rotcap {

enum class EvaluationStatus { Ok, ElementFailed, FactorisationFailed, NotFinite };

class EquilibriumProblem {
 public:
  virtual ~EquilibriumProblem() = default;
  virtual int size() const = 0;
  /// f_ref: the load scaled by the load factor (free DOFs).
  virtual const Eigen::VectorXd& reference_load() const = 0;
  /// f_fixed: a load held constant while lambda varies (e.g. an axial force applied first); zero if none.
  virtual const Eigen::VectorXd& fixed_load() const = 0;
  /// Weights of the DOFs in the arc-length norm (1 for translations, 0 for rotations).
  virtual const Eigen::VectorXd& arc_length_weights() const = 0;
  virtual EvaluationStatus evaluate(Eigen::VectorXd& internal_force, bool factorise_tangent) = 0;
  /// See the contract above. The default factorises at once (evaluate(f, true)): correct, without
  /// the saving of a factorisation the caller turns out not to need.
  virtual EvaluationStatus evaluate_deferred(Eigen::VectorXd& internal_force) { return evaluate(internal_force, true); }
  virtual EvaluationStatus factorise_assembled() { return EvaluationStatus::Ok; }
  virtual void solve(const Eigen::VectorXd& rhs, Eigen::VectorXd& x) = 0;
  virtual int negative_pivots() const = 0;
  virtual void update(const Eigen::VectorXd& du) = 0;
  virtual void commit() = 0;
  virtual void revert() = 0;
  /// Human-readable reason of the last non-Ok evaluation (element, Gauss point, pivot ...).
  virtual std::string last_message() const { return {}; }
};

}  // namespace rotcap
