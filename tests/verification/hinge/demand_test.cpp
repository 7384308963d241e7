// The rotation demand end to end: `rotcap run` on hinge cases of tests/data/hinge/ with a [demand]
// table appended; summary.json's verdict, margin and both R values against the run's own extracted
// numbers (the verdict rule is model/hinge/rotation_demand.hpp; these tests check the wiring).
#include "tests/verification/hinge/hinge_run.hpp"

#include <gtest/gtest.h>

#include <fstream>

namespace rotcap::testing {
namespace {

namespace fs = std::filesystem;

/// Runs `file` with `demand` appended as a [demand] table; returns summary.json.
nlohmann::json run_with_demand(const std::string& file, const std::string& demand, const std::string& name) {
  const fs::path folder = scratch_folder(name + "_case");
  const fs::path case_file = folder / file;
  std::ofstream(case_file) << read_text(hinge_case(file)) << "\n[demand]\n" << demand << "\n";
  const HingeRun run = run_rotcap("run", case_file, name);
  EXPECT_EQ(run.exit_code, 0) << run.err;
  return read_json(run.results / "summary.json");
}

TEST(HingeDemand, StockyClass1HingeMeetsRThreeOnItsLowerBoundAndReportsBothR) {
  const nlohmann::json s = run_with_demand("plastic_stocky.toml", "rotation_capacity = 3.0", "demand_r3");
  ASSERT_TRUE(s["demand"].is_object());
  EXPECT_EQ(s["demand"]["kind"], "rotation_capacity");
  EXPECT_EQ(s["demand"]["verdict"], "met");
  const double R = s["rotation_capacity"].get<double>();
  EXPECT_EQ(s["demand"]["available"].get<double>(), R);
  EXPECT_DOUBLE_EQ(s["demand"]["margin"].get<double>(), R - 3.0);
  // R with the beam-theory theta_p: theta_u / theta_p_beam - 1 from the summary's own numbers.
  const double r_beam = s["theta_u_mrad"].get<double>() / s["theta_p_beam_mrad"].get<double>() - 1.0;
  EXPECT_NEAR(s["rotation_capacity_beam_theta_p"].get<double>(), r_beam, 1e-12);
  EXPECT_NEAR(s["available_plastic_rotation_mrad"].get<double>(),
              s["theta_u_mrad"].get<double>() - s["theta_p_mrad"].get<double>(), 1e-9);
  EXPECT_NE(s["theta_p_note"].get<std::string>().find("Timoshenko"), std::string::npos);
}

TEST(HingeDemand, ADemandBeyondTheLowerBoundIsNotShownAndNamesTheRemedy) {
  const nlohmann::json s = run_with_demand("plastic_stocky.toml", "plastic_rotation_mrad = 500", "demand_500mrad");
  EXPECT_EQ(s["demand"]["verdict"], "not shown");
  EXPECT_EQ(s["demand"]["unit"], "mrad");
  EXPECT_NE(s["demand"]["note"].get<std::string>().find("max_rotation"), std::string::npos);
}

TEST(HingeDemand, AHingeThatNeverReachesMpMeetsNoDemand) {
  const nlohmann::json s = run_with_demand("class4_flange.toml", "plastic_rotation_mrad = 1.0", "demand_class4");
  EXPECT_LT(s["m_max_over_mp"].get<double>(), 1.0);
  EXPECT_EQ(s["demand"]["verdict"], "not met");
  EXPECT_TRUE(s["demand"]["available"].is_null());
}

}  // namespace
}  // namespace rotcap::testing
