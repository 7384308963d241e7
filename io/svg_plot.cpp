#include "io/svg_plot.hpp"

#include "core/text_format.hpp"

#include "io/xml_text.hpp"
#include "io/atomic_file.hpp"

#include "io/input_error.hpp"

#include <algorithm>
#include <array>
#include <charconv>
#include <cmath>
#include <fstream>
#include <stdexcept>
#include <system_error>
#include <utility>

namespace rotcap {

namespace {

constexpr std::array<const char*, 8> kPalette = {"#1b4f9c", "#c0392b", "#2e7d32", "#e67e22",
                                                 "#6a3d9a", "#00838f", "#5d4037", "#444444"};
constexpr double kMarkerRadius = 3.5;  // px
constexpr double kCharWidth = 0.6;     // mean glyph advance / font size, for layout estimates
constexpr double kLargest = 1e300;    // larger magnitudes are not drawn (differences stay finite)
constexpr const char* kHalo =
    " stroke=\"#ffffff\" stroke-width=\"3\" stroke-linejoin=\"round\" paint-order=\"stroke\"";

bool drawable(double v) { return std::abs(v) <= kLargest; }  // false for NaN too
bool drawable(double x, double y) { return drawable(x) && drawable(y); }

std::string fixed(double v, int decimals) { return format_fixed(v, decimals); }

std::string px(double v) { return fixed(v, 2); }


/// Estimated width [px] of UTF-8 text: its code points (continuation bytes not counted) times a
/// mean glyph advance.
double text_width(std::string_view s, double font_size) {
  std::size_t n = 0;
  for (unsigned char c : s) n += (c & 0xC0) != 0x80;
  return kCharWidth * font_size * static_cast<double>(n);
}

const char* dash_array(LineDash d) {
  switch (d) {
    case LineDash::solid: return "";
    case LineDash::dashed: return "7 4";
    case LineDash::dotted: return "1.5 3";
    case LineDash::dash_dot: return "7 3 1.5 3";
  }
  return "";
}

std::string dash_attribute(LineDash d) {
  const std::string a = dash_array(d);
  return a.empty() ? std::string() : " stroke-dasharray=\"" + a + "\"";
}




struct Range {
  double lo = 0.0, hi = 0.0;
  bool any = false;
  void add(double v) {
    if (!drawable(v)) return;
    lo = any ? std::min(lo, v) : v;
    hi = any ? std::max(hi, v) : v;
    any = true;
  }
};

AxisTicks axis_ticks(const Range& data, std::optional<double> min, std::optional<double> max,
                     int target) {
  if (min && max) return nice_ticks(*min, *max, target, false);
  double lo = data.any ? data.lo : 0.0, hi = data.any ? data.hi : 1.0;
  if (min) lo = *min, hi = std::max(hi, lo);
  if (max) hi = *max, lo = std::min(lo, hi);
  widen_if_degenerate(lo, hi);
  if (min) lo = *min;  // the widening keeps an explicit limit
  if (max) hi = *max;
  AxisTicks t = nice_ticks(lo, hi, target, true);
  if (min) t.lo = *min;
  if (max) t.hi = *max;
  fill_tick_values(t);
  return t;
}

/// Axis box in px and the data -> px maps.
struct Frame {
  double x0, x1, y0, y1;  // left, right, top, bottom
  AxisTicks xt, yt;
  double X(double x) const { return x0 + (x - xt.lo) / (xt.hi - xt.lo) * (x1 - x0); }
  double Y(double y) const { return y1 - (y - yt.lo) / (yt.hi - yt.lo) * (y1 - y0); }
  bool inside(double x, double y) const {
    const double ex = 1e-9 * (xt.hi - xt.lo), ey = 1e-9 * (yt.hi - yt.lo);
    return x >= xt.lo - ex && x <= xt.hi + ex && y >= yt.lo - ey && y <= yt.hi + ey;
  }
};

/// A rectangle [xl, xh] x [yl, yh] (data or px coordinates).
struct Box {
  double xl, xh, yl, yh;
};

/// Liang & Barsky (1984): the parameter interval [t0, t1] of a -> b inside box b.
bool clip(const Box& box, double xa, double ya, double xb, double yb, double& t0, double& t1) {
  const double dx = xb - xa, dy = yb - ya;
  if (!std::isfinite(dx) || !std::isfinite(dy)) return false;
  const double p[4] = {-dx, dx, -dy, dy};
  const double q[4] = {xa - box.xl, box.xh - xa, ya - box.yl, box.yh - ya};
  t0 = 0.0;
  t1 = 1.0;
  for (int k = 0; k < 4; ++k) {
    if (p[k] == 0.0) {
      if (q[k] < 0.0) return false;  // parallel to this edge and outside it
      continue;
    }
    const double r = q[k] / p[k];
    if (p[k] < 0.0) t0 = std::max(t0, r);  // entering through this edge
    else t1 = std::min(t1, r);             // leaving through it
    if (t0 > t1) return false;
  }
  return true;
}

Box data_box(const Frame& f) { return {f.xt.lo, f.xt.hi, f.yt.lo, f.yt.hi}; }

void marker(std::string& out, MarkerShape shape, double cx, double cy, const std::string& colour) {
  const double r = kMarkerRadius;
  const std::string fill = " fill=\"" + colour + "\"";
  switch (shape) {
    case MarkerShape::none: return;
    case MarkerShape::circle:
      out += "<circle cx=\"" + px(cx) + "\" cy=\"" + px(cy) + "\" r=\"" + px(r) + "\"" + fill + "/>\n";
      return;
    case MarkerShape::square:
      out += "<rect x=\"" + px(cx - r) + "\" y=\"" + px(cy - r) + "\" width=\"" + px(2 * r) +
             "\" height=\"" + px(2 * r) + "\"" + fill + "/>\n";
      return;
    case MarkerShape::diamond: {
      const double d = 1.3 * r;
      out += "<polygon points=\"" + px(cx) + "," + px(cy - d) + " " + px(cx + d) + "," + px(cy) + " " +
             px(cx) + "," + px(cy + d) + " " + px(cx - d) + "," + px(cy) + "\"" + fill + "/>\n";
      return;
    }
    case MarkerShape::triangle:
      out += "<polygon points=\"" + px(cx) + "," + px(cy - 1.3 * r) + " " + px(cx + 1.13 * r) + "," +
             px(cy + 0.65 * r) + " " + px(cx - 1.13 * r) + "," + px(cy + 0.65 * r) + "\"" + fill + "/>\n";
      return;
    case MarkerShape::cross:
      out += "<path d=\"M" + px(cx - r) + " " + px(cy - r) + "L" + px(cx + r) + " " + px(cy + r) + "M" +
             px(cx - r) + " " + px(cy + r) + "L" + px(cx + r) + " " + px(cy - r) + "\" stroke=\"" +
             colour + "\" stroke-width=\"1.50\" fill=\"none\"/>\n";
      return;
  }
}

std::string text(double x, double y, const char* anchor, std::string_view content,
                 const std::string& extra = "") {
  return "<text x=\"" + px(x) + "\" y=\"" + px(y) + "\" text-anchor=\"" + anchor + "\"" + extra +
         ">" + escape_xml_text(content) + "</text>\n";
}

void validate(const LinePlot& plot) {
  const PlotOptions& o = plot.options;
  auto fail = [](const std::string& what) { throw std::invalid_argument("LinePlot: " + what); };
  if (o.width < 200 || o.width > 4000)
    fail("options.width = " + std::to_string(o.width) + ": expected 200 .. 4000");
  if (o.height < 200 || o.height > 4000)
    fail("options.height = " + std::to_string(o.height) + ": expected 200 .. 4000");
  if (!(o.font_size > 0.0 && o.font_size <= 1000.0))
    fail("options.font_size = " + std::to_string(o.font_size) + ": expected 0 < value <= 1000");
  if (o.target_ticks < 2 || o.target_ticks > 20)
    fail("options.target_ticks = " + std::to_string(o.target_ticks) + ": expected 2 .. 20");
  const std::array<std::pair<const char*, std::optional<double>>, 4> limits = {
      {{"x_min", o.x_min}, {"x_max", o.x_max}, {"y_min", o.y_min}, {"y_max", o.y_max}}};
  for (const auto& [name, v] : limits)
    if (v && !std::isfinite(*v)) fail(std::string("options.") + name + " is not finite");
  if (o.x_min && o.x_max && !(*o.x_min < *o.x_max)) fail("options.x_min >= options.x_max");
  if (o.y_min && o.y_max && !(*o.y_min < *o.y_max)) fail("options.y_min >= options.y_max");
  for (const auto& [name, axis] : {std::pair{"x2", o.x2}, std::pair{"y2", o.y2}})
    if (axis && !(std::isfinite(axis->scale) && axis->scale > 0.0))
      fail(std::string("options.") + name + ".scale = " + std::to_string(axis->scale) + ": expected finite > 0");
  for (std::size_t k = 0; k < plot.reference_lines.size(); ++k)
    if (!(plot.reference_lines[k].line_width > 0.0) || !std::isfinite(plot.reference_lines[k].line_width))
      fail("reference_lines[" + std::to_string(k) + "]: line_width: expected > 0");
  for (std::size_t k = 0; k < plot.series.size(); ++k) {
    const PlotSeries& s = plot.series[k];
    const std::string where = "series[" + std::to_string(k) + "] '" + s.name + "'";
    if (s.x.size() != s.y.size())
      fail(where + ": x has " + std::to_string(s.x.size()) + " values, y " + std::to_string(s.y.size()));
    if (!(s.line_width > 0.0) || !std::isfinite(s.line_width)) fail(where + ": line_width: expected > 0");
  }
}

void draw_series(std::string& out, const Frame& f, const PlotSeries& s, const std::string& colour) {
  out += "<g class=\"series\">";
  if (!s.name.empty()) out += "<title>" + escape_xml_text(s.name) + "</title>";
  out += "\n";
  const std::string stroke = " fill=\"none\" stroke=\"" + colour + "\" stroke-width=\"" +
                             px(s.line_width) + "\" stroke-linejoin=\"round\"" + dash_attribute(s.dash);
  std::string run;  // "x,y x,y ..." of the current visible piece
  auto flush = [&] {
    if (!run.empty()) out += "<polyline points=\"" + run + "\"" + stroke + "/>\n";
    run.clear();
  };
  auto point = [&](double x, double y) {
    return (run.empty() ? "" : " ") + px(f.X(x)) + "," + px(f.Y(y));
  };
  const std::size_t n = s.x.size();
  auto finite = [&](std::size_t j) { return drawable(s.x[j], s.y[j]); };
  for (std::size_t j = 1; j < n; ++j) {
    double t0, t1;
    if (!finite(j - 1) || !finite(j) ||
        !clip(data_box(f), s.x[j - 1], s.y[j - 1], s.x[j], s.y[j], t0, t1)) {
      flush();
      continue;
    }
    const double dx = s.x[j] - s.x[j - 1], dy = s.y[j] - s.y[j - 1];
    if (t0 > 0.0) flush();
    if (run.empty()) run += point(s.x[j - 1] + t0 * dx, s.y[j - 1] + t0 * dy);
    run += t1 < 1.0 ? point(s.x[j - 1] + t1 * dx, s.y[j - 1] + t1 * dy)  // leaves the box
                    : point(s.x[j], s.y[j]);
    if (t1 < 1.0) flush();
  }
  flush();
  for (std::size_t j = 0; j < n; ++j) {
    if (!finite(j) || !f.inside(s.x[j], s.y[j])) continue;
    const bool isolated = (j == 0 || !finite(j - 1)) && (j + 1 == n || !finite(j + 1));
    if (s.marker != MarkerShape::none) marker(out, s.marker, f.X(s.x[j]), f.Y(s.y[j]), colour);
    else if (isolated)
      out += "<circle cx=\"" + px(f.X(s.x[j])) + "\" cy=\"" + px(f.Y(s.y[j])) + "\" r=\"" +
             px(std::max(1.5, s.line_width)) + "\" fill=\"" + colour + "\"/>\n";
  }
  out += "</g>\n";
}

/// The px box of a point label's text: right of and above the marker, moved to its left near the
/// right edge of the axis box and below it near the top edge.
Box label_box(const Frame& f, const PointLabel& p, double fs) {
  const double cx = f.X(p.x), cy = f.Y(p.y), w = text_width(p.label, fs);
  const bool left = cx + 7 + w > f.x1;
  const double baseline = cy - 7 - fs < f.y0 ? cy + 7 + fs : cy - 7;
  const double x = left ? cx - 7 - w : cx + 7;
  return {x, x + w, baseline - fs, baseline + 0.3 * fs};
}

/// How many drawn things the px box meets: series segments and single points, reference lines,
/// point labels (the score of a legend position).
int clutter(const Frame& f, const LinePlot& plot, const Box& px_box) {
  const Box data = data_box(f);
  auto meets = [&](double xa, double ya, double xb, double yb) {
    double t0, t1;
    if (!clip(data, xa, ya, xb, yb, t0, t1)) return false;
    const double dx = xb - xa, dy = yb - ya;
    return clip(px_box, f.X(xa + t0 * dx), f.Y(ya + t0 * dy), f.X(xa + t1 * dx), f.Y(ya + t1 * dy),
                t0, t1);
  };
  int n = 0;
  for (const PlotSeries& s : plot.series) {
    for (std::size_t j = 0; j < s.x.size(); ++j) {
      const double xb = s.x[j], yb = s.y[j];
      if (!drawable(xb, yb)) continue;
      const bool segment = j > 0 && drawable(s.x[j - 1], s.y[j - 1]);
      n += meets(segment ? s.x[j - 1] : xb, segment ? s.y[j - 1] : yb, xb, yb);
    }
  }
  for (const ReferenceLine& l : plot.reference_lines) {
    if (!drawable(l.value)) continue;
    if (l.orientation == LineOrientation::horizontal) n += meets(f.xt.lo, l.value, f.xt.hi, l.value);
    else n += meets(l.value, f.yt.lo, l.value, f.yt.hi);
  }
  for (const PointLabel& p : plot.point_labels) {
    if (!drawable(p.x, p.y) || !f.inside(p.x, p.y)) continue;
    const Box t = label_box(f, p, plot.options.font_size);
    const bool text_meets =
        !p.label.empty() && t.xl < px_box.xh && px_box.xl < t.xh && t.yl < px_box.yh && px_box.yl < t.yh;
    n += meets(p.x, p.y, p.x, p.y) || text_meets;
  }
  return n;
}

void draw_legend(std::string& out, const Frame& f, const LinePlot& plot,
                 const std::vector<std::string>& colours) {
  const PlotOptions& o = plot.options;
  std::vector<std::size_t> rows;
  double text_w = 0.0;
  for (std::size_t k = 0; k < plot.series.size(); ++k)
    if (!plot.series[k].name.empty()) {
      rows.push_back(k);
      text_w = std::max(text_w, text_width(plot.series[k].name, o.font_size));
    }
  if (rows.empty() || o.legend == LegendPlacement::none) return;
  const double row_h = 1.4 * o.font_size, pad = 8.0, sample = 28.0;
  const double w = pad + sample + 6.0 + text_w + pad;
  const double h = pad + row_h * static_cast<double>(rows.size()) + pad / 2;
  auto corner = [&](LegendPlacement c) {
    const bool right = c == LegendPlacement::top_right || c == LegendPlacement::bottom_right;
    const bool top = c == LegendPlacement::top_right || c == LegendPlacement::top_left;
    const double lx = right ? f.x1 - 10.0 - w : f.x0 + 10.0;
    const double ly = top ? f.y0 + 10.0 : f.y1 - 10.0 - h;
    return Box{lx, lx + w, ly, ly + h};
  };
  LegendPlacement where = o.legend;
  if (where == LegendPlacement::automatic) {
    int best = -1;
    for (LegendPlacement c : {LegendPlacement::top_right, LegendPlacement::top_left,
                              LegendPlacement::bottom_right, LegendPlacement::bottom_left}) {
      const Box b = corner(c);
      const int score = clutter(f, plot, {b.xl - 6.0, b.xh + 6.0, b.yl - 6.0, b.yh + 6.0});
      if (best < 0 || score < best) best = score, where = c;
    }
  }
  const Box b = corner(where);
  out += "<g class=\"legend\">\n<rect x=\"" + px(b.xl) + "\" y=\"" + px(b.yl) + "\" width=\"" + px(w) +
         "\" height=\"" + px(h) + "\" fill=\"#ffffff\" fill-opacity=\"0.9\" stroke=\"#999999\"/>\n";
  for (std::size_t r = 0; r < rows.size(); ++r) {
    const PlotSeries& s = plot.series[rows[r]];
    const double cy = b.yl + pad + row_h * (static_cast<double>(r) + 0.5);
    out += "<line x1=\"" + px(b.xl + pad) + "\" y1=\"" + px(cy) + "\" x2=\"" + px(b.xl + pad + sample) +
           "\" y2=\"" + px(cy) + "\" stroke=\"" + colours[rows[r]] + "\" stroke-width=\"" +
           px(s.line_width) + "\"" + dash_attribute(s.dash) + "/>\n";
    marker(out, s.marker, b.xl + pad + sample / 2, cy, colours[rows[r]]);
    out += text(b.xl + pad + sample + 6.0, cy + 0.35 * o.font_size, "start", s.name);
  }
  out += "</g>\n";
}

}  // namespace



std::string render_svg(const LinePlot& plot) {
  validate(plot);
  const PlotOptions& o = plot.options;
  const double W = o.width, H = o.height, fs = o.font_size;

  // 1. Axis ranges and ticks from the finite data.
  Range xr, yr;
  for (const PlotSeries& s : plot.series)
    for (std::size_t j = 0; j < s.x.size(); ++j)
      if (drawable(s.x[j], s.y[j])) xr.add(s.x[j]), yr.add(s.y[j]);
  for (const ReferenceLine& l : plot.reference_lines)
    (l.orientation == LineOrientation::vertical ? xr : yr).add(l.value);
  for (const PointLabel& p : plot.point_labels)
    if (drawable(p.x, p.y)) xr.add(p.x), yr.add(p.y);
  Frame f;
  f.xt = axis_ticks(xr, o.x_min, o.x_max, o.target_ticks);
  f.yt = axis_ticks(yr, o.y_min, o.y_max, o.target_ticks);

  // Secondary scales: their own nice ticks over the primary range times the scale.
  const std::optional<AxisTicks> x2t =
      o.x2 ? std::optional(nice_ticks(o.x2->scale * f.xt.lo, o.x2->scale * f.xt.hi, o.target_ticks, false)) : std::nullopt;
  const std::optional<AxisTicks> y2t =
      o.y2 ? std::optional(nice_ticks(o.y2->scale * f.yt.lo, o.y2->scale * f.yt.hi, o.target_ticks, false)) : std::nullopt;

  // 2. Layout: margins from the tick labels, axis labels and title (and the secondary scales).
  double y_tick_w = 0.0, y2_tick_w = 0.0;
  for (double v : f.yt.values) y_tick_w = std::max(y_tick_w, text_width(tick_text(v, f.yt), fs));
  if (y2t)
    for (double v : y2t->values) y2_tick_w = std::max(y2_tick_w, text_width(tick_text(v, *y2t), fs));
  f.x0 = std::min(W / 2, 10.0 + (o.y_label.empty() ? 0.0 : 1.6 * fs) + y_tick_w + 8.0);
  f.x1 = W - (y2t ? 10.0 + (o.y2->label.empty() ? 0.0 : 1.6 * fs) + y2_tick_w + 8.0 : 20.0);
  f.x1 = std::max(f.x1, f.x0 + W / 4);
  f.y0 = (o.title.empty() ? 16.0 : 2.6 * fs) + (x2t ? 1.4 * fs + (o.x2->label.empty() ? 0.0 : 1.4 * fs) : 0.0);
  f.y1 = H - (10.0 + 1.4 * fs + (o.x_label.empty() ? 0.0 : 1.6 * fs));

  std::vector<std::string> colours;
  for (std::size_t k = 0; k < plot.series.size(); ++k)
    colours.push_back(plot.series[k].colour.empty() ? std::string(kPalette[k % kPalette.size()])
                                                    : escape_xml_text(plot.series[k].colour));

  // 3. Document, background, title.
  const std::string w = std::to_string(o.width), h = std::to_string(o.height);
  std::string out = "<svg xmlns=\"http://www.w3.org/2000/svg\" version=\"1.1\" width=\"" + w +
                    "\" height=\"" + h + "\" viewBox=\"0 0 " + w + " " + h + "\" font-family=\"" +
                    escape_xml_text(o.font_family) + "\" font-size=\"" + px(fs) + "\" fill=\"#222222\">\n";
  if (!o.title.empty()) out += "<title>" + escape_xml_text(o.title) + "</title>\n";
  out += "<rect x=\"0\" y=\"0\" width=\"" + w + "\" height=\"" + h + "\" fill=\"#ffffff\"/>\n";
  if (!o.title.empty())
    out += text(W / 2, 1.6 * fs, "middle", o.title,
                " font-size=\"" + px(1.2 * fs) + "\" font-weight=\"bold\"");

  // 4. Grid, frame, ticks and their labels, axis labels.
  out += "<g class=\"axes\">\n";
  auto line = [](double xa, double ya, double xb, double yb, const char* colour) {
    return "<line x1=\"" + px(xa) + "\" y1=\"" + px(ya) + "\" x2=\"" + px(xb) + "\" y2=\"" + px(yb) +
           "\" stroke=\"" + colour + "\"/>\n";
  };
  for (double v : f.xt.values)
    out += line(f.X(v), f.y0, f.X(v), f.y1, "#e3e3e3") +
           line(f.X(v), f.y1, f.X(v), f.y1 + 5, "#333333") +
           text(f.X(v), f.y1 + 5 + 1.1 * fs, "middle", tick_text(v, f.xt));
  for (double v : f.yt.values)
    out += line(f.x0, f.Y(v), f.x1, f.Y(v), "#e3e3e3") +
           line(f.x0 - 5, f.Y(v), f.x0, f.Y(v), "#333333") +
           text(f.x0 - 8, f.Y(v) + 0.35 * fs, "end", tick_text(v, f.yt));
  out += "<rect x=\"" + px(f.x0) + "\" y=\"" + px(f.y0) + "\" width=\"" + px(f.x1 - f.x0) + "\" height=\"" +
         px(f.y1 - f.y0) + "\" fill=\"none\" stroke=\"#333333\"/>\n";
  if (!o.x_label.empty()) out += text((f.x0 + f.x1) / 2, H - 10.0, "middle", o.x_label);
  if (!o.y_label.empty()) {
    const double x = 10.0 + fs, y = (f.y0 + f.y1) / 2;
    out += text(x, y, "middle", o.y_label,
                " transform=\"rotate(-90 " + px(x) + " " + px(y) + ")\"");
  }
  out += "</g>\n";
  if (x2t || y2t) {
    // Secondary scales: value v sits at the primary coordinate v / scale.
    out += "<g class=\"secondary-axes\">\n";
    if (x2t) {
      for (double v : x2t->values) {
        const double x = f.X(v / o.x2->scale);
        out += line(x, f.y0 - 5, x, f.y0, "#333333") + text(x, f.y0 - 8, "middle", tick_text(v, *x2t));
      }
      if (!o.x2->label.empty()) out += text((f.x0 + f.x1) / 2, f.y0 - 8 - 1.4 * fs, "middle", o.x2->label);
    }
    if (y2t) {
      for (double v : y2t->values) {
        const double y = f.Y(v / o.y2->scale);
        out += line(f.x1, y, f.x1 + 5, y, "#333333") + text(f.x1 + 8, y + 0.35 * fs, "start", tick_text(v, *y2t));
      }
      if (!o.y2->label.empty()) {
        const double x = W - 10.0, y = (f.y0 + f.y1) / 2;
        out += text(x, y, "middle", o.y2->label, " transform=\"rotate(-90 " + px(x) + " " + px(y) + ")\"");
      }
    }
    out += "</g>\n";
  }

  // 5. Reference lines (under the data), series, legend, point labels (on top).
  for (const ReferenceLine& l : plot.reference_lines) {
    const bool horizontal = l.orientation == LineOrientation::horizontal;
    if (!drawable(l.value)) continue;
    if (!(horizontal ? f.inside(f.xt.lo, l.value) : f.inside(l.value, f.yt.lo))) continue;
    const std::string colour = escape_xml_text(l.colour);
    const double a = horizontal ? f.Y(l.value) : f.X(l.value);
    out += "<g class=\"reference\">\n<line x1=\"" + px(horizontal ? f.x0 : a) + "\" y1=\"" +
           px(horizontal ? a : f.y0) + "\" x2=\"" + px(horizontal ? f.x1 : a) + "\" y2=\"" +
           px(horizontal ? a : f.y1) + "\" stroke=\"" + colour + "\" stroke-width=\"" + px(l.line_width) + "\"" +
           dash_attribute(l.dash) + "/>\n";
    if (!l.label.empty()) {
      const std::string fill = " fill=\"" + colour + "\"" + kHalo;
      if (horizontal) out += text(f.x0 + 4, a - 4, "start", l.label, fill);
      else if (a + 4 + text_width(l.label, fs) > f.x1)
        out += text(a - 4, f.y0 + 1.2 * fs, "end", l.label, fill);
      else out += text(a + 4, f.y0 + 1.2 * fs, "start", l.label, fill);
    }
    out += "</g>\n";
  }
  for (std::size_t k = 0; k < plot.series.size(); ++k) draw_series(out, f, plot.series[k], colours[k]);
  draw_legend(out, f, plot, colours);
  for (const PointLabel& p : plot.point_labels) {
    if (!drawable(p.x, p.y) || !f.inside(p.x, p.y)) continue;
    const std::string colour = escape_xml_text(p.colour);
    const double cx = f.X(p.x), cy = f.Y(p.y);
    out += "<g class=\"point\">\n";
    marker(out, p.marker, cx, cy, colour);
    if (!p.label.empty()) {
      const Box t = label_box(f, p, fs);
      out += text(t.xl, t.yh - 0.3 * fs, "start", p.label, " fill=\"" + colour + "\"" + kHalo);
    }
    out += "</g>\n";
  }
  out += "</svg>\n";
  return out;
}

void write_svg(const LinePlot& plot, const std::filesystem::path& file) {
  write_file_atomically(file, "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n" + render_svg(plot));
}

}  // namespace rotcap
