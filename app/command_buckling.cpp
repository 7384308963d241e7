// rotcap buckling CASE.toml: linear buckling load factors and mode shapes under the reference load.
#include "app/commands.hpp"
#include "core/text_format.hpp"
#include "app/field_export.hpp"
#include "app/logging.hpp"
#include "app/model_builder.hpp"
#include "app/output_folder.hpp"
#include "io/case_echo.hpp"
#include "io/input_error.hpp"
#include "io/pvd_collection.hpp"
#include "solver/linear_buckling.hpp"
#include "solver/section_assignment.hpp"

#include <nlohmann/json.hpp>

#include <cstdio>
#include <fstream>

namespace rotcap::app {

int command_buckling(const CommandOptions& options) {
  // 1. The model and the number of modes.
  const BuiltCase built = build_case(options.case_file, options.mesh_scale);
  const int n_modes = options.modes.value_or(built.input.buckling.modes);
  if (n_modes < 1)
    throw InputError(options.case_file, 0, "-n", std::to_string(n_modes), "a number of modes >= 1");
  const auto folder = prepare_output_folder(options.case_file, options.output, options.overwrite);
  add_log_file(folder);
  log_info("rotcap buckling " + options.case_file.string() + " -> " + folder.string());
  // 2. The eigenproblem K phi = lambda (-Kg) phi about the linear state under the reference load.
  const SectionAssignment sections =
      SectionAssignment::for_steel(built.model, built.input.steel, built.input.layers, true);
  BucklingOptions bo;
  bo.prebuckling.threads = options.threads;
  const BucklingResult result = solve_linear_buckling(built.model, sections, n_modes, bo);
  // 3. buckling.json and the mode shapes.
  nlohmann::json j{{"title", built.input.title}, {"program", program_json()}, {"input", to_json(built.input)},
                   {"caution", kCaution},
                   {"status", buckling_status_name(result.status)}, {"message", result.message},
                   {"load_factors", result.load_factors},
                   {"sturm_check", {{"done", result.sturm.done}, {"shift", result.sturm.shift},
                                    {"modes_below_shift", result.sturm.modes_below_shift},
                                    {"negative_pivots", result.sturm.negative_pivots},
                                    {"passed", result.sturm.passed()}}}};
  if (built.hinge) {
    std::vector<double> mcr;
    for (double l : result.load_factors) mcr.push_back(l * built.hinge->zone.moment_per_load_factor / 1e6);
    j["critical_moments_kNm"] = mcr;
    j["mp_kNm"] = built.hinge->zone.plastic_moment / 1e6;
  }
  std::filesystem::create_directories(folder / "modes");
  PvdCollection pvd(folder / "modes.pvd");
  for (std::size_t k = 0; k < result.modes.size(); ++k) {
    const std::string name = format_text("mode_%02zu.vtu", k + 1);
    write_shell_fields(folder / "modes" / name, built.model, result.modes[k], ElementResults{});
    pvd.add(static_cast<double>(k + 1), folder / "modes" / name);
  }
  {
    std::ofstream out(folder / "buckling.json");
    out << j.dump(2) << "\n";
  }
  for (std::size_t k = 0; k < result.load_factors.size(); ++k) {
    std::string text = format_text("mode %2zu: load factor %.6g", k + 1, result.load_factors[k]);
    if (built.hinge)
      text += format_text("  (critical hinge moment %.4g kNm = %.4g Mp)",
                          result.load_factors[k] * built.hinge->zone.moment_per_load_factor / 1e6,
                          result.load_factors[k]);
    log_info(text);
  }
  if (result.sturm.done)
    log_info("Sturm check: " + std::to_string(result.sturm.negative_pivots) + " eigenvalues below " +
             std::to_string(result.sturm.shift) + ", " + std::to_string(result.sturm.modes_below_shift) +
             " found" + (result.sturm.passed() ? " (passed)" : " (MISMATCH: a mode may be missing)"));
  log_info("modes in " + (folder / "modes.pvd").string());
  // The outcome goes to run.log too (the log file is closed last).
  int code = kExitOk;
  if (!result.ok()) {
    log_error(result.message);
    code = result.status == BucklingStatus::NoPositiveModes ? kExitOk : kExitStoppedEarly;
  }
  close_log_file();
  return code;
}

}  // namespace rotcap::app
