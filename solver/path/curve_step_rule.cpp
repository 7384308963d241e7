#include "solver/path/curve_step_rule.hpp"

#include "core/check.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>

namespace rotcap {

CurveStepRule::CurveStepRule(Eigen::VectorXd weights, double elastic_value, CurveStepOptions options)
    : weights_(std::move(weights)), elastic_value_(elastic_value), options_(options) {
  ROTCAP_CHECK(std::isfinite(elastic_value_) && elastic_value_ != 0.0,
               "curve step rule: the monitored quantity has no elastic response to the reference load");
}

CurveChord CurveStepRule::chord(const Eigen::VectorXd& Du, double dlambda) const {
  return {weights_.dot(Du) / elastic_value_, dlambda};
}

double CurveStepRule::size_factor(const CurveChord& step, const CurveChord& previous) const {
  double f = options_.growth;
  const double p = plastic_increment(step);
  if (p > 0.0) f = std::min(f, options_.plastic_step / p);
  if (previous.valid() && step.valid()) {
    const double turn = std::abs(std::remainder(std::atan2(step.dy, step.dx) - std::atan2(previous.dy, previous.dx),
                                                2.0 * std::numbers::pi)) * 180.0 / std::numbers::pi;
    if (turn > 0.0) f = std::min(f, options_.turning_step / turn);
  }
  return std::max(f, options_.shrink);
}

bool CurveStepRule::too_large(const CurveChord& step, double& retry_factor) const {
  const double p = plastic_increment(step);
  if (!(p > options_.reject_ratio * options_.plastic_step)) return false;
  retry_factor = std::max(options_.shrink, 0.9 * options_.plastic_step / p);
  return true;
}

}  // namespace rotcap
