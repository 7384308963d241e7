// Moment-curvature by fibre integration against closed forms.
#include "materials/steel_curve.hpp"
#include "model/laws/moment_curvature.hpp"
#include "tests/test_support.hpp"

#include <cmath>

namespace rotcap {
namespace {

// IPE 300-like plates (b 150, tf 10.7, tw 7.1, h 300 mm), S355.
ISection ipe300_plates() { return ISection{"", 300.0, 150.0, 10.7, 7.1, 0.0, 0.0}; }

UniaxialFibreLaw perfectly_plastic(double E, double fy) { return UniaxialFibreLaw(E, {{fy / E, fy}}); }

TEST(UniaxialFibreLaw, StrainIsPlasticStrainPlusElasticPart) {
  // The fibre law of a hardening curve: eps = epbar + sigma / E at sigma = sigma_y(epbar).
  SteelModel steel;  // quadlinear S355, fu 490
  const HardeningCurve hc = hardening_curve(steel);
  const UniaxialFibreLaw law = UniaxialFibreLaw::from_hardening_curve(steel.E, hc.points());
  for (const HardeningCurve::Point& p : hc.points()) {
    EXPECT_CLOSE(law.stress(p.plastic_strain + p.stress / steel.E), p.stress, 1e-12, 0.0);
    EXPECT_CLOSE(law.stress(-(p.plastic_strain + p.stress / steel.E)), -p.stress, 1e-12, 0.0);
  }
  EXPECT_CLOSE(law.stress(0.5 * law.yield_strain()), 0.5 * law.yield_stress(), 1e-12, 0.0);
  EXPECT_TRUE(law.has_hardening());
  EXPECT_GT(law.hardening_onset_strain(), 5.0 * law.yield_strain());  // a yield plateau first
}

TEST(MomentCurvature, RectangleElasticPerfectlyPlasticMatchesClosedForm) {
  // Solid rectangle, elastic-perfectly plastic: M/My = 1.5 (1 - (kappa_y/kappa)^2 / 3) for
  // kappa >= kappa_y (Neal, "The Plastic Methods of Structural Analysis", 3rd ed. 1977, ch. 1,
  // from memory; it follows from the elastic core of depth d kappa_y / kappa).
  const double b = 20.0, d = 100.0, E = 210000.0, fy = 355.0;
  const std::vector<Fibre> f = rectangle_fibres(b, d, 400);
  MomentCurvatureOptions o;
  o.max_strain = 20.0 * fy / E;
  const MomentCurvatureCurve c = moment_curvature(f, perfectly_plastic(E, fy), o);
  const double My = fy * b * d * d / 6.0, ky = fy / E / (0.5 * d);
  EXPECT_CLOSE(c.first_yield_moment, My, 1e-12, 0.0);
  EXPECT_CLOSE(c.first_yield_curvature, ky, 1e-12, 0.0);
  int checked = 0;
  for (const MomentCurvaturePoint& p : c.points) {
    if (p.kappa < ky) {
      EXPECT_CLOSE(p.moment, E * b * d * d * d / 12.0 * p.kappa, 1e-10, 0.0);
    } else {
      const double r = ky / p.kappa;
      // 400 strips with 2 Gauss points: the kink inside one strip errs by < (d/400)^2 relative.
      EXPECT_CLOSE(p.moment / My, 1.5 * (1.0 - r * r / 3.0), 2e-5, 0.0);
      ++checked;
    }
  }
  EXPECT_GT(checked, 100);
}

TEST(MomentCurvature, ISectionYieldsAtElasticMomentAndTendsToPlasticMoment) {
  // Plate model: My = fy Wel,y and M -> fy Wpl,y (model/section/i_section.hpp closed forms).
  const ISection s = ipe300_plates();
  const SectionProperties p = plate_model_properties(s);
  const double E = 210000.0, fy = 355.0;
  MomentCurvatureOptions o;
  o.max_strain = 0.2;  // about 120 eps_y
  const MomentCurvatureCurve c = moment_curvature(plate_model_fibres(s, ResidualStressPattern()), perfectly_plastic(E, fy), o);
  EXPECT_CLOSE(c.EI, E * p.Iy, 1e-12, 0.0);
  EXPECT_CLOSE(c.first_yield_moment, fy * p.Wel_y, 1e-12, 0.0);
  // At the extreme strain 0.2 the elastic core of the web is z_c = eps_y h / 0.4 = 1.27 mm either side: M falls
  // short of Mp by fy tw z_c^2 / 3 = 1.3 kN mm, 6e-6 Mp.
  EXPECT_CLOSE(c.points.back().moment, fy * p.Wpl_y, 1e-4, 0.0);
  EXPECT_LT(c.points.back().moment, fy * p.Wpl_y);
  for (std::size_t i = 1; i < c.points.size(); ++i) EXPECT_GE(c.points[i].moment, c.points[i - 1].moment);
}

TEST(MomentCurvature, ResidualStressLowersFirstYieldButNotPlasticMoment) {
  // ECCS hot-rolled pattern (0.3 fy at the flange tips for h/b > 1.2, model/patterns/residual_stress.hpp).
  const ISection s = ipe300_plates();
  const SectionProperties p = plate_model_properties(s);
  const double E = 210000.0, fy = 355.0;
  const ResidualStressPattern pattern(ResidualStressKind::hot_rolled, s, fy);
  MomentCurvatureOptions o;
  o.max_strain = 0.2;
  const MomentCurvatureCurve plain = moment_curvature(plate_model_fibres(s, ResidualStressPattern()), perfectly_plastic(E, fy), o);
  const MomentCurvatureCurve with = moment_curvature(plate_model_fibres(s, pattern), perfectly_plastic(E, fy), o);
  // The compression tip strips yield first, at kappa h/2 = eps_y + sigma_R / E. The pattern is sampled at the strip
  // centre, |y| = b/2 - b/40 of the 20 strips: sigma_R = 0.3 fy (1 - 4|y|/b) = -0.27 fy, so My drops to 0.73 My
  // (0.7 My for the tip value itself).
  // The strip-sampled pattern is not exactly self-equilibrated (N_R ~ 1e-4 fy A): its elastic axial strain moves
  // the first yield by ~5e-5 relative.
  EXPECT_CLOSE(with.first_yield_moment / plain.first_yield_moment, 1.0 - 0.3 * 0.9, 2e-4, 0.0);
  EXPECT_LT(with.first_yield_moment, 0.75 * plain.first_yield_moment);
  EXPECT_CLOSE(with.points.back().moment, fy * p.Wpl_y, 1e-4, 0.0);
  EXPECT_CLOSE(with.points.back().moment, plain.points.back().moment, 1e-4, 0.0);
  // In between, the residual stresses soften the knee: below the plain curve at 1.2 kappa_y.
  const double k = 1.2 * plain.first_yield_curvature;
  double m_plain = 0, m_with = 0;
  for (std::size_t i = 1; i < plain.points.size(); ++i)
    if (plain.points[i].kappa >= k) {
      m_plain = plain.points[i].moment;
      m_with = with.points[i].moment;
      break;
    }
  EXPECT_LT(m_with, m_plain);
}

}  // namespace
}  // namespace rotcap
