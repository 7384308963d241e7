#include "io/final_state.hpp"

#include "io/input_error.hpp"

#include <nlohmann/json.hpp>

#include <fstream>
#include <map>

namespace rotcap {

namespace fs = std::filesystem;
using nlohmann::json;

DeformedMesh deformed_mesh(const ShellModel& model, const Eigen::VectorXd& u) {
  DeformedMesh m;
  std::map<int, int> renumber;
  for (const auto& e : model.elements) {
    std::array<int, 4> q{};
    for (int a = 0; a < 4; ++a) {
      const int n = e.nodes[a];
      auto it = renumber.find(n);
      if (it == renumber.end()) {
        it = renumber.emplace(n, static_cast<int>(m.nodes.size())).first;
        m.nodes.push_back({model.nodes[n].x(), model.nodes[n].y(), model.nodes[n].z()});
        const bool has_u = u.size() >= kDofsPerNode * (n + 1);
        m.displacement.push_back({has_u ? u[kDofsPerNode * n] : 0.0, has_u ? u[kDofsPerNode * n + 1] : 0.0,
                                  has_u ? u[kDofsPerNode * n + 2] : 0.0});
      }
      q[a] = it->second;
    }
    m.quads.push_back(q);
  }
  return m;
}

void write_final_state(const DeformedMesh& mesh, const fs::path& file) {
  json j{{"nodes", mesh.nodes}, {"quads", mesh.quads}, {"displacement", mesh.displacement},
         {"units", "mm"}, {"note", "deformed mesh at the end of the run: shell nodes used by elements, renumbered"}};
  std::ofstream out(file);
  if (!out) throw OutputError(file, "cannot create");
  out << j.dump() << "\n";
  if (!out) throw OutputError(file, "cannot write");
}

DeformedMesh read_final_state(const fs::path& file) {
  std::ifstream in(file);
  if (!in) throw InputError(file, 0, "final_state.json", "no such file", "the final_state.json a run writes");
  DeformedMesh m;
  try {
    const json j = json::parse(in);
    m.nodes = j.at("nodes").get<std::vector<std::array<double, 3>>>();
    m.quads = j.at("quads").get<std::vector<std::array<int, 4>>>();
    m.displacement = j.at("displacement").get<std::vector<std::array<double, 3>>>();
  } catch (const json::exception& e) {
    throw InputError(file, 0, "final_state.json", e.what(), "nodes, quads and displacement arrays");
  }
  if (m.displacement.size() != m.nodes.size())
    throw InputError(file, 0, "displacement", "a different count than nodes", "one displacement per node");
  return m;
}

}  // namespace rotcap
