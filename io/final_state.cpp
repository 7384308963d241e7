#include "io/final_state.hpp"

#include "io/input_error.hpp"

#include <nlohmann/json.hpp>

#include <fstream>
#include <map>

namespace rotcap {

namespace fs = std::filesystem;
using nlohmann::json;

namespace {

/// Initial position plus the translation of u (zero when u is shorter) of node n [mm].
std::array<double, 3> deformed_position(const ShellModel& model, const Eigen::VectorXd& u, int n) {
  const bool has_u = u.size() >= kDofsPerNode * (n + 1);
  std::array<double, 3> p{};
  for (int k = 0; k < 3; ++k) p[k] = model.nodes[n][k] + (has_u ? u[kDofsPerNode * n + k] : 0.0);
  return p;
}

std::array<double, 3> to_array(const Eigen::Vector3d& v) { return {v.x(), v.y(), v.z()}; }

}  // namespace

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
  for (const Support& s : model.supports) {
    const auto g = model.groups.find(s.group);
    if (g == model.groups.end()) continue;  // validate_topology reports it; the picture only omits it
    SupportMarks mark{s.group, {}, {}};
    for (int d = 0; d < kDofsPerNode; ++d)
      if (s.fixed[d]) mark.fixed.push_back(dof_name(static_cast<Dof>(d)));
    for (int n : g->second.nodes) mark.points.push_back(deformed_position(model, u, n));
    m.supports.push_back(mark);
  }
  for (const GroupLoad& l : model.loads) {
    const auto g = model.groups.find(l.group);
    if (g == model.groups.end() || g->second.nodes.empty()) continue;
    LoadMark mark{l.group, {}, to_array(l.force), to_array(l.moment)};
    for (int n : g->second.nodes) {
      const auto p = deformed_position(model, u, n);
      for (int k = 0; k < 3; ++k) mark.point[k] += p[k] / static_cast<double>(g->second.nodes.size());
    }
    m.loads.push_back(mark);
  }
  return m;
}

void write_final_state(const DeformedMesh& mesh, const fs::path& file) {
  json supports = json::array(), loads = json::array();
  for (const SupportMarks& s : mesh.supports)
    supports.push_back({{"group", s.group}, {"fixed", s.fixed}, {"points", s.points}});
  for (const LoadMark& l : mesh.loads)
    loads.push_back({{"group", l.group}, {"point", l.point}, {"force", l.force}, {"moment", l.moment}});
  json j{{"nodes", mesh.nodes}, {"quads", mesh.quads}, {"displacement", mesh.displacement},
         {"supports", supports}, {"loads", loads}, {"units", "mm, N, N mm"},
         {"note", "deformed mesh at the end of the run: shell nodes used by elements, renumbered; supports and "
                  "reference loads (load factor 1) at their deformed positions"}};
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
    for (const json& s : j.value("supports", json::array()))
      m.supports.push_back({s.at("group").get<std::string>(), s.at("fixed").get<std::vector<std::string>>(),
                            s.at("points").get<std::vector<std::array<double, 3>>>()});
    for (const json& l : j.value("loads", json::array()))
      m.loads.push_back({l.at("group").get<std::string>(), l.at("point").get<std::array<double, 3>>(),
                         l.at("force").get<std::array<double, 3>>(), l.at("moment").get<std::array<double, 3>>()});
  } catch (const json::exception& e) {
    throw InputError(file, 0, "final_state.json", e.what(),
                     "nodes, quads and displacement arrays (supports and loads optional)");
  }
  if (m.displacement.size() != m.nodes.size())
    throw InputError(file, 0, "displacement", "a different count than nodes", "one displacement per node");
  return m;
}

}  // namespace rotcap
