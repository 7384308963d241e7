// Cantilever strip rolled up into a full circle by an end moment, solved by the whole nonlinear
// solver chain (ShellModel -> ShellProblem with corotational shells -> PathFollower, load control).
//
// Problem: K.Y. Sze, X.H. Liu, S.H. Lo, "Popular benchmark problems for geometric nonlinear
// analysis of shells", FEAD 40 (2004) 1551-1569, "cantilever subjected to end moment". Data from
// memory (docs/spec/references.md 2.2): L = 12, b = 1, t = 0.1, E = 1.2e6, nu = 0, clamped at x = 0, end moment
// M = lambda M_max with M_max = 2 pi E I / L = 50 pi / 3 (E I = E b t^3 / 12 = 100).
// Reference: the analytical solution quoted by Sze et al. (DERIVED in docs/spec/references.md 2.2): under a
// constant moment the strip bends into an arc of radius E I / M = L / (2 pi lambda), so with
// theta = 2 pi lambda the tip moves by U = L (sin(theta)/theta - 1), W = L (1 - cos(theta))/theta.
// Error measure: distance of the computed tip (mean of the two tip nodes) from the analytical tip,
// relative to L; limit 1 % of L.
//
// The tip is free in all six DOFs. The exact solution is planar; the skew part -1/2 skew(m) of the
// consistent tangent at the moment-loaded tip nodes (shell_problem.hpp, Woodbury correction) keeps
// the rotations rx, rz there from drifting: with the symmetric part alone the path stalled at
// M/M_max = 0.80 to 0.87 (20 elements), the residual growing in rx, rz.

#include "tests/test_support.hpp"
#include "tests/verification/nonlinear/benchmark_meshes.hpp"
#include "tests/verification/nonlinear/path_record.hpp"

#include <cmath>
#include <cstdio>
#include <numbers>

namespace rotcap::verification {
namespace {

constexpr double kLength = 12.0, kWidth = 1.0, kThickness = 0.1, kE = 1.2e6;
constexpr double kEI = kE * kWidth * kThickness * kThickness * kThickness / 12.0;  // 100
constexpr int kElements = 20;  // 18 degrees of arc per element at the full circle

struct RollUp {
  ShellModel model = cantilever_strip(kLength, kWidth, kThickness, kElements);
  SectionAssignment sections;
  double moment_max = 2.0 * std::numbers::pi * kEI / kLength;
  RollUp() {
    // A moment about -y curls the strip towards +z.
    model.loads.push_back({"tip", Eigen::Vector3d::Zero(), Eigen::Vector3d(0.0, -moment_max, 0.0)});
    sections = SectionAssignment::elastic(model, kE, 0.0);
  }
};

TEST(RollUpVerification, TipFollowsThePureBendingCircleUpToTheClosedRing) {
  RollUp case_;
  ShellProblem shells(case_.model, case_.sections, {.element = {}, .threads = 1});
  NewtonRecorder problem(shells);
  LoadControl control;
  PathOptions o;
  o.first_step = 0.05;
  o.force_tolerance = 1e-9;  // tight, so that the tail of each Newton sequence shows its rate
  o.displacement_tolerance = 1e-8;
  const double scale = problem.reference_load().norm();
  PathRecord all;
  std::vector<std::vector<double>> energies;  // per converged step
  double lambda = 0.0;
  std::printf("roll-up (Sze, Liu & Lo 2004, setup from memory; analytical circle, DERIVED), %d elements\n",
              kElements);
  for (double target : {0.25, 0.5, 1.0}) {
    o.max_load_factor = target;
    const PathRecord r = follow_path(problem, control, o, lambda, [&](const ConvergedStep& s) {
      energies.push_back(problem.energy_norms(s.load_factor));
      return true;
    });
    ASSERT_EQ(r.summary.status, PathStatus::Completed) << r.summary.message;
    ASSERT_DOUBLE_EQ(r.summary.load_factor, target);
    append(all, r);
    lambda = target;
    const Eigen::VectorXd u = shells.displacements();
    const double U = group_mean(case_.model, "tip", Dof::ux, u);
    const double W = group_mean(case_.model, "tip", Dof::uz, u);
    const double theta = 2.0 * std::numbers::pi * target;
    const double U_ref = kLength * (std::sin(theta) / theta - 1.0);
    const double W_ref = kLength * (1.0 - std::cos(theta)) / theta;
    const double error = std::hypot(U - U_ref, W - W_ref) / kLength;
    std::printf("  M/M_max %.2f: U %.4f (ref %.4f), W %.4f (ref %.4f), |tip error|/L %.2e\n", target, U, U_ref, W,
                W_ref, error);
    EXPECT_LE(error, 0.01) << "at M/M_max = " << target;
  }
  // Quadratic convergence, measured in the energy norm E_k = |du_k+1 . r_k| of each correction
  // (the work of the residual on the correction that removes it, E ~ |e|_K^2 for the error e):
  // the order estimate p = ln(E_n / E_n-1) / ln(E_n-1 / E_n-2) over the last three corrections of
  // each step is 2 for Newton's quadratic rate and 1 for a linear rate; p >= 1.8 is required.
  // The constant of the last pair, C_E = E_n / E_n-1^2 [1/(N mm)], and the residual norms
  // rho = |r|/|f_ref| are printed. The residual norm is not used for the test: it alternates
  // between soft bending and stiff membrane components (a rotation error dtheta leaves a membrane
  // residual of order E t dtheta^2, whose correction leaves a bending one again), so consecutive
  // pairs of |r| can grow while the energy falls quadratically.
  double p_min = 1e9, c_max = 0.0;
  for (const ConvergedStep& s : all.steps) {
    const std::vector<double>& E = energies[s.step - 1];
    ASSERT_GE(E.size(), 3u) << "step " << s.step;
    const std::size_t n = E.size() - 1;
    const double p = std::log(E[n] / E[n - 1]) / std::log(E[n - 1] / E[n - 2]);
    const double c = E[n] / (E[n - 1] * E[n - 1]);
    p_min = std::min(p_min, p);
    c_max = std::max(c_max, c);
    EXPECT_GE(p, 1.8) << "step " << s.step;
    std::string line = residual_line("step " + std::to_string(s.step), s.residual_norms, scale) + "\n      energy |du.r| =";
    char buf[32];
    for (double e : E) {
      std::snprintf(buf, sizeof buf, " %.2e", e);
      line += buf;
    }
    std::printf("  %s  (order %.2f, C_E %.3g)\n", line.c_str(), p, c);
  }
  std::printf("  %d steps, %d iterations (%.2f per step), %d cut-backs; order of the last corrections >= %.2f, "
              "C_E <= %.3g /(N mm)\n",
              all.summary.steps, all.summary.iterations, all.mean_iterations(), all.summary.cutbacks, p_min, c_max);
}

}  // namespace
}  // namespace rotcap::verification
