#pragma once
// Linear (bifurcation) buckling analysis about the reference load of a ShellModel.
//
//   1. prebuckling: K u0 = f_ref (solve_linear_static), membrane forces N0 of every element;
//   2. geometric stiffness Kg(N0) = sum of ShellQ4::geometric_stiffness, in global DOFs;
//   3. K phi = lambda (-Kg) phi for the n lowest POSITIVE load factors lambda.
// Step 3 is solved as the inverse problem  (-Kg) phi = mu K phi, mu = 1/lambda, for the largest
// algebraic mu with Spectra's symmetric generalised solver in RegularInverse mode (K positive
// definite, factored once by CHOLMOD; Kg may be indefinite and singular). See
// docs/spec/toolchain.md; Lanczos method as in Spectra (implicitly restarted, Sorensen 1992).
//
// Sturm check (Sylvester's law of inertia): for K positive definite, the number of negative
// eigenvalues of K + s Kg equals the number of eigenvalues lambda in (0, s). With s slightly
// above the largest returned lambda it must equal the number of returned load factors; a larger
// count means the Lanczos iteration missed a (e.g. repeated) mode. The count comes from a
// supernodal LDL^T of K + s Kg (CholmodFactor::Method::SupernodalLDLT). A mismatch is reported in the result (status SturmMismatch), the
// modes found are kept.
//
// Modes: full vectors (6 a node, global axes, zero at held DOFs), scaled so the largest nodal
// translation |(ux, uy, uz)| is 1 and its largest-magnitude component is positive.

#include "solver/linear_static.hpp"

#include <span>
#include <string>
#include <vector>

namespace rotcap {

struct BucklingOptions {
  LinearStaticOptions prebuckling;   ///< element, ordering and thread settings
  int basis_size = 0;                ///< Lanczos vectors ncv, 0 = max(2 n_modes + 1, 20); n_modes < ncv <= free DOFs
  int max_iterations = 1000;         ///< restarts, >= 1
  double tolerance = 1e-10;          ///< relative accuracy of each mu (Spectra's test), > 0
  double sturm_shift_ratio = 1.001;  ///< s = ratio * largest lambda, > 1
  bool sturm_check = true;
  /// Throws std::invalid_argument naming the option and the broken constraint.
  void validate(int n_modes) const;
};

enum class BucklingStatus {
  Ok,
  PrebucklingFailed,   ///< the linear static solve failed (see prebuckling.message)
  NotConverged,        ///< Spectra did not converge; load_factors holds what had converged
  NoPositiveModes,     ///< fewer positive load factors than requested (the load cannot buckle the model)
  SturmMismatch,       ///< the inertia count disagrees with the modes found: a mode was missed
  SturmFactorFailed,   ///< K + s Kg had a zero pivot; the check could not be made
  EigenSolverFailed    ///< the Lanczos iteration broke down (Spectra threw); nothing was found
};
const char* buckling_status_name(BucklingStatus status);

struct SturmCheck {
  bool done = false;           ///< false if not asked for, or if K + s Kg had a zero pivot
  double shift = 0.0;          ///< s
  int modes_below_shift = 0;   ///< returned load factors < s
  int negative_pivots = 0;     ///< inertia count of K + s Kg = eigenvalues in (0, s)
  std::string message;         ///< the factorisation's outcome
  bool passed() const { return done && modes_below_shift == negative_pivots; }
};

/// Sturm check of the load factors found for K phi = lambda (-Kg) phi, K positive definite;
/// k and kg are upper-triangle values on pattern; s = shift_ratio * max(load_factors), > 0.
SturmCheck sturm_check(const SparsePattern& pattern, std::span<const double> k, std::span<const double> kg,
                       const std::vector<double>& load_factors, double shift_ratio,
                       CholmodFactor::Ordering ordering = CholmodFactor::Ordering::Automatic);

struct BucklingResult {
  BucklingStatus status = BucklingStatus::Ok;
  std::string message;
  std::vector<double> load_factors;       ///< ascending, all > 0
  std::vector<Eigen::VectorXd> modes;     ///< one per load factor, see the file comment
  SturmCheck sturm;
  LinearStaticResult prebuckling;         ///< u0, N0 (resultants), reactions and solve statistics
  int iterations = 0;                     ///< Spectra restarts
  int operations = 0;                     ///< applications of K^{-1}(-Kg)
  double geometric_assembly_seconds = 0.0;
  double eigen_seconds = 0.0;
  double sturm_seconds = 0.0;
  bool ok() const { return status == BucklingStatus::Ok; }
};

/// n_modes >= 1 and n_modes < free DOFs. Throws std::invalid_argument on invalid input.
BucklingResult solve_linear_buckling(const ShellModel& model, const SectionAssignment& sections, int n_modes,
                                     const BucklingOptions& options = {});

}  // namespace rotcap
