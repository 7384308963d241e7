#pragma once
// Test models of the plastic verification: a flat plate strip meshed with four-node shells, the
// layered J2 sections it uses, and small helpers shared by the structural tests.
//
// Strip geometry (mm): x along the strip, 0 <= x <= L (node lines at `stations`), y across the
// width, -b/2 <= y <= b/2 (`across` elements), z the plate normal; thickness t. Quads are
// counter-clockwise about +z, so the element frames' z is global +z.
// Groups: "root" (the node line x = 0) and "tip" (x = L), both line groups (dimension 1, cells are
// the edges), so a group load is shared by tributary width; "root_centre": the root node at y = 0
// (across must be even).
//
// Root support used by the bending tests ("clamped for bending about y", the clamp of beam theory,
// which fixes the section's displacement and rotation but leaves it free to distort in its own
// plane): ux, ry and rz of every root node held; uy, uz and rx of the centre node only. The edge
// nodes' uz and rx stay free so the root line may curve anticlastically, w(y) = -k_yy y^2 / 2,
// rx = dw/dy (no transverse shear). Holding uz (or rx) at every root node would keep the root line
// straight, and the plate next to it would be in plane strain across its width (sigma_yy =
// sigma_xx / 2 in the plastic limit), raising the plastic moment there towards 2/sqrt(3) of the
// uniaxial value (von Mises): measured +10 % on the cantilever of cantilever_collapse_test.cpp.
// The six rigid-body modes are held (ux at three y, uy, uz and rx at the centre, ry).

#include "materials/hardening_curve.hpp"
#include "materials/j2_plane_stress.hpp"
#include "materials/layered_shell_section.hpp"
#include "model/shell_model.hpp"
#include "solver/section_assignment.hpp"

#include <algorithm>
#include <cmath>
#include <memory>
#include <stdexcept>
#include <vector>

namespace rotcap::testing {

struct StripSpec {
  double length = 100.0;          ///< L [mm]
  double width = 10.0;            ///< b [mm]
  double thickness = 5.0;         ///< t [mm]
  int across = 2;                 ///< elements across the width, even
  std::vector<double> stations;   ///< x of the node lines, ascending, from 0 to L
};

/// Node lines x_0 = 0 < x_1 < ... = L: the first element `first` long, each next one `ratio`
/// times longer, capped at `largest`; the remaining length is then cut into equal elements.
inline std::vector<double> graded_stations(double L, double first, double ratio, double largest) {
  std::vector<double> x{0.0};
  double a = first;
  while (x.back() + a < L - largest) {
    x.push_back(x.back() + a);
    a = std::min(a * ratio, largest);
  }
  const double rest = L - x.back();
  const int n = std::max(1, static_cast<int>(std::ceil(rest / largest - 1e-9)));
  const double x0 = x.back();
  for (int i = 1; i <= n; ++i) x.push_back(x0 + rest * i / n);
  x.back() = L;
  return x;
}

inline std::vector<double> uniform_stations(double L, int elements) {
  std::vector<double> x;
  for (int i = 0; i <= elements; ++i) x.push_back(L * i / elements);
  return x;
}

/// Node index of station i, width position j (0 <= j <= across).
inline int strip_node(const StripSpec& s, int i, int j) { return i * (s.across + 1) + j; }

inline ShellModel strip_model(const StripSpec& s) {
  if (s.across < 2 || s.across % 2 != 0) throw std::invalid_argument("strip: across must be even");
  ShellModel m;
  const int lines = static_cast<int>(s.stations.size());
  for (int i = 0; i < lines; ++i)
    for (int j = 0; j <= s.across; ++j)
      m.nodes.emplace_back(s.stations[i], -0.5 * s.width + s.width * j / s.across, 0.0);
  m.region_names = {"strip"};
  for (int i = 0; i + 1 < lines; ++i)
    for (int j = 0; j < s.across; ++j)
      m.elements.push_back({{strip_node(s, i, j), strip_node(s, i + 1, j), strip_node(s, i + 1, j + 1),
                             strip_node(s, i, j + 1)},
                            s.thickness, 0});
  for (const auto& [name, i] : {std::pair<const char*, int>{"root", 0}, {"tip", lines - 1}}) {
    NodeGroup g;
    g.dimension = 1;
    for (int j = 0; j <= s.across; ++j) g.nodes.push_back(strip_node(s, i, j));
    for (int j = 0; j < s.across; ++j) g.cells.push_back({strip_node(s, i, j), strip_node(s, i, j + 1)});
    m.groups[name] = g;
  }
  NodeGroup centre;
  centre.nodes = {strip_node(s, 0, s.across / 2)};
  centre.cells = {{centre.nodes[0]}};
  m.groups["root_centre"] = centre;
  return m;
}

/// The root support for bending about y (see the header comment).
inline void clamp_root_for_bending(ShellModel& m) {
  Support root;
  root.group = "root";
  for (Dof d : {Dof::ux, Dof::ry, Dof::rz}) root.fixed[static_cast<int>(d)] = true;
  Support centre;
  centre.group = "root_centre";
  for (Dof d : {Dof::uy, Dof::uz, Dof::rx}) centre.fixed[static_cast<int>(d)] = true;
  m.supports = {root, centre};
}

/// Bilinear hardening with one linear segment, sigma_y = fy + H epbar up to epbar = 1 (never
/// reached here), so the curve has no kink in the range the tests visit. H = 0: perfectly plastic.
inline HardeningCurve linear_hardening(double fy, double H) {
  if (H == 0.0) return HardeningCurve::perfectly_plastic(fy);
  return HardeningCurve({{0.0, fy}, {1.0, fy + H}});
}

/// One layered section for every element of the model (all elements have the thickness t);
/// `substeps`: backward-Euler substeps of a plastic layer update (the program's default, or 1).
inline SectionAssignment layered_sections(const ShellModel& m, double E, double nu,
                                          const HardeningCurve& curve, double t, int layers,
                                          int substeps = J2PlaneStress::Options{}.substeps) {
  SectionAssignment a;
  LayeredShellSection::Options o;
  o.layers = layers;
  J2PlaneStress::Options point;
  point.substeps = substeps;
  const int s = a.add_section(std::make_unique<LayeredShellSection>(J2PlaneStress(E, nu, curve, point), t, o));
  for (int e = 0; e < m.element_count(); ++e) a.assign(e, s);
  return a;
}

/// Mean of one DOF over a group's nodes, from a full displacement vector.
inline double group_mean(const ShellModel& m, const char* group, Dof dof, const Eigen::VectorXd& u) {
  const NodeGroup& g = m.groups.at(group);
  double s = 0.0;
  for (int n : g.nodes) s += u[kDofsPerNode * n + static_cast<int>(dof)];
  return s / static_cast<double>(g.nodes.size());
}

/// Weights c over the free DOFs with c . u = mean of `dof` over the group (displacement control).
template <class Dofs>
Eigen::VectorXd group_mean_weights(const ShellModel& m, const Dofs& dofs, const char* group, Dof dof) {
  const NodeGroup& g = m.groups.at(group);
  Eigen::VectorXd c = Eigen::VectorXd::Zero(dofs.free_count());
  for (int n : g.nodes) c[dofs.equation(n, dof)] = 1.0 / static_cast<double>(g.nodes.size());
  return c;
}

}  // namespace rotcap::testing
