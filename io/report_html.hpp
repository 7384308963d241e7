#pragma once
// ReportPage: one self-contained HTML5 page (report.html) — inline CSS, inline SVG, no script, no
// external resource of any kind (no link, img src, font or URL), so it opens offline and prints.
// No mechanics: the caller hands over text, tables and ready SVG elements.
//
// Contract:
//  - render_report_html() returns the whole document (<!DOCTYPE html> ... </html>), UTF-8;
//    all text is escaped (escape_xml_text of io/svg_plot.hpp); SVG strings are inserted as given
//    (they must be single <svg> elements, e.g. render_svg() or render_mesh_svg() output).
//  - Deterministic: the same page gives the same bytes.
//  - Elements carry ids the tests and readers can rely on: each section gets id="section-<k>"
//    (k from 1 in order), and a table cell can be given an id (ReportCell::id).
// MeshPicture: a deformed shell mesh drawn as SVG polygons, coloured by one nodal field:
//  - points: 3-D coordinates [mm] (already deformed, scaled as the caller wants); quads: node
//    indices; values: one per point (the colour of a quad is the mean of its four values).
//  - projection: rotation about the global z axis by azimuth, then about the screen's horizontal
//    axis by elevation (an orthographic axonometric view, z up), fitted into width x height with
//    equal scales; quads painted far to near by their mean depth (painter's algorithm).
//  - colour map: five-stop blue - cyan - green - yellow - red, linear in the value between the
//    field's min and max; a colour bar with both numbers and the field name is drawn.
//  - Errors: std::invalid_argument for a quad index out of range, values.size() != points.size(),
//    no quads, or non-finite coordinates (message names the item).
// write_report_html: OutputError (io/input_error.hpp) when the file cannot be written.

#include <array>
#include <filesystem>
#include <string>
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
};

struct ReportSection {
  std::string heading;
  std::vector<std::string> paragraphs;  ///< plain text, one <p> each
  std::vector<ReportTable> tables;
  std::vector<std::string> figures;     ///< <svg> elements, drawn after the tables
  std::vector<std::string> preformatted;  ///< monospace blocks (<pre>)
};

struct ReportPage {
  std::string title;
  std::string subtitle;
  std::vector<ReportSection> sections;
  std::string caution;  ///< shown in a box at the top and at the end
};

std::string render_report_html(const ReportPage& page);
void write_report_html(const ReportPage& page, const std::filesystem::path& file);

struct MeshPicture {
  std::vector<std::array<double, 3>> points;
  std::vector<std::array<int, 4>> quads;
  std::vector<double> values;
  std::string field_name;
  double azimuth_deg = -35.0;
  double elevation_deg = 25.0;
  int width = 760;
  int height = 420;
  std::string title;
};

std::string render_mesh_svg(const MeshPicture& picture);

}  // namespace rotcap
