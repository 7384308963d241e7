#include "model/laws/moment_curvature.hpp"
#include "core/text_format.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <limits>
#include <stdexcept>
#include <string>

namespace rotcap {

namespace {

// A true-stress yield plateau rises with slope ~ fy (sigma_t = sigma_e (1 + eps_e)), about 0.0017 E for
// S355: that is not strain hardening. Hardening branches of structural steel have E_sh ~ 0.01 E.
constexpr double kHardeningSlope = 0.005;

std::string num(double v) { return format_text("%.6g", v); }

// Two Gauss points of a strip [z0, z1] in z: z_mid -+ (z1 - z0) / (2 sqrt 3), half the area each.
void add_strip(std::vector<Fibre>& out, double z0, double z1, double width, double sigma_r) {
  const double zm = 0.5 * (z0 + z1), half = 0.5 * (z1 - z0) / std::sqrt(3.0);
  const double area = 0.5 * width * (z1 - z0);
  const double edge = std::max(std::abs(z0), std::abs(z1));
  out.push_back({zm - half, area, sigma_r, edge});
  out.push_back({zm + half, area, sigma_r, edge});
}

}  // namespace

UniaxialFibreLaw::UniaxialFibreLaw(double E, std::vector<std::array<double, 2>> points)
    : E_(E), points_(std::move(points)) {
  if (!(E_ > 0.0)) throw std::invalid_argument("fibre law: E = " + num(E_) + ": expected > 0");
  if (points_.empty()) throw std::invalid_argument("fibre law: no points");
  const auto& p0 = points_.front();
  if (!(p0[1] > 0.0) || std::abs(p0[1] - E_ * p0[0]) > 1e-9 * p0[1])
    throw std::invalid_argument("fibre law: point 0 (" + num(p0[0]) + ", " + num(p0[1]) +
                                ") must lie on the elastic line sigma = E eps with sigma > 0");
  for (std::size_t i = 1; i < points_.size(); ++i) {
    if (!(points_[i][0] > points_[i - 1][0]) || points_[i][1] < points_[i - 1][1])
      throw std::invalid_argument("fibre law: point " + std::to_string(i) + " (" + num(points_[i][0]) + ", " +
                                  num(points_[i][1]) + "): strain must increase and stress not decrease");
    if (hardening_segment_ < 0 &&
        (points_[i][1] - points_[i - 1][1]) > kHardeningSlope * E_ * (points_[i][0] - points_[i - 1][0]))
      hardening_segment_ = static_cast<int>(i) - 1;
  }
}

UniaxialFibreLaw UniaxialFibreLaw::from_hardening_curve(double E, std::span<const HardeningCurve::Point> curve) {
  std::vector<std::array<double, 2>> pts;
  pts.reserve(curve.size());
  for (const HardeningCurve::Point& p : curve) pts.push_back({p.plastic_strain + p.stress / E, p.stress});
  return UniaxialFibreLaw(E, std::move(pts));
}

double UniaxialFibreLaw::stress(double eps) const {
  const double a = std::abs(eps), s = eps < 0.0 ? -1.0 : 1.0;
  if (a <= points_.front()[0]) return E_ * eps;
  if (a >= points_.back()[0]) return s * points_.back()[1];
  const auto it = std::upper_bound(points_.begin(), points_.end(), a,
                                   [](double v, const std::array<double, 2>& p) { return v < p[0]; });
  const auto& p1 = *it;
  const auto& p0 = *(it - 1);
  return s * (p0[1] + (p1[1] - p0[1]) * (a - p0[0]) / (p1[0] - p0[0]));
}

double UniaxialFibreLaw::tangent(double eps) const {
  const double a = std::abs(eps);
  if (a < points_.front()[0]) return E_;
  if (a >= points_.back()[0]) return 0.0;
  const auto it = std::upper_bound(points_.begin(), points_.end(), a,
                                   [](double v, const std::array<double, 2>& p) { return v < p[0]; });
  const auto& p1 = *it;
  const auto& p0 = *(it - 1);
  return (p1[1] - p0[1]) / (p1[0] - p0[0]);
}

double UniaxialFibreLaw::hardening_onset_strain() const {
  return has_hardening() ? points_[hardening_segment_][0] : ultimate_strain();
}

double UniaxialFibreLaw::hardening_modulus() const {
  if (!has_hardening()) return 0.0;
  const auto& p0 = points_[hardening_segment_];
  const auto& p1 = points_[hardening_segment_ + 1];
  return (p1[1] - p0[1]) / (p1[0] - p0[0]);
}

std::vector<Fibre> plate_model_fibres(const ISection& s, const ResidualStressPattern& pattern,
                                      const FibreMeshOptions& o) {
  validate(s);
  if (o.flange_strips_width < 2 || o.flange_strips_width % 2)
    throw std::invalid_argument("flange_strips_width = " + std::to_string(o.flange_strips_width) + ": expected even >= 2");
  if (o.flange_strips_thickness < 1)
    throw std::invalid_argument("flange_strips_thickness = " + std::to_string(o.flange_strips_thickness) + ": expected >= 1");
  if (o.web_strips < 2 || o.web_strips % 2)
    throw std::invalid_argument("web_strips = " + std::to_string(o.web_strips) + ": expected even >= 2");
  const double zf = 0.5 * (s.h - s.tf);
  std::vector<Fibre> f;
  f.reserve(2 * (2 * o.flange_strips_width * o.flange_strips_thickness + o.web_strips));
  const double dy = s.b / o.flange_strips_width, dt = s.tf / o.flange_strips_thickness;
  for (int side = -1; side <= 1; side += 2) {
    const PlateRegion region = side > 0 ? PlateRegion::top_flange : PlateRegion::bottom_flange;
    for (int i = 0; i < o.flange_strips_width; ++i) {
      const double y = -0.5 * s.b + (i + 0.5) * dy;
      const double sr = pattern.longitudinal(region, y);
      for (int k = 0; k < o.flange_strips_thickness; ++k) {
        const double z0 = side * zf - 0.5 * s.tf + k * dt;
        add_strip(f, z0, z0 + dt, dy, sr);
      }
    }
  }
  const double dz = 2.0 * zf / o.web_strips;
  for (int i = 0; i < o.web_strips; ++i) {
    const double z0 = -zf + i * dz;
    add_strip(f, z0, z0 + dz, s.tw, pattern.longitudinal(PlateRegion::web, z0 + 0.5 * dz));
  }
  return f;
}

std::vector<Fibre> rectangle_fibres(double b, double d, int strips) {
  if (!(b > 0.0) || !(d > 0.0) || strips < 2 || strips % 2)
    throw std::invalid_argument("rectangle_fibres: b, d > 0 and an even strip count >= 2 expected");
  std::vector<Fibre> f;
  const double dz = d / strips;
  for (int i = 0; i < strips; ++i) add_strip(f, -0.5 * d + i * dz, -0.5 * d + (i + 1) * dz, b, 0.0);
  return f;
}

namespace {

struct Resultant {
  double N = 0.0, M = 0.0, dN = 0.0;  // dN = dN / d eps_0
};

Resultant resultant(std::span<const Fibre> fibres, const UniaxialFibreLaw& law, double eps0, double kappa) {
  Resultant r;
  const double E = law.E();
  for (const Fibre& f : fibres) {
    const double eps = f.residual_stress / E + eps0 + kappa * f.z;
    const double s = law.stress(eps);
    r.N += s * f.area;
    r.M += s * f.area * f.z;
    r.dN += law.tangent(eps) * f.area;
  }
  return r;
}

// eps_0 with N(eps_0) = target: N is non-decreasing in eps_0. Bracket outward from the guess,
// then Newton steps kept inside the bracket, bisection when a step leaves it (rtsafe).
double solve_axial_strain(std::span<const Fibre> fibres, const UniaxialFibreLaw& law, double kappa, double target,
                          double guess, double tol, double eps_limit) {
  auto g = [&](double e) { return resultant(fibres, law, e, kappa).N - target; };
  double step = std::max(law.yield_strain(), 1e-6);
  double lo = guess - step, hi = guess + step;
  while (g(lo) > 0.0) {
    lo -= (step *= 2.0);
    if (lo < -eps_limit) throw std::invalid_argument("moment_curvature: axial force " + num(target) + " N cannot be carried");
  }
  step = std::max(law.yield_strain(), 1e-6);
  while (g(hi) < 0.0) {
    hi += (step *= 2.0);
    if (hi > eps_limit) throw std::invalid_argument("moment_curvature: axial force " + num(target) + " N cannot be carried");
  }
  double e = std::clamp(guess, lo, hi);
  for (int it = 0; it < 200; ++it) {
    const Resultant r = resultant(fibres, law, e, kappa);
    const double f = r.N - target;
    if (std::abs(f) <= tol) return e;
    (f < 0.0 ? lo : hi) = e;
    double next = r.dN > 0.0 ? e - f / r.dN : 0.5 * (lo + hi);
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (hi - lo < 1e-16) return next;
    e = next;
  }
  return e;
}

}  // namespace

MomentCurvatureCurve moment_curvature(std::span<const Fibre> fibres, const UniaxialFibreLaw& law,
                                      const MomentCurvatureOptions& o) {
  if (fibres.empty()) throw std::invalid_argument("moment_curvature: no fibres");
  if (o.elastic_steps < 2 || o.plastic_steps < 2)
    throw std::invalid_argument("moment_curvature: elastic_steps and plastic_steps must be >= 2");
  if (o.max_strain < 0.0 || !(o.perfectly_plastic_max_strain > law.yield_strain()))
    throw std::invalid_argument("moment_curvature: max_strain >= 0 and perfectly_plastic_max_strain > eps_y expected");
  const double E = law.E(), eps_y = law.yield_strain();
  double z_max = 0.0, scale = 0.0, EI = 0.0, EA = 0.0, N_R = 0.0;
  for (const Fibre& f : fibres) {
    z_max = std::max(z_max, f.z_edge);
    scale += law.yield_stress() * f.area;
    EI += E * f.area * f.z * f.z;
    EA += E * f.area;
    N_R += f.residual_stress * f.area;
  }
  MomentCurvatureCurve c;
  c.EI = EI;
  // First yield: elastic state eps_i = eps_R,i + eps_0 + kappa z_i with eps_0 = (N - N_R) / (E A);
  // a strip edge at z reaches +-eps_y at kappa = (eps_y - e) / z (z > 0) or (eps_y + e) / |z| (z < 0).
  const double eps0_el = (o.axial_force - N_R) / EA;
  double ky = std::numeric_limits<double>::infinity();
  for (const Fibre& f : fibres) {
    const double e = f.residual_stress / E + eps0_el;
    if (std::abs(e) >= eps_y) ky = 0.0;
    if (f.z > 0.0) ky = std::min(ky, (eps_y - e) / f.z_edge);
    if (f.z < 0.0) ky = std::min(ky, (eps_y + e) / f.z_edge);
  }
  ky = std::max(ky, 0.0);
  c.first_yield_curvature = ky;
  c.first_yield_moment = EI * ky;
  const double eps_max = o.max_strain > 0.0 ? o.max_strain
                         : law.has_hardening() ? law.ultimate_strain()
                                               : o.perfectly_plastic_max_strain;
  const double k_max = eps_max / z_max;
  const double k_knee = std::min(2.0 * std::max(ky, eps_y / z_max), k_max);
  std::vector<double> kappas;
  for (int i = 0; i <= o.elastic_steps; ++i) kappas.push_back(k_knee * i / o.elastic_steps);
  if (k_max > k_knee) {
    const double ratio = std::pow(k_max / k_knee, 1.0 / o.plastic_steps);
    for (int i = 1; i <= o.plastic_steps; ++i) kappas.push_back(i == o.plastic_steps ? k_max : k_knee * std::pow(ratio, i));
  }
  const double tol = o.axial_tolerance * scale;
  double eps0 = eps0_el;
  for (double k : kappas) {
    eps0 = solve_axial_strain(fibres, law, k, o.axial_force, eps0, tol, 100.0 * eps_max + 1.0);
    const Resultant r = resultant(fibres, law, eps0, k);
    c.points.push_back({k, r.M, eps0});
    c.peak_moment = std::max(c.peak_moment, r.M);
  }
  c.max_strain = k_max * z_max + std::abs(eps0);
  // Rounded for reading (the numbers themselves are in the curve).
  c.message = "moment-curvature: " + std::to_string(fibres.size()) + " fibres, first yield at M = " +
              format_text("%.1f", c.first_yield_moment / 1e6) + " kNm, M = " +
              format_text("%.1f", c.points.back().moment / 1e6) + " kNm at the extreme strain " +
              format_text("%.3g", eps_max);
  return c;
}

}  // namespace rotcap
