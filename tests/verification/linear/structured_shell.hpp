#pragma once
// Test helper for the linear shell benchmarks: a structured nx x ny mesh of four-node shells on a
// parametrised surface p(i, j), 0 <= i <= nx, 0 <= j <= ny, as a ShellModel.
//
// Node (i, j) has index j (nx + 1) + i. Element (i, j) has the nodes (i, j), (i+1, j), (i+1, j+1),
// (i, j+1): counter-clockwise about dp/di x dp/dj, which is the outward normal when p is
// parametrised so. Groups (sorted node lists with their cells, model/shell_model.hpp):
//   "i0", "in"  the edges i = 0 and i = nx   (line cells)
//   "j0", "jn"  the edges j = 0 and j = ny   (line cells)
//   "all"       every node, with the quads as cells (surface loads shared by tributary area)
// Units are those of the benchmark (the published problems are stated in consistent units).

#include "model/shell_model.hpp"

#include <Eigen/Core>
#include <Eigen/Geometry>
#include <algorithm>
#include <stdexcept>
#include <string>
#include <vector>

namespace rotcap::testing {

struct StructuredShell {
  ShellModel model;
  int nx = 0, ny = 0;
  int node(int i, int j) const { return j * (nx + 1) + i; }
};

template <class Position>
StructuredShell structured_shell(int nx, int ny, double thickness, Position position) {
  StructuredShell s;
  s.nx = nx;
  s.ny = ny;
  ShellModel& m = s.model;
  for (int j = 0; j <= ny; ++j)
    for (int i = 0; i <= nx; ++i) m.nodes.push_back(position(i, j));
  m.region_names = {"shell"};
  NodeGroup all;
  all.dimension = 2;
  for (int j = 0; j < ny; ++j)
    for (int i = 0; i < nx; ++i) {
      ShellElement e;
      e.nodes = {s.node(i, j), s.node(i + 1, j), s.node(i + 1, j + 1), s.node(i, j + 1)};
      e.thickness = thickness;
      m.elements.push_back(e);
      all.cells.push_back({e.nodes.begin(), e.nodes.end()});
    }
  for (int v = 0; v < m.node_count(); ++v) all.nodes.push_back(v);
  m.groups["all"] = all;

  const auto edge = [&](const std::string& name, int count, auto node_of) {
    NodeGroup g;
    g.dimension = 1;
    for (int k = 0; k <= count; ++k) g.nodes.push_back(node_of(k));
    for (int k = 0; k < count; ++k) g.cells.push_back({node_of(k), node_of(k + 1)});
    std::sort(g.nodes.begin(), g.nodes.end());
    m.groups[name] = g;
  };
  edge("i0", ny, [&](int k) { return s.node(0, k); });
  edge("in", ny, [&](int k) { return s.node(nx, k); });
  edge("j0", nx, [&](int k) { return s.node(k, 0); });
  edge("jn", nx, [&](int k) { return s.node(k, ny); });
  return s;
}

/// Adds a point group holding one node.
inline void add_node_group(ShellModel& m, const std::string& name, int node) {
  NodeGroup g;
  g.dimension = 0;
  g.nodes = {node};
  g.cells = {{node}};
  m.groups[name] = g;
}

/// A support holding the named DOFs ("ux" .. "rz") of a group.
inline void hold(ShellModel& m, const std::string& group, const std::vector<std::string>& dofs) {
  Support s;
  s.group = group;
  for (const auto& name : dofs) {
    Dof d;
    if (!parse_dof(name, d)) throw std::invalid_argument("hold(): unknown DOF " + name);
    s.fixed[static_cast<int>(d)] = true;
  }
  m.supports.push_back(s);
}

/// A point force on a one-node group.
inline void point_force(ShellModel& m, const std::string& name, int node, const Eigen::Vector3d& force) {
  add_node_group(m, name, node);
  GroupLoad load;
  load.group = name;
  load.force = force;
  m.loads.push_back(load);
}

/// Total mean-plane area of the mesh (sum over the quads of |d1 x d2| / 2, the measure
/// tributary_weights() shares surface loads by).
inline double mesh_area(const ShellModel& m) {
  double area = 0.0;
  for (const ShellElement& e : m.elements) {
    const Eigen::Vector3d d1 = m.nodes[e.nodes[2]] - m.nodes[e.nodes[0]];
    const Eigen::Vector3d d2 = m.nodes[e.nodes[3]] - m.nodes[e.nodes[1]];
    area += 0.5 * d1.cross(d2).norm();
  }
  return area;
}

}  // namespace rotcap::testing
