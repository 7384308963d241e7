// Hinge verification 6: a run stopped by a step that does not converge keeps consistent results
// (docs/spec/interface.md: exit code 3, "a run that stops early ... still leaves every file consistent and
// readable, holding all converged steps").
//
// Case tests/data/hinge/interrupted.toml: HEB 300 cantilever, L = 1200 mm, elastic-perfectly
// plastic; max_iterations = 3 and min_step_ratio = 1 leave no room for a cut-back, so the first
// step that needs more than three Newton iterations (into the plastic range) ends the run.
#include "tests/test_support.hpp"
#include "tests/verification/hinge/hinge_run.hpp"

#include <gtest/gtest.h>

#include <cstdio>
#include <filesystem>

namespace rotcap::testing {
namespace {

namespace fs = std::filesystem;

TEST(HingeInterruptedRun, ExitsThreeAndKeepsEveryConvergedStep) {
  const HingeRun run = run_rotcap("run", hinge_case("interrupted.toml"), "interrupted");
  EXPECT_EQ(run.exit_code, 3) << run.err;
  ASSERT_TRUE(fs::exists(run.results / "summary.json"));
  const nlohmann::json s = read_json(run.results / "summary.json");
  std::printf("stop_reason '%s': %s\n", s["stop_reason"].get<std::string>().c_str(),
              s["message"].get<std::string>().c_str());
  EXPECT_EQ(s["stop_reason"], "no_convergence");
  const int steps = s["solver"]["steps"].get<int>();
  std::printf("solver.steps %d, cut-backs %d\n", steps, s["solver"]["cutbacks"].get<int>());
  EXPECT_GE(steps, 1) << "the elastic steps converge";
  // curve.csv: one row per converged step and the unloaded state, steps counted 0, 1, ...
  const CurveTable c = read_curve(run.results / "curve.csv");
  ASSERT_EQ(static_cast<int>(c.rows.size()), steps + 1);
  const std::vector<double> step = c.values("step");
  for (int k = 0; k <= steps; ++k) EXPECT_EQ(step[k], k);
  // The summary's numbers are those of the converged curve.
  const double m_last = c.values("moment_kNm").back();
  EXPECT_CLOSE(s["m_max_kNm"].get<double>(), m_last, 1e-6, 0.0) << "the curve still rises at the stop";
  EXPECT_LT(s["m_max_over_mp"].get<double>(), 1.0);
  EXPECT_TRUE(s["rotation_capacity"].is_null());
  // fields.pvd lists files that exist, the last one the last converged step.
  const std::vector<std::string> sets = pvd_datasets(run.results / "fields.pvd");
  ASSERT_FALSE(sets.empty());
  for (const std::string& f : sets) EXPECT_TRUE(fs::exists(run.results / f)) << f;
  char last[64];
  std::snprintf(last, sizeof last, "fields/step_%04d.vtu", steps);
  EXPECT_EQ(sets.back(), last);
  const VtuField f = read_vtu_field(run.results / sets.back());
  EXPECT_GT(f.u.norm(), 0.0);
  EXPECT_TRUE(fs::exists(run.results / "run.log"));
  EXPECT_TRUE(fs::exists(run.results / "curve.svg"));
  std::printf("run time %.2f s\n", run.wall_s);
}

}  // namespace
}  // namespace rotcap::testing
