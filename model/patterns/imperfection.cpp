#include "model/patterns/imperfection.hpp"
#include "core/check.hpp"
#include "core/option_error.hpp"
#include "core/text_format.hpp"

#include "model/setups/loading_setup.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <numbers>
#include <stdexcept>

namespace rotcap {

namespace {

constexpr double kPi = std::numbers::pi;

std::string num(double v) { return format_text("%.4g", v); }

void require(bool ok, const std::string& key, double value, const std::string& expected) {
  if (!ok) throw OptionError(key, num(value), expected);
}

// Hinge sections x_h where the local wave trains start (header comment; the setup's class).
std::vector<double> hinge_sections(const HingeZoneModel& h) { return h.loading().hinge_sections(h); }

// Wave train along x: sum_h sin(pi (x - x_h) / lambda) e(|x - x_h|) with the envelope e of the
// header (full first half-wave, raised-cosine fade over the next n - 1).
struct WaveTrain {
  std::vector<double> sections;
  double lambda = 1.0;
  int n = 1;
  double envelope(double d) const {
    if (d <= lambda) return 1.0;
    if (n <= 1 || d >= n * lambda) return 0.0;
    return 0.5 * (1.0 + std::cos(kPi * (d - lambda) / ((n - 1) * lambda)));
  }
  double operator()(double x) const {
    double w = 0.0;
    for (double xh : sections) w += std::sin(kPi * (x - xh) / lambda) * envelope(std::abs(x - xh));
    return w;
  }
  // Every element along x that touches the range of a train must be at most lambda/2 long.
  void check_mesh(const std::vector<double>& stations, const std::string& key) const {
    for (double xh : sections)
      for (std::size_t i = 0; i + 1 < stations.size(); ++i) {
        const double x0 = stations[i], x1 = stations[i + 1];
        const bool touches = x1 > xh - n * lambda && x0 < xh + n * lambda;
        if (touches && x1 - x0 > 0.5 * lambda * (1.0 + 1e-9))
          throw OptionError("mesh.aspect", "an element from x = " + num(x0) + " to " + num(x1) + " mm",
                            "elements along the member at most half a half-wave of the " + key + " pattern (" +
                                num(0.5 * lambda) + " mm) near the hinge: a smaller mesh.aspect");
      }
  }
};

std::vector<bool> used_by_elements(const ShellModel& m) {
  std::vector<bool> used(m.nodes.size(), false);
  for (const ShellElement& e : m.elements)
    for (int n : e.nodes) used[static_cast<std::size_t>(n)] = true;
  return used;
}

}  // namespace

NodeOffsets global_bow(const HingeZoneModel& hinge, const GlobalBowOptions& o) {
  require(o.amplitude >= 0.0 && std::isfinite(o.amplitude), "imperfection.global_amplitude", o.amplitude,
          "a finite value >= 0 mm");
  const double L = hinge.span;
  NodeOffsets out(hinge.model.nodes.size(), Eigen::Vector3d::Zero());
  for (std::size_t i = 0; i < out.size(); ++i) {
    const double t = std::clamp(hinge.model.nodes[i].x() / L, 0.0, 1.0);
    out[i].y() = o.amplitude * (o.shape == BowShape::half_sine ? std::sin(kPi * t) : 1.0 - std::cos(0.5 * kPi * t));
  }
  return out;
}

NodeOffsets half_sine_imperfection(const HingeZoneModel& hinge, const HalfSineOptions& o) {
  require(o.flange_amplitude >= 0.0 && std::isfinite(o.flange_amplitude), "imperfection.local_amplitude",
          o.flange_amplitude, "a finite value >= 0 mm (flange)");
  require(o.web_amplitude >= 0.0 && std::isfinite(o.web_amplitude), "imperfection.web_amplitude", o.web_amplitude,
          "a finite value >= 0 mm");
  require(o.half_waves >= 1, "imperfection.half_waves", o.half_waves, "an integer >= 1");
  const HingeSectionGeometry g = SectionDeformationAnalysis(hinge).geometry();
  const double zf = g.zf;
  const WaveTrain flange_wave{hinge_sections(hinge), o.flange_half_wave.value_or(0.5 * g.b), o.half_waves};
  const WaveTrain web_wave{hinge_sections(hinge), o.web_half_wave.value_or(g.web_depth()), o.half_waves};
  require(flange_wave.lambda > 0.0, "imperfection.flange_half_wave", flange_wave.lambda, "> 0 mm");
  require(web_wave.lambda > 0.0, "imperfection.web_half_wave", web_wave.lambda, "> 0 mm");

  ImperfectFlange which = o.flange;
  if (which == ImperfectFlange::compression)  // hogging cantilever; sagging beams (header)
    which = hinge.loading().top_flange_in_compression() ? ImperfectFlange::top : ImperfectFlange::bottom;
  const bool top = which == ImperfectFlange::top || which == ImperfectFlange::both;
  const bool bottom = which == ImperfectFlange::bottom || which == ImperfectFlange::both;
  const bool flanges = o.flange_amplitude > 0.0 && (top || bottom);
  const bool web = o.web_amplitude > 0.0;
  if (flanges) flange_wave.check_mesh(hinge.stations, "imperfection.flange_half_wave");
  if (web) web_wave.check_mesh(hinge.stations, "imperfection.web_half_wave");

  // Unit-amplitude fields, then scaled so the largest nodal offset equals each amplitude.
  const ShellModel& m = hinge.model;
  const std::vector<bool> used = used_by_elements(m);
  NodeOffsets dz(m.nodes.size(), Eigen::Vector3d::Zero()), dy(m.nodes.size(), Eigen::Vector3d::Zero());
  double max_dz = 0.0, max_dy = 0.0;
  for (std::size_t i = 0; i < m.nodes.size(); ++i) {
    if (!used[i]) continue;
    const Eigen::Vector3d& p = m.nodes[i];
    const double s = std::clamp((p.z() + zf) / (2.0 * zf), 0.0, 1.0);  // 0 bottom flange, 1 top flange
    if (flanges) {
      const double across = o.across == FlangeWave::antisymmetric ? 2.0 * p.y() / g.b : 2.0 * std::abs(p.y()) / g.b;
      const double w = across * flange_wave(p.x());
      dz[i].z() = (top ? s * w : 0.0) + (bottom ? (1.0 - s) * w : 0.0);
      max_dz = std::max(max_dz, std::abs(dz[i].z()));
    }
    if (web) {
      dy[i].y() = std::sin(kPi * s) * web_wave(p.x());
      max_dy = std::max(max_dy, std::abs(dy[i].y()));
    }
  }
  if ((flanges && max_dz == 0.0) || (web && max_dy == 0.0))
    throw std::logic_error("half-sine imperfection: the pattern vanishes at every node");
  NodeOffsets out(m.nodes.size(), Eigen::Vector3d::Zero());
  const double kz = flanges ? o.flange_amplitude / max_dz : 0.0, ky = web ? o.web_amplitude / max_dy : 0.0;
  for (std::size_t i = 0; i < out.size(); ++i) out[i] = kz * dz[i] + ky * dy[i];
  return out;
}

ModeImperfection buckling_mode_imperfection(const HingeZoneModel& hinge, std::span<const Eigen::VectorXd> modes,
                                            const ModeImperfectionOptions& o) {
  require(o.amplitude > 0.0 && std::isfinite(o.amplitude), "imperfection.local_amplitude", o.amplitude,
          "a finite value > 0 mm");
  const SectionDeformationAnalysis analysis(hinge);
  const double h = analysis.geometry().h();
  const Eigen::Index n_nodes = hinge.model.node_count();
  require(o.local_mode >= 1, "imperfection.mode", o.local_mode, "an integer >= 1");
  ModeImperfection r;
  std::string list;
  int local_seen = 0;
  for (std::size_t k = 0; k < modes.size(); ++k) {
    const Eigen::VectorXd& phi = modes[k];
    ROTCAP_CHECK(phi.size() == kDofsPerNode * n_nodes,
                 "buckling-mode imperfection: mode " + std::to_string(k) + " has " + std::to_string(phi.size()) +
                     " entries, expected " + std::to_string(kDofsPerNode * n_nodes));
    // Normalise the largest nodal translation to h, so the none threshold is relative.
    double largest = 0.0;
    for (Eigen::Index i = 0; i < n_nodes; ++i) largest = std::max(largest, phi.segment<3>(kDofsPerNode * i).norm());
    DeformationMode mode = DeformationMode::none;
    SectionDeformation shape;
    if (largest > 0.0) {
      shape = analysis.analyse(phi * (h / largest));
      mode = classify(shape, o.classify);
    }
    r.classifications.push_back(mode);
    list += (k ? ", " : "") + std::to_string(k) + " " + deformation_mode_name(mode);
    const bool local = mode == DeformationMode::flange_local_buckling || mode == DeformationMode::web_local_buckling;
    if (!local || ++local_seen < o.local_mode) continue;
    // The distortion is linear in the field: D(phi) = D(scaled) * largest / h.
    const double D =
        (mode == DeformationMode::flange_local_buckling ? shape.flange.value : shape.web.value) * largest / h;
    r.found = true;
    r.mode = static_cast<int>(k);
    r.classification = mode;
    r.scale = o.amplitude / D;
    r.offsets.resize(static_cast<std::size_t>(n_nodes));
    for (Eigen::Index i = 0; i < n_nodes; ++i)
      r.offsets[static_cast<std::size_t>(i)] = r.scale * phi.segment<3>(kDofsPerNode * i);
    const PeakMeasure& at = mode == DeformationMode::flange_local_buckling ? shape.flange : shape.web;
    r.distortion_x = at.x;
    r.message = "mode " + std::to_string(k) + " (from 0) of " + std::to_string(modes.size()) + " (" +
                deformation_mode_name(mode) + "), scaled by " + num(r.scale) + " to a largest plate distortion of " +
                num(o.amplitude) + " mm at x = " + num(at.x) + " mm; modes examined: " + list;
    return r;
  }
  r.message = (o.local_mode == 1 ? std::string("no local mode") : "no local mode number " + std::to_string(o.local_mode) +
                                                                         " (found " + std::to_string(local_seen) + ")") +
              " among the " + std::to_string(modes.size()) + " modes: " + (list.empty() ? "none given" : list);
  return r;
}

void add_offsets(ShellModel& model, const NodeOffsets& offsets) {
  ROTCAP_CHECK(offsets.size() == model.nodes.size(),
               std::to_string(offsets.size()) + " offsets for " + std::to_string(model.nodes.size()) + " nodes");
  for (std::size_t i = 0; i < offsets.size(); ++i) model.nodes[i] += offsets[i];
}

NodeOffsets combine(const NodeOffsets& a, const NodeOffsets& b) {
  ROTCAP_CHECK(a.size() == b.size(),
               "offset fields of " + std::to_string(a.size()) + " and " + std::to_string(b.size()) + " nodes");
  NodeOffsets out(a.size());
  for (std::size_t i = 0; i < a.size(); ++i) out[i] = a[i] + b[i];
  return out;
}

}  // namespace rotcap
