#include "model/hinge_zone/section_grid.hpp"
#include "core/check.hpp"
#include "core/text_format.hpp"

#include <algorithm>
#include <cmath>
#include <sstream>
#include <stdexcept>

namespace rotcap {

int Stations::at(double xq) const {
  const auto it = std::lower_bound(x.begin(), x.end(), xq - tol);
  if (it == x.end() || std::abs(*it - xq) > tol) {
    throw InternalError("hinge-zone mesher: no station at x = " + format_text("%.8g", xq));
  }
  return static_cast<int>(it - x.begin());
}

NodeGroup point_group(int node) { return NodeGroup{0, {node}, {{node}}}; }

NodeGroup section_group(const SectionGrid& g, int i) {
  NodeGroup group;
  group.dimension = 1;
  for (int k = 0; k < std::max(g.nb(), g.nt()); ++k) {  // interleaved, as before the counts could differ
    if (k < g.nb()) group.cells.push_back({g.bottom(i, k), g.bottom(i, k + 1)});
    if (k < g.nt()) group.cells.push_back({g.top(i, k), g.top(i, k + 1)});
  }
  for (int m = 0; m < g.nw(); ++m) group.cells.push_back({g.web(i, m), g.web(i, m + 1)});
  for (int n = g.bottom(i, 0); n < g.bottom(i, 0) + g.per(); ++n) group.nodes.push_back(n);
  return group;
}

Support support(const std::string& group, std::initializer_list<Dof> dofs) {
  Support s;
  s.group = group;
  for (Dof d : dofs) s.fixed[static_cast<int>(d)] = true;
  return s;
}

}  // namespace rotcap
