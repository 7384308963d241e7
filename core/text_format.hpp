#pragma once
// The one number formatter of the program: printf formats for messages, logs and reports, and
// the %.10g form that messages use for values found in input.
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

/// %.10g ("355", "0.0001", "2.5e+06"): values quoted in messages.
inline std::string format_number(double value) { return format_text("%.10g", value); }

}  // namespace rotcap
