#include "model/section/section_table.hpp"

#include <cctype>
#include <cstring>

namespace rotcap {

namespace {

// Upper case, without spaces, hyphens and underscores: "he 300-a" -> "HE300A".
std::string squeeze(const std::string& text) {
  std::string out;
  for (unsigned char c : text)
    if (!std::isspace(c) && c != '-' && c != '_') out.push_back(static_cast<char>(std::toupper(c)));
  return out;
}

// A size of one to five digits (so std::stoi cannot overflow).
bool all_digits(const std::string& s) {
  if (s.empty() || s.size() > 5) return false;
  for (unsigned char c : s)
    if (!std::isdigit(c)) return false;
  return true;
}

// Canonical "FAMILY SIZE" for an accepted spelling, or "" if the text is not one:
// IPE300, HEA300, HEB300, HE300A, HE300B (after squeeze()).
std::string canonical(const std::string& designation) {
  const std::string s = squeeze(designation);
  for (const char* family : {"IPE", "HEA", "HEB"}) {
    const std::size_t n = std::strlen(family);
    if (s.size() > n && s.compare(0, n, family) == 0 && all_digits(s.substr(n)))
      return std::string(family) + " " + std::to_string(std::stoi(s.substr(n)));
  }
  if (s.size() > 3 && s.compare(0, 2, "HE") == 0 && (s.back() == 'A' || s.back() == 'B')) {
    const std::string size = s.substr(2, s.size() - 3);
    if (all_digits(size)) return std::string("HE") + s.back() + " " + std::to_string(std::stoi(size));
  }
  return "";
}

}  // namespace

std::optional<SectionTableRow> find_section_row(const std::string& designation) {
  const std::string name = canonical(designation);
  if (name.empty()) return std::nullopt;
  for (const auto& row : section_table())
    if (name == row.designation) return row;
  return std::nullopt;
}

std::optional<ISection> find_section(const std::string& designation) {
  const auto row = find_section_row(designation);
  if (!row) return std::nullopt;
  ISection s;
  s.designation = row->designation;
  s.h = row->h;
  s.b = row->b;
  s.tw = row->tw;
  s.tf = row->tf;
  s.r = row->r;
  return s;
}

std::vector<std::string> list_sections() {
  std::vector<std::string> names;
  for (const auto& row : section_table()) names.emplace_back(row.designation);
  return names;
}

}  // namespace rotcap
