#include "io/case_echo.hpp"

namespace rotcap {

namespace {

using nlohmann::json;

json optional(const std::optional<double>& v) { return v ? json(*v) : json(nullptr); }

json amplitude(const Amplitude& a) {
  return a.kind == Amplitude::Kind::millimetres ? json(a.millimetres) : json(a.text);
}

json group_dof(const GroupDof& g) { return {{"group", g.group}, {"dof", dof_name(g.dof)}}; }

json steel(const SteelInput& s) {
  json j = {{"E", s.E}, {"nu", s.nu}, {"fy", optional(s.fy)}, {"fu", optional(s.fu)},
            {"curve", enum_name(s.curve)}};
  if (s.curve == SteelCurve::bilinear) j["hardening_modulus"] = optional(s.hardening_modulus);
  if (s.curve == SteelCurve::table) j["table"] = s.table;
  return j;
}

json member(const MemberInput& m) {
  json j = {{"setup", enum_name(m.setup)}, {"length", m.length}, {"axial_load_ratio", m.axial_load_ratio}};
  if (m.setup == Setup::four_point) j["load_spacing"] = optional(m.load_spacing);
  if (m.setup == Setup::cantilever) j["support"] = enum_name(m.support);
  if (m.stiffeners == StiffenerLayout::positions)
    j["stiffeners"] = m.stiffener_positions;
  else
    j["stiffeners"] = enum_name(m.stiffeners);
  if (m.stiffeners != StiffenerLayout::none) j["stiffener_thickness"] = optional(m.stiffener_thickness);
  return j;
}

json analysis(const AnalysisInput& a, ModelKind kind) {
  json j = {{"control", enum_name(a.control)},
            {"force_tolerance", a.force_tolerance},
            {"displacement_tolerance", a.displacement_tolerance},
            {"max_iterations", a.max_iterations},
            {"first_step", a.first_step},
            {"min_step_ratio", a.min_step_ratio},
            {"max_step_ratio", a.max_step_ratio},
            {"target_iterations", a.target_iterations},
            {"arc_length_form", enum_name(a.arc_length_form)},
            {"stop_below", a.stop_below},
            {"max_steps", a.max_steps}};
  if (kind == ModelKind::generated) {
    j["max_rotation"] = a.max_rotation;
    return j;
  }
  j["max_load_factor"] = optional(a.max_load_factor);
  j["control_dof"] = a.control_dof ? group_dof(*a.control_dof) : json(nullptr);
  j["max_displacement"] = optional(a.max_displacement);
  j["monitor"] = json::array();
  for (const GroupDof& g : a.monitor) j["monitor"].push_back(group_dof(g));
  return j;
}

json general_parts(const CaseInput& c, json j) {
  j["model"] = {{"mesh", c.model.mesh_as_written}, {"mesh_path", c.model.mesh.string()},
                {"thickness", optional(c.model.thickness)}};
  j["thickness"] = json::array();
  for (const ThicknessInput& t : c.thickness) j["thickness"].push_back({{"group", t.group}, {"value", t.value}});
  j["support"] = json::array();
  for (const SupportInput& s : c.supports) {
    json fix = json::array();
    for (int d = 0; d < kDofsPerNode; ++d)
      if (s.fixed[d]) fix.push_back(dof_name(static_cast<Dof>(d)));
    j["support"].push_back({{"group", s.group}, {"fix", fix}});
  }
  j["load"] = json::array();
  for (const LoadInput& l : c.loads) j["load"].push_back({{"group", l.group}, {"force", l.force}, {"moment", l.moment}});
  return j;
}

}  // namespace

json to_json(const CaseInput& c) {
  json j = {{"file", c.file.string()}, {"title", c.title}, {"kind", enum_name(c.kind)}};
  if (c.kind == ModelKind::generated) {
    const SectionInput& s = c.section;
    j["section"] = {{"designation", s.designation.empty() ? json(nullptr) : json(s.designation)},
                    {"depth", s.depth}, {"flange_width", s.flange_width},
                    {"flange_thickness", s.flange_thickness}, {"web_thickness", s.web_thickness},
                    {"root_radius", s.root_radius}, {"weld_throat", s.weld_throat}};
    j["member"] = member(c.member);
    json lateral = json::array();
    for (const LateralRestraint& r : c.lateral_restraints)
      lateral.push_back({{"x", r.x}, {"flange", enum_name(r.flange)}});
    j["restraints"] = {{"lateral", lateral}};
    j["residual_stress"] = {{"pattern", enum_name(c.residual_stress)}};
  }
  j["steel"] = steel(c.steel);
  json imperfection = {{"local", enum_name(c.imperfection.local)},
                       {"global_amplitude", amplitude(c.imperfection.global_amplitude)}};
  if (c.imperfection.local != LocalImperfection::none)
    imperfection["local_amplitude"] = amplitude(c.imperfection.local_amplitude);
  j["imperfection"] = imperfection;
  json mesh = {{"layers", c.mesh.layers}};
  if (c.kind == ModelKind::generated) {
    mesh["flange_elements"] = c.mesh.flange_elements;
    mesh["web_elements"] = c.mesh.web_elements;
    mesh["aspect"] = c.mesh.aspect;
  }
  j["mesh"] = mesh;
  j["analysis"] = analysis(c.analysis, c.kind);
  j["buckling"] = {{"modes", c.buckling.modes}};
  j["output"] = {{"fields_every", c.output.fields_every}};
  return c.kind == ModelKind::general ? general_parts(c, std::move(j)) : j;
}

}  // namespace rotcap
