#pragma once
// DofMap: numbering of the model's degrees of freedom into equations.
//
// Every node carries kDofsPerNode = 6 global DOFs in the order of Dof (ux, uy, uz, rx, ry, rz);
// the "full" vector of a model has size 6 n (n nodes), entry 6 node + dof. A DOF is either
//   - free: it owns an equation number in [0, free_count()), or
//   - held: its value is prescribed (zero for a Support); equation(node, dof) returns -1.
// Equations are numbered node by node, in node order and then in Dof order, skipping held DOFs,
// so a node's free equations are contiguous and increasing (the fill-reducing ordering is left
// to the factorisation; this numbering only has to be deterministic).
//
// Extension points (kept out of the numbering itself): prescribed non-zero values live in a
// separate full-size vector (prescribed()), so scatter() writes them into the held entries;
// master-slave ties would add a DofKind and a constraint table without changing this API.
//
// Units: whatever the vectors carry (mm and rad for displacements, N and N mm for forces).

#include "model/shell_model.hpp"

#include <Eigen/Core>
#include <vector>

namespace rotcap {

class DofMap {
 public:
  /// Numbers the DOFs of model, holding every DOF named by a Support (all nodes of its group).
  /// Throws std::invalid_argument if a support names a missing group.
  explicit DofMap(const ShellModel& model);
  /// Numbers node_count nodes with the DOFs marked in held (size 6 node_count, true = held).
  DofMap(int node_count, const std::vector<bool>& held);

  int node_count() const { return node_count_; }
  /// Size of a full vector: 6 node_count().
  int dof_count() const { return static_cast<int>(equation_.size()); }
  /// Number of free DOFs (equations), 0 <= free_count() <= dof_count().
  int free_count() const { return free_count_; }

  /// Equation of (node, dof) or -1 if held; 0 <= node < node_count().
  int equation(int node, Dof dof) const { return equation_[kDofsPerNode * node + static_cast<int>(dof)]; }
  /// Equation of full-vector entry i (0 <= i < dof_count()) or -1 if held.
  int equation(int i) const { return equation_[i]; }
  bool is_held(int i) const { return equation_[i] < 0; }
  /// Full-vector index of equation q, 0 <= q < free_count().
  int dof_of_equation(int q) const { return dof_of_equation_[q]; }

  /// Prescribed values of the held DOFs (full size, zero at free DOFs); zero for supports.
  const Eigen::VectorXd& prescribed() const { return prescribed_; }
  /// Sets the prescribed value of a held DOF; throws std::invalid_argument if i is free.
  void set_prescribed(int i, double value);

  /// Full vector from a free vector: free entries from x, held entries from prescribed().
  Eigen::VectorXd scatter(const Eigen::VectorXd& x_free) const;
  /// Free vector from a full vector (entries of the free DOFs, in equation order).
  Eigen::VectorXd gather(const Eigen::VectorXd& x_full) const;
  /// Full vector from a free vector with zeros in the held entries (for increments, modes).
  Eigen::VectorXd scatter_homogeneous(const Eigen::VectorXd& x_free) const;

 private:
  void number(const std::vector<bool>& held);

  int node_count_ = 0;
  int free_count_ = 0;
  std::vector<int> equation_;           // full index -> equation or -1
  std::vector<int> dof_of_equation_;    // equation -> full index
  Eigen::VectorXd prescribed_;
};

/// The weights of a DOF combination over the free DOFs (weight / divisor per equation; held DOFs
/// dropped and counted in *held when given): the constraint vector of displacement control.
Eigen::VectorXd free_dof_weights(const DofCombination& combination, const DofMap& dofs, int* held = nullptr);

}  // namespace rotcap
