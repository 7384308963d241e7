#include "app/analysis_common.hpp"

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

}  // namespace rotcap::app
