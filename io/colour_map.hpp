#pragma once
// A perceptually uniform sequential colour map for the report's pictures (viridis).
//
// Contract:
//  - viridis(t) for t in [0, 1] (clamped; NaN gives t = 0) returns an sRGB colour, linear
//    interpolation in sRGB between ten control points at t = k / 9, k = 0 .. 9;
//  - lightness rises monotonically from dark violet (t = 0, #440154) to yellow (t = 1, #fde725),
//    so the order of values survives grey-scale printing and colour-vision deficiency;
//  - colour_hex() gives the lower-case "#rrggbb" text SVG and CSS take.
#include <string>

namespace rotcap {

struct Rgb {
  int r = 0, g = 0, b = 0;  ///< 0 .. 255 each
};

Rgb viridis(double t);
std::string colour_hex(const Rgb& c);

/// Relative luminance of an sRGB colour, 0 (black) .. 1 (white) (WCAG 2 / IEC 61966-2-1 transfer).
double relative_luminance(const Rgb& c);

}  // namespace rotcap
