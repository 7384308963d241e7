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

/// The study's running values in a checkpoint ("hinge.*").
void put_hinge_state(CheckpointData& d, const std::vector<HingePoint>& curve, double theta0, double m_max,
                     int peak_step, const Eigen::VectorXd& u_peak) {
  std::vector<double>& points = d.arrays["hinge.curve"];
  points.clear();
  for (const HingePoint& p : curve)
    points.insert(points.end(), {double(p.step), p.load_factor, p.moment, p.rotation, p.max_plastic_strain,
                                 double(p.iterations), double(p.negative_pivots)});
  d.arrays["hinge.theta0"] = {theta0};
  d.arrays["hinge.m_max"] = {m_max};
  d.integers["hinge.peak_step"] = peak_step;
  put_vector(d, "hinge.u_peak", u_peak);
}

std::vector<HingePoint> hinge_curve_of(const CheckpointData& d) {
  const std::vector<double>& a = d.array("hinge.curve");
  std::vector<HingePoint> curve;
  for (std::size_t i = 0; i + 7 <= a.size(); i += 7)
    curve.push_back(HingePoint{int(a[i]), a[i + 1], a[i + 2], a[i + 3], a[i + 4], int(a[i + 5]), int(a[i + 6])});
  return curve;
}

}  // namespace

int run_hinge_study(const CaseInput& input, const HingeCase& hinge, const fs::path& folder, int threads,
                    RunCheckpoint& checkpoint) {
  const auto t_start = std::chrono::steady_clock::now();
  const HingeZoneModel& zone = hinge.zone;
  const double mp = zone.plastic_moment;
  const CheckpointData* resume = checkpoint.resume_from ? &*checkpoint.resume_from : nullptr;
  if (input.output.checkpoint_every == 0) checkpoint.file.clear();
  nlohmann::json summary{{"title", input.title}, {"program", program_json()}, {"input", to_json(input)},
                         {"caution", kCaution}};
  ShellModel model = zone.model;
  if (resume) {
    const nlohmann::json start = nlohmann::json::parse(resume->text("summary.start"));
    for (const char* key : {"imperfection", "mesh", "residual_stress"})
      if (start.contains(key)) summary[key] = start[key];
    restore_geometry(model, *resume);  // the imperfect nodes
  } else {
    // 1. Imperfections on a copy of the perfect model.
    const StageReport imperfection = apply_imperfections(input, hinge, model, threads);
    for (const auto& l : imperfection.log) log_info(l);
    summary["imperfection"] = imperfection.json;
  }
  // 2. Sections and the nonlinear problem; residual stresses and their equilibrium step.
  const SectionAssignment sections = SectionAssignment::for_steel(model, input.steel, input.layers, false);
  ShellProblemOptions po;
  po.threads = threads;
  ShellProblem problem(model, sections, po);
  const Eigen::VectorXd bending = reference_load_vector(model);
  if (!resume) {
    summary["mesh"] = {{"nodes", model.node_count()}, {"elements", model.element_count()},
                       {"free_dofs", problem.size()}, {"flange_elements", input.zone.flange_elements},
                       {"web_elements", input.zone.web_elements}, {"layers", input.layers.layers}};
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
  } else if (zone.axial_force > 0.0) {
    problem.set_fixed_load(load_vector(model, model.fixed_loads));
    problem.set_reference_load(bending);
  }
  // 4. The bending load traced past the peak; the unloaded (or axially loaded) state is step 0.
  std::vector<HingePoint> curve{HingePoint{}};
  double m_max = 0.0;
  int peak_step = 0;
  Eigen::VectorXd u_peak = problem.displacements();
  double theta0 = zone.rotation.value(u_peak);
  ElementResults peak_results;
  std::optional<RunRecorder> recorder_store;
  std::optional<PathState> resume_path;
  if (resume) {
    resume_path = restore_path_run(problem, *resume);
    const int resumed_step = resume_path ? resume_path->steps : 0;
    curve = hinge_curve_of(*resume);
    theta0 = resume->scalar("hinge.theta0");
    m_max = resume->scalar("hinge.m_max");
    peak_step = static_cast<int>(resume->integer("hinge.peak_step"));
    u_peak = vector_of(*resume, "hinge.u_peak");
    if (peak_step == resumed_step) peak_results = snapshot_results(problem);
    recorder_store.emplace(folder, kColumns, input.output.fields_every, recorder_continuation(*resume));
    log_info(format_text("resuming at step %d (load factor %.6g, M/Mp %.4f)", resumed_step,
                         curve.back().load_factor, curve.back().moment / mp));
  } else {
    recorder_store.emplace(folder, kColumns, input.output.fields_every);
    recorder_store->add_row(row_of(curve[0], mp, hinge.theta_p_beam));
    recorder_store->write_fields(0, 0.0, model, u_peak, snapshot_results(problem));
    checkpoint.base.texts["summary.start"] = summary.dump();
    put_geometry(checkpoint.base, model);
  }
  RunRecorder& recorder = *recorder_store;
  checkpoint.add_study_state = [&](CheckpointData& d) { put_hinge_state(d, curve, theta0, m_max, peak_step, u_peak); };
  if (!resume) write_start_checkpoint(checkpoint, problem, recorder);
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
  setup.options.curve.rising_limit = 1.0;  // load factor 1: M = Mp
  setup.description = "tracing the moment-rotation curve";
  setup.checkpoint = checkpoint.file.empty() ? nullptr : &checkpoint;
  setup.checkpoint_every = std::max(1, input.output.checkpoint_every);
  setup.resume_from = resume_path;
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
  summary["solver"]["checkpoints"] = checkpoint.writes;
  summary["solver"]["checkpoint_s"] = checkpoint.write_seconds;
  if (resume) summary["resumed_from_step"] = resume_path ? resume_path->steps : 0;
  recorder.write_summary(summary);
  if (laws) write_hinge_report(input, hinge, points, extraction, *laws, final_mesh, summary, folder);
  return finish_path(run.path, run.stop_reason, wall);
}

}  // namespace rotcap::app
