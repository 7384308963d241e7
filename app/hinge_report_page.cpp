#include "app/hinge_report_page.hpp"

#include "app/commands.hpp"
#include "app/hinge_law_outputs.hpp"
#include "core/text_format.hpp"
#include "io/case_echo.hpp"
#include "io/report_html.hpp"

namespace rotcap::app {

using nlohmann::json;

namespace {

std::string num_text(const json& v, const char* f, double scale = 1.0) {
  if (v.is_number()) return format_text(f, v.get<double>() * scale);
  if (v.is_boolean()) return v.get<bool>() ? "true" : "false";
  if (v.is_string()) return v.get<std::string>();
  return "-";
}

void flatten(const json& j, const std::string& prefix, std::vector<std::pair<std::string, std::string>>& out) {
  if (j.is_object()) {
    for (auto it = j.begin(); it != j.end(); ++it) flatten(it.value(), prefix.empty() ? it.key() : prefix + "." + it.key(), out);
  } else {
    out.emplace_back(prefix, j.is_string() ? j.get<std::string>() : j.dump());
  }
}

ReportTable key_value_table(const std::string& caption, const std::vector<std::pair<std::string, std::string>>& kv) {
  ReportTable t;
  t.caption = caption;
  t.header = {"key", "value"};
  for (const auto& [k, v] : kv) t.rows.push_back({{k, ""}, {v, ""}});
  return t;
}

}  // namespace

void write_hinge_report(const CaseInput& input, const HingeCase& hinge, const std::vector<MomentRotationPoint>& pts,
                        const HingeCurveResult& r, const HingeLawSet& set, const DeformedMesh& mesh,
                        const json& summary, const std::filesystem::path& folder) {
  const double mp = hinge.zone.plastic_moment;
  const double theta_p = set.theta_p;
  const double k_el = set.k_el;
  const FittedHingeLaw& fit = set.fitted;
  const json jl = hinge_laws_json(set, mp).at("laws");
  const LinePlot plot = hinge_curve_plot(input.title, pts, r, set, mp);
  ReportPage page;
  page.title = input.title.empty() ? "rotcap hinge-zone report" : input.title;
  page.subtitle = "Plastic-hinge moment-rotation analysis by nonlinear shell model (rotcap); units mm, N, MPa, kNm, mrad";
  page.caution = kCaution;
  {
    ReportSection sec{"Inputs", {}, {}, {}, {}};
    std::vector<std::pair<std::string, std::string>> kv;
    flatten(summary.contains("input") ? summary.at("input") : to_json(input), "", kv);
    sec.tables.push_back(key_value_table("case file (defaults filled in)", kv));
    page.sections.push_back(sec);
  }
  {
    ReportSection sec{"Section and classification", {}, {}, {}, {}};
    std::string text;
    for (const std::string& l : hinge.description) text += l + "\n";
    sec.preformatted.push_back(text);
    page.sections.push_back(sec);
  }
  {
    ReportSection sec{"Results", {}, {}, {}, {}};
    ReportTable t;
    t.caption = "reported numbers (interface.md definitions)";
    t.header = {"quantity", "value"};
    auto row = [&](const std::string& name, const std::string& value, const std::string& id = "") {
      t.rows.push_back({{name, ""}, {value, id}});
    };
    row("Mp (plate model) [kNm]", format_text("%.2f", mp / 1e6), "mp");
    row("Mel [kNm]", format_text("%.2f", hinge.mel / 1e6));
    row("M_max [kNm]", format_text("%.2f", r.m_max / 1e6), "m-max");
    row("M_max / Mp", format_text("%.4f", r.m_max / mp), "m-max-over-mp");
    row("theta at M_max [mrad]", format_text("%.2f", 1e3 * r.theta_at_m_max));
    row("theta_p (computed) [mrad]", format_text("%.3f", 1e3 * theta_p));
    row("theta_p (beam theory) [mrad]", format_text("%.3f", 1e3 * hinge.theta_p_beam));
    row("theta_u [mrad]", r.theta_u ? format_text("%.2f", 1e3 * *r.theta_u) : "-");
    row("rotation capacity R", r.rotation_capacity ? format_text("%.2f", *r.rotation_capacity) : "none (M_max < Mp)", "rotation-capacity");
    row("R is a lower bound", r.rotation_capacity_is_lower_bound ? "yes (the run stopped before M fell back to Mp)" : "no");
    row("section class (EN 1993-1-1 Table 5.2)", std::to_string(hinge.classification.section_class));
    row("failure mode", summary.value("failure_mode", std::string("-")));
    row("stop reason", summary.value("stop_reason", std::string("-")));
    sec.tables.push_back(t);
    sec.paragraphs.push_back(r.message);
    page.sections.push_back(sec);
  }
  {
    ReportSection sec{"Moment-rotation curve and simple hinge laws", {}, {}, {render_svg(plot)}, {}};
    ReportTable t;
    t.caption = "laws against the shell curve (error = (M_shell - M_law) / M_law)";
    t.header = {"law", "M at theta(M_max) [kNm]", "error there", "M at theta_u [kNm]", "error there",
                "shell 5 % below from [mrad]", "note"};
    for (const HingeLawCurve& l : set.laws) {
      const json& c = jl.at(l.key);
      t.rows.push_back({{l.label, ""},
                        {num_text(c.value("m_at_theta_at_m_max_kNm", json()), "%.2f"), ""},
                        {num_text(c.value("error_at_theta_at_m_max", json()), "%+.1f %%", 100.0), ""},
                        {num_text(c.value("m_at_theta_u_kNm", json()), "%.2f"), ""},
                        {num_text(c.value("error_at_theta_u", json()), "%+.1f %%", 100.0), ""},
                        {l.curve.empty() ? "-" : c["theta_first_below_5pct_mrad"].is_null() ? "never" : num_text(c["theta_first_below_5pct_mrad"], "%.2f"),
                         l.key == "moment_curvature" ? "separation" : ""},
                        {l.note, ""}});
    }
    sec.tables.push_back(t);
    page.sections.push_back(sec);
  }
  {
    ReportSection sec{"Fitted multilinear hinge law (hinge_law.csv)", {fit.message,
                      format_text("Elastic branch before the first point: k_el = %.4g kNm/mrad (theta_p = %.3f mrad).", k_el / 1e9, 1e3 * theta_p)},
                      {}, {}, {}};
    ReportTable t;
    t.header = {"point", "kind", "theta_plastic [mrad]", "M [kNm]", "theta_plastic / theta_p", "M / Mp"};
    for (std::size_t k = 0; k < fit.points.size(); ++k) {
      const FittedLawPoint& q = fit.points[k];
      t.rows.push_back({{std::to_string(k), ""}, {q.kind, ""}, {format_text("%.3f", 1e3 * q.theta_plastic), ""},
                        {format_text("%.2f", q.moment / 1e6), ""}, {format_text("%.3f", q.theta_plastic / theta_p), ""},
                        {format_text("%.4f", q.moment / mp), ""}});
    }
    sec.tables.push_back(t);
    page.sections.push_back(sec);
  }
  if (!mesh.quads.empty()) {
    MeshPicture pic;
    pic.title = "deformed hinge zone at the end of the run (true scale)";
    pic.field_name = "|uy| [mm]";
    for (std::size_t i = 0; i < mesh.nodes.size(); ++i) {
      pic.points.push_back({mesh.nodes[i][0] + mesh.displacement[i][0], mesh.nodes[i][1] + mesh.displacement[i][1],
                            mesh.nodes[i][2] + mesh.displacement[i][2]});
      pic.values.push_back(std::abs(mesh.displacement[i][1]));
    }
    pic.quads = mesh.quads;
    ReportSection sec{"Deformed hinge zone", {"Shell mesh at the last converged step, displacements at true scale, "
                                              "coloured by the lateral displacement |uy| (local buckles and lateral deflection)."},
                      {}, {render_mesh_svg(pic)}, {}};
    page.sections.push_back(sec);
  }
  write_report_html(page, folder / "report.html");
}

}  // namespace rotcap::app
