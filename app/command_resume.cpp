// rotcap resume DIR: continues the run of a results folder from its checkpoint (app/run_checkpoint.hpp),
// after an interruption (Ctrl-C, kill, power cut) or, with --max-rotation / --stop-below, past the
// stop criterion of a finished run. The case file must still read as it did when the run began.
#include "app/commands.hpp"
#include "app/general_analysis.hpp"
#include "app/hinge_analysis.hpp"
#include "app/logging.hpp"
#include "app/model_builder.hpp"
#include "app/run_checkpoint.hpp"
#include "core/text_format.hpp"
#include "io/input_error.hpp"

#include <nlohmann/json.hpp>

#include <cmath>
#include <fstream>

namespace rotcap::app {

namespace fs = std::filesystem;

namespace {

std::optional<double> stored_override(const CheckpointData& data, const std::string& name) {
  const double v = data.scalar(name);
  return std::isnan(v) ? std::nullopt : std::optional<double>(v);
}

/// The stop reason of a finished run (summary.json), empty when the run did not finish.
std::string finished_stop_reason(const fs::path& folder) {
  std::ifstream in(folder / "summary.json");
  if (!in) return {};
  const nlohmann::json summary = nlohmann::json::parse(in, nullptr, false);
  if (summary.is_discarded() || !summary.contains("stop_reason") || !summary["stop_reason"].is_string()) return {};
  return summary["stop_reason"].get<std::string>();
}

/// Whether the options move the stop criterion a run ended on (a larger max_rotation, a smaller
/// stop_below).
bool is_rotation_stop(const std::string& reason) { return reason == "rotation reached max_rotation"; }
bool is_fall_stop(const std::string& reason) {
  return reason.rfind("moment fell below", 0) == 0 || reason.rfind("load factor fell below", 0) == 0;
}

bool extends(const std::string& reason, const CaseInput& was, const CommandOptions& o) {
  if (is_rotation_stop(reason)) return o.max_rotation && *o.max_rotation > was.analysis.max_rotation;
  if (is_fall_stop(reason)) return o.stop_below && *o.stop_below < was.analysis.stop_below;
  return false;
}

/// A run that ended by itself is continued only past the stop criterion the options move: a larger
/// max_rotation or a smaller stop_below. Runs stopped by a signal (or killed: no summary) resume.
void require_extension(const fs::path& folder, const std::string& reason, const CaseInput& was,
                       const CommandOptions& o) {
  if (reason == "interrupted" || extends(reason, was, o)) return;
  if (is_rotation_stop(reason))
    throw InputError(folder, 0, "--max-rotation",
                     o.max_rotation ? format_text("%g rad", *o.max_rotation) : std::string("none"),
                     format_text("a rotation above the run's max_rotation = %g rad: the run is finished (%s)",
                                 was.analysis.max_rotation, reason.c_str()));
  if (is_fall_stop(reason))
    throw InputError(folder, 0, "--stop-below", o.stop_below ? format_text("%g", *o.stop_below) : std::string("none"),
                     format_text("a fraction below the run's stop_below = %g: the run is finished (%s)",
                                 was.analysis.stop_below, reason.c_str()));
  throw InputError(folder / "summary.json", 0, "stop_reason", "a finished run (" + reason + ")",
                   "a run stopped by Ctrl-C, a signal or a crash; or a finished generated-model run extended "
                   "with --max-rotation or --stop-below (start a new run to change anything else)");
}

}  // namespace

int command_resume(const CommandOptions& options) {
  // 1. The checkpoint, and the case it was run from (unchanged).
  const fs::path folder = options.case_file;
  if (!fs::exists(folder / kCheckpointFile))
    throw InputError(folder, 0, "", "no " + std::string(kCheckpointFile) + " in the folder",
                     "the results folder of a run that reached its start state (a run stopped before it, or "
                     "the folder of another command, has nothing to continue: run the case again)");
  CheckpointData data = read_checkpoint(folder / kCheckpointFile);
  const fs::path case_file = data.text("case.file");
  if (read_case_text(case_file) != data.text("case.text"))
    throw InputError(case_file, 0, "", "a case file that is missing or changed since the run began",
                     "the case text the checkpoint holds (restore the file, or start a new run with rotcap run)");
  const std::optional<double> scale = stored_override(data, "run.mesh_scale");
  BuiltCase built = build_case(case_file, scale);
  if (const auto v = stored_override(data, "run.max_rotation")) built.input.analysis.max_rotation = *v;
  if (const auto v = stored_override(data, "run.stop_below")) built.input.analysis.stop_below = *v;
  // 2. What the options change.
  // The stop reason decided at the checkpoint's step (empty: the path was going on, or stopped by a
  // signal or a kill); summary.json has it too once the outputs were written.
  const auto stored = data.texts.find("path.stop_reason");
  std::string finished = stored == data.texts.end() ? std::string() : stored->second;
  if (finished.empty()) finished = finished_stop_reason(folder);
  std::optional<std::string> finish_only;
  if (!finished.empty() && finished != "interrupted") {
    if (fs::exists(folder / "summary.json"))
      require_extension(folder, finished, built.input, options);  // exit 2 unless extended
    else if (!extends(finished, built.input, options))
      finish_only = finished;  // killed after its last step, before its outputs: write them
  }
  if (options.max_rotation) {
    if (!built.hinge) throw InputError(folder, 0, "--max-rotation", "a general model", "a generated hinge-zone model");
    if (!(*options.max_rotation > 0.0 && *options.max_rotation <= 1.0))
      throw InputError(folder, 0, "--max-rotation", format_text("%g", *options.max_rotation), "0 < rotation <= 1 [rad]");
    built.input.analysis.max_rotation = *options.max_rotation;
    data.arrays["run.max_rotation"] = {*options.max_rotation};
  }
  if (options.stop_below) {
    if (!(*options.stop_below > 0.0 && *options.stop_below < 1.0))
      throw InputError(folder, 0, "--stop-below", format_text("%g", *options.stop_below), "0 < stop_below < 1");
    built.input.analysis.stop_below = *options.stop_below;
    data.arrays["run.stop_below"] = {*options.stop_below};
  }
  const int threads = options.threads_given ? options.threads : static_cast<int>(data.integer("run.threads"));
  // 3. The folder: stale end-of-run results go; curve.csv, fields and run.log continue.
  for (const char* name : {"summary.json", "report.html", "report.pdf", "curve.svg", "hinge_law.csv", "final_state.json"})
    fs::remove(folder / name);
  add_log_file(folder, true);
  log_info("rotcap resume " + folder.string() + " (case " + case_file.string() + ")");
  if (options.max_rotation) log_info(format_text("max_rotation now %g rad", *options.max_rotation));
  if (options.stop_below) log_info(format_text("stop_below now %g", *options.stop_below));
  log_info("caution: " + std::string(kCaution));
  // 4. The analysis, from the checkpoint on.
  RunCheckpoint checkpoint;
  checkpoint.file = folder / kCheckpointFile;
  checkpoint.base = data;
  checkpoint.resume_from = std::move(data);
  checkpoint.finish_only = finish_only;
  const int code = built.hinge ? run_hinge_study(built.input, *built.hinge, folder, threads, checkpoint)
                               : run_general_path(built.input, built.model, folder, threads, checkpoint);
  log_info("results in " + folder.string());
  close_log_file();
  return code;
}

}  // namespace rotcap::app
