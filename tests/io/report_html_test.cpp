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

TEST(ReportHtml, ShowsHeaderFactsResultBoxAndFigureCaptions) {
  ReportPage p = sample_page();
  p.facts = {{"program", "rotcap 0.1.0"}, {"run", "2026-12-03 08:00 UTC"}};
  p.sections[0].boxed = true;
  p.sections[0].figure_captions = {"M against θ [kNm, mrad]"};
  ReportSection later;
  later.heading = "Deformed hinge zone";
  later.page_break_before = true;
  p.sections.push_back(later);
  const std::string h = render_report_html(p);
  EXPECT_NE(h.find("<p class=\"facts\">program: rotcap 0.1.0 | run: 2026-12-03 08:00 UTC</p>"), std::string::npos);
  EXPECT_NE(h.find("<section id=\"section-1\" class=\"boxed\">"), std::string::npos);
  EXPECT_NE(h.find("<section id=\"section-2\" class=\"page-break\">"), std::string::npos);
  EXPECT_NE(h.find("</svg>\n<figcaption>M against θ [kNm, mrad]</figcaption>\n</figure>"), std::string::npos);
  // The caution comes before the first section and again at the end.
  EXPECT_LT(h.find("id=\"caution-top\""), h.find("id=\"section-1\""));
  EXPECT_GT(h.find("id=\"caution-end\""), h.find("id=\"section-2\""));
}

TEST(ReportHtml, PrintStylesheetIsA4WithoutBackgroundsOrSplitFigures) {
  const std::string h = render_report_html(sample_page());
  EXPECT_NE(h.find("@page{size:A4 portrait;margin:14mm}"), std::string::npos);
  const std::size_t print = h.find("@media print{");
  ASSERT_NE(print, std::string::npos);
  const std::string rules = h.substr(print, h.find("</style>") - print);
  EXPECT_NE(rules.find(".caution,.boxed,th,pre{background:none}"), std::string::npos);
  EXPECT_NE(rules.find("figure"), std::string::npos);
  EXPECT_NE(rules.find("break-inside:avoid"), std::string::npos);
  EXPECT_NE(rules.find(".page-break{break-before:page}"), std::string::npos);
}

}  // namespace
}  // namespace rotcap
