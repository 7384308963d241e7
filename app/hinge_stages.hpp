#pragma once
// The stages of a hinge-zone study before the path following: imperfections (node offsets before
// the analysis) and residual stresses (initial stresses in the layers). Each stage reports what it
// did in lines for the log and a JSON object for summary.json.
#include "app/hinge_case.hpp"
#include "io/case_input.hpp"
#include "solver/nonlinear/shell_problem.hpp"

#include <nlohmann/json.hpp>

#include <string>
#include <vector>

namespace rotcap::app {

struct StageReport {
  std::vector<std::string> log;
  nlohmann::json json = nlohmann::json::object();
};

/// Adds the case's imperfections to the nodes of `model` (a copy of the perfect hinge-zone model):
/// the local pattern (buckling mode or half-sine) and the global bow. Linear buckling of the
/// perfect model is run here for "buckling_mode".
StageReport apply_imperfections(const CaseInput& input, const HingeCase& hinge, ShellModel& model, int threads);

/// Sets the case's residual stresses as initial stresses of every layer point of the problem.
StageReport apply_residual_stresses(const CaseInput& input, const HingeCase& hinge, ShellProblem& problem);

}  // namespace rotcap::app
