#pragma once
// Linear static analysis of a ShellModel under its reference load (load factor 1):
//   K u = f_ref,  K = assembled initial stiffness of the ShellQ4 elements in their initial
//   frames, supports held at zero (DofMap), f_ref = reference_load_vector(model).
//
// Units: mm, N, MPa, rad. Vectors are FULL (6 entries a node, Dof order ux..rz, global axes).
// Reactions: the forces and moments the supports apply to the structure, so that at every held
// DOF  f_int = f_ext + reaction; summed over the model, reactions + applied loads = 0.
// Status: on anything but Ok (an element failure, or a singular K: too few supports, a zero
// stiffness) the displacement, reaction and resultant fields are empty; the statistics filled so
// far are kept. A singular K shows up either as NotPositiveDefinite (a round-off pivot < 0) or as
// Mechanism (a round-off pivot > 0); the message names the equation's node and DOF.

#include "solver/linear_system.hpp"

#include <Eigen/Core>
#include <string>
#include <vector>

namespace rotcap {

using LinearStaticOptions = LinearSystemOptions;

enum class LinearStaticStatus {
  Ok,
  ElementFailed,        ///< an element kernel failed (message names it)
  NotPositiveDefinite,  ///< the Cholesky factorisation met a pivot <= 0
  Mechanism             ///< factorised, but a pivot ratio < mechanism_pivot_ratio: K is singular
};
const char* linear_static_status_name(LinearStaticStatus status);

struct LinearSolveStatistics {
  int dofs = 0;                       ///< 6 * nodes
  int free_dofs = 0;                  ///< equations
  int stiffness_nonzeros = 0;         ///< stored upper-triangle entries of K
  double factor_nonzeros = 0.0;       ///< nonzeros of the Cholesky factor L
  int colours = 0;                    ///< element colours of the parallel assembly
  double assembly_seconds = 0.0;
  double analysis_seconds = 0.0;      ///< ordering + symbolic factorisation
  double factorization_seconds = 0.0; ///< numeric factorisation
  double solve_seconds = 0.0;         ///< forward/back substitution
  double recovery_seconds = 0.0;      ///< element resultants, internal forces, reactions
};

struct LinearStaticResult {
  LinearStaticStatus status = LinearStaticStatus::Ok;
  std::string message;
  Eigen::VectorXd displacements;               ///< full, global [mm, rad]
  Eigen::VectorXd reactions;                   ///< full, global [N, N mm]; zero at free DOFs
  Eigen::VectorXd applied;                     ///< the reference load, full, global
  /// Out-of-balance force max_i |f_int - f_ext|_i over the free DOFs [N or N mm].
  double residual = 0.0;
  /// residual / max_i (|K| |u| + |f_ext|)_i over the free DOFs: the residual relative to the
  /// size of the terms that cancel in K u - f. A backward-stable solve gives a few machine
  /// epsilons (2.2e-16); it does not grow with the condition number of K.
  double backward_error = 0.0;
  std::vector<ShellQ4Resultants> resultants;   ///< per element, in its local frame
  std::vector<ShellFrame> frames;              ///< per element, initial frame
  LinearSolveStatistics statistics;
  bool ok() const { return status == LinearStaticStatus::Ok; }
};

/// Throws std::invalid_argument on an invalid model (validate_topology) or section assignment.
LinearStaticResult solve_linear_static(const ShellModel& model, const SectionAssignment& sections,
                                       const LinearStaticOptions& options = {});

/// The same analysis on an existing system (reuses its pattern, factor and timings); used by the
/// buckling analysis, which keeps the factor of K.
LinearStaticResult solve_linear_static(LinearShellSystem& system);

}  // namespace rotcap
