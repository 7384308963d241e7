#include "model/hinge_zone/station_grading.hpp"

#include <algorithm>
#include <cmath>

namespace rotcap {

namespace {

/// The grading: target size h_e in the hinge region, growing with slope `growth` (element ratio
/// 1 + growth) up to max_size h_e; neighbours accepted up to max_ratio() (1.25 for slope 0.2).
struct Grading {
  double he, max_size, growth;
  double max_ratio() const { return 1.05 + growth; }
};

struct SizeField {
  std::vector<double> x, s;
  std::vector<std::size_t> begin;  // first sample of each span; begin.back() = x.size()
};

// Lipschitz envelope: the largest field <= s with |ds/dx| <= growth (two sweeps).
void limit_slope(SizeField& f, double growth) {
  for (std::size_t i = 1; i < f.s.size(); ++i) f.s[i] = std::min(f.s[i], f.s[i - 1] + growth * (f.x[i] - f.x[i - 1]));
  for (std::size_t i = f.s.size() - 1; i-- > 0;) f.s[i] = std::min(f.s[i], f.s[i + 1] + growth * (f.x[i + 1] - f.x[i]));
}

SizeField initial_field(const std::vector<double>& hard, const Grading& gr, double hinge_lo, double hinge_hi) {
  const double he = gr.he;
  SizeField f;
  for (std::size_t j = 0; j + 1 < hard.size(); ++j) {
    const double a = hard[j], len = hard[j + 1] - a;
    const int m = std::max(8, static_cast<int>(std::ceil(16.0 * len / he)));
    f.begin.push_back(f.x.size());
    for (int t = 0; t <= m; ++t) {
      const double x = t == m ? hard[j + 1] : a + len * t / m;
      const double d = x < hinge_lo ? hinge_lo - x : (x > hinge_hi ? x - hinge_hi : 0.0);
      f.x.push_back(x);
      f.s.push_back(std::min({gr.max_size * he, he + gr.growth * d, len}));  // no element beyond its span
    }
  }
  f.begin.push_back(f.x.size());
  limit_slope(f, gr.growth);
  return f;
}

std::vector<double> place_stations(const SizeField& f) {
  std::vector<double> st{f.x.front()};
  std::vector<double> phi;
  for (std::size_t j = 0; j + 1 < f.begin.size(); ++j) {
    const std::size_t i0 = f.begin[j], i1 = f.begin[j + 1];
    phi.assign(1, 0.0);
    for (std::size_t i = i0 + 1; i < i1; ++i)
      phi.push_back(phi.back() + 0.5 * (f.x[i] - f.x[i - 1]) * (1.0 / f.s[i] + 1.0 / f.s[i - 1]));
    const int n = std::max(1, static_cast<int>(std::ceil(phi.back() - 1e-6)));
    std::size_t i = 0;
    for (int k = 1; k < n; ++k) {
      const double target = phi.back() * k / n;
      while (phi[i + 1] < target) ++i;
      const double t = (target - phi[i]) / (phi[i + 1] - phi[i]);
      st.push_back(f.x[i0 + i] + t * (f.x[i0 + i + 1] - f.x[i0 + i]));
    }
    st.push_back(f.x[i1 - 1]);
  }
  return st;
}

void lower(SizeField& f, double x0, double x1, double value) {
  for (std::size_t i = 0; i < f.x.size(); ++i)
    if (f.x[i] >= x0 && f.x[i] <= x1) f.s[i] = std::min(f.s[i], value);
}

}  // namespace

std::vector<double> grade_stations(const std::vector<double>& hard, double he, double hinge_lo, double hinge_hi,
                                   double max_size, double growth) {
  const Grading gr{he, max_size, growth};
  SizeField f = initial_field(hard, gr, hinge_lo, hinge_hi);
  for (int iteration = 0; iteration < 100; ++iteration) {
    const std::vector<double> st = place_stations(f);
    bool graded = true;
    for (std::size_t e = 0; e + 2 < st.size(); ++e) {
      const double a = st[e + 1] - st[e], b = st[e + 2] - st[e + 1];
      if (a > gr.max_ratio() * b) {
        lower(f, st[e], st[e + 1], (1.0 + growth) * b);
        graded = false;
      } else if (b > gr.max_ratio() * a) {
        lower(f, st[e + 1], st[e + 2], (1.0 + growth) * a);
        graded = false;
      }
    }
    if (graded) return st;
    limit_slope(f, growth);
  }
  return place_stations(f);  // best effort; not reached for the meshes tested
}

std::vector<double> unique_points(std::vector<double> p, double L, double tol) {
  for (double& x : p) x = std::abs(x) <= tol ? 0.0 : (std::abs(x - L) <= tol ? L : x);
  std::sort(p.begin(), p.end());
  std::vector<double> out;
  for (double x : p)
    if (out.empty() || x - out.back() > tol) out.push_back(x);
  return out;
}

}  // namespace rotcap
