#pragma once
// Cross-section classification of a doubly symmetric I-section in major-axis bending with an
// axial compression, EN 1993-1-1:2005 5.5.2 and Table 5.2 (sheets 1 and 2), eps = sqrt(235/fy).
//
// Parts and widths c (Table 5.2 figures), thickness t:
//   flange outstand in compression (sheet 2), t = tf:
//     rolled  c = (b - tw - 2 r)/2,   welded  c = (b - tw)/2 - sqrt(2) a,
//     limits 9 eps / 10 eps / 14 eps for Classes 1 / 2 / 3;
//   web, internal part in bending and compression (sheet 1), t = tw:
//     rolled  c = h - 2 tf - 2 r,     welded  c = h - 2 tf - 2 sqrt(2) a,
//     Classes 1, 2 with the plastic neutral-axis parameter alpha (the compressed fraction of c):
//       alpha > 0.5: 396 eps/(13 alpha - 1), 456 eps/(13 alpha - 1); else 36 eps/alpha, 41.5 eps/alpha;
//     Class 3 with the elastic stress ratio psi:
//       psi > -1: 42 eps/(0.67 + 0.33 psi);  psi <= -1: 62 eps (1 - psi) sqrt(-psi).
// For n = N / (A fy) (A of the real section, compression positive):
//   alpha = min(1, 1/2 + N / (2 fy tw c))   (web depth N/(fy tw) carries N, centred on the axis);
//   psi   = 2 n - 1                          (web edges at -fy + 2 n fy and fy: the bending
//                                             stress fy (1 - n) about the axial stress n fy).
// n = 0 gives the pure-bending limits 72, 83, 124 eps; n = 1 the pure-compression ones 33, 38, 42.
// A part whose c/t exceeds its Class-3 limit is Class 4; the section's class is the worse part's.

#include "model/section/i_section.hpp"

#include <array>

namespace rotcap {

struct PartClassification {
  double c = 0.0;         ///< compressed width [mm]
  double t = 0.0;         ///< thickness [mm]
  double c_over_t = 0.0;  ///< c / t
  int section_class = 0;  ///< 1 .. 4
  std::array<double, 3> limits{};  ///< c/t limits of Classes 1, 2, 3 used (eps included)
};

struct SectionClassification {
  double epsilon = 0.0;      ///< sqrt(235 / fy)
  double axial_ratio = 0.0;  ///< n = N / (A fy)
  double alpha = 0.0;        ///< web plastic compression fraction, in [0.5, 1]
  double psi = 0.0;          ///< web elastic stress ratio, in [-1, 1]
  PartClassification flange;
  PartClassification web;
  int section_class = 0;     ///< max(flange, web)
};

/// Classifies s for yield strength fy [MPa] (> 0; key "steel.fy") and axial ratio n in [0, 1]
/// (key "member.axial_load_ratio"); throws std::invalid_argument naming the key, or from
/// validate(s).
SectionClassification classify_section(const ISection& s, double fy, double axial_ratio = 0.0);

}  // namespace rotcap
