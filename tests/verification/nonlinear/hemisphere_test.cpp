// Hemispherical shell with an 18 degree polar hole under alternating radial point forces at the
// equator: large rotations of a doubly curved shell with almost inextensional bending.
//
// Problem: K.Y. Sze, X.H. Liu, S.H. Lo, "Popular benchmark problems for geometric nonlinear
// analysis of shells", FEAD 40 (2004) 1551-1569, "hemispherical shell subjected to alternating
// radial forces". Data from memory (docs/spec/references.md 2.4): R = 10, t = 0.04, E = 6.825e7, nu = 0.3,
// P_max = 400; the forces act in pairs, inward at A (on the x axis) and outward at B (on the y axis),
// the polar hole's edge and the equator are free. Quarter model with symmetry planes, n x n
// elements; each loaded point lies on a symmetry plane, so the quarter model carries half of the
// point force there.
// Reference (from memory, low confidence, including the load convention): the radial deflections
// at P_max, about 8.1 inward at A and 4.0 outward at B. Reported with the relative difference;
// the path itself must reach P_max.
// Load convention: P_max is taken as the force at each loaded point of the full shell (200 on the
// quarter model). During development the other reading (400 on the quarter model) gave 9.61 and
// 4.37 on the 16 x 16 quarter (+19 % and +9 %), while this one agrees at both points at once and
// converges towards them with the mesh (8 x 8: 6.54 / 3.46, 16 x 16: 7.88 / 3.97, 24 x 24:
// 8.08 / 4.05); the 8 x 8 quarter is far from converged for this problem.

#include "tests/test_support.hpp"
#include "tests/verification/nonlinear/benchmark_meshes.hpp"
#include "tests/verification/nonlinear/path_record.hpp"

#include <cmath>
#include <cstdio>

namespace rotcap::verification {
namespace {

constexpr double kE = 6.825e7, kNu = 0.3, kThickness = 0.04, kPmax = 400.0;  // from memory
constexpr double kInwardA = 8.1, kOutwardB = 4.0;                            // from memory

struct HemisphereResult {
  double inward_A = 0.0, outward_B = 0.0;
  PathRecord record;
};

/// point_force: the force at each loaded point of the FULL shell at P_max; the quarter model
/// carries half of it.
HemisphereResult run_hemisphere(int n, double point_force) {
  ShellModel model = hemisphere_quarter(kThickness, n);
  model.loads.push_back({"A", Eigen::Vector3d(-0.5 * point_force, 0.0, 0.0), Eigen::Vector3d::Zero()});
  model.loads.push_back({"B", Eigen::Vector3d(0.0, 0.5 * point_force, 0.0), Eigen::Vector3d::Zero()});
  const SectionAssignment sections = SectionAssignment::elastic(model, kE, kNu);
  ShellProblem problem(model, sections, {.element = {}, .threads = 1});
  ArcLength arc(problem.arc_length_weights(), ArcLength::Form::Cylindrical);
  PathOptions o;
  o.first_step = 0.02;
  o.max_steps = 300;
  o.max_load_factor = 1.0;
  HemisphereResult result;
  result.record = follow_path(problem, arc, o);
  const Eigen::VectorXd u = problem.displacements();
  result.inward_A = -group_mean(model, "A", Dof::ux, u);
  result.outward_B = group_mean(model, "B", Dof::uy, u);
  return result;
}

TEST(HemisphereVerification, AlternatingForcesReachMaximumLoad) {
  for (int n : {16, 24}) {
    const HemisphereResult r = run_hemisphere(n, kPmax);
    ASSERT_EQ(r.record.summary.status, PathStatus::Completed) << r.record.summary.message;
    EXPECT_DOUBLE_EQ(r.record.summary.load_factor, 1.0);
    std::printf("  hemisphere %d x %d quarter: at P_max inward at A %.3f (Sze et al. 2004, from memory: %.1f, %+.1f %%), "
                "outward at B %.3f (%.1f, %+.1f %%); %d steps, %d iterations (%.2f per step), %d cut-backs\n",
                n, n, r.inward_A, kInwardA, 100 * (r.inward_A / kInwardA - 1), r.outward_B, kOutwardB,
                100 * (r.outward_B / kOutwardB - 1), r.record.summary.steps, r.record.summary.iterations,
                r.record.mean_iterations(), r.record.summary.cutbacks);
  }
}

}  // namespace
}  // namespace rotcap::verification
