// Hinge verification 7: mesh convergence of the demo (issue requirement: M_max and theta at M_max
// change by less than 2 % and 5 % from the default mesh to one 1.5 times finer).
//
// The demo case cases/carpark_girder.toml (invented welded girder 500 x 220 x 12 x 8, S355, class 3
// flange, cantilever 2 m, welded residual stresses, buckling-mode imperfection b/200) is run twice
// through `rotcap run`: as bundled (flange_elements 18, web_elements 23 with the default coarse
// tension side: 23,128 free DOFs) and with --mesh-scale 1.5 (28, the flange count rounded to even,
// and 35: 54,004 free DOFs; the tension side and the element length along the member follow). Only [analysis] stop_below is raised from 0.9 to 0.97 so each
// run stops some steps past the peak: M_max and theta at M_max come from the curve up to there,
// identical to the full run's.
//
// The limits are the acceptance criteria (a project requirement, not a published value).
// Full runs of this pair on the uniform mesh of before (bench/results/demo_mesh_study.txt): M_max
// -0.07 %, theta at M_max -1.7 %, theta_u -1.7 %, R -4.0 %. The default mesh is the study's converged level (9 elements per flange
// outstand); coarser meshes overstate the rotations by up to 40 % (same file).
#include "tests/test_support.hpp"
#include "tests/verification/hinge/hinge_run.hpp"

#include <gtest/gtest.h>

#include <cmath>
#include <cstdio>
#include <fstream>

namespace rotcap::testing {
namespace {

/// The demo case with stop_below 0.97, written to a scratch folder; returns its path.
std::filesystem::path demo_case_stopping_past_the_peak() {
  std::string s = read_text(source_path("cases/carpark_girder.toml"));
  const std::string from = "stop_below = 0.9\n", to = "stop_below = 0.97\n";
  const auto at = s.find(from);
  if (at == std::string::npos) return {};
  s.replace(at, from.size(), to);
  const std::filesystem::path out = scratch_folder("mesh_convergence_case") / "carpark_girder.toml";
  std::ofstream(out) << s;
  return out;
}

TEST(HingeMeshConvergence, DemoPeakMovesLessThanTwoAndFivePercentWithAMeshOneAndAHalfTimesFiner) {
  const std::filesystem::path demo = demo_case_stopping_past_the_peak();
  ASSERT_FALSE(demo.empty()) << "cases/carpark_girder.toml: expected the line \"stop_below = 0.9\"";
  const HingeRun coarse = run_rotcap("run", demo, "mesh_convergence_default");
  ASSERT_EQ(coarse.exit_code, 0) << coarse.err;
  const HingeRun fine = run_rotcap("run", demo, "mesh_convergence_finer", "--mesh-scale 1.5");
  ASSERT_EQ(fine.exit_code, 0) << fine.err;
  const nlohmann::json a = read_json(coarse.results / "summary.json"), b = read_json(fine.results / "summary.json");
  ASSERT_EQ(a["input"]["mesh"]["flange_elements"], 18);
  ASSERT_EQ(a["input"]["mesh"]["web_elements"], 23);
  ASSERT_EQ(b["input"]["mesh"]["flange_elements"], 28);
  ASSERT_EQ(b["input"]["mesh"]["web_elements"], 35);
  const double m0 = a["m_max_kNm"].get<double>(), m1 = b["m_max_kNm"].get<double>();
  const double t0 = a["theta_at_m_max_mrad"].get<double>(), t1 = b["theta_at_m_max_mrad"].get<double>();
  const double dm = 100.0 * (m1 / m0 - 1.0), dt = 100.0 * (t1 / t0 - 1.0);
  std::printf("demo mesh study: default 18 x 23 (%d free DOFs, %.1f s), finer 28 x 35 (%d free DOFs, %.1f s)\n",
              a["solver"]["free_dofs"].get<int>(), coarse.wall_s, b["solver"]["free_dofs"].get<int>(), fine.wall_s);
  std::printf("  M_max:          %.2f kNm -> %.2f kNm, change %+.2f %% (limit 2 %%)\n", m0, m1, dm);
  std::printf("  theta at M_max: %.2f mrad -> %.2f mrad, change %+.2f %% (limit 5 %%)\n", t0, t1, dt);
  // Printed only: the label is judged from the shape where each run stops, here just past the peak
  // while the buckle is still forming (the full demo ends with flange_local_buckling on both meshes).
  std::printf("  shape at the stop (0.97 M_max): %s -> %s\n", a["failure_mode"].get<std::string>().c_str(),
              b["failure_mode"].get<std::string>().c_str());
  EXPECT_LT(std::abs(dm), 2.0);
  EXPECT_LT(std::abs(dt), 5.0);
}

}  // namespace
}  // namespace rotcap::testing
