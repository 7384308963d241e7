#pragma once
// The one XML escaper of the writers (SVG, HTML, VTK collections): text and attribute values.
#include <string>
#include <string_view>

namespace rotcap {

/// The text with & < > " ' as entities (safe in element content and in quoted attribute values),
/// characters XML 1.0 does not allow and malformed UTF-8 replaced by U+FFFD.
std::string escape_xml_text(std::string_view text);

}  // namespace rotcap
