// HardeningCurve: interpolation, the constant continuation beyond the last point, and input
// validation (messages name the offending point).
#include "materials/hardening_curve.hpp"

#include "tests/test_support.hpp"

#include <stdexcept>
#include <string>

namespace rotcap {
namespace {

HardeningCurve three_points() {
  return HardeningCurve({{0.0, 355.0}, {0.02, 361.0}, {0.10, 520.0}});
}

std::string message_of(const std::vector<HardeningCurve::Point>& pts,
                       HardeningCurve::Options o = {}) {
  try {
    HardeningCurve c(pts, o);
  } catch (const std::invalid_argument& e) {
    return e.what();
  }
  return "";
}

TEST(HardeningCurve, InterpolatesLinearlyBetweenPoints) {
  const HardeningCurve c = three_points();
  // Segment 1: slope (520 - 361) / 0.08 = 1987.5 MPa.
  EXPECT_CLOSE(c.flow_stress(0.06), 361.0 + 1987.5 * 0.04, 1e-14, 0.0);
  EXPECT_CLOSE(c.slope(0.06), 1987.5, 1e-12, 0.0);
  // Segment 0: slope 6 / 0.02 = 300 MPa.
  EXPECT_CLOSE(c.flow_stress(0.01), 358.0, 1e-14, 0.0);
  EXPECT_CLOSE(c.slope(0.01), 300.0, 1e-12, 0.0);
  EXPECT_EQ(c.segment(0.01), 0u);
  EXPECT_EQ(c.segment(0.06), 1u);
  EXPECT_EQ(c.initial_yield_stress(), 355.0);
}

TEST(HardeningCurve, ReproducesEveryPointExactly) {
  const HardeningCurve c = three_points();
  for (const auto& p : c.points()) EXPECT_EQ(c.flow_stress(p.plastic_strain), p.stress);
}

TEST(HardeningCurve, SlopeAtBreakpointIsThatOfTheSegmentToTheRight) {
  const HardeningCurve c = three_points();
  EXPECT_CLOSE(c.slope(0.0), 300.0, 1e-12, 0.0);
  EXPECT_CLOSE(c.slope(0.02), 1987.5, 1e-12, 0.0);
  EXPECT_EQ(c.segment(0.02), 1u);
}

TEST(HardeningCurve, HoldsLastStressConstantBeyondLastPoint) {
  const HardeningCurve c = three_points();
  EXPECT_EQ(c.flow_stress(0.10), 520.0);
  EXPECT_EQ(c.flow_stress(0.5), 520.0);
  EXPECT_EQ(c.slope(0.10), 0.0);
  EXPECT_EQ(c.slope(3.0), 0.0);
  EXPECT_EQ(c.segment(3.0), 2u);
}

TEST(HardeningCurve, PerfectlyPlasticIsConstant) {
  const HardeningCurve c = HardeningCurve::perfectly_plastic(235.0);
  EXPECT_EQ(c.size(), 1u);
  EXPECT_EQ(c.flow_stress(0.0), 235.0);
  EXPECT_EQ(c.flow_stress(0.3), 235.0);
  EXPECT_EQ(c.slope(0.3), 0.0);
  EXPECT_EQ(c.minimum_stress(), 235.0);
}

TEST(HardeningCurve, RejectsFirstStrainNotZero) {
  const std::string m = message_of({{0.001, 355.0}, {0.02, 400.0}});
  EXPECT_NE(m.find("point 0"), std::string::npos) << m;
  EXPECT_NE(m.find("0.001"), std::string::npos) << m;
}

TEST(HardeningCurve, RejectsNonIncreasingStrainsNamingThePoint) {
  const std::string m = message_of({{0.0, 355.0}, {0.02, 400.0}, {0.02, 450.0}});
  EXPECT_NE(m.find("point 2"), std::string::npos) << m;
  EXPECT_NE(m.find("increase strictly"), std::string::npos) << m;
  EXPECT_NE(message_of({{0.0, 355.0}, {0.02, 400.0}, {0.01, 450.0}}), "");
}

TEST(HardeningCurve, RejectsNonPositiveStress) {
  const std::string m = message_of({{0.0, 355.0}, {0.02, -1.0}});
  EXPECT_NE(m.find("point 1"), std::string::npos) << m;
  EXPECT_NE(m.find("> 0"), std::string::npos) << m;
  EXPECT_NE(message_of({{0.0, 0.0}}), "");
}

TEST(HardeningCurve, RejectsSofteningUnlessAllowed) {
  const std::vector<HardeningCurve::Point> pts{{0.0, 355.0}, {0.02, 400.0}, {0.05, 380.0}};
  const std::string m = message_of(pts);
  EXPECT_NE(m.find("negative slope"), std::string::npos) << m;
  EXPECT_NE(m.find("point 2"), std::string::npos) << m;
  HardeningCurve::Options allow;
  allow.allow_softening = true;
  const HardeningCurve c(pts, allow);
  EXPECT_CLOSE(c.slope(0.03), -20.0 / 0.03, 1e-12, 0.0);
  EXPECT_EQ(c.minimum_stress(), 355.0);
}

TEST(HardeningCurve, RejectsEmptyAndNegativeEvaluation) {
  EXPECT_THROW(HardeningCurve(std::vector<HardeningCurve::Point>{}), std::invalid_argument);
  EXPECT_THROW(three_points().evaluate(-1e-9), std::invalid_argument);
}

}  // namespace
}  // namespace rotcap
