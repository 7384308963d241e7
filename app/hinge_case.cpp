#include "app/hinge_case.hpp"

#include "core/text_format.hpp"

namespace rotcap::app {

HingeCase build_hinge_case(const CaseInput& input) {
  HingeCase hc;
  hc.spec = input.zone;
  hc.section = hc.spec.section;
  const HingeZoneSpec& spec = hc.spec;
  // read_case_file validated the spec (validate(HingeZoneSpec)): a failure here is a program error.
  hc.zone = build_hinge_zone(spec);
  hc.real = real_section_properties(hc.section);
  hc.classification = classify_section(hc.section, spec.fy, spec.axial_load_ratio);
  const double fy = spec.fy;
  hc.mel = elastic_moment(hc.zone.plate, fy);
  hc.mp_real = plastic_moment(hc.real, fy);
  hc.theta_p_beam = beam_theory_rotation_at_mp(hc.zone, input.steel.E);
  hc.theta_p_shear = shear_rotation_at_mp(hc.zone, input.steel.E, input.steel.nu);
  // Derived data, as `check` prints it.
  auto& d = hc.description;
  const SectionProperties& p = hc.zone.plate;
  d.push_back("section " + (hc.section.designation.empty() ? std::string("(plates)") : hc.section.designation) +
              format_text(": h %.1f, b %.1f, tf %.1f, tw %.1f mm", hc.section.h, hc.section.b, hc.section.tf, hc.section.tw) +
              format_text(", r %.1f mm", hc.section.r));
  d.push_back(format_text("%-22s %12s %12s", "property", "plate model", "real section"));
  auto row = [&](const char* name, double a, double b, double scale, const char* unit) {
    d.push_back(format_text("%-22s %12.5g %12.5g  %s", name, a / scale, b / scale, unit));
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
  d.push_back(format_text("EN 1993-1-1 Table 5.2 (eps = %.3f, n = N/Npl = %.3f):", c.epsilon, c.axial_ratio));
  d.push_back(format_text("  flange outstand c/t = %.2f: class %.0f (limits 9, 10, 14 eps = %.2f, %.2f, ", c.flange.c_over_t,
                     double(c.flange.section_class), c.flange.limits[0], c.flange.limits[1]) +
              format_text("%.2f)", c.flange.limits[2]));
  d.push_back(format_text("  web c/t = %.2f: class %.0f (limits %.2f, %.2f, ", c.web.c_over_t, double(c.web.section_class),
                     c.web.limits[0], c.web.limits[1]) +
              format_text("%.2f", c.web.limits[2]) + (c.axial_ratio > 0 ? "; bending and compression)" : "; bending)"));
  d.push_back(format_text("  section class %.0f", double(c.section_class)));
  d.push_back(format_text("theta_p (beam theory, rotation at Mp): %.3f mrad; with shear deformation %.3f mrad",
                          1e3 * hc.theta_p_beam, 1e3 * (hc.theta_p_beam + hc.theta_p_shear)));
  d.push_back(format_text("hinge-region element length %.1f mm; %.0f node lines along the member", hc.zone.hinge_element_length,
                     static_cast<double>(hc.zone.stations.size())));
  const SectionGrid& g = hc.zone.grid;
  d.push_back(format_text("cross-section elements: top flange %.0f, bottom flange %.0f, web %.0f (tension_coarsening %g)",
                          double(g.nt()), double(g.nb()), double(g.nw()), spec.tension_coarsening));
  return hc;
}

}  // namespace rotcap::app
