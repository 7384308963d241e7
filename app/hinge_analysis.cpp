#include "app/hinge_analysis.hpp"

#include "app/analysis_common.hpp"
#include "app/commands.hpp"
#include "app/hinge_laws_stage.hpp"
#include "app/hinge_stages.hpp"
#include "app/logging.hpp"
#include "app/run_recorder.hpp"
#include "app/sections.hpp"
#include "io/case_echo.hpp"
#include "solver/nonlinear/equilibrate.hpp"
#include "solver/path/path_follower.hpp"

#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <memory>

namespace rotcap::app {

namespace fs = std::filesystem;

namespace {

const std::vector<std::string> kColumns{"step", "load_factor", "moment_kNm", "rotation_mrad", "m_over_mp",
                                        "theta_over_theta_p", "max_plastic_strain", "iterations",
                                        "negative_pivots"};

double hinge_rotation(const HingeZoneModel& zone, const Eigen::VectorXd& u) {
  double theta = 0.0;
  for (std::size_t i = 0; i < zone.rotation.nodes.size(); ++i)
    theta += zone.rotation.weights[i] * u[kDofsPerNode * zone.rotation.nodes[i] + static_cast<int>(zone.rotation.dof)];
  return theta;
}

std::vector<double> row_of(const HingePoint& p, double mp, double theta_p) {
  return {double(p.step), p.load_factor, p.moment / 1e6, 1e3 * p.rotation, p.moment / mp,
          theta_p > 0 ? p.rotation / theta_p : 0.0, p.max_plastic_strain, double(p.iterations),
          double(p.negative_pivots)};
}

/// Control weights of the hinge rotation over the free DOFs (displacement control of theta).
Eigen::VectorXd rotation_weights(const HingeZoneModel& zone, const DofMap& dofs) {
  Eigen::VectorXd c = Eigen::VectorXd::Zero(dofs.free_count());
  for (std::size_t i = 0; i < zone.rotation.nodes.size(); ++i) {
    const int q = dofs.equation(zone.rotation.nodes[i], zone.rotation.dof);
    if (q >= 0) c[q] += zone.rotation.weights[i];
  }
  return c;
}

}  // namespace

int run_hinge_study(const CaseInput& input, const HingeCase& hinge, const fs::path& folder, int threads) {
  const auto t_start = std::chrono::steady_clock::now();
  const HingeZoneModel& zone = hinge.zone;
  const double mp = zone.plastic_moment;
  nlohmann::json summary{{"title", input.title}, {"input", to_json(input)}, {"caution", kCaution}};
  // 1. Imperfections on a copy of the perfect model.
  ShellModel model = zone.model;
  const StageReport imperfection = apply_imperfections(input, hinge, model, threads);
  for (const auto& l : imperfection.log) log_info(l);
  summary["imperfection"] = imperfection.json;
  // 2. Sections and the nonlinear problem; residual stresses and their equilibrium step.
  const SectionAssignment sections = make_sections(model, input.steel, input.mesh.layers, false);
  ShellProblemOptions po;
  po.threads = threads;
  ShellProblem problem(model, sections, po);
  const Eigen::VectorXd bending = reference_load_vector(model);
  const StageReport residual = apply_residual_stresses(input, hinge, model, problem);
  for (const auto& l : residual.log) log_info(l);
  summary["residual_stress"] = residual.json;
  const double force_scale = bending.norm();
  if (input.residual_stress != ResidualPattern::none) {
    const EquilibrateResult eq = equilibrate(problem, force_scale);
    char line[200];
    std::snprintf(line, sizeof line, "residual-stress equilibrium: %s in %d iterations, largest displacement %.3g mm",
                  eq.converged ? "converged" : "FAILED", eq.iterations, eq.displacement_norm);
    log_info(line);
    summary["residual_stress"]["equilibrium_iterations"] = eq.iterations;
    summary["residual_stress"]["equilibrium_displacement_mm"] = eq.displacement_norm;
    if (!eq.converged) log_warn("residual stresses could not be equilibrated: " + eq.message);
  }
  // 3. The axial load first, under load control to its full value, then held.
  const PathOptions options = path_options(input.analysis);
  if (zone.axial_force > 0.0) {
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
  // 4. The bending load traced past the peak.
  RunRecorder recorder(folder, kColumns, input.output.fields_every);
  std::vector<HingePoint> curve{HingePoint{}};
  const Eigen::VectorXd u0 = problem.displacements();
  recorder.add_row(row_of(curve[0], mp, hinge.theta_p_beam));
  recorder.write_fields(0, 0.0, model, u0, snapshot_results(problem));
  double m_max = 0.0, theta_p_first = 0.0;
  Eigen::VectorXd u_peak = u0;
  int peak_step = 0;
  ElementResults peak_results;
  std::string stop_reason = "completed";
  auto observer = [&](const ConvergedStep& step) {
    const Eigen::VectorXd u = problem.displacements();
    HingePoint p{step.step, step.load_factor, step.load_factor * zone.moment_per_load_factor,
                 hinge_rotation(zone, u) - hinge_rotation(zone, u0), problem.max_plastic_strain(), step.iterations,
                 step.negative_pivots};
    curve.push_back(p);
    if (theta_p_first == 0.0 && p.rotation != 0.0) theta_p_first = mp / (p.moment / p.rotation);
    recorder.add_row(row_of(p, mp, theta_p_first));
    char line[200];
    std::snprintf(line, sizeof line, "step %4d  M/Mp %.4f  theta/theta_p %.3f  (%.2f mrad)  iterations %d  negative pivots %d%s",
                  p.step, p.moment / mp, p.rotation / theta_p_first, 1e3 * p.rotation, p.iterations,
                  p.negative_pivots, step.cutbacks ? "  (after cut-backs)" : "");
    log_info(line);
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
    if (recorder.fields_due(p.step)) recorder.write_fields(p.step, p.load_factor, model, u, snapshot_results(problem));
    if (std::abs(p.rotation) >= input.analysis.max_rotation) {
      stop_reason = "rotation reached max_rotation";
      return false;
    }
    if (p.moment < input.analysis.stop_below * m_max && m_max > 0.0) {
      stop_reason = "moment fell below stop_below x M_max";
      return false;
    }
    return true;
  };
  std::unique_ptr<StepConstraint> constraint;
  if (input.analysis.control == Control::displacement)
    constraint = std::make_unique<DisplacementControl>(rotation_weights(zone, problem.dofs()));
  else if (input.analysis.control == Control::load)
    constraint = std::make_unique<LoadControl>();
  else
    constraint = arc_length_constraint(problem, input.analysis);
  PathOptions bo = options;
  if (input.analysis.control == Control::load) bo.max_load_factor = input.analysis.max_load_factor.value_or(1.0);
  log_info("tracing the moment-rotation curve (" + enum_name(input.analysis.control) + "), " +
           std::to_string(problem.size()) + " free DOFs");
  PathFollower follower(problem, *constraint, bo);
  const PathSummary ps = follower.run(observer);
  if (ps.status != PathStatus::Completed) stop_reason = to_string(ps.status);
  // 5. The last fields, the reported numbers and the summary.
  const Eigen::VectorXd u_end = problem.displacements();
  const int last = curve.back().step;
  if (!recorder.has_fields(last)) recorder.write_fields(last, curve.back().load_factor, model, u_end, snapshot_results(problem));
  if (peak_step > 0 && !recorder.has_fields(peak_step))
    recorder.write_fields(peak_step, curve[peak_step].load_factor, model, u_peak, peak_results);
  const StageReport results = report_hinge_results(input, hinge, model, curve, u_peak, u_end, folder);
  for (const auto& l : results.log) log_info(l);
  // curve.csv once more with the final theta_p (rows were written as the run went, with the first
  // step's slope).
  {
    const double theta_p = computed_theta_p(hinge, curve);
    CurveCsv final_csv(folder / "curve.csv.tmp", kColumns);
    for (const HingePoint& p : curve) final_csv.write_row(row_of(p, mp, theta_p));
    final_csv.close();
    fs::rename(folder / "curve.csv.tmp", folder / "curve.csv");
  }
  const double wall = std::chrono::duration<double>(std::chrono::steady_clock::now() - t_start).count();
  summary.update(results.json);
  summary["stop_reason"] = stop_reason;
  summary["message"] = ps.message;
  summary["solver"] = solver_summary(ps, problem, model, wall);
  recorder.write_summary(summary);
  // report.html once more, now that the summary holds the stop reason and solver statistics.
  try {
    report_hinge_laws(input, hinge, curve, read_final_state(folder / "final_state.json"), summary, folder);
  } catch (const std::exception& e) {
    log_warn(std::string("report.html not remade: ") + e.what());
  }
  return finish_path(ps, stop_reason, wall);
}

}  // namespace rotcap::app
