#pragma once
// The cross-section grid of the hinge-zone mesh (section_grid.hpp): where the node lines of the
// flanges (y) and of the web (z) lie, for the mesh counts of a HingeZoneSpec and its
// tension_coarsening c >= 1 (hinge_zone_mesher.hpp, "Cross-section grid").
//
//   Compression flange: flange_elements equal elements across the width b.
//   Tension flange:     tension_flange_elements(flange_elements, c) equal elements (even, >= 4),
//                       or flange_elements where the flanges must match (stiffener plates).
//   Web:                hf = (h - tf) / web_elements, the fine size. From the compression flange
//                       to the plastic neutral axis under the axial load N (at mid-depth shifted
//                       by N / (2 fy tw) towards the tension flange) the target size is hf; past
//                       it the target grows with slope kWebGrowth up to c hf. The nodes lie at
//                       equal increments of phi(s) = int_0^s ds / target(s), s the distance from
//                       the compression flange, with ceil(phi(h - tf)) elements, so no element
//                       exceeds its target and neighbours differ by at most exp(kWebGrowth)
//                       (1.42) apart from round-off.
// c = 1 gives today's uniform grid exactly (equal elements across both flanges and the web).
// Units: mm, N, MPa.

#include "model/hinge_zone/hinge_zone_spec.hpp"
#include "model/hinge_zone/section_grid.hpp"

#include <vector>

namespace rotcap {

inline constexpr double kWebGrowth = 0.35;  ///< slope of the web's target size past the neutral axis

/// Elements across the tension flange for flange_elements nf (even, >= 4) and coarsening c >= 1:
/// nf / c rounded to the nearest even number, at least 4 and at most nf.
int tension_flange_elements(int nf, double c);

/// The web's node lines z [mm], ascending from -zf to +zf (zf = (h - tf) / 2 > 0), for nw >= 1
/// fine elements, coarsening c >= 1, the compression flange (top or bottom) and the neutral axis
/// shift e >= 0 [mm] from mid-depth towards the tension flange (e >= zf: the whole web fine).
std::vector<double> web_lines(double zf, int nw, double c, bool top_in_compression, double e);

/// The grid of a validated spec: top_in_compression from the loading setup, axial force N [N]
/// (compression positive) for the neutral axis, matched_flanges true when both flanges must keep
/// flange_elements (the model has stiffener plates, whose y lines are the flanges').
SectionGrid section_grid(const HingeZoneSpec& spec, bool top_in_compression, double axial_force, bool matched_flanges);

}  // namespace rotcap
