#pragma once
// SupernodalLdlt: numeric A = P^T L D L^T P without pivoting for a symmetric, possibly indefinite
// matrix, on the supernodal symbolic structure that CHOLMOD's analysis computes (CHOLMOD itself
// offers LDL^T only in simplicial form, which runs without BLAS-3 and was 5.6 times slower than the
// supernodal LL^T on the demo's tangent; bench/results/demo.txt).
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
//
// Storage: the block of supernode k is column-major at x[px[k]], leading dimension nsrow_k; its
// diagonal holds d_j, its strict lower part L. Values enter as the upper triangle of A in the
// pattern's column order (original numbering), the same input as CholmodFactor.
// No allocation in factorize() or solve() after construction. Not thread-safe (workspaces).

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
  int negative_pivots() const { return negative_pivots_; }
  int failed_column() const { return failed_column_; }
  /// min over j of d_j / |a_jj| and its equation (original numbering); as CholmodFactor documents.
  double min_pivot_ratio() const { return min_pivot_ratio_; }
  int min_pivot_equation() const { return min_pivot_equation_; }

 private:
  int n_ = 0;
  Symbolic sym_;
  int nsuper_ = 0;
  std::vector<int> supernode_of_;   // permuted column -> its supernode
  std::vector<int> value_offset_;   // pattern entry -> its place in x_
  std::vector<int> diagonal_entry_; // permuted column -> pattern index of its diagonal
  std::vector<double> x_;           // numeric blocks
  std::vector<int> row_map_;        // workspace: row -> position in a target's row list
  Eigen::MatrixXd work_x_, work_c_; // workspaces: X (m x nscol) and C (m x m), largest sizes
  Eigen::VectorXd work_y_, work_t_; // solve workspaces
  int negative_pivots_ = -1;
  int failed_column_ = -1;
  double min_pivot_ratio_ = 0.0;
  int min_pivot_equation_ = -1;
};

}  // namespace rotcap
