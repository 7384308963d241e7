#pragma once
// LinePlot: a small, self-contained SVG 1.1 line-plot writer (no mechanics knowledge): axes with
// "nice" ticks and labels, a title, named series (polyline, colour, dash, optional markers),
// horizontal / vertical reference lines with labels, labelled point markers and a legend.
//
// Output contract:
//  - render_svg() returns one <svg> element (no XML declaration), ready to be inlined in HTML;
//    write_svg() writes the XML declaration and that element to a file.
//  - Deterministic: the same LinePlot gives the same bytes (numbers are printed with
//    std::to_chars, independent of the locale; no time stamps, no ids).
//  - Every number written is finite. Data that are not finite or exceed 1e300 in magnitude are
//    never drawn: such an x or y in a series breaks its line there; such reference lines and
//    point labels are left out.
//  - Text (title, labels, names, colours, font) is escaped for XML; bytes that are not valid
//    UTF-8 and control characters that XML 1.0 forbids become U+FFFD.
//  - Data are clipped to the axis box (Liang & Barsky 1984, "A new concept and method for line
//    clipping", ACM Trans. Graphics 3(1)); reference lines, markers and labels outside it are
//    left out.
// Axis ranges: each axis takes the explicit limits of PlotOptions where given; otherwise the range
// of the drawable data (series, reference lines of that axis, point labels) widened to whole tick
// steps. The tick step is a "nice" 1, 2 or 5 times a power of ten (Heckbert, "Nice numbers for
// graph labels", Graphics Gems, 1990). No data at all gives [0, 1]; a zero-width range is widened
// by 10 % of its value (or by 1 about 0).
// Labels of reference lines and points have a white halo (SVG 2 paint-order; viewers without it
// draw plain text). Sizes are in px (user units of the viewBox). A single point of a series (no
// drawable neighbour) is drawn as a dot when the series has no marker, so single-point series
// stay visible.
// Errors: std::invalid_argument for a plot that cannot be drawn (the message names the field):
// x and y of a series of different lengths, width or height outside [200, 4000], line width not
// positive, font size outside (0, 1000], non-finite or empty explicit axis limits, target_ticks
// outside [2, 20], a secondary-axis scale not finite and > 0, a reference line width not > 0.
// write_svg: OutputError (io/input_error.hpp) when the file cannot be written.

#include "io/axis_ticks.hpp"

#include <filesystem>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace rotcap {

enum class LineDash { solid, dashed, dotted, dash_dot };
enum class MarkerShape { none, circle, square, diamond, triangle, cross };

struct PlotSeries {
  std::string name;            ///< legend entry (UTF-8); empty: no legend entry
  std::vector<double> x, y;    ///< data coordinates, same length (may be empty)
  std::string colour;          ///< SVG colour ("#1b4f9c", "red"); empty: palette colour by index
  LineDash dash = LineDash::solid;
  MarkerShape marker = MarkerShape::none;  ///< drawn at every point inside the axis box
  double line_width = 1.8;     ///< px, > 0
};

enum class LineOrientation { horizontal, vertical };

struct ReferenceLine {
  LineOrientation orientation = LineOrientation::horizontal;  ///< horizontal: y = value
  double value = 0.0;          ///< data coordinate
  std::string label;           ///< drawn at the line's left end (horizontal) or top (vertical)
  std::string colour = "#555555";
  LineDash dash = LineDash::dashed;
  double line_width = 1.2;     ///< px, > 0
};

struct PointLabel {
  double x = 0.0, y = 0.0;     ///< data coordinates
  std::string label;           ///< drawn beside the marker
  std::string colour = "#111111";
  MarkerShape marker = MarkerShape::circle;
};

/// Where the legend box sits inside the axis box. automatic: the corner whose box meets the
/// fewest drawn segments, reference lines and point labels (ties in the order top_right,
/// top_left, bottom_right, bottom_left).
enum class LegendPlacement { automatic, top_right, top_left, bottom_right, bottom_left, none };

/// A second scale of an axis in other units, drawn on the opposite side of the box (top for x,
/// right for y) with its own nice ticks: secondary value = scale * primary value (scale finite,
/// > 0), e.g. theta [mrad] = theta_p [mrad] * (theta / theta_p).
struct SecondaryAxis {
  double scale = 1.0;
  std::string label;
};

struct PlotOptions {
  int width = 720;             ///< px, 200 .. 4000
  int height = 480;            ///< px, 200 .. 4000
  std::string title;           ///< empty: no title line
  std::string x_label, y_label;
  std::optional<double> x_min, x_max, y_min, y_max;  ///< explicit axis limits (min < max)
  std::optional<SecondaryAxis> x2, y2;  ///< top and right scales; none: a plain frame edge
  int target_ticks = 6;        ///< about this many ticks per axis, 2 .. 20
  LegendPlacement legend = LegendPlacement::automatic;
  double font_size = 13.0;     ///< px, > 0 (tick labels; the title is 1.2 times larger)
  std::string font_family = "sans-serif";
};

struct LinePlot {
  PlotOptions options;
  std::vector<PlotSeries> series;            ///< drawn in order (later on top)
  std::vector<ReferenceLine> reference_lines;
  std::vector<PointLabel> point_labels;      ///< drawn last, above the series
};


/// The plot as one <svg> element (see the header comment).
std::string render_svg(const LinePlot& plot);

/// Writes "<?xml ...?>" and render_svg(plot) to file (through file + ".part", then renamed).
void write_svg(const LinePlot& plot, const std::filesystem::path& file);

}  // namespace rotcap
