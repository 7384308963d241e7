#include "app/path_run.hpp"

#include "app/commands.hpp"
#include "app/interrupt.hpp"
#include "app/logging.hpp"
#include "core/check.hpp"
#include "elements/kernel_dispatch.hpp"
#include "solver/dof_map.hpp"

#include <memory>

namespace rotcap::app {

namespace {

std::unique_ptr<StepConstraint> make_constraint(const ShellProblem& problem, const PathRunSetup& setup) {
  switch (setup.control) {
    case Control::load: return std::make_unique<LoadControl>();
    case Control::displacement:
      ROTCAP_CHECK(setup.controlled.has_value(), "displacement control without a controlled quantity");
      return std::make_unique<DisplacementControl>(free_dof_weights(*setup.controlled, problem.dofs()));
    case Control::arc_length: return std::make_unique<ArcLength>(problem.arc_length_weights(), setup.arc_length_form);
    case Control::linear: break;
  }
  ROTCAP_CHECK(false, "control \"linear\" is not a path control");
  return nullptr;
}

}  // namespace

PathRunResult run_path(ShellProblem& problem, const ShellModel& model, RunRecorder& recorder,
                       const PathRunSetup& setup, const StepHandler& on_step) {
  const std::unique_ptr<StepConstraint> constraint = make_constraint(problem, setup);
  PathRunResult result;
  std::optional<std::string> stop;
  PathFollower follower(problem, *constraint, setup.options);
  if (setup.controlled) follower.set_curve_monitor(free_dof_weights(*setup.controlled, problem.dofs()));
  auto observer = [&](const ConvergedStep& step) {
    const Eigen::VectorXd u = problem.displacements();
    StepRecord record = on_step(step, u);
    recorder.add_row(record.row);
    log_info(record.progress);
    result.last_step = step.step;
    if (recorder.fields_due(step.step) && !recorder.has_fields(step.step))  // skips the snapshot too
      recorder.write_fields(step.step, step.load_factor, model, u, snapshot_results(problem));
    stop = std::move(record.stop_reason);
    if (!stop && interrupt_requested()) stop = std::string(kInterrupted);
    if (setup.checkpoint && (stop || step.step % setup.checkpoint_every == 0))
      write_run_checkpoint(*setup.checkpoint, problem, follower.state(), recorder, stop.value_or(""));
    return !stop.has_value();
  };
  log_info(setup.description + " (" + enum_name(setup.control) + "), " + std::to_string(problem.size()) +
           " free DOFs");
  if (setup.resume_from && setup.checkpoint && setup.checkpoint->finish_only) {
    const PathState& s = *setup.resume_from;
    result.last_step = s.steps;
    result.path = {PathStatus::Completed, "stop criterion met", s.steps, s.iterations, s.cutbacks, s.load_factor};
    stop = *setup.checkpoint->finish_only;
    log_info("resume: the run had met its stop criterion at step " + std::to_string(s.steps) +
             " (" + *stop + "); writing its outputs");
  } else if (setup.resume_from) {
    result.last_step = setup.resume_from->steps;
    result.path = follower.resume(observer, *setup.resume_from);
  } else {
    result.path = follower.run(observer);
  }
  if (!recorder.has_fields(result.last_step))  // skips the snapshot too
    recorder.write_fields(result.last_step, result.path.load_factor, model, problem.displacements(),
                          snapshot_results(problem));
  if (result.path.status != PathStatus::Completed)
    result.stop_reason = to_string(result.path.status);
  else if (stop)
    result.stop_reason = *stop;
  else if (!setup.landed_reason.empty() && result.path.message.rfind("landed", 0) == 0)
    result.stop_reason = setup.landed_reason;
  else
    result.stop_reason = "completed";
  return result;
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
          {"nodes", model.node_count()}, {"elements", model.element_count()},
          {"kernel", kernel_name(active_kernel())}};  // the element tangent kernels' flavour
}

int finish_path(const PathSummary& ps, const std::string& stop_reason, double wall) {
  log_info("stopped: " + stop_reason + " (" + ps.message + "); " + std::to_string(ps.steps) + " steps, " +
           std::to_string(ps.iterations) + " iterations, " + std::to_string(ps.cutbacks) + " cut-backs, " +
           std::to_string(wall) + " s; " + std::to_string(ps.residual_only_evaluations) +
           " iterates evaluated without tangent (" + std::to_string(ps.repeated_evaluations) + " of them again with it)");
  const bool early = ps.status == PathStatus::StepTooSmall || ps.status == PathStatus::EvaluationFailed ||
                     stop_reason == kInterrupted;
  return early ? kExitStoppedEarly : kExitOk;
}

}  // namespace rotcap::app
