#include "app/hinge_report_sections.hpp"

#include "app/hinge_law_outputs.hpp"
#include "app/report_words.hpp"
#include "core/text_format.hpp"

#include <cmath>

namespace rotcap::app {

using nlohmann::json;

namespace {

/// A two-column table (quantity, value), value cells optionally with an id.
struct QuantityTable {
  ReportTable table;
  explicit QuantityTable(std::string caption = "") {
    table.caption = std::move(caption);
    table.header = {"quantity", "value"};
  }
  void row(const std::string& name, const std::string& value, const std::string& id = "") {
    table.rows.push_back({{name, ""}, {value, id}});
  }
};

ReportSection titled(const std::string& heading) {
  ReportSection s;
  s.heading = heading;
  return s;
}

std::string error_text(const json& v) {
  return v.is_number() ? format_text("%+.1f %%", 100.0 * v.get<double>()) : std::string("-");
}

std::string kNm_or_dash(const json& v) { return v.is_number() ? kNm_text(v.get<double>()) : std::string("-"); }

}  // namespace

ReportSection result_section(const ReportInputs& in) {
  const HingeCurveResult& r = in.result;
  const json& s = in.summary;
  const double mp = in.hinge.zone.plastic_moment, theta_p = in.laws.theta_p;
  ReportSection sec = titled("Result");
  sec.boxed = true;
  QuantityTable t;
  t.row("plastic moment Mp (plate model)", kNm_text(mp / 1e6), "mp");
  t.row("peak moment M_max", kNm_text(r.m_max / 1e6) + " at θ = " + mrad_text(1e3 * r.theta_at_m_max), "m-max");
  t.row("M_max / Mp", ratio_text(r.m_max / mp), "m-max-over-mp");
  t.row("θp, elastic rotation at Mp (computed from the curve's initial slope)", mrad_text(1e3 * theta_p));
  t.row("θp, beam theory (bending only)", mrad_text(1e3 * in.hinge.theta_p_beam));
  t.row("θu, rotation where M falls back to Mp",
        !r.theta_u ? "not reached (M_max < Mp)"
        : r.rotation_capacity_is_lower_bound ? "≥ " + mrad_text(1e3 * *r.theta_u) + " (end of run; M was still above Mp)"
                                             : mrad_text(1e3 * *r.theta_u));
  std::optional<double> available = json_number(s, {"available_plastic_rotation_mrad"});
  if (!available && r.theta_u) available = 1e3 * (*r.theta_u - theta_p);
  t.row("available plastic rotation θu − θp", available ? mrad_text(*available) : "none (M_max < Mp)");
  t.row("rotation capacity R = θu / θp − 1 (computed θp)",
        r.rotation_capacity ? format_text("%.2f", *r.rotation_capacity) : "none (M_max < Mp)", "rotation-capacity");
  if (r.rotation_capacity && r.rotation_capacity_is_lower_bound)
    t.row("R is a lower bound", "yes: the run stopped before M fell back to Mp");
  if (const auto r_beam = json_number(s, {"rotation_capacity_beam_theta_p"}))
    t.row("R with the beam-theory θp (for comparison)", format_text("%.2f", *r_beam));
  const std::string mode = json_string(s, {"failure_mode"});
  t.row("failure mode", mode.empty() ? "not recorded"
                                     : mode == "none" ? "none: the moment did not fall from its peak within the run"
                                                      : identifier_words(mode),
        "failure-mode");
  t.row("cross-section class (EN 1993-1-1 Table 5.2)",
        format_text("%d (flange %d, web %d)", in.hinge.classification.section_class,
                    in.hinge.classification.flange.section_class, in.hinge.classification.web.section_class));
  // The rotation demand, when the case gives one.
  if (s.contains("demand") && s["demand"].is_object()) {
    const json& d = s["demand"];
    const bool rotation = json_string(d, {"kind"}) == "plastic_rotation";
    auto value = [&](const std::optional<double>& v, bool sign = false) {
      if (!v) return std::string("not available");
      return rotation ? (sign ? signed_mrad_text(*v) : mrad_text(*v)) : format_text(sign ? "%+.2f" : "%.2f", *v);
    };
    const std::string what = rotation ? "plastic rotation θu − θp" : "rotation capacity R";
    const std::string verdict = json_string(d, {"verdict"});
    t.row("demand: required " + what, value(json_number(d, {"required"})));
    t.row("demand: available " + what, value(json_number(d, {"available"})));
    t.row("demand: verdict (margin = available − required)",
          (verdict.empty() ? std::string("not shown") : verdict) +
              (json_number(d, {"margin"}) ? " (margin " + value(json_number(d, {"margin"}), true) + ")" : ""),
          "demand-verdict");
    if (const std::string basis = json_string(d, {"basis"}); !basis.empty()) t.row("demand: basis", basis);
    if (const std::string note = json_string(d, {"note"}); !note.empty()) t.row("demand: note", note);
  }
  sec.tables.push_back(t.table);
  if (!r.theta_u)
    sec.paragraphs.insert(sec.paragraphs.begin(),
                          format_text("The section does not reach its plastic moment: the peak is %.3f Mp at θ = %.2f mrad, "
                                      "so it has no rotation capacity at Mp.",
                                      r.m_max / mp, 1e3 * r.theta_at_m_max));
  if (const std::string note = json_string(s, {"theta_p_note"}); !note.empty()) sec.paragraphs.push_back(note);
  return sec;
}

ReportSection section_section(const ReportInputs& in) {
  ReportSection sec = titled("Section and classification");
  std::string text;
  for (const std::string& l : in.hinge.description) text += l + "\n";
  sec.preformatted.push_back(text);
  return sec;
}

ReportSection model_section(const ReportInputs& in) {
  const json& s = in.summary;
  auto count = [&](const char* key) -> std::optional<double> {
    if (auto v = json_number(s, {"mesh", key})) return v;
    return json_number(s, {"solver", key});
  };
  auto count_text = [](const std::optional<double>& v) { return v ? format_text("%.0f", *v) : std::string("not available"); };
  ReportSection sec = titled("Model and solution");
  QuantityTable t;
  t.row("loading setup", identifier_words(json_string(s, {"input", "member", "setup"})));
  if (const auto l = json_number(s, {"input", "member", "length"})) t.row("member length", mm_text(*l));
  t.row("shell elements (4-node, corotational)", count_text(count("elements")));
  t.row("nodes", count_text(count("nodes")));
  t.row("free degrees of freedom", count_text(count("free_dofs")));
  const auto fe = json_number(s, {"mesh", "flange_elements"}) ? json_number(s, {"mesh", "flange_elements"})
                                                              : json_number(s, {"input", "mesh", "flange_elements"});
  const auto we = json_number(s, {"mesh", "web_elements"}) ? json_number(s, {"mesh", "web_elements"})
                                                           : json_number(s, {"input", "mesh", "web_elements"});
  if (fe && we) t.row("elements across a flange / the web", format_text("%.0f / %.0f", *fe, *we));
  const auto layers = json_number(s, {"mesh", "layers"}) ? json_number(s, {"mesh", "layers"})
                                                         : json_number(s, {"input", "mesh", "layers"});
  if (layers) t.row("integration layers through the thickness", format_text("%.0f (Simpson)", *layers));
  if (const auto steps = json_number(s, {"solver", "steps"})) t.row("converged load steps", format_text("%.0f", *steps));
  if (const auto it = json_number(s, {"solver", "iterations"})) t.row("Newton iterations (all steps)", format_text("%.0f", *it));
  if (const auto cb = json_number(s, {"solver", "cutbacks"})) t.row("step cut-backs", format_text("%.0f", *cb));
  t.row("path control", identifier_words(json_string(s, {"input", "analysis", "control"})));
  t.row("run stopped because", stop_reason_words(json_string(s, {"stop_reason"}), s.value("input", json::object())));
  if (const auto wall = json_number(s, {"solver", "wall_s"})) t.row("wall-clock time", format_text("%.0f s", *wall));
  sec.tables.push_back(t.table);
  return sec;
}

ReportSection imperfection_section(const ReportInputs& in) {
  const json imp = in.summary.value("imperfection", json::object());
  ReportSection sec = titled("Imperfection used");
  QuantityTable t;
  const std::string local = json_string(imp, {"local"});
  const bool mode_used = json_number(imp, {"mode"}).has_value();
  t.row("local imperfection", local.empty() ? "not recorded"
                              : local == "buckling_mode" && !mode_used
                                  ? "half-sine waves on the compression flange (no local buckling mode was found)"
                                  : identifier_words(local));
  if (mode_used) {
    t.row("buckling mode used", format_text("mode %.0f", *json_number(imp, {"mode"})) +
                                    (json_string(imp, {"mode_classification"}).empty()
                                         ? ""
                                         : ": " + identifier_words(json_string(imp, {"mode_classification"}))));
    if (const auto lf = json_number(imp, {"mode_load_factor"})) t.row("its buckling load factor", format_text("%.3g", *lf));
  }
  if (const auto a = json_number(imp, {"local_amplitude_mm"})) t.row("local amplitude", mm_text(*a, 2));
  if (const auto x = json_number(imp, {"buckle_x_mm"})) t.row("buckle position x (largest local distortion)", mm_text(*x));
  if (const auto g = json_number(imp, {"global_amplitude_mm"}))
    t.row("global lateral bow e0", *g > 0.0 ? mm_text(*g, 2) : "none");
  sec.tables.push_back(t.table);
  return sec;
}

ReportSection residual_stress_section(const ReportInputs& in) {
  const json rs = in.summary.value("residual_stress", json::object());
  ReportSection sec = titled("Residual stresses");
  const std::string pattern = json_string(rs, {"pattern"});
  if (pattern.empty() || pattern == "none") {
    sec.paragraphs.push_back("None: the model starts free of stress.");
    return sec;
  }
  QuantityTable t;
  t.row("pattern", identifier_words(pattern));
  if (const auto v = json_number(rs, {"peak_tension_MPa"})) t.row("peak tension", format_text("%.0f MPa", *v));
  if (const auto v = json_number(rs, {"peak_compression_MPa"})) t.row("peak compression", format_text("%.0f MPa", *v));
  if (const auto v = json_number(rs, {"equilibrium_displacement_mm"}))
    t.row("largest displacement of the equilibrium step", mm_text(*v, 3));
  sec.tables.push_back(t.table);
  if (const std::string d = json_string(rs, {"description"}); !d.empty()) sec.paragraphs.push_back(d);
  return sec;
}

ReportSection curve_section(const ReportInputs& in, const std::string& plot_svg) {
  const double mp = in.hinge.zone.plastic_moment, theta_p = in.laws.theta_p;
  ReportSection sec = titled("Moment-rotation curve");
  sec.figures.push_back(plot_svg);
  sec.page_break_before = true;
  sec.figure_captions.push_back(
      format_text("Moment M against hinge rotation θ. Bottom and left axes: θ / θp and M / Mp with the computed "
                  "θp = %.2f mrad and Mp = %.1f kNm; top and right axes: θ in mrad and M in kNm. The M axis starts "
                  "at the value shown, not at zero: below about 0.5 Mp the curve is the straight elastic line. "
                  "Law (a) is drawn dashed in black on top of the thin grey Mp line.",
                  1e3 * theta_p, mp / 1e6));
  return sec;
}

ReportSection laws_section(const ReportInputs& in) {
  ReportSection sec = titled("Simple hinge laws against the shell curve");
  const json jl = hinge_laws_json(in.laws, in.hinge.zone.plastic_moment).at("laws");
  ReportTable t;
  t.caption = "error = (M_shell − M_law) / M_law";
  t.header = {"law", "M_law at θ(M_max)", "error there", "M_law at θu", "error there", "shell 5 % below the law from",
              "note"};
  for (const HingeLawCurve& l : in.laws.laws) {
    const json& c = jl.at(l.key);
    std::string below = "-";
    if (!l.curve.empty())
      below = c.value("theta_first_below_5pct_mrad", json()).is_number()
                  ? mrad_text(c["theta_first_below_5pct_mrad"].get<double>())
                  : std::string("never");
    t.rows.push_back({{l.label, ""},
                      {kNm_or_dash(c.value("m_at_theta_at_m_max_kNm", json())), ""},
                      {error_text(c.value("error_at_theta_at_m_max", json())), ""},
                      {kNm_or_dash(c.value("m_at_theta_u_kNm", json())), ""},
                      {error_text(c.value("error_at_theta_u", json())), ""},
                      {below, l.key == "moment_curvature" ? "separation" : ""},
                      {l.note, ""}});
  }
  sec.tables.push_back(t);
  return sec;
}

ReportSection fitted_law_section(const ReportInputs& in) {
  const FittedHingeLaw& fit = in.laws.fitted;
  const double mp = in.hinge.zone.plastic_moment, theta_p = in.laws.theta_p;
  ReportSection sec = titled("Fitted multilinear hinge law (hinge_law.csv)");
  sec.paragraphs.push_back(format_text("Largest deviation from the shell curve %.1f %% of M (bound 3 %%): %s. Elastic branch "
                                 "before the first point: k_el = %.1f kNm/mrad (θp = %.2f mrad).",
                                 100.0 * fit.max_deviation, fit.within_bound ? "within the bound" : "OUTSIDE the bound",
                                 in.laws.k_el / 1e9, 1e3 * theta_p));
  ReportTable t;
  t.header = {"point", "kind", "plastic rotation", "M", "plastic rotation / θp", "M / Mp"};
  for (std::size_t k = 0; k < fit.points.size(); ++k) {
    const FittedLawPoint& q = fit.points[k];
    t.rows.push_back({{std::to_string(k), ""}, {identifier_words(q.kind), ""}, {mrad_text(1e3 * q.theta_plastic), ""},
                      {kNm_text(q.moment / 1e6), ""}, {format_text("%.2f", q.theta_plastic / theta_p), ""},
                      {ratio_text(q.moment / mp), ""}});
  }
  sec.tables.push_back(t);
  return sec;
}

ReportSection deformed_section(const ReportInputs& in) {
  const DeformedMesh& mesh = in.mesh;
  MeshPicture pic;
  pic.title = "Deformed hinge zone at the end of the run (true scale)";
  pic.field_name = "lateral displacement |uy| [mm]";
  for (std::size_t i = 0; i < mesh.nodes.size(); ++i) {
    pic.points.push_back({mesh.nodes[i][0] + mesh.displacement[i][0], mesh.nodes[i][1] + mesh.displacement[i][1],
                          mesh.nodes[i][2] + mesh.displacement[i][2]});
    pic.values.push_back(std::abs(mesh.displacement[i][1]));
  }
  pic.quads = mesh.quads;
  for (const SupportMarks& s : mesh.supports) pic.support_points.insert(pic.support_points.end(), s.points.begin(), s.points.end());
  for (const LoadMark& l : mesh.loads) pic.loads.push_back({l.point, l.force, l.moment});
  ReportSection sec = titled("Deformed hinge zone");
  sec.figures.push_back(render_mesh_svg(pic));
  sec.page_break_before = true;
  std::string caption =
      "Shell mesh at the last converged step, displacements at true scale, coloured by the lateral displacement "
      "|uy| in mm (local buckles and lateral deflection; colour map viridis, dark = small, yellow = large).";
  if (mesh.supports.empty() && mesh.loads.empty())
    caption += " Supports and loads are not marked: this results folder predates their record in final_state.json.";
  else {
    std::string groups;
    for (const SupportMarks& s : mesh.supports) {
      std::string fixed;
      for (const std::string& d : s.fixed) fixed += (fixed.empty() ? "" : " ") + d;
      groups += (groups.empty() ? "" : "; ") + identifier_words(s.group) + " (" + fixed + " held)";
    }
    caption += " Triangles: supported nodes — " + groups + ". Red arrows: the applied loads (directions only).";
  }
  sec.figure_captions.push_back(caption);
  return sec;
}

ReportSection inputs_section(const ReportInputs& in) {
  const json input = in.summary.value("input", json::object());
  struct Item {
    std::vector<std::string> path;
    const char* label;
    const char* unit;  // "" for none; "mrad" converts from rad
  };
  static const Item kItems[] = {
      {{"section", "designation"}, "section", ""},
      {{"section", "depth"}, "depth h", "mm"},
      {{"section", "flange_width"}, "flange width b", "mm"},
      {{"section", "flange_thickness"}, "flange thickness tf", "mm"},
      {{"section", "web_thickness"}, "web thickness tw", "mm"},
      {{"section", "root_radius"}, "root radius r", "mm"},
      {{"section", "weld_throat"}, "weld throat a", "mm"},
      {{"steel", "curve"}, "steel curve", ""},
      {{"steel", "E"}, "Young's modulus E", "MPa"},
      {{"steel", "fy"}, "yield strength fy", "MPa"},
      {{"steel", "fu"}, "tensile strength fu", "MPa"},
      {{"steel", "nu"}, "Poisson's ratio", "-"},
      {{"member", "setup"}, "loading setup", ""},
      {{"member", "length"}, "member length L", "mm"},
      {{"member", "axial_load_ratio"}, "axial load N / Npl", "-"},
      {{"imperfection", "local"}, "local imperfection", ""},
      {{"imperfection", "local_amplitude"}, "local amplitude (as given)", ""},
      {{"imperfection", "global_amplitude"}, "global bow (as given)", ""},
      {{"residual_stress", "pattern"}, "residual stresses", ""},
      {{"analysis", "control"}, "path control", ""},
      {{"analysis", "first_step"}, "first load step", "× reference load"},
      {{"analysis", "max_rotation"}, "rotation limit", "mrad"},
      {{"analysis", "stop_below"}, "stop when M falls below", "× M_max"},
      {{"analysis", "max_steps"}, "step budget", "steps"}};
  ReportSection sec = titled("Inputs");
  sec.paragraphs.push_back("The main values of the case file, defaults filled in; summary.json holds all of them under \"input\".");
  ReportTable t;
  t.header = {"input", "value"};
  for (const Item& it : kItems) {
    const json* v = &input;
    for (const std::string& k : it.path) v = v->is_object() && v->contains(k) ? &(*v)[k] : nullptr;
    if (v == nullptr || v->is_null()) continue;
    std::string text;
    const std::string unit = it.unit;
    if (v->is_string()) text = identifier_words(v->get<std::string>());
    else if (v->is_number() && unit == "mrad") text = mrad_text(1e3 * v->get<double>());
    else if (v->is_number() && unit == "mm") text = mm_text(v->get<double>());
    else if (v->is_number()) text = format_text("%g", v->get<double>()) + (unit.empty() || unit == "-" ? "" : " " + unit);
    else text = v->dump();
    if (v->is_number() && it.path.back() == "global_amplitude") text = v->get<double>() > 0 ? mm_text(v->get<double>(), 2) : "none";
    t.rows.push_back({{it.label, ""}, {text, ""}});
  }
  sec.tables.push_back(t);
  return sec;
}

}  // namespace rotcap::app
