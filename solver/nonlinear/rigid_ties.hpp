#pragma once
// RigidTieSet: the model's rigid sections (ShellModel::rigid_ties) imposed by elimination. A tied
// ("slave") node keeps no DOFs of its own; it follows its reference ("master") node exactly,
//   x_s = x_m + R_m R_m0^T (X_s - X_m)  (R_m0 = I: the reference starts unrotated),   R_s = R_m,
// so the coupling holds at any rotation. Variations (spatial spins, as in the element):
//   du_s = du_m - skew(r) dw_m,  dw_s = dw_m,  r = x_s - x_m,
// so an element's global force and tangent map to the master's DOFs with T_s = [I, -skew(r); 0, I]:
//   f_m = T^T f,  K_m = T^T K T + K_r,  K_r = sym(r f_s^T) - (f_s . r) I  on the master's spins
// (the second variation of x_s; f_s the element's force on the slave's translations).
// Elements with a tied node are assembled here, serially, because several of their nodes may map
// onto one master (the pattern's pair scatter assumes distinct nodes).

#include "elements/shell_q4.hpp"
#include "model/shell_model.hpp"
#include "solver/dof_map.hpp"
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
  int master_of(int node) const { return master_[node]; }
  /// Held DOFs of the model: supports plus every DOF of a tied node (size 6 nodes).
  std::vector<bool> held_dofs(const ShellModel& model) const;
  /// Element node lists with tied nodes replaced by their masters (for the sparsity pattern).
  std::vector<ElementNodes> effective_nodes(const ShellModel& model) const;
  /// Elements with at least one tied node, ascending.
  const std::vector<int>& tied_elements() const { return tied_elements_; }
  bool is_tied_element(int e) const { return tied_flag_[e] != 0; }

  /// Moves every tied node onto its master's rigid motion (u: translations, R: rotations).
  void place_slaves(const std::vector<Eigen::Vector3d>& X, std::vector<Eigen::Vector3d>& u,
                    std::vector<Eigen::Matrix3d>& R) const;

  /// Adds the element's global K (symmetric part) and f, taken at the current coordinates x of its
  /// four nodes, mapped to the masters' DOFs, into the pattern values (may be null) and the full
  /// force vector.
  /// X, u: initial coordinates and current translations of all nodes (for the masters' positions).
  void add_element(const ElementNodes& nodes, const Eigen::Matrix<double, 3, 4>& x, const Mat24* K,
                   const Vec24& f, const std::vector<Eigen::Vector3d>& X,
                   const std::vector<Eigen::Vector3d>& u, const DofMap& dofs,
                   const SparsePattern& pattern, std::vector<double>* values,
                   Eigen::VectorXd& f_full) const;

 private:
  std::vector<int> master_;
  std::vector<int> tied_elements_;
  std::vector<char> tied_flag_;
  int slaves_ = 0;
};

}  // namespace rotcap
