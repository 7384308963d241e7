// Hinge verification 1: the initial stiffness of an elastic cantilever hinge model.
//
// Case tests/data/hinge/elastic_cantilever.toml: IPE 300 (plates h 300, b 150, tf 10.7, tw 7.1 mm,
// docs/spec/references.md section 7), L = 3000 mm, E = 210 000 MPa, nu = 0.3, curve "elastic", perfect
// geometry, no residual stresses, three load-control steps of 0.1 Mp.
//
// Reference: Timoshenko beam theory, cantilever with a tip load P (Timoshenko & Gere, "Mechanics
// of Materials", the shear-deflection term P L / (G A_v); from memory):
//   delta = P L^3 / (3 E I) + P L / (G A_v),   theta = delta / L (docs/spec/interface.md), M = P L, so
//   theta / M = L / (3 E I) + 1 / (L G A_v),
// with I = Iy of the centre-line plate model (i_section.hpp) and the web shear area of the plate
// model A_v = (h - tf) tw, G = E / (2 (1 + nu)). The computed theta_p (summary theta_p_mrad, from the
// initial slope k_el of the M-theta curve) must be Mp / k_el within 3 % of Mp times that
// compliance.
#include "tests/test_support.hpp"
#include "tests/verification/hinge/hinge_run.hpp"

#include <gtest/gtest.h>

#include <cmath>
#include <cstdio>

namespace rotcap::testing {
namespace {

TEST(HingeElasticCantilever, InitialSlopeMatchesTimoshenkoBeamWithShear) {
  const HingeRun run = run_rotcap("run", hinge_case("elastic_cantilever.toml"), "elastic_cantilever");
  ASSERT_EQ(run.exit_code, 0) << run.err;
  const nlohmann::json s = read_json(run.results / "summary.json");
  // Plate-model properties in closed form (the plates of the case; docs/spec/references.md section 7).
  const double h = 300.0, b = 150.0, tf = 10.7, tw = 7.1, L = 3000.0, E = 210000.0, nu = 0.3, fy = 355.0;
  const double hw = h - tf;
  const double I = 2.0 * (b * tf * tf * tf / 12.0 + b * tf * 0.25 * hw * hw) + tw * hw * hw * hw / 12.0;
  const double Wpl = b * tf * hw + 0.25 * tw * hw * hw;
  const double G = E / (2.0 * (1.0 + nu));
  const double Av = hw * tw;
  const double mp = fy * Wpl;
  std::printf("plate model: Iy = %.6g mm4, Wpl,y = %.6g mm3, A_v = (h - tf) tw = %.6g mm2, G = %.6g MPa\n", I, Wpl,
              Av, G);
  EXPECT_CLOSE(s["mp_kNm"].get<double>(), mp / 1e6, 1e-9, 0.0);
  const double bending = mp * L / (3.0 * E * I), shear = mp / (L * G * Av);
  const double theta_p_ref = bending + shear;  // rad
  std::printf("theta_p beam theory: bending %.4f mrad + shear %.4f mrad = %.4f mrad\n", 1e3 * bending, 1e3 * shear,
              1e3 * theta_p_ref);
  const double theta_p = 1e-3 * s["theta_p_mrad"].get<double>();
  print_comparison("theta_p = Mp / k_el [mrad] vs Timoshenko beam with shear", 1e3 * theta_p_ref, 1e3 * theta_p,
                   "Timoshenko & Gere, from memory");
  print_comparison("theta_p [mrad] vs Euler-Bernoulli Mp L / (3 E I) (no shear; for information)", 1e3 * bending,
                   1e3 * theta_p, "beam theory");
  EXPECT_CLOSE(theta_p, theta_p_ref, 0.03, 0.0);
  // The summary's beam-theory value is the bending term alone (model/hinge_zone/hinge_zone_mesher.hpp).
  EXPECT_CLOSE(1e-3 * s["theta_p_beam_mrad"].get<double>(), bending, 1e-6, 0.0);
  // The curve is linear over the three steps: every point on the same slope within 0.1 %.
  const CurveTable c = read_curve(run.results / "curve.csv");
  ASSERT_EQ(c.rows.size(), 4u);
  const std::vector<double> m = c.values("moment_kNm"), t = c.values("rotation_mrad");
  for (std::size_t i = 1; i < m.size(); ++i) EXPECT_CLOSE(t[i] / m[i], t[1] / m[1], 1e-3, 0.0) << "step " << i;
  EXPECT_CLOSE(m.back(), 0.3 * mp / 1e6, 1e-6, 0.0);
  std::printf("run time %.2f s\n", run.wall_s);
}

}  // namespace
}  // namespace rotcap::testing
