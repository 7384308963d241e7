#pragma once
// LinearShellSystem: the pieces every linear analysis of a ShellModel needs, built once and kept
// together: DOF numbering (supports held at zero), the sparsity pattern, the assembler (element
// colouring), the elements in their initial frames, the assembled initial stiffness K and its
// CHOLMOD factor. solve_linear_static() and solve_linear_buckling() are written on top of it.
//
// Steps, in order (each records its wall time in seconds):
//   assemble_stiffness()  - K = sum of element tangents at zero displacement (global DOFs)
//   factorize_stiffness() - symbolic analysis (first call only) + numeric LL^T of K
//   solve(f_full)         - u = K^{-1} f on the free DOFs, returned as a full vector
//   recover(u)            - element resultants and internal forces f_int (full, held DOFs
//                           included) at u; reactions = f_int - f_ext at the held DOFs
// Rigid sections (ShellModel::rigid_ties) are eliminated as in rigid_ties.hpp, linearised.
// Not copyable or movable (the assembler and factor refer to the pattern it owns).

#include "solver/assembler.hpp"
#include "solver/cholmod_factor.hpp"
#include "solver/dof_map.hpp"
#include "solver/rigid_ties.hpp"
#include "solver/shell_element_set.hpp"
#include "solver/sparse_pattern.hpp"

#include <memory>
#include <vector>

namespace rotcap {

struct LinearSystemOptions {
  ShellQ4::Options element;                                          ///< element settings
  CholmodFactor::Ordering ordering = CholmodFactor::Ordering::Automatic;
  int threads = 0;                                                   ///< assembly threads, 0 = OpenMP default
  /// K counts as singular (a mechanism) when its factor's min pivot ratio d_j / k_jj is below
  /// this (see CholmodFactor::min_pivot_ratio); in (0, 1). A heuristic: a strip turning about a
  /// pinned edge gave 2e-13 (round-off), the same strip clamped 1.6e-4.
  double mechanism_pivot_ratio = 1e-10;
  /// Throws std::invalid_argument naming the option and the broken constraint.
  void validate() const;
};

class LinearShellSystem {
 public:
  /// Validates the model's topology and the section assignment (std::invalid_argument).
  /// model and sections are held by reference and must outlive the system (temporaries are
  /// rejected at compile time).
  LinearShellSystem(const ShellModel& model, const SectionAssignment& sections,
                    const LinearSystemOptions& options = {});
  LinearShellSystem(const ShellModel&&, const SectionAssignment&, const LinearSystemOptions& = {}) = delete;
  LinearShellSystem(const ShellModel&, const SectionAssignment&&, const LinearSystemOptions& = {}) = delete;
  LinearShellSystem(const LinearShellSystem&) = delete;
  LinearShellSystem& operator=(const LinearShellSystem&) = delete;

  AssemblySummary assemble_stiffness();
  /// Requires assemble_stiffness() to have succeeded.
  FactorStatus factorize_stiffness();
  /// Full displacement vector for the full load vector f (size 6 nodes; held entries of f ignored).
  Eigen::VectorXd solve(const Eigen::VectorXd& f_full);

  struct Recovery {
    AssemblySummary summary;
    std::vector<ShellQ4Resultants> resultants;  ///< per element, local frame
    Eigen::VectorXd internal_forces;            ///< full vector, global axes
  };
  Recovery recover(const Eigen::VectorXd& u_full) const;

  /// Full vector (6 per node) of a free-DOF vector, held DOFs zero, tied nodes following their
  /// masters (for increments and mode shapes).
  Eigen::VectorXd full_vector(const Eigen::VectorXd& x_free) const;
  /// Assembles a kernel's matrix onto the system's pattern (e.g. the geometric stiffness); tied
  /// elements are mapped to their masters here, like every kernel of the system.
  AssemblySummary assemble_matrix(const ElementKernel& kernel, std::vector<double>& values) const;

  const ShellModel& model() const { return model_; }
  const LinearSystemOptions& options() const { return options_; }
  const DofMap& dofs() const { return dofs_; }
  const SparsePattern& pattern() const { return *pattern_; }
  const Assembler& assembler() const { return *assembler_; }
  const ShellElementSet& elements() const { return *elements_; }
  const std::vector<double>& stiffness_values() const { return k_; }
  /// The factor of K; requires factorize_stiffness() to have been called (else std::logic_error).
  CholmodFactor& stiffness_factor();

  double assembly_seconds() const { return assembly_seconds_; }
  double solve_seconds() const { return solve_seconds_; }

 private:
  const ShellModel& model_;
  LinearSystemOptions options_;
  RigidTieSet ties_;
  DofMap dofs_;
  ElementKernel tied(ElementKernel kernel) const;
  std::unique_ptr<SparsePattern> pattern_;
  std::unique_ptr<Assembler> assembler_;
  std::unique_ptr<ShellElementSet> elements_;
  std::vector<double> k_;
  std::unique_ptr<CholmodFactor> factor_;
  bool assembled_ = false;
  double assembly_seconds_ = 0.0;
  double solve_seconds_ = 0.0;
};

}  // namespace rotcap
