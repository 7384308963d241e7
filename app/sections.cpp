#include "app/sections.hpp"

#include "materials/elastic_shell_section.hpp"
#include "materials/j2_plane_stress.hpp"
#include "materials/layered_shell_section.hpp"

#include <map>

namespace rotcap::app {

SteelModel steel_model(const SteelInput& s) {
  SteelModel m;
  m.E = s.E;
  m.nu = s.nu;
  m.fy = s.fy.value_or(0.0);
  m.fu = s.fu.value_or(m.fy);
  // io's SteelCurve and materials' SteelCurveKind list the same curves in the same order.
  m.kind = static_cast<SteelCurveKind>(static_cast<int>(s.curve));
  m.hardening_modulus = s.hardening_modulus.value_or(0.0);
  m.table = s.table;
  return m;
}

SectionAssignment make_sections(const ShellModel& model, const SteelInput& steel, int layers, bool elastic_only) {
  if (elastic_only || steel.curve == SteelCurve::elastic) return SectionAssignment::elastic(model, steel.E, steel.nu);
  const SteelModel sm = steel_model(steel);
  const HardeningCurve curve = hardening_curve(sm);
  SectionAssignment sections;
  std::map<double, int> by_thickness;
  for (int e = 0; e < model.element_count(); ++e) {
    const double t = model.elements[e].thickness;
    auto it = by_thickness.find(t);
    if (it == by_thickness.end()) {
      LayeredShellSection::Options o;
      o.layers = layers;
      const int s = sections.add_section(
          std::make_unique<LayeredShellSection>(J2PlaneStress(sm.E, sm.nu, curve), t, o));
      it = by_thickness.emplace(t, s).first;
    }
    sections.assign(e, it->second);
  }
  return sections;
}

}  // namespace rotcap::app
