#pragma once
// RigidTieSet: the model's rigid sections (ShellModel::rigid_ties) imposed by elimination. A tied
// ("slave") node keeps no DOFs of its own; it follows its reference ("master") node exactly,
//   x_s = x_m + R_m R_m0^T (X_s - X_m)  (R_m0 = I: the reference starts unrotated),   R_s = R_m,
// so the coupling holds at any rotation. Variations (spatial spins, as in the element):
//   du_s = du_m - skew(r) dw_m,  dw_s = dw_m,  r = x_s - x_m,
// so an element's global force and tangent map to the master's DOFs with T_s = [I, -skew(r); 0, I]:
//   f_m = T^T f,  K_m = T^T K T + K_r,  K_r = sym(r f_s^T) - (f_s . r) I  on the master's spins
// (the second variation of x_s; f_s the element's force on the slave's translations).
// The transformed element is assembled on its effective node list (tied nodes replaced by their
// masters); the Assembler sums repeated nodes correctly. Linear analyses use the same transform
// at the initial geometry (r = X_s - X_m; K_r vanishes with the force at the unloaded state).

#include "elements/shell_q4.hpp"
#include "model/shell_model.hpp"
#include "solver/sparse_pattern.hpp"

#include <Eigen/Core>
#include <vector>

namespace rotcap {

class RigidTieSet {
 public:
  /// Reads model.rigid_ties; throws std::invalid_argument if a node is tied twice or a tied node
  /// also carries a Support or a load.
  explicit RigidTieSet(const ShellModel& model);

  bool empty() const { return tied_elements_.empty() && slaves_ == 0; }
  bool is_slave(int node) const { return master_[node] != node; }
  /// Held DOFs of the model: supports plus every DOF of a tied node (size 6 nodes).
  std::vector<bool> held_dofs(const ShellModel& model) const;
  /// Element node lists with tied nodes replaced by their masters (for the sparsity pattern).
  std::vector<ElementNodes> effective_nodes(const ShellModel& model) const;
  /// Elements with at least one tied node, ascending.
  const std::vector<int>& tied_elements() const { return tied_elements_; }

  /// Moves every tied node onto its master's rigid motion (u: translations, R: rotations).
  void place_slaves(const std::vector<Eigen::Vector3d>& X, std::vector<Eigen::Vector3d>& u,
                    std::vector<Eigen::Matrix3d>& R) const;
  /// Linearised: fills the tied nodes' entries of a full small-displacement vector from their
  /// masters, u_s = u_m + theta_m x (X_s - X_m), theta_s = theta_m.
  void complete_linear(const std::vector<Eigen::Vector3d>& X, Eigen::VectorXd& u_full) const;

  /// Maps element e's global force f and (if K) tangent, taken at the current coordinates x of
  /// its nodes (its original node list), onto the DOFs of its effective nodes; x_of(node) gives a
  /// node's current coordinates (for the masters). A no-op for an element without tied nodes.
  template <class Position>
  void to_masters(int e, const std::array<int, 4>& nodes, const Eigen::Matrix<double, 3, 4>& x,
                  const Position& x_of, Mat24* K, Vec24& f) const {
    if (!tied_flag_[e]) return;
    std::array<Eigen::Vector3d, 4> r;
    for (int a = 0; a < 4; ++a)
      r[a] = is_slave(nodes[a]) ? Eigen::Vector3d(x.col(a) - x_of(master_[nodes[a]])) : Eigen::Vector3d::Zero();
    transform(nodes, r, K, f);
  }

 private:
  void transform(const std::array<int, 4>& nodes, const std::array<Eigen::Vector3d, 4>& r, Mat24* K,
                 Vec24& f) const;

  std::vector<int> master_;
  std::vector<int> tied_elements_;
  std::vector<char> tied_flag_;
  int slaves_ = 0;
};

}  // namespace rotcap
