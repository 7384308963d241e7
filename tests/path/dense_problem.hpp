#pragma once
// A small dense EquilibriumProblem for driver tests: f_int(u) and its Jacobian given as functions.
#include "solver/path/equilibrium_problem.hpp"

#include <Eigen/Dense>
#include <functional>
#include <stdexcept>

namespace rotcap::testing {

class DenseProblem final : public EquilibriumProblem {
 public:
  using Force = std::function<Eigen::VectorXd(const Eigen::VectorXd&)>;
  using Jacobian = std::function<Eigen::MatrixXd(const Eigen::VectorXd&)>;
  DenseProblem(Force f, Jacobian k, Eigen::VectorXd f_ref)
      : f_(std::move(f)), k_(std::move(k)), f_ref_(std::move(f_ref)) {
    const int n = static_cast<int>(f_ref_.size());
    u_.setZero(n);
    committed_.setZero(n);
    fixed_.setZero(n);
    w_.setOnes(n);
  }
  int size() const override { return static_cast<int>(f_ref_.size()); }
  const Eigen::VectorXd& reference_load() const override { return f_ref_; }
  const Eigen::VectorXd& fixed_load() const override { return fixed_; }
  const Eigen::VectorXd& arc_length_weights() const override { return w_; }
  EvaluationStatus evaluate(Eigen::VectorXd& f, bool factorise) override {
    const EvaluationStatus s = factorise ? evaluate_deferred(f) : assemble(f, false);
    return s == EvaluationStatus::Ok && factorise ? factorise_assembled() : s;
  }
  EvaluationStatus evaluate_deferred(Eigen::VectorXd& f) override { return assemble(f, true); }
  EvaluationStatus factorise_assembled() override {
    if (!assembled_) throw std::logic_error("DenseProblem::factorise_assembled without a tangent");
    assembled_ = false;
    ++factorisations;
    ldlt_.compute(tangent_);
    // Sylvester's law of inertia: P^T K P = L D L^T is a congruence, so D's signs are K's.
    negative_ = static_cast<int>((ldlt_.vectorD().array() < 0.0).count());
    return EvaluationStatus::Ok;
  }
  void solve(const Eigen::VectorXd& rhs, Eigen::VectorXd& x) override { x = ldlt_.solve(rhs); }
  int negative_pivots() const override { return negative_; }
  void update(const Eigen::VectorXd& du) override { u_ += du; }
  void commit() override { committed_ = u_; }
  void revert() override { u_ = committed_; }
  const Eigen::VectorXd& state() const { return committed_; }
  int evaluations = 0;     ///< of f_int (with or without tangent)
  int factorisations = 0;  ///< of the tangent

 private:
  EvaluationStatus assemble(Eigen::VectorXd& f, bool with_tangent) {
    ++evaluations;
    f = f_(u_);
    assembled_ = with_tangent;
    if (with_tangent) tangent_ = k_(u_);
    return f.allFinite() ? EvaluationStatus::Ok : EvaluationStatus::NotFinite;
  }
  Eigen::MatrixXd tangent_;
  bool assembled_ = false;
  Force f_;
  Jacobian k_;
  Eigen::VectorXd f_ref_, u_, committed_, fixed_, w_;
  Eigen::LDLT<Eigen::MatrixXd> ldlt_;
  int negative_ = 0;
};

}  // namespace rotcap::testing
