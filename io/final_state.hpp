#pragma once
// final_state.json: the deformed mesh at the end of a run, enough to redraw the report's picture
// without re-running: {"nodes": [[x, y, z] mm], "quads": [[n0..n3]], "displacement": [[ux, uy, uz]
// mm], "supports": [...], "loads": [...], "units": "mm", "note": ...} over the nodes used by shell
// elements, renumbered from 0 in the order the elements first use them.
//  - "supports": one object per support of the model, {"group", "fixed": ["ux", ...], "points":
//    [[x, y, z] mm]}: the deformed positions (initial + displacement) of the group's nodes;
//  - "loads": one object per reference load (load factor 1), {"group", "point": [x, y, z] mm (the
//    deformed mean of the group's nodes), "force": [N], "moment": [N mm]} in global axes.
// Files written before "supports" and "loads" existed are read with both lists empty.
#include "model/shell_model.hpp"

#include <Eigen/Core>

#include <array>
#include <filesystem>
#include <string>
#include <vector>

namespace rotcap {

struct SupportMarks {
  std::string group;
  std::vector<std::string> fixed;                ///< held DOF names ("ux" .. "rz")
  std::vector<std::array<double, 3>> points;     ///< deformed node positions [mm]
};

struct LoadMark {
  std::string group;
  std::array<double, 3> point{};                 ///< deformed mean position of the group [mm]
  std::array<double, 3> force{};                 ///< [N], at load factor 1
  std::array<double, 3> moment{};                ///< [N mm], at load factor 1
};

struct DeformedMesh {
  std::vector<std::array<double, 3>> nodes;
  std::vector<std::array<int, 4>> quads;
  std::vector<std::array<double, 3>> displacement;
  std::vector<SupportMarks> supports;            ///< empty: not known (older files)
  std::vector<LoadMark> loads;                   ///< empty: not known (older files)
};

/// The shell elements of model with the translations of u (full DOF vector, 6 per node; zero when
/// u is shorter), and the model's supports and reference loads at their deformed positions.
DeformedMesh deformed_mesh(const ShellModel& model, const Eigen::VectorXd& u);
/// Throws OutputError when the file cannot be written.
void write_final_state(const DeformedMesh& mesh, const std::filesystem::path& file);
/// Throws InputError for a missing or malformed file.
DeformedMesh read_final_state(const std::filesystem::path& file);

}  // namespace rotcap
