#include "io/report_html.hpp"
#include "core/text_format.hpp"
#include "io/atomic_file.hpp"

#include "io/input_error.hpp"
#include "io/svg_plot.hpp"
#include "io/xml_text.hpp"

#include <algorithm>
#include <cctype>
#include <charconv>
#include <cstdio>
#include <cmath>
#include <fstream>
#include <numeric>
#include <stdexcept>

namespace rotcap {

namespace {

std::string esc(const std::string& s) { return escape_xml_text(s); }

std::string safe_id(const std::string& id) {
  std::string out;
  for (char c : id)
    if (std::isalnum(static_cast<unsigned char>(c)) || c == '-' || c == '_') out += c;
  return out;
}

std::string fixed(double v, int decimals = 1) {
  char buf[64];
  const auto r = std::to_chars(buf, buf + sizeof buf, v, std::chars_format::fixed, decimals);
  return std::string(buf, r.ptr);
}

std::string general(double v) {
  char buf[64];
  const auto r = std::to_chars(buf, buf + sizeof buf, v, std::chars_format::general, 4);
  return std::string(buf, r.ptr);
}

const char* kStyle =
    "body{font-family:sans-serif;margin:2em auto;max-width:960px;color:#111;line-height:1.4}"
    "h1{font-size:1.6em;margin-bottom:0.2em}h2{font-size:1.25em;border-bottom:1px solid #bbb;margin-top:1.6em}"
    ".subtitle{color:#555;margin-top:0}"
    ".caution{border:1px solid #b07000;background:#fff6e0;padding:0.6em 0.9em;margin:1em 0}"
    "table{border-collapse:collapse;margin:0.6em 0}caption{text-align:left;font-weight:bold;padding:0.2em 0}"
    "th,td{border:1px solid #ccc;padding:0.25em 0.6em;text-align:left}th{background:#f0f0f0}"
    "pre{background:#f7f7f7;padding:0.6em;overflow-x:auto;font-size:0.85em}"
    "figure{margin:0.8em 0}svg{max-width:100%;height:auto}";

// Five-stop colour map, t in [0, 1].
std::string colour(double t) {
  static const double stops[5][3] = {{49, 54, 149}, {69, 173, 209}, {102, 189, 99}, {254, 224, 79}, {215, 48, 39}};
  t = std::clamp(std::isfinite(t) ? t : 0.0, 0.0, 1.0) * 4.0;
  const int i = std::min(3, static_cast<int>(t));
  const double f = t - i;
  return format_text("#%02x%02x%02x", static_cast<int>(stops[i][0] + f * (stops[i + 1][0] - stops[i][0])),
                static_cast<int>(stops[i][1] + f * (stops[i + 1][1] - stops[i][1])),
                static_cast<int>(stops[i][2] + f * (stops[i + 1][2] - stops[i][2])));
}

}  // namespace

std::string render_report_html(const ReportPage& page) {
  std::string h;
  h += "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n<title>" + esc(page.title) +
       "</title>\n<style>" + kStyle + "</style>\n</head>\n<body>\n";
  h += "<h1>" + esc(page.title) + "</h1>\n";
  if (!page.subtitle.empty()) h += "<p class=\"subtitle\">" + esc(page.subtitle) + "</p>\n";
  if (!page.caution.empty()) h += "<div class=\"caution\" id=\"caution-top\">" + esc(page.caution) + "</div>\n";
  for (std::size_t k = 0; k < page.sections.size(); ++k) {
    const ReportSection& s = page.sections[k];
    h += "<section id=\"section-" + std::to_string(k + 1) + "\">\n<h2>" + esc(s.heading) + "</h2>\n";
    for (const std::string& p : s.paragraphs) h += "<p>" + esc(p) + "</p>\n";
    for (const ReportTable& t : s.tables) {
      h += "<table>\n";
      if (!t.caption.empty()) h += "<caption>" + esc(t.caption) + "</caption>\n";
      if (!t.header.empty()) {
        h += "<tr>";
        for (const std::string& c : t.header) h += "<th>" + esc(c) + "</th>";
        h += "</tr>\n";
      }
      for (const auto& row : t.rows) {
        h += "<tr>";
        for (const ReportCell& c : row)
          h += (c.id.empty() ? std::string("<td>") : "<td id=\"" + safe_id(c.id) + "\">") + esc(c.text) + "</td>";
        h += "</tr>\n";
      }
      h += "</table>\n";
    }
    for (const std::string& f : s.figures) h += "<figure>\n" + f + "\n</figure>\n";
    for (const std::string& p : s.preformatted) h += "<pre>" + esc(p) + "</pre>\n";
    h += "</section>\n";
  }
  if (!page.caution.empty()) h += "<div class=\"caution\" id=\"caution-end\">" + esc(page.caution) + "</div>\n";
  h += "</body>\n</html>\n";
  return h;
}

void write_report_html(const ReportPage& page, const std::filesystem::path& file) {
  write_file_atomically(file, render_report_html(page));
}

std::string render_mesh_svg(const MeshPicture& m) {
  if (m.quads.empty()) throw std::invalid_argument("mesh picture: no quads");
  if (m.values.size() != m.points.size())
    throw std::invalid_argument("mesh picture: values.size() " + std::to_string(m.values.size()) + " != points.size() " +
                                std::to_string(m.points.size()));
  const double pi = std::acos(-1.0);
  const double ca = std::cos(m.azimuth_deg * pi / 180), sa = std::sin(m.azimuth_deg * pi / 180);
  const double ce = std::cos(m.elevation_deg * pi / 180), se = std::sin(m.elevation_deg * pi / 180);
  // Screen coordinates (sx right, sy up) and depth (towards the viewer) of every point.
  std::vector<std::array<double, 3>> s(m.points.size());
  for (std::size_t i = 0; i < m.points.size(); ++i) {
    const auto& p = m.points[i];
    if (!std::isfinite(p[0]) || !std::isfinite(p[1]) || !std::isfinite(p[2]))
      throw std::invalid_argument("mesh picture: point " + std::to_string(i) + " is not finite");
    const double x = ca * p[0] - sa * p[1], y = sa * p[0] + ca * p[1];  // about z
    s[i] = {x, ce * p[2] - se * y, -ce * y - se * p[2]};
  }
  for (std::size_t q = 0; q < m.quads.size(); ++q)
    for (int n : m.quads[q])
      if (n < 0 || static_cast<std::size_t>(n) >= m.points.size())
        throw std::invalid_argument("mesh picture: quad " + std::to_string(q) + " names point " + std::to_string(n));
  double x0 = 1e300, x1 = -1e300, y0 = 1e300, y1 = -1e300;
  for (const auto& p : s) {
    x0 = std::min(x0, p[0]), x1 = std::max(x1, p[0]);
    y0 = std::min(y0, p[1]), y1 = std::max(y1, p[1]);
  }
  const double margin = 20, bar = 70, top = m.title.empty() ? 10 : 34;
  const double w = m.width - 2 * margin - bar, hgt = m.height - top - margin;
  const double scale = std::min(w / std::max(x1 - x0, 1e-9), hgt / std::max(y1 - y0, 1e-9));
  const double ox = margin + 0.5 * (w - scale * (x1 - x0)), oy = top + 0.5 * (hgt - scale * (y1 - y0));
  double v0 = 1e300, v1 = -1e300;
  for (double v : m.values)
    if (std::isfinite(v)) v0 = std::min(v0, v), v1 = std::max(v1, v);
  if (v0 > v1) v0 = v1 = 0.0;
  const double dv = v1 > v0 ? v1 - v0 : 1.0;
  std::vector<std::size_t> order(m.quads.size());
  std::iota(order.begin(), order.end(), 0);
  auto depth = [&](std::size_t q) {
    double d = 0.0;
    for (int n : m.quads[q]) d += s[n][2];
    return d;
  };
  std::stable_sort(order.begin(), order.end(), [&](std::size_t a, std::size_t b) { return depth(a) < depth(b); });
  std::string o = "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"" + std::to_string(m.width) + "\" height=\"" +
                  std::to_string(m.height) + "\" viewBox=\"0 0 " + std::to_string(m.width) + " " +
                  std::to_string(m.height) + "\" font-family=\"sans-serif\" font-size=\"12\">\n";
  o += "<rect width=\"100%\" height=\"100%\" fill=\"white\"/>\n";
  if (!m.title.empty()) o += "<text x=\"" + fixed(margin) + "\" y=\"22\" font-size=\"15\">" + esc(m.title) + "</text>\n";
  o += "<g stroke=\"#333333\" stroke-width=\"0.4\" stroke-linejoin=\"round\">\n";
  for (std::size_t q : order) {
    double v = 0.0;
    for (int n : m.quads[q]) v += m.values[n];
    v *= 0.25;
    o += "<polygon points=\"";
    for (int k = 0; k < 4; ++k) {
      const auto& p = s[m.quads[q][k]];
      o += fixed(ox + scale * (p[0] - x0)) + "," + fixed(oy + scale * (y1 - p[1])) + (k < 3 ? " " : "");
    }
    o += "\" fill=\"" + colour((v - v0) / dv) + "\"/>\n";
  }
  o += "</g>\n";
  // Colour bar.
  const double bx = m.width - bar + 10, by0 = top + 10, bh = m.height - top - margin - 30;
  for (int k = 0; k < 20; ++k)
    o += "<rect x=\"" + fixed(bx) + "\" y=\"" + fixed(by0 + bh * (19 - k) / 20.0) + "\" width=\"16\" height=\"" +
         fixed(bh / 20.0 + 0.5) + "\" fill=\"" + colour((k + 0.5) / 20.0) + "\"/>\n";
  o += "<text x=\"" + fixed(bx) + "\" y=\"" + fixed(by0 - 2) + "\">" + esc(general(v1)) + "</text>\n";
  o += "<text x=\"" + fixed(bx) + "\" y=\"" + fixed(by0 + bh + 14) + "\">" + esc(general(v0)) + "</text>\n";
  o += "<text x=\"" + fixed(bx) + "\" y=\"" + fixed(by0 + bh + 28) + "\">" + esc(m.field_name) + "</text>\n";
  o += "</svg>";
  return o;
}

}  // namespace rotcap
