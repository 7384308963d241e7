#pragma once
// Checkpoints of a path run: after every converged step the run's whole state goes to
// <results>/checkpoint.h5 (io/checkpoint_file.hpp), so that `rotcap resume` continues a stopped
// run bit for bit, or extends a finished one.
//
// Entries (dotted names; units mm, N, rad):
//   run.kind ("hinge" | "general"), case.file, case.text, run.threads, run.mesh_scale (NaN: none),
//   summary.start (summary.json as known before the path: imperfection, mesh, residual stresses)
//   problem.*   ShellProblemState (solver/nonlinear/shell_problem.hpp)
//   path.*      PathState (solver/path/path_follower.hpp)
//   recorder.*  curve.csv rows and the steps whose fields are written
//   hinge.* / general.*  the study's own running values (peak, curve points)
#include "app/run_recorder.hpp"
#include "io/checkpoint_file.hpp"
#include "solver/nonlinear/shell_problem.hpp"
#include "solver/path/path_follower.hpp"

#include <Eigen/Core>

#include <filesystem>
#include <functional>
#include <optional>

namespace rotcap::app {

/// The file name of a run's checkpoint in its results folder.
inline constexpr const char* kCheckpointFile = "checkpoint.h5";

struct RunCheckpoint {
  std::filesystem::path file;                ///< empty: no checkpoints
  CheckpointData base;                       ///< written with every checkpoint (case, options)
  std::optional<CheckpointData> resume_from; ///< set: the run continues this checkpoint
  /// Set: the checkpoint's step had met this stop criterion and nothing extends it; the resumed run
  /// takes no step and only writes the outputs (a kill after the last checkpoint, before them).
  std::optional<std::string> finish_only;
  /// The study's running values, added to every checkpoint (set by the study).
  std::function<void(CheckpointData&)> add_study_state;
  /// Checkpoints written by this process and their wall time [s] (summary.json solver.checkpoints,
  /// solver.checkpoint_s).
  mutable int writes = 0;
  mutable double write_seconds = 0.0;
};

void put_vector(CheckpointData& data, const std::string& name, const Eigen::VectorXd& v);
Eigen::VectorXd vector_of(const CheckpointData& data, const std::string& name);

/// The full checkpoint of a converged step; path null: the start state, before the first step
/// (path.started = 0).
CheckpointData checkpoint_of(const RunCheckpoint& run, const ShellProblem& problem, const PathState* path,
                             const RunRecorder& recorder);
/// Writes the start state (step 0, before the path follower runs), so that a run killed during its
/// first step can be resumed too (nothing when run.file is empty).
void write_start_checkpoint(const RunCheckpoint& run, const ShellProblem& problem, const RunRecorder& recorder);
/// Writes checkpoint_of(...) to run.file (nothing when run.file is empty).
/// stop_reason: what the step handler decided at this step (empty: go on), kept as path.stop_reason.
void write_run_checkpoint(const RunCheckpoint& run, const ShellProblem& problem, const PathState& path,
                          const RunRecorder& recorder, const std::string& stop_reason);

/// The node coordinates of the analysed (imperfect) model as "model.nodes", and back onto the model
/// the case builds (InputError when the node counts differ).
void put_geometry(CheckpointData& data, const ShellModel& model);
void restore_geometry(ShellModel& model, const CheckpointData& data);

RecorderContinuation recorder_continuation(const CheckpointData& data);
/// Restores the problem's state and tangent from data (ShellProblem::restore; a state that the
/// re-evaluation does not reproduce to the bit is logged as a warning with its size) and returns
/// the path state to resume from; nullopt for a start checkpoint (the path is then run from the
/// restored committed state).
std::optional<PathState> restore_path_run(ShellProblem& problem, const CheckpointData& data);

}  // namespace rotcap::app
