// The rotation-demand verdict (model/hinge/rotation_demand.hpp) on extraction results built by hand:
// every branch of the rule in the header (final theta_u, lower bound, no Mp) for both kinds of demand.
#include "model/hinge/rotation_demand.hpp"

#include "core/check.hpp"
#include "tests/test_support.hpp"

namespace rotcap {
namespace {

/// theta_p 5 mrad; theta_u 20 mrad (R = 3) unless the hinge never reaches Mp.
HingeCurveResult extraction(bool reaches_mp, bool lower_bound) {
  HingeCurveResult r;
  r.mp = 100e6;
  r.theta_p = 0.005;
  r.m_max = reaches_mp ? 105e6 : 95e6;
  r.status = !reaches_mp ? HingeCurveStatus::below_mp
                         : lower_bound ? HingeCurveStatus::ends_above_mp : HingeCurveStatus::falls_back_to_mp;
  if (reaches_mp) {
    r.theta_u = 0.020;
    r.rotation_capacity = 3.0;
    r.rotation_capacity_is_lower_bound = lower_bound;
  }
  return r;
}

const RotationDemand kPlastic12mrad{RotationDemand::Kind::plastic_rotation, 0.012};
const RotationDemand kR4{RotationDemand::Kind::rotation_capacity, 4.0};

TEST(RotationDemand, FinalThetaUMeetsASmallerPlasticRotationWithItsMargin) {
  const DemandCheck c = check_rotation_demand(kPlastic12mrad, extraction(true, false));
  EXPECT_EQ(c.verdict, "met");
  EXPECT_CLOSE(*c.available, 0.015, 1e-14, 0.0);  // theta_u - theta_p
  EXPECT_CLOSE(*c.margin, 0.003, 1e-12, 0.0);
  EXPECT_CLOSE(c.required_theta_u, 0.017, 1e-14, 0.0);
}

TEST(RotationDemand, FinalThetaUFailsALargerRequiredR) {
  const DemandCheck c = check_rotation_demand(kR4, extraction(true, false));
  EXPECT_EQ(c.verdict, "not met");
  EXPECT_EQ(*c.available, 3.0);
  EXPECT_EQ(*c.margin, -1.0);
  EXPECT_CLOSE(c.required_theta_u, 0.025, 1e-14, 0.0);  // theta_p (1 + R_req)
}

TEST(RotationDemand, LowerBoundThatReachesTheDemandMeetsIt) {
  const RotationDemand r2{RotationDemand::Kind::rotation_capacity, 2.0};
  EXPECT_EQ(check_rotation_demand(r2, extraction(true, true)).verdict, "met");
}

TEST(RotationDemand, LowerBoundBelowTheDemandIsNotShownRatherThanFailed) {
  const DemandCheck c = check_rotation_demand(kR4, extraction(true, true));
  EXPECT_EQ(c.verdict, "not shown");
  EXPECT_NE(c.note.find("max_rotation"), std::string::npos) << c.note;
}

TEST(RotationDemand, AHingeBelowMpMeetsNoDemand) {
  const DemandCheck c = check_rotation_demand(kPlastic12mrad, extraction(false, false));
  EXPECT_EQ(c.verdict, "not met");
  EXPECT_FALSE(c.available.has_value());
  EXPECT_FALSE(c.margin.has_value());
}

TEST(RotationDemand, AnExtractionWithoutThetaPIsAProgrammingError) {
  HingeCurveResult r = extraction(true, false);
  r.theta_p.reset();
  EXPECT_THROW(check_rotation_demand(kR4, r), InternalError);
}

}  // namespace
}  // namespace rotcap
