#include "io/general_model.hpp"

#include "io/input_error.hpp"
#include "io/input_text.hpp"

#include <stdexcept>

namespace rotcap {

namespace {

/// The group of that name, or an InputError at the case-file key naming the mesh's groups.
const NodeGroup& find_group(const CaseInput& c, const GmshMesh& mesh, const std::string& group,
                            const std::string& key, int line) {
  const auto it = mesh.groups.find(group);
  if (it == mesh.groups.end()) {
    std::vector<std::string> names;
    for (const auto& [name, g] : mesh.groups) names.push_back(name);
    throw InputError(c.file, line, key,
                     quote(group) + " (no such physical group in " + mesh.file.filename().string() + ")",
                     "one of the mesh's physical groups: " + quote_list(names) + did_you_mean(group, names));
  }
  if (it->second.nodes.empty())
    throw InputError(c.file, line, key, quote(group) + ", a physical group with no mesh elements",
                     "a group whose entities carry points, lines or quadrangles");
  return it->second;
}

std::vector<double> element_thickness(const CaseInput& c, const GmshMesh& mesh) {
  std::vector<double> t(mesh.quads.size(), 0.0);
  std::vector<int> source(mesh.quads.size(), -1);  // index of the [[thickness]] entry
  for (std::size_t i = 0; i < c.thickness.size(); ++i) {
    const ThicknessInput& entry = c.thickness[i];
    const std::string key = "thickness[" + std::to_string(i) + "].group";
    const NodeGroup& g = find_group(c, mesh, entry.group, key, entry.line);
    if (g.dimension != 2)
      throw InputError(c.file, entry.line, key,
                       quote(entry.group) + ", a " + gmsh_dimension_name(g.dimension),
                       "a Physical Surface (thickness belongs to quadrangles)");
    for (int e : mesh.group_quads.at(entry.group)) {
      if (source[e] >= 0 && t[e] != entry.value)
        throw InputError(c.file, entry.line, key,
                         quote(entry.group) + " with thickness " + format_number(entry.value) +
                             ", overlapping thickness[" + std::to_string(source[e]) + "] (" +
                             format_number(t[e]) + ") at quadrangle " + std::to_string(mesh.quad_tags[e]),
                         "one thickness per quadrangle");
      t[e] = entry.value;
      source[e] = static_cast<int>(i);
    }
  }
  for (std::size_t e = 0; e < t.size(); ++e) {
    if (source[e] >= 0) continue;
    if (!c.model.thickness)
      throw InputError(c.file, c.model.line, "model.thickness",
                       "no thickness for quadrangle " + std::to_string(mesh.quad_tags[e]) + " (region " +
                           quote(mesh.region_names[mesh.quad_region[e]]) + ")",
                       "[model] thickness or a [[thickness]] group that contains it");
    t[e] = *c.model.thickness;
  }
  return t;
}

void check_analysis_groups(const CaseInput& c, const GmshMesh& mesh) {
  const AnalysisInput& a = c.analysis;
  if (a.control_dof)
    find_group(c, mesh, a.control_dof->group, "analysis.control_dof.group", a.control_dof->line);
  for (std::size_t i = 0; i < a.record_dofs.size(); ++i)
    find_group(c, mesh, a.record_dofs[i].group, "analysis.record_dofs[" + std::to_string(i) + "].group",
               a.record_dofs[i].line);
}

}  // namespace

ShellModel build_general_model(const CaseInput& c) { return build_general_model(c, read_gmsh(c.model.mesh)); }

ShellModel build_general_model(const CaseInput& c, const GmshMesh& mesh) {
  if (c.kind != ModelKind::general)
    throw InputError(c.file, 0, "model", "a generated case ([section] + [member])",
                     "a general case ([model] mesh) for build_general_model");
  ShellModel m;
  m.nodes = mesh.nodes;
  m.region_names = mesh.region_names;
  m.groups = mesh.groups;
  const std::vector<double> t = element_thickness(c, mesh);
  m.elements.reserve(mesh.quads.size());
  for (std::size_t e = 0; e < mesh.quads.size(); ++e)
    m.elements.push_back(ShellElement{mesh.quads[e], t[e], mesh.quad_region[e]});
  for (std::size_t i = 0; i < c.supports.size(); ++i) {
    const SupportInput& s = c.supports[i];
    find_group(c, mesh, s.group, "support[" + std::to_string(i) + "].group", s.line);
    m.supports.push_back(Support{s.group, s.fixed});
  }
  for (std::size_t i = 0; i < c.loads.size(); ++i) {
    const LoadInput& l = c.loads[i];
    find_group(c, mesh, l.group, "load[" + std::to_string(i) + "].group", l.line);
    GroupLoad load;
    load.group = l.group;
    load.force = Eigen::Vector3d(l.force[0], l.force[1], l.force[2]);
    load.moment = Eigen::Vector3d(l.moment[0], l.moment[1], l.moment[2]);
    m.loads.push_back(load);
  }
  check_analysis_groups(c, mesh);
  try {
    validate_topology(m);  // the mesh reader's checks make this a safety net only
  } catch (const std::invalid_argument& e) {
    throw InputError(mesh.file, 0, "", e.what(), "a consistent shell model");
  }
  return m;
}

}  // namespace rotcap
