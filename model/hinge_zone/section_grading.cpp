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
  // Per half: h fine cells become n cells, (h - n) of two fine widths in pairs and 2 n - h of one.
  const int h = nf / 2;
  const double target = h / c;
  int best = h;
  for (int n = h; n >= std::max(1, (h + 1) / 2); --n)
    if ((h - n) % 2 == 0 && std::abs(n - target) < std::abs(best - target) - 1e-9) best = n;
  return std::max(4, 2 * best);
}

std::vector<int> tension_flange_indices(int nf, int n) {
  const int h = nf / 2, half = n / 2, singles = 2 * half - h;
  ROTCAP_CHECK(n % 2 == 0 && half <= h && singles >= 0 && (h - half) % 2 == 0,
               "tension flange of " + std::to_string(n) + " elements on " + std::to_string(nf));
  std::vector<int> right{h};  // from the web outwards: cells of one fine width first, then of two
  for (int j = 0; j < half; ++j) right.push_back(right.back() + (j < singles ? 1 : 2));
  std::vector<int> k;
  for (auto it = right.rbegin(); it != right.rend(); ++it) k.push_back(nf - *it);  // mirrored left half
  k.insert(k.end(), right.begin() + 1, right.end());
  return k;
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

SectionGrid section_grid(const HingeZoneSpec& spec, bool top_in_compression, double axial_force) {
  const ISection& sec = spec.section;
  const double c = spec.tension_coarsening;
  const int nf = spec.flange_elements;
  const std::vector<double> fine = flange_lines(sec.b, nf);
  std::vector<double> tension;
  for (int k : tension_flange_indices(nf, tension_flange_elements(nf, c))) tension.push_back(fine[static_cast<std::size_t>(k)]);
  const double zf = 0.5 * (sec.h - sec.tf);
  const double e = std::max(0.0, axial_force) / (2.0 * spec.fy * sec.tw);  // the web carries N first
  SectionGrid g;
  g.y_bottom = top_in_compression ? tension : fine;
  g.y_top = top_in_compression ? fine : tension;
  g.z_web = web_lines(zf, spec.web_elements, c, top_in_compression, e);
  return g;
}

}  // namespace rotcap
