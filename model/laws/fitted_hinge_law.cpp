#include "model/laws/fitted_hinge_law.hpp"
#include "core/text_format.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <stdexcept>

namespace rotcap {

namespace {

struct UV {
  double u, v;
};

// Relative moment error of point j against the chord from a to b (in u).
double chord_error(const std::vector<UV>& p, std::size_t a, std::size_t b, std::size_t j) {
  const double du = p[b].u - p[a].u;
  const double vc = du > 0.0 ? p[a].v + (p[b].v - p[a].v) * (p[j].u - p[a].u) / du : p[a].v;
  return std::abs(vc - p[j].v) / std::max(std::abs(p[j].v), 1e-12);
}

// Douglas-Peucker on [a, b]: marks the kept indices (a and b are kept by the caller).
void simplify(const std::vector<UV>& p, std::size_t a, std::size_t b, double tol, std::vector<bool>& keep) {
  if (b <= a + 1) return;
  std::size_t worst = a;
  double e_max = 0.0;
  for (std::size_t j = a + 1; j < b; ++j) {
    const double e = chord_error(p, a, b, j);
    if (e > e_max) {
      e_max = e;
      worst = j;
    }
  }
  if (e_max <= tol) return;
  keep[worst] = true;
  simplify(p, a, worst, tol, keep);
  simplify(p, worst, b, tol, keep);
}

}  // namespace

FittedHingeLaw fit_hinge_law(std::span<const MomentRotationPoint> curve, double mp, double k_el,
                             const FittedLawOptions& o) {
  if (curve.size() < 3) throw std::invalid_argument("fit_hinge_law: at least 3 curve points expected");
  if (!(mp > 0.0) || !(k_el > 0.0)) throw std::invalid_argument("fit_hinge_law: mp and k_el must be > 0");
  if (!(o.bound > 0.0 && o.bound < 1.0) || !(o.tolerance > 0.0 && o.tolerance <= o.bound) || o.elastic_limit < 0.0)
    throw std::invalid_argument("fit_hinge_law: 0 < tolerance <= bound < 1 and elastic_limit >= 0 expected");
  FittedHingeLaw law;
  law.theta_p = mp / k_el;
  std::vector<UV> p(curve.size());
  double running = 0.0;
  std::size_t peak = 0;
  for (std::size_t j = 0; j < curve.size(); ++j) {
    if (!std::isfinite(curve[j].theta) || !std::isfinite(curve[j].moment))
      throw std::invalid_argument("fit_hinge_law: non-finite curve point " + std::to_string(j));
    running = std::max(running, curve[j].theta - curve[j].moment / k_el);
    p[j] = {running / law.theta_p, curve[j].moment / mp};
    if (curve[j].moment > curve[peak].moment) peak = j;
  }
  // 1. The elastic limit: the last point before the peak still on the linear branch.
  std::size_t start = 0;
  for (std::size_t j = 0; j < peak; ++j)
    if (p[j].u <= o.elastic_limit) start = j;
  const std::size_t last = curve.size() - 1;
  // 2.-3. DP on [start, peak] and [peak, last], the peak kept.
  std::vector<bool> keep(curve.size(), false);
  keep[start] = keep[peak] = keep[last] = true;
  simplify(p, start, peak, o.tolerance, keep);
  simplify(p, peak, last, o.tolerance, keep);
  for (std::size_t j = start; j <= last; ++j) {
    if (!keep[j]) continue;
    std::string kind = j == start ? "elastic_limit" : j == peak ? "peak" : j == last ? "end" : j < peak ? "hardening" : "softening";
    law.points.push_back({p[j].u * law.theta_p, curve[j].moment, kind, j});
  }
  // The check: every covered curve point against the law (interpolated in theta_pl).
  for (std::size_t j = start; j <= last; ++j) {
    const double m_law = fitted_law_moment(law, p[j].u * law.theta_p);
    const double e = std::abs(m_law - curve[j].moment) / std::max(std::abs(curve[j].moment), 1e-12 * mp);
    ++law.points_checked;
    if (e > law.max_deviation) {
      law.max_deviation = e;
      law.theta_plastic_at_max_deviation = p[j].u * law.theta_p;
    }
  }
  law.within_bound = law.max_deviation <= o.bound;
  law.message = format_text(
                "fitted hinge law: %zu points (Douglas-Peucker, tolerance %.3g), largest deviation %.3g %% of M at "
                "theta_pl = %.3g mrad over %zu curve points (bound %.3g %%: %s)",
                law.points.size(), o.tolerance, 100.0 * law.max_deviation, 1e3 * law.theta_plastic_at_max_deviation,
                law.points_checked, 100.0 * o.bound, law.within_bound ? "met" : "NOT met");
  return law;
}

double fitted_law_moment(const FittedHingeLaw& law, double t) {
  const auto& q = law.points;
  if (q.empty()) return 0.0;
  if (t <= q.front().theta_plastic) return q.front().moment;
  for (std::size_t i = 1; i < q.size(); ++i)
    if (t <= q[i].theta_plastic) {
      const double d = q[i].theta_plastic - q[i - 1].theta_plastic;
      // Equal theta_pl (a vertical step): the first of the points, as the curve's check compares.
      if (d <= 0.0) return q[i - 1].moment;
      return q[i - 1].moment + (q[i].moment - q[i - 1].moment) * (t - q[i - 1].theta_plastic) / d;
    }
  return q.back().moment;
}

std::vector<MomentRotationPoint> fitted_law_curve(const FittedHingeLaw& law, double k_el) {
  std::vector<MomentRotationPoint> c{{0.0, 0.0}};
  for (const FittedLawPoint& q : law.points) c.push_back({q.theta_plastic + q.moment / k_el, q.moment});
  return c;
}

}  // namespace rotcap
