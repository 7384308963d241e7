#pragma once
// The folder of one case of a batch (sweep or study), and what "finished" means.
//
// Contents: case.toml (the case as run: the base with the overrides, so it can be rerun by hand
// with `rotcap run case.toml`), the results of `rotcap run case.toml -o <folder> --overwrite`
// (summary.json, curve.csv, report.html, ...), child.log (the child's stdout and stderr) and
// batch_case.json, the runner's marker, written atomically after the child has ended:
//   {"case", "state": "done" | "failed", "exit_code" (null when a signal ended it), "signal",
//    "reason", "wall_s"}.
// A folder is finished when batch_case.json exists, summary.json holds a stop_reason other than
// "interrupted", and case.toml is the text the batch would write now. Anything else (a case that
// was running when the batch was killed, a crash, a changed plan) is run again from scratch: the
// folder is emptied first.
#include "app/batch/child_process.hpp"

#include <nlohmann/json.hpp>

#include <filesystem>
#include <optional>
#include <string>

namespace rotcap::app {

struct BatchJob {
  std::string name;               ///< the case's name (its folder's name)
  std::filesystem::path folder;
  std::string case_text;          ///< TOML of case.toml
};

enum class CaseState { queued, running, done, failed };
const char* case_state_name(CaseState state);

/// What became of one case.
struct CaseOutcome {
  CaseState state = CaseState::queued;
  std::optional<int> exit_code;   ///< when the child exited
  int signal = 0;
  std::string reason;             ///< stop reason, or why it failed
  double wall_s = 0.0;            ///< of the child, as measured by the runner
  bool from_earlier_run = false;  ///< finished before this batch started
};

inline constexpr const char* kCaseFileName = "case.toml";
inline constexpr const char* kMarkerName = "batch_case.json";
inline constexpr const char* kChildLogName = "child.log";

/// The finished outcome of a folder (see the header comment), or nothing.
std::optional<CaseOutcome> finished_outcome(const BatchJob& job);

/// The outcome batch_case.json records, finished or not (nothing when it is absent or unreadable).
std::optional<CaseOutcome> recorded_outcome(const std::filesystem::path& folder);

/// Empties (or creates) the folder and writes case.toml.
void prepare_case_folder(const BatchJob& job);

/// The child's command line: run case.toml -o folder --overwrite --quiet --threads N, with
/// OMP_NUM_THREADS and OPENBLAS_NUM_THREADS = N, and ROTCAP_NO_PDF=1 unless pdf (no report.pdf).
ChildSpec case_child(const BatchJob& job, const std::filesystem::path& program, int threads, bool pdf);

/// After the child's end: its outcome (state, reason from summary.json or the log's last error
/// line), written as batch_case.json.
CaseOutcome record_case_end(const BatchJob& job, const ChildExit& exit, double wall_s);

/// summary.json of the folder, or nothing when absent or unreadable.
std::optional<nlohmann::json> read_summary(const std::filesystem::path& folder);

}  // namespace rotcap::app
