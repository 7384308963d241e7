#include "model/setups/three_point_setup.hpp"

#include "model/setups/end_bearings.hpp"

#include <algorithm>

namespace rotcap {

SetupStations ThreePointSetup::stations(const HingeZoneSpec& spec, double hinge_reach) const {
  const double L = spec.length;
  SetupStations s;
  s.loads = {0.5 * L};
  s.default_stiffeners = {0.0, L};
  s.default_stiffeners.insert(s.default_stiffeners.end(), s.loads.begin(), s.loads.end());
  s.hinge_lo = std::max(0.0, 0.5 * L - hinge_reach);
  s.hinge_hi = std::min(L, 0.5 * L + hinge_reach);
  return s;
}

void ThreePointSetup::apply(const HingeZoneMesh& mesh) const {
  const SectionGrid& g = mesh.grid;
  HingeZoneModel& out = mesh.out;
  ShellModel& m = out.model;
  const double L = mesh.spec.length, Mp = out.plastic_moment;
  add_end_bearings(mesh);
  const int i = mesh.stations.at(0.5 * L);
  m.groups["load_point"] = point_group(g.top_centre(i));
  m.groups["midspan_bottom"] = point_group(g.bottom_centre(i));
  out.reference_load = 4.0 * Mp / L;
  out.lever_arm = 0.25 * L;
  out.shear_span = 0.5 * L;
  m.loads.push_back({"load_point", Eigen::Vector3d(0.0, 0.0, -out.reference_load), Eigen::Vector3d::Zero()});
  out.rotation = {{g.bottom_centre(i)}, Dof::uz, {-4.0 / L}};
}

double ThreePointSetup::beam_theory_rotation_at_mp(const HingeZoneModel& m, double EI) const {
  return m.plastic_moment * m.span / (3.0 * EI);  // delta = P L^3 / (48 EI), theta = 4 delta / L
}

RotationIntegral ThreePointSetup::rotation_integral(double length, double) const { return {length, 0.0}; }

std::vector<double> ThreePointSetup::hinge_sections(const HingeZoneModel& m) const { return {0.5 * m.span}; }

double ThreePointSetup::shear_rotation_at_mp(const HingeZoneModel& m, double GAv) const {
  return 4.0 * m.plastic_moment / (m.span * GAv);  // V = P/2 over L/2: delta = P L / (4 GAv), theta = 4 delta / L
}

}  // namespace rotcap
