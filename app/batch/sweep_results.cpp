#include "app/batch/sweep_results.hpp"

#include "app/batch/csv_field.hpp"
#include "core/text_format.hpp"
#include "model/section/section_class.hpp"

#include <cmath>

namespace rotcap::app {

namespace {

std::string summary_text(const std::optional<nlohmann::json>& s, const std::string& key) {
  if (!s || !s->contains(key) || !(*s)[key].is_string()) return "";
  return (*s)[key].get<std::string>();
}

}  // namespace

const std::vector<std::string> kSummaryColumns = {
    "mp_kNm", "m_max_kNm", "m_max_over_mp", "theta_at_m_max_mrad", "theta_p_mrad", "theta_p_beam_mrad",
    "theta_u_mrad", "rotation_capacity", "rotation_capacity_is_lower_bound", "available_plastic_rotation_mrad"};

std::string results_number(const nlohmann::json& summary, const std::string& key) {
  if (!summary.contains(key)) return "";
  const nlohmann::json& v = summary[key];
  if (v.is_boolean()) return v.get<bool>() ? "true" : "false";
  if (!v.is_number()) return "";
  return format_text("%.6g", v.get<double>());
}

SweepRow sweep_row(const PlannedCase& planned, const std::filesystem::path& folder, const CaseOutcome& outcome) {
  SweepRow row;
  row.name = planned.name;
  row.folder = folder;
  for (const CaseOverride& o : planned.overrides) row.inputs.push_back(o.value.display);
  row.outcome = outcome;
  if (outcome.state == CaseState::done || outcome.state == CaseState::failed) row.summary = read_summary(folder);
  if (planned.input.kind == ModelKind::generated) {
    const SectionClassification c =
        classify_section(planned.input.zone.section, planned.input.steel.fy, planned.input.zone.axial_load_ratio);
    row.fy = planned.input.steel.fy;
    row.epsilon = c.epsilon;
    row.flange_c_over_t = c.flange.c_over_t;
    row.web_c_over_t = c.web.c_over_t;
    row.flange_class = c.flange.section_class;
    row.web_class = c.web.section_class;
    row.section_class = c.section_class;
  }
  return row;
}

std::string sweep_results_csv(const SweepPlan& plan, const std::vector<SweepRow>& rows) {
  std::string text = "case,state";
  for (const PlanAxis& a : plan.axes) text += "," + csv_field(a.key);
  for (const std::string& c : kSummaryColumns) text += "," + c;
  text += ",section_class,flange_class,web_class,flange_c_over_t,web_c_over_t,flange_c_over_t_eps,failure_mode,"
          "stop_reason,exit_code,reason,wall_s,folder\n";
  for (const SweepRow& r : rows) {
    text += csv_field(r.name) + "," + case_state_name(r.outcome.state);
    for (const std::string& v : r.inputs) text += "," + csv_field(v);
    for (const std::string& c : kSummaryColumns) text += "," + (r.summary ? results_number(*r.summary, c) : std::string());
    if (r.epsilon > 0.0)
      text += format_text(",%d,%d,%d,%.4g,%.4g,%.4g", r.section_class, r.flange_class, r.web_class, r.flange_c_over_t,
                          r.web_c_over_t, r.flange_c_over_t / r.epsilon);
    else
      text += ",,,,,,";
    text += "," + csv_field(summary_text(r.summary, "failure_mode")) + "," + csv_field(summary_text(r.summary, "stop_reason"));
    text += "," + (r.outcome.exit_code ? std::to_string(*r.outcome.exit_code) : std::string());
    text += "," + csv_field(r.outcome.reason);
    text += "," + (r.outcome.state == CaseState::done || r.outcome.state == CaseState::failed ? format_text("%.2f", r.outcome.wall_s)
                                                                                             : std::string());
    text += "," + csv_field("cases/" + r.folder.filename().string()) + "\n";
  }
  return text;
}

}  // namespace rotcap::app
