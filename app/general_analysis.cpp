#include "app/general_analysis.hpp"

#include "app/path_run.hpp"
#include "app/commands.hpp"
#include "app/logging.hpp"
#include "app/run_recorder.hpp"
#include "core/text_format.hpp"
#include "elements/kernel_dispatch.hpp"
#include "io/case_echo.hpp"
#include "io/input_error.hpp"
#include "solver/linear_static.hpp"
#include "solver/nonlinear/shell_problem.hpp"
#include "solver/dof_map.hpp"
#include "solver/path/path_follower.hpp"
#include "solver/section_assignment.hpp"

#include <chrono>
#include <cmath>
#include <cstdio>
#include <memory>

namespace rotcap::app {

namespace fs = std::filesystem;

namespace {

/// The recorded curve columns as DOF combinations (group means), built once per run.
std::vector<DofCombination> recorded_means(const CaseInput& input, const ShellModel& model) {
  std::vector<DofCombination> out;
  for (const GroupDof& g : input.analysis.record_dofs) out.push_back(group_mean(model, g.group, g.dof));
  return out;
}

std::vector<std::string> curve_columns(const CaseInput& input) {
  std::vector<std::string> c{"step", "load_factor"};
  for (const GroupDof& m : input.analysis.record_dofs) c.push_back(std::string(dof_name(m.dof)) + "@" + m.group);
  c.insert(c.end(), {"max_plastic_strain", "iterations", "negative_pivots"});
  return c;
}

ElementResults linear_results(const ShellModel& model, const SectionAssignment& sections,
                              const std::vector<ShellQ4Resultants>& resultants) {
  ElementResults r;
  r.resultants = resultants;
  r.surfaces.resize(resultants.size());
  for (int e = 0; e < model.element_count(); ++e)
    for (int gp = 0; gp < 4; ++gp) r.surfaces[e][gp] = sections.of(e).surfaces(resultants[e].g[gp], {});
  return r;
}

nlohmann::json model_size(const ShellModel& model, int free_dofs) {
  return {{"nodes", model.node_count()}, {"elements", model.element_count()},
          {"dofs", model.dof_count()}, {"free_dofs", free_dofs}};
}

}  // namespace

int run_general_linear(const CaseInput& input, const ShellModel& model, const fs::path& folder, int threads) {
  const SectionAssignment sections = SectionAssignment::for_steel(model, input.steel, input.layers, true);
  LinearStaticOptions options;
  options.threads = threads;
  log_info("linear static solve: " + std::to_string(model.node_count()) + " nodes, " +
           std::to_string(model.element_count()) + " shells");
  const LinearStaticResult result = solve_linear_static(model, sections, options);
  RunRecorder recorder(folder, curve_columns(input), input.output.fields_every);
  nlohmann::json summary{{"title", input.title}, {"program", program_json()}, {"input", to_json(input)},
                         {"caution", kCaution}};
  summary["model"] = model_size(model, result.statistics.free_dofs);
  if (!result.ok()) {
    summary["stop_reason"] = linear_static_status_name(result.status);
    summary["message"] = result.message;
    recorder.write_summary(summary);
    log_error("linear solve failed: " + result.message);
    return kExitStoppedEarly;
  }
  const Eigen::VectorXd zero = Eigen::VectorXd::Zero(model.dof_count());
  const std::vector<DofCombination> means = recorded_means(input, model);
  for (int step = 0; step <= 1; ++step) {
    const Eigen::VectorXd& u = step == 0 ? zero : result.displacements;
    std::vector<double> row{double(step), double(step)};
    for (const DofCombination& c : means) row.push_back(c.value(u));
    row.insert(row.end(), {0.0, double(step), 0.0});
    recorder.add_row(row);
  }
  recorder.write_fields(0, 0.0, model, zero, ElementResults{});
  recorder.write_fields(1, 1.0, model, result.displacements, linear_results(model, sections, result.resultants));
  const auto& s = result.statistics;
  double max_translation = 0.0;
  for (int n = 0; n < model.node_count(); ++n)
    max_translation = std::max(max_translation, result.displacements.segment<3>(kDofsPerNode * n).norm());
  summary["stop_reason"] = "completed";
  summary["max_translation_mm"] = max_translation;
  summary["recorded_dofs"] = nlohmann::json::object();
  for (const GroupDof& m : input.analysis.record_dofs)
    summary["recorded_dofs"][std::string(dof_name(m.dof)) + "@" + m.group] =
        group_mean(model, m.group, m.dof).value(result.displacements);
  summary["residual_relative"] = result.backward_error;
  summary["solver"] = {{"factor_nonzeros", s.factor_nonzeros}, {"assembly_s", s.assembly_seconds},
                       {"analysis_s", s.analysis_seconds}, {"factorisation_s", s.factorization_seconds},
                       {"solve_s", s.solve_seconds}, {"kernel", kernel_name(active_kernel())}};
  recorder.write_summary(summary);
  log_info("largest translation " + std::to_string(max_translation) + " mm; fields in " +
           (folder / "fields.pvd").string());
  return kExitOk;
}

int run_general_path(const CaseInput& input, const ShellModel& model, const fs::path& folder, int threads,
                     RunCheckpoint& checkpoint) {
  const auto t_start = std::chrono::steady_clock::now();
  const AnalysisInput& a = input.analysis;
  const SectionAssignment sections = SectionAssignment::for_steel(model, input.steel, input.layers, false);
  ShellProblemOptions po;
  po.threads = threads;
  ShellProblem problem(model, sections, po);
  // 1. The control and its limits.
  PathRunSetup setup;
  setup.control = a.control;
  setup.options = a.path;
  setup.arc_length_form = a.arc_length_form;
  setup.landed_reason = "reached the load or displacement limit";
  setup.description = "path following";
  if (a.control == Control::load) setup.options.max_load_factor = a.max_load_factor.value_or(1.0);
  if (a.control_dof) setup.controlled = group_mean(model, a.control_dof->group, a.control_dof->dof);
  const std::vector<DofCombination> means = recorded_means(input, model);
  if (a.control == Control::displacement) {
    int held = 0;
    free_dof_weights(*setup.controlled, problem.dofs(), &held);
    if (held > 0)
      throw InputError(input.file, a.control_dof->line, "analysis.control_dof",
                       std::string(dof_name(a.control_dof->dof)) + " of a node of group '" + a.control_dof->group +
                           "' held by a support",
                       "a free DOF to control");
    if (a.max_displacement) setup.options.max_control_value = *a.max_displacement;
  }
  if (a.max_load_factor && a.control != Control::load) setup.options.max_load_factor = *a.max_load_factor;
  // 2. The recorder and the unloaded state as step 0 (or the state of the checkpoint to resume).
  if (input.output.checkpoint_every == 0) checkpoint.file.clear();
  double lambda_max = 0.0;
  std::optional<RunRecorder> recorder_store;
  if (checkpoint.resume_from) {
    setup.resume_from = restore_path_run(problem, *checkpoint.resume_from);
    lambda_max = checkpoint.resume_from->scalar("general.lambda_max");
    recorder_store.emplace(folder, curve_columns(input), input.output.fields_every,
                           recorder_continuation(*checkpoint.resume_from));
    log_info(format_text("resuming at step %d (load factor %.6g)", setup.resume_from ? setup.resume_from->steps : 0,
                         setup.resume_from ? setup.resume_from->load_factor : 0.0));
  } else {
    recorder_store.emplace(folder, curve_columns(input), input.output.fields_every);
  }
  RunRecorder& recorder = *recorder_store;
  checkpoint.add_study_state = [&lambda_max](CheckpointData& d) { d.arrays["general.lambda_max"] = {lambda_max}; };
  if (!checkpoint.file.empty()) setup.checkpoint = &checkpoint;
  setup.checkpoint_every = std::max(1, input.output.checkpoint_every);
  const Eigen::VectorXd zero = Eigen::VectorXd::Zero(model.dof_count());
  if (!checkpoint.resume_from) {
    std::vector<double> row{0.0, 0.0};
    for (std::size_t i = 0; i < a.record_dofs.size(); ++i) row.push_back(0.0);
    row.insert(row.end(), {0.0, 0.0, 0.0});
    recorder.add_row(row);
    recorder.write_fields(0, 0.0, model, zero, ElementResults{});
    write_start_checkpoint(checkpoint, problem, recorder);
  }
  nlohmann::json summary{{"title", input.title}, {"program", program_json()}, {"input", to_json(input)},
                         {"caution", kCaution}};
  summary["model"] = model_size(model, problem.size());
  // 3. Each converged step: a curve row, a progress line, the stop criteria.
  auto on_step = [&](const ConvergedStep& step, const Eigen::VectorXd& u) {
    StepRecord record;
    record.row = {double(step.step), step.load_factor};
    std::string recorded;
    for (std::size_t i = 0; i < a.record_dofs.size(); ++i) {
      const GroupDof& m = a.record_dofs[i];
      record.row.push_back(means[i].value(u));
      recorded += format_text("  %s@%s %.5g", dof_name(m.dof), m.group.c_str(), record.row.back());
    }
    record.row.insert(record.row.end(),
                      {problem.max_plastic_strain(), double(step.iterations), double(step.negative_pivots)});
    record.progress = format_text("step %4d  load factor %.6g%s  iterations %d  negative pivots %d%s", step.step,
                                  step.load_factor, recorded.c_str(), step.iterations, step.negative_pivots,
                                  step.cutbacks ? ("  (" + std::to_string(step.cutbacks) + " cut-backs)").c_str() : "");
    const bool peak_passed = step.load_factor < lambda_max;
    lambda_max = std::max(lambda_max, step.load_factor);
    if (peak_passed && lambda_max > 0.0 && step.load_factor < a.stop_below * lambda_max)
      record.stop_reason = "load factor fell below stop_below x maximum";
    else if (a.control == Control::arc_length && a.control_dof && a.max_displacement &&
             std::abs(setup.controlled->value(u)) >= std::abs(*a.max_displacement))
      record.stop_reason = "control_dof reached max_displacement";
    return record;
  };
  const PathRunResult run = run_path(problem, model, recorder, setup, on_step);
  // 4. The summary, whatever the outcome.
  const double wall = std::chrono::duration<double>(std::chrono::steady_clock::now() - t_start).count();
  summary["stop_reason"] = run.stop_reason;
  summary["message"] = run.path.message;
  summary["load_factor_final"] = run.path.load_factor;
  summary["load_factor_max"] = lambda_max;
  summary["solver"] = solver_summary(run.path, problem, model, wall);
  summary["solver"]["checkpoints"] = checkpoint.writes;
  summary["solver"]["checkpoint_s"] = checkpoint.write_seconds;
  if (checkpoint.resume_from) summary["resumed_from_step"] = setup.resume_from ? setup.resume_from->steps : 0;
  recorder.write_summary(summary);
  return finish_path(run.path, run.stop_reason, wall);
}

}  // namespace rotcap::app
