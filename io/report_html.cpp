#include "io/report_html.hpp"

#include "io/atomic_file.hpp"
#include "io/xml_text.hpp"

#include <cctype>

namespace rotcap {

namespace {

std::string esc(const std::string& s) { return escape_xml_text(s); }

std::string safe_id(const std::string& id) {
  std::string out;
  for (char c : id)
    if (std::isalnum(static_cast<unsigned char>(c)) || c == '-' || c == '_') out += c;
  return out;
}

// Screen: one column of at most 960 px. Print: A4, white backgrounds, nothing split across pages.
const char* kStyle =
    "body{font-family:sans-serif;margin:2em auto;max-width:960px;color:#111;line-height:1.4;padding:0 1em}"
    "h1{font-size:1.6em;margin-bottom:0.2em}h2{font-size:1.25em;border-bottom:1px solid #bbb;margin-top:1.6em}"
    ".subtitle{color:#555;margin:0}.facts{color:#333;margin:0.3em 0 0;font-size:0.92em}"
    ".caution{border:1px solid #b07000;background:#fff6e0;padding:0.6em 0.9em;margin:1em 0}"
    ".boxed{border:2px solid #1b4f9c;padding:0 1em 0.6em;margin-top:1.2em}.boxed h2{border:none;margin-top:0.6em}"
    "table{border-collapse:collapse;margin:0.6em 0}caption{text-align:left;font-weight:bold;padding:0.2em 0}"
    "th,td{border:1px solid #ccc;padding:0.25em 0.6em;text-align:left;vertical-align:top}th{background:#f0f0f0}"
    "pre{background:#f7f7f7;padding:0.6em;overflow-x:auto;font-size:0.85em}"
    "figure{margin:0.8em 0}figcaption{font-size:0.92em;color:#333;margin-top:0.3em}svg{max-width:100%;height:auto}"
    "@page{size:A4 portrait;margin:14mm}"
    "@media print{body{margin:0;max-width:none;padding:0;font-size:10pt}"
    ".caution,.boxed,th,pre{background:none}h2{break-after:avoid}"
    "figure,pre,.caution,tr{break-inside:avoid}.page-break{break-before:page}}";

}  // namespace

std::string render_report_html(const ReportPage& page) {
  std::string h;
  h += "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n<title>" + esc(page.title) +
       "</title>\n<style>" + kStyle + "</style>\n</head>\n<body>\n";
  h += "<h1>" + esc(page.title) + "</h1>\n";
  if (!page.subtitle.empty()) h += "<p class=\"subtitle\">" + esc(page.subtitle) + "</p>\n";
  if (!page.facts.empty()) {
    h += "<p class=\"facts\">";
    for (std::size_t k = 0; k < page.facts.size(); ++k)
      h += (k ? " | " : "") + esc(page.facts[k].first) + ": " + esc(page.facts[k].second);
    h += "</p>\n";
  }
  if (!page.caution.empty()) h += "<div class=\"caution\" id=\"caution-top\">" + esc(page.caution) + "</div>\n";
  for (std::size_t k = 0; k < page.sections.size(); ++k) {
    const ReportSection& s = page.sections[k];
    std::string cls = s.boxed ? "boxed" : "";
    if (s.page_break_before) cls += cls.empty() ? "page-break" : " page-break";
    h += "<section id=\"section-" + std::to_string(k + 1) + "\"" + (cls.empty() ? "" : " class=\"" + cls + "\"") +
         ">\n<h2>" + esc(s.heading) + "</h2>\n";
    for (const std::string& p : s.paragraphs) h += "<p>" + esc(p) + "</p>\n";
    for (const ReportTable& t : s.tables) {
      h += "<table>\n";
      if (!t.caption.empty()) h += "<caption>" + esc(t.caption) + "</caption>\n";
      if (!t.header.empty()) {
        h += "<tr>";
        for (const std::string& c : t.header) h += "<th>" + esc(c) + "</th>";
        h += "</tr>\n";
      }
      for (std::size_t k = 0; k < t.rows.size(); ++k) {
        const auto& row = t.rows[k];
        const std::string link = k < t.row_links.size() ? t.row_links[k] : std::string();
        h += "<tr>";
        for (std::size_t i = 0; i < row.size(); ++i) {
          const ReportCell& c = row[i];
          h += (c.id.empty() ? std::string("<td>") : "<td id=\"" + safe_id(c.id) + "\">") +
               (i == 0 && !link.empty() ? "<a href=\"" + esc(link) + "\">" + esc(c.text) + "</a>" : esc(c.text)) + "</td>";
        }
        h += "</tr>\n";
      }
      h += "</table>\n";
    }
    for (std::size_t f = 0; f < s.figures.size(); ++f) {
      const bool caption = f < s.figure_captions.size() && !s.figure_captions[f].empty();
      h += "<figure>\n" + s.figures[f] + "\n" +
           (caption ? "<figcaption>" + esc(s.figure_captions[f]) + "</figcaption>\n" : "") + "</figure>\n";
    }
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

}  // namespace rotcap
