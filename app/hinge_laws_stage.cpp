#include "app/hinge_laws_stage.hpp"

#include "app/commands.hpp"
#include "app/sections.hpp"
#include "io/case_echo.hpp"
#include "io/input_error.hpp"
#include "io/report_html.hpp"
#include "io/svg_plot.hpp"
#include "model/laws/fitted_hinge_law.hpp"
#include "model/laws/hinge_laws.hpp"
#include "model/laws/moment_curvature.hpp"
#include "model/patterns/residual_stress.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <fstream>
#include <map>

namespace rotcap::app {

namespace fs = std::filesystem;
using nlohmann::json;

namespace {

std::string fmt(const char* f, double a, double b = 0.0) {
  char buf[256];
  std::snprintf(buf, sizeof buf, f, a, b);
  return buf;
}

json opt(const std::optional<double>& v, double scale = 1.0) { return v ? json(*v * scale) : json(nullptr); }

/// A law curve cut at theta_cut (linear interpolation at the cut).
std::vector<MomentRotationPoint> cut_at(const std::vector<MomentRotationPoint>& law, double theta_cut) {
  std::vector<MomentRotationPoint> out;
  for (std::size_t i = 0; i < law.size(); ++i) {
    if (law[i].theta <= theta_cut) {
      out.push_back(law[i]);
      continue;
    }
    if (i > 0) out.push_back({theta_cut, *law_moment_at(law, theta_cut)});
    break;
  }
  return out;
}

struct NamedLaw {
  std::string key, label, colour;
  LineDash dash;
  std::vector<MomentRotationPoint> curve;  // empty: not defined
  std::string note;
};

/// The shell's moment at theta_u (Mp where the falling branch crosses it, else the last point).
double shell_moment_at_theta_u(const HingeCurveResult& r, const std::vector<MomentRotationPoint>& pts) {
  return r.status == HingeCurveStatus::falls_back_to_mp ? r.mp : pts.back().moment;
}

json compare(const NamedLaw& law, const std::vector<MomentRotationPoint>& pts, const HingeCurveResult& r,
             double theta_p) {
  json j{{"label", law.label}, {"defined", !law.curve.empty()}, {"note", law.note}};
  if (law.curve.empty()) return j;
  const std::optional<double> m_peak = law_moment_at(law.curve, r.theta_at_m_max);
  j["m_at_theta_at_m_max_kNm"] = opt(m_peak, 1e-6);
  j["error_at_theta_at_m_max"] = m_peak ? json((r.m_max - *m_peak) / *m_peak) : json(nullptr);
  if (r.theta_u) {
    const std::optional<double> m_u = law_moment_at(law.curve, *r.theta_u);
    j["m_at_theta_u_kNm"] = opt(m_u, 1e-6);
    j["error_at_theta_u"] = m_u ? json((shell_moment_at_theta_u(r, pts) - *m_u) / *m_u) : json(nullptr);
  } else {
    j["m_at_theta_u_kNm"] = nullptr;
    j["error_at_theta_u"] = nullptr;
  }
  LawComparisonOptions co;
  co.fraction = 0.05;
  // (a), (b) have a sharp knee at theta_p that a real section rounds off: compared from 2 theta_p;
  // (c) is smooth and compared from theta_p.
  const double from = law.key == "moment_curvature" ? 1.0 : 2.0;
  co.from_theta = from * theta_p;
  const std::optional<double> below = theta_first_below_law(pts, law.curve, co);
  j["theta_first_below_5pct_mrad"] = opt(below, 1e3);
  j["theta_first_below_5pct_over_theta_p"] = opt(below, 1.0 / theta_p);
  j["compared_from_theta_over_theta_p"] = from;
  // Largest |M_shell - M_law| / Mp over the shell points with theta <= 5 theta_p inside the law's range.
  double worst = 0.0;
  for (const MomentRotationPoint& p : pts)
    if (p.theta <= 5.0 * theta_p)
      if (const auto m = law_moment_at(law.curve, p.theta)) worst = std::max(worst, std::abs(p.moment - *m) / r.mp);
  j["max_difference_over_mp_up_to_5_theta_p"] = worst;
  j["law_end_theta_mrad"] = 1e3 * law.curve.back().theta;
  return j;
}

std::string num_text(const json& v, const char* f, double scale = 1.0) {
  if (v.is_number()) return fmt(f, v.get<double>() * scale);
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

DeformedMesh deformed_mesh(const ShellModel& model, const Eigen::VectorXd& u) {
  DeformedMesh m;
  std::map<int, int> renumber;
  for (const auto& e : model.elements) {
    std::array<int, 4> q{};
    for (int a = 0; a < 4; ++a) {
      const int n = e.nodes[a];
      auto it = renumber.find(n);
      if (it == renumber.end()) {
        it = renumber.emplace(n, static_cast<int>(m.nodes.size())).first;
        m.nodes.push_back({model.nodes[n].x(), model.nodes[n].y(), model.nodes[n].z()});
        const bool has_u = u.size() >= kDofsPerNode * (n + 1);
        m.displacement.push_back({has_u ? u[kDofsPerNode * n] : 0.0, has_u ? u[kDofsPerNode * n + 1] : 0.0,
                                  has_u ? u[kDofsPerNode * n + 2] : 0.0});
      }
      q[a] = it->second;
    }
    m.quads.push_back(q);
  }
  return m;
}

void write_final_state(const DeformedMesh& mesh, const fs::path& file) {
  json j{{"nodes", mesh.nodes}, {"quads", mesh.quads}, {"displacement", mesh.displacement},
         {"units", "mm"}, {"note", "deformed mesh at the end of the run: shell nodes used by elements, renumbered"}};
  std::ofstream out(file);
  if (!out) throw OutputError(file, "cannot create");
  out << j.dump() << "\n";
  if (!out) throw OutputError(file, "cannot write");
}

DeformedMesh read_final_state(const fs::path& file) {
  std::ifstream in(file);
  if (!in) throw InputError(file, 0, "final_state.json", "no such file", "the final_state.json a run writes");
  DeformedMesh m;
  try {
    const json j = json::parse(in);
    m.nodes = j.at("nodes").get<std::vector<std::array<double, 3>>>();
    m.quads = j.at("quads").get<std::vector<std::array<int, 4>>>();
    m.displacement = j.at("displacement").get<std::vector<std::array<double, 3>>>();
  } catch (const json::exception& e) {
    throw InputError(file, 0, "final_state.json", e.what(), "nodes, quads and displacement arrays");
  }
  if (m.displacement.size() != m.nodes.size())
    throw InputError(file, 0, "displacement", "a different count than nodes", "one displacement per node");
  return m;
}

StageReport report_hinge_laws(const CaseInput& input, const HingeCase& hinge, const std::vector<HingePoint>& curve,
                              const DeformedMesh& mesh, const json& summary, const fs::path& folder) {
  StageReport report;
  const double mp = hinge.zone.plastic_moment;
  std::vector<MomentRotationPoint> pts;
  for (const HingePoint& p : curve) pts.push_back({p.rotation, p.moment});
  const HingeCurveResult r = extract_hinge_curve(pts, mp, hinge.mel, hinge.theta_p_beam);
  const double k_el = r.k_el.value_or(mp / hinge.theta_p_beam);
  const double theta_p = mp / k_el;
  // Laws (a), (b) are drawn and compared over the shell run and a margin beyond it.
  const double theta_last = std::max(1.5 * pts.back().theta, 2.0 * theta_p);
  const double E = input.steel.E;
  const ISection& s = hinge.section;
  // 1. The laws.
  std::vector<NamedLaw> laws;
  laws.push_back({"elastic_perfectly_plastic", "(a) elastic-perfectly plastic at Mp", "#555555", LineDash::dashed,
                  elastic_perfectly_plastic_law(mp, k_el, theta_last), "theta = M / k_el (k_el of the shell curve) up to Mp"});
  std::optional<MomentCurvatureCurve> mk;
  std::optional<HardeningHingeLaw> hh;
  if (input.steel.curve != SteelCurve::elastic) {
    const HardeningCurve hc = hardening_curve(steel_model(input.steel));
    const UniaxialFibreLaw fibre = UniaxialFibreLaw::from_hardening_curve(E, hc.points());
    const double shear_span = hinge.zone.setup == HingeSetup::four_point ? hinge.zone.shear_span : 0.0;
    HardeningHingeInput hi{hinge.zone.setup, hinge.zone.span, shear_span, mp, E * hinge.zone.plate.Iy, E,
                           fibre.hardening_modulus(), fibre.hardening_onset_strain(), 0.5 * (s.h - s.tf), k_el};
    hh = linear_hardening_hinge(hi, theta_last);
    laws.push_back({"linear_hardening", "(b) linear strain-hardening hinge", "#1a9850", LineDash::dash_dot,
                    hh->defined ? hh->curve : std::vector<MomentRotationPoint>{}, hh->reason});
    ResidualStressPattern pattern;
    if (input.residual_stress != ResidualPattern::none)
      pattern = ResidualStressPattern(input.residual_stress == ResidualPattern::hot_rolled ? ResidualStressKind::hot_rolled
                                                                                           : ResidualStressKind::welded,
                                      s, input.steel.fy.value_or(0.0));
    MomentCurvatureOptions mo;
    mo.axial_force = -hinge.zone.axial_force;
    mk = moment_curvature(plate_model_fibres(s, pattern), fibre, mo);
    // The integration is beam theory (no shear deformation, rigid support); its elastic part is
    // matched to the shell's measured slope: theta = theta_int + M (1/k_el - 1/k_beam), k_beam = Mp / theta_p_beam.
    std::vector<MomentRotationPoint> integrated = integrate_member_rotation(*mk, hinge.zone.setup, hinge.zone.span, shear_span);
    const double extra_compliance = 1.0 / k_el - hinge.theta_p_beam / mp;
    for (MomentRotationPoint& p : integrated) p.theta += p.moment * extra_compliance;
    laws.push_back({"moment_curvature", "(c) moment-curvature integration", "#d95f02", LineDash::solid, integrated,
                    mk->message + fmt("; elastic compliance matched to the shell (k_el / k_beam = %.4f)", k_el * hinge.theta_p_beam / mp) + (pattern.kind() == ResidualStressKind::none ? "" : "; residual stresses: " + pattern.description())});
  }
  // 2. The fitted multilinear law.
  const FittedHingeLaw fit = fit_hinge_law(pts, mp, k_el);
  report.log.push_back(fit.message);
  // 3. The comparison.
  json jl = json::object();
  for (const NamedLaw& l : laws) {
    jl[l.key] = compare(l, pts, r, theta_p);
    const json& c = jl[l.key];
    if (!l.curve.empty())
      report.log.push_back(l.label + ": M_law at theta(M_max) " + num_text(c["m_at_theta_at_m_max_kNm"], "%.2f kNm") +
                           ", shell falls 5 % below it at " + num_text(c["theta_first_below_5pct_mrad"], "%.2f mrad") +
                           (c["theta_first_below_5pct_mrad"].is_null() ? " (never)" : ""));
    else
      report.log.push_back(l.label + ": " + l.note);
  }
  if (hh) {
    jl["linear_hardening"]["slope_kNm_per_mrad"] = hh->defined ? json(hh->slope / 1e9) : json(nullptr);
    jl["linear_hardening"]["slope_over_k_el"] = hh->defined ? json(hh->slope_ratio) : json(nullptr);
  }
  if (mk) {
    jl["moment_curvature"]["first_yield_moment_kNm"] = mk->first_yield_moment / 1e6;
    jl["moment_curvature"]["peak_moment_kNm"] = mk->peak_moment / 1e6;
    jl["moment_curvature"]["section"] = "plate model (centre-line flanges and web, no fillets)";
  }
  json jf{{"points", json::array()}, {"max_deviation", fit.max_deviation}, {"bound", 0.03},
          {"within_bound", fit.within_bound}, {"points_checked", fit.points_checked},
          {"theta_plastic_at_max_deviation_mrad", 1e3 * fit.theta_plastic_at_max_deviation},
          {"k_el_kNm_per_mrad", k_el / 1e9}, {"rule", "elastic limit, Douglas-Peucker (tolerance 0.025 of M), peak kept"},
          {"message", fit.message}};
  for (const FittedLawPoint& q : fit.points)
    jf["points"].push_back({{"kind", q.kind}, {"theta_plastic_mrad", 1e3 * q.theta_plastic}, {"moment_kNm", q.moment / 1e6},
                            {"m_over_mp", q.moment / mp}, {"theta_plastic_over_theta_p", q.theta_plastic / theta_p}});
  report.json["laws"] = jl;
  report.json["fitted_law"] = jf;
  // 4. hinge_law.csv.
  {
    std::ofstream csv(folder / "hinge_law.csv");
    if (!csv) throw OutputError(folder / "hinge_law.csv", "cannot create");
    csv << "point,kind,theta_plastic_mrad,moment_kNm,theta_plastic_over_theta_p,m_over_mp\n";
    int k = 0;
    for (const FittedLawPoint& q : fit.points) {
      char line[256];
      std::snprintf(line, sizeof line, "%d,%s,%.10g,%.10g,%.10g,%.10g\n", k++, q.kind.c_str(), 1e3 * q.theta_plastic,
                    q.moment / 1e6, q.theta_plastic / theta_p, q.moment / mp);
      csv << line;
    }
  }
  // 5. curve.svg with the laws.
  LinePlot plot;
  plot.options.title = input.title.empty() ? "Moment-rotation curve" : input.title;
  plot.options.x_label = "theta / theta_p";
  plot.options.y_label = "M / Mp";
  PlotSeries shell;
  shell.name = "shell model (rotcap)";
  shell.colour = "#1b4f9c";
  shell.line_width = 2.4;
  for (const auto& p : pts) {
    shell.x.push_back(p.theta / theta_p);
    shell.y.push_back(p.moment / mp);
  }
  plot.series.push_back(shell);
  auto add = [&](const std::string& name, const std::string& colour, LineDash dash, MarkerShape marker,
                 const std::vector<MomentRotationPoint>& c) {
    PlotSeries ps;
    ps.name = name;
    ps.colour = colour;
    ps.dash = dash;
    ps.marker = marker;
    ps.line_width = 1.6;
    for (const auto& p : cut_at(c, 1.1 * pts.back().theta)) {
      ps.x.push_back(p.theta / theta_p);
      ps.y.push_back(p.moment / mp);
    }
    plot.series.push_back(ps);
  };
  for (const NamedLaw& l : laws)
    if (!l.curve.empty()) add(l.label, l.colour, l.dash, MarkerShape::none, l.curve);
  add("fitted multilinear law", "#7b3294", LineDash::dotted, MarkerShape::square, fitted_law_curve(fit, k_el));
  plot.reference_lines.push_back({LineOrientation::horizontal, 1.0, "Mp", "#555555", LineDash::dashed});
  plot.point_labels.push_back({r.theta_at_m_max / theta_p, r.m_max / mp, fmt("peak %.3f Mp", r.m_max / mp), "#b00000", MarkerShape::circle});
  if (r.theta_u)
    plot.point_labels.push_back({*r.theta_u / theta_p, 1.0,
                                 r.rotation_capacity_is_lower_bound ? fmt("end of run (R >= %.2f)", *r.rotation_capacity)
                                                                    : fmt("theta_u, R = %.2f", *r.rotation_capacity),
                                 "#0050b0", MarkerShape::diamond});
  write_svg(plot, folder / "curve.svg");
  // 6. report.html.
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
    row("Mp (plate model) [kNm]", fmt("%.2f", mp / 1e6), "mp");
    row("Mel [kNm]", fmt("%.2f", hinge.mel / 1e6));
    row("M_max [kNm]", fmt("%.2f", r.m_max / 1e6), "m-max");
    row("M_max / Mp", fmt("%.4f", r.m_max / mp), "m-max-over-mp");
    row("theta at M_max [mrad]", fmt("%.2f", 1e3 * r.theta_at_m_max));
    row("theta_p (computed) [mrad]", fmt("%.3f", 1e3 * theta_p));
    row("theta_p (beam theory) [mrad]", fmt("%.3f", 1e3 * hinge.theta_p_beam));
    row("theta_u [mrad]", r.theta_u ? fmt("%.2f", 1e3 * *r.theta_u) : "-");
    row("rotation capacity R", r.rotation_capacity ? fmt("%.2f", *r.rotation_capacity) : "none (M_max < Mp)", "rotation-capacity");
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
    for (const NamedLaw& l : laws) {
      const json& c = jl[l.key];
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
                      fmt("Elastic branch before the first point: k_el = %.4g kNm/mrad (theta_p = %.3f mrad).", k_el / 1e9, 1e3 * theta_p)},
                      {}, {}, {}};
    ReportTable t;
    t.header = {"point", "kind", "theta_plastic [mrad]", "M [kNm]", "theta_plastic / theta_p", "M / Mp"};
    for (std::size_t k = 0; k < fit.points.size(); ++k) {
      const FittedLawPoint& q = fit.points[k];
      t.rows.push_back({{std::to_string(k), ""}, {q.kind, ""}, {fmt("%.3f", 1e3 * q.theta_plastic), ""},
                        {fmt("%.2f", q.moment / 1e6), ""}, {fmt("%.3f", q.theta_plastic / theta_p), ""},
                        {fmt("%.4f", q.moment / mp), ""}});
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
  return report;
}

}  // namespace rotcap::app
