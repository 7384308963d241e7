// The rotation at which a hinge curve first falls below a comparison law by more than a band.
// Synthetic polylines with hand-worked crossings (DERIVED in the comment beside each value);
// tolerances are round-off (1e-12 relative).
#include "model/hinge/hinge_curve.hpp"
#include "tests/test_support.hpp"

#include <stdexcept>
#include <vector>

namespace rotcap {
namespace {

using Curve = std::vector<MomentRotationPoint>;
constexpr double kRoundOff = 1e-12;

// An elastic-perfectly-plastic hinge law: slope 1e4 up to Mp = 100 at 0.01, flat to 0.2.
const Curve kPlateauLaw = {{0.0, 0.0}, {0.01, 100.0}, {0.2, 100.0}};

TEST(LawComparison, FindsTheCrossingOfARelativeBand) {
  // 5 % below the law means M < 95: 100 at 0.05 -> 90 at 0.07 crosses at 0.06.
  const Curve c = {{0.0, 0.0}, {0.01, 100.0}, {0.05, 100.0}, {0.07, 90.0}, {0.09, 80.0}};
  const std::optional<double> t = theta_first_below_law(c, kPlateauLaw, {.fraction = 0.05});
  ASSERT_TRUE(t.has_value());
  EXPECT_CLOSE(*t, 0.06, kRoundOff, 0.0);
}

TEST(LawComparison, UsesAFixedBandAndAStrictInequality) {
  const Curve c = {{0.0, 0.0}, {0.01, 100.0}, {0.05, 100.0}, {0.07, 90.0}, {0.09, 80.0}};
  // Band 0.15 * 100: M < 85, reached between 90 at 0.07 and 80 at 0.09, at 0.08.
  const std::optional<double> t =
      theta_first_below_law(c, kPlateauLaw, {.fraction = 0.15, .reference_moment = 100.0});
  ASSERT_TRUE(t.has_value());
  EXPECT_CLOSE(*t, 0.08, kRoundOff, 0.0);
  // Band 0.2 * 100: the last point sits exactly on M = 80, which is not "more than" the band.
  EXPECT_FALSE(theta_first_below_law(c, kPlateauLaw, {.fraction = 0.2, .reference_moment = 100.0}));
}

TEST(LawComparison, IsExactWhenTheLawBendsInsideACurveStep) {
  // Law hardening from (0.01, 100) to (0.03, 120); curve flat at 100 over one long step from 0.01
  // to 0.05. Below 95 % of the law where 100 = 0.95 (100 + 1000 (theta - 0.01)):
  // theta = 0.01 + (100 / 0.95 - 100) / 1000.
  const Curve law = {{0.0, 0.0}, {0.01, 100.0}, {0.03, 120.0}};
  const Curve c = {{0.0, 0.0}, {0.01, 100.0}, {0.05, 100.0}};
  const std::optional<double> t = theta_first_below_law(c, law, {.fraction = 0.05});
  ASSERT_TRUE(t.has_value());
  EXPECT_CLOSE(*t, 0.01 + (100.0 / 0.95 - 100.0) / 1000.0, kRoundOff, 0.0);
}

TEST(LawComparison, DoesNotExtrapolateTheLaw) {
  const Curve law = {{0.0, 0.0}, {0.01, 100.0}, {0.04, 100.0}};
  const Curve c = {{0.0, 0.0}, {0.01, 100.0}, {0.05, 100.0}, {0.07, 60.0}};
  EXPECT_FALSE(theta_first_below_law(c, law));
  EXPECT_FALSE(theta_first_below_law(Curve{{0.0, 0.0}}, law));
}

TEST(LawComparison, StartsWhereToldPastTheKnee) {
  // Gradual yielding keeps the curve more than 5 % under the plateau law around the knee:
  // (0.005, 50) has margin 50 - 47.5 = 2.5, (0.01, 85) has 85 - 95 = -10: crossing at
  // 0.005 + 0.005 * 2.5 / 12.5 = 0.006.
  const Curve c = {{0.0, 0.0}, {0.005, 50.0}, {0.01, 85.0}, {0.02, 98.0}, {0.05, 101.0}, {0.07, 90.0}};
  EXPECT_CLOSE(*theta_first_below_law(c, kPlateauLaw), 0.006, kRoundOff, 0.0);
  // From 0.02 on: margins 3 (0.02), 6 (0.05), -5 (0.07): 0.05 + 0.02 * 6 / 11.
  EXPECT_CLOSE(*theta_first_below_law(c, kPlateauLaw, {.from_theta = 0.02}), 0.05 + 0.02 * 6.0 / 11.0,
               kRoundOff, 0.0);
  // From 0.01 on: the first compared point is already below, so its theta is the answer.
  EXPECT_CLOSE(*theta_first_below_law(c, kPlateauLaw, {.from_theta = 0.01}), 0.01, kRoundOff, 0.0);
  // From 0.0075, inside a step: margin there 67.5 - 71.25 = -3.75 < 0, so 0.0075 itself.
  EXPECT_CLOSE(*theta_first_below_law(c, kPlateauLaw, {.from_theta = 0.0075}), 0.0075, kRoundOff, 0.0);
}

TEST(LawComparison, FollowsTheCurveInPathOrderThroughASnapBack) {
  // 100 at 0.05 back to 80 at 0.04: margins 5 and -15, crossing a quarter of the way, 0.0475.
  const Curve c = {{0.0, 0.0}, {0.01, 100.0}, {0.05, 100.0}, {0.04, 80.0}};
  EXPECT_CLOSE(*theta_first_below_law(c, kPlateauLaw), 0.0475, kRoundOff, 0.0);
}

TEST(LawComparison, RejectsBadInput) {
  const Curve c = {{0.0, 0.0}, {0.01, 100.0}};
  EXPECT_THROW(theta_first_below_law(Curve{}, kPlateauLaw), std::invalid_argument);
  EXPECT_THROW(theta_first_below_law(c, Curve{{0.0, 0.0}}), std::invalid_argument);
  EXPECT_THROW(theta_first_below_law(c, Curve{{0.0, 0.0}, {0.01, 1.0}, {0.01, 2.0}}), std::invalid_argument);
  EXPECT_THROW(theta_first_below_law(c, kPlateauLaw, {.fraction = 1.0}), std::invalid_argument);
  EXPECT_THROW(theta_first_below_law(c, kPlateauLaw, {.reference_moment = -1.0}), std::invalid_argument);
  EXPECT_THROW(theta_first_below_law(Curve{{0.0, NAN}}, kPlateauLaw), std::invalid_argument);
}

}  // namespace
}  // namespace rotcap
