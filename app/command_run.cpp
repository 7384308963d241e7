// rotcap run CASE.toml: the full analysis of a case, results into the output folder.
#include "app/commands.hpp"
#include "app/general_analysis.hpp"
#include "app/hinge_analysis.hpp"
#include "app/logging.hpp"
#include "app/model_builder.hpp"
#include "io/input_error.hpp"
#include "app/output_folder.hpp"

#include <ctime>
#include <fstream>
#include <limits>
#include <sstream>

namespace rotcap::app {

const char* const kCaution =
    "rotcap results support, and never replace, the design of a structure to the governing code by a "
    "qualified engineer; check them against local codes and licensed practice.";

nlohmann::json program_json() {
  const std::time_t now = std::time(nullptr);
  std::tm utc{};
  gmtime_r(&now, &utc);
  char date[32];
  std::strftime(date, sizeof date, "%Y-%m-%dT%H:%M:%SZ", &utc);
  return {{"name", "rotcap"}, {"version", ROTCAP_VERSION}, {"run_date", date}};
}

std::string read_case_text(const std::filesystem::path& case_file) {
  std::ifstream in(case_file, std::ios::binary);
  std::ostringstream text;
  text << in.rdbuf();
  return text.str();
}

namespace {

RunCheckpoint new_run_checkpoint(const std::filesystem::path& folder, const CommandOptions& options, bool hinge) {
  RunCheckpoint c;
  c.file = folder / kCheckpointFile;
  c.base.texts["run.kind"] = hinge ? "hinge" : "general";
  c.base.texts["case.file"] = std::filesystem::absolute(options.case_file).lexically_normal().string();
  c.base.texts["case.text"] = read_case_text(options.case_file);
  c.base.integers["run.threads"] = options.threads;
  const double none = std::numeric_limits<double>::quiet_NaN();
  c.base.arrays["run.mesh_scale"] = {options.mesh_scale.value_or(none)};
  c.base.arrays["run.max_rotation"] = {none};
  c.base.arrays["run.stop_below"] = {none};
  return c;
}

}  // namespace

int command_run(const CommandOptions& options) {
  // 1. Read, validate and build the model before anything is written.
  const BuiltCase built = build_case(options.case_file, options.mesh_scale);
  if (built.hinge && built.input.analysis.control == Control::linear)
    throw InputError(options.case_file, 0, "analysis.control", "\"linear\"",
                     "\"arc_length\", \"displacement\" or \"load\" for a generated hinge-zone model");
  // 2. The output folder and its log file.
  const auto folder = prepare_output_folder(options.case_file, options.output, options.overwrite);
  add_log_file(folder);
  log_info("rotcap run " + options.case_file.string() + " -> " + folder.string());
  if (!built.input.title.empty()) log_info("title: " + built.input.title);
  for (const std::string& line : built.description) log_info(line);
  for (const std::string& line : built.warnings) log_warn(line);
  log_info("caution: " + std::string(kCaution));
  // 3. The analysis, with a checkpoint after every converged step (rotcap resume).
  RunCheckpoint checkpoint = new_run_checkpoint(folder, options, built.hinge.has_value());
  int code = kExitOk;
  if (built.hinge)
    code = run_hinge_study(built.input, *built.hinge, folder, options.threads, checkpoint);
  else if (built.input.analysis.control == Control::linear)
    code = run_general_linear(built.input, built.model, folder, options.threads);
  else
    code = run_general_path(built.input, built.model, folder, options.threads, checkpoint);
  log_info("results in " + folder.string());
  close_log_file();
  return code;
}

}  // namespace rotcap::app
