#pragma once
// The stages of a hinge-zone study that depend on the model's geometry rather than on the path
// following: imperfections (node offsets before the analysis), residual stresses (initial stresses
// in the layers), and the results that follow from the converged curve (extraction, failure mode,
// the plot). Each stage reports what it did in lines for the log and a JSON object for summary.json.
#include "app/hinge_case.hpp"
#include "io/case_input.hpp"
#include "solver/nonlinear/shell_problem.hpp"

#include <nlohmann/json.hpp>

#include <filesystem>
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
StageReport apply_residual_stresses(const CaseInput& input, const HingeCase& hinge, const ShellModel& model,
                                    ShellProblem& problem);

/// One converged point of the hinge curve.
struct HingePoint {
  int step = 0;
  double load_factor = 0.0;
  double moment = 0.0;     ///< [N mm]
  double rotation = 0.0;   ///< [rad]
  double max_plastic_strain = 0.0;
  int iterations = 0;
  int negative_pivots = 0;
};

/// The reported numbers from the converged curve (interpolated), the failure mode from the
/// deformation between the peak and the end, and curve.svg. u_peak / u_end: full displacement vectors.
StageReport report_hinge_results(const CaseInput& input, const HingeCase& hinge, const ShellModel& model,
                                 const std::vector<HingePoint>& curve, const Eigen::VectorXd& u_peak,
                                 const Eigen::VectorXd& u_end, const std::filesystem::path& folder);

/// theta_p = Mp / k_el from the curve's elastic start (the rule of the extraction).
double computed_theta_p(const HingeCase& hinge, const std::vector<HingePoint>& curve);

}  // namespace rotcap::app
