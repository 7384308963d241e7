#include "io/mesh_picture.hpp"

#include "core/text_format.hpp"
#include "io/axis_ticks.hpp"
#include "io/colour_map.hpp"
#include "io/xml_text.hpp"

#include <algorithm>
#include <charconv>
#include <cmath>
#include <numeric>
#include <stdexcept>

namespace rotcap {

namespace {

constexpr double kMargin = 20.0;       // px around the drawing
constexpr double kBarZone = 110.0;     // px on the right for the colour bar, its ticks and name
constexpr double kKeyHeight = 24.0;    // px below the drawing for the symbol key
constexpr double kArrowLength = 46.0;  // px, force arrows
constexpr double kMomentRadius = 15.0; // px, moment arrows
constexpr const char* kLoadColour = "#c8102e";

std::string px(double v) {
  char buf[64];
  const auto r = std::to_chars(buf, buf + sizeof buf, v, std::chars_format::fixed, 1);
  std::string s(buf, r.ptr);
  return s == "-0.0" ? "0.0" : s;
}

std::string esc(const std::string& s) { return escape_xml_text(s); }

/// The axonometric view: screen x right, screen y up, depth towards the viewer (all mm).
struct View {
  double ca, sa, ce, se;
  View(double azimuth_deg, double elevation_deg) {
    const double rad = std::acos(-1.0) / 180.0;
    ca = std::cos(azimuth_deg * rad), sa = std::sin(azimuth_deg * rad);
    ce = std::cos(elevation_deg * rad), se = std::sin(elevation_deg * rad);
  }
  std::array<double, 3> operator()(const std::array<double, 3>& p) const {
    const double x = ca * p[0] - sa * p[1], y = sa * p[0] + ca * p[1];  // about z
    return {x, ce * p[2] - se * y, -ce * y - se * p[2]};
  }
};

/// Screen px of a projected point: fitted box origin (ox, oy), scale, and the top of the range y1.
struct Fit {
  double x0 = 0, y1 = 0, scale = 1, ox = 0, oy = 0;
  double X(const std::array<double, 3>& s) const { return ox + scale * (s[0] - x0); }
  double Y(const std::array<double, 3>& s) const { return oy + scale * (y1 - s[1]); }
};

bool finite3(const std::array<double, 3>& p) { return std::isfinite(p[0]) && std::isfinite(p[1]) && std::isfinite(p[2]); }
double norm3(const std::array<double, 3>& v) { return std::sqrt(v[0] * v[0] + v[1] * v[1] + v[2] * v[2]); }

std::string triangle(double x, double y, double size) {
  return "<polygon points=\"" + px(x) + "," + px(y) + " " + px(x - 0.6 * size) + "," + px(y + size) + " " +
         px(x + 0.6 * size) + "," + px(y + size) + "\" fill=\"#ffffff\" stroke=\"#000000\" stroke-width=\"1.2\"/>\n";
}

/// Arrow head at (x, y) pointing along the unit screen vector (dx, dy) (SVG y down).
std::string arrow_head(double x, double y, double dx, double dy) {
  const double l = 9.0, w = 4.0;
  const double bx = x - l * dx, by = y - l * dy;
  return "<polygon points=\"" + px(x) + "," + px(y) + " " + px(bx - w * dy) + "," + px(by + w * dx) + " " +
         px(bx + w * dy) + "," + px(by - w * dx) + "\" fill=\"" + kLoadColour + "\"/>\n";
}

/// A straight arrow whose head touches (x, y), coming from direction (dx, dy) (unit, SVG y down).
std::string force_arrow(double x, double y, double dx, double dy) {
  return "<line x1=\"" + px(x - kArrowLength * dx) + "\" y1=\"" + px(y - kArrowLength * dy) + "\" x2=\"" +
         px(x - 6.0 * dx) + "\" y2=\"" + px(y - 6.0 * dy) + "\" stroke=\"" + kLoadColour + "\" stroke-width=\"2.2\"/>\n" +
         arrow_head(x, y, dx, dy) + "<text x=\"" + px(x - kArrowLength * dx + 4) + "\" y=\"" +
         px(y - kArrowLength * dy - 4) + "\" fill=\"" + kLoadColour + "\">F</text>\n";
}

/// A curved arrow of 270 degrees around (x, y); counter-clockwise on screen when ccw.
std::string moment_arrow(double x, double y, bool ccw) {
  const double pi = std::acos(-1.0), r = kMomentRadius;
  const double a0 = pi / 4, sweep = 1.5 * pi, sign = ccw ? 1.0 : -1.0;
  std::string d;
  const int n = 24;
  for (int k = 0; k <= n; ++k) {
    const double a = a0 + sign * sweep * k / n;  // visual angle, y up
    d += (k ? " L" : "M") + px(x + r * std::cos(a)) + " " + px(y - r * std::sin(a));
  }
  const double a1 = a0 + sign * sweep;
  // Tangent of the visual circle at a1 in the sense of travel, in SVG coordinates (y down).
  const double tx = -sign * std::sin(a1), ty = -sign * std::cos(a1);
  return "<path d=\"" + d + "\" fill=\"none\" stroke=\"" + kLoadColour + "\" stroke-width=\"2.2\"/>\n" +
         arrow_head(x + r * std::cos(a1) + 4 * tx, y - r * std::sin(a1) + 4 * ty, tx, ty) + "<text x=\"" +
         px(x + r + 4) + "\" y=\"" + px(y - r) + "\" fill=\"" + kLoadColour + "\">M</text>\n";
}

}  // namespace

std::string render_mesh_svg(const MeshPicture& m) {
  if (m.quads.empty()) throw std::invalid_argument("mesh picture: no quads");
  if (m.values.size() != m.points.size())
    throw std::invalid_argument("mesh picture: values.size() " + std::to_string(m.values.size()) + " != points.size() " +
                                std::to_string(m.points.size()));
  const View view(m.azimuth_deg, m.elevation_deg);
  std::vector<std::array<double, 3>> s(m.points.size());
  for (std::size_t i = 0; i < m.points.size(); ++i) {
    if (!finite3(m.points[i])) throw std::invalid_argument("mesh picture: point " + std::to_string(i) + " is not finite");
    s[i] = view(m.points[i]);
  }
  for (std::size_t q = 0; q < m.quads.size(); ++q)
    for (int n : m.quads[q])
      if (n < 0 || static_cast<std::size_t>(n) >= m.points.size())
        throw std::invalid_argument("mesh picture: quad " + std::to_string(q) + " names point " + std::to_string(n));
  for (std::size_t i = 0; i < m.support_points.size(); ++i)
    if (!finite3(m.support_points[i]))
      throw std::invalid_argument("mesh picture: support point " + std::to_string(i) + " is not finite");
  for (std::size_t i = 0; i < m.loads.size(); ++i)
    if (!finite3(m.loads[i].point) || !finite3(m.loads[i].force) || !finite3(m.loads[i].moment))
      throw std::invalid_argument("mesh picture: load " + std::to_string(i) + " is not finite");
  // 1. Fit the mesh, supports and load points into the drawing box (arrows need a margin).
  const bool marks = !m.support_points.empty() || !m.loads.empty();
  double x0 = 1e300, x1 = -1e300, y0 = 1e300, y1 = -1e300;
  auto extend = [&](const std::array<double, 3>& p) {
    x0 = std::min(x0, p[0]), x1 = std::max(x1, p[0]), y0 = std::min(y0, p[1]), y1 = std::max(y1, p[1]);
  };
  for (const auto& p : s) extend(p);
  for (const auto& p : m.support_points) extend(view(p));
  for (const auto& l : m.loads) extend(view(l.point));
  const double pad = m.loads.empty() ? 8.0 : kArrowLength + 4.0;
  const double top = m.title.empty() ? 10.0 : 34.0;
  const double w = m.width - 2 * kMargin - kBarZone - 2 * pad;
  const double h = m.height - top - kMargin - 2 * pad - (marks ? kKeyHeight : 0.0);
  Fit fit;
  fit.x0 = x0, fit.y1 = y1;
  fit.scale = std::min(w / std::max(x1 - x0, 1e-9), h / std::max(y1 - y0, 1e-9));
  fit.ox = kMargin + pad + 0.5 * (w - fit.scale * (x1 - x0));
  fit.oy = top + pad + 0.5 * (h - fit.scale * (y1 - y0));
  // 2. The field's range and the quads far to near.
  double v0 = 1e300, v1 = -1e300;
  for (double v : m.values)
    if (std::isfinite(v)) v0 = std::min(v0, v), v1 = std::max(v1, v);
  if (v0 > v1) v0 = v1 = 0.0;
  const double dv = v1 > v0 ? v1 - v0 : 1.0;
  std::vector<double> depth(m.quads.size(), 0.0);
  for (std::size_t q = 0; q < m.quads.size(); ++q)
    for (int n : m.quads[q]) depth[q] += s[n][2];
  std::vector<std::size_t> order(m.quads.size());
  std::iota(order.begin(), order.end(), 0);
  std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) { return depth[a] < depth[b]; });
  const std::string W = std::to_string(m.width), H = std::to_string(m.height);
  std::string o = "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" + W + "\" height=\"" + H + "\" viewBox=\"0 0 " +
                  W + " " + H + "\" font-family=\"sans-serif\" font-size=\"12\">\n";
  o += "<rect width=\"100%\" height=\"100%\" fill=\"white\"/>\n";
  if (!m.title.empty()) o += "<text x=\"" + px(kMargin) + "\" y=\"22\" font-size=\"15\">" + esc(m.title) + "</text>\n";
  o += "<g class=\"mesh\" stroke=\"#333333\" stroke-width=\"0.4\" stroke-linejoin=\"round\">\n";
  for (std::size_t q : order) {
    double v = 0.0;
    for (int n : m.quads[q]) v += std::isfinite(m.values[n]) ? m.values[n] : v0;
    v *= 0.25;
    o += "<polygon points=\"";
    for (int k = 0; k < 4; ++k) {
      const auto& p = s[m.quads[q][k]];
      o += px(fit.X(p)) + "," + px(fit.Y(p)) + (k < 3 ? " " : "");
    }
    o += "\" fill=\"" + colour_hex(viridis((v - v0) / dv)) + "\"/>\n";
  }
  o += "</g>\n";
  // 3. Supports and loads on top of the mesh.
  if (!m.support_points.empty()) {
    o += "<g class=\"supports\">\n";
    for (const auto& p : m.support_points) o += triangle(fit.X(view(p)), fit.Y(view(p)), 9.0);
    o += "</g>\n";
  }
  if (!m.loads.empty()) {
    o += "<g class=\"loads\" font-weight=\"bold\">\n";
    for (const MeshLoad& l : m.loads) {
      const auto c = view(l.point);
      const double cx = fit.X(c), cy = fit.Y(c);
      if (const double f = norm3(l.force); f > 0.0) {
        std::array<double, 3> tip{};
        for (int k = 0; k < 3; ++k) tip[k] = l.point[k] + l.force[k] / f;
        const auto t = view(tip);
        double dx = t[0] - c[0], dy = -(t[1] - c[1]);  // SVG y down
        const double len = std::hypot(dx, dy);
        if (len < 1e-6) dx = 0.0, dy = 1.0;  // along the line of sight: drawn downwards
        else dx /= len, dy /= len;
        o += force_arrow(cx, cy, dx, dy);
      }
      if (norm3(l.moment) > 0.0) {
        const auto mv = view(l.moment);  // the moment vector in view axes; [2] towards the viewer
        o += moment_arrow(cx, cy, mv[2] >= 0.0);
      }
    }
    o += "</g>\n";
  }
  if (marks) {
    const double ky = m.height - kMargin + 4.0;
    o += "<g class=\"key\">\n" + triangle(kMargin + 4, ky - 10, 9.0) + "<text x=\"" + px(kMargin + 14) + "\" y=\"" +
         px(ky) + "\">support (held nodes)</text>\n";
    o += "<text x=\"" + px(kMargin + 170) + "\" y=\"" + px(ky) + "\" fill=\"" + kLoadColour +
         "\">F: applied force, M: applied moment (directions only)</text>\n</g>\n";
  }
  // 4. Colour bar: the map from v0 (bottom) to v1 (top), nice ticks, the field's name.
  const double bx = m.width - kBarZone + 10, by0 = top + 10, bh = m.height - top - kMargin - 30;
  const int bands = 64;
  o += "<g class=\"colour-bar\">\n";
  for (int k = 0; k < bands; ++k)
    o += "<rect x=\"" + px(bx) + "\" y=\"" + px(by0 + bh * (bands - 1 - k) / bands) + "\" width=\"16\" height=\"" +
         px(bh / bands + 0.6) + "\" fill=\"" + colour_hex(viridis((k + 0.5) / bands)) + "\"/>\n";
  o += "<rect x=\"" + px(bx) + "\" y=\"" + px(by0) + "\" width=\"16\" height=\"" + px(bh) +
       "\" fill=\"none\" stroke=\"#333333\" stroke-width=\"0.6\"/>\n";
  AxisTicks ticks = nice_ticks(v0, v1 > v0 ? v1 : v0, 5, false);
  if (!(v1 > v0)) ticks.values = {v0};  // a constant field: one tick at the bottom
  for (double v : ticks.values) {
    const double y = by0 + bh * (1.0 - (v1 > v0 ? (v - v0) / dv : 0.0));
    o += "<line x1=\"" + px(bx + 16) + "\" y1=\"" + px(y) + "\" x2=\"" + px(bx + 21) + "\" y2=\"" + px(y) +
         "\" stroke=\"#333333\"/>\n<text class=\"tick\" x=\"" + px(bx + 24) + "\" y=\"" + px(y + 4) + "\">" +
         esc(tick_text(v, ticks)) + "</text>\n";
  }
  const double lx = m.width - 12.0, ly = by0 + 0.5 * bh;
  o += "<text class=\"field\" x=\"" + px(lx) + "\" y=\"" + px(ly) + "\" text-anchor=\"middle\" transform=\"rotate(-90 " +
       px(lx) + " " + px(ly) + ")\">" + esc(m.field_name) + "</text>\n</g>\n</svg>";
  return o;
}

}  // namespace rotcap
