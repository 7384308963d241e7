// Hinge verification: steps sized by the moment-rotation curve (analysis.step_rule = "curve", the
// default of generated models) against constant small steps.
//
// tests/data/hinge/step_rule_girder.toml (the demo's invented girder on a coarse 6 x 8 mesh) is run
// twice: with the defaults, and with step_rule = "iterations", first_step = 0.025, max_step_ratio = 1
// (constant arc-length steps of 0.025, the finest of bench/results/step_size_study.txt). The targets
// are the project's own (performance issue, item 4; no outside reference): M_max within 0.2 %, theta
// at M_max within 2 % and R within 2 % of the constant-step run, with at most 40 % of its steps.
// Both runs integrate the layer points with the default 4 substeps (materials/j2_plane_stress.hpp).
#include "tests/test_support.hpp"
#include "tests/verification/hinge/hinge_run.hpp"

#include <gtest/gtest.h>

#include <cmath>
#include <cstdio>
#include <fstream>

namespace rotcap::testing {
namespace {

std::filesystem::path with_constant_steps(const std::filesystem::path& source, const std::string& name) {
  std::string text = read_text(source);
  const std::string key = "max_steps = 200";
  const std::size_t at = text.find(key);
  EXPECT_NE(at, std::string::npos);
  text.replace(at, key.size(),
               "max_steps = 600\nstep_rule = \"iterations\"\nfirst_step = 0.025\nmax_step_ratio = 1.0");
  const std::filesystem::path file = scratch_folder(name + "_case") / "constant_steps.toml";
  std::ofstream(file) << text;
  return file;
}

double relative(double value, double reference) { return value / reference - 1.0; }

TEST(HingeStepRule, CurveStepsMatchConstantSmallStepsWithFewerThanHalfTheSteps) {
  const std::filesystem::path source = hinge_case("step_rule_girder.toml");
  const HingeRun curve = run_rotcap("run", source, "step_rule_curve");
  ASSERT_EQ(curve.exit_code, 0) << curve.err;
  const HingeRun constant = run_rotcap("run", with_constant_steps(source, "step_rule"), "step_rule_constant");
  ASSERT_EQ(constant.exit_code, 0) << constant.err;
  const nlohmann::json a = read_json(curve.results / "summary.json");
  const nlohmann::json b = read_json(constant.results / "summary.json");
  ASSERT_EQ(a["input"]["analysis"]["step_rule"], "curve");
  ASSERT_EQ(b["input"]["analysis"]["step_rule"], "iterations");
  ASSERT_FALSE(a["rotation_capacity"].is_null()) << a["extraction"];
  ASSERT_FALSE(b["rotation_capacity"].is_null()) << b["extraction"];
  ASSERT_FALSE(a["rotation_capacity_is_lower_bound"].get<bool>());
  ASSERT_FALSE(b["rotation_capacity_is_lower_bound"].get<bool>());
  const int steps_a = a["solver"]["steps"].get<int>(), steps_b = b["solver"]["steps"].get<int>();
  const double dm = relative(a["m_max_over_mp"].get<double>(), b["m_max_over_mp"].get<double>());
  const double dt = relative(a["theta_at_m_max_mrad"].get<double>(), b["theta_at_m_max_mrad"].get<double>());
  const double dr = relative(a["rotation_capacity"].get<double>(), b["rotation_capacity"].get<double>());
  std::printf("step_rule curve: %d steps, %d iterations, %.1f s; constant 0.025: %d steps, %d iterations, %.1f s\n",
              steps_a, a["solver"]["iterations"].get<int>(), curve.wall_s, steps_b,
              b["solver"]["iterations"].get<int>(), constant.wall_s);
  std::printf("curve against constant (project targets): M_max %+.3f %% (0.2 %%), theta at M_max %+.2f %% (2 %%), "
              "R %+.2f %% (2 %%); R = %.3f against %.3f\n",
              100 * dm, 100 * dt, 100 * dr, a["rotation_capacity"].get<double>(), b["rotation_capacity"].get<double>());
  EXPECT_LE(std::abs(dm), 0.002);
  EXPECT_LE(std::abs(dt), 0.02);
  EXPECT_LE(std::abs(dr), 0.02);
  EXPECT_LE(steps_a, 0.4 * steps_b);
}

}  // namespace
}  // namespace rotcap::testing
