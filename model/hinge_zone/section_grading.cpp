#include "model/hinge_zone/section_grading.hpp"

#include "core/check.hpp"

#include <algorithm>
#include <cmath>

namespace rotcap {

namespace {

/// n + 1 equally spaced flange lines over the width b [mm], y = 0 exactly at k = n/2.
std::vector<double> flange_lines(double b, int n) {
  std::vector<double> y(static_cast<std::size_t>(n) + 1);
  for (int k = 0; k <= n; ++k) y[static_cast<std::size_t>(k)] = (k - n / 2) * (b / n);
  return y;
}

/// phi(s) and its inverse for the target size hf up to s0, hf + g (s - s0) up to s1 (where it
/// reaches c hf), c hf beyond.
struct WebSize {
  double hf, s0, c, g = kWebGrowth;
  double s1() const { return s0 + (c - 1.0) * hf / g; }
  double phi1() const { return s0 / hf + std::log(c) / g; }
  double phi(double s) const {
    if (s <= s0) return s / hf;
    if (s <= s1()) return s0 / hf + std::log1p(g * (s - s0) / hf) / g;
    return phi1() + (s - s1()) / (c * hf);
  }
  double inverse(double p) const {
    if (p <= s0 / hf) return p * hf;
    if (p <= phi1()) return s0 + hf * std::expm1(g * (p - s0 / hf)) / g;
    return s1() + (p - phi1()) * c * hf;
  }
};

}  // namespace

int tension_flange_elements(int nf, double c) {
  ROTCAP_CHECK(nf >= 4 && nf % 2 == 0 && c >= 1.0, "nf = " + std::to_string(nf) + ", c = " + std::to_string(c));
  const int n = 2 * static_cast<int>(std::lround(0.5 * nf / c));
  return std::clamp(n, 4, nf);
}

std::vector<double> web_lines(double zf, int nw, double c, bool top_in_compression, double e) {
  ROTCAP_CHECK(zf > 0.0 && nw >= 1 && c >= 1.0 && e >= 0.0, "web_lines: bad arguments");
  std::vector<double> z(static_cast<std::size_t>(nw) + 1);
  if (c == 1.0 || e >= zf) {  // uniform: today's expression, exactly
    for (int m = 0; m <= nw; ++m) z[static_cast<std::size_t>(m)] = (m - 0.5 * nw) * (2.0 * zf / nw);
    return z;
  }
  const double D = 2.0 * zf;
  const WebSize w{D / nw, zf + e, c};
  const double total = w.phi(D);
  const int n = std::max(1, static_cast<int>(std::ceil(total - 1e-9)));
  z.assign(static_cast<std::size_t>(n) + 1, 0.0);
  for (int k = 0; k <= n; ++k) {
    const double s = k == n ? D : std::min(D, w.inverse(total * k / n));
    // s from the compression flange; z ascending from the bottom flange.
    if (top_in_compression) z[static_cast<std::size_t>(n - k)] = zf - s;
    else z[static_cast<std::size_t>(k)] = s - zf;
  }
  z.front() = -zf;
  z.back() = zf;
  return z;
}

SectionGrid section_grid(const HingeZoneSpec& spec, bool top_in_compression, double axial_force, bool matched_flanges) {
  const ISection& sec = spec.section;
  const double c = spec.tension_coarsening;
  const int nf = spec.flange_elements;
  const int n_tension = matched_flanges ? nf : tension_flange_elements(nf, c);
  const double zf = 0.5 * (sec.h - sec.tf);
  const double e = std::max(0.0, axial_force) / (2.0 * spec.fy * sec.tw);  // the web carries N first
  SectionGrid g;
  g.y_bottom = flange_lines(sec.b, top_in_compression ? n_tension : nf);
  g.y_top = flange_lines(sec.b, top_in_compression ? nf : n_tension);
  g.z_web = web_lines(zf, spec.web_elements, c, top_in_compression, e);
  return g;
}

}  // namespace rotcap
