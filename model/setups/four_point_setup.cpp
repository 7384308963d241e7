#include "model/setups/four_point_setup.hpp"
#include "core/text_format.hpp"

#include "model/setups/end_bearings.hpp"

#include <algorithm>
#include <cstdio>
#include <stdexcept>

namespace rotcap {

SetupStations FourPointSetup::stations(const HingeZoneSpec& spec, double hinge_reach) const {
  const double L = spec.length, a = shear_span(spec);
  SetupStations s;
  s.loads = {a, L - a};
  s.default_stiffeners = {0.0, L};
  s.default_stiffeners.insert(s.default_stiffeners.end(), s.loads.begin(), s.loads.end());
  s.hinge_lo = std::max(0.0, a - hinge_reach);
  s.hinge_hi = std::min(L, L - a + hinge_reach);
  return s;
}

void FourPointSetup::apply(const HingeZoneMesh& mesh) const {
  const SectionGrid& g = mesh.grid;
  HingeZoneModel& out = mesh.out;
  ShellModel& m = out.model;
  const double L = mesh.spec.length, Mp = out.plastic_moment, a = shear_span(mesh.spec);
  add_end_bearings(mesh);
  const int ia = mesh.stations.at(a), ib = mesh.stations.at(L - a);
  m.groups["load_point_a"] = point_group(g.top_centre(ia));
  m.groups["load_point_b"] = point_group(g.top_centre(ib));
  m.groups["deflection_a"] = point_group(g.bottom_centre(ia));
  m.groups["deflection_b"] = point_group(g.bottom_centre(ib));
  out.reference_load = Mp / a;
  out.lever_arm = out.shear_span = a;
  for (const char* name : {"load_point_a", "load_point_b"})
    m.loads.push_back({name, Eigen::Vector3d(0.0, 0.0, -out.reference_load), Eigen::Vector3d::Zero()});
  out.rotation = {{g.bottom_centre(ia), g.bottom_centre(ib)}, Dof::uz, {-1.0 / a, -1.0 / a}};
}

double FourPointSetup::beam_theory_rotation_at_mp(const HingeZoneModel& m, double EI) const {
  // delta(a) = P a^2 (3 L - 4 a) / (6 EI), theta = 2 delta / a
  return m.plastic_moment * (3.0 * m.span - 4.0 * m.shear_span) / (3.0 * EI);
}

RotationIntegral FourPointSetup::rotation_integral(double L, double a) const {
  if (!(a > 0.0) || a > 0.5 * L) {
    throw std::invalid_argument("shear span " + format_text("%.4g", a) + " mm: expected 0 < a <= L/2");
  }
  return {2.0 * a, L - 2.0 * a};
}

std::vector<double> FourPointSetup::hinge_sections(const HingeZoneModel& m) const {
  return {m.shear_span, m.span - m.shear_span};
}

double FourPointSetup::shear_rotation_at_mp(const HingeZoneModel& m, double GAv) const {
  return 2.0 * m.plastic_moment / (m.shear_span * GAv);  // V = Mp / a over a: delta = Mp / GAv, theta = 2 delta / a
}

}  // namespace rotcap
