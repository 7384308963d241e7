#pragma once
// SparsePattern: the nonzero structure of a symmetric stiffness matrix over the free DOFs of a
// four-node shell mesh, built once per model from element connectivity.
//
// Storage: upper triangle (row <= column) in compressed sparse column form with 0-based int
// indices, row indices sorted and unique within each column, diagonal always present. This is
// the layout CHOLMOD reads for a symmetric matrix with stype = 1; the numeric values live outside
// the pattern (a std::vector<double> of size nonzeros()), so K, the geometric stiffness and
// shifted combinations share one pattern and one symbolic factorisation.
//
// Element scatter maps: an element's 24 DOFs are ordered node by node (its four nodes in the
// order given) and, per node, in Dof order (ux..rz, global axes). For each of the 300 local pairs
// (i, j) with i <= j (packed column-wise: index j (j + 1) / 2 + i) the map holds the value index of
// the global entry (min(q_i, q_j), max(q_i, q_j)), q = equation numbers, or -1 when either DOF is
// held. When an element's nodes are distinct, every stored entry receives exactly one
// contribution per element from this map; an element may also list a node twice (collapsed
// onto a master node), then pairs with q_i = q_j map to the diagonal (see Assembler).

#include "solver/dof_map.hpp"

#include <array>
#include <span>
#include <vector>

namespace rotcap {

using ElementNodes = std::array<int, 4>;

/// The node lists of a model's elements, in element order.
std::vector<ElementNodes> element_nodes(const ShellModel& model);

class SparsePattern {
 public:
  static constexpr int kElementDofs = 24;
  static constexpr int kElementPairs = kElementDofs * (kElementDofs + 1) / 2;  // 300

  /// Pattern of all element couplings between the free DOFs of dofs. Node indices must lie in
  /// [0, dofs.node_count()); throws std::invalid_argument otherwise.
  SparsePattern(const std::vector<ElementNodes>& elements, const DofMap& dofs);

  /// Matrix order n = number of free DOFs.
  int size() const { return n_; }
  /// Stored entries of the upper triangle (diagonal included); < 2^31 (int indices, as CHOLMOD's
  /// int interface).
  int nonzeros() const { return static_cast<int>(row_.size()); }
  int element_count() const { return static_cast<int>(equations_.size() / kElementDofs); }
  /// Nodes of the DofMap the pattern was built from (a full vector has 6 node_count() entries).
  int node_count() const { return node_count_; }

  /// Column starts, size n + 1; column j holds entries column_starts()[j] .. [j + 1] - 1.
  const std::vector<int>& column_starts() const { return colptr_; }
  /// Row index of each stored entry, sorted within a column, row <= column.
  const std::vector<int>& row_indices() const { return row_; }

  /// Value index of entry (row, col) of the symmetric matrix (either triangle), or -1 if the
  /// entry is structurally zero. 0 <= row, col < size().
  int find(int row, int col) const;

  /// Equations of element e's 24 DOFs (-1 for held DOFs).
  std::span<const int> element_equations(int e) const {
    return {equations_.data() + static_cast<std::size_t>(kElementDofs) * e, kElementDofs};
  }
  /// Scatter map of element e (300 packed pairs, see the file comment).
  std::span<const int> element_map(int e) const {
    return {map_.data() + static_cast<std::size_t>(kElementPairs) * e, kElementPairs};
  }
  /// Index of the local pair (i, j), i <= j, in element_map().
  static constexpr int pair_index(int i, int j) { return j * (j + 1) / 2 + i; }

  /// y = A x for the symmetric matrix A whose upper triangle is values (size nonzeros());
  /// x and y have size() entries and must not alias.
  void multiply(std::span<const double> values, const double* x, double* y) const;
  /// y = |A| |x| (entrywise absolute values): the size of the terms summed in A x, the scale of
  /// its round-off (for backward-error measures).
  void multiply_abs(std::span<const double> values, const double* x, double* y) const;

 private:
  int n_ = 0;
  int node_count_ = 0;
  std::vector<int> colptr_;
  std::vector<int> row_;
  std::vector<int> equations_;  // 24 per element
  std::vector<int> map_;        // 300 per element
};

}  // namespace rotcap
