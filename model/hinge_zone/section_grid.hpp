#pragma once
// The hinge-zone mesh's node numbering and its node lines, shared by the mesher and the loading
// setups (model/setups/) that place supports, ties and loads on it.
//
// Every station (a node line at x = stations[i]) has the same cross-section grid, in mm:
//   bottom flange  nodes k = 0..nb at y = y_bottom[k], z = -zf;
//   top flange     nodes k = 0..nt at y = y_top[k],    z = +zf;
//   web            nodes m = 0..nw at y = 0, z = z_web[m] (z_web[0] = -zf, z_web[nw] = +zf).
// nb and nt are even and y = 0 exactly at k = nb/2 and k = nt/2: the web's end nodes m = 0 and
// m = nw are those flange nodes (the junctions are shared). The two flanges may have different
// counts and the web's z lines need not be evenly spaced (section_grading.hpp decides them).
// Station i holds per() = (nb + 1) + (nt + 1) + nw - 1 nodes: the bottom flange, the top flange,
// then the web's interior nodes m = 1..nw-1. Stiffener interiors and reference nodes follow all
// stations.

#include "model/shell_model.hpp"

#include <initializer_list>
#include <string>
#include <vector>

namespace rotcap {

struct SectionGrid {
  std::vector<double> y_bottom;  ///< ascending [mm], nb + 1 values, y_bottom[nb/2] = 0
  std::vector<double> y_top;     ///< ascending [mm], nt + 1 values, y_top[nt/2] = 0
  std::vector<double> z_web;     ///< ascending [mm], nw + 1 values from -zf to +zf

  int nb() const { return static_cast<int>(y_bottom.size()) - 1; }  ///< bottom flange elements (even)
  int nt() const { return static_cast<int>(y_top.size()) - 1; }     ///< top flange elements (even)
  int nw() const { return static_cast<int>(z_web.size()) - 1; }     ///< web elements
  int per() const { return nb() + nt() + nw() + 1; }
  int bottom(int i, int k) const { return i * per() + k; }
  int top(int i, int k) const { return i * per() + nb() + 1 + k; }
  int web(int i, int m) const {
    if (m == 0) return bottom_centre(i);
    if (m == nw()) return top_centre(i);
    return i * per() + nb() + nt() + 2 + m - 1;
  }
  /// The flange nodes on the web's plane (y = 0), the web-flange junctions of station i.
  int bottom_centre(int i) const { return bottom(i, nb() / 2); }
  int top_centre(int i) const { return top(i, nt() / 2); }
};

/// The node lines along x, ascending [mm]; special x's closer than tol share one.
struct Stations {
  std::vector<double> x;
  double tol = 0.0;
  /// Index of the station at xq (every special x is one); throws std::logic_error if none.
  int at(double xq) const;
};

/// A point group of one node.
NodeGroup point_group(int node);
/// All nodes of station i as a curve group (flange and web segments as its cells).
NodeGroup section_group(const SectionGrid& g, int i);
/// A support holding `dofs` of every node of `group`.
Support support(const std::string& group, std::initializer_list<Dof> dofs);

}  // namespace rotcap
