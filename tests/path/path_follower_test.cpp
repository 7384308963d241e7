// Path-following drivers on small problems with known equilibrium paths.
#include "core/option_error.hpp"
#include "solver/path/path_follower.hpp"
#include "tests/path/dense_problem.hpp"
#include "tests/test_support.hpp"

#include <cmath>
#include <iostream>
#include <limits>
#include <vector>

namespace rotcap {
namespace {

using testing::DenseProblem;
using V = Eigen::VectorXd;
using M = Eigen::MatrixXd;

// One DOF with two limit points: f(u) = u^3 - 3u^2 + 2u. Limit loads at u = 1 -+ 1/sqrt(3),
// lambda = +-2/(3 sqrt 3) = +-0.3849 (calculus; the path is lambda = f(u)).
DenseProblem cubic_problem() {
  return DenseProblem([](const V& u) { V f(1); f[0] = u[0] * u[0] * u[0] - 3 * u[0] * u[0] + 2 * u[0]; return f; },
                      [](const V& u) { M k(1, 1); k(0, 0) = 3 * u[0] * u[0] - 6 * u[0] + 2; return k; },
                      V::Ones(1));
}

// Two DOFs with a snap-back of the loaded DOF: a linear spring k1 between DOF 0 (loaded) and DOF 1,
// the cubic spring above from DOF 1 to ground. u0 = u1 + f(u1)/k1 turns back where f'(u1) < -k1.
DenseProblem snap_back_problem(double k1) {
  auto f2 = [](double x) { return x * x * x - 3 * x * x + 2 * x; };
  auto df2 = [](double x) { return 3 * x * x - 6 * x + 2; };
  V fref(2);
  fref << 1.0, 0.0;
  return DenseProblem(
      [=](const V& u) { V f(2); f << k1 * (u[0] - u[1]), -k1 * (u[0] - u[1]) + f2(u[1]); return f; },
      [=](const V& u) { M k(2, 2); k << k1, -k1, -k1, k1 + df2(u[1]); return k; }, fref);
}

TEST(PathFollower, LoadControlLandsExactlyOnMaxLoadFactorForLinearSpring) {
  DenseProblem p([](const V& u) { return V(2.0 * u); }, [](const V&) { return M(2.0 * M::Identity(1, 1)); }, V::Ones(1));
  LoadControl control;
  PathOptions o;
  o.first_step = 0.3;
  o.max_load_factor = 1.0;
  PathFollower follower(p, control, o);
  const PathSummary s = follower.run([](const ConvergedStep&) { return true; });
  EXPECT_EQ(s.status, PathStatus::Completed);
  EXPECT_DOUBLE_EQ(s.load_factor, 1.0);
  EXPECT_CLOSE(p.state()[0], 0.5, 1e-12, 0.0);
}

TEST(PathFollower, ArcLengthPassesBothLimitPointsOfCubicPath) {
  DenseProblem p = cubic_problem();
  ArcLength arc(V::Ones(1), ArcLength::Form::Cylindrical);
  PathOptions o;
  o.first_step = 0.05;
  o.max_steps = 400;
  double lambda_max = -1e9, lambda_min = 1e9;
  int max_pivots = 0;
  double max_du = 0.0, prev_u = 0.0;
  PathFollower follower(p, arc, o);
  const PathSummary s = follower.run([&](const ConvergedStep& step) {
    const double u = p.state()[0];
    EXPECT_CLOSE(u * u * u - 3 * u * u + 2 * u, step.load_factor, 0.0, 1e-8);  // on the path
    max_du = std::max(max_du, std::abs(u - prev_u));
    prev_u = u;
    if (u < 1.0) lambda_max = std::max(lambda_max, step.load_factor);  // first limit point
    if (u > 1.0 && u < 2.0) lambda_min = std::min(lambda_min, step.load_factor);  // second
    max_pivots = std::max(max_pivots, step.negative_pivots);
    return u < 2.5;
  });
  EXPECT_EQ(s.status, PathStatus::Completed) << s.message;
  const double limit = 2.0 / (3.0 * std::sqrt(3.0));
  std::cout << "cubic path: lambda_max " << lambda_max << " (exact " << limit << "), lambda_min "
            << lambda_min << ", steps " << s.steps << ", iterations " << s.iterations << "\n";
  // The converged points lie on the path exactly, but only sample it: a point at most h/2 from the
  // peak (h the largest step in u) is below it by at most |f''| (h/2)^2 / 2, |f''| = 2 sqrt 3 there.
  const double sampling = std::sqrt(3.0) * 0.25 * max_du * max_du;
  EXPECT_LE(lambda_max, limit + 1e-12);
  EXPECT_GE(lambda_max, limit - sampling);
  EXPECT_GE(lambda_min, -limit - 1e-12);
  EXPECT_LE(lambda_min, -limit + sampling);
  EXPECT_EQ(max_pivots, 1);  // f'(u) < 0 between the limit points
}

TEST(PathFollower, ArcLengthFollowsSnapBackWhereDisplacementControlCannot) {
  const double k1 = 0.5;  // f'(u1) reaches -1 < -k1: the loaded DOF snaps back
  DenseProblem p = snap_back_problem(k1);
  ArcLength arc(V::Ones(2), ArcLength::Form::Cylindrical);
  PathOptions o;
  o.force_tolerance = 1e-10;  // so that "on the path" below can be checked to 1e-8
  o.first_step = 0.05;
  o.max_steps = 600;
  double u0_max_before_back = -1e9;
  bool u0_decreased = false;
  double prev_u1 = 0.0;
  PathFollower follower(p, arc, o);
  const PathSummary s = follower.run([&](const ConvergedStep& step) {
    const V& u = p.state();
    const double f2 = u[1] * u[1] * u[1] - 3 * u[1] * u[1] + 2 * u[1];
    EXPECT_CLOSE(k1 * (u[0] - u[1]), step.load_factor, 0.0, 1e-8);
    EXPECT_CLOSE(f2, step.load_factor, 0.0, 1e-8);
    EXPECT_GT(u[1], prev_u1);  // the internal DOF never doubles back
    prev_u1 = u[1];
    if (u[0] < u0_max_before_back - 1e-6) u0_decreased = true;
    u0_max_before_back = std::max(u0_max_before_back, u[0]);
    return u[1] < 2.5;
  });
  EXPECT_EQ(s.status, PathStatus::Completed) << s.message;
  EXPECT_TRUE(u0_decreased) << "the loaded DOF must move back along the snap-back";
}

TEST(PathFollower, DisplacementControlPassesLoadLimitPoint) {
  DenseProblem p = cubic_problem();
  DisplacementControl control(V::Ones(1));
  PathOptions o;
  o.first_step = 0.05;
  o.max_control_value = 2.0;
  PathFollower follower(p, control, o);
  const PathSummary s = follower.run([&](const ConvergedStep& step) {
    const double u = p.state()[0];
    EXPECT_CLOSE(u * u * u - 3 * u * u + 2 * u, step.load_factor, 0.0, 1e-8);
    return true;
  });
  EXPECT_EQ(s.status, PathStatus::Completed) << s.message;
  EXPECT_CLOSE(p.state()[0], 2.0, 1e-12, 0.0);  // landed on max_control_value
  EXPECT_CLOSE(s.load_factor, 0.0, 0.0, 1e-8);  // f(2) = 0
}

TEST(PathFollower, NewtonConvergesQuadraticallyOnSnapBackPath) {
  // With one DOF the cylindrical constraint fixes u outright; two DOFs make the corrector iterate.
  DenseProblem p = snap_back_problem(0.5);
  ArcLength arc(V::Ones(2), ArcLength::Form::Cylindrical);
  PathOptions o;
  o.first_step = 0.1;
  o.force_tolerance = 1e-13;
  o.displacement_tolerance = 1e-12;
  PathFollower follower(p, arc, o);
  int checked = 0;
  follower.run([&](const ConvergedStep& step) {
    const auto& r = step.residual_norms;
    std::cout << "step " << step.step << " |r|:";
    for (double x : r) std::cout << " " << x;
    std::cout << "\n";
    // ||r_k+1|| <= C ||r_k||^2 once the iterates are close (r_k < 1e-2); C = 10 is moderate for
    // f'' = 6u - 6 of order 10 and f' of order 1. Below 1e-12 (a few thousand eps for O(1) terms)
    // the residual is round-off and no longer shows the rate.
    for (std::size_t k = 0; k + 1 < r.size(); ++k)
      if (r[k] < 1e-2 && r[k + 1] > 1e-12) {
        EXPECT_LE(r[k + 1], 10.0 * r[k] * r[k]);
        ++checked;
      }
    return step.step < 15;
  });
  EXPECT_GT(checked, 3);
}

TEST(PathFollower, ConvergedIteratesAreNeverFactorisedAndLikelyOnesSkipTheTangent) {
  // Each attempt factorises at its predicted state and at every iterate that did not converge; the
  // converged iterate's tangent is not factorised (the next predictor uses the one before it), so
  // a path without cut-backs costs 1 (start) + sum of iterations factorisations. (k1 = 2: a load
  // limit point, no snap-back.)
  DenseProblem p = snap_back_problem(2.0);
  ArcLength arc(V::Ones(2), ArcLength::Form::Cylindrical);
  PathOptions o;
  o.first_step = 0.1;
  o.force_tolerance = 1e-10;
  o.displacement_tolerance = 1e-8;
  PathFollower follower(p, arc, o);
  const PathSummary s = follower.run([&](const ConvergedStep& step) {
    EXPECT_LE(step.repeated_evaluations, step.residual_only_evaluations);
    return step.step < 20;
  });
  ASSERT_EQ(s.cutbacks, 0) << "the count below holds for paths without cut-backs";
  EXPECT_EQ(p.factorisations, 1 + s.iterations);
  EXPECT_EQ(p.evaluations, 1 + s.steps + s.iterations + s.repeated_evaluations);
  // Newton converges quadratically here: most converged iterates were foreseen.
  EXPECT_GE(s.residual_only_evaluations, s.steps / 2);
  std::cout << s.steps << " steps, " << s.iterations << " iterations, " << p.factorisations << " factorisations, "
            << s.residual_only_evaluations << " residual-only evaluations (" << s.repeated_evaluations
            << " repeated)\n";
}

// lambda = u up to 0.7, then 0.7 + 0.3 (1 - exp(-(u - 0.7) / 0.3)): linear, then softening towards
// lambda = 1 with a continuous slope, so the arc-length corrector can only lower the predicted
// load-factor increment past the knee (the tangent predictor overshoots a concave curve).
std::vector<ConvergedStep> rising_path(double rising_limit, int& cutbacks) {
  auto f = [](double u) { return u <= 0.7 ? u : 0.7 + 0.3 * (1.0 - std::exp(-(u - 0.7) / 0.3)); };
  auto df = [](double u) { return u <= 0.7 ? 1.0 : std::exp(-(u - 0.7) / 0.3); };
  DenseProblem p([=](const V& u) { V r(1); r[0] = f(u[0]); return r; },
                 [=](const V& u) { M k(1, 1); k(0, 0) = df(u[0]); return k; }, V::Ones(1));
  ArcLength arc(V::Ones(1), ArcLength::Form::Cylindrical);
  PathOptions o;
  o.first_step = 0.02;
  o.max_step_ratio = 1000.0;
  o.step_rule = StepRule::curve;
  o.curve.rising_limit = rising_limit;
  PathFollower follower(p, arc, o);
  follower.set_curve_monitor(V::Ones(1));
  std::vector<ConvergedStep> steps;
  const PathSummary s = follower.run([&](const ConvergedStep& step) {
    steps.push_back(step);
    return step.load_factor < 0.95;
  });
  EXPECT_EQ(s.status, PathStatus::Completed) << s.message;
  cutbacks = s.cutbacks;
  return steps;
}

TEST(PathFollower, RisingLimitHoldsStepsBelowPointNineToHalfTheRemainingRiseWithoutCutBacks) {
  // Without the limit the curve rule doubles the size while the curve is linear and overshoots the
  // knee: the step goes too far along the plastic part and is redone (a cut-back). With
  // rising_limit = 1 a step from lambda < 0.9 predicts at most half of 1 - lambda, and the
  // softening corrector keeps the converged step below that.
  int cutbacks_without = 0, cutbacks_with = 0;
  rising_path(std::numeric_limits<double>::quiet_NaN(), cutbacks_without);
  EXPECT_GT(cutbacks_without, 0) << "the test case must need the limit";
  double before = 0.0;
  for (const ConvergedStep& step : rising_path(1.0, cutbacks_with)) {
    if (before < 0.9) EXPECT_LE(step.load_factor, 0.5 * (1.0 + before) + 1e-12) << "step " << step.step;
    before = step.load_factor;
  }
  EXPECT_EQ(cutbacks_with, 0);
  std::cout << "cut-backs without the rising limit " << cutbacks_without << ", with it " << cutbacks_with << "\n";
}

TEST(PathFollower, TooLargeFirstStepIsCutBackAndSucceeds) {
  // Stiffening spring f = u + u^5: a first step of lambda = 50 does not converge in 4 iterations.
  DenseProblem p([](const V& u) { return V(u.array() + u.array().pow(5)); },
                 [](const V& u) { M k(1, 1); k(0, 0) = 1 + 5 * std::pow(u[0], 4); return k; }, V::Ones(1));
  LoadControl control;
  PathOptions o;
  o.first_step = 50.0;
  o.max_iterations = 4;
  o.max_load_factor = 50.0;
  o.max_steps = 200;
  PathFollower follower(p, control, o);
  const PathSummary s = follower.run([](const ConvergedStep&) { return true; });
  EXPECT_EQ(s.status, PathStatus::Completed) << s.message;
  EXPECT_GT(s.cutbacks, 0);
  EXPECT_DOUBLE_EQ(s.load_factor, 50.0);
  const double u = p.state()[0];
  EXPECT_CLOSE(u + std::pow(u, 5), 50.0, 1e-6, 0.0);
}

TEST(PathFollower, LoadBeyondCapacityStopsWithConvergedStepsKept) {
  // f = tanh(u) can carry at most lambda = 1; load control to 2 must stop cleanly.
  DenseProblem p([](const V& u) { return V(u.array().tanh()); },
                 [](const V& u) { M k(1, 1); k(0, 0) = 1.0 / std::pow(std::cosh(u[0]), 2); return k; }, V::Ones(1));
  LoadControl control;
  PathOptions o;
  o.first_step = 0.2;
  o.max_load_factor = 2.0;
  o.min_step_ratio = 1e-3;
  PathFollower follower(p, control, o);
  int observed = 0;
  double last = 0.0;
  const PathSummary s = follower.run([&](const ConvergedStep& step) { ++observed; last = step.load_factor; return true; });
  EXPECT_EQ(s.status, PathStatus::StepTooSmall);
  EXPECT_EQ(observed, s.steps);
  EXPECT_GT(last, 0.95);
  EXPECT_LT(last, 1.0);
  EXPECT_CLOSE(std::tanh(p.state()[0]), last, 0.0, 1e-6);  // the state is the last converged step
}

TEST(PathOptions, ValidateNamesTheBrokenOption) {
  PathOptions o;
  o.min_step_ratio = 0.0;
  try {
    o.validate();
    ADD_FAILURE() << "min_step_ratio = 0 accepted";
  } catch (const OptionError& e) {
    EXPECT_EQ(e.key(), "analysis.min_step_ratio");
    EXPECT_EQ(e.found(), "0");
  }
  EXPECT_NO_THROW(PathOptions{}.validate());
  o = PathOptions{};
  o.target_iterations = o.max_iterations + 1;
  EXPECT_THROW(o.validate(), OptionError);
}

}  // namespace
}  // namespace rotcap
