#pragma once
// CholmodFactor: sparse symmetric factorisation with CHOLMOD (SuiteSparse, C API, int indices)
// over a SparsePattern. The fill-reducing ordering and symbolic analysis are done ONCE, in the
// constructor; factorize() then only does numeric work on new values with the same pattern.
//
// Methods:
//   SupernodalLLT  - A = P^T L L^T P for symmetric positive-definite A (BLAS-3 supernodes).
//                    On an indefinite or singular A it stops early and reports
//                    NotPositiveDefinite (with the failing column), never aborts.
//   SimplicialLDLT - A = P^T L D L^T P without pivoting: works for indefinite A as long as no
//                    pivot is exactly zero; negative_pivots() is the number of d_jj < 0, which by
//                    Sylvester's law of inertia equals the number of negative eigenvalues of A.
//   SupernodalLDLT - the same factorisation and contract as SimplicialLDLT, computed by our
//                    SupernodalLdlt (supernodal_ldlt.hpp) on CHOLMOD's supernodal analysis, with
//                    dense BLAS-3 kernels: several times faster on shell tangents.
//
// Values are the upper triangle in the pattern's order (stype = 1). Expects one BLAS thread
// (use_one_blas_thread(), blas_threads.hpp; the rotcap program sets it at start).
// CHOLMOD's own OpenMP regions are made inactive during every call (cholmod_factor.cpp says why).
// Not thread-safe: one factor object per thread; solve() uses workspace held by the object; call it
// outside OpenMP parallel regions.

#include "solver/sparse_pattern.hpp"

#include <Eigen/Core>
#include <limits>
#include <memory>
#include <span>
#include <string>

namespace rotcap {

enum class FactorStatus {
  Ok,                   ///< factor valid; solve() may be called
  NotFactorized,        ///< no numeric factorisation yet
  NotPositiveDefinite,  ///< LL^T: a pivot <= 0 (or NaN); the matrix is not positive definite
  ZeroPivot,            ///< LDL^T: a pivot is exactly zero or NaN; the matrix is singular
  OutOfMemory,
  Failed                ///< any other CHOLMOD error (message() has CHOLMOD's status code)
};
const char* factor_status_name(FactorStatus status);

class CholmodFactor {
 public:
  enum class Method { SupernodalLLT, SimplicialLDLT, SupernodalLDLT };
  enum class Ordering {
    Automatic,        ///< CHOLMOD's default: AMD, then METIS / nested dissection if AMD fill is poor
    Amd,              ///< approximate minimum degree only
    NestedDissection  ///< CHOLMOD_NESDIS (METIS based); faster factorisations beyond ~100k DOFs
  };
  struct Options {
    Method method = Method::SupernodalLLT;
    Ordering ordering = Ordering::Automatic;
    int threads = 0;  ///< SupernodalLDLT: threads of a factorisation, at most 2 used (0: the OpenMP default)
  };

  /// Analyses the pattern (ordering + symbolic factorisation). The pattern must outlive this
  /// object. Throws std::runtime_error if CHOLMOD cannot analyse it (out of memory).
  CholmodFactor(const SparsePattern& pattern, const Options& options);
  /// The given method with the default ordering.
  CholmodFactor(const SparsePattern& pattern, Method method);
  ~CholmodFactor();
  CholmodFactor(const CholmodFactor&) = delete;
  CholmodFactor& operator=(const CholmodFactor&) = delete;

  /// Numeric factorisation of the matrix with these upper-triangle values
  /// (values.size() == pattern.nonzeros()); reuses the symbolic analysis.
  FactorStatus factorize(std::span<const double> values);

  /// x = A^{-1} b (size n each, may alias); requires status() == Ok, else throws std::logic_error.
  void solve(const double* b, double* x);
  Eigen::VectorXd solve(const Eigen::VectorXd& b);

  FactorStatus status() const { return status_; }
  /// Readable outcome of the last call, e.g. "not positive definite at column 17 of 120".
  const std::string& message() const { return message_; }
  Method method() const { return options_.method; }
  int size() const { return pattern_.size(); }

  /// Number of negative pivots of D (SimplicialLDLT) after an Ok factorisation; 0 for an Ok
  /// SupernodalLLT; -1 if the last factorisation failed.
  int negative_pivots() const { return negative_pivots_; }

  /// After an Ok factorisation: min over pivots of d_j / a_jj (d_j = l_jj^2 for LL^T, D_jj for
  /// LDL^T, a_jj the matrix diagonal of the same equation), a scale-free test of near-singularity:
  /// about eps = 2.2e-16 (or negative) when a mechanism is factored, O(1) .. 1e-8 for a
  /// well-supported structure. NaN unless the last factorisation was Ok.
  double min_pivot_ratio() const { return min_pivot_ratio_; }
  /// Equation (original numbering) of that pivot, -1 unless the last factorisation was Ok.
  int min_pivot_equation() const { return min_pivot_equation_; }

  /// Nonzeros of L predicted by the symbolic analysis (diagonal included).
  double factor_nonzeros() const { return factor_nonzeros_; }
  /// Floating-point operations of one numeric factorisation, from the symbolic analysis.
  /// Number of symbolic analyses (1 per object) and numeric factorisations done.
  int analysis_count() const { return analyses_; }
  int factorization_count() const { return factorizations_; }
  double analysis_seconds() const { return analysis_seconds_; }
  double last_factorization_seconds() const { return factorization_seconds_; }

 private:
  FactorStatus factorize_supernodal_ldlt(std::span<const double> values);
  // Sets status Ok, the inertia, the smallest pivot ratio and the message from the pivots that
  // for_each_pivot(visit) passes as visit(j, d_j) (permuted order; perm[j] the original equation).
  template <class ForEachPivot>
  void record_pivots(std::span<const double> values, const int* perm, ForEachPivot for_each_pivot);
  struct Impl;  // CHOLMOD objects (cholmod_common, factor, solve workspace); keeps cholmod.h private
  const SparsePattern& pattern_;
  Options options_;
  std::unique_ptr<Impl> impl_;
  FactorStatus status_ = FactorStatus::NotFactorized;
  std::string message_ = "not factorised yet";
  int negative_pivots_ = -1;
  double min_pivot_ratio_ = std::numeric_limits<double>::quiet_NaN();
  int min_pivot_equation_ = -1;
  double factor_nonzeros_ = 0.0;
  double factor_flops_ = 0.0;
  int analyses_ = 0;
  int factorizations_ = 0;
  double analysis_seconds_ = 0.0;
  double factorization_seconds_ = 0.0;
};

}  // namespace rotcap
