// rotcap check CASE.toml: validate the case and print what the analysis would work on.
#include "app/commands.hpp"
#include "app/logging.hpp"
#include "app/model_builder.hpp"
#include "solver/cholmod_factor.hpp"
#include "solver/dof_map.hpp"
#include "solver/rigid_ties.hpp"
#include "solver/sparse_pattern.hpp"

#include <cstdio>

namespace rotcap::app {

int command_check(const CommandOptions& options) {
  // 1. Read and validate the case (InputError -> exit 2 in main).
  const BuiltCase built = build_case(options.case_file, options.mesh_scale);
  // 2. Derived data of a generated model (section, class, Mp, theta_p).
  for (const std::string& line : built.description) log_info(line);
  for (const std::string& line : built.warnings) log_warn(line);
  // 3. Model size and the factor's size from the symbolic analysis (no numeric work).
  const ShellModel& model = built.model;
  const RigidTieSet ties(model);
  const DofMap dofs(model.node_count(), ties.held_dofs(model));
  const SparsePattern pattern(ties.effective_nodes(model), dofs);
  const CholmodFactor analysis(pattern, CholmodFactor::Method::SupernodalLLT);
  const double factor_mb = 8.0 * analysis.factor_nonzeros() / 1.0e6;
  const double matrix_mb = 12.0 * pattern.nonzeros() / 1.0e6;
  char line[256];
  std::snprintf(line, sizeof line, "mesh: %d nodes, %d shell elements, %d DOFs (%d free)", model.node_count(),
                model.element_count(), model.dof_count(), dofs.free_count());
  log_info(line);
  std::snprintf(line, sizeof line,
                "rough memory need: %.0f MB (factor %.3g nonzeros = %.0f MB, tangent %.0f MB, twice for the "
                "indefinite route)",
                2.0 * factor_mb + matrix_mb + 1.0e-3 * model.element_count(), analysis.factor_nonzeros(), factor_mb,
                matrix_mb);
  log_info(line);
  log_info("case is valid: " + options.case_file.string());
  return kExitOk;
}

}  // namespace rotcap::app
