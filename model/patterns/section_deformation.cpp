#include "model/patterns/section_deformation.hpp"
#include "core/text_format.hpp"

#include <Eigen/LU>
#include <algorithm>
#include <cmath>
#include <cstdio>
#include <stdexcept>

namespace rotcap {

namespace {

using Mat36 = Eigen::Matrix<double, 3, 6>;

std::string num(double v) { return format_text("%.4g", v); }

// Rigid small displacement of a point at r from the centre: u = U + theta x r = A q with
// A = [I, -[r]x], q = (U, theta).
Mat36 rigid_map(const Eigen::Vector3d& r) {
  Mat36 a = Mat36::Zero();
  a.leftCols<3>().setIdentity();
  a(0, 4) = r.z(), a(0, 5) = -r.y();
  a(1, 3) = -r.z(), a(1, 5) = r.x();
  a(2, 3) = r.y(), a(2, 4) = -r.x();
  return a;
}

int region_index(const ShellModel& m, const char* name) {
  const auto it = std::find(m.region_names.begin(), m.region_names.end(), name);
  if (it == m.region_names.end())
    throw std::invalid_argument(std::string("section deformation: the model has no region \"") + name +
                                "\" (a hinge-zone model is needed)");
  return static_cast<int>(it - m.region_names.begin());
}

void raise(PeakMeasure& p, double value, double x, int station) {
  if (p.station < 0 || value > p.value) p = {value, x, station};
}

}  // namespace

const char* deformation_mode_name(DeformationMode mode) {
  switch (mode) {
    case DeformationMode::none: return "none";
    case DeformationMode::flange_local_buckling: return "flange_local_buckling";
    case DeformationMode::web_local_buckling: return "web_local_buckling";
    case DeformationMode::lateral_torsional: return "lateral_torsional";
  }
  return "?";
}

SectionDeformationAnalysis::SectionDeformationAnalysis(const HingeZoneModel& hinge) : positions_(hinge.model.nodes) {
  const ShellModel& m = hinge.model;
  const int top = region_index(m, "top_flange"), bottom = region_index(m, "bottom_flange"),
            web = region_index(m, "web");
  enum : unsigned { kTop = 1u, kBottom = 2u, kWeb = 4u };
  std::vector<unsigned> plates(m.nodes.size(), 0u);
  for (const ShellElement& e : m.elements) {
    const unsigned bit = e.region == top ? kTop : e.region == bottom ? kBottom : e.region == web ? kWeb : 0u;
    if (e.region == top || e.region == bottom) geometry_.tf = e.thickness;
    if (e.region == web) geometry_.tw = e.thickness;
    for (int n : e.nodes) plates[static_cast<std::size_t>(n)] |= bit;
  }

  stations_.resize(hinge.stations.size());
  const double tol = 1e-6 * std::max(hinge.span, 1.0);
  for (std::size_t i = 0; i < stations_.size(); ++i) stations_[i].x = hinge.stations[i];
  for (std::size_t n = 0; n < plates.size(); ++n) {
    if (plates[n] == 0u) continue;
    const double x = positions_[n].x();
    const auto it = std::lower_bound(hinge.stations.begin(), hinge.stations.end(), x - tol);
    if (it == hinge.stations.end() || std::abs(*it - x) > tol)
      throw std::invalid_argument("section deformation: node " + std::to_string(n) + " at x = " + num(x) +
                                  " mm lies on no station");
    Station& s = stations_[static_cast<std::size_t>(it - hinge.stations.begin())];
    const int id = static_cast<int>(n);
    s.all.push_back(id);
    if (plates[n] & kTop) s.top.push_back(id);
    if (plates[n] & kBottom) s.bottom.push_back(id);
    if (plates[n] & kWeb) s.web.push_back(id);
    if ((plates[n] & kTop) && (plates[n] & kWeb)) s.top_junction = id;
    if ((plates[n] & kBottom) && (plates[n] & kWeb)) s.bottom_junction = id;
  }

  for (Station& s : stations_) {
    if (s.top_junction < 0 || s.bottom_junction < 0)
      throw std::invalid_argument("section deformation: the station at x = " + num(s.x) +
                                  " mm has no flange-web junction node");
    const Eigen::Vector3d& jt = positions_[static_cast<std::size_t>(s.top_junction)];
    const Eigen::Vector3d& jb = positions_[static_cast<std::size_t>(s.bottom_junction)];
    s.centre = 0.5 * (jt + jb);
    std::sort(s.web.begin(), s.web.end(), [&](int a, int b) {
      return positions_[static_cast<std::size_t>(a)].z() < positions_[static_cast<std::size_t>(b)].z();
    });
    // Normal equations of the rigid fit, sum A_i^T A_i; six independent DOFs need the flanges
    // and the web (non-collinear nodes), which every station has.
    Eigen::Matrix<double, 6, 6> normal = Eigen::Matrix<double, 6, 6>::Zero();
    for (int n : s.all) {
      const Mat36 a = rigid_map(positions_[static_cast<std::size_t>(n)] - s.centre);
      normal += a.transpose() * a;
    }
    const Eigen::FullPivLU<Eigen::Matrix<double, 6, 6>> lu(normal);
    if (lu.rank() < 6)
      throw std::invalid_argument("section deformation: the nodes of the station at x = " + num(s.x) +
                                  " mm do not fix a rigid section motion");
    s.normal_inverse = lu.inverse();
    auto width = [&](const std::vector<int>& nodes) {
      double lo = 0.0, hi = 0.0;
      for (std::size_t k = 0; k < nodes.size(); ++k) {
        const double y = positions_[static_cast<std::size_t>(nodes[k])].y();
        lo = k == 0 ? y : std::min(lo, y), hi = k == 0 ? y : std::max(hi, y);
      }
      return hi - lo;
    };
    geometry_.b = std::max({geometry_.b, width(s.top), width(s.bottom)});
    geometry_.zf = std::max(geometry_.zf, 0.5 * (jt.z() - jb.z()));
  }
}

SectionDeformation SectionDeformationAnalysis::analyse(const Eigen::VectorXd& u) const {
  if (u.size() != kDofsPerNode * static_cast<Eigen::Index>(positions_.size()))
    throw std::invalid_argument("section deformation: displacement vector of size " + std::to_string(u.size()) +
                                ", expected 6 x " + std::to_string(positions_.size()) + " nodes");
  SectionDeformation out;
  out.geometry = geometry_;
  out.stations.reserve(stations_.size());
  auto translation = [&](int n) { return Eigen::Vector3d(u.segment<3>(kDofsPerNode * static_cast<Eigen::Index>(n))); };
  for (std::size_t i = 0; i < stations_.size(); ++i) {
    const Station& s = stations_[i];
    // 1. Rigid fit q = (sum A^T A)^-1 sum A^T u_i.
    SectionMotion rhs = SectionMotion::Zero();
    for (int n : s.all)
      rhs += rigid_map(positions_[static_cast<std::size_t>(n)] - s.centre).transpose() * translation(n);
    StationDeformation st;
    st.x = s.x;
    st.rigid = s.normal_inverse * rhs;
    // 2. Residual of node n after the rigid motion.
    auto residual = [&](int n) -> Eigen::Vector3d {
      return translation(n) - rigid_map(positions_[static_cast<std::size_t>(n)] - s.centre) * st.rigid;
    };
    // 3. Flanges: out-of-plane residual relative to the junction node.
    auto flange = [&](const std::vector<int>& nodes, int junction) {
      const double dj = residual(junction).z();
      double worst = 0.0;
      for (int n : nodes) worst = std::max(worst, std::abs(residual(n).z() - dj));
      return worst;
    };
    st.top_flange = flange(s.top, s.top_junction);
    st.bottom_flange = flange(s.bottom, s.bottom_junction);
    // 4. Web: lateral residual relative to the chord between the junctions.
    const double zb = positions_[static_cast<std::size_t>(s.bottom_junction)].z();
    const double zt = positions_[static_cast<std::size_t>(s.top_junction)].z();
    const double db = residual(s.bottom_junction).y(), dt = residual(s.top_junction).y();
    for (int n : s.web) {
      const double t = (positions_[static_cast<std::size_t>(n)].z() - zb) / (zt - zb);
      st.web = std::max(st.web, std::abs(residual(n).y() - (db + t * (dt - db))));
    }
    // 5. Rigid lateral displacement and twist.
    st.lateral_torsional = std::abs(st.rigid(1)) + std::abs(st.rigid(3)) * 0.5 * geometry_.h();

    const int k = static_cast<int>(i);
    raise(out.top_flange, st.top_flange, st.x, k);
    raise(out.bottom_flange, st.bottom_flange, st.x, k);
    raise(out.web, st.web, st.x, k);
    raise(out.lateral_torsional, st.lateral_torsional, st.x, k);
    out.stations.push_back(st);
  }
  out.flange = out.top_flange.value >= out.bottom_flange.value ? out.top_flange : out.bottom_flange;
  return out;
}

Classification classify_detailed(const SectionDeformation& d, const ClassifyOptions& o) {
  if (!(o.none_ratio > 0.0))
    throw std::invalid_argument("classify: none_ratio = " + num(o.none_ratio) + ": expected > 0");
  if (!(o.web_weight > 0.0))
    throw std::invalid_argument("classify: web_weight = " + num(o.web_weight) + ": expected > 0");
  if (!(o.distortion_preference >= 1.0))
    throw std::invalid_argument("classify: distortion_preference = " + num(o.distortion_preference) +
                                ": expected >= 1");
  Classification c;
  const HingeSectionGeometry& g = d.geometry;
  const double F = d.flange.value, W = d.web.value, T = d.lateral_torsional.value;
  c.threshold = o.none_ratio * g.h();
  c.flange_ratio = g.b > 0.0 ? F / (0.5 * g.b) : 0.0;
  c.web_ratio = g.web_depth() > 0.0 ? W / g.web_depth() : 0.0;
  const std::string measures = "flange distortion F = " + num(F) + " mm at x = " + num(d.flange.x) +
                               " mm (F/(b/2) = " + num(c.flange_ratio) + "), web distortion W = " + num(W) +
                               " mm at x = " + num(d.web.x) + " mm (W/hw = " + num(c.web_ratio) +
                               "), lateral-torsional motion T = " + num(T) + " mm at x = " +
                               num(d.lateral_torsional.x) + " mm";
  // a. Nothing above the threshold.
  if (F < c.threshold && W < c.threshold && T < c.threshold) {
    c.message = "none: " + measures + ", all below " + num(c.threshold) + " mm";
    return c;
  }
  // b. Which plate distorts; c. does its distortion beat the rigid lateral-torsional motion.
  const bool flange = c.flange_ratio >= o.web_weight * c.web_ratio;
  const double D = flange ? F : W;
  if (D >= c.threshold && o.distortion_preference * D >= T) {
    c.mode = flange ? DeformationMode::flange_local_buckling : DeformationMode::web_local_buckling;
    c.message = std::string(deformation_mode_name(c.mode)) + ": " + measures + "; " +
                (flange ? "F/(b/2) >= " + num(o.web_weight) + " W/hw" : "F/(b/2) < " + num(o.web_weight) + " W/hw") +
                " and " + num(o.distortion_preference) + " D >= T (D: the distortion of that plate)";
  } else {
    c.mode = DeformationMode::lateral_torsional;
    c.message = "lateral_torsional: " + measures + "; plate distortion D = " + num(D) + " mm, " +
                num(o.distortion_preference) + " D < T or D below " + num(c.threshold) + " mm";
  }
  return c;
}

DeformationMode classify(const SectionDeformation& d, const ClassifyOptions& options) {
  return classify_detailed(d, options).mode;
}

}  // namespace rotcap
