// Twisted beam of MacNeal & Harder (1985), "A proposed standard set of problems to test finite
// element accuracy", FEAD 1, 3-20: L = 12, width 1.1, thickness 0.32, pre-twisted 90 degrees from
// root to tip, E = 29e6, nu = 0.22, 12x2 mesh, clamped root, unit tip load. Reference tip
// deflections along the load (FROM MEMORY, widely quoted; docs/spec/references.md sec. 1):
// 5.424e-3 for the load in the plane of the tip section ("in-plane") and 1.754e-3 for the load
// normal to it ("out-of-plane"). Which load is which follows from Euler-Bernoulli theory
// (beam_estimate below gives 5.43e-3 and 1.75e-3); the wording "in plane of root" in
// docs/spec/references.md does not fit it. Every element is warped (7.5 degrees of twist per element), so
// this exercises the warping correction.
#include "benchmark_problems.hpp"
#include "materials/elastic_shell_section.hpp"
#include "tests/test_support.hpp"

#include <cmath>
#include <cstdio>
#include <numbers>

namespace rotcap {
namespace {

using testing::twisted_beam_tip;
constexpr double kLength = testing::kTwistedLength, kWidth = testing::kTwistedWidth;
constexpr double kThickness = testing::kTwistedThickness, kE = testing::kTwistedE;

// Euler-Bernoulli estimate of the same problem (DERIVED, for the log): the section's principal
// axes turn with phi(x), so the tip flexibility is int_0^L (L - x)^2 [cos^2/E I_1 + sin^2/E I_2] dx
// with the midpoint rule on 4000 intervals.
double beam_estimate(bool inplane) {
  const double i_weak = kWidth * std::pow(kThickness, 3) / 12.0, i_strong = kThickness * std::pow(kWidth, 3) / 12.0;
  double sum = 0.0;
  const int n = 4000;
  for (int k = 0; k < n; ++k) {
    const double x = (k + 0.5) * kLength / n, phi = 0.5 * std::numbers::pi * x / kLength;
    const double c2 = std::cos(phi) * std::cos(phi), s2 = 1.0 - c2;
    sum += (kLength - x) * (kLength - x) * (inplane ? s2 / i_strong + c2 / i_weak : c2 / i_strong + s2 / i_weak);
  }
  return sum * kLength / n / kE;
}

TEST(TwistedBeam, InPlaneTipLoadWithinFivePercentOfReference) {
  // At the tip (phi = 90 degrees) the section's width lies along global z.
  const auto [centre, mean] = twisted_beam_tip(Eigen::Vector3d::UnitZ());
  std::printf("twisted beam, in-plane load: tip deflection %.5e (mean of tip nodes %.5e), reference "
              "5.424e-3 (from memory), ratio %.4f; beam theory %.4e\n",
              centre, mean, centre / 5.424e-3, beam_estimate(true));
  EXPECT_CLOSE(centre, 5.424e-3, 0.05, 0.0);  // MacNeal & Harder 1985, from memory
}

TEST(TwistedBeam, OutOfPlaneTipLoadWithinFivePercentOfReference) {
  // The tip section's normal is -y (e3 = e1 x width direction).
  const auto [centre, mean] = twisted_beam_tip(Eigen::Vector3d::UnitY());
  std::printf("twisted beam, out-of-plane load: tip deflection %.5e (mean of tip nodes %.5e), reference "
              "1.754e-3 (from memory), ratio %.4f; beam theory %.4e\n",
              centre, mean, centre / 1.754e-3, beam_estimate(false));
  EXPECT_CLOSE(centre, 1.754e-3, 0.05, 0.0);  // MacNeal & Harder 1985, from memory
}

}  // namespace
}  // namespace rotcap
