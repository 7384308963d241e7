#include "model/patterns/residual_stress.hpp"
#include "core/text_format.hpp"

#include "materials/steel_curve.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <stdexcept>

namespace rotcap {

namespace {

constexpr double kHotRolledSwitch = 1.2;  // h/b above which the ECCS amplitude is 0.3 fy

std::string num(double v) { return format_text("%.6g", v); }

// Closed-form moments of a quadratic piece: int_{s0}^{s1} (c0 + c1 s + c2 s^2) s^k ds, k = 0, 1, 2.
struct PieceMoments {
  double m0, m1, m2;
};

template <class P>
PieceMoments moments(const P& p) {
  // d(k) = int_{s0}^{s1} s^(k-1) ds
  auto d = [&](int k) { return (std::pow(p.s1, k) - std::pow(p.s0, k)) / k; };
  const double m0 = p.c0 * d(1) + p.c1 * d(2) + p.c2 * d(3);
  const double m1 = p.c0 * d(2) + p.c1 * d(3) + p.c2 * d(4);
  const double m2 = p.c0 * d(3) + p.c1 * d(4) + p.c2 * d(5);
  return {m0, m1, m2};
}

/// sigma_R e_x e_x^T in the frame (e1, e2): components c = e1 . e_x, s = e2 . e_x.
Eigen::Vector3d rotate_into_frame(double sigma, const Eigen::Matrix3d& axes) {
  const double c = axes(0, 0), sn = axes(0, 1);
  return Eigen::Vector3d(c * c, sn * sn, c * sn) * sigma;
}

}  // namespace

std::optional<PlateRegion> plate_region(std::string_view name) {
  if (name == "top_flange") return PlateRegion::top_flange;
  if (name == "bottom_flange") return PlateRegion::bottom_flange;
  if (name == "web") return PlateRegion::web;
  if (name == "stiffener") return PlateRegion::stiffener;
  return std::nullopt;
}

const char* residual_stress_kind_name(ResidualStressKind kind) {
  switch (kind) {
    case ResidualStressKind::none: return "none";
    case ResidualStressKind::hot_rolled: return "hot_rolled";
    case ResidualStressKind::welded: return "welded";
  }
  return "?";
}

ResidualStressPattern::ResidualStressPattern(ResidualStressKind kind, const ISection& section, double fy,
                                             const ResidualStressOptions& options)
    : kind_(kind), section_(section), fy_(fy), options_(options) {
  validate(section);
  require_yield_strength(fy);
  const double c = options.welded_compression;
  if (!(c > 0.0 && c < 1.0))
    throw std::invalid_argument("residual_stress.welded_compression = " + num(c) + ": expected 0 < c < 1");
  if (!(options.edge_tolerance >= 0.0))
    throw std::invalid_argument("residual_stress.edge_tolerance = " + num(options.edge_tolerance) + ": expected >= 0");
  const double b = section.b;
  zf_ = 0.5 * (section.h - section.tf);
  switch (kind) {
    case ResidualStressKind::none:
      flange_ = {{-0.5 * b, 0.5 * b, 0.0, 0.0, 0.0}};
      web_ = {{-zf_, zf_, 0.0, 0.0, 0.0}};
      break;
    case ResidualStressKind::hot_rolled: {
      // ECCS 1984 (from memory): a = 0.5 fy for h/b <= 1.2, else 0.3 fy; flange a (1 - 4|y|/b);
      // web a (3/2 (z/zf)^2 - 1/2), the even parabola equal to a at the junctions with zero mean.
      const double a = (section.h / b <= kHotRolledSwitch ? 0.5 : 0.3) * fy;
      amplitude_ = a;
      flange_ = {{-0.5 * b, 0.0, a, 4.0 * a / b, 0.0}, {0.0, 0.5 * b, a, -4.0 * a / b, 0.0}};
      web_ = {{-zf_, zf_, -0.5 * a, 0.0, 1.5 * a / (zf_ * zf_)}};
      break;
    }
    case ResidualStressKind::welded: {
      // Tension fy in the weld bands, -c fy elsewhere; band widths from each plate's zero net force:
      // flange fy w_f = c fy (b - w_f); web 2 fy w_w = c fy (2 zf - 2 w_w).
      amplitude_ = fy;
      const double wf = c * b / (1.0 + c), ww = c * zf_ / (1.0 + c);
      flange_ = {{-0.5 * b, -0.5 * wf, -c * fy, 0.0, 0.0},
                 {-0.5 * wf, 0.5 * wf, fy, 0.0, 0.0},
                 {0.5 * wf, 0.5 * b, -c * fy, 0.0, 0.0}};
      web_ = {{-zf_, -zf_ + ww, fy, 0.0, 0.0}, {-zf_ + ww, zf_ - ww, -c * fy, 0.0, 0.0}, {zf_ - ww, zf_, fy, 0.0, 0.0}};
      break;
    }
  }
}

std::string ResidualStressPattern::description() const {
  const double b = section_.b;
  switch (kind_) {
    case ResidualStressKind::none: return "no residual stress";
    case ResidualStressKind::hot_rolled:
      return "ECCS (1984) hot-rolled pattern (from memory): h/b = " + num(section_.h / b) +
             (section_.h / b <= kHotRolledSwitch ? " <= 1.2, a = 0.5 fy = " : " > 1.2, a = 0.3 fy = ") +
             num(amplitude_) + " MPa; flange -a at the tips to +a at the junction (linear); web parabolic, " +
             "+a at the junctions, -a/2 at mid-depth";
    case ResidualStressKind::welded: {
      const double c = options_.welded_compression;
      return "welded block pattern after ECCS (1984) (from memory): +fy = " + num(fy_) +
             " MPa in junction bands (flange " + num(c * b / (1.0 + c)) + " mm wide, web " + num(c * zf_ / (1.0 + c)) +
             " mm from each flange), -" + num(c) + " fy = " + num(-c * fy_) + " MPa elsewhere";
    }
  }
  return "";
}

double ResidualStressPattern::clamp_to_plate(const std::vector<Piece>& plate, double s) const {
  const double lo = plate.front().s0, hi = plate.back().s1, tol = options_.edge_tolerance * (hi - lo);
  if (s < lo - tol || s > hi + tol || !std::isfinite(s))
    throw std::out_of_range("residual stress: plate coordinate " + num(s) + " mm lies outside [" + num(lo) + ", " +
                            num(hi) + "] mm by more than " + num(tol) + " mm");
  return std::clamp(s, lo, hi);
}

double ResidualStressPattern::evaluate(const std::vector<Piece>& plate, double s) const {
  s = clamp_to_plate(plate, s);
  const auto it = std::find_if(plate.begin(), plate.end(), [&](const Piece& p) { return s <= p.s1; });
  const Piece& p = it == plate.end() ? plate.back() : *it;
  return p.c0 + s * (p.c1 + s * p.c2);
}

double ResidualStressPattern::mean(const std::vector<Piece>& plate, double s0, double s1) const {
  s0 = clamp_to_plate(plate, s0);
  s1 = clamp_to_plate(plate, s1);
  if (s1 - s0 <= 1e-12 * (plate.back().s1 - plate.front().s0)) return evaluate(plate, 0.5 * (s0 + s1));
  double integral = 0.0;
  for (const Piece& p : plate) {
    const double a = std::max(p.s0, s0), b = std::min(p.s1, s1);
    if (b > a) integral += moments(Piece{a, b, p.c0, p.c1, p.c2}).m0;
  }
  return integral / (s1 - s0);
}

const std::vector<ResidualStressPattern::Piece>* ResidualStressPattern::plate_of(PlateRegion region) const {
  if (kind_ == ResidualStressKind::none || region == PlateRegion::stiffener) return nullptr;
  return region == PlateRegion::web ? &web_ : &flange_;
}

double ResidualStressPattern::longitudinal(PlateRegion region, double y_or_z) const {
  const auto* plate = plate_of(region);
  return plate ? evaluate(*plate, y_or_z) : 0.0;
}

double ResidualStressPattern::mean_longitudinal(PlateRegion region, double s0, double s1) const {
  if (!(s0 <= s1))
    throw std::invalid_argument("residual stress: mean over [" + num(s0) + ", " + num(s1) + "] mm: expected s0 <= s1");
  const auto* plate = plate_of(region);
  return plate ? mean(*plate, s0, s1) : 0.0;
}

SelfEquilibrium ResidualStressPattern::check() const {
  SelfEquilibrium r;
  const double tf = section_.tf, tw = section_.tw, b = section_.b;
  // Flanges at z = +zf and -zf (same pattern): omega = -y z, so B = -z int sigma y dA per flange.
  for (const Piece& p : flange_) {
    const PieceMoments m = moments(p);
    for (double z : {zf_, -zf_}) {
      r.N += tf * m.m0;
      r.My += tf * z * m.m0;
      r.Mz += tf * m.m1;
      r.B += -tf * z * m.m1;
      r.wagner += tf * (m.m2 + z * z * m.m0);
    }
  }
  for (const Piece& p : web_) {  // web at y = 0: no Mz, no B
    const PieceMoments m = moments(p);
    r.N += tw * m.m0;
    r.My += tw * m.m1;
    r.wagner += tw * m.m2;
  }
  // Extremes of each quadratic piece: its ends and its vertex.
  for (const auto* plate : {&flange_, &web_})
    for (const Piece& p : *plate) {
      std::vector<double> s{p.s0, p.s1};
      if (p.c2 != 0.0) s.push_back(std::clamp(-p.c1 / (2.0 * p.c2), p.s0, p.s1));
      for (double x : s) {
        const double v = p.c0 + x * (p.c1 + x * p.c2);
        r.peak_tension = std::max(r.peak_tension, v);
        r.peak_compression = std::min(r.peak_compression, v);
      }
    }
  if (kind_ != ResidualStressKind::none) {
    const double fyA = fy_ * plate_model_properties(section_).A;
    r.relative_imbalance =
        std::max({std::abs(r.N) / fyA, std::abs(r.My) / (fyA * zf_), std::abs(r.Mz) / (fyA * 0.5 * b)});
  }
  r.message = std::string(residual_stress_kind_name(kind_)) + " residual stress on the plate model: N = " + num(r.N) +
              " N, My = " + num(r.My) + " N mm, Mz = " + num(r.Mz) + " N mm (largest of |N|/(fy A), |My|/(fy A zf), " +
              "|Mz|/(fy A b/2) = " + num(r.relative_imbalance) + "); peak tension " + num(r.peak_tension) +
              " MPa, peak compression " + num(r.peak_compression) + " MPa";
  return r;
}

Eigen::Vector3d local_residual_stress(const ResidualStressPattern& pattern, PlateRegion region,
                                      const Eigen::Vector3d& point, const Eigen::Matrix3d& axes) {
  if (region == PlateRegion::stiffener || pattern.kind() == ResidualStressKind::none) return Eigen::Vector3d::Zero();
  const double s = region == PlateRegion::web ? point.z() : point.y();
  return rotate_into_frame(pattern.longitudinal(region, s), axes);
}

PlateRegion element_plate_region(const ShellModel& model, int element) {
  if (element < 0 || element >= model.element_count())
    throw std::out_of_range("residual stress: element " + std::to_string(element) + " not in the model (" +
                            std::to_string(model.element_count()) + " elements)");
  const int r = model.elements[static_cast<std::size_t>(element)].region;
  const std::string name =
      r >= 0 && r < static_cast<int>(model.region_names.size()) ? model.region_names[static_cast<std::size_t>(r)] : "";
  const auto region = plate_region(name);
  if (!region)
    throw std::invalid_argument("residual stress: element " + std::to_string(element) + " lies in region \"" + name +
                                "\"; patterns apply to top_flange, bottom_flange, web and stiffener only");
  return *region;
}

std::array<Eigen::Vector3d, 4> gauss_point_residual_stresses(const ResidualStressPattern& pattern, PlateRegion region,
                                                             const Eigen::Matrix<double, 3, 4>& corners,
                                                             const Eigen::Matrix3d& axes) {
  std::array<Eigen::Vector3d, 4> out;
  out.fill(Eigen::Vector3d::Zero());
  if (region == PlateRegion::stiffener || pattern.kind() == ResidualStressKind::none) return out;
  const int coordinate = region == PlateRegion::web ? 2 : 1;  // the plate coordinate: z on the web, y on a flange
  const double node_xi[4] = {-1, 1, 1, -1}, node_eta[4] = {-1, -1, 1, 1};
  // s(xi, eta) by the bilinear map of the corners' plate coordinate.
  auto s_at = [&](double xi, double eta) {
    double s = 0.0;
    for (int a = 0; a < 4; ++a) s += 0.25 * (1 + xi * node_xi[a]) * (1 + eta * node_eta[a]) * corners(coordinate, a);
    return s;
  };
  for (int k = 0; k < 4; ++k) {
    // The quadrant [0, xi_k] x [0, eta_k]: s is bilinear, so its range is spanned by the corners.
    const double s[4] = {s_at(0, 0), s_at(node_xi[k], 0), s_at(node_xi[k], node_eta[k]), s_at(0, node_eta[k])};
    const double s0 = *std::min_element(s, s + 4), s1 = *std::max_element(s, s + 4);
    out[static_cast<std::size_t>(k)] = rotate_into_frame(pattern.mean_longitudinal(region, s0, s1), axes);
  }
  return out;
}

Eigen::Vector3d local_residual_stress(const ResidualStressPattern& pattern, const ShellModel& model, int element,
                                      const Eigen::Vector3d& point, const Eigen::Matrix3d& axes) {
  return local_residual_stress(pattern, element_plate_region(model, element), point, axes);
}

}  // namespace rotcap
