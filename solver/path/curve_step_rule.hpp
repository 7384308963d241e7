#pragma once
// CurveStepRule: step sizes from the shape of the load-deflection curve of one monitored quantity
// q = c . u (a hinge rotation), instead of from the Newton iteration count.
//
// The curve is taken in the normalised plane x = q / q_el, y = lambda, where q_el is the elastic
// value of q at lambda = 1 (the first predictor's), so the initial elastic branch has slope 1. For a
// hinge whose load factor is M / Mp, x is theta / theta_p and x - y is the plastic rotation over
// theta_p. Each converged step's chord (dx, dy) gives two measures:
//   plastic increment  p = |dx - dy|  (the step's departure from the elastic line: zero on elastic
//                      loading and unloading, the plastic rotation increment / theta_p on a hinge);
//   turning            phi = the angle between this chord and the previous one [degrees].
// The next size is size x f with f = min(growth, p_target / p, phi_target / phi), f >= shrink.
// Rationale (bench/results/step_size_study.txt): the hinge curve depends on the step size to first
// order through the plastic strain path of each step, so the error of a step scales with its plastic
// increment, while elastic steps cost accuracy nothing; the turning limit resolves first yield and
// the peak. A step whose p exceeds reject_ratio x p_target is redone smaller (too_large()).
#include <Eigen/Core>

#include <limits>

namespace rotcap {

struct CurveStepOptions {
  double plastic_step = 0.1;    ///< > 0: p_target, plastic increment per step in units of q_el
  double turning_step = 10.0;   ///< > 0 [degrees]: phi_target, turning of the curve per step
  double growth = 2.0;          ///< > 1: largest size ratio between consecutive steps
  double shrink = 0.25;         ///< in (0, 1): smallest size ratio between consecutive steps
  double reject_ratio = 2.0;    ///< > 1: a step with p > reject_ratio x p_target is redone
  /// Load factor the rising curve approaches (generated hinge models: 1, M = Mp), or NaN (none).
  /// While lambda < 0.9 x rising_limit, a step's predicted load-factor increment is held to half
  /// the remaining rise: the size doubles in the elastic stretch and would otherwise jump far past
  /// the onset of yield, where arc-length then finds no real root and cuts back.
  double rising_limit = std::numeric_limits<double>::quiet_NaN();
};

/// One step of the normalised curve (x = q / q_el, y = lambda).
struct CurveChord {
  double dx = 0.0, dy = 0.0;
  bool valid() const { return dx != 0.0 || dy != 0.0; }
};

class CurveStepRule {
 public:
  /// weights: c over the free DOFs; elastic_value: q_el = c . (K^-1 f_ref) at the start, != 0.
  CurveStepRule(Eigen::VectorXd weights, double elastic_value, CurveStepOptions options);
  /// The normalised chord of a step with displacement increment Du and load-factor increment dlambda.
  CurveChord chord(const Eigen::VectorXd& Du, double dlambda) const;
  /// The plastic increment p of a chord.
  static double plastic_increment(const CurveChord& c) { return std::abs(c.dx - c.dy); }
  /// The factor f for the next step's size after `step` (previous: the step before it, or invalid).
  double size_factor(const CurveChord& step, const CurveChord& previous) const;
  /// True when the step is too large to keep; then `retry_factor` scales its size for the retry.
  bool too_large(const CurveChord& step, double& retry_factor) const;
  double elastic_value() const { return elastic_value_; }

 private:
  Eigen::VectorXd weights_;
  double elastic_value_;
  CurveStepOptions options_;
};

}  // namespace rotcap
