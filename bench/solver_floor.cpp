// The cost floor of a path run (issue "each Newton iteration close to one bare factorisation"):
// restores the state of a results folder's checkpoint.h5, assembles the tangent there, and times
// the bare factorisations of that matrix (CHOLMOD supernodal LL^T, tried even when it fails, and our
// supernodal LDL^T) and one solve with each factor: medians of REPEATS. Prints one JSON object.
// Usage: bench_solver_floor RESULTS_DIR [REPEATS] (run with OPENBLAS_NUM_THREADS=1, as the program).
#include "bench/checkpoint_model.hpp"
#include "solver/cholmod_factor.hpp"
#include "solver/nonlinear/shell_problem.hpp"
#include "solver/section_assignment.hpp"

#include <nlohmann/json.hpp>

#include <algorithm>
#include <chrono>
#include <cmath>
#include <cstdio>
#include <functional>
#include <iostream>
#include <vector>

namespace {

using namespace rotcap;

double median_seconds(int repeats, const std::function<void()>& work) {
  std::vector<double> t;
  for (int r = 0; r < repeats; ++r) {
    const auto t0 = std::chrono::steady_clock::now();
    work();
    t.push_back(std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count());
  }
  std::sort(t.begin(), t.end());
  return t[t.size() / 2];
}

}  // namespace

int main(int argc, char** argv) {
  if (argc < 2) {
    std::cerr << "usage: bench_solver_floor RESULTS_DIR [REPEATS]\n";
    return 2;
  }
  const std::filesystem::path folder = argv[1];
  const int repeats = argc > 2 ? std::max(1, std::atoi(argv[2])) : 5;
  const std::optional<bench::CheckpointModel> loaded = bench::load_checkpoint_model(folder, "bench_solver_floor");
  if (!loaded) return 2;
  const CheckpointData& data = loaded->data;
  const ShellModel& model = loaded->model;
  const SectionAssignment sections =
      SectionAssignment::for_steel(model, loaded->built.input.steel, loaded->built.input.layers, false);
  ShellProblem problem(model, sections, {});
  const auto assemble = [&] {
    Eigen::VectorXd f;
    problem.evaluate(f, true);
  };
  const double with_assembly = median_seconds(1, [&] { bench::restore_checkpoint_state(problem, *loaded); });
  const std::vector<double> values = problem.tangent_values();  // the path's own tangent at that step
  const double evaluate_s = median_seconds(repeats, assemble);    // assembly + factorisation
  CholmodFactor llt(problem.pattern(), CholmodFactor::Method::SupernodalLLT);
  CholmodFactor ldlt(problem.pattern(), CholmodFactor::Method::SupernodalLDLT);
  FactorStatus llt_status = FactorStatus::Ok;
  const double llt_s = median_seconds(repeats, [&] { llt_status = llt.factorize(values); });
  const double ldlt_s = median_seconds(repeats, [&] { ldlt.factorize(values); });
  const int n = problem.size();
  std::vector<double> b(n, 1.0), y(n);
  const double ldlt_solve_s = median_seconds(repeats, [&] { ldlt.solve(b.data(), y.data()); });
  double llt_solve_s = NAN;
  if (llt_status == FactorStatus::Ok) llt_solve_s = median_seconds(repeats, [&] { llt.solve(b.data(), y.data()); });
  const nlohmann::json out{{"step", data.integer("path.steps")},
                           {"free_dofs", n},
                           {"negative_pivots", ldlt.negative_pivots()},
                           {"llt_status", factor_status_name(llt_status)},
                           {"llt_factorisation_s", llt_s},
                           {"llt_solve_s", llt_status == FactorStatus::Ok ? nlohmann::json(llt_solve_s) : nlohmann::json()},
                           {"ldlt_factorisation_s", ldlt_s},
                           {"ldlt_solve_s", ldlt_solve_s},
                           {"evaluate_s", evaluate_s},
                           {"restore_s", with_assembly},
                           {"repeats", repeats}};
  std::cout << out.dump() << "\n";
  return 0;
}
