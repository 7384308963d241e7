#include "io/xml_text.hpp"

namespace rotcap {

namespace {
constexpr const char* kReplacement = "\xEF\xBF\xBD";  // U+FFFD in UTF-8
}  // namespace

std::string escape_xml_text(std::string_view s) {
  std::string out;
  out.reserve(s.size());
  for (std::size_t i = 0; i < s.size();) {
    const unsigned char c = static_cast<unsigned char>(s[i]);
    if (c < 0x80) {
      switch (c) {
        case '&': out += "&amp;"; break;
        case '<': out += "&lt;"; break;
        case '>': out += "&gt;"; break;
        case '"': out += "&quot;"; break;
        case '\'': out += "&apos;"; break;
        default:
          // XML 1.0 Char: #x9 | #xA | #xD | [#x20-#xD7FF] | [#xE000-#xFFFD] | [#x10000-#x10FFFF]
          if (c < 0x20 && c != 0x09 && c != 0x0A && c != 0x0D) out += kReplacement;
          else out += static_cast<char>(c);
      }
      ++i;
      continue;
    }
    // A multi-byte UTF-8 sequence (RFC 3629): lead byte, continuation bytes, no overlong form,
    // no surrogate, <= U+10FFFF, and an XML Char (not U+FFFE / U+FFFF).
    const std::size_t len = c >= 0xF0 ? 4 : c >= 0xE0 ? 3 : c >= 0xC0 ? 2 : 0;
    char32_t cp = len == 4 ? (c & 0x07) : len == 3 ? (c & 0x0F) : (c & 0x1F);
    bool ok = len != 0 && c < 0xF5 && i + len <= s.size();
    for (std::size_t k = 1; ok && k < len; ++k) {
      const unsigned char d = static_cast<unsigned char>(s[i + k]);
      ok = (d & 0xC0) == 0x80;
      cp = (cp << 6) | (d & 0x3F);
    }
    const char32_t min_cp = len == 4 ? 0x10000 : len == 3 ? 0x800 : 0x80;
    ok = ok && cp >= min_cp && cp <= 0x10FFFF && !(cp >= 0xD800 && cp <= 0xDFFF) && cp != 0xFFFE &&
         cp != 0xFFFF;
    if (ok) {
      out.append(s.substr(i, len));
      i += len;
    } else {
      out += kReplacement;
      ++i;  // resynchronise on the next byte
    }
  }
  return out;
}

}  // namespace rotcap
