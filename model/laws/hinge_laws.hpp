#pragma once
// Simple hinge laws, drawn beside the shell model's moment-rotation curve. Rotations follow the
// same definitions as the shell run (docs/spec/interface.md, "Definitions the numbers follow";
// each setup's class in model/setups/, HingeRotation). Units: N mm, mm, rad.
//
// (a) Elastic-perfectly plastic at Mp: theta = M / k_el up to Mp, then M = Mp.
//
// (b) Linear strain-hardening hinge (DERIVED HERE; the idea of a yielded zone spreading with the
//     moment gradient and entering strain hardening follows Lay & Galambos' inelastic-beam
//     analyses of the 1960s, cited from memory, no formula taken from them). Idealised section
//     law: elastic (EI) up to Mp at kappa_p = Mp / (EI); at Mp the curvature jumps to
//     kappa_sh = eps_sh / zf (the flanges, at zf = (h - tf)/2, reach the strain-hardening onset
//     eps_sh of the steel); above Mp, dM = E_t I dkappa (E_t the steel's first hardening tangent
//     modulus). The plastic curvature (total minus elastic M/EI) of a yielded section is
//       dkappa(m) = D0 + (m - Mp) / (E' I),   D0 = max(0, kappa_sh - kappa_p),
//       1/E' = 1/E_t - 1/E.
//     The yielded zone is where M(x) > Mp: for a cantilever of length L, M(x) = M0 (1 - x/L) and
//     the zone has the length L_p = L (1 - Mp/M0). Integrating the plastic curvature along the
//     member by the rotation definitions (virtual work with the unit moment diagram of the
//     rotation, as in integrate_member_rotation below) gives the hinge's plastic rotation
//       theta_pl(M0) = c1 / M0^2 int_Mp^M0 dkappa(m) m dm + c2 dkappa(M0)
//                    = c1 / M0^2 [D0 (M0^2 - Mp^2)/2 + (M0^3/3 - Mp M0^2/2 + Mp^3/6) / (E' I)]
//                      + c2 dkappa(M0),
//     with (c1, c2) = (L, 0) cantilever and three_point, (2a, L - 2a) four_point. The relation is
//     not linear; the law uses its SECANT from (0, Mp) to the point theta_pl = r theta_p
//     (r = HardeningHingeOptions::reference_plastic_rotation, default 4: the law is fitted over
//     the range up to 5 theta_p). The law is M = Mp + K_sh theta_pl, theta = M / k_el + theta_pl.
//     uniform_moment: no moment gradient; the whole zone yields at once (L_p = L (1 - Mp/M0) has
//     no counterpart), so a hinge slope independent of the zone length does not exist: the law is
//     reported as not defined, with that reason, and no number is invented
//     (LoadingSetup::no_hardening_hinge_law).
//     A steel without strain hardening (E_t = 0): K_sh = 0, law (b) equals law (a).
//
// (c) Moment-curvature integration (model/laws/moment_curvature.hpp) along the statically
//     determinate member: M(x) from statics, kappa(M(x)) by inverting M(kappa), the rotation by
//     virtual work with the unit moment diagram of the rotation definition:
//       theta(M0) = c1 / M0^2 int_0^M0 kappa(m) m dm + c2 kappa(M0),
//     (c1, c2) = (L, 0) cantilever (theta = delta/L, M(x) = M0 (1 - x/L)) and three_point
//     (theta = 4 delta_mid/L), (2a, L - 2a) four_point (theta = 2 delta(a)/a), (0, L)
//     uniform_moment (relative end rotation). kappa(m) is piecewise linear in m, so the integral
//     is exact for the tabulated M(kappa). Elastic: theta = M0 c1/(3EI) + M0 c2/(EI), the beam
//     theory of beam_theory_rotation_at_mp. Shear deformation and local buckling are absent by
//     construction. The curve stops at the last point of M(kappa) (the ultimate strain).

#include "model/hinge/hinge_curve.hpp"
#include "model/hinge_zone/hinge_zone_mesher.hpp"
#include "model/laws/moment_curvature.hpp"
#include "model/setups/loading_setup.hpp"

#include <string>
#include <vector>

namespace rotcap {

/// Coefficients (c1, c2) of the rotation integrals above (RotationIntegral, LoadingSetup::
/// rotation_integral): length L > 0; shear_span a (four_point only, 0 < a <= L/2). Throws
/// std::invalid_argument.
RotationIntegral rotation_integral(HingeSetup setup, double length, double shear_span);

/// (a): (0,0), (theta_p, Mp), (theta_end, Mp); theta_p = Mp / k_el. mp, k_el > 0, theta_end > theta_p.
std::vector<MomentRotationPoint> elastic_perfectly_plastic_law(double mp, double k_el, double theta_end);

struct HardeningHingeOptions {
  double reference_plastic_rotation = 4.0;  ///< r: secant to theta_pl = r theta_p, > 0
};

struct HardeningHingeInput {
  HingeSetup setup = HingeSetup::cantilever;
  double length = 0.0;      ///< L [mm]
  double shear_span = 0.0;  ///< a [mm] (four_point)
  double mp = 0.0;          ///< [N mm]
  double EI = 0.0;          ///< [N mm^2]
  double E = 0.0;           ///< [MPa]
  double E_t = 0.0;         ///< first hardening tangent modulus [MPa], >= 0
  double eps_sh = 0.0;      ///< strain-hardening onset [-]
  double zf = 0.0;          ///< flange lever arm (h - tf)/2 [mm]
  double k_el = 0.0;        ///< elastic slope of the hinge [N mm/rad] (the shell's)
};

struct HardeningHingeLaw {
  bool defined = false;
  std::string reason;        ///< why not defined, or how the slope was found (numbers quoted)
  double slope = 0.0;        ///< K_sh = dM / dtheta_pl [N mm/rad]
  double slope_ratio = 0.0;  ///< K_sh / k_el [-]
  double reference_moment = 0.0;  ///< M at theta_pl = r theta_p on the derived relation [N mm]
  std::vector<MomentRotationPoint> curve;  ///< (0,0), (theta_p, Mp), (theta_end, ...)
};

/// theta_pl(M0) of the derived relation (b); 0 for M0 <= Mp; +inf when E_t = 0 and M0 > Mp.
double spread_plastic_rotation(const HardeningHingeInput& in, double m0);

/// Law (b) up to theta_end (> Mp / k_el). Throws std::invalid_argument for inputs out of range.
HardeningHingeLaw linear_hardening_hinge(const HardeningHingeInput& in, double theta_end,
                                         const HardeningHingeOptions& options = {});

/// (c): theta(M0) at every moment M0 of the M(kappa) curve (skipping repeated moments), from (0,0).
std::vector<MomentRotationPoint> integrate_member_rotation(const MomentCurvatureCurve& mk, HingeSetup setup,
                                                           double length, double shear_span);

/// Linear interpolation of a law at theta (theta strictly increasing); nullopt outside its range.
std::optional<double> law_moment_at(std::span<const MomentRotationPoint> law, double theta);

}  // namespace rotcap
