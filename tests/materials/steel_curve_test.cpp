// Steel models -> hardening curves: Yun & Gardner (2017) quad-linear constants, the
// engineering-to-true conversion (Arasaratnam, Sivakumaran & Tait 2011) and input validation.
#include "core/option_error.hpp"
#include "materials/steel_curve.hpp"

#include "tests/test_support.hpp"

#include <cmath>
#include <limits>
#include <cstdio>
#include <stdexcept>
#include <string>

namespace rotcap {
namespace {

SteelModel s355(SteelCurveKind kind) {
  SteelModel s;
  s.E = 210000.0;
  s.nu = 0.3;
  s.fy = 355.0;
  s.fu = 490.0;
  s.kind = kind;
  return s;
}

TEST(YunGardnerQuadlinear, S355ValuesMatchReferenceDerivation) {
  // docs/spec/references.md section 5: eps_sh = 0.0174, eps_u = 0.165, E_sh ~ 2280 MPa for S355
  // (fy 355, fu 490). These are DERIVED from formulas of Yun & Gardner (2017), J. Constr. Steel
  // Res. 133:36-46, that are quoted FROM MEMORY; tolerances are the rounding of the quoted
  // figures (half a unit of the last digit given).
  const QuadlinearParameters q = yun_gardner_quadlinear(210000.0, 355.0, 490.0);
  EXPECT_CLOSE(q.eps_sh, 0.0174, 0.0, 0.00005);
  EXPECT_CLOSE(q.eps_u, 0.165, 0.0, 0.0005);
  EXPECT_CLOSE(q.E_sh, 2280.0, 0.0, 5.0);
  EXPECT_CLOSE(q.eps_y, 355.0 / 210000.0, 1e-15, 0.0);
  // Definitions of the break strains (from memory, same source).
  EXPECT_CLOSE(q.c1_eps_u, q.eps_sh + 0.25 * (q.eps_u - q.eps_sh), 1e-15, 0.0);
  EXPECT_CLOSE(q.f_c1, 355.0 + q.E_sh * (q.c1_eps_u - q.eps_sh), 1e-15, 0.0);
}

TEST(YunGardnerQuadlinear, S235ValuesMatchReferenceDerivation) {
  // docs/spec/references.md section 5, DERIVED from the from-memory formulas: S235 (235/360) gives
  // eps_sh = 0.015 (the lower bound governs), eps_u = 0.208, E_sh ~ 1620 MPa.
  const QuadlinearParameters q = yun_gardner_quadlinear(210000.0, 235.0, 360.0);
  EXPECT_EQ(q.eps_sh, 0.015);
  EXPECT_CLOSE(q.eps_u, 0.208, 0.0, 0.0005);
  EXPECT_CLOSE(q.E_sh, 1620.0, 0.0, 5.0);
}

TEST(YunGardnerQuadlinear, BoundsApplyAtHighYieldRatio) {
  // fy/fu = 0.9375: 0.1 fy/fu - 0.055 = 0.03875 is capped at 0.03, and 0.6 (1 - fy/fu) = 0.0375
  // is raised to 0.06 (bounds of the from-memory formulas).
  const QuadlinearParameters q = yun_gardner_quadlinear(210000.0, 450.0, 480.0);
  EXPECT_EQ(q.eps_sh, 0.03);
  EXPECT_EQ(q.eps_u, 0.06);
}

TEST(EngineeringToTrue, FollowsArasaratnamConversion) {
  // sigma_t = sigma_e (1 + eps_e), eps_t = ln(1 + eps_e), eps_pl = eps_t - sigma_t / E
  // (Arasaratnam, Sivakumaran & Tait 2011, Table 2).
  const HardeningCurve::Point p = engineering_to_true({0.1, 400.0}, 200000.0);
  EXPECT_CLOSE(p.stress, 440.0, 1e-15, 0.0);
  EXPECT_CLOSE(p.plastic_strain, std::log(1.1) - 440.0 / 200000.0, 1e-14, 0.0);
}

TEST(SteelCurve, QuadlinearPassesThroughConvertedBreakpoints) {
  const SteelModel s = s355(SteelCurveKind::quadlinear);
  SteelCurveOptions o;
  o.points_per_segment = 8;
  const HardeningCurve c = hardening_curve(s, o);
  const auto eng = engineering_curve(s);
  ASSERT_EQ(eng.size(), 4u);
  ASSERT_EQ(c.size(), 1u + 3u * 8u);
  const HardeningCurve::Point y = engineering_to_true(eng[0], s.E);
  EXPECT_CLOSE(c.initial_yield_stress(), 355.0 * (1.0 + 355.0 / 210000.0), 1e-15, 0.0);
  for (std::size_t i = 1; i < eng.size(); ++i) {
    const HardeningCurve::Point t = engineering_to_true(eng[i], s.E);
    const HardeningCurve::Point& p = c.points()[8 * i];
    EXPECT_CLOSE(p.plastic_strain, t.plastic_strain - y.plastic_strain, 1e-14, 0.0) << i;
    EXPECT_CLOSE(p.stress, t.stress, 1e-15, 0.0) << i;
  }
  // The ultimate point: true stress fu (1 + eps_u), held beyond.
  const double eps_u = yun_gardner_quadlinear(s.E, s.fy, s.fu).eps_u;
  EXPECT_CLOSE(c.points().back().stress, 490.0 * (1.0 + eps_u), 1e-15, 0.0);
  EXPECT_EQ(c.flow_stress(1.0), c.points().back().stress);
}

TEST(SteelCurve, SampledTrueCurveIsWithinChordErrorOfExactConversion) {
  // Between samples the exact converted curve sigma_t(x), x = eps_pl, is curved; linear
  // interpolation through samples dx apart errs by at most max|f''| dx^2 / 8. With eps_e = e as
  // parameter, sigma_t = sigma_e (1 + e), x = ln(1 + e) - sigma_t / E:
  //   f'' = (sigma_t'' x' - sigma_t' x'') / x'^3,  sigma_t' = E_h (1 + e) + sigma_e,
  //   sigma_t'' = 2 E_h,  x' = 1/(1+e) - sigma_t'/E,  x'' = -1/(1+e)^2 - sigma_t''/E.
  // f'' is evaluated at the test point; it changes by < 1 % within one sample interval here, so
  // the bound carries a 5 % margin. Checked at the midpoint of every sample interval.
  const SteelModel s = s355(SteelCurveKind::quadlinear);
  const int m = 8;
  const HardeningCurve c = hardening_curve(s, {m, 0.5});
  const auto eng = engineering_curve(s);
  const double ep_y = engineering_to_true(eng[0], s.E).plastic_strain;
  for (std::size_t i = 0; i + 1 < eng.size(); ++i) {
    const double d = (eng[i + 1].strain - eng[i].strain) / m;
    const double Eh = (eng[i + 1].stress - eng[i].stress) / (eng[i + 1].strain - eng[i].strain);
    for (int j = 0; j < m; ++j) {
      const double e0 = eng[i].strain + j * d, e = e0 + 0.5 * d, e1 = e0 + d;
      auto at = [&](double ee) {
        return engineering_to_true({ee, eng[i].stress + Eh * (ee - eng[i].strain)}, s.E);
      };
      const HardeningCurve::Point t = at(e), t0 = at(e0), t1 = at(e1);
      const double se = eng[i].stress + Eh * (e - eng[i].strain);
      const double s1 = Eh * (1.0 + e) + se, s2 = 2.0 * Eh;
      const double x1 = 1.0 / (1.0 + e) - s1 / s.E, x2 = -1.0 / ((1.0 + e) * (1.0 + e)) - s2 / s.E;
      const double f2 = (s2 * x1 - s1 * x2) / (x1 * x1 * x1);
      const double dx = t1.plastic_strain - t0.plastic_strain;
      const double bound = 1.05 * std::abs(f2) * dx * dx / 8.0 + 1e-12 * t.stress;
      const double err = std::abs(c.flow_stress(t.plastic_strain - ep_y) - t.stress);
      EXPECT_LE(err, bound) << "segment " << i << " sample " << j;
      if (j == m / 2)
        std::printf("segment %zu: chord error %.3e MPa, bound %.3e MPa\n", i, err, bound);
    }
  }
}

TEST(SteelCurve, BilinearConvertsTheEngineeringLine) {
  // EN 1993-1-5 C.6 model (c), linear hardening E/100 up to fu (from memory): E_h = 2100 MPa.
  SteelModel s = s355(SteelCurveKind::bilinear);
  s.hardening_modulus = 2100.0;
  const auto eng = engineering_curve(s);
  ASSERT_EQ(eng.size(), 2u);
  EXPECT_CLOSE(eng[1].strain, 355.0 / 210000.0 + 135.0 / 2100.0, 1e-15, 0.0);
  const HardeningCurve c = hardening_curve(s);
  EXPECT_EQ(c.size(), 1u + 8u);
  EXPECT_CLOSE(c.points().back().stress, 490.0 * (1.0 + eng[1].strain), 1e-15, 0.0);
}

TEST(SteelCurve, ElasticPlasticIsNotConverted) {
  const HardeningCurve c = hardening_curve(s355(SteelCurveKind::elastic_plastic));
  EXPECT_EQ(c.size(), 1u);
  EXPECT_EQ(c.flow_stress(0.2), 355.0);
}

TEST(SteelCurve, TableRowsAreStressThenPlasticStrain) {
  SteelModel s = s355(SteelCurveKind::table);
  s.table = {{355.0, 0.0}, {355.0, 0.015}, {480.0, 0.10}};
  const HardeningCurve c = hardening_curve(s);
  ASSERT_EQ(c.size(), 3u);
  EXPECT_EQ(c.points()[1].plastic_strain, 0.015);
  EXPECT_EQ(c.points()[2].stress, 480.0);
  EXPECT_CLOSE(c.flow_stress(0.0575), 417.5, 1e-14, 0.0);
  s.table = {{355.0, 0.0}, {480.0, 0.10}, {470.0, 0.2}};
  try {
    hardening_curve(s);
    ADD_FAILURE() << "softening table accepted";
  } catch (const std::invalid_argument& e) {
    EXPECT_NE(std::string(e.what()).find("point 2"), std::string::npos) << e.what();
  }
}

TEST(SteelCurve, ElasticKindHasNoHardeningCurve) {
  const SteelModel s = s355(SteelCurveKind::elastic);
  EXPECT_FALSE(has_yield(s));
  EXPECT_NO_THROW(validate(s));
  try {
    hardening_curve(s);
    ADD_FAILURE() << "elastic steel gave a hardening curve";
  } catch (const std::invalid_argument& e) {
    EXPECT_NE(std::string(e.what()).find("must be elastic"), std::string::npos) << e.what();
  }
}

/// The OptionError of validate(s), or a failure when it passes or throws something else.
OptionError validation_error(const SteelModel& s) {
  try {
    validate(s);
  } catch (const OptionError& e) {
    return e;
  }
  ADD_FAILURE() << "validate() accepted the model or threw another type";
  return OptionError("", "", "");
}

TEST(SteelCurve, ValidationNamesKeyValueAndConstraint) {
  SteelModel s = s355(SteelCurveKind::quadlinear);
  s.fu = 300.0;
  OptionError e = validation_error(s);
  EXPECT_EQ(e.key(), "steel.fu");
  EXPECT_EQ(e.found(), "300");
  EXPECT_NE(e.expected().find("fu >= fy (355)"), std::string::npos) << e.what();

  s = s355(SteelCurveKind::bilinear);
  s.hardening_modulus = -10.0;
  e = validation_error(s);
  EXPECT_EQ(e.key(), "steel.hardening_modulus");
  EXPECT_EQ(e.found(), "-10");

  s.hardening_modulus = 21.0;  // E/10000 would reach fu only at engineering strain ~6.4
  e = validation_error(s);
  EXPECT_EQ(e.key(), "steel.hardening_modulus");
  EXPECT_NE(e.expected().find("engineering strain"), std::string::npos) << e.what();

  s = s355(SteelCurveKind::bilinear);
  s.hardening_modulus = 2100.0;
  s.fu = 355.0;
  e = validation_error(s);
  EXPECT_EQ(e.key(), "steel.fu");
  EXPECT_NE(e.expected().find("fu > fy"), std::string::npos) << e.what();

  s = s355(SteelCurveKind::elastic_plastic);
  s.E = -1.0;
  EXPECT_EQ(validation_error(s).key(), "steel.E");
  s = s355(SteelCurveKind::elastic_plastic);
  s.nu = 0.5;
  EXPECT_EQ(validation_error(s).key(), "steel.nu");
  s.nu = -0.1;  // admissible for an isotropic solid, not for a steel
  EXPECT_EQ(validation_error(s).key(), "steel.nu");
  s = s355(SteelCurveKind::elastic_plastic);
  s.fy = 0.0;
  e = validation_error(s);
  EXPECT_EQ(e.key(), "steel.fy");
  EXPECT_EQ(e.found(), "0");
  s = s355(SteelCurveKind::table);
  EXPECT_EQ(validation_error(s).key(), "steel.table");
}

TEST(SteelCurve, OneYieldStrengthCheck) {
  EXPECT_NO_THROW(require_yield_strength(355.0));
  for (double fy : {0.0, -1.0, std::numeric_limits<double>::infinity(), std::numeric_limits<double>::quiet_NaN()})
    EXPECT_THROW(require_yield_strength(fy), OptionError) << fy;
}

}  // namespace
}  // namespace rotcap
