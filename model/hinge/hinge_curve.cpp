#include "model/hinge/hinge_curve.hpp"
#include "core/text_format.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <stdexcept>
#include <vector>

namespace rotcap {

namespace {

std::string num(double v) { return format_text("%.6g", v); }

void require_finite_curve(std::span<const MomentRotationPoint> curve, const char* what) {
  for (std::size_t j = 0; j < curve.size(); ++j)
    if (!std::isfinite(curve[j].theta) || !std::isfinite(curve[j].moment))
      throw std::invalid_argument(std::string(what) + ": point " + std::to_string(j) + " = (" +
                                  num(curve[j].theta) + ", " + num(curve[j].moment) +
                                  "): expected finite theta and M");
}

/// theta where the segment a -> b reaches moment level m (a.moment != b.moment, m between them).
double crossing(const MomentRotationPoint& a, const MomentRotationPoint& b, double m) {
  const double t = (m - a.moment) / (b.moment - a.moment);
  return a.theta + t * (b.theta - a.theta);
}

/// k_el by least squares through the origin over the leading run with M <= limit; see header.
void fit_initial_slope(std::span<const MomentRotationPoint> curve, double limit, HingeCurveResult& r) {
  double stt = 0.0, stm = 0.0;  // sum theta^2, sum theta M: the normal equation of M = k theta
  std::size_t used = 0;
  for (std::size_t j = 1; j < curve.size() && curve[j].moment <= limit; ++j) {
    if (curve[j].theta == 0.0) continue;
    stt += curve[j].theta * curve[j].theta;
    stm += curve[j].theta * curve[j].moment;
    ++used;
  }
  if (used == 0) {
    for (std::size_t j = 1; j < curve.size(); ++j) {
      if (curve[j].theta == 0.0) continue;
      stt = curve[j].theta * curve[j].theta;
      stm = curve[j].theta * curve[j].moment;
      used = 1;
      r.k_el_from_first_point_above_limit = true;
      break;
    }
  }
  r.k_el_points = used;
  if (used == 0) return;
  const double k = stm / stt;
  if (!(k > 0.0) || !std::isfinite(k)) return;
  r.k_el = k;
  r.theta_p = r.mp / k;
}

struct Peak {
  MomentRotationPoint vertex;
  PeakMethod method = PeakMethod::largest_point;
};

/// The peak of the curve about its largest point i (guards in the header).
Peak locate_peak(std::span<const MomentRotationPoint> c, std::size_t i) {
  const Peak sample{c[i], PeakMethod::largest_point};
  if (c.size() < 3 || i == 0 || i + 1 >= c.size()) return sample;
  const MomentRotationPoint &p0 = c[i - 1], &p1 = c[i], &p2 = c[i + 1];
  if (!(p0.theta < p1.theta && p1.theta < p2.theta)) return sample;
  if (p0.moment == p1.moment || p2.moment == p1.moment) return sample;  // flat top
  // M = M1 + b t + a t^2 with t = theta - theta1 through the three points:
  //   (M0 - M1)/h0 = b + a h0,  (M2 - M1)/h2 = b + a h2   (h0 < 0 < h2)
  // i.e. the Numerical Recipes eq. 10.2.1 vertex, written about the middle point so the
  // differences stay small. Vertex t* = -b / (2a), M* = M1 - b^2 / (4a).
  const double h0 = p0.theta - p1.theta, h2 = p2.theta - p1.theta;
  const double s0 = (p0.moment - p1.moment) / h0, s2 = (p2.moment - p1.moment) / h2;
  const double a = (s2 - s0) / (h2 - h0);
  const double b = s0 - a * h0;
  if (!(a < 0.0)) return sample;
  const double t = -b / (2.0 * a);
  if (!(t >= h0 && t <= h2)) return sample;
  return {{p1.theta + t, p1.moment - b * b / (4.0 * a)}, PeakMethod::parabola};
}

}  // namespace

HingeCurveResult extract_hinge_curve(std::span<const MomentRotationPoint> curve, double mp,
                                     double mel, double theta_p_beam,
                                     const HingeCurveOptions& options) {
  if (curve.empty()) throw std::invalid_argument("extract_hinge_curve: empty curve: expected >= 1 point");
  require_finite_curve(curve, "extract_hinge_curve");
  if (!(mp > 0.0) || !std::isfinite(mp))
    throw std::invalid_argument("extract_hinge_curve: Mp = " + num(mp) + " N mm: expected > 0");
  if (!(mel > 0.0) || !std::isfinite(mel))
    throw std::invalid_argument("extract_hinge_curve: Mel = " + num(mel) + " N mm: expected > 0");
  if (!std::isfinite(theta_p_beam))
    throw std::invalid_argument("extract_hinge_curve: theta_p_beam = " + num(theta_p_beam) +
                                ": expected finite");
  if (!(options.elastic_fraction > 0.0 && options.elastic_fraction <= 1.0))
    throw std::invalid_argument("HingeCurveOptions::elastic_fraction = " +
                                num(options.elastic_fraction) + ": expected 0 < value <= 1");

  HingeCurveResult r;
  r.mp = mp;
  r.mel = mel;
  r.theta_p_beam = theta_p_beam;
  fit_initial_slope(curve, options.elastic_fraction * mel, r);

  // Peak: first largest point, refined by the guarded parabola.
  std::size_t i = 0;
  for (std::size_t j = 1; j < curve.size(); ++j)
    if (curve[j].moment > curve[i].moment) i = j;
  const Peak peak = locate_peak(curve, i);
  r.peak_index = i;
  r.peak_method = peak.method;
  r.m_max = peak.vertex.moment;
  r.theta_at_m_max = peak.vertex.theta;

  if (r.m_max < mp) {
    r.status = HingeCurveStatus::below_mp;
    r.message = "the section does not reach its plastic moment: M_max / Mp = " + num(r.m_max / mp) +
                " at theta = " + num(1e3 * r.theta_at_m_max) + " mrad";
    return r;
  }

  // The polyline with the vertex inserted on its side of point i; q is the vertex's index in it.
  std::vector<MomentRotationPoint> line(curve.begin(), curve.end());
  std::size_t q = i;
  if (peak.method == PeakMethod::parabola) {
    if (peak.vertex.theta > curve[i].theta) q = i + 1;
    if (peak.vertex.theta == curve[i].theta) line[i] = peak.vertex;
    else line.insert(line.begin() + static_cast<std::ptrdiff_t>(q), peak.vertex);
  }

  // Rising branch: first point at or above Mp, bracketed by the point before it.
  for (std::size_t j = 0; j <= q; ++j) {
    if (line[j].moment < mp) continue;
    r.theta_at_mp = j == 0 ? line[0].theta : crossing(line[j - 1], line[j], mp);
    break;
  }
  // Falling branch: first point below Mp after the peak (its predecessor is at or above Mp).
  for (std::size_t j = q + 1; j < line.size(); ++j) {
    if (line[j].moment >= mp) continue;
    r.theta_u = crossing(line[j - 1], line[j], mp);
    break;
  }
  if (r.theta_u) {
    r.status = HingeCurveStatus::falls_back_to_mp;
  } else {
    r.status = HingeCurveStatus::ends_above_mp;
    r.theta_u = line.back().theta;
    r.rotation_capacity_is_lower_bound = true;
  }

  const std::string peak_text = "M_max / Mp = " + num(r.m_max / mp) + " at " +
                                num(1e3 * r.theta_at_m_max) + " mrad";
  if (!r.theta_p) {
    r.message = peak_text + "; no initial slope (no loaded step with theta != 0 and M > 0): R unknown";
    return r;
  }
  r.rotation_capacity = *r.theta_u / *r.theta_p - 1.0;
  const std::string secant = r.k_el_from_first_point_above_limit
                                 ? " (a secant: the first point is already above " + num(options.elastic_fraction) +
                                       " Mel; a smaller [analysis] first_step gives the initial slope)"
                                 : "";
  const std::string capacity = "theta_p = " + num(1e3 * *r.theta_p) + " mrad" + secant + ", R = theta_u / theta_p - 1";
  if (r.status == HingeCurveStatus::falls_back_to_mp)
    r.message = peak_text + "; falls back to Mp at theta_u = " + num(1e3 * *r.theta_u) + " mrad; " +
                capacity + " = " + num(*r.rotation_capacity);
  else
    r.message = peak_text + "; the curve ends above Mp at theta = " + num(1e3 * *r.theta_u) +
                " mrad; " + capacity + " >= " + num(*r.rotation_capacity) + " (lower bound)";
  return r;
}

std::optional<double> theta_first_below_law(std::span<const MomentRotationPoint> curve,
                                            std::span<const MomentRotationPoint> law,
                                            const LawComparisonOptions& options) {
  if (curve.empty()) throw std::invalid_argument("theta_first_below_law: empty curve: expected >= 1 point");
  if (law.size() < 2)
    throw std::invalid_argument("theta_first_below_law: law of " + std::to_string(law.size()) +
                                " points: expected >= 2");
  require_finite_curve(curve, "theta_first_below_law (curve)");
  require_finite_curve(law, "theta_first_below_law (law)");
  for (std::size_t j = 1; j < law.size(); ++j)
    if (!(law[j].theta > law[j - 1].theta))
      throw std::invalid_argument("theta_first_below_law: law theta[" + std::to_string(j) + "] = " +
                                  num(law[j].theta) + ": expected > theta[" + std::to_string(j - 1) +
                                  "] = " + num(law[j - 1].theta));
  if (!(options.fraction >= 0.0 && options.fraction < 1.0))
    throw std::invalid_argument("LawComparisonOptions::fraction = " + num(options.fraction) +
                                ": expected 0 <= value < 1");
  if (!(options.reference_moment >= 0.0) || !std::isfinite(options.reference_moment))
    throw std::invalid_argument("LawComparisonOptions::reference_moment = " +
                                num(options.reference_moment) + ": expected finite, >= 0");
  if (!std::isfinite(options.from_theta))
    throw std::invalid_argument("LawComparisonOptions::from_theta = " + num(options.from_theta) +
                                ": expected finite");

  const double lo = std::max(law.front().theta, options.from_theta), hi = law.back().theta;
  // Margin g = M - (M_law - fraction * scale) at a compared rotation; absent outside [lo, hi].
  auto margin = [&](double theta, double m) -> std::optional<double> {
    if (theta < lo || theta > hi) return std::nullopt;
    const auto it = std::upper_bound(law.begin(), law.end(), theta,
                                     [](double t, const MomentRotationPoint& p) { return t < p.theta; });
    const std::size_t k = std::min<std::size_t>(static_cast<std::size_t>(it - law.begin()), law.size() - 1);
    const MomentRotationPoint &a = law[k - 1], &b = law[k];
    const double m_law = a.moment + (theta - a.theta) / (b.theta - a.theta) * (b.moment - a.moment);
    const double scale = options.reference_moment > 0.0 ? options.reference_moment : std::abs(m_law);
    return m - (m_law - options.fraction * scale);
  };

  // Walk the curve in path order. Each segment is cut at the rotations where the comparison
  // changes form (law breakpoints, lo, hi), so g is linear on every piece and its zero is found
  // exactly by linear interpolation.
  struct Sample { double theta, m, g; };
  std::optional<Sample> prev;
  auto visit = [&](double theta, double m) -> std::optional<double> {
    const std::optional<double> g = margin(theta, m);
    if (!g) { prev.reset(); return std::nullopt; }
    if (*g < 0.0) {
      if (!prev) return theta;  // the first compared point is already below
      const double t = prev->g / (prev->g - *g);
      return prev->theta + t * (theta - prev->theta);
    }
    prev = Sample{theta, m, *g};
    return std::nullopt;
  };

  if (auto hit = visit(curve[0].theta, curve[0].moment)) return hit;
  std::vector<std::pair<double, double>> cuts;  // (s in (0, 1), exact theta there)
  for (std::size_t j = 1; j < curve.size(); ++j) {
    const MomentRotationPoint &a = curve[j - 1], &b = curve[j];
    cuts.clear();
    auto cut_at = [&](double theta) {
      if ((theta - a.theta) * (theta - b.theta) < 0.0)  // strictly inside the segment
        cuts.emplace_back((theta - a.theta) / (b.theta - a.theta), theta);
    };
    for (const MomentRotationPoint& p : law) cut_at(p.theta);
    cut_at(lo);
    std::sort(cuts.begin(), cuts.end());
    for (const auto& [s, theta] : cuts)
      if (auto hit = visit(theta, a.moment + s * (b.moment - a.moment))) return hit;
    if (auto hit = visit(b.theta, b.moment)) return hit;
  }
  return std::nullopt;
}

}  // namespace rotcap
