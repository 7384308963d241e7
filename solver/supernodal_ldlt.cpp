#include "solver/supernodal_ldlt.hpp"
#include "solver/subtree_split.hpp"

#include <Eigen/Dense>
#include <omp.h>

#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>
#include <string>

namespace rotcap {

// Fortran BLAS (the library CHOLMOD uses; OpenBLAS on Debian picks AVX2 kernels at run time, which
// Eigen's own products, compiled for baseline x86-64, do not).
extern "C" {
void dtrsm_(const char* side, const char* uplo, const char* transa, const char* diag, const int* m, const int* n,
            const double* alpha, const double* a, const int* lda, double* b, const int* ldb);
void dgemm_(const char* transa, const char* transb, const int* m, const int* n, const int* k, const double* alpha,
            const double* a, const int* lda, const double* b, const int* ldb, const double* beta, double* c,
            const int* ldc);
}

namespace {
using BlockMap = Eigen::Map<Eigen::MatrixXd>;
// Columns of C computed per dgemm call: the lower triangle is covered by trapezoids of this width.
constexpr int kUpdateBlock = 64;
// Rows of L21 solved per dtrsm call (independent rows: the calls may run on several threads).
constexpr int kSolveRows = 256;
}

SupernodalLdlt::SupernodalLdlt(std::span<const int> column_starts, std::span<const int> row_indices,
                               Symbolic symbolic)
    : n_(static_cast<int>(column_starts.size()) - 1), sym_(std::move(symbolic)) {
  const auto bad = [](const std::string& what) {
    throw std::invalid_argument("SupernodalLdlt: " + what);
  };
  if (n_ < 0 || static_cast<int>(sym_.perm.size()) != n_) bad("perm has " + std::to_string(sym_.perm.size()) + " entries for n = " + std::to_string(n_));
  nsuper_ = static_cast<int>(sym_.super.size()) - 1;
  if (nsuper_ < 0 || sym_.pi.size() != sym_.super.size() || sym_.px.size() != sym_.super.size() ||
      (n_ > 0 && sym_.super.back() != n_) || static_cast<int>(sym_.s.size()) < sym_.pi.back())
    bad("inconsistent supernode arrays");
  x_.assign(static_cast<std::size_t>(sym_.px.back()), 0.0);

  std::vector<int> inverse(static_cast<std::size_t>(n_), -1);
  for (int j = 0; j < n_; ++j) {
    const int q = sym_.perm[j];
    if (q < 0 || q >= n_ || inverse[q] >= 0) bad("perm is not a permutation");
    inverse[q] = j;
  }
  supernode_of_.assign(static_cast<std::size_t>(n_), -1);
  int max_x = 0, max_c = 0, max_cols = 0;
  for (int k = 0; k < nsuper_; ++k) {
    const Block b = block(k);
    if (b.cols <= 0 || b.m < 0) bad("supernode " + std::to_string(k) + " has no columns or too few rows");
    for (int j = b.first; j < b.first + b.cols; ++j) supernode_of_[j] = k;
    max_x = std::max(max_x, b.m * b.cols);
    max_c = std::max(max_c, b.m);
    max_cols = std::max(max_cols, b.cols);
  }

  // Entry (r, q) of the upper triangle is entry (max, min) of the permuted lower triangle; find its
  // place in the block of the supernode that holds column min.
  const int nnz = column_starts[n_];
  value_offset_.assign(static_cast<std::size_t>(nnz), -1);
  std::vector<int> by_supernode_start(static_cast<std::size_t>(nsuper_) + 1, 0), entries(static_cast<std::size_t>(nnz));
  const auto place = [&](int q, int p) {
    const int a = inverse[row_indices[p]], b = inverse[q];
    return std::pair<int, int>(std::max(a, b), std::min(a, b));  // (row, column), permuted
  };
  for (int q = 0; q < n_; ++q)
    for (int p = column_starts[q]; p < column_starts[q + 1]; ++p) ++by_supernode_start[supernode_of_[place(q, p).second] + 1];
  for (int k = 0; k < nsuper_; ++k) by_supernode_start[k + 1] += by_supernode_start[k];
  std::vector<int> fill(by_supernode_start.begin(), by_supernode_start.end() - 1);
  std::vector<int> entry_column(static_cast<std::size_t>(nnz));
  for (int q = 0; q < n_; ++q)
    for (int p = column_starts[q]; p < column_starts[q + 1]; ++p) {
      entries[fill[supernode_of_[place(q, p).second]]++] = p;
      entry_column[p] = q;
    }
  std::vector<int>& row_map = work_[0].row_map;
  row_map.assign(static_cast<std::size_t>(n_), -1);
  std::vector<int> stamp(static_cast<std::size_t>(n_), -1);
  for (int k = 0; k < nsuper_; ++k) {
    const int nsrow = sym_.pi[k + 1] - sym_.pi[k];
    for (int i = 0; i < nsrow; ++i) {
      row_map[sym_.s[sym_.pi[k] + i]] = i;
      stamp[sym_.s[sym_.pi[k] + i]] = k;
    }
    for (int e = by_supernode_start[k]; e < by_supernode_start[k + 1]; ++e) {
      const int p = entries[e];
      const auto [row, col] = place(entry_column[p], p);
      if (stamp[row] != k) bad("row " + std::to_string(row) + " of column " + std::to_string(col) + " is not in the symbolic factor");
      value_offset_[p] = sym_.px[k] + (col - sym_.super[k]) * nsrow + row_map[row];
    }
  }
  for (int q = 0; q < n_; ++q) {
    const int last = column_starts[q + 1] - 1;
    if (last < column_starts[q] || row_indices[last] != q) bad("column " + std::to_string(q) + " has no diagonal entry");
  }
  diagonal_offset_.resize(static_cast<std::size_t>(n_));
  for (int k = 0; k < nsuper_; ++k) {
    const Block b = block(k);
    for (int j = 0; j < b.cols; ++j) diagonal_offset_[b.first + j] = sym_.px[k] + j * (b.rows + 1);
  }
  // Work of supernode k in multiply-adds: dense LDL^T cols^3/3, solve m cols^2/2, update m^2 cols/2.
  std::vector<int> parent(static_cast<std::size_t>(nsuper_), -1);
  std::vector<double> work(static_cast<std::size_t>(nsuper_));
  for (int k = 0; k < nsuper_; ++k) {
    const Block b = block(k);
    if (b.m > 0) parent[k] = supernode_of_[sym_.s[sym_.pi[k] + b.cols]];
    work[k] = double(b.cols) * b.cols * (b.cols / 3.0 + b.m / 2.0) + double(b.m) * b.m * b.cols / 2.0;
  }
  // CHOLMOD numbers supernodes in postorder (parent > child); should another analysis not, the
  // whole tree is the top and the factorisation runs in order on one thread.
  bool postordered = true;
  for (int k = 0; k < nsuper_; ++k) postordered = postordered && (parent[k] < 0 || parent[k] > k);
  owner_.assign(static_cast<std::size_t>(nsuper_), -1);
  if (postordered) {
    owner_ = split_subtrees(parent, work).owner;
  }
  buffer_offset_.assign(static_cast<std::size_t>(nsuper_), -1);
  std::ptrdiff_t buffer_size = 0;
  for (int k = 0; k < nsuper_; ++k) {
    if (owner_[k] >= 0) {
      group_[owner_[k]].push_back(k);
      continue;
    }
    top_.push_back(k);
    buffer_offset_[k] = buffer_size;
    buffer_size += sym_.px[k + 1] - sym_.px[k];
  }
  top_buffer_.assign(static_cast<std::size_t>(buffer_size), 0.0);
  for (Workspace& w : work_) {
    w.row_map.assign(static_cast<std::size_t>(n_), -1);
    w.x.resize(std::max(max_x, 1), 1);
    w.c.resize(std::max(max_c, 1), std::max(max_c, 1));
    w.t.resize(std::max(max_cols, 1));
    w.panel.resize(std::max(max_cols, 1), kPanel);
  }
  work_y_.resize(std::max(n_, 1));
  work_t_.resize(std::max(std::max(max_c, max_cols), 1));
}

bool SupernodalLdlt::diagonal_ldlt(double* data, int nscol, int ld, Workspace& w, bool parallel, int& failed) {
  BlockMap B(data, ld, nscol);
  auto t = w.t.head(nscol);
  const double minus_one = -1.0, one = 1.0;
  for (int p0 = 0; p0 < nscol; p0 += kPanel) {
    const int pb = std::min(kPanel, nscol - p0), p1 = p0 + pb;
    // The panel, left-looking over its own columns (the panels before are already subtracted).
    for (int j = p0; j < p1; ++j) {
      if (j > p0) {
        for (int i = p0; i < j; ++i) t[i] = B(j, i) * B(i, i);
        B.col(j).segment(j, nscol - j).noalias() -= B.block(j, p0, nscol - j, j - p0) * t.segment(p0, j - p0);
      }
      const double d = B(j, j);
      if (d == 0.0 || !std::isfinite(d)) {
        failed = j;
        return false;
      }
      B.col(j).segment(j + 1, nscol - j - 1) /= d;
    }
    // Trailing lower triangle -= L21 (D1 L21^T), by column blocks of kUpdateBlock.
    const int nr = nscol - p1;
    if (nr == 0) break;
    BlockMap W(w.panel.data(), nr, pb);
    for (int j = 0; j < pb; ++j) W.col(j) = B.col(p0 + j).segment(p1, nr) * B(p0 + j, p0 + j);
    const double* l21 = data + p1 + static_cast<std::ptrdiff_t>(p0) * ld;
#pragma omp parallel for if (parallel) num_threads(team_) schedule(dynamic, 1)
    for (int j0 = 0; j0 < nr; j0 += kUpdateBlock) {
      const int jb = std::min(kUpdateBlock, nr - j0), rows = nr - j0;
      dgemm_("N", "T", &rows, &jb, &pb, &minus_one, l21 + j0, &ld, W.data() + j0, &nr, &one,
             data + (p1 + j0) + static_cast<std::ptrdiff_t>(p1 + j0) * ld, &ld);
    }
  }
  return true;
}

bool SupernodalLdlt::factor_supernode(int k, Workspace& w, bool to_buffer, bool parallel, int& failed) {
  const int* s = sym_.s.data();
  std::vector<int>& row_map = w.row_map;
  const Block blk = block(k);
  const int nscol = blk.cols, nsrow = blk.rows, m = blk.m;
  BlockMap B(blk.data, nsrow, nscol);
  if (!diagonal_ldlt(blk.data, nscol, nsrow, w, parallel, failed)) {
    failed += blk.first;
    return false;
  }
  if (m == 0) return true;
  // X = A21 L11^-T (kept in w.x), L21 = X D1^-1, C = L21 X^T.
  double* l21 = B.data() + nscol;  // leading dimension nsrow
  const double one = 1.0, zero = 0.0;
#pragma omp parallel for if (parallel) num_threads(team_) schedule(static, 1)
  for (int r0 = 0; r0 < m; r0 += kSolveRows) {
    const int rows = std::min(kSolveRows, m - r0);
    dtrsm_("R", "L", "T", "U", &rows, &nscol, &one, B.data(), &nsrow, l21 + r0, &nsrow);
  }
  BlockMap X(w.x.data(), m, nscol);
  X = B.bottomRows(m);
  for (int j = 0; j < nscol; ++j) B.col(j).tail(m) /= B(j, j);
  // Lower triangle of C = L21 X^T (m x m, leading dimension m), by column blocks.
  double* c_data = w.c.data();
#pragma omp parallel for if (parallel) num_threads(team_) schedule(dynamic, 1)
  for (int j0 = 0; j0 < m; j0 += kUpdateBlock) {
    const int jb = std::min(kUpdateBlock, m - j0), rows = m - j0;
    dgemm_("N", "T", &rows, &jb, &nscol, &one, l21 + j0, &nsrow, X.data() + j0, &m, &zero,
           c_data + j0 + static_cast<std::ptrdiff_t>(j0) * m, &m);
  }
  const BlockMap C(c_data, m, m);
  // Extend-add: subtract C from the blocks of the ancestors holding its columns.
  const int* rows = s + sym_.pi[k] + nscol;
  for (int a = 0; a < m;) {
    const int target_k = supernode_of_[rows[a]];
    Block target = block(target_k);
    if (to_buffer && owner_[target_k] < 0) target.data = top_buffer_.data() + buffer_offset_[target_k];
    const int* target_rows = s + sym_.pi[target_k];
    for (int i = 0; i < target.rows; ++i) row_map[target_rows[i]] = i;
    int a_end = a;
    while (a_end < m && rows[a_end] < target.first + target.cols) ++a_end;
    for (int c = a; c < a_end; ++c) {
      double* column = target.data + static_cast<std::ptrdiff_t>(rows[c] - target.first) * target.rows;
      for (int b = c; b < m; ++b) column[row_map[rows[b]]] -= C(b, c);
    }
    a = a_end;
  }
  return true;
}

SupernodalLdlt::Outcome SupernodalLdlt::factorize(std::span<const double> values) {
  if (values.size() != value_offset_.size())
    throw std::invalid_argument("SupernodalLdlt::factorize: " + std::to_string(values.size()) + " values; the pattern has " +
                                std::to_string(value_offset_.size()));
  std::fill(x_.begin(), x_.end(), 0.0);
  for (std::size_t p = 0; p < values.size(); ++p) x_[value_offset_[p]] += values[p];
  factorized_ = false;
  failed_column_ = -1;
  std::fill(top_buffer_.begin(), top_buffer_.end(), 0.0);
  int failed[2] = {-1, -1};
  // The two groups at once (one thread: one after the other, the same arithmetic).
  team_ = std::max(1, std::min(2, threads_ > 0 ? threads_ : omp_get_max_threads()));
#pragma omp parallel for num_threads(team_) schedule(static, 1)
  for (int g = 0; g < 2; ++g)
    for (int k : group_[g])
      if (!factor_supernode(k, work_[g], g == 1, false, failed[g])) break;
  if (failed[0] >= 0 || failed[1] >= 0) {
    failed_column_ = failed[0] < 0 ? failed[1] : (failed[1] < 0 ? failed[0] : std::min(failed[0], failed[1]));
    return Outcome::ZeroPivot;
  }
  for (int k : top_) {
    double* block_data = x_.data() + sym_.px[k];
    const double* buffer = top_buffer_.data() + buffer_offset_[k];
    for (std::ptrdiff_t i = 0, size = sym_.px[k + 1] - sym_.px[k]; i < size; ++i) block_data[i] += buffer[i];
  }
  for (int k : top_)
    if (!factor_supernode(k, work_[0], false, true, failed_column_)) return Outcome::ZeroPivot;
  factorized_ = true;
  return Outcome::Ok;
}

void SupernodalLdlt::solve(const double* b, double* x) {
  if (!factorized_) throw std::logic_error("SupernodalLdlt::solve without an Ok factorisation");
  auto y = work_y_.head(n_);
  for (int j = 0; j < n_; ++j) y[j] = b[sym_.perm[j]];
  const int* s = sym_.s.data();
  // L z = y (forward), then D w = z, then L^T v = w (backward), supernode by supernode.
  for (int k = 0; k < nsuper_; ++k) {
    const Block blk = block(k);
    const BlockMap B(blk.data, blk.rows, blk.cols);
    auto yk = y.segment(blk.first, blk.cols);
    B.topRows(blk.cols).triangularView<Eigen::UnitLower>().solveInPlace(yk);
    if (blk.m == 0) continue;
    auto t = work_t_.head(blk.m);
    t.noalias() = B.bottomRows(blk.m) * yk;
    const int* rows = s + sym_.pi[k] + blk.cols;
    for (int a = 0; a < blk.m; ++a) y[rows[a]] -= t[a];
  }
  for (int j = 0; j < n_; ++j) y[j] /= pivot(j);
  for (int k = nsuper_ - 1; k >= 0; --k) {
    const Block blk = block(k);
    const BlockMap B(blk.data, blk.rows, blk.cols);
    auto yk = y.segment(blk.first, blk.cols);
    if (blk.m > 0) {
      auto t = work_t_.head(blk.m);
      const int* rows = s + sym_.pi[k] + blk.cols;
      for (int a = 0; a < blk.m; ++a) t[a] = y[rows[a]];
      yk.noalias() -= B.bottomRows(blk.m).transpose() * t;
    }
    B.topRows(blk.cols).triangularView<Eigen::UnitLower>().transpose().solveInPlace(yk);
  }
  for (int j = 0; j < n_; ++j) x[sym_.perm[j]] = y[j];
}

}  // namespace rotcap
