#include "model/laws/hinge_laws.hpp"
#include "core/text_format.hpp"

#include "model/setups/loading_setup.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <limits>
#include <stdexcept>
#include <utility>

namespace rotcap {

namespace {

std::string num(double v) { return format_text("%.4g", v); }

}  // namespace

RotationIntegral rotation_integral(HingeSetup setup, double L, double a) {
  if (!(L > 0.0)) throw std::invalid_argument("member length " + num(L) + " mm: expected > 0");
  return loading_setup(setup).rotation_integral(L, a);
}

std::vector<MomentRotationPoint> elastic_perfectly_plastic_law(double mp, double k_el, double theta_end) {
  if (!(mp > 0.0) || !(k_el > 0.0) || !(theta_end > mp / k_el))
    throw std::invalid_argument("elastic_perfectly_plastic_law: mp, k_el > 0 and theta_end > mp/k_el expected");
  return {{0.0, 0.0}, {mp / k_el, mp}, {theta_end, mp}};
}

double spread_plastic_rotation(const HardeningHingeInput& in, double m0) {
  const double mp = in.mp;
  if (m0 <= mp) return 0.0;
  if (!(in.E_t > 0.0)) return std::numeric_limits<double>::infinity();
  const RotationIntegral ri = rotation_integral(in.setup, in.length, in.shear_span);
  const double I = in.EI / in.E;
  const double inv_EpI = (1.0 / in.E_t - 1.0 / in.E) / I;  // 1 / (E' I)
  const double D0 = std::max(0.0, in.eps_sh / in.zf - mp / in.EI);
  // int_Mp^M0 dkappa(m) m dm, dkappa = D0 + (m - Mp) / (E' I).
  const double integral = D0 * 0.5 * (m0 * m0 - mp * mp) +
                          inv_EpI * (m0 * m0 * m0 / 3.0 - 0.5 * mp * m0 * m0 + mp * mp * mp / 6.0);
  return ri.c1 * integral / (m0 * m0) + ri.c2 * (D0 + (m0 - mp) * inv_EpI);
}

HardeningHingeLaw linear_hardening_hinge(const HardeningHingeInput& in, double theta_end,
                                         const HardeningHingeOptions& o) {
  if (!(in.mp > 0.0) || !(in.EI > 0.0) || !(in.E > 0.0) || !(in.k_el > 0.0) || !(in.zf > 0.0) || in.E_t < 0.0 ||
      in.E_t >= in.E || !(o.reference_plastic_rotation > 0.0))
    throw std::invalid_argument("linear_hardening_hinge: mp, EI, E, k_el, zf > 0, 0 <= E_t < E and "
                                "reference_plastic_rotation > 0 expected");
  HardeningHingeLaw law;
  const double theta_p = in.mp / in.k_el;
  if (!(theta_end > theta_p)) throw std::invalid_argument("linear_hardening_hinge: theta_end must exceed theta_p");
  if (std::optional<std::string> why = loading_setup(in.setup).no_hardening_hinge_law()) {
    law.reason = std::move(*why);
    return law;
  }
  law.defined = true;
  const double target = o.reference_plastic_rotation * theta_p;
  if (!(in.E_t > 0.0)) {
    law.reason = "the steel has no strain hardening (E_t = 0): K_sh = 0, the law equals the elastic-perfectly "
                 "plastic hinge";
    law.reference_moment = in.mp;
  } else if (spread_plastic_rotation(in, in.mp * (1.0 + 1e-12)) >= target) {
    law.reason = "the yield plateau alone gives theta_pl >= " + num(o.reference_plastic_rotation) + " theta_p: K_sh = 0";
    law.reference_moment = in.mp;
  } else {
    // theta_pl(M0) is increasing in M0: bisection for theta_pl = target, upper bound doubled as needed.
    double lo = in.mp, hi = 2.0 * in.mp;
    while (spread_plastic_rotation(in, hi) < target) hi *= 2.0;
    for (int it = 0; it < 200 && hi - lo > 1e-12 * in.mp; ++it) {
      const double mid = 0.5 * (lo + hi);
      (spread_plastic_rotation(in, mid) < target ? lo : hi) = mid;
    }
    law.reference_moment = 0.5 * (lo + hi);
    law.slope = (law.reference_moment - in.mp) / target;
    law.reason = "secant of the spread-of-plasticity relation to theta_pl = " + num(o.reference_plastic_rotation) +
                 " theta_p (M = " + num(law.reference_moment / in.mp) + " Mp): K_sh = " + num(law.slope / in.k_el) +
                 " k_el (E_t = " + num(in.E_t) + " MPa, eps_sh = " + num(in.eps_sh) + ")";
  }
  law.slope_ratio = law.slope / in.k_el;
  // M = Mp + K_sh theta_pl and theta = M / k_el + theta_pl: theta_pl = (theta - theta_p) / (1 + K_sh / k_el).
  const double theta_pl_end = (theta_end - theta_p) / (1.0 + law.slope_ratio);
  const double m_end = in.mp + law.slope * theta_pl_end;
  law.curve = {{0.0, 0.0}, {theta_p, in.mp}, {theta_end, m_end}};  // theta_end = m_end / k_el + theta_pl_end
  return law;
}

std::vector<MomentRotationPoint> integrate_member_rotation(const MomentCurvatureCurve& mk, HingeSetup setup,
                                                           double length, double shear_span) {
  const RotationIntegral ri = rotation_integral(setup, length, shear_span);
  std::vector<MomentRotationPoint> out{{0.0, 0.0}};
  // Cumulative int_0^m kappa(m') m' dm' over the segments of the table; kappa linear in m on each.
  double integral = 0.0;
  double m_a = 0.0, k_a = 0.0;
  for (const MomentCurvaturePoint& p : mk.points) {
    const double m_b = p.moment, k_b = p.kappa;
    if (!(m_b > m_a)) continue;  // repeated or falling moment: kappa(M) takes the first kappa
    const double s = (k_b - k_a) / (m_b - m_a);
    integral += k_a * 0.5 * (m_b * m_b - m_a * m_a) +
                s * ((m_b * m_b * m_b - m_a * m_a * m_a) / 3.0 - m_a * 0.5 * (m_b * m_b - m_a * m_a));
    out.push_back({ri.c1 * integral / (m_b * m_b) + ri.c2 * k_b, m_b});
    m_a = m_b;
    k_a = k_b;
  }
  return out;
}

std::optional<double> law_moment_at(std::span<const MomentRotationPoint> law, double theta) {
  if (law.size() < 2 || theta < law.front().theta || theta > law.back().theta) return std::nullopt;
  for (std::size_t i = 1; i < law.size(); ++i)
    if (theta <= law[i].theta) {
      const double d = law[i].theta - law[i - 1].theta;
      if (d <= 0.0) return law[i].moment;
      return law[i - 1].moment + (law[i].moment - law[i - 1].moment) * (theta - law[i - 1].theta) / d;
    }
  return law.back().moment;
}

}  // namespace rotcap
