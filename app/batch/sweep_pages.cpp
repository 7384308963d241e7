#include "app/batch/sweep_pages.hpp"

#include "app/commands.hpp"
#include "core/text_format.hpp"
#include "io/report_html.hpp"
#include "io/svg_plot.hpp"

#include <cmath>
#include <limits>

namespace rotcap::app {

namespace {

constexpr double kNaN = std::numeric_limits<double>::quiet_NaN();

std::optional<double> summary_number(const SweepRow& r, const char* key) {
  if (!r.summary || !r.summary->contains(key) || !(*r.summary)[key].is_number()) return std::nullopt;
  return (*r.summary)[key].get<double>();
}

bool one_grade(const std::vector<SweepRow>& rows) {
  for (const SweepRow& r : rows)
    if (r.epsilon > 0.0 && r.fy != rows.front().fy) return false;
  return true;
}

/// One scatter plot of a summary quantity against the flange c/t (see the header).
LinePlot flange_plot(const std::vector<SweepRow>& rows, const char* key, const std::string& y_label, const std::string& title) {
  const bool single = one_grade(rows);
  const double eps = rows.empty() ? 1.0 : rows.front().epsilon;
  LinePlot plot;
  plot.options.title = title;
  plot.options.x_label = single ? "flange outstand c/t" : "flange outstand c/(t eps), eps = sqrt(235/fy)";
  plot.options.y_label = y_label;
  plot.options.legend = LegendPlacement::none;
  PlotSeries points;
  points.name = "cases";
  points.marker = MarkerShape::circle;
  points.colour = "#1b4f9c";
  for (const SweepRow& r : rows) {
    const std::optional<double> y = summary_number(r, key);
    if (!y || r.epsilon <= 0.0) continue;
    const double x = single ? r.flange_c_over_t : r.flange_c_over_t / r.epsilon;
    points.x.insert(points.x.end(), {x, kNaN});
    points.y.insert(points.y.end(), {*y, kNaN});
    plot.point_labels.push_back({x, *y, r.name.substr(0, r.name.find('_')), "#111111", MarkerShape::none});
  }
  plot.series.push_back(points);
  const double limits[3] = {9.0, 10.0, 14.0};
  for (int k = 0; k < 3; ++k) {
    ReferenceLine line;
    line.orientation = LineOrientation::vertical;
    line.value = single && eps > 0.0 ? limits[k] * eps : limits[k];
    line.label = format_text("class %d: %g eps", k + 1, limits[k]) + (k == 0 ? " (EN 1993-1-1:2005, Table 5.2)" : "");
    plot.reference_lines.push_back(line);
  }
  return plot;
}

std::string cell_number(const SweepRow& r, const char* key, const char* format) {
  const std::optional<double> v = summary_number(r, key);
  return v ? format_text(format, *v) : std::string("-");
}

}  // namespace

void write_sweep_pages(const SweepPlan& plan, const std::vector<SweepRow>& rows, const std::filesystem::path& folder) {
  const LinePlot r_plot = flange_plot(rows, "rotation_capacity", "rotation capacity R", "R against the flange slenderness");
  const LinePlot m_plot = flange_plot(rows, "m_max_over_mp", "M_max / Mp", "M_max / Mp against the flange slenderness");
  write_svg(r_plot, folder / "r_vs_flange_ct.svg");
  write_svg(m_plot, folder / "m_max_vs_flange_ct.svg");

  ReportPage page;
  page.title = plan.title.empty() ? "rotcap sweep" : plan.title;
  page.subtitle = "sweep over " + std::to_string(rows.size()) + " cases";
  int done = 0, failed = 0;
  for (const SweepRow& r : rows) {
    done += r.outcome.state == CaseState::done;
    failed += r.outcome.state == CaseState::failed;
  }
  page.facts = {{"plan", plan.file.string()}, {"base case", plan.base_file.string()},
                {"combine", plan.combine == PlanCombine::grid ? "grid" : "zip"},
                {"cases", format_text("%d done, %d failed, %zu not run", done, failed, rows.size() - done - failed)}};
  page.caution = kCaution;
  ReportSection table_section;
  table_section.heading = "Cases";
  table_section.paragraphs.push_back("Each case's name links to its own report; results.csv holds every number of this "
                                     "table with more digits, and each case folder its case.toml to rerun it by hand.");
  ReportTable t;
  t.header = {"case", "state"};
  for (const PlanAxis& a : plan.axes) t.header.push_back(a.key);
  for (const char* h : {"flange c/t", "class (flange, web)", "Mp [kNm]", "M_max / Mp", "theta_p [mrad]", "theta_u [mrad]", "R",
                        "failure mode", "stop reason or failure"})
    t.header.push_back(h);
  for (const SweepRow& r : rows) {
    std::vector<ReportCell> row;
    const bool has_report = std::filesystem::exists(r.folder / "report.html");
    row.push_back({r.name, ""});
    t.row_links.push_back(has_report ? "cases/" + r.folder.filename().string() + "/report.html" : std::string());
    row.push_back({case_state_name(r.outcome.state), ""});
    for (const std::string& v : r.inputs) row.push_back({v, ""});
    row.push_back({r.epsilon > 0.0 ? format_text("%.2f", r.flange_c_over_t) : "-", ""});
    row.push_back({r.epsilon > 0.0 ? format_text("%d (%d, %d)", r.section_class, r.flange_class, r.web_class) : "-", ""});
    row.push_back({cell_number(r, "mp_kNm", "%.1f"), ""});
    row.push_back({cell_number(r, "m_max_over_mp", "%.3f"), ""});
    row.push_back({cell_number(r, "theta_p_mrad", "%.2f"), ""});
    row.push_back({cell_number(r, "theta_u_mrad", "%.2f"), ""});
    row.push_back({cell_number(r, "rotation_capacity", "%.2f"), ""});
    row.push_back({r.summary ? r.summary->value("failure_mode", "-") : "-", ""});
    row.push_back({r.outcome.reason, ""});
    t.rows.push_back(std::move(row));
  }
  table_section.tables.push_back(std::move(t));
  page.sections.push_back(std::move(table_section));
  ReportSection plots;
  plots.heading = "Against the flange slenderness";
  plots.paragraphs.push_back("Vertical lines: the c/t limits of an outstand flange in compression for Classes 1, 2 and 3, "
                             "9, 10 and 14 eps with eps = sqrt(235/fy) (EN 1993-1-1:2005, Table 5.2). Points are labelled "
                             "with the case number.");
  plots.figures = {render_svg(r_plot), render_svg(m_plot)};
  page.sections.push_back(std::move(plots));
  write_report_html(page, folder / "index.html");
}

}  // namespace rotcap::app
