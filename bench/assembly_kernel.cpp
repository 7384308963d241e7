// The element and material kernel alone: restores the state of a results folder's checkpoint.h5
// (as bench_solver_floor does), then times repeated assemblies of the corotational shells over their
// layered J2 sections at that state, with 1 and 2 assembly threads: tangent + residual (the
// assembly part of ShellProblem::evaluate(f, true), read from assembly_seconds(), so factorisation
// is not counted) and residual only (evaluate(f, false)). Medians of REPEATS. Per-element and
// per-layer-point figures are CPU time per evaluation (wall time x threads / count).
// Prints one JSON object. Usage: bench_assembly_kernel RESULTS_DIR [REPEATS] [MAX_THREADS]
// (MAX_THREADS 1 or 2, default 2: the thread counts timed are 1..MAX_THREADS)
// (run with OPENBLAS_NUM_THREADS=1 as the program; bench/assembly_kernel.sh alternates two builds).
#include "bench/checkpoint_model.hpp"
#include "solver/nonlinear/shell_problem.hpp"
#include "solver/section_assignment.hpp"
#if __has_include("elements/kernel_dispatch.hpp")
#include "elements/kernel_dispatch.hpp"
#define ROTCAP_BENCH_HAS_DISPATCH 1
#endif

#include <nlohmann/json.hpp>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <iostream>
#include <vector>

namespace {

using namespace rotcap;

double median(std::vector<double> t) {
  std::sort(t.begin(), t.end());
  return t[t.size() / 2];
}

}  // namespace

int main(int argc, char** argv) {
  if (argc < 2) {
    std::cerr << "usage: bench_assembly_kernel RESULTS_DIR [REPEATS]\n";
    return 2;
  }
  const std::filesystem::path folder = argv[1];
  const int repeats = argc > 2 ? std::max(1, std::atoi(argv[2])) : 9;
  const int max_threads = argc > 3 ? std::clamp(std::atoi(argv[3]), 1, 2) : 2;
  const std::optional<bench::CheckpointModel> loaded = bench::load_checkpoint_model(folder, "bench_assembly_kernel");
  if (!loaded) return 2;
  const CheckpointData& data = loaded->data;
  const app::BuiltCase& built = loaded->built;
  const ShellModel& model = loaded->model;
  const SectionAssignment sections = SectionAssignment::for_steel(model, built.input.steel, built.input.layers, false);
  long layer_points = 0;
  for (int e = 0; e < model.element_count(); ++e) layer_points += 4L * sections.of(e).layers();

  nlohmann::json out{{"step", data.integer("path.steps")},
                     {"elements", model.element_count()},
                     {"layer_points", layer_points},
                     {"repeats", repeats}};
#ifdef ROTCAP_BENCH_HAS_DISPATCH
  out["kernel"] = kernel_name(active_kernel());
#else
  out["kernel"] = "baseline (before run-time dispatch)";
#endif
  for (int threads = 1; threads <= max_threads; ++threads) {
    ShellProblemOptions options;
    options.threads = threads;
    ShellProblem problem(model, sections, options);
    bench::restore_checkpoint_state(problem, *loaded);
    Eigen::VectorXd f;
    std::vector<double> tangent, residual;
    for (int r = 0; r < repeats; ++r) {
      const double before = problem.assembly_seconds();
      problem.evaluate(f, true);
      tangent.push_back(problem.assembly_seconds() - before);
      const auto t0 = std::chrono::steady_clock::now();
      problem.evaluate(f, false);
      residual.push_back(std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count());
    }
    const double t = median(tangent), rr = median(residual);
    const std::string key = "threads_" + std::to_string(threads);
    out[key] = {{"tangent_residual_ms", 1e3 * t},
                {"residual_ms", 1e3 * rr},
                {"tangent_residual_us_per_element", 1e6 * t * threads / model.element_count()},
                {"tangent_residual_ns_per_layer_point", 1e9 * t * threads / static_cast<double>(layer_points)},
                {"max_plastic_strain", problem.max_plastic_strain()}};
  }
  std::cout << out.dump() << "\n";
  return 0;
}
