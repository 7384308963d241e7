#pragma once
// Hinge-curve extraction: the numbers reported for a converged moment-rotation curve
// (docs/spec/interface.md, "Definitions the numbers follow"; docs/spec/mechanics.md, "Numbers the program reports").
// Everything is found by interpolation between converged steps, never by picking a step.
//
// Input: the curve as points (theta_j, M_j), j = 0 .. n-1, in the order the path follower
// converged them; theta the hinge rotation [rad], M the hinge moment [N mm], both oriented so
// that the curve rises into positive values (the caller flips a hogging sign). Point 0 is the
// unloaded state, normally (0, 0). theta need not increase monotonically (a snap-back is allowed);
// every crossing below is the first one in path order.
//
// Definitions:
//  - k_el [N mm/rad]: least squares through the origin, k_el = sum theta_j M_j / sum theta_j^2,
//    over the leading run of points j = 1, 2, ... with M_j <= elastic_fraction * Mel (the run ends
//    at the first point above; points of a later falling branch never enter). When that run holds
//    no point with theta != 0 (coarse first step), the first point with theta != 0 is used alone.
//    No such point, or k_el <= 0: k_el and theta_p are absent and so is R.
//  - theta_p = Mp / k_el; theta_p_beam (beam theory, given by the caller) is echoed beside it.
//  - Peak: i = index of the largest M (the first one on ties). The parabola through points
//    i-1, i, i+1 gives M_max and theta_at_m_max at its vertex (the three-point parabola vertex of
//    Press et al., Numerical Recipes, 2nd ed. 1992, section 10.2, eq. 10.2.1 as cited from
//    memory; written here about the middle point, see the .cpp). Guard, the
//    largest point itself is used instead (PeakMethod::largest_point) when: n < 3; i is the
//    first or the last point; theta does not increase strictly over i-1, i, i+1; a neighbour's
//    M equals M_i (flat top); the parabola is not concave; or its vertex lies outside
//    [theta_{i-1}, theta_{i+1}].
//  - The curve for the crossings below is the polyline of the points with the parabola's vertex
//    inserted (between i and the neighbour on its side), so its largest value is M_max.
//  - theta_at_mp: where M first reaches Mp before the peak, interpolated linearly between the two
//    bracketing points.
//  - theta_u: where the falling branch, after the peak, first drops below Mp, interpolated
//    linearly between the two bracketing points. When the curve ends first: theta_u = the last
//    point's theta and rotation_capacity_is_lower_bound = true.
//  - R = rotation_capacity = theta_u / theta_p - 1.
//  - M_max < Mp: status below_mp, theta_at_mp, theta_u and R absent: the section does not reach
//    its plastic moment.
//
// Errors (a caller's bug): std::invalid_argument for an empty curve, a non-finite value, Mp or
// Mel not positive, a non-finite theta_p_beam, or an option out of range (message names it).

#include <cstddef>
#include <optional>
#include <span>
#include <string>

namespace rotcap {

struct MomentRotationPoint {
  double theta = 0.0;   ///< hinge rotation [rad]
  double moment = 0.0;  ///< hinge moment [N mm]
};

struct HingeCurveOptions {
  /// Leading points with M <= elastic_fraction * Mel enter the fit of k_el; 0 < value <= 1.
  double elastic_fraction = 0.5;
};

enum class HingeCurveStatus {
  falls_back_to_mp,  ///< M_max >= Mp and the falling branch drops back below Mp: R is final
  ends_above_mp,     ///< M_max >= Mp, the curve ends above Mp: theta_u = last theta, R a lower bound
  below_mp,          ///< M_max < Mp: no theta_at_mp, theta_u or R
};

enum class PeakMethod {
  parabola,       ///< vertex of the parabola through the largest point and its neighbours
  largest_point,  ///< the largest point itself (a guard case; see the header comment)
};

struct HingeCurveResult {
  HingeCurveStatus status = HingeCurveStatus::below_mp;
  std::string message;  ///< one line for the log and the report, quoting the numbers

  double mp = 0.0;                     ///< plastic moment used [N mm] (echo)
  double mel = 0.0;                    ///< elastic moment used [N mm] (echo)
  std::optional<double> k_el;          ///< initial slope [N mm/rad]; absent: see the header
  std::size_t k_el_points = 0;         ///< points with theta != 0 in the fit of k_el
  /// k_el from the first point alone, above elastic_fraction * Mel: a secant, so theta_p (and R) lean
  /// on the first step's size; the message says so.
  bool k_el_from_first_point_above_limit = false;
  std::optional<double> theta_p;       ///< Mp / k_el [rad]
  double theta_p_beam = 0.0;           ///< beam-theory theta_p [rad] (echo)

  double m_max = 0.0;                  ///< peak moment [N mm]
  double theta_at_m_max = 0.0;         ///< rotation at the peak [rad]
  std::size_t peak_index = 0;          ///< index of the largest point
  PeakMethod peak_method = PeakMethod::largest_point;

  std::optional<double> theta_at_mp;   ///< first reaching Mp on the rising branch [rad]
  std::optional<double> theta_u;       ///< falling branch back at Mp, or the last theta [rad]
  std::optional<double> rotation_capacity;     ///< R = theta_u / theta_p - 1
  bool rotation_capacity_is_lower_bound = false;  ///< true when the curve ended above Mp

  bool reaches_mp() const { return status != HingeCurveStatus::below_mp; }
};

/// Extracts k_el, theta_p, the peak, theta_at_mp, theta_u and R from curve (see the header
/// comment). mp, mel > 0 [N mm]; theta_p_beam [rad] finite.
HingeCurveResult extract_hinge_curve(std::span<const MomentRotationPoint> curve, double mp,
                                     double mel, double theta_p_beam,
                                     const HingeCurveOptions& options = {});

struct LawComparisonOptions {
  /// The curve is "below" the law where M < M_law - fraction * scale, 0 <= fraction < 1.
  double fraction = 0.05;
  /// scale = reference_moment when > 0 (a fixed band, e.g. Mp); 0: scale = M_law(theta) (a band
  /// relative to the law). Must be >= 0 and finite.
  double reference_moment = 0.0;
  /// Only rotations theta >= from_theta are compared (e.g. past the elastic-plastic knee).
  double from_theta = 0.0;
};

/// The first rotation, in path order along curve, at which curve falls below law by more than
/// the band of options, interpolated linearly between the bracketing points. law (>= 2 points,
/// theta strictly increasing, all finite) is interpolated linearly and not extrapolated: only
/// rotations within [law.front().theta, law.back().theta] are compared. Between the breakpoints of
/// both curves the difference is linear, so the crossing found is exact for the two polylines.
/// When the first compared point is already below, its theta is returned. Absent when the curve
/// never falls below within the compared range. Throws std::invalid_argument for bad input.
std::optional<double> theta_first_below_law(std::span<const MomentRotationPoint> curve,
                                            std::span<const MomentRotationPoint> law,
                                            const LawComparisonOptions& options = {});

}  // namespace rotcap
