#include "model/setups/end_bearings.hpp"

namespace rotcap {

void add_end_bearings(const HingeZoneMesh& mesh) {
  const SectionGrid& g = mesh.grid;
  ShellModel& m = mesh.out.model;
  const int last = mesh.last();
  m.groups["bearing_a"] = point_group(g.bottom_centre(0));
  m.groups["bearing_b"] = point_group(g.bottom_centre(last));
  m.groups["twist_a"] = point_group(g.top_centre(0));
  m.groups["twist_b"] = point_group(g.top_centre(last));
  m.supports.push_back(support("bearing_a", {Dof::ux, Dof::uy, Dof::uz}));
  m.supports.push_back(support("bearing_b", {Dof::uy, Dof::uz}));
  m.supports.push_back(support("twist_a", {Dof::uy}));
  m.supports.push_back(support("twist_b", {Dof::uy}));
}

}  // namespace rotcap
