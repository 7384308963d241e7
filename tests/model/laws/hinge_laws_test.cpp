// The simple hinge laws: member integration of M-kappa, elastic-perfectly plastic and linear
// strain-hardening hinges.
#include "materials/steel_curve.hpp"
#include "model/laws/hinge_laws.hpp"
#include "tests/test_support.hpp"

#include <cmath>

namespace rotcap {
namespace {

ISection ipe300_plates() { return ISection{"", 300.0, 150.0, 10.7, 7.1, 0.0, 0.0}; }

MomentCurvatureCurve section_curve(const UniaxialFibreLaw& law, double max_strain = 0.0) {
  MomentCurvatureOptions o;
  o.max_strain = max_strain;
  return moment_curvature(plate_model_fibres(ipe300_plates(), ResidualStressPattern()), law, o);
}

TEST(MemberRotation, CantileverElasticRangeEqualsBeamTheory) {
  // Cantilever tip load P: delta = P L^3 / (3 E I) (any strength-of-materials text, e.g. Timoshenko & Gere,
  // "Mechanics of Materials", 1972, table of deflections), theta = delta / L, M = P L.
  const double E = 210000.0, fy = 355.0, L = 1500.0;
  const MomentCurvatureCurve mk = section_curve(UniaxialFibreLaw(E, {{fy / E, fy}}), 0.05);
  const std::vector<MomentRotationPoint> c = integrate_member_rotation(mk, HingeSetup::cantilever, L, 0.0);
  int checked = 0;
  for (const MomentRotationPoint& p : c) {
    if (p.moment == 0.0 || p.moment > mk.first_yield_moment) continue;
    const double P = p.moment / L;
    EXPECT_CLOSE(p.theta, P * L * L * L / (3.0 * mk.EI) / L, 1e-12, 0.0);
    ++checked;
  }
  EXPECT_GE(checked, 5);
}

TEST(MemberRotation, ElasticCoefficientsMatchBeamTheoryOfEverySetup) {
  // Elastic theta(M) of each setup equals beam_theory_rotation_at_mp's formulas (model/setups/):
  // three_point M L/(3EI); four_point M (3L - 4a)/(3EI); uniform_moment M L/(EI).
  const double E = 210000.0, fy = 355.0, L = 3000.0, a = 1000.0;
  const MomentCurvatureCurve mk = section_curve(UniaxialFibreLaw(E, {{fy / E, fy}}), 0.05);
  const MomentCurvaturePoint& q = mk.points[5];  // elastic
  ASSERT_LT(q.moment, mk.first_yield_moment);
  const auto at = [&](HingeSetup s, double span, double shear) {
    for (const MomentRotationPoint& p : integrate_member_rotation(mk, s, span, shear))
      if (p.moment == q.moment) return p.theta;
    return -1.0;
  };
  EXPECT_CLOSE(at(HingeSetup::three_point, L, 0.0), q.moment * L / (3.0 * mk.EI), 1e-12, 0.0);
  EXPECT_CLOSE(at(HingeSetup::four_point, L, a), q.moment * (3.0 * L - 4.0 * a) / (3.0 * mk.EI), 1e-12, 0.0);
  EXPECT_CLOSE(at(HingeSetup::uniform_moment, L, 0.0), q.moment * L / mk.EI, 1e-12, 0.0);
}

TEST(MemberRotation, WithStrainHardeningTheMomentExceedsMp) {
  SteelModel steel;  // quadlinear S355 / 490 (Yun & Gardner 2017, formulas from memory)
  const HardeningCurve hc = hardening_curve(steel);
  const MomentCurvatureCurve mk = section_curve(UniaxialFibreLaw::from_hardening_curve(steel.E, hc.points()));
  const double mp = steel.fy * plate_model_properties(ipe300_plates()).Wpl_y;
  const std::vector<MomentRotationPoint> c = integrate_member_rotation(mk, HingeSetup::cantilever, 1500.0, 0.0);
  EXPECT_GT(c.back().moment, 1.2 * mp);  // the flanges reach well into hardening at the ultimate strain
  for (std::size_t i = 1; i < c.size(); ++i) {
    EXPECT_GT(c[i].theta, c[i - 1].theta);
    EXPECT_GT(c[i].moment, c[i - 1].moment);
  }
  // Past theta_p the moment keeps rising above Mp.
  const std::optional<double> m5 = law_moment_at(c, 5.0 * mp * 1500.0 / (3.0 * mk.EI));
  ASSERT_TRUE(m5.has_value());
  EXPECT_GT(*m5, mp);
}

TEST(HardeningHinge, SecantReachesTheDerivedRelationAtTheReferenceRotation) {
  HardeningHingeInput in;
  in.setup = HingeSetup::cantilever;
  in.length = 1500.0;
  in.mp = 2.2e8;
  in.E = 210000.0;
  in.EI = in.E * 8.0e7;
  in.E_t = 2000.0;
  in.eps_sh = 0.02;
  in.zf = 144.65;
  in.k_el = 3.0 * in.EI / in.length;
  const HardeningHingeLaw law = linear_hardening_hinge(in, 0.1);
  ASSERT_TRUE(law.defined);
  const double theta_p = in.mp / in.k_el;
  EXPECT_CLOSE(spread_plastic_rotation(in, law.reference_moment), 4.0 * theta_p, 1e-9, 0.0);
  EXPECT_CLOSE(law.slope, (law.reference_moment - in.mp) / (4.0 * theta_p), 1e-12, 0.0);
  EXPECT_GT(law.slope, 0.0);
  // The law's curve: elastic to (theta_p, Mp), then M - Mp = K_sh theta_pl with theta_pl = theta - M / k_el.
  const MomentRotationPoint& end = law.curve.back();
  EXPECT_CLOSE(end.theta, 0.1, 1e-12, 0.0);
  EXPECT_CLOSE(end.moment - in.mp, law.slope * (end.theta - end.moment / in.k_el), 1e-9, 0.0);
  // Closed form at M0 -> Mp+: the plateau term alone, c1 D0 (M0^2 - Mp^2) / (2 M0^2) (derived in the header).
  const double m0 = 1.001 * in.mp;
  const double D0 = in.eps_sh / in.zf - in.mp / in.EI;
  const double plateau = in.length * D0 * (m0 * m0 - in.mp * in.mp) / (2.0 * m0 * m0);
  EXPECT_GT(spread_plastic_rotation(in, m0), plateau);
  EXPECT_CLOSE(spread_plastic_rotation(in, m0), plateau, 0.01, 0.0);
}

TEST(HardeningHinge, UniformMomentHasNoHingeSlope) {
  HardeningHingeInput in{HingeSetup::uniform_moment, 2000.0, 0.0, 2.2e8, 1.7e13, 210000.0, 2000.0, 0.02, 144.65, 1e10};
  const HardeningHingeLaw law = linear_hardening_hinge(in, 0.1);
  EXPECT_FALSE(law.defined);
  EXPECT_TRUE(law.curve.empty());
  EXPECT_NE(law.reason.find("uniform_moment"), std::string::npos);
}

TEST(ElasticPerfectlyPlasticLaw, IsFlatAtMpFromThetaP) {
  const auto c = elastic_perfectly_plastic_law(2.0e8, 1.0e11, 0.05);
  ASSERT_EQ(c.size(), 3u);
  EXPECT_CLOSE(c[1].theta, 2.0e-3, 1e-12, 0.0);
  EXPECT_CLOSE(*law_moment_at(c, 1.0e-3), 1.0e8, 1e-12, 0.0);
  EXPECT_CLOSE(*law_moment_at(c, 0.04), 2.0e8, 1e-12, 0.0);
  EXPECT_FALSE(law_moment_at(c, 0.06).has_value());
}

}  // namespace
}  // namespace rotcap
