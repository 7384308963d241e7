#pragma once
// SupernodalLdlt: numeric A = P^T L D L^T P without pivoting for a symmetric, possibly indefinite
// matrix, on the supernodal symbolic structure that CHOLMOD's analysis computes (CHOLMOD itself
// offers LDL^T only in simplicial form, which runs without BLAS-3: on a 30k-DOF plate it took 0.55 s
// against 0.083 s for this one and 0.066 s for CHOLMOD's supernodal LL^T; bench/results/linear_plate.txt).
//
// Algorithm: right-looking supernodal factorisation (the supernodal scheme of Ng & Peyton 1993,
// SIAM J. Sci. Comput. 14:1034-1056, with the LDL^T variant of the dense kernels; see e.g. Davis,
// "Direct Methods for Sparse Linear Systems", SIAM 2006, ch. 4 and 9). For each supernode k in
// order, with its dense block [L11; L21] (columns of k, rows of k's pattern):
//   L11 D1 L11^T = A11        dense LDL^T without pivoting (unit lower L11, D1 diagonal),
//   X = A21 L11^-T,  L21 = X D1^-1,
//   C = L21 X^T = L21 D1 L21^T, subtracted from the ancestors' blocks (extend-add by row maps).
// Without pivoting the factorisation exists as long as no pivot vanishes; by Sylvester's law of
// inertia the number of negative d_j is the number of negative eigenvalues of A (the same contract
// as CHOLMOD's simplicial LDL^T, whose results it reproduces: tests/solver/cholmod_factor_test.cpp).
// Used through CholmodFactor (Method::SupernodalLDLT), which reads the pivots for the inertia.
//
// Two threads (when OpenMP gives two): the supernodes are split into two groups of independent
// subtrees and the top above them (subtree_split.hpp); the groups are factorised at once, group 1
// subtracting its updates of top blocks into a buffer that is added to them after both, then the
// top in order. The arithmetic is the same with one thread or two (the groups are done one after
// the other), so the factor is bit-identical for any thread count.
//
// Storage: the block of supernode k is column-major at x[px[k]], leading dimension nsrow_k; its
// diagonal holds d_j, its strict lower part L. Values enter as the upper triangle of A in the
// pattern's column order (original numbering), the same input as CholmodFactor.
// No allocation in factorize() or solve() after construction. Not thread-safe (workspaces):
// call from outside OpenMP parallel regions.

#include <Eigen/Core>

#include <span>
#include <vector>

namespace rotcap {

class SupernodalLdlt {
 public:
  /// Supernodal symbolic factor, as CHOLMOD's cholmod_analyze returns it (int indices):
  /// super (nsuper + 1): first column of each supernode (permuted numbering); pi (nsuper + 1):
  /// starts of each supernode's row list in s; px (nsuper + 1): starts of its numeric block;
  /// s: row lists (the supernode's own columns first, ascending); perm (n): P, row j of P A P^T is
  /// row perm[j] of A.
  struct Symbolic {
    std::vector<int> super, pi, px, s, perm;
  };

  /// column_starts / row_indices: the upper triangle of A (CSC, rows ascending, diagonal last in
  /// each column, every diagonal present), n = column_starts.size() - 1.
  /// Throws std::invalid_argument if the symbolic factor does not cover the pattern.
  SupernodalLdlt(std::span<const int> column_starts, std::span<const int> row_indices, Symbolic symbolic);

  enum class Outcome { Ok, ZeroPivot };
  /// Numeric factorisation of the upper-triangle values (pattern order). On ZeroPivot (a pivot exactly
  /// zero or not finite) failed_column() names it (permuted order) and solve() must not be called.
  Outcome factorize(std::span<const double> values);
  /// x = A^-1 b (size n each; may alias). Requires the last factorize() to be Ok.
  void solve(const double* b, double* x);

  int size() const { return n_; }
  int failed_column() const { return failed_column_; }
  /// d_j, the pivot of permuted column j (0 <= j < size()), after an Ok factorize(); CholmodFactor
  /// counts the inertia and the smallest pivot ratio from them.
  double pivot(int j) const { return x_[diagonal_offset_[j]]; }
  /// P: row j of P A P^T is row permutation()[j] of A.
  const std::vector<int>& permutation() const { return sym_.perm; }
  static constexpr int kPanel = 64;  ///< panel width of the dense diagonal LDL^T
  /// Threads of factorize(): at most 2 are used; 0 (default) takes the OpenMP default.
  void set_threads(int threads) { threads_ = threads; }

 private:
  // Supernode k: columns first .. first + cols - 1, a dense column-major block of rows x cols at data
  // (its first cols rows are those columns, the m = rows - cols others are below).
  struct Block {
    int first, cols, rows, m;
    double* data;
  };
  Block block(int k) {
    const int first = sym_.super[k], cols = sym_.super[k + 1] - first, rows = sym_.pi[k + 1] - sym_.pi[k];
    return {first, cols, rows, rows - cols, x_.data() + sym_.px[k]};
  }
  struct Workspace {
    std::vector<int> row_map;        // row -> position in a target's row list
    Eigen::MatrixXd x, c;            // X (m x nscol) and C (m x m), largest sizes
    Eigen::MatrixXd panel;           // L21 D1 of a diagonal block's panel (cols x kPanel)
    Eigen::VectorXd t;
  };
  // Factorises supernode k and subtracts its update from its ancestors (top ones into top_buffer_
  // when to_buffer); false on a zero pivot (failed column in `failed`). parallel: its dense kernels
  // on the OpenMP team (the top; the same arithmetic as without).
  bool factor_supernode(int k, Workspace& w, bool to_buffer, bool parallel, int& failed);
  // L11 D1 L11^T = A11 of a block (nscol x nscol at data, leading dimension ld, lower triangle),
  // right-looking by panels of kPanel columns; false on a zero pivot (its column in `failed`).
  bool diagonal_ldlt(double* data, int nscol, int ld, Workspace& w, bool parallel, int& failed);

  int n_ = 0;
  Symbolic sym_;
  int nsuper_ = 0;
  std::vector<int> supernode_of_;   // permuted column -> its supernode
  std::vector<int> value_offset_;   // pattern entry -> its place in x_
  std::vector<int> diagonal_offset_;// permuted column -> place of d_j in x_
  std::vector<double> x_;           // numeric blocks
  Workspace work_[2];               // one per group
  std::vector<int> group_[2], top_; // supernodes of each group and of the top, ascending
  std::vector<int> owner_;          // supernode -> 0, 1 or -1 (top)
  std::vector<std::ptrdiff_t> buffer_offset_;  // top supernode -> its block in top_buffer_
  std::vector<double> top_buffer_;  // group 1's updates of the top blocks
  int threads_ = 0;
  int team_ = 1;                    // threads of the factorize() under way
  Eigen::VectorXd work_y_, work_t_; // solve workspaces
  bool factorized_ = false;
  int failed_column_ = -1;
};

}  // namespace rotcap
