#pragma once
// The hinge-zone mesh's node numbering and its node lines, shared by the mesher and the loading
// setups (model/setups/) that place supports, ties and loads on it.
//
// Station i (a node line at x = stations[i]) holds per() = 2 (nf + 1) + nw - 1 nodes: bottom
// flange k = 0..nf, top flange k = 0..nf (y_k = -b/2 + k b/nf, so k = nf/2 is the centre line
// y = 0), then the web's interior nodes m = 1..nw-1 (m = 0 and m = nw are the flanges' centre
// nodes). Stiffener interiors and reference nodes follow all stations.

#include "model/shell_model.hpp"

#include <initializer_list>
#include <string>
#include <vector>

namespace rotcap {

struct SectionGrid {
  int nf, nw;  ///< flange elements (even), web elements
  int per() const { return 2 * (nf + 1) + nw - 1; }
  int bottom(int i, int k) const { return i * per() + k; }
  int top(int i, int k) const { return i * per() + nf + 1 + k; }
  int web(int i, int m) const {
    if (m == 0) return bottom(i, nf / 2);
    if (m == nw) return top(i, nf / 2);
    return i * per() + 2 * (nf + 1) + m - 1;
  }
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
