#pragma once
// Test helper: a flat rectangular plate [0, a] x [0, b] in the global x-y plane meshed with
// nx x ny equal four-node shells (normal +z, nodes counter-clockwise), with node groups
//   "x0", "xa" (edges x = 0 and x = a), "y0", "yb" (edges y = 0, y = b) as line cells, and
//   "all" (every node, as the quads) for surface loads.
// Node (i, j), 0 <= i <= nx, 0 <= j <= ny, has index j (nx + 1) + i.

#include "model/shell_model.hpp"

#include <algorithm>
#include <stdexcept>
#include <string>
#include <vector>

namespace rotcap::testing {

inline int plate_node(int nx, int i, int j) { return j * (nx + 1) + i; }

inline ShellModel rectangular_plate(double a, double b, int nx, int ny, double t) {
  ShellModel m;
  for (int j = 0; j <= ny; ++j)
    for (int i = 0; i <= nx; ++i) m.nodes.emplace_back(a * i / nx, b * j / ny, 0.0);
  m.region_names = {"plate"};
  NodeGroup all;
  all.dimension = 2;
  for (int j = 0; j < ny; ++j)
    for (int i = 0; i < nx; ++i) {
      ShellElement e;
      e.nodes = {plate_node(nx, i, j), plate_node(nx, i + 1, j), plate_node(nx, i + 1, j + 1),
                 plate_node(nx, i, j + 1)};
      e.thickness = t;
      m.elements.push_back(e);
      all.cells.push_back({e.nodes.begin(), e.nodes.end()});
    }
  for (int v = 0; v < m.node_count(); ++v) all.nodes.push_back(v);
  m.groups["all"] = all;

  auto edge = [&](const std::string& name, int count, auto node_of) {
    NodeGroup g;
    g.dimension = 1;
    for (int k = 0; k <= count; ++k) g.nodes.push_back(node_of(k));
    for (int k = 0; k < count; ++k) g.cells.push_back({node_of(k), node_of(k + 1)});
    std::sort(g.nodes.begin(), g.nodes.end());
    m.groups[name] = g;
  };
  edge("x0", ny, [&](int k) { return plate_node(nx, 0, k); });
  edge("xa", ny, [&](int k) { return plate_node(nx, nx, k); });
  edge("y0", nx, [&](int k) { return plate_node(nx, k, 0); });
  edge("yb", nx, [&](int k) { return plate_node(nx, k, ny); });
  return m;
}

/// Adds a point group holding the given nodes (sorted here).
inline void add_point_group(ShellModel& m, const std::string& name, std::vector<int> nodes) {
  std::sort(nodes.begin(), nodes.end());
  NodeGroup g;
  g.dimension = 0;
  g.nodes = nodes;
  for (int v : nodes) g.cells.push_back({v});
  m.groups[name] = g;
}

/// Support holding the named DOFs ("ux" .. "rz") of a group.
inline Support support(const std::string& group, const std::vector<std::string>& dofs) {
  Support s;
  s.group = group;
  for (const auto& name : dofs) {
    Dof d;
    if (!parse_dof(name, d)) throw std::invalid_argument("support(): unknown DOF " + name);
    s.fixed[static_cast<int>(d)] = true;
  }
  return s;
}

}  // namespace rotcap::testing
