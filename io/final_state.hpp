#pragma once
// final_state.json: the deformed mesh at the end of a run, enough to redraw the report's picture
// without re-running: {"nodes": [[x, y, z] mm], "quads": [[n0..n3]], "displacement": [[ux, uy, uz]
// mm], "units": "mm", "note": ...} over the nodes used by shell elements, renumbered from 0 in the
// order the elements first use them.
#include "model/shell_model.hpp"

#include <Eigen/Core>

#include <array>
#include <filesystem>
#include <vector>

namespace rotcap {

struct DeformedMesh {
  std::vector<std::array<double, 3>> nodes;
  std::vector<std::array<int, 4>> quads;
  std::vector<std::array<double, 3>> displacement;
};

/// The shell elements of model with the translations of u (full DOF vector, 6 per node; zero when
/// u is shorter).
DeformedMesh deformed_mesh(const ShellModel& model, const Eigen::VectorXd& u);
/// Throws OutputError when the file cannot be written.
void write_final_state(const DeformedMesh& mesh, const std::filesystem::path& file);
/// Throws InputError for a missing or malformed file.
DeformedMesh read_final_state(const std::filesystem::path& file);

}  // namespace rotcap
