#pragma once
// A multilinear M - theta_plastic hinge law fitted to a computed moment-rotation curve, for frame
// analysis (an elastic branch of slope k_el followed by this law).
//
// Input: the shell curve (theta_j, M_j) in path order [rad, N mm], Mp [N mm], k_el [N mm/rad].
// Plastic rotation: theta_pl,j = theta_j - M_j / k_el, made non-decreasing by a running maximum
// (the fit of k_el leaves tiny negative values in the elastic range; a snap-back in theta would
// need a law that is not a function of theta_pl and is flattened the same way), in normalised
// coordinates u = theta_pl / theta_p (theta_p = Mp / k_el), v = M / Mp.
//
// Points of the law (the rule):
//   1. elastic limit: the last point before the peak with theta_pl <= elastic_limit theta_p (the
//      departure from the linear branch); the law starts there at theta_pl = its theta_pl;
//   2. the peak (the largest M) is always kept;
//   3. between them, and from the peak to the last point of the run, Douglas-Peucker
//      simplification (Douglas & Peucker, Cartographica 10(2), 1973, 112-122) with the distance
//      |v_chord(u_j) - v_j| / v_j, the moment error of point j relative to its moment, and the
//      tolerance `tolerance` (< bound).
// Bound: the law is linear between its points and so is the curve between its points, so the
// largest deviation over the covered range [first point, last point] is reached at a curve point;
// DP keeps every curve point within tolerance, hence within `bound`. The deviation is checked
// again in code over all covered points (max_deviation, within_bound) — the check the report
// quotes. Points with equal u (a vertical step of the curve in theta_pl) are compared with the
// first of them.
// Labels: "elastic_limit", "hardening" (before the peak), "peak", "softening" (after), "end".

#include "model/hinge/hinge_curve.hpp"

#include <span>
#include <string>
#include <vector>

namespace rotcap {

struct FittedLawOptions {
  double tolerance = 0.025;      ///< DP tolerance on the relative moment error, 0 < tol <= bound
  double bound = 0.03;           ///< the guaranteed bound, checked, 0 < bound < 1
  double elastic_limit = 0.01;   ///< theta_pl / theta_p that still counts as elastic, >= 0
};

struct FittedLawPoint {
  double theta_plastic = 0.0;  ///< [rad]
  double moment = 0.0;         ///< [N mm]
  std::string kind;            ///< see the header comment
  std::size_t curve_index = 0; ///< index of the curve point it was taken from
};

struct FittedHingeLaw {
  std::vector<FittedLawPoint> points;  ///< theta_plastic non-decreasing
  double theta_p = 0.0;                ///< Mp / k_el [rad]
  double max_deviation = 0.0;          ///< max |M_law - M| / M over the covered curve points
  double theta_plastic_at_max_deviation = 0.0;  ///< [rad]
  std::size_t points_checked = 0;
  bool within_bound = false;
  std::string message;                 ///< one line quoting the numbers
};

/// Fits the law (see the header comment). Throws std::invalid_argument for fewer than 3 curve
/// points, mp or k_el not positive, non-finite values, or options out of range.
FittedHingeLaw fit_hinge_law(std::span<const MomentRotationPoint> curve, double mp, double k_el,
                             const FittedLawOptions& options = {});

/// M of the law at theta_plastic by linear interpolation (the first point's moment below it, the
/// last point's beyond it).
double fitted_law_moment(const FittedHingeLaw& law, double theta_plastic);

/// The law as an M-theta curve (theta = theta_pl + M / k_el), preceded by (0, 0).
std::vector<MomentRotationPoint> fitted_law_curve(const FittedHingeLaw& law, double k_el);

}  // namespace rotcap
