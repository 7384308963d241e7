#pragma once
// Pieces every path-following run of the app shares: the PathOptions of the case's [analysis]
// table, the arc-length constraint of its chosen form, and the element results of a ShellProblem's
// committed state for the VTK fields.
#include "app/field_export.hpp"
#include "io/case_input.hpp"
#include "solver/nonlinear/shell_problem.hpp"
#include "solver/path/path_follower.hpp"

#include <nlohmann/json.hpp>

#include <memory>
#include <string>

namespace rotcap::app {

PathOptions path_options(const AnalysisInput& analysis);
std::unique_ptr<StepConstraint> arc_length_constraint(const ShellProblem& problem, const AnalysisInput& analysis);
ElementResults snapshot_results(const ShellProblem& problem);
/// summary.json's "solver" object of a finished path.
nlohmann::json solver_summary(const PathSummary& path, const ShellProblem& problem, const ShellModel& model,
                              double wall_seconds);
/// Logs the closing line of a path and returns the exit code it calls for (3 when it stopped early).
int finish_path(const PathSummary& path, const std::string& stop_reason, double wall_seconds);

}  // namespace rotcap::app
