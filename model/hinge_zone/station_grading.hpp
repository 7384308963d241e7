#pragma once
// Station grading of the hinge-zone mesh along x (hinge_zone_mesher.hpp, "Node lines along x").
//
// The target element length s(x) is sampled on a fine grid per span between hard points (the
// hard points appear twice, as the end of one span and the start of the next). Node lines are
// placed span by span at equal increments of phi(x) = int dx / s, with ceil(phi_span) elements,
// so no element exceeds the target. Where neighbouring elements still differ by more than
// 1.05 + growth (short spans, rounding), the target is lowered over the larger element to
// (1 + growth) times the smaller one and re-limited to slope growth, and the spans re-placed.

#include <vector>

namespace rotcap {

/// Node lines (ascending x [mm]) through every hard point (sorted, unique, first 0, last L), at
/// h_e [mm] > 0 in [hinge_lo, hinge_hi] and graded outside it with slope `growth` (> 0; element
/// ratio 1 + growth, neighbours accepted up to 1.05 + growth) up to max_size h_e (>= 1)
/// (HingeZoneSpec::far_growth, far_element_length).
std::vector<double> grade_stations(const std::vector<double>& hard, double he, double hinge_lo, double hinge_hi,
                                   double max_size, double growth);

/// Sorted, with points closer than tol merged into the first (points within tol of 0 or L become
/// exactly 0 or L).
std::vector<double> unique_points(std::vector<double> p, double L, double tol);

}  // namespace rotcap
