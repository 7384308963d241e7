#include "model/setups/end_bearings.hpp"

namespace rotcap {

void add_end_bearings(const HingeZoneMesh& mesh) {
  const SectionGrid& g = mesh.grid;
  ShellModel& m = mesh.out.model;
  const int last = mesh.last(), c = mesh.centre();
  m.groups["bearing_a"] = point_group(g.bottom(0, c));
  m.groups["bearing_b"] = point_group(g.bottom(last, c));
  m.groups["twist_a"] = point_group(g.top(0, c));
  m.groups["twist_b"] = point_group(g.top(last, c));
  m.supports.push_back(support("bearing_a", {Dof::ux, Dof::uy, Dof::uz}));
  m.supports.push_back(support("bearing_b", {Dof::uy, Dof::uz}));
  m.supports.push_back(support("twist_a", {Dof::uy}));
  m.supports.push_back(support("twist_b", {Dof::uy}));
}

}  // namespace rotcap
