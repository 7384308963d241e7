#include "tests/verification/nonlinear/benchmark_meshes.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>

namespace rotcap::verification {

namespace {

NodeGroup line_group(const std::vector<int>& nodes) {
  NodeGroup g;
  g.dimension = 1;
  g.nodes = nodes;
  for (std::size_t k = 0; k + 1 < nodes.size(); ++k) g.cells.push_back({nodes[k], nodes[k + 1]});
  std::sort(g.nodes.begin(), g.nodes.end());
  return g;
}

}  // namespace

ShellModel structured_shell(int nu, int nv, double thickness,
                            const std::function<Eigen::Vector3d(double s, double t)>& map) {
  ShellModel m;
  m.region_names = {"shell"};
  for (int j = 0; j <= nv; ++j)
    for (int i = 0; i <= nu; ++i) m.nodes.push_back(map(double(i) / nu, double(j) / nv));
  for (int j = 0; j < nv; ++j)
    for (int i = 0; i < nu; ++i)
      m.elements.push_back({{grid_node(nu, i, j), grid_node(nu, i + 1, j), grid_node(nu, i + 1, j + 1),
                             grid_node(nu, i, j + 1)},
                            thickness, 0});
  std::vector<int> s0, s1, t0, t1;
  for (int j = 0; j <= nv; ++j) {
    s0.push_back(grid_node(nu, 0, j));
    s1.push_back(grid_node(nu, nu, j));
  }
  for (int i = 0; i <= nu; ++i) {
    t0.push_back(grid_node(nu, i, 0));
    t1.push_back(grid_node(nu, i, nv));
  }
  m.groups["s0"] = line_group(s0);
  m.groups["s1"] = line_group(s1);
  m.groups["t0"] = line_group(t0);
  m.groups["t1"] = line_group(t1);
  return m;
}

void add_point_group(ShellModel& model, const std::string& name, int node) {
  NodeGroup g;
  g.dimension = 0;
  g.nodes = {node};
  g.cells = {{node}};
  model.groups[name] = g;
}

void add_support(ShellModel& model, const std::string& group, std::initializer_list<Dof> dofs) {
  Support s;
  s.group = group;
  for (Dof d : dofs) s.fixed[static_cast<int>(d)] = true;
  model.supports.push_back(s);
}

ShellModel cantilever_strip(double length, double width, double thickness, int elements) {
  ShellModel m = structured_shell(elements, 1, thickness, [&](double s, double t) {
    return Eigen::Vector3d(length * s, width * t, 0.0);
  });
  m.groups["clamped"] = m.groups.at("s0");
  m.groups["tip"] = m.groups.at("s1");
  add_support(m, "clamped", {Dof::ux, Dof::uy, Dof::uz, Dof::rx, Dof::ry, Dof::rz});
  return m;
}

ShellModel hinged_roof_quarter(double thickness, int n) {
  constexpr double R = 2540.0, half_length = 254.0, half_angle = 0.1;  // mm, mm, rad (from memory)
  ShellModel m = structured_shell(n, n, thickness, [&](double s, double t) {
    const double phi = half_angle * t;
    return Eigen::Vector3d(half_length * s, R * std::sin(phi), R * (std::cos(phi) - 1.0));
  });
  add_support(m, "s0", {Dof::ux, Dof::ry, Dof::rz});  // symmetry plane x = 0
  add_support(m, "t0", {Dof::uy, Dof::rx, Dof::rz});  // symmetry plane y = 0 (the crown line)
  add_support(m, "t1", {Dof::ux, Dof::uy, Dof::uz});  // hinged straight edge
  add_point_group(m, "crown", grid_node(n, 0, 0));
  return m;
}

ShellModel slit_annular_plate(double thickness, int radial, int around) {
  constexpr double inner = 6.0, outer = 10.0;  // from memory
  ShellModel m = structured_shell(radial, around, thickness, [&](double s, double t) {
    const double r = inner + (outer - inner) * s;
    const double theta = 2.0 * std::numbers::pi * t;
    return Eigen::Vector3d(r * std::cos(theta), r * std::sin(theta), 0.0);
  });
  m.groups["clamped"] = m.groups.at("t0");
  m.groups["lifted"] = m.groups.at("t1");
  add_support(m, "clamped", {Dof::ux, Dof::uy, Dof::uz, Dof::rx, Dof::ry, Dof::rz});
  add_point_group(m, "A", grid_node(radial, 0, around));
  add_point_group(m, "B", grid_node(radial, radial, around));
  return m;
}

ShellModel hemisphere_quarter(double thickness, int n) {
  constexpr double R = 10.0;  // from memory
  const double hole = 18.0 * std::numbers::pi / 180.0;
  // t runs from the equator (t = 0) to the hole, so the element normals point outwards.
  ShellModel m = structured_shell(n, n, thickness, [&](double s, double t) {
    const double phi = 0.5 * std::numbers::pi * s;
    const double psi = 0.5 * std::numbers::pi - (0.5 * std::numbers::pi - hole) * t;  // from the pole
    return Eigen::Vector3d(R * std::sin(psi) * std::cos(phi), R * std::sin(psi) * std::sin(phi), R * std::cos(psi));
  });
  add_support(m, "s0", {Dof::uy, Dof::rx, Dof::rz});  // symmetry plane y = 0
  add_support(m, "s1", {Dof::ux, Dof::ry, Dof::rz});  // symmetry plane x = 0
  add_point_group(m, "pin", grid_node(n, 0, n));
  add_support(m, "pin", {Dof::uz});
  add_point_group(m, "A", grid_node(n, 0, 0));
  add_point_group(m, "B", grid_node(n, n, 0));
  return m;
}

double group_mean(const ShellModel& model, const std::string& group, Dof dof, const Eigen::VectorXd& u) {
  const NodeGroup& g = model.groups.at(group);
  double sum = 0.0;
  for (int node : g.nodes) sum += u[kDofsPerNode * node + static_cast<int>(dof)];
  return sum / static_cast<double>(g.nodes.size());
}

}  // namespace rotcap::verification
