// report.html: one self-contained page, escaped text, the mesh picture.
#include "io/report_html.hpp"
#include "tests/test_support.hpp"

#include <regex>

namespace rotcap {
namespace {

ReportPage sample_page() {
  ReportPage p;
  p.title = "Beam <A> & \"B\"";
  p.caution = "check it";
  ReportSection s;
  s.heading = "Results";
  s.paragraphs.push_back("R = 3.2 < 4");
  ReportTable t;
  t.header = {"quantity", "value"};
  t.rows.push_back({{"M_max [kNm]", ""}, {"412.50", "m-max"}});
  s.tables.push_back(t);
  s.figures.push_back("<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"10\" height=\"10\"></svg>");
  p.sections.push_back(s);
  return p;
}

TEST(ReportHtml, IsOneSelfContainedDocument) {
  const std::string h = render_report_html(sample_page());
  EXPECT_EQ(h.rfind("<!DOCTYPE html>", 0), 0u);
  EXPECT_NE(h.find("</html>"), std::string::npos);
  // No external resource: no script, link, img, iframe, import, and no URL other than the SVG namespace.
  for (const char* banned : {"<script", "<link", "<img", "<iframe", "@import", "src=", "href="})
    EXPECT_EQ(h.find(banned), std::string::npos) << banned;
  const std::regex url("https?://");
  std::string rest = h;
  const std::string ns = "http://www.w3.org/2000/svg";
  for (std::size_t at; (at = rest.find(ns)) != std::string::npos;) rest.erase(at, ns.size());
  EXPECT_FALSE(std::regex_search(rest, url));
  EXPECT_NE(h.find("<td id=\"m-max\">412.50</td>"), std::string::npos);
  EXPECT_NE(h.find("id=\"section-1\""), std::string::npos);
  EXPECT_EQ(render_report_html(sample_page()), h);  // deterministic
}

TEST(ReportHtml, EscapesText) {
  const std::string h = render_report_html(sample_page());
  EXPECT_NE(h.find("Beam &lt;A&gt; &amp; &quot;B&quot;"), std::string::npos);
  EXPECT_NE(h.find("R = 3.2 &lt; 4"), std::string::npos);
}

TEST(MeshPicture, DrawsOnePolygonPerQuadAndAColourBar) {
  MeshPicture m;
  m.points = {{0, 0, 0}, {1, 0, 0}, {1, 1, 0}, {0, 1, 0}, {2, 0, 0}, {2, 1, 0}};
  m.quads = {{0, 1, 2, 3}, {1, 4, 5, 2}};
  m.values = {0, 1, 2, 3, 4, 5};
  m.field_name = "|uy| [mm]";
  const std::string s = render_mesh_svg(m);
  std::size_t polygons = 0;
  for (std::size_t at = 0; (at = s.find("<polygon", at)) != std::string::npos; ++at) ++polygons;
  EXPECT_EQ(polygons, 2u);
  EXPECT_NE(s.find("|uy| [mm]"), std::string::npos);
  EXPECT_NE(s.find(">5<"), std::string::npos);  // the field's maximum on the colour bar
  m.quads.push_back({0, 1, 2, 9});
  EXPECT_THROW(render_mesh_svg(m), std::invalid_argument);
}

}  // namespace
}  // namespace rotcap
