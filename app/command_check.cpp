// rotcap check CASE.toml: validate the case and print what the analysis would work on.
#include "app/commands.hpp"
#include "app/logging.hpp"
#include "app/model_builder.hpp"
#include "core/text_format.hpp"
#include "solver/factor_size.hpp"

namespace rotcap::app {

int command_check(const CommandOptions& options) {
  // 1. Read and validate the case (InputError -> exit 2 in main).
  const BuiltCase built = build_case(options.case_file, options.mesh_scale);
  // 2. Derived data of a generated model (section, class, Mp, theta_p).
  for (const std::string& line : built.description) log_info(line);
  for (const std::string& line : built.warnings) log_warn(line);
  // 3. Model size and the factor's size from the symbolic analysis (no numeric work).
  const ShellModel& model = built.model;
  const FactorSize size = estimate_factor_size(model);
  log_info(format_text("mesh: %d nodes, %d shell elements, %d DOFs (%d free)", model.node_count(),
                       model.element_count(), model.dof_count(), size.free_dofs));
  log_info(format_text("rough memory need: %.0f MB (factor %.3g nonzeros = %.0f MB, tangent %.0f MB, twice for the "
                       "indefinite route)",
                       size.memory_mb(model.element_count()), size.factor_nonzeros, 8.0 * size.factor_nonzeros / 1.0e6,
                       12.0 * size.matrix_nonzeros / 1.0e6));
  log_info("case is valid: " + options.case_file.string());
  return kExitOk;
}

}  // namespace rotcap::app
