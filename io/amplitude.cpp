#include "io/amplitude.hpp"

#include "io/input_text.hpp"

#include <algorithm>
#include <charconv>
#include <cmath>

namespace rotcap {

namespace {
const std::string kBases[] = {"b", "h", "L"};

std::string_view trim(std::string_view s) {
  const auto space = [](char c) { return c == ' ' || c == '\t'; };
  while (!s.empty() && space(s.front())) s.remove_prefix(1);
  while (!s.empty() && space(s.back())) s.remove_suffix(1);
  return s;
}
}  // namespace

std::span<const std::string> amplitude_bases() { return kBases; }

std::optional<Amplitude> parse_amplitude(std::string_view text) {
  const std::size_t slash = text.find('/');
  if (slash == std::string_view::npos) return std::nullopt;
  const std::string_view symbol = trim(text.substr(0, slash));
  const std::string_view number = trim(text.substr(slash + 1));
  if (std::find(std::begin(kBases), std::end(kBases), symbol) == std::end(kBases))
    return std::nullopt;
  double divisor = 0.0;
  const auto [end, ec] = std::from_chars(number.data(), number.data() + number.size(), divisor);
  if (ec != std::errc() || end != number.data() + number.size() || number.empty()) return std::nullopt;
  if (!std::isfinite(divisor) || !(divisor > 0.0)) return std::nullopt;
  Amplitude a;
  a.kind = Amplitude::Kind::ratio;
  a.base = std::string(symbol);
  a.divisor = divisor;
  a.text = std::string(trim(text));
  return a;
}

Amplitude amplitude_mm(double millimetres) {
  Amplitude a;
  a.kind = Amplitude::Kind::millimetres;
  a.millimetres = millimetres;
  a.text = format_number(millimetres);
  return a;
}

}  // namespace rotcap
