#pragma once
// What the benchmarks that start from a run's checkpoint share: the run's case built again (at the
// checkpoint's mesh scale), its imperfect geometry, and a ShellProblem put back into the
// checkpoint's state (app/run_checkpoint.hpp). Bench-only, header-only.
#include "app/model_builder.hpp"
#include "app/run_checkpoint.hpp"
#include "solver/nonlinear/shell_problem.hpp"

#include <cmath>
#include <filesystem>
#include <iostream>
#include <optional>
#include <string>

namespace rotcap::bench {

struct CheckpointModel {
  CheckpointData data;
  app::BuiltCase built;
  ShellModel model;  ///< the hinge zone with the checkpoint's (imperfect) node positions
};

/// nullopt, with a message on stderr naming `program`, unless the folder holds a checkpoint of a
/// generated hinge-zone case.
inline std::optional<CheckpointModel> load_checkpoint_model(const std::filesystem::path& folder,
                                                            const std::string& program) {
  CheckpointData data = read_checkpoint(folder / app::kCheckpointFile);
  const double scale = data.scalar("run.mesh_scale");
  app::BuiltCase built =
      app::build_case(data.text("case.file"), std::isnan(scale) ? std::nullopt : std::optional<double>(scale));
  if (!built.hinge) {
    std::cerr << program << ": a generated hinge-zone case is expected\n";
    return std::nullopt;
  }
  ShellModel model = built.hinge->zone.model;
  app::restore_geometry(model, data);
  return CheckpointModel{std::move(data), std::move(built), std::move(model)};
}

/// The problem's loads as the run set them, then the checkpoint's state (restore_path_run).
inline void restore_checkpoint_state(ShellProblem& problem, const CheckpointModel& m) {
  if (m.built.hinge->zone.axial_force > 0.0) {
    problem.set_fixed_load(load_vector(m.model, m.model.fixed_loads));
    problem.set_reference_load(reference_load_vector(m.model));
  }
  app::restore_path_run(problem, m.data);
}

}  // namespace rotcap::bench
