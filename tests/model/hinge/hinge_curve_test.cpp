// Hinge-curve extraction on synthetic curves whose numbers are known in closed form.
// The definitions under test: R = theta_u / theta_p - 1 with theta_u where the falling branch
// returns to Mp and theta_p = Mp / k_el (Lukey & Adams 1969, J. Struct. Div. ASCE 95(ST6); Kemp
// 1986; from memory, widely quoted: docs/spec/references.md section 6, MEMORY) as stated in docs/spec/interface.md
// "Definitions the numbers follow". Every expected value below is worked out by hand in the
// comment beside it (DERIVED), so the tolerances are round-off only (1e-12 relative, about
// 1e4 ulp of the few operations involved) unless a comment says otherwise.
#include "model/hinge/hinge_curve.hpp"
#include "tests/test_support.hpp"

#include <cmath>
#include <random>
#include <stdexcept>
#include <vector>

namespace rotcap {
namespace {

using Curve = std::vector<MomentRotationPoint>;
constexpr double kMp = 100.0;   // arbitrary units: extraction is unit-free
constexpr double kMel = 88.0;   // 0.5 Mel = 44 bounds the elastic fit
constexpr double kRoundOff = 1e-12;

// Rises with slope 1e4 (theta_p = 0.01), peaks in a symmetric tent at (0.04, 110), falls through
// Mp between the steps at 0.06 (104) and 0.08 (96).
Curve tent_curve() {
  return {{0.0, 0.0},    {0.002, 20.0}, {0.004, 40.0}, {0.008, 80.0},  {0.012, 98.0},  {0.02, 104.0},
          {0.03, 108.0}, {0.04, 110.0}, {0.05, 108.0}, {0.06, 104.0},  {0.08, 96.0},   {0.09, 90.0}};
}

TEST(HingeCurve, GivesTheRotationCapacityOfAPiecewiseLinearCurveExactly) {
  const HingeCurveResult r = extract_hinge_curve(tent_curve(), kMp, kMel, 0.0123);
  // k_el from (0.002, 20) and (0.004, 40), the points with M <= 44: 1e4 exactly.
  ASSERT_TRUE(r.k_el.has_value());
  EXPECT_CLOSE(*r.k_el, 1.0e4, kRoundOff, 0.0);
  EXPECT_EQ(r.k_el_points, 2u);
  EXPECT_FALSE(r.k_el_from_first_point_above_limit);
  EXPECT_CLOSE(*r.theta_p, 0.01, kRoundOff, 0.0);
  EXPECT_EQ(r.theta_p_beam, 0.0123);
  // Symmetric neighbours 108 | 110 | 108: the parabola's vertex is the middle point.
  EXPECT_EQ(r.peak_method, PeakMethod::parabola);
  EXPECT_EQ(r.peak_index, 7u);
  EXPECT_CLOSE(r.m_max, 110.0, kRoundOff, 0.0);
  EXPECT_CLOSE(r.theta_at_m_max, 0.04, kRoundOff, 0.0);
  // Rising: 98 at 0.012 -> 104 at 0.02: 0.012 + (2/6) 0.008.
  ASSERT_TRUE(r.theta_at_mp.has_value());
  EXPECT_CLOSE(*r.theta_at_mp, 0.012 + 0.008 / 3.0, kRoundOff, 0.0);
  // Falling: 104 at 0.06 -> 96 at 0.08: theta_u = 0.07, R = 0.07 / 0.01 - 1 = 6 (the nearest
  // steps would give 5 or 7).
  EXPECT_EQ(r.status, HingeCurveStatus::falls_back_to_mp);
  ASSERT_TRUE(r.theta_u.has_value());
  EXPECT_CLOSE(*r.theta_u, 0.07, kRoundOff, 0.0);
  ASSERT_TRUE(r.rotation_capacity.has_value());
  EXPECT_CLOSE(*r.rotation_capacity, 6.0, kRoundOff, 0.0);
  EXPECT_FALSE(r.rotation_capacity_is_lower_bound);
  EXPECT_TRUE(r.reaches_mp());
  EXPECT_NE(r.message.find("R = theta_u / theta_p - 1 = 6"), std::string::npos) << r.message;
}

TEST(HingeCurve, DoesNotDependOnTheStepSizeAlongAPolyline) {
  // The same polyline with every segment cut into three steps: all numbers unchanged.
  const Curve coarse = tent_curve();
  Curve fine{coarse.front()};
  for (std::size_t j = 1; j < coarse.size(); ++j)
    for (int k = 1; k <= 3; ++k) {
      const double s = k / 3.0;
      fine.push_back({coarse[j - 1].theta + s * (coarse[j].theta - coarse[j - 1].theta),
                      coarse[j - 1].moment + s * (coarse[j].moment - coarse[j - 1].moment)});
    }
  const HingeCurveResult a = extract_hinge_curve(coarse, kMp, kMel, 0.0);
  const HingeCurveResult b = extract_hinge_curve(fine, kMp, kMel, 0.0);
  EXPECT_GT(b.k_el_points, a.k_el_points);
  EXPECT_CLOSE(*b.k_el, *a.k_el, kRoundOff, 0.0);
  EXPECT_CLOSE(b.m_max, a.m_max, kRoundOff, 0.0);
  EXPECT_CLOSE(b.theta_at_m_max, a.theta_at_m_max, kRoundOff, 0.0);
  EXPECT_CLOSE(*b.theta_at_mp, *a.theta_at_mp, kRoundOff, 0.0);
  EXPECT_CLOSE(*b.theta_u, *a.theta_u, kRoundOff, 0.0);
  EXPECT_CLOSE(*b.rotation_capacity, *a.rotation_capacity, kRoundOff, 0.0);
}

TEST(HingeCurve, FindsTheExactVertexOfASampledParabola) {
  // M = A theta (2 theta_v - theta): zero at the origin, vertex (theta_v, A theta_v^2), sampled
  // at seeded random, unevenly spaced rotations that miss the vertex. The parabola through any
  // three of its points is the curve itself, so the vertex is exact up to round-off: the slope b
  // at the middle point carries an error ~ eps M / h (h ~ 1e-3), i.e. ~1e-11, and the vertex
  // offset -b / (2a) with |a| = A ~ 6e4 then ~1e-16 rad, well inside 1e-12 relative.
  const double theta_v = 0.0437, m_peak = 123.4, A = m_peak / (theta_v * theta_v);
  std::mt19937 rng(20240917);
  std::uniform_real_distribution<double> gap(0.5e-3, 2.0e-3);
  Curve c{{0.0, 0.0}};
  for (double t = gap(rng); t < 1.9 * theta_v; t += gap(rng)) c.push_back({t, A * t * (2.0 * theta_v - t)});
  const HingeCurveResult r = extract_hinge_curve(c, kMp, kMel, 0.0);
  EXPECT_EQ(r.peak_method, PeakMethod::parabola);
  EXPECT_NE(c[r.peak_index].theta, theta_v);
  EXPECT_CLOSE(r.theta_at_m_max, theta_v, kRoundOff, 0.0);
  EXPECT_CLOSE(r.m_max, m_peak, kRoundOff, 0.0);
  // theta_u by linear interpolation of the smooth curve: the exact crossing is
  // theta_v + sqrt(theta_v^2 - Mp / A); the chord's error is at most h^2 |M''| / (8 |M'|) over
  // the bracketing step (M'' = -2A, |M'| smallest at the step's left end).
  const double exact_u = theta_v + std::sqrt(theta_v * theta_v - kMp / A);
  std::size_t j = 1;
  while (c[j].theta < exact_u) ++j;
  const double h = c[j].theta - c[j - 1].theta;
  const double slope = 2.0 * A * (c[j - 1].theta - theta_v);
  ASSERT_TRUE(r.theta_u.has_value());
  EXPECT_GE(*r.theta_u, c[j - 1].theta);
  EXPECT_LE(*r.theta_u, c[j].theta);
  EXPECT_LE(std::abs(*r.theta_u - exact_u), h * h * 2.0 * A / (8.0 * slope));
}

TEST(HingeCurve, ReachesMpThroughTheInterpolatedPeakBetweenSteps) {
  // Steps 96 | 99.9 | 99.8 at spacing h = 0.004 all stay below Mp = 100; the parabola's vertex
  // (equal-spacing form, a second code path) lies above it:
  //   t* = h (M0 - M2) / (2 (M0 - 2 M1 + M2)) = 0.004 (-3.8) / (-8) = 0.0019,
  //   M* = M1 - (M0 - M2)^2 / (8 (M0 - 2 M1 + M2)) = 99.9 + 14.44 / 32 = 100.35125.
  const Curve c = {{0.0, 0.0}, {0.004, 40.0}, {0.012, 96.0}, {0.016, 99.9}, {0.02, 99.8}, {0.024, 95.0}};
  const HingeCurveResult r = extract_hinge_curve(c, kMp, kMel, 0.0);
  const double theta_v = 0.0179, m_v = 100.35125;
  EXPECT_EQ(r.peak_method, PeakMethod::parabola);
  EXPECT_CLOSE(r.theta_at_m_max, theta_v, kRoundOff, 0.0);
  EXPECT_CLOSE(r.m_max, m_v, kRoundOff, 0.0);
  // Crossings on the polyline with the vertex inserted between 0.016 and 0.02.
  EXPECT_EQ(r.status, HingeCurveStatus::falls_back_to_mp);
  EXPECT_CLOSE(*r.theta_at_mp, 0.016 + (100.0 - 99.9) / (m_v - 99.9) * (theta_v - 0.016), kRoundOff, 0.0);
  EXPECT_CLOSE(*r.theta_u, theta_v + (m_v - 100.0) / (m_v - 99.8) * (0.02 - theta_v), kRoundOff, 0.0);
  EXPECT_CLOSE(*r.rotation_capacity, *r.theta_u / 0.01 - 1.0, kRoundOff, 0.0);
}

TEST(HingeCurve, GivesALowerBoundWhenTheCurveEndsAboveMp) {
  // The first step already exceeds 0.5 Mel: k_el from it alone, 50 / 0.005 = 1e4.
  const Curve c = {{0.0, 0.0},     {0.005, 50.0},  {0.01, 90.0},  {0.02, 105.0},
                   {0.03, 112.0},  {0.04, 115.0},  {0.05, 112.0}, {0.06, 106.0}};
  const HingeCurveResult r = extract_hinge_curve(c, kMp, kMel, 0.0);
  EXPECT_EQ(r.k_el_points, 1u);
  EXPECT_TRUE(r.k_el_from_first_point_above_limit);
  EXPECT_NE(r.message.find("a secant"), std::string::npos) << r.message;
  EXPECT_CLOSE(*r.k_el, 1.0e4, kRoundOff, 0.0);
  EXPECT_CLOSE(r.m_max, 115.0, kRoundOff, 0.0);
  EXPECT_EQ(r.status, HingeCurveStatus::ends_above_mp);
  EXPECT_TRUE(r.rotation_capacity_is_lower_bound);
  EXPECT_CLOSE(*r.theta_u, 0.06, kRoundOff, 0.0);               // the last step
  EXPECT_CLOSE(*r.rotation_capacity, 5.0, kRoundOff, 0.0);      // 0.06 / 0.01 - 1
  EXPECT_NE(r.message.find("lower bound"), std::string::npos) << r.message;
}

TEST(HingeCurve, UsesTheLastPointAsPeakOfAMonotonicCurve) {
  // Still rising at the end: the peak guard keeps the end point; theta_u = its theta.
  const Curve c = {{0.0, 0.0}, {0.004, 40.0}, {0.01, 95.0}, {0.02, 102.0}, {0.03, 104.0}};
  const HingeCurveResult r = extract_hinge_curve(c, kMp, kMel, 0.0);
  EXPECT_EQ(r.peak_method, PeakMethod::largest_point);
  EXPECT_EQ(r.peak_index, 4u);
  EXPECT_EQ(r.m_max, 104.0);
  EXPECT_EQ(r.theta_at_m_max, 0.03);
  EXPECT_CLOSE(*r.theta_at_mp, 0.01 + 5.0 / 7.0 * 0.01, kRoundOff, 0.0);
  EXPECT_EQ(r.status, HingeCurveStatus::ends_above_mp);
  EXPECT_CLOSE(*r.rotation_capacity, 2.0, kRoundOff, 0.0);      // 0.03 / 0.01 - 1
}

TEST(HingeCurve, ReportsNoCapacityWhenMpIsNotReached) {
  // Peak 92 | 95 | 93 at h = 0.004: t* = 0.004 (-1) / (2 (-5)) = 0.0004, M* = 95 + 1/40 = 95.025.
  const Curve c = {{0.0, 0.0},    {0.004, 40.0},  {0.008, 80.0}, {0.012, 92.0},
                   {0.016, 95.0}, {0.02, 93.0},   {0.03, 85.0}};
  const HingeCurveResult r = extract_hinge_curve(c, kMp, kMel, 0.0);
  EXPECT_EQ(r.status, HingeCurveStatus::below_mp);
  EXPECT_FALSE(r.reaches_mp());
  EXPECT_CLOSE(r.m_max, 95.025, kRoundOff, 0.0);
  EXPECT_CLOSE(r.theta_at_m_max, 0.0164, kRoundOff, 0.0);
  EXPECT_TRUE(r.k_el.has_value());
  EXPECT_FALSE(r.theta_at_mp.has_value());
  EXPECT_FALSE(r.theta_u.has_value());
  EXPECT_FALSE(r.rotation_capacity.has_value());
  EXPECT_FALSE(r.rotation_capacity_is_lower_bound);
  EXPECT_NE(r.message.find("does not reach its plastic moment"), std::string::npos) << r.message;
}

TEST(HingeCurve, FitsTheInitialSlopeByLeastSquaresThroughTheOrigin) {
  // Five seeded, scattered points (+-1 %) about slope 2.5e4 below 0.5 Mel = 44, then a softening
  // branch and a deep fall back below 44 that must not enter the fit. Expected: the normal
  // equation sum(theta M) / sum(theta^2) over the five, evaluated here independently.
  std::mt19937 rng(7);
  std::uniform_real_distribution<double> scatter(-0.01, 0.01);
  Curve c{{0.0, 0.0}};
  double stm = 0.0, stt = 0.0;
  for (int j = 1; j <= 5; ++j) {
    const double t = 0.0003 * j, m = 2.5e4 * t * (1.0 + scatter(rng));
    c.push_back({t, m});
    stm += t * m;
    stt += t * t;
  }
  for (const auto& [t, m] : std::vector<std::pair<double, double>>{
           {0.003, 60.0}, {0.006, 95.0}, {0.01, 104.0}, {0.02, 101.0}, {0.03, 60.0}, {0.04, 30.0}})
    c.push_back({t, m});
  const HingeCurveResult r = extract_hinge_curve(c, kMp, kMel, 0.0);
  EXPECT_EQ(r.k_el_points, 5u);
  EXPECT_CLOSE(*r.k_el, stm / stt, kRoundOff, 0.0);
  EXPECT_CLOSE(*r.theta_p, kMp / (stm / stt), kRoundOff, 0.0);
  // Without scatter, a linear start gives its slope exactly.
  for (int j = 1; j <= 5; ++j) c[j].moment = 2.5e4 * c[j].theta;
  EXPECT_CLOSE(*extract_hinge_curve(c, kMp, kMel, 0.0).k_el, 2.5e4, kRoundOff, 0.0);
  // elastic_fraction = 1 admits the point at 60 <= 88 as well.
  EXPECT_EQ(extract_hinge_curve(c, kMp, kMel, 0.0, {.elastic_fraction = 1.0}).k_el_points, 6u);
}

TEST(HingeCurve, KeepsTheLargestPointWithFewerThanThreePoints) {
  const Curve c = {{0.0, 0.0}, {0.01, 120.0}};
  const HingeCurveResult r = extract_hinge_curve(c, kMp, kMel, 0.0);
  EXPECT_EQ(r.peak_method, PeakMethod::largest_point);
  EXPECT_EQ(r.m_max, 120.0);
  EXPECT_EQ(r.theta_at_m_max, 0.01);
  EXPECT_CLOSE(*r.k_el, 1.2e4, kRoundOff, 0.0);
  EXPECT_CLOSE(*r.theta_at_mp, 0.01 * 100.0 / 120.0, kRoundOff, 0.0);
  EXPECT_EQ(r.status, HingeCurveStatus::ends_above_mp);
  EXPECT_CLOSE(*r.rotation_capacity, 0.01 / (100.0 / 1.2e4) - 1.0, kRoundOff, 0.0);  // 0.2
}

TEST(HingeCurve, ReportsNothingButTheInputsForTheUnloadedStateAlone) {
  const HingeCurveResult r = extract_hinge_curve(Curve{{0.0, 0.0}}, kMp, kMel, 0.005);
  EXPECT_FALSE(r.k_el.has_value());
  EXPECT_FALSE(r.theta_p.has_value());
  EXPECT_EQ(r.k_el_points, 0u);
  EXPECT_EQ(r.m_max, 0.0);
  EXPECT_EQ(r.status, HingeCurveStatus::below_mp);
  EXPECT_EQ(r.theta_p_beam, 0.005);
}

TEST(HingeCurve, KeepsTheFirstPointOfAFlatTop) {
  // Three equal maxima: the first of them, no parabola (it would be a straight line).
  Curve c = {{0.0, 0.0},     {0.004, 40.0},  {0.012, 98.0},  {0.02, 104.0},
             {0.03, 110.0},  {0.04, 110.0},  {0.05, 110.0},  {0.06, 104.0}, {0.08, 96.0}};
  HingeCurveResult r = extract_hinge_curve(c, kMp, kMel, 0.0);
  EXPECT_EQ(r.peak_method, PeakMethod::largest_point);
  EXPECT_EQ(r.peak_index, 4u);
  EXPECT_EQ(r.m_max, 110.0);
  EXPECT_EQ(r.theta_at_m_max, 0.03);
  EXPECT_CLOSE(*r.theta_u, 0.07, kRoundOff, 0.0);
  // One lower neighbour and one equal one (108 | 110 | 110): still the point itself, since a
  // parabola would put a vertex above the plateau.
  c[4].moment = 108.0;
  r = extract_hinge_curve(c, kMp, kMel, 0.0);
  EXPECT_EQ(r.peak_method, PeakMethod::largest_point);
  EXPECT_EQ(r.theta_at_m_max, 0.04);
  EXPECT_EQ(r.m_max, 110.0);
}

TEST(HingeCurve, KeepsTheLargestPointWhenThetaDoesNotIncreaseAroundIt) {
  // A snap-back right after the peak: no parabola in theta; the falling branch is still followed
  // in path order (110 at 0.04 -> 96 at 0.035 crosses Mp at 0.04 - (10/14) 0.005).
  const Curve c = {{0.0, 0.0}, {0.004, 40.0}, {0.02, 104.0}, {0.04, 110.0}, {0.035, 96.0}, {0.03, 80.0}};
  const HingeCurveResult r = extract_hinge_curve(c, kMp, kMel, 0.0);
  EXPECT_EQ(r.peak_method, PeakMethod::largest_point);
  EXPECT_EQ(r.theta_at_m_max, 0.04);
  EXPECT_CLOSE(*r.theta_u, 0.04 - 10.0 / 14.0 * 0.005, kRoundOff, 0.0);
}

TEST(HingeCurve, LeavesCapacityUnknownWithoutAPositiveInitialSlope) {
  const Curve c = {{0.0, 0.0}, {0.01, -5.0}, {0.02, 120.0}, {0.03, 90.0}};
  const HingeCurveResult r = extract_hinge_curve(c, kMp, kMel, 0.0);
  EXPECT_FALSE(r.k_el.has_value());
  EXPECT_EQ(r.status, HingeCurveStatus::falls_back_to_mp);
  EXPECT_TRUE(r.theta_u.has_value());
  EXPECT_FALSE(r.rotation_capacity.has_value());
  EXPECT_NE(r.message.find("R unknown"), std::string::npos) << r.message;
}

TEST(HingeCurve, RejectsBadInput) {
  const Curve good = tent_curve();
  EXPECT_THROW(extract_hinge_curve(Curve{}, kMp, kMel, 0.0), std::invalid_argument);
  EXPECT_THROW(extract_hinge_curve(good, 0.0, kMel, 0.0), std::invalid_argument);
  EXPECT_THROW(extract_hinge_curve(good, kMp, -1.0, 0.0), std::invalid_argument);
  EXPECT_THROW(extract_hinge_curve(good, kMp, kMel, NAN), std::invalid_argument);
  EXPECT_THROW(extract_hinge_curve(good, kMp, kMel, 0.0, {.elastic_fraction = 0.0}), std::invalid_argument);
  Curve bad = good;
  bad[3].moment = NAN;
  try {
    extract_hinge_curve(bad, kMp, kMel, 0.0);
    ADD_FAILURE() << "no exception for a NaN moment";
  } catch (const std::invalid_argument& e) {
    EXPECT_NE(std::string(e.what()).find("point 3"), std::string::npos) << e.what();
  }
}

}  // namespace
}  // namespace rotcap
