#include "app/analysis_common.hpp"

#include "app/commands.hpp"
#include "app/logging.hpp"

namespace rotcap::app {

PathOptions path_options(const AnalysisInput& a) {
  PathOptions o;
  o.force_tolerance = a.force_tolerance;
  o.displacement_tolerance = a.displacement_tolerance;
  o.max_iterations = a.max_iterations;
  o.first_step = a.first_step;
  o.min_step_ratio = a.min_step_ratio;
  o.max_step_ratio = a.max_step_ratio;
  o.target_iterations = a.target_iterations;
  o.max_steps = a.max_steps;
  return o;
}

std::unique_ptr<StepConstraint> arc_length_constraint(const ShellProblem& problem, const AnalysisInput& a) {
  return std::make_unique<ArcLength>(problem.arc_length_weights(), a.arc_length_form == rotcap::ArcLengthForm::normal_plane
                                                                       ? ArcLength::Form::NormalPlane
                                                                       : ArcLength::Form::Cylindrical);
}

ElementResults snapshot_results(const ShellProblem& problem) {
  ElementResults r;
  for (ElementSnapshot& s : problem.snapshot()) {
    r.resultants.push_back(s.resultants);
    r.surfaces.push_back(s.surfaces);
  }
  return r;
}

nlohmann::json solver_summary(const PathSummary& ps, const ShellProblem& problem, const ShellModel& model,
                              double wall) {
  return {{"steps", ps.steps}, {"iterations", ps.iterations}, {"cutbacks", ps.cutbacks},
          {"iterations_per_step", ps.steps ? double(ps.iterations) / ps.steps : 0.0},
          {"factorisations", problem.factorisations()}, {"assembly_s", problem.assembly_seconds()},
          {"factorisation_s", problem.factorisation_seconds()},
          {"indefinite_factorisations", problem.indefinite_factorisations()},
          {"indefinite_factorisation_s", problem.indefinite_factorisation_seconds()}, {"wall_s", wall}, {"free_dofs", problem.size()},
          {"nodes", model.node_count()}, {"elements", model.element_count()}};
}

int finish_path(const PathSummary& ps, const std::string& stop_reason, double wall) {
  log_info("stopped: " + stop_reason + " (" + ps.message + "); " + std::to_string(ps.steps) + " steps, " +
           std::to_string(ps.iterations) + " iterations, " + std::to_string(ps.cutbacks) + " cut-backs, " +
           std::to_string(wall) + " s");
  const bool early = ps.status == PathStatus::StepTooSmall || ps.status == PathStatus::EvaluationFailed;
  return early ? kExitStoppedEarly : kExitOk;
}

}  // namespace rotcap::app
