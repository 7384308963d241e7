#pragma once
// run_path: one path-following run of a ShellProblem from its committed state, shared by the
// hinge-zone study and general models. It builds the step constraint of the [analysis] control
// (load, displacement of a DOF combination, or arc length), and after every converged step adds the
// caller's curve row, logs the caller's progress line, writes the VTK fields when due and asks the
// caller whether to stop; the last step's fields are written whatever the outcome.
#include "app/run_checkpoint.hpp"
#include "app/run_recorder.hpp"
#include "io/case_input.hpp"
#include "solver/nonlinear/shell_problem.hpp"
#include "solver/path/path_follower.hpp"

#include <Eigen/Core>

#include <functional>
#include <optional>
#include <string>
#include <vector>

namespace rotcap::app {

struct PathRunSetup {
  Control control = Control::arc_length;  ///< load, displacement or arc_length
  PathOptions options;                    ///< with max_load_factor / max_control_value set
  ArcLength::Form arc_length_form = ArcLength::Form::Cylindrical;
  /// The quantity driven by control = displacement, and the monitored curve of step_rule = curve.
  std::optional<DofCombination> controlled;
  /// stop_reason of a path that landed on max_load_factor or max_control_value (empty: "completed").
  std::string landed_reason;
  std::string description;  ///< "tracing the moment-rotation curve", logged with the control
  /// Checkpoints after every converged step (after its row and fields are written); null: none.
  const RunCheckpoint* checkpoint = nullptr;
  int checkpoint_every = 1;  ///< >= 1: every N converged steps, and at a stop the observer asks for
  /// Set: continue this path (the problem already restored, restore_path_run) instead of starting.
  std::optional<PathState> resume_from;
};

/// What the caller makes of one converged step (u: the full displacement vector).
struct StepRecord {
  std::vector<double> row;                 ///< the curve.csv row
  std::string progress;                    ///< the progress line
  std::optional<std::string> stop_reason;  ///< set: stop after this step for this reason
};
using StepHandler = std::function<StepRecord(const ConvergedStep&, const Eigen::VectorXd& u)>;

/// The stop reason of a run stopped by SIGINT or SIGTERM (app/interrupt.hpp); its exit code is 3.
inline constexpr const char* kInterrupted = "interrupted";

struct PathRunResult {
  PathSummary path;
  std::string stop_reason;  ///< the caller's, the path status's, landed_reason or "completed"
  int last_step = 0;        ///< 0 when no step converged
};

/// Throws InputError (through the caller's file) never; a held controlled DOF is the caller's to check.
PathRunResult run_path(ShellProblem& problem, const ShellModel& model, RunRecorder& recorder,
                       const PathRunSetup& setup, const StepHandler& on_step);

/// The element results of the problem's committed state, for the VTK fields.
ElementResults snapshot_results(const ShellProblem& problem);
/// summary.json's "solver" object of a finished path.
nlohmann::json solver_summary(const PathSummary& path, const ShellProblem& problem, const ShellModel& model,
                              double wall_seconds);
/// Logs the closing line of a path and returns the exit code it calls for (3 when it stopped early:
/// no convergence, a failed evaluation, or interrupted).
int finish_path(const PathSummary& path, const std::string& stop_reason, double wall_seconds);

}  // namespace rotcap::app
