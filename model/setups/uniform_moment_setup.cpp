#include "model/setups/uniform_moment_setup.hpp"

namespace rotcap {

SetupStations UniformMomentSetup::stations(const HingeZoneSpec& spec, double) const {
  SetupStations s;
  s.rigid_start = s.rigid_end = true;
  s.hinge_lo = 0.0;
  s.hinge_hi = spec.length;
  return s;
}

void UniformMomentSetup::apply(const HingeZoneMesh& mesh) const {
  const SectionGrid& g = mesh.grid;
  HingeZoneModel& out = mesh.out;
  ShellModel& m = out.model;
  const double L = mesh.spec.length, Mp = out.plastic_moment;
  m.groups["end_section_a"] = section_group(g, 0);
  m.groups["end_section_b"] = section_group(g, mesh.last());
  const int ra = mesh.add_reference("end_a", 0.0), rb = mesh.add_reference("end_b", L);
  m.rigid_ties.push_back({"end_section_a", ra});
  m.rigid_ties.push_back({"end_section_b", rb});
  m.supports.push_back(support("end_a", {Dof::ux, Dof::uy, Dof::uz, Dof::rx}));
  m.supports.push_back(support("end_b", {Dof::uy, Dof::uz, Dof::rx}));
  out.reference_load = Mp;
  m.loads.push_back({"end_a", Eigen::Vector3d::Zero(), Eigen::Vector3d(0.0, Mp, 0.0)});
  m.loads.push_back({"end_b", Eigen::Vector3d::Zero(), Eigen::Vector3d(0.0, -Mp, 0.0)});
  const Eigen::Vector3d axial(-out.axial_force, 0.0, 0.0);  // into the member at x = L
  if (out.axial_force > 0.0) m.fixed_loads.push_back({"end_b", axial, Eigen::Vector3d::Zero()});
  out.rotation = {{ra, rb}, Dof::ry, {1.0, -1.0}};
}

double UniformMomentSetup::beam_theory_rotation_at_mp(const HingeZoneModel& m, double EI) const {
  return m.plastic_moment * m.span / EI;  // end slopes +-M L / (2 EI)
}

RotationIntegral UniformMomentSetup::rotation_integral(double length, double) const { return {0.0, length}; }

std::optional<std::string> UniformMomentSetup::no_hardening_hinge_law() const {
  return "not defined for uniform_moment: with no moment gradient the whole zone yields at once, so "
         "there is no hinge slope independent of the zone length (use the moment-curvature integration)";
}

std::vector<double> UniformMomentSetup::hinge_sections(const HingeZoneModel& m) const { return {0.5 * m.span}; }

double UniformMomentSetup::shear_rotation_at_mp(const HingeZoneModel&, double) const {
  return 0.0;  // no shear force in the hinge zone
}

}  // namespace rotcap
