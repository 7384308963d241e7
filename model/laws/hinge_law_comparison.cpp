#include "model/laws/hinge_law_comparison.hpp"

#include "core/text_format.hpp"

#include <algorithm>
#include <cmath>

namespace rotcap {

namespace {

/// The shell's moment at theta_u (Mp where the falling branch crosses it, else the last point).
double shell_moment_at_theta_u(const HingeCurveResult& r, const std::vector<MomentRotationPoint>& pts) {
  return r.status == HingeCurveStatus::falls_back_to_mp ? r.mp : pts.back().moment;
}

std::optional<double> relative_error(double shell, const std::optional<double>& law) {
  return law ? std::optional<double>((shell - *law) / *law) : std::nullopt;
}

HingeLawComparison compare(const HingeLawCurve& law, const std::vector<MomentRotationPoint>& pts,
                           const HingeCurveResult& r, double theta_p) {
  HingeLawComparison c;
  c.defined = !law.curve.empty();
  if (!c.defined) return c;
  c.m_at_theta_at_m_max = law_moment_at(law.curve, r.theta_at_m_max);
  c.error_at_theta_at_m_max = relative_error(r.m_max, c.m_at_theta_at_m_max);
  if (r.theta_u) {
    c.m_at_theta_u = law_moment_at(law.curve, *r.theta_u);
    c.error_at_theta_u = relative_error(shell_moment_at_theta_u(r, pts), c.m_at_theta_u);
  }
  LawComparisonOptions co;
  co.fraction = 0.05;
  c.compared_from_theta_over_theta_p = law.key == "moment_curvature" ? 1.0 : 2.0;
  co.from_theta = c.compared_from_theta_over_theta_p * theta_p;
  c.theta_first_below_5pct = theta_first_below_law(pts, law.curve, co);
  for (const MomentRotationPoint& p : pts)
    if (p.theta <= 5.0 * theta_p)
      if (const auto m = law_moment_at(law.curve, p.theta))
        c.max_difference_over_mp_up_to_5_theta_p =
            std::max(c.max_difference_over_mp_up_to_5_theta_p, std::abs(p.moment - *m) / r.mp);
  c.law_end_theta = law.curve.back().theta;
  return c;
}

}  // namespace

HingeLawSet compare_hinge_laws(const std::vector<MomentRotationPoint>& pts, const HingeCurveResult& r,
                               const HingeLawInputs& in) {
  HingeLawSet set;
  const HingeZoneModel& zone = in.zone;
  const double mp = zone.plastic_moment;
  set.k_el = r.k_el.value_or(mp / in.theta_p_beam);
  set.theta_p = mp / set.k_el;
  const double k_el = set.k_el;
  // Laws (a), (b) are drawn and compared over the shell run and a margin beyond it.
  const double theta_last = std::max(1.5 * pts.back().theta, 2.0 * set.theta_p);
  const double E = in.steel.E;
  const ISection& s = in.section;
  set.laws.push_back({"elastic_perfectly_plastic", "(a) elastic-perfectly plastic at Mp",
                      elastic_perfectly_plastic_law(mp, k_el, theta_last),
                      "theta = M / k_el (k_el of the shell curve) up to Mp"});
  if (in.steel.kind != SteelCurveKind::elastic) {
    const HardeningCurve hc = hardening_curve(in.steel);
    const UniaxialFibreLaw fibre = UniaxialFibreLaw::from_hardening_curve(E, hc.points());
    const double shear_span = zone.shear_span;  // read by the setups that need it (four_point)
    HardeningHingeInput hi{zone.setup, zone.span, shear_span, mp, E * zone.plate.Iy, E,
                           fibre.hardening_modulus(), fibre.hardening_onset_strain(), 0.5 * (s.h - s.tf), k_el};
    set.hardening = linear_hardening_hinge(hi, theta_last);
    set.laws.push_back({"linear_hardening", "(b) linear strain-hardening hinge",
                        set.hardening->defined ? set.hardening->curve : std::vector<MomentRotationPoint>{},
                        set.hardening->reason});
    ResidualStressPattern pattern;
    if (in.residual_stress != ResidualStressKind::none)
      pattern = ResidualStressPattern(in.residual_stress, s, in.steel.fy);
    MomentCurvatureOptions mo;
    mo.axial_force = -zone.axial_force;
    set.moment_curvature = moment_curvature(plate_model_fibres(s, pattern), fibre, mo);
    std::vector<MomentRotationPoint> integrated =
        integrate_member_rotation(*set.moment_curvature, zone.setup, zone.span, shear_span);
    const double extra_compliance = 1.0 / k_el - in.theta_p_beam / mp;
    for (MomentRotationPoint& p : integrated) p.theta += p.moment * extra_compliance;
    set.laws.push_back(
        {"moment_curvature", "(c) moment-curvature integration", integrated,
         set.moment_curvature->message +
             format_text("; elastic compliance matched to the shell (k_el / k_beam = %.4f)", k_el * in.theta_p_beam / mp) +
             (pattern.kind() == ResidualStressKind::none ? "" : "; residual stresses: " + pattern.description())});
  }
  set.fitted = fit_hinge_law(pts, mp, k_el);
  for (const HingeLawCurve& l : set.laws) set.comparisons.push_back(compare(l, pts, r, set.theta_p));
  return set;
}

}  // namespace rotcap
