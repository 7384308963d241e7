#include "app/hinge_report_page.hpp"

#include "app/commands.hpp"
#include "app/hinge_law_outputs.hpp"
#include "app/hinge_report_sections.hpp"
#include "app/logging.hpp"
#include "app/report_pdf.hpp"
#include "app/report_words.hpp"
#include "core/text_format.hpp"
#include "io/report_html.hpp"

namespace rotcap::app {

using nlohmann::json;
namespace fs = std::filesystem;

namespace {

/// The files of a results folder the page may name, with what each holds; only those present.
ReportSection files_section(const fs::path& folder, bool pdf_expected) {
  static const std::pair<const char*, const char*> kFiles[] = {
      {"summary.json", "every reported number and the full case input, defaults filled in"},
      {"curve.csv", "the moment-rotation curve, one row per converged step"},
      {"curve.svg", "the plot above"},
      {"hinge_law.csv", "the fitted multilinear hinge law"},
      {"final_state.json", "the deformed mesh at the end, with supports and loads (redraws the picture)"},
      {"fields.pvd", "displacement, stress and plastic-strain fields for a VTK viewer"},
      {"run.log", "the log of the run"}};
  ReportSection sec;
  sec.heading = "Files in this results folder";
  ReportTable t;
  t.header = {"file", "holds"};
  for (const auto& [name, what] : kFiles)
    if (fs::exists(folder / name) || std::string(name) == "curve.svg") t.rows.push_back({{name, ""}, {what, ""}});
  if (pdf_expected) t.rows.push_back({{"report.pdf", ""}, {"this page, printed (A4)", ""}});
  sec.tables.push_back(t);
  return sec;
}

std::vector<std::pair<std::string, std::string>> header_facts(const CaseInput& input, const json& summary) {
  std::vector<std::pair<std::string, std::string>> facts;
  const std::string name = json_string(summary, {"program", "name"}), version = json_string(summary, {"program", "version"});
  facts.emplace_back("program", (name.empty() ? std::string("rotcap") : name) + (version.empty() ? "" : " " + version));
  if (const std::string date = json_string(summary, {"program", "run_date"}); !date.empty())
    facts.emplace_back("run", date_words(date));
  std::string file = json_string(summary, {"input", "file"});
  if (file.empty()) file = input.file.string();
  if (!file.empty()) facts.emplace_back("case file", file);
  return facts;
}

}  // namespace

void write_hinge_report(const CaseInput& input, const HingeCase& hinge, const std::vector<MomentRotationPoint>& pts,
                        const HingeCurveResult& r, const HingeLawSet& set, const DeformedMesh& mesh,
                        const json& summary, const fs::path& folder) {
  const ReportInputs in{input, hinge, pts, r, set, mesh, summary};
  const LinePlot plot = hinge_curve_plot(input.title, pts, r, set, hinge.zone.plastic_moment, summary);
  write_svg(plot, folder / "curve.svg");
  const bool pdf_expected = pdf_printer().has_value();
  ReportPage page;
  page.title = input.title.empty() ? "Plastic hinge: moment-rotation report" : input.title;
  page.subtitle = "Moment-rotation capacity of a steel I-beam plastic hinge from a nonlinear shell model";
  page.facts = header_facts(input, summary);
  page.caution = kCaution;
  page.sections.push_back(result_section(in));
  page.sections.push_back(section_section(in));
  page.sections.push_back(model_section(in));
  page.sections.push_back(imperfection_section(in));
  page.sections.push_back(residual_stress_section(in));
  page.sections.push_back(curve_section(in, render_svg(plot)));
  page.sections.push_back(laws_section(in));
  page.sections.push_back(fitted_law_section(in));
  if (!mesh.quads.empty()) page.sections.push_back(deformed_section(in));
  page.sections.push_back(inputs_section(in));
  page.sections.push_back(files_section(folder, pdf_expected));
  write_report_html(page, folder / "report.html");
  const PdfResult pdf = print_report_pdf(folder / "report.html", folder / "report.pdf");
  if (pdf.status == PdfResult::Status::failed) log_warn(pdf.message);
  else log_info(pdf.message);
}

}  // namespace rotcap::app
