#pragma once
// The commands of the rotcap command line. Each returns the process exit code:
//   0 done; 2 bad input (InputError); 3 stopped early with partial results kept; 1 internal error.
#include <nlohmann/json.hpp>

#include <filesystem>
#include <optional>
#include <string>

namespace rotcap::app {

constexpr int kExitOk = 0;
constexpr int kExitInternal = 1;
constexpr int kExitBadInput = 2;
constexpr int kExitStoppedEarly = 3;

/// The demo's default results folder (in the working directory).
inline constexpr const char* kDemoFolder = "rotcap_demo_results";

/// {"name": "rotcap", "version": ..., "run_date": "YYYY-MM-DDThh:mm:ssZ" (UTC, now)} for summary.json.
nlohmann::json program_json();

/// The caution every report carries.
extern const char* const kCaution;

struct CommandOptions {
  std::filesystem::path case_file;
  std::optional<std::filesystem::path> output;  ///< -o DIR
  bool overwrite = false;
  bool quiet = false;
  int threads = 0;                              ///< 0: OpenMP default
  std::optional<int> modes;                     ///< buckling -n
  std::optional<double> mesh_scale;             ///< --mesh-scale (generated models only)
  std::optional<double> max_rotation;           ///< resume --max-rotation [rad]
  std::optional<double> stop_below;             ///< resume --stop-below
  bool threads_given = false;                   ///< --threads on the command line
};

int command_check(const CommandOptions& options);
int command_run(const CommandOptions& options);
int command_buckling(const CommandOptions& options);
/// Writes the bundled demo case into the output folder and runs it.
int command_demo(const CommandOptions& options);
/// Re-makes curve.svg, the law comparison, hinge_law.csv and report.html of a results folder
/// (options.case_file holds the folder) without re-running the analysis.
int command_report(const CommandOptions& options);
/// Continues the run of a results folder (options.case_file holds the folder) from its checkpoint,
/// optionally with a larger max_rotation or a smaller stop_below (extending a finished run).
int command_resume(const CommandOptions& options);
/// The text of a case file as it is on disk (empty when unreadable; the reader reports that).
std::string read_case_text(const std::filesystem::path& case_file);

}  // namespace rotcap::app
