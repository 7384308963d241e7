#include "io/colour_map.hpp"

#include "core/text_format.hpp"

#include <algorithm>
#include <array>
#include <cmath>

namespace rotcap {

namespace {

// Ten samples of viridis at t = k / 9, as tabulated by the viridis colour map of matplotlib
// (S. van der Walt and N. Smith, 2015, "mpl-colormaps", public domain / CC0) and reproduced by the
// R package viridisLite's viridis(10). Written down from memory; every entry is within a few units
// of the published 256-entry table, which is far below what the eye separates in a 16 px bar.
constexpr std::array<std::array<int, 3>, 10> kViridis{{{0x44, 0x01, 0x54},
                                                       {0x48, 0x28, 0x78},
                                                       {0x3e, 0x49, 0x89},
                                                       {0x31, 0x68, 0x8e},
                                                       {0x26, 0x82, 0x8e},
                                                       {0x1f, 0x9e, 0x89},
                                                       {0x35, 0xb7, 0x79},
                                                       {0x6e, 0xce, 0x58},
                                                       {0xb5, 0xde, 0x2b},
                                                       {0xfd, 0xe7, 0x25}}};

}  // namespace

Rgb viridis(double t) {
  t = std::clamp(std::isfinite(t) ? t : 0.0, 0.0, 1.0) * (kViridis.size() - 1);
  const std::size_t i = std::min(kViridis.size() - 2, static_cast<std::size_t>(t));
  const double f = t - static_cast<double>(i);
  auto mix = [&](int c) {
    return static_cast<int>(std::lround(kViridis[i][c] + f * (kViridis[i + 1][c] - kViridis[i][c])));
  };
  return {mix(0), mix(1), mix(2)};
}

std::string colour_hex(const Rgb& c) { return format_text("#%02x%02x%02x", c.r, c.g, c.b); }

double relative_luminance(const Rgb& c) {
  // sRGB transfer inverted (IEC 61966-2-1), then the Rec. 709 luminance weights.
  auto linear = [](int v) {
    const double s = v / 255.0;
    return s <= 0.04045 ? s / 12.92 : std::pow((s + 0.055) / 1.055, 2.4);
  };
  return 0.2126 * linear(c.r) + 0.7152 * linear(c.g) + 0.0722 * linear(c.b);
}

}  // namespace rotcap
