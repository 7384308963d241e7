// SVG line plots: parsed back with VTK's XML reader (expat) to prove well-formedness and to find
// the series, labels and numbers; xmllint (when installed) as a second, independent parser.
// Tick values are worked out by hand from Heckbert's rules (Graphics Gems, 1990) in the comments.
#include "io/input_error.hpp"
#include "io/svg_plot.hpp"
#include "io/xml_text.hpp"
#include "tests/io/io_test_support.hpp"
#include "tests/test_support.hpp"

#include <vtkXMLDataElement.h>
#include <vtkXMLUtilities.h>

#include <cmath>
#include <cstdlib>
#include <functional>
#include <limits>
#include <memory>
#include <sstream>

namespace rotcap {
namespace {

struct ElementDeleter {
  void operator()(vtkXMLDataElement* e) const { e->Delete(); }
};
using Element = std::unique_ptr<vtkXMLDataElement, ElementDeleter>;

/// The SVG parsed by VTK's XML reader; null (and a failure) when it is not well-formed XML.
Element parse(const std::string& svg) {
  Element root(vtkXMLUtilities::ReadElementFromString(svg.c_str()));
  EXPECT_NE(root, nullptr) << "not well-formed XML:\n" << svg;
  return root;
}

void for_each_element(vtkXMLDataElement* e, const std::function<void(vtkXMLDataElement*)>& f) {
  f(e);
  for (int k = 0; k < e->GetNumberOfNestedElements(); ++k) for_each_element(e->GetNestedElement(k), f);
}

std::vector<vtkXMLDataElement*> elements(vtkXMLDataElement* root, const std::string& name,
                                         const std::string& cls = "") {
  std::vector<vtkXMLDataElement*> found;
  for_each_element(root, [&](vtkXMLDataElement* e) {
    const char* c = e->GetAttribute("class");
    if (name == e->GetName() && (cls.empty() || (c != nullptr && cls == c))) found.push_back(e);
  });
  return found;
}

std::vector<std::string> texts(vtkXMLDataElement* root) {
  std::vector<std::string> out;
  for (vtkXMLDataElement* e : elements(root, "text"))
    out.emplace_back(e->GetCharacterData() != nullptr ? e->GetCharacterData() : "");
  return out;
}

bool contains(const std::vector<std::string>& v, const std::string& s) {
  return std::find(v.begin(), v.end(), s) != v.end();
}

/// Every number in every attribute (coordinates, sizes, point lists) parses as a finite value.
void expect_only_finite_numbers(vtkXMLDataElement* root, const std::string& svg) {
  EXPECT_EQ(svg.find("nan"), std::string::npos);
  EXPECT_EQ(svg.find("inf"), std::string::npos);
  for_each_element(root, [&](vtkXMLDataElement* e) {
    for (int k = 0; k < e->GetNumberOfAttributes(); ++k) {
      const std::string name = e->GetAttributeName(k);
      static const std::vector<std::string> numeric = {"x",  "y",  "x1", "y1",    "x2",     "y2",
                                                        "cx", "cy", "r",  "width", "height", "points"};
      if (!contains(numeric, name)) continue;
      std::string value = e->GetAttributeValue(k);
      std::replace(value.begin(), value.end(), ',', ' ');
      std::istringstream in(value);
      double v;
      int count = 0;
      while (in >> v) {
        EXPECT_TRUE(std::isfinite(v)) << name << "=" << e->GetAttributeValue(k);
        ++count;
      }
      EXPECT_TRUE(in.eof()) << name << "=\"" << e->GetAttributeValue(k) << "\" is not a list of numbers";
      EXPECT_GT(count, 0) << name;
    }
  });
}

/// A moment-rotation plot like the report's: normalised curve, a hinge law, Mp line, markers.
LinePlot hinge_like_plot() {
  LinePlot p;
  p.options.title = "M/Mp against θ/θp <IPE 300 & S355>";
  p.options.x_label = "θ / θp";
  p.options.y_label = "M / Mp";
  PlotSeries shell{"shell model", {}, {}, "", LineDash::solid, MarkerShape::circle, 1.8};
  for (int j = 0; j <= 40; ++j) {
    const double t = 0.25 * j;
    shell.x.push_back(t);
    shell.y.push_back(t < 1.0 ? t : 1.0 + 0.08 * (t - 1.0) - 0.006 * (t - 1.0) * (t - 1.0));
  }
  p.series.push_back(shell);
  p.series.push_back({"rigid-plastic law", {0.0, 1.0, 10.0}, {0.0, 1.0, 1.0}, "#777777", LineDash::dashed,
                      MarkerShape::none, 1.2});
  p.reference_lines.push_back({LineOrientation::horizontal, 1.0, "Mp", "#555555", LineDash::dotted});
  p.reference_lines.push_back({LineOrientation::vertical, 1.0, "θp", "#555555", LineDash::dotted});
  p.point_labels.push_back({7.67, 1.267, "peak", "#c0392b", MarkerShape::diamond});
  p.point_labels.push_back({9.9, 1.0, "θu", "#c0392b", MarkerShape::triangle});
  return p;
}

TEST(SvgPlot, IsWellFormedXmlHoldingTheSeriesAndLabels) {
  const LinePlot plot = hinge_like_plot();
  const std::string svg = render_svg(plot);
  const Element root = parse(svg);
  ASSERT_NE(root, nullptr);
  EXPECT_STREQ(root->GetName(), "svg");
  EXPECT_STREQ(root->GetAttribute("xmlns"), "http://www.w3.org/2000/svg");
  EXPECT_STREQ(root->GetAttribute("width"), "720");
  EXPECT_STREQ(root->GetAttribute("height"), "480");
  const auto series = elements(root.get(), "g", "series");
  ASSERT_EQ(series.size(), 2u);
  // Series in order, their names as tooltips; the shell curve's 41 points all carry a marker.
  EXPECT_STREQ(elements(series[0], "title")[0]->GetCharacterData(), "shell model");
  EXPECT_STREQ(elements(series[1], "title")[0]->GetCharacterData(), "rigid-plastic law");
  EXPECT_EQ(elements(series[0], "circle").size(), 41u);
  EXPECT_EQ(elements(series[0], "polyline").size(), 1u);
  EXPECT_STREQ(elements(series[1], "polyline")[0]->GetAttribute("stroke-dasharray"), "7 4");
  EXPECT_STREQ(elements(series[1], "polyline")[0]->GetAttribute("stroke"), "#777777");
  // Title (escaped in the file, restored by the parser), axis labels, legend, references, points.
  const std::vector<std::string> t = texts(root.get());
  for (const char* s : {"M/Mp against θ/θp <IPE 300 & S355>", "θ / θp", "M / Mp", "shell model",
                        "rigid-plastic law", "Mp", "θp", "peak", "θu"})
    EXPECT_TRUE(contains(t, s)) << "no text '" << s << "'";
  EXPECT_NE(svg.find("&lt;IPE 300 &amp; S355&gt;"), std::string::npos);
  EXPECT_EQ(elements(root.get(), "g", "reference").size(), 2u);
  EXPECT_EQ(elements(root.get(), "g", "point").size(), 2u);
  EXPECT_EQ(elements(root.get(), "g", "legend").size(), 1u);
  // Data x in [0, 10]: range nicenum(10) = 10, step nicenum(10 / 5 = 2, round) = 2: ticks
  // 0, 2, ..., 10. y in [0, 1.267]: range 2, step nicenum(0.4) = 0.5: 0 .. 1.5 by 0.5.
  for (const char* s : {"0", "2", "4", "6", "8", "10", "0.0", "0.5", "1.0", "1.5"})
    EXPECT_TRUE(contains(t, s)) << "no tick label '" << s << "'";
  expect_only_finite_numbers(root.get(), svg);
}

/// The x attribute of the first <text> in root whose content is s; NaN when there is none.
double text_x(vtkXMLDataElement* root, const std::string& s) {
  for (vtkXMLDataElement* e : elements(root, "text"))
    if (e->GetCharacterData() != nullptr && s == e->GetCharacterData()) return std::stod(e->GetAttribute("x"));
  return std::numeric_limits<double>::quiet_NaN();
}

TEST(SvgPlot, DrawsSecondaryAxesWithTheirOwnTicksAtScaledPositions) {
  LinePlot plot = hinge_like_plot();
  plot.options.x2 = SecondaryAxis{14.81, "θ [mrad]"};   // theta_p = 14.81 mrad
  plot.options.y2 = SecondaryAxis{309.3, "M [kNm]"};    // Mp = 309.3 kNm
  const std::string svg = render_svg(plot);
  const Element root = parse(svg);
  ASSERT_NE(root, nullptr);
  const auto groups = elements(root.get(), "g", "secondary-axes");
  ASSERT_EQ(groups.size(), 1u);
  const std::vector<std::string> t = texts(groups[0]);
  EXPECT_TRUE(contains(t, "θ [mrad]"));
  EXPECT_TRUE(contains(t, "M [kNm]"));
  // Top scale over [0, 10 x 14.81 = 148.1]: range nicenum(148.1) = 200, step nicenum(200 / 5 = 40,
  // round) = 50: ticks 0, 50, 100. Right scale over [0, 1.5 x 309.3 = 463.95]: range 500, step
  // nicenum(100) = 100: ticks 0 .. 400.
  for (const char* s : {"0", "50", "100", "200", "300", "400"}) EXPECT_TRUE(contains(t, s)) << s;
  EXPECT_FALSE(contains(t, "150"));  // beyond 148.1, off the axis
  // The tick "100" [mrad] sits at theta / theta_p = 100 / 14.81 of the primary axis, whose labels
  // "0" and "10" give the px map (positions printed to 0.01 px).
  const auto axes = elements(root.get(), "g", "axes");
  ASSERT_EQ(axes.size(), 1u);
  const double x0 = text_x(axes[0], "0"), x10 = text_x(axes[0], "10");
  EXPECT_NEAR(text_x(groups[0], "100"), x0 + (100.0 / 14.81) / 10.0 * (x10 - x0), 0.011);
  expect_only_finite_numbers(root.get(), svg);
  plot.options.x2->scale = 0.0;
  EXPECT_THROW(render_svg(plot), std::invalid_argument);
}

TEST(SvgPlot, DrawsReferenceLinesWithTheirOwnWidth) {
  LinePlot plot = hinge_like_plot();
  plot.reference_lines[0].line_width = 0.8;
  const Element root = parse(render_svg(plot));
  ASSERT_NE(root, nullptr);
  const auto refs = elements(root.get(), "g", "reference");
  ASSERT_EQ(refs.size(), 2u);
  EXPECT_STREQ(elements(refs[0], "line")[0]->GetAttribute("stroke-width"), "0.80");
  EXPECT_STREQ(elements(refs[1], "line")[0]->GetAttribute("stroke-width"), "1.20");  // the default
  plot.reference_lines[0].line_width = 0.0;
  EXPECT_THROW(render_svg(plot), std::invalid_argument);
}

TEST(SvgPlot, PlacesTheLegendInTheEmptiestCorner) {
  // The hinge-like plot: the "peak" label is near the top right, the theta_p line crosses the
  // top left, the falling curve stays above M/Mp = 1 on the right: the bottom right is free.
  auto legend_box = [](const LinePlot& plot) {
    const Element root = parse(render_svg(plot));
    const auto legend = elements(root.get(), "g", "legend");
    EXPECT_EQ(legend.size(), 1u);
    vtkXMLDataElement* rect = elements(legend.at(0), "rect").at(0);
    return std::pair{std::stod(rect->GetAttribute("x")), std::stod(rect->GetAttribute("y"))};
  };
  LinePlot plot = hinge_like_plot();
  const auto [x_auto, y_auto] = legend_box(plot);
  EXPECT_GT(x_auto, 360.0);
  EXPECT_GT(y_auto, 240.0);
  plot.options.legend = LegendPlacement::top_left;
  const auto [x_left, y_top] = legend_box(plot);
  EXPECT_LT(x_left, 360.0);
  EXPECT_LT(y_top, 240.0);
}

TEST(SvgPlot, GivesTheSameBytesForTheSameInput) {
  const LinePlot a = hinge_like_plot(), b = hinge_like_plot();
  const std::string first = render_svg(a);
  EXPECT_EQ(render_svg(a), first);
  EXPECT_EQ(render_svg(b), first);
}

TEST(SvgPlot, HandlesEmptyAndSinglePointSeries) {
  LinePlot p;
  p.series.push_back({"no data yet", {}, {}, "", LineDash::solid, MarkerShape::none, 1.8});
  p.series.push_back({"one step", {0.5}, {1.0}, "", LineDash::solid, MarkerShape::none, 1.8});
  const std::string svg = render_svg(p);
  const Element root = parse(svg);
  ASSERT_NE(root, nullptr);
  const auto series = elements(root.get(), "g", "series");
  ASSERT_EQ(series.size(), 2u);
  EXPECT_EQ(series[0]->GetNumberOfNestedElements(), 1);   // its title only
  EXPECT_EQ(elements(series[1], "polyline").size(), 0u);
  EXPECT_EQ(elements(series[1], "circle").size(), 1u);     // the single point as a dot
  const std::vector<std::string> t = texts(root.get());
  EXPECT_TRUE(contains(t, "no data yet"));
  EXPECT_TRUE(contains(t, "one step"));
  // A single value widens by 10 %: x [0.45, 0.55] (width 0.1 within round-off: range 0.2 or 0.1,
  // step 0.05 either way, "0.50"); y [0.9, 1.1] (width 0.2 plus round-off: range 0.5, step 0.1,
  // "1.0").
  EXPECT_TRUE(contains(t, "0.50"));
  EXPECT_TRUE(contains(t, "1.0"));
  expect_only_finite_numbers(root.get(), svg);

  // No series at all: axes over [0, 1], still valid.
  const std::string empty = render_svg(LinePlot{});
  const Element empty_root = parse(empty);
  ASSERT_NE(empty_root, nullptr);
  EXPECT_TRUE(elements(empty_root.get(), "g", "series").empty());
  EXPECT_TRUE(elements(empty_root.get(), "g", "legend").empty());
  expect_only_finite_numbers(empty_root.get(), empty);
}

TEST(SvgPlot, NeverWritesNonFiniteNumbers) {
  const double nan = std::numeric_limits<double>::quiet_NaN(), inf = std::numeric_limits<double>::infinity();
  LinePlot p;
  p.series.push_back({"broken", {0, 1, 2, 3, 4, 5, 6}, {0, 1, 2, nan, 4, 5, 6}, "", LineDash::solid,
                      MarkerShape::square, 1.8});
  p.series.push_back({"isolated", {0, 1, 2}, {inf, 3, -inf}, "", LineDash::dotted, MarkerShape::none, 1.0});
  // Beyond 1e300 counts as not drawable (the auto range would overflow): (2, 1) is left alone.
  p.series.push_back(
      {"huge", {0, 1, 2}, {1.7e308, -1.7e308, 1.0}, "", LineDash::solid, MarkerShape::none, 1.0});
  p.reference_lines.push_back({LineOrientation::horizontal, nan, "not drawn", "#555555", LineDash::dashed});
  p.point_labels.push_back({inf, 1.0, "not drawn either", "#111111", MarkerShape::circle});
  const std::string svg = render_svg(p);
  const Element root = parse(svg);
  ASSERT_NE(root, nullptr);
  const auto series = elements(root.get(), "g", "series");
  ASSERT_EQ(series.size(), 3u);
  EXPECT_EQ(elements(series[0], "polyline").size(), 2u);   // the NaN breaks the line in two
  EXPECT_EQ(elements(series[0], "rect").size(), 6u);       // a marker at each finite point
  EXPECT_EQ(elements(series[1], "polyline").size(), 0u);
  EXPECT_EQ(elements(series[1], "circle").size(), 1u);     // (1, 3) alone, as a dot
  EXPECT_EQ(elements(series[2], "polyline").size(), 0u);
  EXPECT_EQ(elements(series[2], "circle").size(), 1u);
  EXPECT_TRUE(elements(root.get(), "g", "reference").empty());
  EXPECT_TRUE(elements(root.get(), "g", "point").empty());
  expect_only_finite_numbers(root.get(), svg);
}

TEST(SvgPlot, ClipsDataToExplicitAxisLimits) {
  // Axis box x 0 .. 1 maps to px 0 + left margin .. 720 - 20 = 700; the segment (0, 0) -> (2, 2)
  // leaves it at (1, 1), the top right corner; (1e300, 1e300) is far outside.
  LinePlot p;
  p.options.x_min = 0.0;
  p.options.x_max = 1.0;
  p.options.y_min = 0.0;
  p.options.y_max = 1.0;
  p.options.legend = LegendPlacement::none;
  p.series.push_back(
      {"", {0.0, 2.0, 1e300}, {0.0, 2.0, 1e300}, "", LineDash::solid, MarkerShape::circle, 1.8});
  p.reference_lines.push_back({LineOrientation::vertical, 1.5, "outside", "#555555", LineDash::dashed});
  const std::string svg = render_svg(p);
  const Element root = parse(svg);
  ASSERT_NE(root, nullptr);
  const auto lines = elements(root.get(), "polyline");
  ASSERT_EQ(lines.size(), 1u);
  const std::string points = lines[0]->GetAttribute("points");
  EXPECT_EQ(points.substr(points.rfind(' ') + 1), "700.00,16.00") << points;  // top right corner
  EXPECT_EQ(elements(root.get(), "circle").size(), 1u);  // markers only inside the box
  EXPECT_TRUE(elements(root.get(), "g", "reference").empty());
  expect_only_finite_numbers(root.get(), svg);
}

TEST(SvgPlot, ChoosesNiceTicks) {
  // [0, 7.3], 6 ticks: range nicenum(7.3) = 10, step nicenum(2) = 2, axis 0 .. 8.
  AxisTicks t = nice_ticks(0.0, 7.3, 6, true);
  EXPECT_EQ(t.step, 2.0);
  EXPECT_EQ(t.lo, 0.0);
  EXPECT_EQ(t.hi, 8.0);
  EXPECT_EQ(t.values, (std::vector<double>{0, 2, 4, 6, 8}));
  EXPECT_EQ(t.decimals, 0);
  // [105, 543], 5 ticks: range nicenum(438) = 500, step nicenum(125, round) = 100: 100 .. 600.
  t = nice_ticks(105.0, 543.0, 5, true);
  EXPECT_EQ(t.step, 100.0);
  EXPECT_EQ(t.lo, 100.0);
  EXPECT_EQ(t.hi, 600.0);
  // [-0.013, 0.052]: range nicenum(0.065) = 0.1, step 0.02, axis -0.02 .. 0.06, two decimals.
  t = nice_ticks(-0.013, 0.052, 6, true);
  EXPECT_CLOSE(t.step, 0.02, 1e-15, 0.0);
  EXPECT_CLOSE(t.lo, -0.02, 1e-15, 0.0);
  EXPECT_CLOSE(t.hi, 0.06, 1e-15, 0.0);
  EXPECT_EQ(t.values.size(), 5u);
  EXPECT_EQ(t.decimals, 2);
  // Explicit limits are kept: [0, 7] gives step 2 and ticks 0 .. 6 inside.
  t = nice_ticks(0.0, 7.0, 6, false);
  EXPECT_EQ(t.lo, 0.0);
  EXPECT_EQ(t.hi, 7.0);
  EXPECT_EQ(t.values, (std::vector<double>{0, 2, 4, 6}));
  EXPECT_THROW(nice_ticks(1.0, 0.0, 6, true), std::invalid_argument);
}

TEST(SvgPlot, EscapesTextForXml) {
  EXPECT_EQ(escape_xml_text("a<b & \"c\" 'd'>"), "a&lt;b &amp; &quot;c&quot; &apos;d&apos;&gt;");
  EXPECT_EQ(escape_xml_text("θ_u ≥ 3 mrad"), "θ_u ≥ 3 mrad");            // valid UTF-8 kept
  EXPECT_EQ(escape_xml_text("bad\xff"), "bad\xEF\xBF\xBD");                // not UTF-8
  EXPECT_EQ(escape_xml_text("bell\x07"), "bell\xEF\xBF\xBD");              // not an XML 1.0 Char
  EXPECT_EQ(escape_xml_text("\xC0\xAF"), "\xEF\xBF\xBD\xEF\xBF\xBD");      // overlong '/'
  EXPECT_EQ(escape_xml_text("\xED\xA0\x80"), "\xEF\xBF\xBD\xEF\xBF\xBD\xEF\xBF\xBD");  // surrogate
  // The same inputs as labels still give well-formed XML.
  LinePlot p;
  p.options.title = "bad\xff bell\x07 <&>";
  p.series.push_back(
      {"\xC0\xAF name", {0, 1}, {0, 1}, "\"><script>", LineDash::solid, MarkerShape::none, 1.8});
  EXPECT_NE(parse(render_svg(p)), nullptr);
}

TEST(SvgPlot, WritesTheSameSvgToAFileWithADeclaration) {
  const testing::ScratchFolder scratch;
  const LinePlot plot = hinge_like_plot();
  const std::filesystem::path file = scratch / "curve.svg";
  write_svg(plot, file);
  EXPECT_FALSE(std::filesystem::exists(file.string() + ".part"));
  EXPECT_EQ(testing::read_text(file), "<?xml version=\"1.0\" encoding=\"UTF-8\"?>\n" + render_svg(plot));
  EXPECT_THROW(write_svg(plot, scratch / "missing_folder" / "curve.svg"), OutputError);
}

TEST(SvgPlot, PassesXmllintWhenInstalled) {
  // xmllint (Debian package libxml2-utils) is a second parser; CI without it skips this test.
  const std::filesystem::path xmllint = "/usr/bin/xmllint";
  if (!std::filesystem::exists(xmllint)) GTEST_SKIP() << "xmllint not installed";
  const testing::ScratchFolder scratch;
  const std::filesystem::path file = scratch / "curve.svg";
  write_svg(hinge_like_plot(), file);
  const std::string command = xmllint.string() + " --noout '" + file.string() + "'";
  EXPECT_EQ(std::system(command.c_str()), 0) << command;
}

TEST(SvgPlot, RejectsPlotsThatCannotBeDrawn) {
  LinePlot p;
  p.series.push_back({"x and y differ", {0, 1}, {0}, "", LineDash::solid, MarkerShape::none, 1.8});
  EXPECT_THROW(render_svg(p), std::invalid_argument);
  LinePlot q;
  q.options.width = 50;
  EXPECT_THROW(render_svg(q), std::invalid_argument);
  LinePlot r;
  r.options.x_min = 1.0;
  r.options.x_max = 1.0;
  EXPECT_THROW(render_svg(r), std::invalid_argument);
}

}  // namespace
}  // namespace rotcap
