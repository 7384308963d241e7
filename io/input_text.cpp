#include "io/input_text.hpp"

#include <algorithm>
#include <cctype>
#include <cstdio>
#include <vector>

namespace rotcap {

std::string quote(std::string_view text) {
  std::string q = "\"";
  for (char c : text) {
    if (c == '"' || c == '\\') q += '\\';
    q += c;
  }
  return q + "\"";
}

std::string quote_list(std::span<const std::string> names) {
  if (names.empty()) return "(none)";
  std::string s;
  for (std::size_t i = 0; i < names.size(); ++i) {
    if (i > 0) s += (i + 1 == names.size()) ? " or " : ", ";
    s += quote(names[i]);
  }
  return s;
}

int edit_distance(std::string_view a, std::string_view b) {
  // Wagner-Fischer dynamic programme over one row.
  std::vector<int> row(b.size() + 1);
  for (std::size_t j = 0; j <= b.size(); ++j) row[j] = static_cast<int>(j);
  for (std::size_t i = 1; i <= a.size(); ++i) {
    int diagonal = row[0];
    row[0] = static_cast<int>(i);
    for (std::size_t j = 1; j <= b.size(); ++j) {
      const int above = row[j];
      const bool same = std::tolower(static_cast<unsigned char>(a[i - 1])) ==
                        std::tolower(static_cast<unsigned char>(b[j - 1]));
      row[j] = std::min({above + 1, row[j - 1] + 1, diagonal + (same ? 0 : 1)});
      diagonal = above;
    }
  }
  return row[b.size()];
}

std::string nearest_name(std::string_view name, std::span<const std::string> candidates) {
  std::string best;
  int best_distance = 3;
  for (const std::string& c : candidates) {
    const int d = edit_distance(name, c);
    if (d < best_distance && d < static_cast<int>(c.size())) {
      best = c;
      best_distance = d;
    }
  }
  return best;
}

std::string did_you_mean(std::string_view name, std::span<const std::string> candidates) {
  const std::string best = nearest_name(name, candidates);
  return best.empty() ? std::string() : " (did you mean " + quote(best) + "?)";
}

}  // namespace rotcap
