// Hinge verification 4: local buckling caps the hinge of a class 4 section; a class 1 section
// with strain hardening passes Mp and rotates.
//
// EN 1993-1-1 Table 5.2 (docs/spec/references.md section 4): outstand flange in compression, class 1 / 2 / 3
// limits c/t <= 9 eps / 10 eps / 14 eps, eps = sqrt(235 / fy).
//  a. class4_flange.toml: an invented welded section (h 300, b 300, tf 8, tw 8 mm; not a catalogue
//     section), S355: c/t = (b - tw) / 2 / tf = 18.25 > 14 eps = 11.39, class 4; under uniform
//     moment, L = 1200 mm, half-sine flange imperfection b/200, quad-linear steel. Expected:
//     the moment peaks below Mp (m_max_over_mp < 1), rotation_capacity null, failure by flange
//     local buckling.
//  b. class1_hardening.toml: HEB 300, S235 (c/t 6.18 <= 9 eps with the root radius, the
//     handbook way), cantilever L = 1200 mm, quad-linear steel (Yun & Gardner 2017, from memory),
//     half-sine flange imperfection b/200. Expected: M_max > Mp and R >= 3, the capacity commonly
//     required for plastic design (common practice; Yura, Galambos & Ravindra 1978, from
//     memory). R may be a lower bound when the run ends (max_rotation) with M still above Mp.
#include "tests/test_support.hpp"
#include "tests/verification/hinge/hinge_run.hpp"

#include <gtest/gtest.h>

#include <cmath>
#include <cstdio>

namespace rotcap::testing {
namespace {

TEST(HingeLocalBuckling, ClassFourFlangesCapTheMomentBelowMp) {
  const double b = 300.0, tf = 8.0, tw = 8.0, fy = 355.0;
  const double eps = std::sqrt(235.0 / fy), c_over_t = 0.5 * (b - tw) / tf;
  std::printf("flange c/t = %.2f, class 3 limit 14 eps = %.2f (EN 1993-1-1 Table 5.2)\n", c_over_t, 14.0 * eps);
  ASSERT_GT(c_over_t, 14.0 * eps);
  const HingeRun run = run_rotcap("run", hinge_case("class4_flange.toml"), "class4_flange");
  ASSERT_EQ(run.exit_code, 0) << run.err;
  const nlohmann::json s = read_json(run.results / "summary.json");
  EXPECT_EQ(s["flange_class"], 4);
  EXPECT_EQ(s["section_class"], 4);
  const double m = s["m_max_over_mp"].get<double>();
  std::printf("M_max / Mp = %.4f (expected < 1: EN 1993-1-1 5.5.2, a class 4 section buckles locally before "
              "reaching its yield moment; Mel / Mp = %.4f)\n",
              m, s["mel_kNm"].get<double>() / s["mp_kNm"].get<double>());
  EXPECT_LT(m, 1.0);
  EXPECT_TRUE(s["rotation_capacity"].is_null());
  const CurveTable c = read_curve(run.results / "curve.csv");
  EXPECT_LT(c.values("m_over_mp").back(), 0.99 * m) << "the curve falls past the peak";
  std::printf("failure mode: %s (%s)\n", s["failure_mode"].get<std::string>().c_str(),
              s["failure_mode_reason"].get<std::string>().c_str());
  EXPECT_EQ(s["failure_mode"], "flange_local_buckling");
  std::printf("run time %.2f s (%d steps)\n", run.wall_s, s["solver"]["steps"].get<int>());
}

TEST(HingeLocalBuckling, ClassOneSectionWithHardeningExceedsMpAndReachesRThree) {
  const HingeRun run = run_rotcap("run", hinge_case("class1_hardening.toml"), "class1_hardening");
  ASSERT_EQ(run.exit_code, 0) << run.err;
  const nlohmann::json s = read_json(run.results / "summary.json");
  EXPECT_EQ(s["flange_class"], 1);
  EXPECT_EQ(s["section_class"], 1);
  const double m = s["m_max_over_mp"].get<double>();
  std::printf("M_max / Mp = %.4f (expected > 1)\n", m);
  EXPECT_GT(m, 1.0);
  ASSERT_FALSE(s["rotation_capacity"].is_null()) << s["extraction"];
  const double R = s["rotation_capacity"].get<double>();
  const bool lower = s["rotation_capacity_is_lower_bound"].get<bool>();
  std::printf("R = %.3f%s; required R >= 3 (common practice, Yura, Galambos & Ravindra 1978, from memory); "
              "theta_p %.3f mrad, theta_u %.3f mrad\n",
              R, lower ? " (lower bound: the run ended above Mp)" : "", s["theta_p_mrad"].get<double>(),
              s["theta_u_mrad"].get<double>());
  EXPECT_GE(R, 3.0);
  std::printf("run time %.2f s (%d steps)\n", run.wall_s, s["solver"]["steps"].get<int>());
}

}  // namespace
}  // namespace rotcap::testing
