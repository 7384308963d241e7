#include "model/setups/cantilever_setup.hpp"

#include <algorithm>

namespace rotcap {

SetupStations CantileverSetup::stations(const HingeZoneSpec& spec, double hinge_reach) const {
  const double L = spec.length;
  SetupStations s;
  s.rigid_start = s.rigid_end = true;  // fixed section, tied section
  s.hinge_lo = 0.0;
  s.hinge_hi = std::min(L, hinge_reach);
  return s;
}

void CantileverSetup::apply(const HingeZoneMesh& mesh) const {
  const HingeZoneSpec& spec = mesh.spec;
  const SectionGrid& g = mesh.grid;
  HingeZoneModel& out = mesh.out;
  ShellModel& m = out.model;
  const double L = spec.length, Mp = out.plastic_moment;
  m.groups["support"] = section_group(g, 0);
  if (spec.cantilever_support == CantileverSupport::fixed) {
    m.supports.push_back(support("support", {Dof::ux, Dof::uy, Dof::uz, Dof::rx, Dof::ry, Dof::rz}));
  } else {
    // Symmetry plane of a three-point-bending specimen: ux, ry, rz held at every node; the web
    // line carries the shear and the lateral restraint (uy, uz); the flanges may contract.
    m.supports.push_back(support("support", {Dof::ux, Dof::ry, Dof::rz}));
    NodeGroup web;
    web.dimension = 1;
    for (int mm = 0; mm <= g.nw(); ++mm) web.nodes.push_back(g.web(0, mm));
    for (int mm = 0; mm < g.nw(); ++mm) web.cells.push_back({g.web(0, mm), g.web(0, mm + 1)});
    std::sort(web.nodes.begin(), web.nodes.end());
    m.groups["support_web"] = web;
    m.supports.push_back(support("support_web", {Dof::uy, Dof::uz}));
  }
  m.groups["end_section"] = section_group(g, mesh.last());
  const int ref = mesh.add_reference("load_point", L);
  m.rigid_ties.push_back({"end_section", ref});
  m.supports.push_back(support("load_point", {Dof::uy, Dof::rx}));
  out.reference_load = Mp / L;
  out.lever_arm = out.shear_span = L;
  m.loads.push_back({"load_point", Eigen::Vector3d(0.0, 0.0, -out.reference_load), Eigen::Vector3d::Zero()});
  const Eigen::Vector3d axial(-out.axial_force, 0.0, 0.0);  // into the member at x = L
  if (out.axial_force > 0.0) m.fixed_loads.push_back({"load_point", axial, Eigen::Vector3d::Zero()});
  out.rotation = {{ref}, Dof::uz, {-1.0 / L}};
}

double CantileverSetup::beam_theory_rotation_at_mp(const HingeZoneModel& m, double EI) const {
  return m.plastic_moment * m.span / (3.0 * EI);  // delta = P L^3 / (3 EI), theta = delta / L
}

RotationIntegral CantileverSetup::rotation_integral(double length, double) const { return {length, 0.0}; }

std::vector<double> CantileverSetup::hinge_sections(const HingeZoneModel&) const { return {0.0}; }

double CantileverSetup::shear_rotation_at_mp(const HingeZoneModel& m, double GAv) const {
  return m.plastic_moment / (m.span * GAv);  // V = Mp / L over L: delta = Mp / GAv, theta = delta / L
}

}  // namespace rotcap
