// The fitted multilinear M - theta_plastic law: its rule and its 3 % bound.
#include "model/laws/fitted_hinge_law.hpp"
#include "tests/test_support.hpp"

#include <cmath>
#include <random>

namespace rotcap {
namespace {

// A smooth hinge curve made here (no published source needed: the test checks the fit's own
// guarantee): elastic slope k, a rounded knee, a peak at 1.15 Mp near 6 theta_p, then softening.
std::vector<MomentRotationPoint> synthetic_curve(double mp, double k, unsigned seed) {
  std::mt19937 rng(seed);
  std::uniform_real_distribution<double> jitter(-0.2, 0.2);
  const double tp = mp / k;
  std::vector<MomentRotationPoint> c{{0.0, 0.0}};
  for (int i = 1; i <= 120; ++i) {
    const double t = (i + jitter(rng)) * 0.1 * tp;  // uneven steps
    const double x = t / tp;
    const double rising = x < 0.6 ? x : 0.6 + 0.4 * std::tanh((x - 0.6) / 0.4) + 0.03 * (x - 0.6);
    const double soft = x > 6.0 ? 0.08 * (x - 6.0) * (x - 6.0) / (1.0 + 0.3 * (x - 6.0)) : 0.0;
    c.push_back({t, mp * (rising - soft)});
  }
  return c;
}

TEST(FittedHingeLaw, StaysWithinThreePercentAndKeepsThePeak) {
  const double mp = 3.0e8, k = 1.2e11;
  for (unsigned seed : {1u, 7u, 42u}) {
    const std::vector<MomentRotationPoint> c = synthetic_curve(mp, k, seed);
    const FittedHingeLaw law = fit_hinge_law(c, mp, k);
    ASSERT_GE(law.points.size(), 3u);
    EXPECT_TRUE(law.within_bound) << law.message;
    EXPECT_LE(law.max_deviation, 0.03);
    EXPECT_EQ(law.points.front().kind, "elastic_limit");
    EXPECT_EQ(law.points.back().kind, "end");
    std::size_t peak = 0;
    for (std::size_t j = 0; j < c.size(); ++j)
      if (c[j].moment > c[peak].moment) peak = j;
    bool has_peak = false;
    for (const FittedLawPoint& q : law.points) has_peak |= q.kind == "peak" && q.curve_index == peak;
    EXPECT_TRUE(has_peak);
    // Independent check of the bound at every covered curve point.
    for (std::size_t j = law.points.front().curve_index; j < c.size(); ++j) {
      double tpl = 0.0;
      for (std::size_t i = 0; i <= j; ++i) tpl = std::max(tpl, c[i].theta - c[i].moment / k);
      EXPECT_LE(std::abs(fitted_law_moment(law, tpl) - c[j].moment), 0.03 * c[j].moment) << "point " << j;
    }
    EXPECT_LT(law.points.size(), 12u);  // a small number of points
  }
}

TEST(FittedHingeLaw, ElasticLimitIsTheDepartureFromTheLinearBranch) {
  const double mp = 1.0, k = 1.0;
  // Linear to (0.5, 0.5), then plastic: theta_pl = theta - M.
  std::vector<MomentRotationPoint> c{{0, 0}, {0.25, 0.25}, {0.5, 0.5}, {1.0, 0.8}, {2.0, 1.0}, {4.0, 1.1}, {6.0, 0.9}};
  const FittedHingeLaw law = fit_hinge_law(c, mp, k);
  EXPECT_EQ(law.points.front().curve_index, 2u);
  EXPECT_CLOSE(law.points.front().moment, 0.5, 1e-12, 0.0);
  EXPECT_CLOSE(law.points.front().theta_plastic, 0.0, 0.0, 1e-15);
  const std::vector<MomentRotationPoint> back = fitted_law_curve(law, k);
  EXPECT_CLOSE(back[1].theta, 0.5, 1e-12, 0.0);
}

}  // namespace
}  // namespace rotcap
