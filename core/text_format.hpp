#pragma once
// The one number formatter of the program: printf formats for messages, logs and reports, and
// the %.10g form that messages use for values found in input.
#include <charconv>
#include <cstdio>
#include <string>

namespace rotcap {

/// printf-style formatting into a std::string (any length).
template <class... Args>
std::string format_text(const char* format, Args... args) {
  const int n = std::snprintf(nullptr, 0, format, args...);
  if (n <= 0) return {};
  std::string out(static_cast<std::size_t>(n) + 1, '\0');
  std::snprintf(out.data(), out.size(), format, args...);
  out.resize(static_cast<std::size_t>(n));
  return out;
}

/// Fixed-point text with `decimals` digits after the point, locale independent (std::to_chars);
/// "-0.00" is printed as "0.00". For drawing coordinates and tick labels.
inline std::string format_fixed(double value, int decimals) {
  char buf[352];
  const auto res = std::to_chars(buf, buf + sizeof buf, value, std::chars_format::fixed, decimals);
  std::string s(buf, res.ptr);
  if (!s.empty() && s.front() == '-' && s.find_first_not_of("-0.") == std::string::npos) s.erase(0, 1);
  return s;
}

/// %.10g ("355", "0.0001", "2.5e+06"): values quoted in messages.
inline std::string format_number(double value) { return format_text("%.10g", value); }

}  // namespace rotcap
