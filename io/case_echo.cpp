#include "io/case_echo.hpp"

#include "io/case_file_parts.hpp"
#include "io/input_error.hpp"
#include "model/setups/loading_setup.hpp"

#include <toml++/toml.h>

namespace rotcap {

namespace {

using nlohmann::json;

json optional(const std::optional<double>& v) { return v ? json(*v) : json(nullptr); }

json amplitude(const Amplitude& a) {
  return a.kind == Amplitude::Kind::millimetres ? json(a.millimetres) : json(a.text);
}

json group_dof(const GroupDof& g) { return {{"group", g.group}, {"dof", dof_name(g.dof)}}; }

/// The [steel] keys the curve uses (fy also for every generated model: it defines Mp).
json steel(const SteelModel& s, ModelKind kind) {
  json j = {{"E", s.E}, {"nu", s.nu}, {"curve", enum_name(s.kind)}};
  if (kind == ModelKind::generated || s.kind != SteelCurveKind::elastic) j["fy"] = s.fy;
  if (s.kind == SteelCurveKind::bilinear || s.kind == SteelCurveKind::quadlinear) j["fu"] = s.fu;
  if (s.kind == SteelCurveKind::bilinear) j["hardening_modulus"] = s.hardening_modulus;
  if (s.kind == SteelCurveKind::table) j["table"] = s.table;
  return j;
}

json member(const HingeZoneSpec& m) {
  json j = {{"setup", enum_name(m.setup)}, {"length", m.length}, {"axial_load_ratio", m.axial_load_ratio}};
  const LoadingSetup& setup = loading_setup(m.setup);
  if (setup.needs_load_spacing()) j["load_spacing"] = m.load_spacing;
  if (setup.allows_support_choice()) j["support"] = enum_name(m.cantilever_support);
  if (m.stiffeners == StiffenerPlacement::positions)
    j["stiffeners"] = m.stiffener_positions;
  else
    j["stiffeners"] = enum_name(m.stiffeners);
  if (m.stiffeners != StiffenerPlacement::none) j["stiffener_thickness"] = optional(m.stiffener_thickness);
  return j;
}

json analysis(const AnalysisInput& a, ModelKind kind, int material_substeps) {
  const PathOptions& p = a.path;
  json j = {{"control", enum_name(a.control)},
            {"force_tolerance", p.force_tolerance},
            {"displacement_tolerance", p.displacement_tolerance},
            {"max_iterations", p.max_iterations},
            {"first_step", p.first_step},
            {"min_step_ratio", p.min_step_ratio},
            {"max_step_ratio", p.max_step_ratio},
            {"target_iterations", p.target_iterations},
            {"step_rule", enum_name(p.step_rule)},
            {"plastic_step", p.curve.plastic_step},
            {"turning_step", p.curve.turning_step},
            {"material_substeps", material_substeps},
            {"arc_length_form", enum_name(a.arc_length_form)},
            {"stop_below", a.stop_below},
            {"max_steps", p.max_steps}};
  if (kind == ModelKind::generated) {
    j["max_rotation"] = a.max_rotation;
    return j;
  }
  j["max_load_factor"] = optional(a.max_load_factor);
  j["control_dof"] = a.control_dof ? group_dof(*a.control_dof) : json(nullptr);
  j["max_displacement"] = optional(a.max_displacement);
  j["record_dofs"] = json::array();
  for (const GroupDof& g : a.record_dofs) j["record_dofs"].push_back(group_dof(g));
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
    const ISection& s = c.zone.section;
    j["section"] = {{"designation", s.designation.empty() ? json(nullptr) : json(s.designation)},
                    {"depth", s.h}, {"flange_width", s.b},
                    {"flange_thickness", s.tf}, {"web_thickness", s.tw},
                    {"root_radius", s.r}, {"weld_throat", s.weld_throat}};
    j["member"] = member(c.zone);
    json lateral = json::array();
    for (const LateralBrace& r : c.zone.lateral_restraints)
      lateral.push_back({{"x", r.x}, {"flange", enum_name(r.flange)}});
    j["restraints"] = {{"lateral", lateral}};
    j["residual_stress"] = {{"pattern", enum_name(c.residual_stress)}};
    if (c.demand) {
      if (c.demand->kind == RotationDemand::Kind::plastic_rotation)
        j["demand"] = {{"plastic_rotation_mrad", 1e3 * c.demand->required}};
      else
        j["demand"] = {{"rotation_capacity", c.demand->required}};
    }
  }
  j["steel"] = steel(c.steel, c.kind);
  json imperfection = {{"local", enum_name(c.imperfection.local)},
                       {"global_amplitude", amplitude(c.imperfection.global_amplitude)}};
  if (c.imperfection.local != LocalImperfection::none)
    imperfection["local_amplitude"] = amplitude(c.imperfection.local_amplitude);
  // mode and sign only when not the defaults, so the echo of a case without them is unchanged.
  if (c.imperfection.local == LocalImperfection::buckling_mode && c.imperfection.mode != 1)
    imperfection["mode"] = c.imperfection.mode;
  if (c.imperfection.local != LocalImperfection::none && c.imperfection.sign != 1)
    imperfection["sign"] = c.imperfection.sign;
  j["imperfection"] = imperfection;
  json mesh = {{"layers", c.layers.layers}};
  if (c.kind == ModelKind::generated) {
    mesh["flange_elements"] = c.zone.flange_elements;
    mesh["web_elements"] = c.zone.web_elements;
    mesh["aspect"] = c.zone.aspect;
    mesh["tension_coarsening"] = c.zone.tension_coarsening;
    mesh["far_element_length"] = c.zone.far_element_length;
    mesh["far_growth"] = c.zone.far_growth;
  }
  j["mesh"] = mesh;
  j["analysis"] = analysis(c.analysis, c.kind, c.layers.material_substeps);
  j["buckling"] = {{"modes", c.buckling.modes}};
  j["output"] = {{"fields_every", c.output.fields_every}, {"checkpoint_every", c.output.checkpoint_every}};
  return c.kind == ModelKind::general ? general_parts(c, std::move(j)) : j;
}

namespace {

/// A JSON value as a TOML node; nulls are left out by the callers.
toml::table to_toml_table(const json& object);

toml::array to_toml_array(const json& array) {
  toml::array out;
  for (const json& v : array) {
    if (v.is_object()) out.push_back(to_toml_table(v));
    else if (v.is_array()) out.push_back(to_toml_array(v));
    else if (v.is_boolean()) out.push_back(v.get<bool>());
    else if (v.is_number_integer()) out.push_back(v.get<std::int64_t>());
    else if (v.is_number()) out.push_back(v.get<double>());
    else if (v.is_string()) out.push_back(v.get<std::string>());
  }
  return out;
}

toml::table to_toml_table(const json& object) {
  toml::table out;
  for (auto it = object.begin(); it != object.end(); ++it) {
    const json& v = it.value();
    if (v.is_null()) continue;
    if (v.is_object()) out.insert(it.key(), to_toml_table(v));
    else if (v.is_array()) out.insert(it.key(), to_toml_array(v));
    else if (v.is_boolean()) out.insert(it.key(), v.get<bool>());
    else if (v.is_number_integer()) out.insert(it.key(), v.get<std::int64_t>());
    else if (v.is_number()) out.insert(it.key(), v.get<double>());
    else if (v.is_string()) out.insert(it.key(), v.get<std::string>());
  }
  return out;
}

}  // namespace

CaseInput case_from_echo(const json& echo, const std::filesystem::path& source) {
  if (!echo.is_object()) throw InputError(source, 0, "input", echo.type_name(), "the input echo of a run (an object)");
  json e = echo;
  e.erase("file");
  e.erase("kind");
  if (e.contains("model") && e["model"].is_object()) e["model"].erase("mesh_path");
  if (e.contains("section") && e["section"].is_object() && e["section"].value("designation", json()).is_string())
    e["section"] = json{{"designation", e["section"]["designation"]}};
  CaseInput c = detail::parse_case_table(to_toml_table(e), source);
  c.file = echo.value("file", source.string());
  return c;
}

}  // namespace rotcap
