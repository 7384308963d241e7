// Hinge verification 2: elastic lateral-torsional buckling of an unrestrained I-beam under
// uniform moment, by `rotcap buckling` (ltb_uniform_moment_4m.toml, _8m.toml: IPE 300 as plates,
// h 300, b 150, tf 10.7, tw 7.1 mm, E 210 000, nu 0.3, L = 4 m and 8 m, mesh 4 x 4, aspect 2).
//
// End conditions the setup imposes (model/setups/uniform_moment_setup.hpp): rigid end sections tied to
// reference nodes fixed in lateral and vertical translation and in twist, free to rotate about
// both bending axes. So at both ends: twist phi = 0, lateral displacement u = 0, rotation about z
// free (u'' = 0) and warping held (phi' = 0, the section cannot warp).
//
// References (plate-model I_z, I_t, I_w in closed form, i_section.hpp; G = E / (2 (1 + nu))):
//  - exact: Vlasov's equation for uniform moment (Timoshenko & Gere 1961, ch. 6, from memory),
//      E I_w phi'''' - G I_t phi'' - M^2 / (E I_z) phi = 0  (u'' = -M phi / (E I_z) follows),
//    with phi = phi' = 0 at both ends (u'' = 0 there is then automatic). phi = A cos(beta s) +
//    B cosh(alpha s), s from mid-span; alpha^2, -beta^2 the roots of r^4 - (G I_t / E I_w) r^2 -
//    M^2 / (E^2 I_z I_w) = 0; the symmetric mode needs
//      beta sin(beta L/2) cosh(alpha L/2) + alpha sinh(alpha L/2) cos(beta L/2) = 0,
//    whose lowest root M is M_cr (our derivation, solved by bisection below);
//  - the NCCI SN003 formula with C1 = 1, k = 1, k_w = 0.5 (docs/spec/references.md section 3, CONFIRMED
//    structure; C1 from memory), as the brief asked:
//      M_cr = (pi^2 E I_z / L^2) sqrt((k / k_w)^2 I_w / I_z + L^2 G I_t / (pi^2 E I_z)).
//    It is an approximation for warping-fixed ends: for I_t -> 0 it gives (pi sqrt 2 / L)^2 in
//    place of the exact (4.730 / L)^2 of a clamped-clamped fourth-order problem, 13 % low. Measured
//    here it is 11.6 % below the exact value at both lengths; the 6 % check is made against the
//    exact solution, and the NCCI value is printed (and checked to lie below) beside it.
// The lowest mode must be lateral-torsional: its shape is read back from modes/mode_01.vtu and
// classified with model/patterns/section_deformation.hpp on the same mesh rebuilt here; the nearest local
// mode (the first mode classified as flange or web local buckling) is printed.
#include "tests/test_support.hpp"
#include "tests/verification/hinge/hinge_run.hpp"

#include "model/hinge_zone/hinge_zone_mesher.hpp"
#include "model/patterns/section_deformation.hpp"

#include <gtest/gtest.h>

#include <cmath>
#include <cstdio>
#include <numbers>

namespace rotcap::testing {
namespace {

constexpr double kE = 210000.0, kNu = 0.3, kH = 300.0, kB = 150.0, kTf = 10.7, kTw = 7.1;
constexpr double kPi = std::numbers::pi;

struct Torsion {
  double Iz, It, Iw, G;
};

Torsion plate_torsion() {
  const double hw = kH - kTf;
  return {2.0 * kTf * kB * kB * kB / 12.0 + hw * kTw * kTw * kTw / 12.0,
          2.0 * kB * kTf * kTf * kTf / 3.0 + hw * kTw * kTw * kTw / 3.0, kTf * kB * kB * kB * hw * hw / 24.0,
          kE / (2.0 * (1.0 + kNu))};
}

double ncci_mcr(const Torsion& p, double L) {
  const double k = 1.0, kw = 0.5;
  return kPi * kPi * kE * p.Iz / (L * L) *
         std::sqrt((k / kw) * (k / kw) * p.Iw / p.Iz + L * L * p.G * p.It / (kPi * kPi * kE * p.Iz));
}

/// The lowest root of the symmetric-mode condition of the header [N mm].
double exact_mcr(const Torsion& p, double L) {
  auto condition = [&](double M) {
    const double a = p.G * p.It / (2.0 * kE * p.Iw), b = M * M / (kE * kE * p.Iz * p.Iw);
    const double root = std::sqrt(a * a + b);
    const double alpha = std::sqrt(a + root), beta = std::sqrt(root - a);
    return beta * std::sin(0.5 * beta * L) * std::cosh(0.5 * alpha * L) +
           alpha * std::sinh(0.5 * alpha * L) * std::cos(0.5 * beta * L);
  };
  // March up from the fork-support value (below M_cr) to the first sign change, then bisect.
  const double fork = kPi / L * std::sqrt(kE * p.Iz * p.G * p.It) *
                      std::sqrt(1.0 + kPi * kPi * kE * p.Iw / (L * L * p.G * p.It));
  double lo = fork, f_lo = condition(lo), hi = lo;
  for (int i = 0; i < 10000; ++i) {
    hi = lo * 1.001;
    if (condition(hi) * f_lo <= 0.0) break;
    lo = hi;
    f_lo = condition(lo);
  }
  for (int i = 0; i < 100; ++i) {
    const double mid = 0.5 * (lo + hi);
    if (condition(mid) * f_lo <= 0.0) {
      hi = mid;
    } else {
      lo = mid;
      f_lo = condition(lo);
    }
  }
  return 0.5 * (lo + hi);
}

/// The hinge-zone model of the case, rebuilt to classify its mode shapes.
HingeZoneModel case_model(double L) {
  HingeZoneSpec spec;
  spec.section = ISection{"", kH, kB, kTf, kTw, 15.0, 0.0};
  spec.setup = HingeSetup::uniform_moment;
  spec.length = L;
  spec.flange_elements = 4;
  spec.web_elements = 4;
  spec.aspect = 2.0;
  spec.fy = 355.0;
  return build_hinge_zone(spec);
}

void check_ltb(const std::string& file, double L) {
  const HingeRun run = run_rotcap("buckling", hinge_case(file), file.substr(0, file.size() - 5), "-n 6");
  ASSERT_EQ(run.exit_code, 0) << run.err;
  const nlohmann::json j = read_json(run.results / "buckling.json");
  const std::vector<double> lambda = j["load_factors"], mcr = j["critical_moments_kNm"];
  ASSERT_EQ(lambda.size(), 6u);
  const Torsion p = plate_torsion();
  std::printf("plate model: Iz %.6g mm4, It %.6g mm4, Iw %.6g mm6, G %.6g MPa\n", p.Iz, p.It, p.Iw, p.G);
  // Mode shapes on the rebuilt mesh.
  const HingeZoneModel zone = case_model(L);
  const SectionDeformationAnalysis analysis(zone);
  std::vector<DeformationMode> modes;
  for (std::size_t k = 0; k < lambda.size(); ++k) {
    char name[48];
    std::snprintf(name, sizeof name, "modes/mode_%02d.vtu", static_cast<int>(k + 1));
    const VtuField f = read_vtu_field(run.results / name);
    ASSERT_EQ(static_cast<int>(f.points.size()), zone.model.node_count());
    for (int i = 0; i < zone.model.node_count(); ++i) ASSERT_LT((f.points[i] - zone.model.nodes[i]).norm(), 1e-6);
    double largest = 0.0;
    for (int i = 0; i < zone.model.node_count(); ++i) largest = std::max(largest, f.u.segment<3>(6 * i).norm());
    const Classification c = classify_detailed(analysis.analyse(f.u * (10.0 / largest)));
    modes.push_back(c.mode);
    std::printf("mode %zu: load factor %.5g, M = %.5g kNm, %s\n", k + 1, lambda[k], mcr[k], c.message.c_str());
  }
  EXPECT_EQ(modes[0], DeformationMode::lateral_torsional);
  const double exact = exact_mcr(p, L) / 1e6, ncci = ncci_mcr(p, L) / 1e6;
  print_comparison("M_cr [kNm] vs the exact warping-fixed solution", exact, mcr[0],
                   "Vlasov equation, Timoshenko & Gere 1961 ch. 6, from memory; phi = phi' = 0 at the ends");
  print_comparison("M_cr [kNm] vs NCCI SN003, C1 = 1, k = 1, k_w = 0.5 (for information)", ncci, mcr[0],
                   "NCCI SN003 eq. (1), docs/spec/references.md 3");
  std::printf("NCCI formula vs the exact solution: %+.2f %%\n", 100.0 * (ncci - exact) / exact);
  EXPECT_CLOSE(mcr[0], exact, 0.06, 0.0);
  EXPECT_LT(ncci, mcr[0]);
  int local = -1;
  for (std::size_t k = 0; k < modes.size() && local < 0; ++k)
    if (modes[k] == DeformationMode::flange_local_buckling || modes[k] == DeformationMode::web_local_buckling)
      local = static_cast<int>(k);
  if (local >= 0)
    std::printf("nearest local mode: mode %d, %s, load factor %.5g (%.4g times the LTB mode)\n", local + 1,
                deformation_mode_name(modes[local]), lambda[local], lambda[local] / lambda[0]);
  else
    std::printf("no local mode among the %zu lowest modes (all above are lateral-torsional)\n", modes.size());
  std::printf("run time %.2f s\n", run.wall_s);
}

TEST(HingeLateralTorsionalBuckling, FourMetreBeamMatchesWarpingFixedSolution) {
  check_ltb("ltb_uniform_moment_4m.toml", 4000.0);
}

TEST(HingeLateralTorsionalBuckling, EightMetreBeamMatchesWarpingFixedSolution) {
  check_ltb("ltb_uniform_moment_8m.toml", 8000.0);
}

}  // namespace
}  // namespace rotcap::testing
