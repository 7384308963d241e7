// bench_linear_plate: what the linear solver pipeline costs on a flat shell plate.
//
// What it shows:
//   1. a clamped square plate of about 100k DOFs under a uniform transverse load, solved with
//      solve_linear_static: time split assembly / symbolic analysis / numeric factorisation /
//      solve, nonzeros of K and of the factor, for the automatic and the nested-dissection
//      orderings, and the assembly with 1 and 2 OpenMP threads;
//   2. on a 30k-DOF simply supported plate in compression: the linear buckling solve (4 modes),
//      then numeric factorisation times of the supernodal LL^T, the simplicial LDL^T and our
//      supernodal LDL^T (medians of several runs, symbolic analysis excluded) on K and on the
//      indefinite K + s Kg with one negative eigenvalue, the figures the choice of the
//      indefinite-tangent route in the path-following solver rests on.
// How to run: bench/run_benchmarks.sh (writes bench/results/linear_plate.txt), or directly
//   OPENBLAS_NUM_THREADS=1 build/bench/bench_linear_plate [nodes_per_side_large] [nodes_per_side_small] [runs]
// (defaults 129, 71, 5: 99 846 and 30 246 DOFs).

#include "materials/elastic_shell_section.hpp"
#include "solver/linear_buckling.hpp"

#include <omp.h>

#include <algorithm>
#include <chrono>
#include <cstdio>
#include <cstdlib>
#include <string>
#include <vector>

namespace {

using namespace rotcap;

// Square plate 1000 x 1000 mm, t = 10 mm, (s - 1)^2 elements, clamped on the edge x = 0, total
// transverse load 1 kN shared by area.
ShellModel square_plate(int s) {
  ShellModel m;
  const int n = s - 1;
  const double a = 1000.0;
  for (int j = 0; j < s; ++j)
    for (int i = 0; i < s; ++i) m.nodes.emplace_back(a * i / n, a * j / n, 0.0);
  NodeGroup all, clamped;
  all.dimension = 2;
  clamped.dimension = 1;
  for (int j = 0; j < n; ++j)
    for (int i = 0; i < n; ++i) {
      ShellElement e;
      e.nodes = {j * s + i, j * s + i + 1, (j + 1) * s + i + 1, (j + 1) * s + i};
      e.thickness = 10.0;
      m.elements.push_back(e);
      all.cells.push_back({e.nodes.begin(), e.nodes.end()});
    }
  for (int v = 0; v < m.node_count(); ++v) all.nodes.push_back(v);
  for (int j = 0; j < s; ++j) clamped.nodes.push_back(j * s);
  for (int j = 0; j < n; ++j) clamped.cells.push_back({j * s, (j + 1) * s});
  m.region_names = {"plate"};
  m.groups["all"] = all;
  m.groups["clamped"] = clamped;
  Support fix;
  fix.group = "clamped";
  fix.fixed.fill(true);
  m.supports.push_back(fix);
  GroupLoad load;
  load.group = "all";
  load.force = Eigen::Vector3d(0.0, 0.0, -1000.0);
  m.loads.push_back(load);
  return m;
}

double median(std::vector<double> v) {
  std::sort(v.begin(), v.end());
  const std::size_t k = v.size() / 2;
  return v.size() % 2 ? v[k] : 0.5 * (v[k - 1] + v[k]);
}

void time_split(const ShellModel& m, const SectionAssignment& sections, CholmodFactor::Ordering ordering,
                const char* label) {
  LinearStaticOptions options;
  options.ordering = ordering;
  const auto start = std::chrono::steady_clock::now();
  const LinearStaticResult r = solve_linear_static(m, sections, options);
  const double total = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
  const LinearSolveStatistics& st = r.statistics;
  std::printf("  ordering %-18s: %s\n", label, r.message.c_str());
  std::printf("    equations %d, nnz(K upper) %d, nnz(L) %.4g (fill %.1fx), colours %d\n", st.free_dofs,
              st.stiffness_nonzeros, st.factor_nonzeros, st.factor_nonzeros / st.stiffness_nonzeros, st.colours);
  std::printf("    assembly %.3f s | symbolic analysis %.3f s | numeric factorisation %.3f s | solve %.3f s | "
              "recovery %.3f s | total %.3f s (incl. setup)\n",
              st.assembly_seconds, st.analysis_seconds, st.factorization_seconds, st.solve_seconds,
              st.recovery_seconds, total);
}

void assembly_threads(const ShellModel& m, const SectionAssignment& sections, int runs) {
  for (int threads : {1, 2}) {
    LinearStaticOptions options;
    options.threads = threads;
    LinearShellSystem system(m, sections, options);
    std::vector<double> t;
    for (int k = 0; k < runs; ++k) t.push_back(system.assemble_stiffness().seconds);
    std::printf("  stiffness assembly, %d thread(s): min %.3f s, median %.3f s of %d runs\n", threads,
                *std::min_element(t.begin(), t.end()), median(t), runs);
  }
}

// Simply supported square plate (uz and the rotation about the edge normal held on all edges;
// ux on x = 0, uy at one corner) under uniform compression N_xx = -1 N/mm on x = a.
ShellModel compressed_plate(int s) {
  ShellModel m = square_plate(s);
  m.supports.clear();
  m.loads.clear();
  const int n = s - 1;
  auto edge = [&](const std::string& name, auto node_of) {
    NodeGroup g;
    g.dimension = 1;
    for (int k = 0; k < s; ++k) g.nodes.push_back(node_of(k));
    for (int k = 0; k < n; ++k) g.cells.push_back({node_of(k), node_of(k + 1)});
    std::sort(g.nodes.begin(), g.nodes.end());
    m.groups[name] = g;
  };
  edge("x0", [&](int k) { return k * s; });
  edge("xa", [&](int k) { return k * s + n; });
  edge("y0", [&](int k) { return k; });
  edge("yb", [&](int k) { return n * s + k; });
  NodeGroup corner;
  corner.nodes = {0};
  corner.cells = {{0}};
  m.groups["corner"] = corner;
  auto hold = [&](const std::string& group, std::initializer_list<Dof> dofs) {
    Support sup;
    sup.group = group;
    for (Dof d : dofs) sup.fixed[static_cast<int>(d)] = true;
    m.supports.push_back(sup);
  };
  hold("x0", {Dof::uz, Dof::rx, Dof::ux});
  hold("xa", {Dof::uz, Dof::rx});
  hold("y0", {Dof::uz, Dof::ry});
  hold("yb", {Dof::uz, Dof::ry});
  hold("corner", {Dof::uy});
  GroupLoad load;
  load.group = "xa";
  load.force = Eigen::Vector3d(-1000.0, 0.0, 0.0);  // 1 N/mm over the 1000 mm edge
  m.loads.push_back(load);
  return m;
}

const char* method_name(CholmodFactor::Method method) {
  switch (method) {
    case CholmodFactor::Method::SupernodalLLT: return "supernodal LL^T";
    case CholmodFactor::Method::SimplicialLDLT: return "simplicial LDL^T";
    case CholmodFactor::Method::SupernodalLDLT: return "supernodal LDL^T";
  }
  return "?";
}

// Median numeric factorisation time of runs factorisations; prints the outcome.
void time_factorisations(const SparsePattern& pattern, const std::vector<double>& values,
                         CholmodFactor::Method method, int runs, const char* label) {
  CholmodFactor factor(pattern, method);
  std::vector<double> t;
  FactorStatus status = FactorStatus::NotFactorized;
  for (int r = 0; r < runs; ++r) {
    status = factor.factorize(values);
    t.push_back(factor.last_factorization_seconds());
  }
  std::printf("  %-34s %-16s: analysis %.3f s, numeric median %.3f s (min %.3f, max %.3f, %d runs) -> %s, "
              "negative pivots %d\n",
              label, method_name(method),
              factor.analysis_seconds(), median(t), *std::min_element(t.begin(), t.end()),
              *std::max_element(t.begin(), t.end()), runs, factor_status_name(status), factor.negative_pivots());
}

void llt_vs_ldlt(int s, int runs) {
  const ShellModel m = compressed_plate(s);
  const SectionAssignment sections = SectionAssignment::elastic(m, 210000.0, 0.3);
  std::printf("\n2. LL^T vs LDL^T: simply supported square plate in compression, %d x %d nodes, %d DOFs\n", s, s,
              m.dof_count());
  BucklingOptions options;
  const BucklingResult b = solve_linear_buckling(m, sections, 4, options);
  std::printf("  linear buckling, 4 modes: %s\n", b.message.c_str());
  std::printf("    Lanczos %.3f s (%d restarts, %d operator applications), Kg assembly %.3f s, Sturm LDL^T %.3f s\n",
              b.eigen_seconds, b.iterations, b.operations, b.geometric_assembly_seconds, b.sturm_seconds);
  if (b.load_factors.empty()) return;

  LinearShellSystem system(m, sections);
  const LinearStaticResult pre = solve_linear_static(system);
  std::vector<double> kg;
  if (!pre.ok() || !system.assemble_matrix(system.elements().geometric_stiffness_kernel(pre.resultants), kg).ok) return;
  const std::vector<double>& k = system.stiffness_values();
  std::printf("    nnz(K upper) %d, nnz(L) %.4g\n", system.pattern().nonzeros(),
              system.stiffness_factor().factor_nonzeros());
  // K + s Kg just past the first bifurcation: one negative eigenvalue, as a tangent past a limit
  // point. The LL^T attempt stops at the first non-positive pivot (quick return).
  std::vector<double> indefinite(k.size());
  const double shift = 0.5 * (b.load_factors[0] + b.load_factors[1]);
  for (std::size_t i = 0; i < k.size(); ++i) indefinite[i] = k[i] + shift * kg[i];
  for (auto method : {CholmodFactor::Method::SupernodalLLT, CholmodFactor::Method::SimplicialLDLT,
                      CholmodFactor::Method::SupernodalLDLT})
    time_factorisations(system.pattern(), k, method, runs, "K (positive definite)");
  for (auto method : {CholmodFactor::Method::SupernodalLLT, CholmodFactor::Method::SimplicialLDLT,
                      CholmodFactor::Method::SupernodalLDLT})
    time_factorisations(system.pattern(), indefinite, method, runs, "K + s Kg (1 negative eigenvalue)");
}

}  // namespace

int main(int argc, char** argv) {
  const int large = argc > 1 ? std::atoi(argv[1]) : 129;
  const int small = argc > 2 ? std::atoi(argv[2]) : 71;
  const int runs = argc > 3 ? std::atoi(argv[3]) : 5;
  if (large < 3 || small < 3 || runs < 1) {
    std::fprintf(stderr, "usage: bench_linear_plate [nodes_per_side_large >= 3] [nodes_per_side_small >= 3] [runs >= 1]\n");
    return 2;
  }
  const char* blas_threads = std::getenv("OPENBLAS_NUM_THREADS");
  std::printf("bench_linear_plate: OpenMP max threads %d, OPENBLAS_NUM_THREADS=%s\n", omp_get_max_threads(),
              blas_threads ? blas_threads : "(unset)");

  const ShellModel big = square_plate(large);
  const SectionAssignment big_sections = SectionAssignment::elastic(big, 210000.0, 0.3);
  std::printf("\n1. clamped square plate, %d x %d nodes, %d elements, %d DOFs\n", large, large, big.element_count(),
              big.dof_count());
  time_split(big, big_sections, CholmodFactor::Ordering::Automatic, "automatic (AMD)");
  time_split(big, big_sections, CholmodFactor::Ordering::NestedDissection, "nested dissection");
  assembly_threads(big, big_sections, 7);

  llt_vs_ldlt(small, runs);
  return 0;
}
