#include "app/hinge_case.hpp"

#include "io/input_error.hpp"

#include <cstdio>
#include <stdexcept>

namespace rotcap::app {

namespace {

std::string format(const char* fmt, double a, double b = 0.0, double c = 0.0, double d = 0.0) {
  char buf[256];
  std::snprintf(buf, sizeof buf, fmt, a, b, c, d);
  return buf;
}

std::string key_of(const std::string& message) {
  // The mesher and section code start their messages with the case-file key ("member.length ...").
  const auto space = message.find_first_of(" :=");
  const std::string key = message.substr(0, space);
  return key.find('.') != std::string::npos ? key : std::string("section");
}

}  // namespace

HingeCase build_hinge_case(const CaseInput& input) {
  HingeCase hc;
  const SectionInput& s = input.section;
  hc.section = ISection{s.designation, s.depth, s.flange_width, s.flange_thickness, s.web_thickness,
                        s.root_radius, s.weld_throat};
  HingeZoneSpec& spec = hc.spec;
  spec.section = hc.section;
  // io's enums and the mesher's list the same values in the same order.
  spec.setup = static_cast<HingeSetup>(static_cast<int>(input.member.setup));
  spec.length = input.member.length;
  spec.load_spacing = input.member.load_spacing.value_or(0.0);
  spec.stiffeners = static_cast<StiffenerPlacement>(static_cast<int>(input.member.stiffeners));
  spec.stiffener_positions = input.member.stiffener_positions;
  spec.stiffener_thickness = input.member.stiffener_thickness;
  for (const LateralRestraint& r : input.lateral_restraints)
    spec.lateral_restraints.push_back({r.x, static_cast<RestrainedFlange>(static_cast<int>(r.flange))});
  spec.flange_elements = input.mesh.flange_elements;
  spec.web_elements = input.mesh.web_elements;
  spec.aspect = input.mesh.aspect;
  spec.axial_load_ratio = input.member.axial_load_ratio;
  spec.fy = input.steel.fy.value_or(0.0);
  spec.cantilever_support = input.member.support == SupportKind::symmetry ? CantileverSupport::symmetry
                                                                          : CantileverSupport::fixed;
  try {
    hc.zone = build_hinge_zone(spec);
    hc.real = real_section_properties(hc.section);
    hc.classification = classify_section(hc.section, spec.fy, spec.axial_load_ratio);
  } catch (const std::invalid_argument& e) {
    throw InputError(input.file, 0, key_of(e.what()), e.what(), "a buildable hinge-zone model");
  }
  const double fy = spec.fy;
  hc.mel = elastic_moment(hc.zone.plate, fy);
  hc.mp_real = plastic_moment(hc.real, fy);
  hc.theta_p_beam = beam_theory_rotation_at_mp(hc.zone, input.steel.E);
  // Derived data, as `check` prints it.
  auto& d = hc.description;
  const SectionProperties& p = hc.zone.plate;
  d.push_back("section " + (hc.section.designation.empty() ? std::string("(plates)") : hc.section.designation) +
              format(": h %.1f, b %.1f, tf %.1f, tw %.1f mm", hc.section.h, hc.section.b, hc.section.tf, hc.section.tw) +
              format(", r %.1f mm", hc.section.r));
  const char* head = "%-22s %12s %12s";
  char line[160];
  std::snprintf(line, sizeof line, head, "property", "plate model", "real section");
  d.push_back(line);
  auto row = [&](const char* name, double a, double b, double scale, const char* unit) {
    std::snprintf(line, sizeof line, "%-22s %12.5g %12.5g  %s", name, a / scale, b / scale, unit);
    d.push_back(line);
  };
  row("A", p.A, hc.real.A, 1e2, "cm2");
  row("Iy", p.Iy, hc.real.Iy, 1e4, "cm4");
  row("Iz", p.Iz, hc.real.Iz, 1e4, "cm4");
  row("It", p.It, hc.real.It, 1e4, "cm4");
  row("Iw", p.Iw, hc.real.Iw, 1e12, "dm6");
  row("Wel,y", p.Wel_y, hc.real.Wel_y, 1e3, "cm3");
  row("Wpl,y", p.Wpl_y, hc.real.Wpl_y, 1e3, "cm3");
  row("Mel = fy Wel,y", hc.mel, elastic_moment(hc.real, fy), 1e6, "kNm");
  row("Mp = fy Wpl,y", hc.zone.plastic_moment, hc.mp_real, 1e6, "kNm");
  const SectionClassification& c = hc.classification;
  d.push_back(format("EN 1993-1-1 Table 5.2 (eps = %.3f, n = N/Npl = %.3f):", c.epsilon, c.axial_ratio));
  d.push_back(format("  flange outstand c/t = %.2f: class %.0f (limits 9, 10, 14 eps = %.2f, %.2f, ", c.flange.c_over_t,
                     c.flange.section_class, c.flange.limits[0], c.flange.limits[1]) +
              format("%.2f)", c.flange.limits[2]));
  d.push_back(format("  web c/t = %.2f: class %.0f (limits %.2f, %.2f, ", c.web.c_over_t, c.web.section_class,
                     c.web.limits[0], c.web.limits[1]) +
              format("%.2f", c.web.limits[2]) + (c.axial_ratio > 0 ? "; bending and compression)" : "; bending)"));
  d.push_back(format("  section class %.0f", c.section_class));
  d.push_back(format("theta_p (beam theory, rotation at Mp): %.3f mrad", 1e3 * hc.theta_p_beam));
  d.push_back(format("hinge-region element length %.1f mm; %.0f node lines along the member", hc.zone.hinge_element_length,
                     static_cast<double>(hc.zone.stations.size())));
  return hc;
}

}  // namespace rotcap::app
