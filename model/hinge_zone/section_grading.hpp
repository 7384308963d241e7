#pragma once
// The cross-section grid of the hinge-zone mesh (section_grid.hpp): where the node lines of the
// flanges (y) and of the web (z) lie, for the mesh counts of a HingeZoneSpec and its
// tension_coarsening c >= 1 (hinge_zone_mesher.hpp, "Cross-section grid").
//
//   Compression flange: flange_elements equal elements across the width b.
//   Tension flange:     tension_flange_elements(flange_elements, c) elements whose node lines
//                       are a subset of the compression flange's (tension_flange_indices): in
//                       each half, from the web outwards, cells one fine width wide, then cells
//                       two fine widths wide, in pairs (a stiffener plate meets both flanges
//                       through a transition row of 6 quads per pair, hinge_zone_mesher.cpp).
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
/// per half of nf/2 fine cells, the count n nearest (nf/2) / c with nf/2 - n even and
/// n >= nf/4 (so at most half the count: c beyond 2 coarsens the web only), at least 4 in all.
int tension_flange_elements(int nf, double c);

/// The compression flange's node indices k (0..nf, ascending, nf/2 among them) that are the
/// tension flange's n + 1 node lines (n from tension_flange_elements).
std::vector<int> tension_flange_indices(int nf, int n);

/// The web's node lines z [mm], ascending from -zf to +zf (zf = (h - tf) / 2 > 0), for nw >= 1
/// fine elements, coarsening c >= 1, the compression flange (top or bottom) and the neutral axis
/// shift e >= 0 [mm] from mid-depth towards the tension flange (e >= zf: the whole web fine).
std::vector<double> web_lines(double zf, int nw, double c, bool top_in_compression, double e);

/// The grid of a validated spec: top_in_compression from the loading setup, axial force N [N]
/// (compression positive) for the neutral axis.
SectionGrid section_grid(const HingeZoneSpec& spec, bool top_in_compression, double axial_force);

}  // namespace rotcap
