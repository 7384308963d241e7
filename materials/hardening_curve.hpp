#pragma once
// HardeningCurve: isotropic hardening law of a J2 material, the flow stress sigma_y(epbar) [MPa]
// as a piecewise-linear function of the equivalent plastic strain epbar [-].
//
// Data: points (epbar_i, sigma_i), i = 0 .. m-1, true (Cauchy) stress against logarithmic
// equivalent plastic strain, with
//   epbar_0 = 0,  epbar_i strictly increasing,  sigma_i > 0,
//   sigma_{i+1} >= sigma_i unless Options::allow_softening.
// Between points sigma_y is the linear interpolant. Beyond the last point sigma_y is held
// constant (slope 0): a tensile test gives no information past its last point, and a
// horizontal continuation cannot create stresses the data never reached (extrapolating the last
// slope would, without bound, at the large strains of a buckled plate fold). A single point is an
// elastic-perfectly-plastic material.
// Negative epbar is outside the domain (programmer error: std::invalid_argument).
//
// Evaluation (value, slope, segment) is a binary search over the stored points: no allocation.
// At a breakpoint the slope returned is that of the segment to the right, i.e. the slope the
// material follows when it keeps loading from there.

#include <cstddef>
#include <utility>
#include <vector>

namespace rotcap {

class HardeningCurve {
 public:
  struct Options {
    bool allow_softening = false;  ///< accept sigma_{i+1} < sigma_i (a falling branch)
  };

  /// Point i of the curve.
  struct Point {
    double plastic_strain;  ///< epbar_i [-], >= 0
    double stress;          ///< sigma_i [MPa], > 0
  };

  /// Flow stress and its slope at one epbar.
  struct Value {
    double stress;  ///< sigma_y(epbar) [MPa]
    double slope;   ///< d sigma_y / d epbar [MPa] (right-hand slope at a breakpoint)
  };

  /// Validates the points (see the header comment); throws std::invalid_argument naming the
  /// offending point index and its values.
  HardeningCurve(std::vector<Point> points, const Options& options);
  explicit HardeningCurve(std::vector<Point> points)
      : HardeningCurve(std::move(points), Options{}) {}

  /// Elastic-perfectly-plastic curve, sigma_y = fy for all epbar; fy > 0.
  static HardeningCurve perfectly_plastic(double fy);

  /// sigma_y and d sigma_y/d epbar at epbar >= 0.
  Value evaluate(double epbar) const;
  double flow_stress(double epbar) const { return evaluate(epbar).stress; }
  double slope(double epbar) const { return evaluate(epbar).slope; }

  /// Index i of the segment [epbar_i, epbar_{i+1}) holding epbar; size()-1 beyond the last point.
  std::size_t segment(double epbar) const;

  /// Initial yield stress sigma_0 [MPa].
  double initial_yield_stress() const { return points_.front().stress; }
  /// Smallest flow stress anywhere on the curve [MPa] (a lower bound used by the return map).
  double minimum_stress() const { return minimum_stress_; }
  std::size_t size() const { return points_.size(); }
  const std::vector<Point>& points() const { return points_; }

 private:
  std::vector<Point> points_;
  double minimum_stress_ = 0.0;
};

}  // namespace rotcap
