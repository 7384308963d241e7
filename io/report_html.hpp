#pragma once
// ReportPage: one self-contained HTML5 page (report.html) — inline CSS, inline SVG, no script, no
// external resource of any kind (no link, img src, font or URL), so it opens offline and prints.
// The one exception: a table row may link to a file beside the page (ReportTable::row_links, e.g. an
// index page to each case's report); the page itself never loads it.
// No mechanics: the caller hands over text, tables and ready SVG elements.
//
// Contract:
//  - render_report_html() returns the whole document (<!DOCTYPE html> ... </html>), UTF-8;
//    all text is escaped (escape_xml_text of io/svg_plot.hpp); SVG strings are inserted as given
//    (they must be single <svg> elements, e.g. render_svg() or render_mesh_svg() output).
//  - Deterministic: the same page gives the same bytes.
//  - Elements carry ids the tests and readers can rely on: each section gets id="section-<k>"
//    (k from 1 in order), and a table cell can be given an id (ReportCell::id).
//  - Layout: title, subtitle, the header facts on one line ("label: value" joined by " | "), the
//    caution box, the sections in order (a section marked `boxed` is framed as the page's result
//    box), the caution box again. Figures are <figure> elements with an optional <figcaption>.
//  - Print (@media print): A4 portrait, 14 mm margins, white backgrounds, no table, figure or box
//    split across pages, a page break before each section marked page_break_before.
// write_report_html: OutputError (io/input_error.hpp) when the file cannot be written.

#include "io/mesh_picture.hpp"  // the deformed-mesh figure the hinge report inlines

#include <filesystem>
#include <string>
#include <utility>
#include <vector>

namespace rotcap {

struct ReportCell {
  std::string text;
  std::string id;  ///< optional HTML id (letters, digits, '-', '_')
};

struct ReportTable {
  std::string caption;
  std::vector<std::string> header;
  std::vector<std::vector<ReportCell>> rows;
  /// Optional: row_links[k], when not empty, makes the first cell of row k a link to that file
  /// beside the page (a relative path; the page never loads it).
  std::vector<std::string> row_links;
};

struct ReportSection {
  std::string heading;
  std::vector<std::string> paragraphs;  ///< plain text, one <p> each
  std::vector<ReportTable> tables;
  std::vector<std::string> figures;     ///< <svg> elements, drawn after the tables
  std::vector<std::string> preformatted;  ///< monospace blocks (<pre>)
  std::vector<std::string> figure_captions;  ///< caption k belongs to figures[k]; missing or empty: none
  bool boxed = false;                   ///< framed as the result box
  bool page_break_before = false;       ///< printed from a new page
};

struct ReportPage {
  std::string title;
  std::string subtitle;
  std::vector<std::pair<std::string, std::string>> facts;  ///< header line: (label, value)
  std::vector<ReportSection> sections;
  std::string caution;  ///< shown in a box at the top and at the end
};

std::string render_report_html(const ReportPage& page);
void write_report_html(const ReportPage& page, const std::filesystem::path& file);

}  // namespace rotcap
