#include "solver/cholmod_factor.hpp"

#include "solver/supernodal_ldlt.hpp"

#include <cholmod.h>
#include <omp.h>
#include <spdlog/spdlog.h>

#include <chrono>
#include <cmath>
#include <cstring>
#include <stdexcept>

namespace rotcap {

const char* factor_status_name(FactorStatus status) {
  switch (status) {
    case FactorStatus::Ok: return "Ok";
    case FactorStatus::NotFactorized: return "NotFactorized";
    case FactorStatus::NotPositiveDefinite: return "NotPositiveDefinite";
    case FactorStatus::ZeroPivot: return "ZeroPivot";
    case FactorStatus::OutOfMemory: return "OutOfMemory";
    case FactorStatus::Failed: return "Failed";
  }
  return "Unknown";
}

namespace {

// CHOLMOD 3.0 (SuiteSparse 5.12, Debian 12) opens an OpenMP region with a compiled-in team of four
// threads for every large supernode of a numeric factorisation, whatever the machine. On 2 cores
// that oversubscribes the CPUs and the thread wake-ups cost more than the arithmetic they share:
// the 8 x 10 demo took 28.0 s with them and 19.3 s without, and a second thread inside CHOLMOD
// gained nothing on 35k DOFs (measured 2026-12-02, issue 5's closing note). The dense supernode work is BLAS's, so every
// CHOLMOD call runs with OpenMP regions made inactive (max-active-levels 0: a region gets one
// thread) and the previous setting is restored afterwards. Not for use inside a parallel region.
class SerialOpenMpScope {
 public:
  SerialOpenMpScope() : saved_(omp_get_max_active_levels()) { omp_set_max_active_levels(0); }
  ~SerialOpenMpScope() { omp_set_max_active_levels(saved_); }
  SerialOpenMpScope(const SerialOpenMpScope&) = delete;
  SerialOpenMpScope& operator=(const SerialOpenMpScope&) = delete;

 private:
  int saved_;
};

// Inertia and the smallest scale-free pivot of a factorisation: for_each_pivot(visit) calls
// visit(j, d_j) for every pivot (permuted order j, d_j = l_jj^2 for LL^T); perm maps j to the
// original equation (nullptr: identity); a_jj is the last stored entry of column perm[j].
struct PivotSummary {
  int negative = 0;
  double min_ratio = std::numeric_limits<double>::infinity();
  int min_equation = -1;
};

template <class ForEachPivot>
PivotSummary summarise_pivots(const SparsePattern& pattern, std::span<const double> values, const int* perm,
                              ForEachPivot for_each_pivot) {
  PivotSummary out;
  for_each_pivot([&](int j, double d) {
    out.negative += d < 0.0 ? 1 : 0;
    const int q = perm ? perm[j] : j;
    const double a = values[pattern.column_starts()[q + 1] - 1];
    if (a == 0.0) return;  // no scale for this pivot (possible in an indefinite matrix)
    if (d / std::abs(a) < out.min_ratio) {
      out.min_ratio = d / std::abs(a);
      out.min_equation = q;
    }
  });
  return out;
}

}  // namespace

struct CholmodFactor::Impl {
  cholmod_common common;
  cholmod_factor* factor = nullptr;
  cholmod_dense* x = nullptr;  // cholmod_solve2 workspace, reused across solves
  cholmod_dense* y = nullptr;
  cholmod_dense* e = nullptr;
  std::unique_ptr<SupernodalLdlt> ldlt;  // Method::SupernodalLDLT: our numeric factor on CHOLMOD's symbolic one

  Impl() { cholmod_start(&common); }
  ~Impl() {
    cholmod_free_dense(&x, &common);
    cholmod_free_dense(&y, &common);
    cholmod_free_dense(&e, &common);
    cholmod_free_factor(&factor, &common);
    cholmod_finish(&common);
  }

  // A header over the pattern's arrays (no copy); CHOLMOD only reads it.
  static cholmod_sparse view(const SparsePattern& p, const double* values) {
    cholmod_sparse a;
    std::memset(&a, 0, sizeof a);
    a.nrow = a.ncol = static_cast<size_t>(p.size());
    a.nzmax = static_cast<size_t>(p.nonzeros());
    a.p = const_cast<int*>(p.column_starts().data());
    a.i = const_cast<int*>(p.row_indices().data());
    a.x = const_cast<double*>(values);
    a.stype = 1;  // symmetric, upper triangle stored
    a.itype = CHOLMOD_INT;
    a.xtype = values ? CHOLMOD_REAL : CHOLMOD_PATTERN;
    a.dtype = CHOLMOD_DOUBLE;
    a.sorted = 1;
    a.packed = 1;
    return a;
  }
};

CholmodFactor::CholmodFactor(const SparsePattern& pattern, const Options& options)
    : pattern_(pattern), options_(options), impl_(std::make_unique<Impl>()) {
  cholmod_common& c = impl_->common;
  c.print = 0;  // outcomes are reported through status(), not printed
  c.supernodal = options.method == Method::SimplicialLDLT ? CHOLMOD_SIMPLICIAL : CHOLMOD_SUPERNODAL;
  c.final_ll = 0;  // simplicial: keep LDL^T (its D gives the inertia)
  // An LL^T attempt on an indefinite matrix is only a definiteness test: stop at the first bad
  // supernode instead of finishing the factorisation.
  c.quick_return_if_not_posdef = 1;
  if (options.ordering == Ordering::Amd) {
    c.nmethods = 1;
    c.method[0].ordering = CHOLMOD_AMD;
  } else if (options.ordering == Ordering::NestedDissection) {
    c.nmethods = 1;
    c.method[0].ordering = CHOLMOD_NESDIS;
  }

  const auto start = std::chrono::steady_clock::now();
  cholmod_sparse a = Impl::view(pattern, nullptr);
  {
    const SerialOpenMpScope serial;
    impl_->factor = cholmod_analyze(&a, &c);
  }
  analysis_seconds_ = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
  if (!impl_->factor)
    throw std::runtime_error("CholmodFactor: symbolic analysis failed (CHOLMOD status " +
                             std::to_string(c.status) + ") for n = " + std::to_string(pattern.size()));
  ++analyses_;
  if (options.method == Method::SupernodalLDLT) {
    const cholmod_factor* l = impl_->factor;
    if (!l->is_super) throw std::runtime_error("CholmodFactor: CHOLMOD returned a simplicial analysis for SupernodalLDLT");
    const auto copy = [](const void* p, std::size_t count) {
      const int* v = static_cast<const int*>(p);
      return std::vector<int>(v, v + count);
    };
    const std::size_t ns = l->nsuper;
    SupernodalLdlt::Symbolic sym{copy(l->super, ns + 1), copy(l->pi, ns + 1), copy(l->px, ns + 1), {}, copy(l->Perm, l->n)};
    sym.s = copy(l->s, static_cast<std::size_t>(sym.pi.back()));
    impl_->ldlt = std::make_unique<SupernodalLdlt>(pattern.column_starts(), pattern.row_indices(), std::move(sym));
    impl_->ldlt->set_threads(options.threads);
  }
  factor_nonzeros_ = c.lnz;
  factor_flops_ = c.fl;
  spdlog::debug("CholmodFactor: analysed n = {}, nnz(A upper) = {}, nnz(L) = {:.4g}, flops = {:.4g}, {:.3f} s",
                pattern.size(), pattern.nonzeros(), factor_nonzeros_, factor_flops_, analysis_seconds_);
}

CholmodFactor::CholmodFactor(const SparsePattern& pattern, Method method)
    : CholmodFactor(pattern, Options{method, Ordering::Automatic}) {}

template <class ForEachPivot>
void CholmodFactor::record_pivots(std::span<const double> values, const int* perm, ForEachPivot for_each_pivot) {
  const PivotSummary p = summarise_pivots(pattern_, values, perm, for_each_pivot);
  status_ = FactorStatus::Ok;
  negative_pivots_ = p.negative;
  min_pivot_ratio_ = p.min_ratio;
  min_pivot_equation_ = p.min_equation;
  message_ = fmt::format("factorised n = {}, negative pivots {}, min pivot ratio {:.3g} at equation {}",
                         pattern_.size(), negative_pivots_, min_pivot_ratio_, min_pivot_equation_);
}

CholmodFactor::~CholmodFactor() = default;

FactorStatus CholmodFactor::factorize(std::span<const double> values) {
  if (values.size() != static_cast<std::size_t>(pattern_.nonzeros()))
    throw std::invalid_argument("CholmodFactor::factorize: " + std::to_string(values.size()) +
                                " values; the pattern has " + std::to_string(pattern_.nonzeros()));
  if (impl_->ldlt) return factorize_supernodal_ldlt(values);
  cholmod_common& c = impl_->common;
  const auto start = std::chrono::steady_clock::now();
  cholmod_sparse a = Impl::view(pattern_, values.data());
  {
    const SerialOpenMpScope serial;
    cholmod_factorize(&a, impl_->factor, &c);
  }
  factorization_seconds_ = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
  ++factorizations_;

  const cholmod_factor* l = impl_->factor;
  const int n = pattern_.size();
  negative_pivots_ = -1;
  min_pivot_ratio_ = std::numeric_limits<double>::quiet_NaN();
  min_pivot_equation_ = -1;
  if (c.status == CHOLMOD_OUT_OF_MEMORY) {
    status_ = FactorStatus::OutOfMemory;
    message_ = "out of memory in the numeric factorisation (n = " + std::to_string(n) + ")";
  } else if (c.status < CHOLMOD_OK) {
    status_ = FactorStatus::Failed;
    message_ = "CHOLMOD error status " + std::to_string(c.status);
  } else if (c.status == CHOLMOD_NOT_POSDEF || static_cast<int>(l->minor) < n) {
    // LL^T: a non-positive pivot; LDL^T (no pivoting): an exactly zero or NaN pivot.
    const bool ll = options_.method == Method::SupernodalLLT;
    status_ = ll ? FactorStatus::NotPositiveDefinite : FactorStatus::ZeroPivot;
    message_ = std::string(ll ? "not positive definite" : "zero pivot") + " at column " +
               std::to_string(l->minor) + " of " + std::to_string(n) + " (permuted order)";
  } else {
    // Pivots d_j in the permuted order, from CHOLMOD's factor layout.
    const double* lx = static_cast<const double*>(l->x);
    record_pivots(values, static_cast<const int*>(l->Perm), [&](auto&& visit) {
      if (l->is_super) {
        // Supernode s holds columns super[s] .. super[s+1]-1 as a dense column-major block of
        // pi[s+1] - pi[s] rows starting at px[s]; l_jj is on the block's diagonal.
        const int* super = static_cast<const int*>(l->super);
        const int* pi = static_cast<const int*>(l->pi);
        const int* px = static_cast<const int*>(l->px);
        for (std::size_t s = 0; s < l->nsuper; ++s) {
          const int rows = pi[s + 1] - pi[s];
          for (int j = super[s]; j < super[s + 1]; ++j) {
            const double ljj = lx[px[s] + (j - super[s]) * (rows + 1)];
            visit(j, ljj * ljj);
          }
        }
      } else {
        // Simplicial LDL^T: d_jj is the first stored entry of column j of L.
        const int* lp = static_cast<const int*>(l->p);
        for (int j = 0; j < n; ++j) visit(j, lx[lp[j]]);
      }
    });
  }
  spdlog::debug("CholmodFactor: {} ({:.3f} s)", message_, factorization_seconds_);
  return status_;
}

FactorStatus CholmodFactor::factorize_supernodal_ldlt(std::span<const double> values) {
  const auto start = std::chrono::steady_clock::now();
  SupernodalLdlt& f = *impl_->ldlt;
  const SupernodalLdlt::Outcome outcome = f.factorize(values);
  factorization_seconds_ = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
  ++factorizations_;
  negative_pivots_ = -1;
  min_pivot_ratio_ = std::numeric_limits<double>::quiet_NaN();
  min_pivot_equation_ = -1;
  if (outcome != SupernodalLdlt::Outcome::Ok) {
    status_ = FactorStatus::ZeroPivot;
    message_ = "zero pivot at column " + std::to_string(f.failed_column()) + " of " + std::to_string(f.size()) +
               " (permuted order)";
  } else {
    record_pivots(values, f.permutation().data(), [&](auto&& visit) {
      for (int j = 0; j < f.size(); ++j) visit(j, f.pivot(j));
    });
  }
  spdlog::debug("CholmodFactor: {} ({:.3f} s)", message_, factorization_seconds_);
  return status_;
}

void CholmodFactor::solve(const double* b, double* x) {
  if (status_ != FactorStatus::Ok)
    throw std::logic_error(std::string("CholmodFactor::solve: factor status is ") +
                           factor_status_name(status_) + "; need Ok");
  if (impl_->ldlt) {
    impl_->ldlt->solve(b, x);
    return;
  }
  cholmod_common& c = impl_->common;
  const int n = pattern_.size();
  cholmod_dense rhs;
  std::memset(&rhs, 0, sizeof rhs);
  rhs.nrow = static_cast<size_t>(n);
  rhs.ncol = 1;
  rhs.nzmax = rhs.d = static_cast<size_t>(n);
  rhs.x = const_cast<double*>(b);
  rhs.xtype = CHOLMOD_REAL;
  rhs.dtype = CHOLMOD_DOUBLE;
  const SerialOpenMpScope serial;
  if (!cholmod_solve2(CHOLMOD_A, impl_->factor, &rhs, nullptr, &impl_->x, nullptr, &impl_->y, &impl_->e, &c))
    throw std::runtime_error("CholmodFactor::solve: CHOLMOD status " + std::to_string(c.status));
  std::memcpy(x, impl_->x->x, sizeof(double) * static_cast<std::size_t>(n));
}

Eigen::VectorXd CholmodFactor::solve(const Eigen::VectorXd& b) {
  if (b.size() != pattern_.size())
    throw std::invalid_argument("CholmodFactor::solve: b has " + std::to_string(b.size()) +
                                " entries; need " + std::to_string(pattern_.size()));
  Eigen::VectorXd x(b.size());
  solve(b.data(), x.data());
  return x;
}

}  // namespace rotcap
