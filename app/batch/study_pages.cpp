#include "app/batch/study_pages.hpp"

#include "app/commands.hpp"
#include "core/text_format.hpp"
#include "io/report_html.hpp"
#include "io/svg_plot.hpp"

#include <fstream>
#include <sstream>

namespace rotcap::app {

namespace {

/// Two columns of a curve.csv by name (empty when the file or a column is missing).
std::pair<std::vector<double>, std::vector<double>> curve_columns(const std::filesystem::path& file, const std::string& x_name,
                                                                  const std::string& y_name) {
  std::ifstream in(file);
  std::string line;
  if (!in || !std::getline(in, line)) return {};
  std::vector<std::string> header;
  std::stringstream hs(line);
  for (std::string cell; std::getline(hs, cell, ',');) header.push_back(cell);
  const auto column = [&](const std::string& name) {
    for (std::size_t i = 0; i < header.size(); ++i)
      if (header[i] == name) return static_cast<long>(i);
    return -1L;
  };
  const long ix = column(x_name), iy = column(y_name);
  if (ix < 0 || iy < 0) return {};
  std::vector<double> x, y;
  while (std::getline(in, line)) {
    std::vector<std::string> cells;
    std::stringstream rs(line);
    for (std::string cell; std::getline(rs, cell, ',');) cells.push_back(cell);
    if (static_cast<long>(cells.size()) <= std::max(ix, iy)) continue;
    x.push_back(std::strtod(cells[ix].c_str(), nullptr));
    y.push_back(std::strtod(cells[iy].c_str(), nullptr));
  }
  return {x, y};
}

std::string value_or_dash(const std::optional<double>& v, const char* format) {
  return v ? format_text(format, *v) : std::string("-");
}

std::string band_text(const Band& b, const char* format) {
  if (!b.min) return "-";
  return format_text(format, *b.min) + " .. " + format_text(format, *b.max) + format_text(" (%d variants)", b.count);
}

}  // namespace

void write_study_pages(const std::filesystem::path& case_file, const StudyResult& study, const std::filesystem::path& folder) {
  LinePlot plot;
  plot.options.title = "Moment-rotation curves of the variants";
  plot.options.x_label = "hinge rotation theta [mrad]";
  plot.options.y_label = "M / Mp";
  plot.options.width = 860;
  plot.options.height = 540;
  for (const VariantResult& v : study.variants) {
    auto [x, y] = curve_columns(v.folder / "curve.csv", "rotation_mrad", "m_over_mp");
    if (x.empty()) continue;
    PlotSeries s;
    s.name = v.variant.name;
    s.x = std::move(x);
    s.y = std::move(y);
    s.line_width = v.variant.name == "base" ? 3.0 : 1.4;
    if (v.variant.name == "base") s.colour = "#111111";
    plot.series.push_back(std::move(s));
  }
  plot.reference_lines.push_back({LineOrientation::horizontal, 1.0, "Mp", "#555555", LineDash::dashed, 1.2});
  write_svg(plot, folder / "study_curves.svg");

  ReportPage page;
  page.title = "rotcap study: " + case_file.filename().string();
  page.subtitle = "the case and its variants (mesh, step, imperfection amplitude, mode, sign and shape)";
  page.facts = {{"case file", case_file.string()}, {"variants", std::to_string(study.variants.size())}};
  page.caution = kCaution;
  ReportSection result;
  result.heading = "Rotation capacity as a band";
  result.boxed = true;
  result.paragraphs = {study.r_statement, study.mesh.text, study.step.text,
                       "One R without its band misleads: R moves with the mesh, the step and the shape, amplitude and sign "
                       "of the local imperfection. Design with the lowest R of the band unless a variant is known not to apply."};
  ReportTable bands;
  bands.header = {"quantity", "band (min .. max)"};
  bands.rows = {{{"M_max [kNm]", ""}, {band_text(study.m_max_kNm, "%.1f"), ""}},
                {{"theta at M_max [mrad]", ""}, {band_text(study.theta_at_m_max_mrad, "%.2f"), ""}},
                {{"theta_u [mrad]", ""}, {band_text(study.theta_u_mrad, "%.2f"), ""}},
                {{"R", ""}, {band_text(study.r, "%.2f"), ""}}};
  result.tables.push_back(std::move(bands));
  page.sections.push_back(std::move(result));
  ReportSection table;
  table.heading = "Variants";
  table.paragraphs.push_back("Each name links to the variant's own report; study.csv holds the same rows with more digits and "
                             "the inputs each run echoed in its summary.json.");
  ReportTable t;
  t.header = {"variant", "what changes", "state", "M_max [kNm]", "M_max / Mp", "theta at M_max [mrad]", "theta_u [mrad]", "R",
              "stop reason or failure"};
  for (const VariantResult& v : study.variants) {
    const bool has_report = std::filesystem::exists(v.folder / "report.html");
    t.row_links.push_back(has_report ? "cases/" + v.folder.filename().string() + "/report.html" : std::string());
    t.rows.push_back({{v.variant.name, ""},
                      {v.variant.description, ""},
                      {case_state_name(v.outcome.state), ""},
                      {value_or_dash(v.m_max_kNm, "%.1f"), ""},
                      {value_or_dash(v.m_max_over_mp, "%.3f"), ""},
                      {value_or_dash(v.theta_at_m_max_mrad, "%.2f"), ""},
                      {value_or_dash(v.theta_u_mrad, "%.2f"), ""},
                      {value_or_dash(v.r, "%.2f") + (v.r && v.r_is_lower_bound ? " (lower bound)" : ""), ""},
                      {v.outcome.reason, ""}});
  }
  table.tables.push_back(std::move(t));
  table.figures.push_back(render_svg(plot));
  page.sections.push_back(std::move(table));
  write_report_html(page, folder / "report.html");
}

}  // namespace rotcap::app
