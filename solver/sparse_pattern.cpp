#include "solver/sparse_pattern.hpp"

#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>
#include <string>

namespace rotcap {

std::vector<ElementNodes> element_nodes(const ShellModel& model) {
  std::vector<ElementNodes> out;
  out.reserve(model.elements.size());
  for (const ShellElement& e : model.elements) out.push_back(e.nodes);
  return out;
}

SparsePattern::SparsePattern(const std::vector<ElementNodes>& elements, const DofMap& dofs)
    : n_(dofs.free_count()), node_count_(dofs.node_count()) {
  const int nodes = dofs.node_count();
  for (std::size_t e = 0; e < elements.size(); ++e)
    for (int v : elements[e])
      if (v < 0 || v >= nodes)
        throw std::invalid_argument("SparsePattern: element " + std::to_string(e) + " refers to node " +
                                    std::to_string(v) + "; need 0 <= node < " + std::to_string(nodes));

  // Node adjacency: two nodes couple iff they share an element. Every node is its own neighbour,
  // even one no element uses, so the diagonal is always stored (a zero there then shows up as a
  // factorisation failure instead of a malformed pattern).
  std::vector<std::vector<int>> adjacent(static_cast<std::size_t>(nodes));
  for (int v = 0; v < nodes; ++v) adjacent[v].push_back(v);
  for (const ElementNodes& en : elements)
    for (int a : en)
      for (int b : en) adjacent[a].push_back(b);
  for (auto& list : adjacent) {
    std::sort(list.begin(), list.end());
    list.erase(std::unique(list.begin(), list.end()), list.end());
  }

  // Column q of the upper triangle: every free equation p <= q of a node adjacent to q's node.
  colptr_.assign(static_cast<std::size_t>(n_) + 1, 0);
  std::vector<int> column;
  column.reserve(6 * 32);
  for (int q = 0; q < n_; ++q) {
    const int node = dofs.dof_of_equation(q) / kDofsPerNode;
    column.clear();
    for (int m : adjacent[node])
      for (int d = 0; d < kDofsPerNode; ++d) {
        const int p = dofs.equation(m, static_cast<Dof>(d));
        if (p >= 0 && p <= q) column.push_back(p);
      }
    std::sort(column.begin(), column.end());
    if (row_.size() + column.size() > static_cast<std::size_t>(std::numeric_limits<int>::max()))
      throw std::invalid_argument("SparsePattern: more than 2^31 - 1 nonzeros; the model is too large "
                                  "for the int index interface");
    row_.insert(row_.end(), column.begin(), column.end());
    colptr_[q + 1] = static_cast<int>(row_.size());
  }

  // Per-element equations and packed scatter maps.
  equations_.resize(kElementDofs * elements.size());
  map_.resize(kElementPairs * elements.size());
  for (std::size_t e = 0; e < elements.size(); ++e) {
    int* eq = equations_.data() + kElementDofs * e;
    for (int k = 0; k < 4; ++k)
      for (int d = 0; d < kDofsPerNode; ++d)
        eq[kDofsPerNode * k + d] = dofs.equation(elements[e][k], static_cast<Dof>(d));
    int* map = map_.data() + kElementPairs * e;
    for (int j = 0; j < kElementDofs; ++j)
      for (int i = 0; i <= j; ++i)
        map[pair_index(i, j)] = (eq[i] < 0 || eq[j] < 0) ? -1 : find(eq[i], eq[j]);
  }
}

int SparsePattern::find(int row, int col) const {
  if (row > col) std::swap(row, col);
  const auto first = row_.begin() + colptr_[col];
  const auto last = row_.begin() + colptr_[col + 1];
  const auto it = std::lower_bound(first, last, row);
  if (it == last || *it != row) return -1;
  return static_cast<int>(it - row_.begin());
}

void SparsePattern::multiply(std::span<const double> values, const double* x, double* y) const {
  // Symmetric product from the upper triangle: a_pq contributes to y_p (a_pq x_q) and, off the
  // diagonal, to y_q (a_pq x_p).
  std::fill(y, y + n_, 0.0);
  for (int q = 0; q < n_; ++q) {
    double yq = 0.0;
    const double xq = x[q];
    for (int k = colptr_[q]; k < colptr_[q + 1]; ++k) {
      const int p = row_[k];
      const double a = values[k];
      if (p == q) {
        yq += a * xq;
      } else {
        y[p] += a * xq;
        yq += a * x[p];
      }
    }
    y[q] += yq;
  }
}

void SparsePattern::multiply_abs(std::span<const double> values, const double* x, double* y) const {
  std::fill(y, y + n_, 0.0);
  for (int q = 0; q < n_; ++q) {
    double yq = 0.0;
    const double xq = std::abs(x[q]);
    for (int k = colptr_[q]; k < colptr_[q + 1]; ++k) {
      const int p = row_[k];
      const double a = std::abs(values[k]);
      yq += a * (p == q ? xq : std::abs(x[p]));
      if (p != q) y[p] += a * xq;
    }
    y[q] += yq;
  }
}

}  // namespace rotcap
