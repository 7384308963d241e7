#pragma once
// The rows of a sweep's results.csv: one per case, its inputs (the plan's axis values), the
// results of its own summary.json (so every row equals what `rotcap run` printed for that case),
// the EN 1993-1-1 classification of its flange and web (model/section/section_class.hpp, as
// `rotcap check` prints it) and how the case ended.
#include "app/batch/case_folder.hpp"
#include "io/sweep_plan.hpp"

#include <filesystem>
#include <optional>
#include <string>
#include <vector>

namespace rotcap::app {

struct SweepRow {
  std::string name;
  std::filesystem::path folder;
  std::vector<std::string> inputs;        ///< the axis values, in axis order (as displayed)
  CaseOutcome outcome;
  std::optional<nlohmann::json> summary;  ///< the case's summary.json
  double fy = 0.0;
  double epsilon = 0.0;                   ///< sqrt(235 / fy)
  double flange_c_over_t = 0.0, web_c_over_t = 0.0;
  int flange_class = 0, web_class = 0, section_class = 0;
};

/// The result columns taken from summary.json, in order (numbers printed with %.6g, R and its
/// bound flag as given, null as an empty field).
extern const std::vector<std::string> kSummaryColumns;

SweepRow sweep_row(const PlannedCase& planned, const std::filesystem::path& folder, const CaseOutcome& outcome);

/// results.csv: case, state, the axis keys, kSummaryColumns, section_class, flange_class,
/// web_class, flange_c_over_t, web_c_over_t, flange_c_over_t_eps, failure_mode, stop_reason,
/// exit_code, reason, wall_s, folder.
std::string sweep_results_csv(const SweepPlan& plan, const std::vector<SweepRow>& rows);

/// A summary number as results.csv prints it ("%.6g"; "" for null or absent).
std::string results_number(const nlohmann::json& summary, const std::string& key);

}  // namespace rotcap::app
