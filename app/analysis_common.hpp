#pragma once
// Pieces every path-following run of the app shares: the PathOptions of the case's [analysis]
// table, the arc-length constraint of its chosen form, and the element results of a ShellProblem's
// committed state for the VTK fields.
#include "app/field_export.hpp"
#include "io/case_input.hpp"
#include "solver/nonlinear/shell_problem.hpp"
#include "solver/path/path_follower.hpp"

#include <memory>

namespace rotcap::app {

PathOptions path_options(const AnalysisInput& analysis);
std::unique_ptr<StepConstraint> arc_length_constraint(const ShellProblem& problem, const AnalysisInput& analysis);
ElementResults snapshot_results(const ShellProblem& problem);

}  // namespace rotcap::app
