#include "app/hinge_law_outputs.hpp"

#include "app/report_words.hpp"
#include "core/text_format.hpp"
#include "io/input_error.hpp"

#include <cmath>
#include <fstream>

namespace rotcap::app {

namespace fs = std::filesystem;
using nlohmann::json;

namespace {

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

json comparison_json(const HingeLawCurve& law, const HingeLawComparison& c, double theta_p) {
  json j{{"label", law.label}, {"defined", c.defined}, {"note", law.note}};
  if (!c.defined) return j;
  j["m_at_theta_at_m_max_kNm"] = opt(c.m_at_theta_at_m_max, 1e-6);
  j["error_at_theta_at_m_max"] = opt(c.error_at_theta_at_m_max);
  j["m_at_theta_u_kNm"] = opt(c.m_at_theta_u, 1e-6);
  j["error_at_theta_u"] = opt(c.error_at_theta_u);
  j["theta_first_below_5pct_mrad"] = opt(c.theta_first_below_5pct, 1e3);
  j["theta_first_below_5pct_over_theta_p"] = opt(c.theta_first_below_5pct, 1.0 / theta_p);
  j["compared_from_theta_over_theta_p"] = c.compared_from_theta_over_theta_p;
  j["max_difference_over_mp_up_to_5_theta_p"] = c.max_difference_over_mp_up_to_5_theta_p;
  j["law_end_theta_mrad"] = 1e3 * c.law_end_theta;
  return j;
}

struct LawStyle {
  const char* colour;
  LineDash dash;
};

LawStyle style_of(const std::string& key) {
  if (key == "elastic_perfectly_plastic") return {"#111111", LineDash::dashed};
  if (key == "linear_hardening") return {"#1a9850", LineDash::dash_dot};
  return {"#d95f02", LineDash::solid};
}

void write_fitted_law_csv(const FittedHingeLaw& fit, double mp, double theta_p, const fs::path& file) {
  std::ofstream csv(file);
  if (!csv) throw OutputError(file, "cannot create");
  csv << "point,kind,theta_plastic_mrad,moment_kNm,theta_plastic_over_theta_p,m_over_mp\n";
  int k = 0;
  for (const FittedLawPoint& q : fit.points)
    csv << format_text("%d,%s,%.10g,%.10g,%.10g,%.10g\n", k++, q.kind.c_str(), 1e3 * q.theta_plastic, q.moment / 1e6,
                       q.theta_plastic / theta_p, q.moment / mp);
}

}  // namespace

json hinge_laws_json(const HingeLawSet& set, double mp) {
  json jl = json::object();
  for (std::size_t i = 0; i < set.laws.size(); ++i)
    jl[set.laws[i].key] = comparison_json(set.laws[i], set.comparisons[i], set.theta_p);
  if (const auto& hh = set.hardening) {
    jl["linear_hardening"]["slope_kNm_per_mrad"] = hh->defined ? json(hh->slope / 1e9) : json(nullptr);
    jl["linear_hardening"]["slope_over_k_el"] = hh->defined ? json(hh->slope_ratio) : json(nullptr);
  }
  if (const auto& mk = set.moment_curvature) {
    jl["moment_curvature"]["first_yield_moment_kNm"] = mk->first_yield_moment / 1e6;
    jl["moment_curvature"]["peak_moment_kNm"] = mk->peak_moment / 1e6;
    jl["moment_curvature"]["section"] = "plate model (centre-line flanges and web, no fillets)";
  }
  const FittedHingeLaw& fit = set.fitted;
  json jf{{"points", json::array()}, {"max_deviation", fit.max_deviation}, {"bound", 0.03},
          {"within_bound", fit.within_bound}, {"points_checked", fit.points_checked},
          {"theta_plastic_at_max_deviation_mrad", 1e3 * fit.theta_plastic_at_max_deviation},
          {"k_el_kNm_per_mrad", set.k_el / 1e9}, {"rule", "elastic limit, Douglas-Peucker (tolerance 0.025 of M), peak kept"},
          {"message", fit.message}};
  for (const FittedLawPoint& q : fit.points)
    jf["points"].push_back({{"kind", q.kind}, {"theta_plastic_mrad", 1e3 * q.theta_plastic}, {"moment_kNm", q.moment / 1e6},
                            {"m_over_mp", q.moment / mp}, {"theta_plastic_over_theta_p", q.theta_plastic / set.theta_p}});
  return {{"laws", jl}, {"fitted_law", jf}};
}

LinePlot hinge_curve_plot(const std::string& title, const std::vector<MomentRotationPoint>& pts,
                          const HingeCurveResult& r, const HingeLawSet& set, double mp, const json& summary) {
  const double theta_p = set.theta_p;
  const double theta_p_mrad = 1e3 * theta_p, mp_kNm = mp / 1e6;
  LinePlot plot;
  plot.options.title = title.empty() ? "Moment-rotation curve" : title;
  plot.options.x_label = "θ / θp  (θp = " + mrad_text(theta_p_mrad) + ", computed)";
  plot.options.y_label = "M / Mp  (Mp = " + kNm_text(mp_kNm) + ")";
  plot.options.x2 = SecondaryAxis{theta_p_mrad, "θ [mrad]"};
  plot.options.y2 = SecondaryAxis{mp_kNm, "M [kNm]"};
  plot.options.height = 500;
  plot.options.target_ticks = 8;  // M/Mp ticks 0.1 apart over the zoomed range
  PlotSeries shell;
  shell.name = "shell model (rotcap)";
  shell.colour = "#1b4f9c";
  shell.line_width = 2.4;
  for (const auto& p : pts) {
    shell.x.push_back(p.theta / theta_p);
    shell.y.push_back(p.moment / mp);
  }
  auto law_series = [&](const std::string& name, const std::string& colour, LineDash dash, MarkerShape marker,
                        double width, const std::vector<MomentRotationPoint>& c) {
    PlotSeries ps;
    ps.name = name;
    ps.colour = colour;
    ps.dash = dash;
    ps.marker = marker;
    ps.line_width = width;
    for (const auto& p : cut_at(c, 1.1 * pts.back().theta)) {
      ps.x.push_back(p.theta / theta_p);
      ps.y.push_back(p.moment / mp);
    }
    return ps;
  };
  // Drawing order: the shell first, then the laws; law (a) last, so that its dashes stay visible
  // where it runs along the (thin, light) Mp line and over the other curves.
  plot.series.push_back(shell);
  std::optional<PlotSeries> law_a;
  for (const HingeLawCurve& l : set.laws) {
    if (l.curve.empty()) continue;
    const LawStyle st = style_of(l.key);
    const bool a = l.key == "elastic_perfectly_plastic";
    PlotSeries ps = law_series(l.label, st.colour, st.dash, MarkerShape::none, a ? 2.0 : 1.6, l.curve);
    if (a) law_a = ps;
    else plot.series.push_back(ps);
  }
  plot.series.push_back(law_series("fitted multilinear law", "#7b3294", LineDash::dotted, MarkerShape::square, 1.6,
                                   fitted_law_curve(set.fitted, set.k_el)));
  if (law_a) plot.series.push_back(*law_a);
  ReferenceLine mp_line{LineOrientation::horizontal, 1.0, "Mp", "#b0b0b0", LineDash::solid};
  mp_line.line_width = 1.0;
  plot.reference_lines.push_back(mp_line);
  // The y range: from the lower of 0.5 Mp and 0.05 Mp below the lowest shell moment after the peak
  // (so the falling branch is always inside), to 0.05 Mp above the highest drawn moment (and at
  // least 1.05 Mp, so the Mp line is never on the frame). Below 0.5 Mp the curve is the straight
  // elastic line, whose slope the theta_p of the x label gives; the zoom spends the height on the
  // peak, the plateau and the fall, where the answer is.
  double low = 0.5, high = 1.0;
  bool after_peak = false;
  for (const auto& p : pts) {
    after_peak |= p.theta >= r.theta_at_m_max;
    if (after_peak) low = std::min(low, p.moment / mp - 0.05);
  }
  for (const PlotSeries& ps : plot.series)
    for (double y : ps.y)
      if (std::isfinite(y)) high = std::max(high, y);
  plot.options.y_min = std::max(0.0, std::floor(10.0 * low + 1e-9) / 10.0);
  plot.options.y_max = std::ceil(20.0 * (high + 0.05) - 1e-9) / 20.0;
  plot.options.x_min = 0.0;
  plot.point_labels.push_back({r.theta_at_m_max / theta_p, r.m_max / mp,
                               "peak " + kNm_text(r.m_max / 1e6) + format_text(" = %.3f Mp", r.m_max / mp),
                               "#b00000", MarkerShape::circle});
  if (r.theta_u)
    plot.point_labels.push_back({*r.theta_u / theta_p, 1.0,
                                 r.rotation_capacity_is_lower_bound
                                     ? format_text("end of run: R ≥ %.2f", *r.rotation_capacity)
                                     : "θu = " + mrad_text(1e3 * *r.theta_u) + format_text(", R = %.2f", *r.rotation_capacity),
                                 "#0050b0", MarkerShape::diamond});
  // The rotation demand: the theta at which theta_u would just meet it.
  if (const auto needed = json_number(summary, {"demand", "required_theta_u_mrad"})) {
    const std::string verdict = json_string(summary, {"demand", "verdict"});
    plot.reference_lines.push_back({LineOrientation::vertical, *needed / theta_p_mrad,
                                    "demand: θu ≥ " + mrad_text(*needed) + (verdict.empty() ? "" : " (" + verdict + ")"),
                                    "#a6611a", LineDash::dash_dot});
  }
  return plot;
}

// title, shell and extraction are kept in the signature for the callers; curve.svg, which used them,
// is now written with report.html (app/hinge_report_page.hpp).
StageReport write_hinge_law_outputs([[maybe_unused]] const std::string& title,
                                    [[maybe_unused]] const std::vector<MomentRotationPoint>& shell,
                                    [[maybe_unused]] const HingeCurveResult& r, const HingeLawSet& set, double mp,
                                    const fs::path& folder) {
  StageReport report;
  report.log.push_back(set.fitted.message);
  report.json = hinge_laws_json(set, mp);
  for (std::size_t i = 0; i < set.laws.size(); ++i) {
    const HingeLawCurve& l = set.laws[i];
    const HingeLawComparison& c = set.comparisons[i];
    if (l.curve.empty()) {
      report.log.push_back(l.label + ": " + l.note);
      continue;
    }
    report.log.push_back(
        l.label + ": M_law at theta(M_max) " +
        (c.m_at_theta_at_m_max ? format_text("%.2f kNm", *c.m_at_theta_at_m_max * 1e-6) : std::string("-")) +
        ", shell falls 5 % below it at " +
        (c.theta_first_below_5pct ? format_text("%.2f mrad", *c.theta_first_below_5pct * 1e3) : "- (never)"));
  }
  write_fitted_law_csv(set.fitted, mp, set.theta_p, folder / "hinge_law.csv");
  return report;
}

}  // namespace rotcap::app
