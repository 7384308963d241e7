#include "solver/linear_buckling.hpp"

#include <Spectra/SymGEigsSolver.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <stdexcept>

namespace rotcap {

const char* buckling_status_name(BucklingStatus status) {
  switch (status) {
    case BucklingStatus::Ok: return "Ok";
    case BucklingStatus::PrebucklingFailed: return "PrebucklingFailed";
    case BucklingStatus::NotConverged: return "NotConverged";
    case BucklingStatus::NoPositiveModes: return "NoPositiveModes";
    case BucklingStatus::SturmMismatch: return "SturmMismatch";
    case BucklingStatus::SturmFactorFailed: return "SturmFactorFailed";
    case BucklingStatus::EigenSolverFailed: return "EigenSolverFailed";
  }
  return "Unknown";
}

void BucklingOptions::validate(int n_modes) const {
  if (n_modes < 1) throw std::invalid_argument("buckling: n_modes = " + std::to_string(n_modes) + "; need n_modes >= 1");
  if (basis_size != 0 && basis_size <= n_modes)
    throw std::invalid_argument("BucklingOptions::basis_size = " + std::to_string(basis_size) +
                                "; need 0 (automatic) or basis_size > n_modes = " + std::to_string(n_modes));
  if (max_iterations < 1)
    throw std::invalid_argument("BucklingOptions::max_iterations = " + std::to_string(max_iterations) + "; need >= 1");
  if (!(tolerance > 0.0))
    throw std::invalid_argument("BucklingOptions::tolerance = " + std::to_string(tolerance) + "; need > 0");
  if (!(sturm_shift_ratio > 1.0))
    throw std::invalid_argument("BucklingOptions::sturm_shift_ratio = " + std::to_string(sturm_shift_ratio) +
                                "; need > 1");
}

namespace {

double seconds_since(std::chrono::steady_clock::time_point start) {
  return std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
}

// Spectra operator for A = -Kg: y = -Kg x from the upper-triangle values on the shared pattern.
class NegatedSymmetricProduct {
 public:
  using Scalar = double;
  NegatedSymmetricProduct(const SparsePattern& pattern, const std::vector<double>& values)
      : pattern_(pattern), values_(values) {}
  Eigen::Index rows() const { return pattern_.size(); }
  Eigen::Index cols() const { return pattern_.size(); }
  void perform_op(const double* x, double* y) const {
    pattern_.multiply(values_, x, y);
    for (int i = 0; i < pattern_.size(); ++i) y[i] = -y[i];
  }

 private:
  const SparsePattern& pattern_;
  const std::vector<double>& values_;
};

// Spectra operator for B = K in RegularInverse mode: y = K x and y = K^{-1} x (CHOLMOD LL^T).
class StiffnessOperator {
 public:
  using Scalar = double;
  StiffnessOperator(const SparsePattern& pattern, const std::vector<double>& values, CholmodFactor& factor)
      : pattern_(pattern), values_(values), factor_(factor) {}
  Eigen::Index rows() const { return pattern_.size(); }
  Eigen::Index cols() const { return pattern_.size(); }
  void perform_op(const double* x, double* y) const { pattern_.multiply(values_, x, y); }
  void solve(const double* x, double* y) const { factor_.solve(x, y); }

 private:
  const SparsePattern& pattern_;
  const std::vector<double>& values_;
  CholmodFactor& factor_;
};

// Scale a full mode so its largest nodal translation has length 1 and its largest-magnitude
// translation component is positive (a sign convention, so repeated runs give the same mode).
void normalise_mode(Eigen::VectorXd& mode) {
  const int nodes = static_cast<int>(mode.size()) / kDofsPerNode;
  double largest = 0.0;
  int at = 0;
  for (int n = 0; n < nodes; ++n) {
    const double length = mode.segment<3>(kDofsPerNode * n).norm();
    if (length > largest) {
      largest = length;
      at = n;
    }
  }
  if (!(largest > 0.0)) return;  // a purely rotational mode: leave it B-normalised
  Eigen::Index component = 0;
  mode.segment<3>(kDofsPerNode * at).cwiseAbs().maxCoeff(&component);
  const double sign = mode[kDofsPerNode * at + component] < 0.0 ? -1.0 : 1.0;
  mode *= sign / largest;
}

}  // namespace

SturmCheck sturm_check(const SparsePattern& pattern, std::span<const double> k, std::span<const double> kg,
                       const std::vector<double>& load_factors, double shift_ratio,
                       CholmodFactor::Ordering ordering) {
  if (load_factors.empty() || !(shift_ratio > 0.0) || k.size() != kg.size() ||
      k.size() != static_cast<std::size_t>(pattern.nonzeros()))
    throw std::invalid_argument("sturm_check: need load factors, shift_ratio > 0 and K, Kg on the pattern");
  SturmCheck sc;
  sc.shift = shift_ratio * *std::max_element(load_factors.begin(), load_factors.end());
  sc.modes_below_shift = static_cast<int>(
      std::count_if(load_factors.begin(), load_factors.end(), [&](double l) { return l < sc.shift; }));
  // K + s Kg = K - s (-Kg): negative eigenvalues <=> mu = 1/lambda > 1/s <=> 0 < lambda < s.
  std::vector<double> shifted(k.size());
  for (std::size_t i = 0; i < k.size(); ++i) shifted[i] = k[i] + sc.shift * kg[i];
  CholmodFactor ldlt(pattern, CholmodFactor::Options{CholmodFactor::Method::SupernodalLDLT, ordering});
  sc.done = ldlt.factorize(shifted) == FactorStatus::Ok;
  sc.negative_pivots = sc.done ? ldlt.negative_pivots() : 0;
  sc.message = ldlt.message();
  return sc;
}

BucklingResult solve_linear_buckling(const ShellModel& model, const SectionAssignment& sections, int n_modes,
                                     const BucklingOptions& options) {
  options.validate(n_modes);
  LinearShellSystem system(model, sections, options.prebuckling);
  const int n = system.dofs().free_count();
  if (n_modes >= n)
    throw std::invalid_argument("buckling: n_modes = " + std::to_string(n_modes) + "; need n_modes < free DOFs = " +
                                std::to_string(n));
  BucklingResult result;

  // 1. Prebuckling state under the reference load; K stays factorised in the system.
  result.prebuckling = solve_linear_static(system);
  if (!result.prebuckling.ok()) {
    result.status = BucklingStatus::PrebucklingFailed;
    result.message = "prebuckling: " + result.prebuckling.message;
    return result;
  }

  // 2. Geometric stiffness of the prebuckling membrane forces on K's pattern.
  std::vector<double> kg;
  const AssemblySummary ga =
      system.assemble_matrix(system.elements().geometric_stiffness_kernel(result.prebuckling.resultants), kg);
  result.geometric_assembly_seconds = ga.seconds;
  if (!ga.ok) {
    result.status = BucklingStatus::PrebucklingFailed;
    result.message = "geometric stiffness: " + ga.message;
    return result;
  }

  // 3. (-Kg) phi = mu K phi, largest algebraic mu (Spectra, RegularInverse mode). A load that
  // leaves (almost) no membrane forces (a plate loaded across its plane) has Kg = 0 to round-off:
  // every mu is 0, the Krylov basis collapses, and no load factor exists.
  const auto start = std::chrono::steady_clock::now();
  const std::vector<double>& k = system.stiffness_values();
  double k_max = 0.0, kg_max = 0.0;
  for (double v : k) k_max = std::max(k_max, std::abs(v));
  for (double v : kg) kg_max = std::max(kg_max, std::abs(v));
  if (!(kg_max > 1e-12 * k_max)) {
    result.status = BucklingStatus::NoPositiveModes;
    result.message = fmt::format("the reference load leaves no membrane forces (largest |Kg| = {:.3g} x largest |K|): "
                                 "it cannot buckle the model, so there is no buckling load factor",
                                 k_max > 0.0 ? kg_max / k_max : 0.0);
    return result;
  }
  NegatedSymmetricProduct a_op(system.pattern(), kg);
  StiffnessOperator b_op(system.pattern(), k, system.stiffness_factor());
  const int ncv = options.basis_size > 0 ? std::min(options.basis_size, n)
                                         : std::min(std::max(2 * n_modes + 1, 20), n);
  Spectra::SymGEigsSolver<NegatedSymmetricProduct, StiffnessOperator, Spectra::GEigsMode::RegularInverse> eigs(
      a_op, b_op, n_modes, ncv);
  // Spectra reports a breakdown of its dense sub-problems by throwing (e.g. "TridiagEigen: eigen
  // decomposition failed"): a numerical outcome of this model, returned as a status.
  Eigen::Index converged = 0;
  try {
    eigs.init();
    converged = eigs.compute(Spectra::SortRule::LargestAlge, options.max_iterations, options.tolerance,
                             Spectra::SortRule::LargestAlge);
  } catch (const std::exception& e) {
    result.status = BucklingStatus::EigenSolverFailed;
    result.message = std::string("the eigen solver broke down (") + e.what() +
                     "); try another number of modes ([buckling] modes or -n), or check that the reference "
                     "load compresses the model";
    result.eigen_seconds = seconds_since(start);
    return result;
  }
  result.iterations = static_cast<int>(eigs.num_iterations());
  result.operations = static_cast<int>(eigs.num_operations());
  const bool all_converged = eigs.info() == Spectra::CompInfo::Successful;
  if (converged > 0) {
    const Eigen::VectorXd mu = eigs.eigenvalues();     // descending mu = ascending lambda
    const Eigen::MatrixXd phi = eigs.eigenvectors();
    for (Eigen::Index i = 0; i < mu.size(); ++i) {
      if (!(mu[i] > 0.0)) continue;  // lambda <= 0 or infinite: not a buckling load of this load
      result.load_factors.push_back(1.0 / mu[i]);
      result.modes.push_back(system.full_vector(phi.col(i)));
      normalise_mode(result.modes.back());
    }
  }
  result.eigen_seconds = seconds_since(start);
  const int found = static_cast<int>(result.load_factors.size());
  if (!all_converged) {
    result.status = BucklingStatus::NotConverged;
    result.message = "Lanczos iteration converged " + std::to_string(converged) + " of " + std::to_string(n_modes) +
                     " modes in " + std::to_string(result.iterations) + " restarts";
  } else if (found < n_modes) {
    result.status = BucklingStatus::NoPositiveModes;
    result.message = "only " + std::to_string(found) + " of " + std::to_string(n_modes) +
                     " requested load factors are positive";
  }

  // 4. Sturm check: inertia of K + s Kg at s just above the largest load factor found.
  if (options.sturm_check && found > 0) {
    const auto sturm_start = std::chrono::steady_clock::now();
    result.sturm = sturm_check(system.pattern(), k, kg, result.load_factors, options.sturm_shift_ratio,
                               options.prebuckling.ordering);
    result.sturm_seconds = seconds_since(sturm_start);
    const SturmCheck& sc = result.sturm;
    if (result.status == BucklingStatus::Ok && !sc.done) {
      result.status = BucklingStatus::SturmFactorFailed;
      result.message = "Sturm check: LDL^T of K + s Kg failed: " + sc.message;
    } else if (result.status == BucklingStatus::Ok && !sc.passed()) {
      result.status = BucklingStatus::SturmMismatch;
      result.message = fmt::format("Sturm check failed: {} negative pivots of K + s Kg at s = {:.6g}, but {} "
                                   "load factors found below s (a mode was missed)",
                                   sc.negative_pivots, sc.shift, sc.modes_below_shift);
    }
  }
  if (result.status == BucklingStatus::Ok)
    result.message = result.sturm.done
                         ? fmt::format("{} load factors, lowest {:.6g}; Sturm check passed: {} eigenvalues below "
                                       "s = {:.6g}",
                                       found, result.load_factors.front(), result.sturm.negative_pivots,
                                       result.sturm.shift)
                         : fmt::format("{} load factors, lowest {:.6g}; no Sturm check", found,
                                       result.load_factors.front());
  spdlog::debug("linear buckling: {} ({} restarts, {} operations, eigen {:.3f} s, Sturm {:.3f} s)", result.message,
                result.iterations, result.operations, result.eigen_seconds, result.sturm_seconds);
  return result;
}

}  // namespace rotcap
