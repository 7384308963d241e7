#include "app/hinge_analysis.hpp"

#include "app/commands.hpp"
#include "app/hinge_law_outputs.hpp"
#include "app/hinge_report_page.hpp"
#include "app/hinge_results.hpp"
#include "app/hinge_stages.hpp"
#include "app/logging.hpp"
#include "app/path_run.hpp"
#include "app/run_recorder.hpp"
#include "core/text_format.hpp"
#include "io/case_echo.hpp"
#include "io/final_state.hpp"
#include "solver/nonlinear/equilibrate.hpp"
#include "solver/path/path_follower.hpp"
#include "solver/section_assignment.hpp"

#include <chrono>
#include <cmath>
#include <cstdlib>

namespace rotcap::app {

namespace fs = std::filesystem;

namespace {

/// curve.csv of a hinge run. theta_over_theta_p_beam divides by the beam-theory theta_p, known
/// before the run, so that every row is final when written (the computed theta_p of the reported R
/// is in summary.json).
const std::vector<std::string> kColumns{"step", "load_factor", "moment_kNm", "rotation_mrad", "m_over_mp",
                                        "theta_over_theta_p_beam", "max_plastic_strain", "iterations",
                                        "negative_pivots"};

std::vector<double> row_of(const HingePoint& p, double mp, double theta_p_beam) {
  return {double(p.step), p.load_factor, p.moment / 1e6, 1e3 * p.rotation, p.moment / mp, p.rotation / theta_p_beam,
          p.max_plastic_strain, double(p.iterations), double(p.negative_pivots)};
}

/// The axial load first, under load control to its full value, then held as a fixed load.
void apply_axial_load(ShellProblem& problem, const ShellModel& model, const HingeZoneModel& zone,
                      const PathOptions& options, const Eigen::VectorXd& bending) {
  problem.set_reference_load(load_vector(model, model.fixed_loads));
  LoadControl control;
  PathOptions ao = options;
  ao.max_load_factor = 1.0;
  ao.first_step = 0.25;
  PathFollower axial(problem, control, ao);
  const PathSummary s = axial.run([](const ConvergedStep&) { return true; });
  log_info("axial load N = " + std::to_string(zone.axial_force / 1e3) + " kN applied: " + s.message);
  problem.set_fixed_load(load_vector(model, model.fixed_loads));
  problem.set_reference_load(bending);
}

}  // namespace

int run_hinge_study(const CaseInput& input, const HingeCase& hinge, const fs::path& folder, int threads) {
  const auto t_start = std::chrono::steady_clock::now();
  const HingeZoneModel& zone = hinge.zone;
  const double mp = zone.plastic_moment;
  nlohmann::json summary{{"title", input.title}, {"program", program_json()}, {"input", to_json(input)},
                         {"caution", kCaution}};
  // 1. Imperfections on a copy of the perfect model.
  ShellModel model = zone.model;
  const StageReport imperfection = apply_imperfections(input, hinge, model, threads);
  for (const auto& l : imperfection.log) log_info(l);
  summary["imperfection"] = imperfection.json;
  // 2. Sections and the nonlinear problem; residual stresses and their equilibrium step.
  const SectionAssignment sections = SectionAssignment::for_steel(model, input.steel, input.layers, false);
  ShellProblemOptions po;
  po.threads = threads;
  ShellProblem problem(model, sections, po);
  summary["mesh"] = {{"nodes", model.node_count()}, {"elements", model.element_count()},
                     {"free_dofs", problem.size()}, {"flange_elements", input.zone.flange_elements},
                     {"web_elements", input.zone.web_elements}, {"layers", input.layers.layers}};
  const Eigen::VectorXd bending = reference_load_vector(model);
  const StageReport residual = apply_residual_stresses(input, hinge, problem);
  for (const auto& l : residual.log) log_info(l);
  summary["residual_stress"] = residual.json;
  if (input.residual_stress != ResidualStressKind::none) {
    const EquilibrateResult eq = equilibrate(problem, bending.norm());
    log_info(format_text("residual-stress equilibrium: %s in %d iterations, largest displacement %.3g mm",
                         eq.converged ? "converged" : "FAILED", eq.iterations, eq.displacement_norm));
    summary["residual_stress"]["equilibrium_iterations"] = eq.iterations;
    summary["residual_stress"]["equilibrium_displacement_mm"] = eq.displacement_norm;
    if (!eq.converged) log_warn("residual stresses could not be equilibrated: " + eq.message);
  }
  // 3. The axial load first, then held.
  if (zone.axial_force > 0.0) apply_axial_load(problem, model, zone, input.analysis.path, bending);
  // 4. The bending load traced past the peak; the unloaded (or axially loaded) state is step 0.
  RunRecorder recorder(folder, kColumns, input.output.fields_every);
  std::vector<HingePoint> curve{HingePoint{}};
  const Eigen::VectorXd u0 = problem.displacements();
  recorder.add_row(row_of(curve[0], mp, hinge.theta_p_beam));
  recorder.write_fields(0, 0.0, model, u0, snapshot_results(problem));
  double m_max = 0.0;
  Eigen::VectorXd u_peak = u0;
  int peak_step = 0;
  ElementResults peak_results;
  const double theta0 = zone.rotation.value(u0);
  auto on_step = [&](const ConvergedStep& step, const Eigen::VectorXd& u) {
    const HingePoint p{step.step, step.load_factor, step.load_factor * zone.moment_per_load_factor,
                       zone.rotation.value(u) - theta0, problem.max_plastic_strain(), step.iterations,
                       step.negative_pivots};
    curve.push_back(p);
    StepRecord record;
    record.row = row_of(p, mp, hinge.theta_p_beam);
    record.progress = format_text("step %4d  load factor %.4f  M/Mp %.4f  rotation %.2f mrad  iterations %d  "
                                  "negative pivots %d%s",
                                  p.step, p.load_factor, p.moment / mp, 1e3 * p.rotation, p.iterations,
                                  p.negative_pivots, step.cutbacks ? "  (after cut-backs)" : "");
    if (std::getenv("ROTCAP_DEBUG_RESIDUALS")) {
      std::string rs = "  |r|:";
      for (double x : step.residual_norms) rs += " " + std::to_string(x);
      log_info(rs);
    }
    if (p.moment > m_max) {
      m_max = p.moment;
      u_peak = u;
      peak_step = p.step;
      peak_results = snapshot_results(problem);
    } else if (peak_step > 0 && !recorder.has_fields(peak_step)) {
      recorder.write_fields(peak_step, curve[peak_step].load_factor, model, u_peak, peak_results);
    }
    if (std::abs(p.rotation) >= input.analysis.max_rotation)
      record.stop_reason = "rotation reached max_rotation";
    else if (p.moment < input.analysis.stop_below * m_max && m_max > 0.0)
      record.stop_reason = "moment fell below stop_below x M_max";
    return record;
  };
  PathRunSetup setup;
  setup.control = input.analysis.control;
  setup.options = input.analysis.path;
  if (setup.control == Control::load) setup.options.max_load_factor = input.analysis.max_load_factor.value_or(1.0);
  setup.arc_length_form = input.analysis.arc_length_form;
  setup.controlled = zone.rotation;
  setup.description = "tracing the moment-rotation curve";
  const PathRunResult run = run_path(problem, model, recorder, setup, on_step);
  if (peak_step > 0 && !recorder.has_fields(peak_step))
    recorder.write_fields(peak_step, curve[peak_step].load_factor, model, u_peak, peak_results);
  // 5. The reported numbers (one extraction), the laws, the plot, the summary and the report.
  const Eigen::VectorXd u_end = problem.displacements();
  const HingeCurveResult extraction = extract_hinge_results(hinge, curve);
  const FailureMode failure = classify_failure(hinge, curve, extraction, u_peak, u_end);
  const StageReport results = hinge_results_report(hinge, extraction, failure, input.demand, input.residual_stress);
  for (const auto& l : results.log) log_info(l);
  summary.update(results.json);
  const std::vector<MomentRotationPoint> points = moment_rotation_points(curve);
  const DeformedMesh final_mesh = deformed_mesh(model, u_end);
  write_final_state(final_mesh, folder / "final_state.json");
  std::optional<HingeLawSet> laws;
  try {
    laws = compare_hinge_laws(points, extraction,
                              {zone, hinge.section, input.steel, input.residual_stress, hinge.theta_p_beam});
    const StageReport outputs = write_hinge_law_outputs(input.title, points, extraction, *laws, mp, folder);
    for (const auto& l : outputs.log) log_info(l);
    summary.update(outputs.json);
  } catch (const std::exception& e) {
    laws.reset();
    log_warn(std::string("hinge laws, curve.svg and report.html not made: ") + e.what());
  }
  const double wall = std::chrono::duration<double>(std::chrono::steady_clock::now() - t_start).count();
  summary["stop_reason"] = run.stop_reason;
  summary["message"] = run.path.message;
  summary["solver"] = solver_summary(run.path, problem, model, wall);
  recorder.write_summary(summary);
  if (laws) write_hinge_report(input, hinge, points, extraction, *laws, final_mesh, summary, folder);
  return finish_path(run.path, run.stop_reason, wall);
}

}  // namespace rotcap::app
