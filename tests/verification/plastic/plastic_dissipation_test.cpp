// Plastic dissipation over a load cycle of a small plastic model: a cantilever plate strip under an
// oblique tip force (vertical plus half as much sideways, so layers see biaxial stress and in-plane
// shear), displacement control of the tip deflection through the cycle 0 -> +d -> 0 -> -d -> 0
// (loading, unloading, reversed loading past reverse yield, unloading), d = 1.5 times the elastic
// deflection at the plastic collapse load.
//
// Checks, at every layer point and every converged step:
//  - LayerState::dissipation >= 0 and never decreases (the plastic work of a step is
//    dgamma sigma^T P sigma >= 0 for associative J2 flow: the second law for this material; Simo &
//    Hughes, Computational Inelasticity, 1998, section 2.2 and 3.4 on the dissipation inequality);
//  - the structure as a whole: external work W = sum over steps of the trapezoidal integral of
//    lambda f_ref . du never falls below the total dissipation D = sum over points of (volume
//    weight x dissipation): W - D is the elastic energy stored, which is >= 0. The trapezoid has an
//    error of order (step)^2 / 12 of the curvature of the load path; the margin W - D is printed.
// The layer history is rebuilt by HistoryReplay (history_replay.hpp) from the committed
// displacements, a second code path checked against ShellProblem::max_plastic_strain().
// Also checked: the reversed leg yields again (dissipation grows in it), so the cycle is a real
// elastic-plastic cycle and not an elastic shake-down.

#include "solver/nonlinear/shell_problem.hpp"
#include "solver/path/path_follower.hpp"
#include "tests/test_support.hpp"
#include "tests/verification/plastic/history_replay.hpp"
#include "tests/verification/plastic/plastic_strip.hpp"

#include <cmath>
#include <cstdio>
#include <vector>

namespace rotcap {
namespace {

using namespace rotcap::testing;

constexpr double kE = 210000.0, kNu = 0.3, kFy = 355.0, kL = 100.0, kB = 10.0, kT = 5.0;
constexpr int kLayers = 5;

struct CycleRecord {
  int steps = 0;
  int negative_points = 0;      // layer points x steps with dissipation < 0
  int decreasing_points = 0;    // layer points x steps whose dissipation fell
  double min_margin = 1e300;    // min over steps of (W - D) / W (W > 0)
  double worst_replay = 0.0;    // max relative difference of the max plastic strains
  std::vector<double> leg_dissipation;  // D at the end of each leg
};

TEST(PlasticDissipation, IsNonNegativeAtEveryLayerPointOverALoadCycle) {
  StripSpec spec;
  spec.length = kL;
  spec.width = kB;
  spec.thickness = kT;
  spec.stations = uniform_stations(kL, 10);
  ShellModel model = strip_model(spec);
  clamp_root_for_bending(model);
  const double Pc = kFy * kB * kT * kT / (4.0 * kL);
  model.loads = {{"tip", Eigen::Vector3d(0.0, 0.5 * Pc, -Pc), Eigen::Vector3d::Zero()}};
  const SectionAssignment sections = layered_sections(model, kE, kNu, linear_hardening(kFy, 0.0), kT, kLayers);
  ShellProblemOptions po;
  po.threads = 1;
  ShellProblem problem(model, sections, po);
  HistoryReplay replay(model, sections);
  // Volume weight of layer point (e, gp, k): a quarter of the (rectangular) element's area times
  // the Simpson weight of layer k.
  const auto& section = dynamic_cast<const LayeredShellSection&>(sections.section(0));
  const double quarter = 0.25 * (kL / 10.0) * (kB / spec.across);
  auto total_dissipation = [&](const std::vector<LayerState>& h) {
    double D = 0.0;
    for (std::size_t i = 0; i < h.size(); ++i) D += quarter * section.layer_weight(static_cast<int>(i % kLayers)) * h[i].dissipation;
    return D;
  };
  const Eigen::VectorXd f_ref_full = reference_load_vector(model);
  const DisplacementControl control(-group_mean_weights(model, problem.dofs(), "tip", Dof::uz));
  const double d = 1.5 * kFy * kL * kL / (kE * kT);  // 1.5 x 3.38 mm
  CycleRecord rec;
  double W = 0.0, lambda_prev = 0.0;
  Eigen::VectorXd u_prev = Eigen::VectorXd::Zero(model.dof_count());
  auto observer = [&](const ConvergedStep& step) {
    const Eigen::VectorXd u = problem.displacements();
    // External work of the step (trapezoid; the reference load has forces only).
    W += 0.5 * (lambda_prev + step.load_factor) * f_ref_full.dot(u - u_prev);
    u_prev = u;
    lambda_prev = step.load_factor;
    // Replay the step and check every layer point.
    replay.set_configuration(u);
    EXPECT_TRUE(replay.evaluate());
    const std::vector<LayerState> before = replay.committed_all();
    replay.commit();
    const std::vector<LayerState>& after = replay.committed_all();
    for (std::size_t i = 0; i < after.size(); ++i) {
      rec.negative_points += after[i].dissipation < 0.0;
      rec.decreasing_points += after[i].dissipation < before[i].dissipation;
    }
    const double m_problem = problem.max_plastic_strain(), m_replay = replay.max_committed_plastic_strain();
    if (m_problem > 0.0) rec.worst_replay = std::max(rec.worst_replay, std::abs(m_replay - m_problem) / m_problem);
    const double D = total_dissipation(after);
    if (W > 0.0) rec.min_margin = std::min(rec.min_margin, (W - D) / W);
    ++rec.steps;
    return true;
  };
  PathOptions options;
  options.first_step = 0.1;
  options.max_step_ratio = 1.0;
  options.max_steps = 400;
  double lambda = 0.0;
  std::printf("  leg | target delta [mm] | steps | P/P_c at end | total dissipation D [N mm] | W [N mm]\n");
  const double targets[] = {d, -d, -d, d};  // increments of the controlled deflection per leg
  double delta = 0.0;
  for (int leg = 0; leg < 4; ++leg) {
    options.max_control_value = targets[leg];  // measured from the start of each run
    const int before = rec.steps;
    const PathSummary s = PathFollower(problem, control, options).run(observer, lambda);
    ASSERT_EQ(s.status, PathStatus::Completed) << "leg " << leg << ": " << s.message;
    lambda = s.load_factor;
    delta += targets[leg];
    rec.leg_dissipation.push_back(total_dissipation(replay.committed_all()));
    std::printf("  %3d | %17.3f | %5d | %12.5f | %26.4f | %.4f\n", leg + 1, delta, rec.steps - before, lambda,
                rec.leg_dissipation.back(), W);
  }
  std::printf("  %d steps; points with D < 0: %d, with D falling: %d; min (W - D)/W = %.4f; replay vs "
              "problem max plastic strain: %.1e relative\n",
              rec.steps, rec.negative_points, rec.decreasing_points, rec.min_margin, rec.worst_replay);
  EXPECT_EQ(rec.negative_points, 0);
  EXPECT_EQ(rec.decreasing_points, 0);
  EXPECT_GE(rec.min_margin, 0.0);
  // Two code paths to the history agree (round-off of log/exp of the rotations).
  EXPECT_LT(rec.worst_replay, 1e-9);
  // Plastic in the first leg, elastic unloading (no new dissipation in leg 2 until reverse yield,
  // if any), reverse yield in leg 3.
  EXPECT_GT(rec.leg_dissipation[0], 0.0);
  EXPECT_GT(rec.leg_dissipation[2], rec.leg_dissipation[1] * (1.0 + 1e-3));
}

}  // namespace
}  // namespace rotcap
