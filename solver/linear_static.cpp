#include "solver/linear_static.hpp"

#include <spdlog/spdlog.h>

#include <algorithm>
#include <chrono>
#include <cmath>

namespace rotcap {

const char* linear_static_status_name(LinearStaticStatus status) {
  switch (status) {
    case LinearStaticStatus::Ok: return "Ok";
    case LinearStaticStatus::ElementFailed: return "ElementFailed";
    case LinearStaticStatus::NotPositiveDefinite: return "NotPositiveDefinite";
    case LinearStaticStatus::Mechanism: return "Mechanism";
  }
  return "Unknown";
}

LinearStaticResult solve_linear_static(const ShellModel& model, const SectionAssignment& sections,
                                       const LinearStaticOptions& options) {
  LinearShellSystem system(model, sections, options);
  return solve_linear_static(system);
}

LinearStaticResult solve_linear_static(LinearShellSystem& system) {
  LinearStaticResult result;
  LinearSolveStatistics& st = result.statistics;
  const ShellModel& model = system.model();
  st.dofs = system.dofs().dof_count();
  st.free_dofs = system.dofs().free_count();
  st.stiffness_nonzeros = system.pattern().nonzeros();
  st.colours = system.assembler().colour_count();
  result.frames = system.elements().frames();

  // 1. K from the element tangents at u = 0.
  const AssemblySummary assembly = system.assemble_stiffness();
  st.assembly_seconds = assembly.seconds;
  if (!assembly.ok) {
    result.status = LinearStaticStatus::ElementFailed;
    result.message = "stiffness assembly: " + assembly.message;
    return result;
  }

  // 2. Cholesky factor of K (the symbolic analysis is done once per system).
  const FactorStatus fs = system.factorize_stiffness();
  CholmodFactor& factor = system.stiffness_factor();
  st.analysis_seconds = factor.analysis_seconds();
  st.factorization_seconds = factor.last_factorization_seconds();
  st.factor_nonzeros = factor.factor_nonzeros();
  if (fs != FactorStatus::Ok) {
    result.status = LinearStaticStatus::NotPositiveDefinite;
    result.message = "K is not positive definite (mechanism or missing supports?): " + factor.message();
    return result;
  }
  if (factor.min_pivot_ratio() < system.options().mechanism_pivot_ratio) {
    const int full = system.dofs().dof_of_equation(factor.min_pivot_equation());
    result.status = LinearStaticStatus::Mechanism;
    result.message = fmt::format("K is singular to working precision (a mechanism: missing supports?): pivot "
                                 "ratio {:.3g} < {:.3g} at node {} DOF {}",
                                 factor.min_pivot_ratio(), system.options().mechanism_pivot_ratio,
                                 full / kDofsPerNode, dof_name(static_cast<Dof>(full % kDofsPerNode)));
    return result;
  }

  // 3. u = K^{-1} f_ref on the free DOFs.
  result.applied = reference_load_vector(model);
  result.displacements = system.solve(result.applied);
  st.solve_seconds = system.solve_seconds();

  // 4. Resultants and internal forces at u; reactions at the held DOFs, residual at the free ones.
  const auto start = std::chrono::steady_clock::now();
  LinearShellSystem::Recovery rec = system.recover(result.displacements);
  if (!rec.summary.ok) {
    result.status = LinearStaticStatus::ElementFailed;
    result.message = "stress recovery: " + rec.summary.message;
    result.displacements.resize(0);
    return result;
  }
  result.resultants = std::move(rec.resultants);
  const Eigen::VectorXd out_of_balance = rec.internal_forces - result.applied;
  result.reactions = Eigen::VectorXd::Zero(st.dofs);
  const DofMap& dofs = system.dofs();
  for (int i = 0; i < st.dofs; ++i)
    if (dofs.is_held(i)) result.reactions[i] = out_of_balance[i];
  // Backward error: max |r| over max (|K| |u| + |f|), both over the free DOFs.
  const Eigen::VectorXd u_free = dofs.gather(result.displacements);
  Eigen::VectorXd scale(u_free.size());
  system.pattern().multiply_abs(system.stiffness_values(), u_free.data(), scale.data());
  scale += dofs.gather(result.applied).cwiseAbs();
  result.residual = dofs.gather(out_of_balance).lpNorm<Eigen::Infinity>();
  const double scale_max = scale.size() > 0 ? scale.maxCoeff() : 0.0;
  result.backward_error = scale_max > 0.0 ? result.residual / scale_max : 0.0;
  st.recovery_seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
  result.message = fmt::format("solved {} equations; residual {:.3g}, backward error {:.3g}", st.free_dofs,
                               result.residual, result.backward_error);
  spdlog::debug("linear static: {}; assembly {:.3f} s, analysis {:.3f} s, factorisation {:.3f} s, solve {:.3f} s",
                result.message, st.assembly_seconds, st.analysis_seconds, st.factorization_seconds,
                st.solve_seconds);
  return result;
}

}  // namespace rotcap
