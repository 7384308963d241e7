// Per-iteration cost against model size (issue 15, item 6): one process per mesh size (bench/scaling.sh
// runs it for each --mesh-scale and fits cost ~ N^p).
//
// What it does, for one case and one mesh scale:
//  1. builds the hinge-zone model as `rotcap run` does (app::build_case with the mesh scale), the
//     layered steel sections, the ShellProblem with the case's residual stresses, and equilibrates them;
//     the imperfection stage is left out (it only moves nodes: the pattern, the element work and the
//     factor's fill do not depend on the coordinates, and its linear buckling analysis is no part of
//     a Newton iteration);
//  2. loads the model under load control to LOAD_FACTOR (default 0.9, i.e. M = 0.9 Mp for the
//     generated setups, whose reference load gives Mp at load factor 1): a post-yield state, with the
//     welded residual-stress bands and the outer flange fibres yielded, and still positive definite;
//  3. times, as medians (and, under "min", the smallest) of REPEATS: one assembly (internal force and tangent, ShellProblem::evaluate;
//     its assembly part, ShellProblem::assembly_seconds), one supernodal LL^T factorisation
//     (CholmodFactor::SupernodalLLT), one supernodal LDL^T factorisation (our SupernodalLdlt,
//     CholmodFactor::SupernodalLDLT) and one solve with each factor; the symbolic analysis (ordering
//     and symbolic factorisation, CholmodFactor constructor) once;
//  4. prints one JSON object: sizes, times [s], the LL^T factor's nonzeros (symbolic count, diagonal
//     included), and memory [MB]: rss_program_mb = peak resident set after steps 1-2 (what the
//     program itself holds: model, history, pattern, its own LL^T factor), peak_rss_mb = getrusage
//     ru_maxrss at the end (adds this benchmark's own LL^T and LDL^T factors of the same matrix).
//
// Usage: bench_scaling CASE MESH_SCALE [--repeats R] [--threads T] [--load-factor L]
//   T: OpenMP threads of the assembly (default 1). Run with OPENBLAS_NUM_THREADS=1, as the program.
#include "app/hinge_stages.hpp"
#include "app/model_builder.hpp"
#include "solver/cholmod_factor.hpp"
#include "solver/nonlinear/equilibrate.hpp"
#include "solver/nonlinear/shell_problem.hpp"
#include "solver/path/path_follower.hpp"
#include "solver/path/step_constraint.hpp"
#include "solver/section_assignment.hpp"

#include <nlohmann/json.hpp>
#include <sys/resource.h>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <functional>
#include <iostream>
#include <string>
#include <vector>

namespace {

using namespace rotcap;

double seconds_since(std::chrono::steady_clock::time_point t0) {
  return std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
}

/// Median and smallest of `repeats` measured times [s] (the smallest is the least disturbed by
/// other work on a shared machine).
struct Timing {
  double median = 0.0;
  double min = 0.0;
};

/// Of `repeats` calls of work(), each returning its own measured time [s].
Timing median_of(int repeats, const std::function<double()>& work) {
  std::vector<double> t;
  for (int r = 0; r < repeats; ++r) t.push_back(work());
  std::sort(t.begin(), t.end());
  return {t[t.size() / 2], t.front()};
}

/// Wall times [s] of `repeats` calls of work().
Timing median_seconds(int repeats, const std::function<void()>& work) {
  return median_of(repeats, [&] {
    const auto t0 = std::chrono::steady_clock::now();
    work();
    return seconds_since(t0);
  });
}

/// Peak resident set of this process so far [MB] (Linux reports ru_maxrss in KiB).
double peak_rss_mb() {
  rusage u{};
  getrusage(RUSAGE_SELF, &u);
  return static_cast<double>(u.ru_maxrss) / 1024.0;
}

int usage() {
  std::cerr << "usage: bench_scaling CASE MESH_SCALE [--repeats R] [--threads T] [--load-factor L]\n";
  return 2;
}

}  // namespace

int main(int argc, char** argv) {
  if (argc < 3) return usage();
  const std::filesystem::path case_file = argv[1];
  const double mesh_scale = std::atof(argv[2]);
  int repeats = 3, threads = 1;
  double load_factor = 0.9;
  for (int i = 3; i + 1 < argc; i += 2) {
    if (!std::strcmp(argv[i], "--repeats")) repeats = std::max(1, std::atoi(argv[i + 1]));
    else if (!std::strcmp(argv[i], "--threads")) threads = std::max(1, std::atoi(argv[i + 1]));
    else if (!std::strcmp(argv[i], "--load-factor")) load_factor = std::atof(argv[i + 1]);
    else return usage();
  }
  if (!(mesh_scale > 0.0)) return usage();

  // 1. The model, sections, problem and residual stresses as the program builds them.
  const auto t_setup = std::chrono::steady_clock::now();
  const app::BuiltCase built = app::build_case(case_file, mesh_scale);
  if (!built.hinge) {
    std::cerr << "bench_scaling: a generated hinge-zone case is expected\n";
    return 2;
  }
  const ShellModel& model = built.hinge->zone.model;
  const SectionAssignment sections = SectionAssignment::for_steel(model, built.input.steel, built.input.layers, false);
  ShellProblemOptions po;
  po.threads = threads;
  ShellProblem problem(model, sections, po);
  const Eigen::VectorXd bending = reference_load_vector(model);
  app::apply_residual_stresses(built.input, *built.hinge, problem);
  int equilibrium_iterations = 0;
  if (built.input.residual_stress != ResidualStressKind::none) {
    const EquilibrateResult eq = equilibrate(problem, bending.norm());
    equilibrium_iterations = eq.iterations;
    if (!eq.converged) std::cerr << "bench_scaling: residual stresses not equilibrated: " << eq.message << "\n";
  }
  if (built.hinge->zone.axial_force > 0.0) {  // held at its full value (applied in one go here)
    problem.set_fixed_load(load_vector(model, model.fixed_loads));
    problem.set_reference_load(bending);
  }
  // 2. Load control to the post-yield state.
  PathSummary path;
  if (load_factor > 0.0) {
    LoadControl control;
    PathOptions options = built.input.analysis.path;
    options.max_load_factor = load_factor;
    options.first_step = load_factor / 3.0;
    PathFollower follower(problem, control, options);
    path = follower.run([](const ConvergedStep&) { return true; });
    if (path.status != PathStatus::Completed)
      std::cerr << "bench_scaling: load control stopped at load factor " << path.load_factor << ": " << path.message
                << "\n";
  }
  const double setup_s = seconds_since(t_setup);
  const double rss_program_mb = peak_rss_mb();

  // 3. Timings at that state.
  Eigen::VectorXd f;
  const Timing assembly = median_of(repeats, [&] {
    const double before = problem.assembly_seconds();
    problem.evaluate(f, true);  // assembly (force + tangent), then the program's own factorisation
    return problem.assembly_seconds() - before;
  });
  const std::vector<double> values = problem.tangent_values();
  const auto t_analysis = std::chrono::steady_clock::now();
  CholmodFactor llt(problem.pattern(), CholmodFactor::Method::SupernodalLLT);
  const double analysis_s = seconds_since(t_analysis);
  CholmodFactor ldlt(problem.pattern(), CholmodFactor::Method::SupernodalLDLT);
  FactorStatus llt_status = FactorStatus::Ok, ldlt_status = FactorStatus::Ok;
  const Timing llt_t = median_seconds(repeats, [&] { llt_status = llt.factorize(values); });
  const Timing ldlt_t = median_seconds(repeats, [&] { ldlt_status = ldlt.factorize(values); });
  const int n = problem.size();
  std::vector<double> b(n, 1.0), y(n);
  Timing llt_solve{NAN, NAN}, ldlt_solve{NAN, NAN};
  if (llt_status == FactorStatus::Ok) llt_solve = median_seconds(repeats, [&] { llt.solve(b.data(), y.data()); });
  if (ldlt_status == FactorStatus::Ok) ldlt_solve = median_seconds(repeats, [&] { ldlt.solve(b.data(), y.data()); });
  const auto number = [](double x) { return std::isfinite(x) ? nlohmann::json(x) : nlohmann::json(); };

  // 4. One JSON object.
  const nlohmann::json out{{"case", case_file.string()},
                           {"mesh_scale", mesh_scale},
                           {"flange_elements", built.input.zone.flange_elements},
                           {"web_elements", built.input.zone.web_elements},
                           {"nodes", model.node_count()},
                           {"elements", model.element_count()},
                           {"free_dofs", n},
                           {"pattern_nonzeros", problem.pattern().nonzeros()},
                           {"factor_nonzeros", llt.factor_nonzeros()},
                           {"assembly_threads", threads},
                           {"repeats", repeats},
                           {"state", {{"load_factor", path.load_factor},
                                      {"path_status", to_string(path.status)},
                                      {"steps", path.steps},
                                      {"iterations", path.iterations},
                                      {"equilibrium_iterations", equilibrium_iterations},
                                      {"max_plastic_strain", problem.max_plastic_strain()}}},
                           {"setup_s", setup_s},
                           {"analysis_s", analysis_s},
                           {"assembly_s", assembly.median},
                           {"llt_status", factor_status_name(llt_status)},
                           {"llt_factorisation_s", llt_t.median},
                           {"ldlt_status", factor_status_name(ldlt_status)},
                           {"ldlt_factorisation_s", ldlt_t.median},
                           {"negative_pivots", ldlt.negative_pivots()},
                           {"llt_solve_s", number(llt_solve.median)},
                           {"ldlt_solve_s", number(ldlt_solve.median)},
                           {"min", {{"assembly_s", assembly.min},
                                    {"llt_factorisation_s", llt_t.min},
                                    {"ldlt_factorisation_s", ldlt_t.min},
                                    {"llt_solve_s", number(llt_solve.min)},
                                    {"ldlt_solve_s", number(ldlt_solve.min)}}},
                           {"rss_program_mb", rss_program_mb},
                           {"peak_rss_mb", peak_rss_mb()}};
  std::cout << out.dump() << "\n";
  return 0;
}
