#include "app/run_checkpoint.hpp"

#include "app/logging.hpp"
#include "core/text_format.hpp"
#include "io/input_error.hpp"

#include <chrono>

namespace rotcap::app {

void put_vector(CheckpointData& data, const std::string& name, const Eigen::VectorXd& v) {
  data.arrays[name].assign(v.data(), v.data() + v.size());
}

Eigen::VectorXd vector_of(const CheckpointData& data, const std::string& name) {
  const std::vector<double>& a = data.array(name);
  return Eigen::Map<const Eigen::VectorXd>(a.data(), static_cast<Eigen::Index>(a.size()));
}

CheckpointData checkpoint_of(const RunCheckpoint& run, const ShellProblem& problem, const PathState* path,
                             const RunRecorder& recorder) {
  CheckpointData d = run.base;
  ShellProblemState s = problem.state();
  d.arrays["problem.translations"] = std::move(s.translations);
  d.arrays["problem.rotations"] = std::move(s.rotations);
  d.arrays["problem.factored_translations"] = std::move(s.factored_translations);
  d.arrays["problem.factored_rotations"] = std::move(s.factored_rotations);
  d.arrays["problem.history"] = std::move(s.history);
  d.arrays["problem.history_previous"] = std::move(s.history_previous);
  d.arrays["problem.modes"] = std::move(s.modes);
  d.arrays["problem.modes_previous"] = std::move(s.modes_previous);
  d.arrays["problem.statistics"] = std::move(s.statistics);
  d.integers["problem.indefinite_before_last_evaluation"] = s.indefinite_before_last_evaluation ? 1 : 0;
  d.integers["problem.indefinite"] = s.indefinite ? 1 : 0;
  d.integers["path.started"] = path ? 1 : 0;
  if (path) {
    d.arrays["path.load_factor"] = {path->load_factor};
    put_vector(d, "path.total_increment", path->total_increment);
    put_vector(d, "path.previous_increment", path->previous_increment);
    d.arrays["path.next_size"] = {path->next_size};
    d.arrays["path.first_size"] = {path->first_size};
    d.arrays["path.previous_load_factor_increment"] = {path->previous_load_factor_increment};
    d.arrays["path.curve_elastic_value"] = {path->curve_elastic_value};
    d.integers["path.steps"] = path->steps;
    d.integers["path.iterations"] = path->iterations;
    d.integers["path.cutbacks"] = path->cutbacks;
  }
  d.integers["recorder.rows"] = static_cast<std::int64_t>(recorder.rows());
  d.arrays["recorder.field_steps"].assign(recorder.field_steps().begin(), recorder.field_steps().end());
  if (run.add_study_state) run.add_study_state(d);
  return d;
}

namespace {

void write_timed(const RunCheckpoint& run, const ShellProblem& problem, const PathState* path,
                 const RunRecorder& recorder, const std::string& stop_reason) {
  if (run.file.empty()) return;
  const auto t0 = std::chrono::steady_clock::now();
  CheckpointData d = checkpoint_of(run, problem, path, recorder);
  d.texts["path.stop_reason"] = stop_reason;
  write_checkpoint(run.file, d);
  run.write_seconds += std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
  ++run.writes;
}

}  // namespace

void write_run_checkpoint(const RunCheckpoint& run, const ShellProblem& problem, const PathState& path,
                          const RunRecorder& recorder, const std::string& stop_reason) {
  write_timed(run, problem, &path, recorder, stop_reason);
}

void write_start_checkpoint(const RunCheckpoint& run, const ShellProblem& problem, const RunRecorder& recorder) {
  write_timed(run, problem, nullptr, recorder, "");
}

void put_geometry(CheckpointData& data, const ShellModel& model) {
  std::vector<double>& nodes = data.arrays["model.nodes"];
  nodes.clear();
  for (const Eigen::Vector3d& x : model.nodes) nodes.insert(nodes.end(), x.data(), x.data() + 3);
}

void restore_geometry(ShellModel& model, const CheckpointData& data) {
  const std::vector<double>& x = data.array("model.nodes");
  if (x.size() != 3 * model.nodes.size())
    throw InputError(data.source, 0, "model.nodes", std::to_string(x.size() / 3) + " nodes",
                     std::to_string(model.nodes.size()) + " nodes, as the case file builds");
  for (std::size_t n = 0; n < model.nodes.size(); ++n) model.nodes[n] = Eigen::Vector3d(x.data() + 3 * n);
}

RecorderContinuation recorder_continuation(const CheckpointData& data) {
  RecorderContinuation r;
  r.rows = static_cast<std::size_t>(data.integer("recorder.rows"));
  for (double step : data.array("recorder.field_steps")) r.field_steps.push_back(static_cast<int>(step));
  return r;
}

std::optional<PathState> restore_path_run(ShellProblem& problem, const CheckpointData& data) {
  ShellProblemState s;
  s.translations = data.array("problem.translations");
  s.rotations = data.array("problem.rotations");
  s.factored_translations = data.array("problem.factored_translations");
  s.factored_rotations = data.array("problem.factored_rotations");
  s.history = data.array("problem.history");
  s.history_previous = data.array("problem.history_previous");
  s.modes = data.array("problem.modes");
  s.modes_previous = data.array("problem.modes_previous");
  s.statistics = data.array("problem.statistics");
  s.indefinite_before_last_evaluation = data.integer("problem.indefinite_before_last_evaluation") != 0;
  s.indefinite = data.integer("problem.indefinite") != 0;
  const bool started = data.integer("path.started") != 0;
  double difference = 0.0;
  try {
    difference = problem.restore(s, started);
  } catch (const std::invalid_argument& e) {
    throw InputError(data.source, 0, "problem", e.what(), "the state of the model the case file builds");
  }
  if (!started) {
    log_info("resume: the start state restored; the path begins again from its first step");
    return std::nullopt;
  }
  if (difference == 0.0)
    log_info("resume: state restored and the tangent re-evaluated; the history is reproduced to the bit");
  else
    log_warn(format_text("resume: the re-evaluated history differs from the checkpoint's by up to %.3g (relative); "
                         "another build, thread count or BLAS? The run goes on from the stored history, but is "
                         "not bit-identical to an uninterrupted one",
                         difference));
  PathState p;
  p.load_factor = data.scalar("path.load_factor");
  p.total_increment = vector_of(data, "path.total_increment");
  p.previous_increment = vector_of(data, "path.previous_increment");
  p.next_size = data.scalar("path.next_size");
  p.first_size = data.scalar("path.first_size");
  p.previous_load_factor_increment = data.scalar("path.previous_load_factor_increment");
  p.curve_elastic_value = data.scalar("path.curve_elastic_value");
  p.steps = static_cast<int>(data.integer("path.steps"));
  p.iterations = static_cast<int>(data.integer("path.iterations"));
  p.cutbacks = static_cast<int>(data.integer("path.cutbacks"));
  return p;
}

}  // namespace rotcap::app
