#include "materials/hardening_curve.hpp"
#include "core/text_format.hpp"

#include <algorithm>
#include <cmath>
#include <sstream>
#include <stdexcept>

namespace rotcap {

namespace {

std::string describe(std::size_t i, const HardeningCurve::Point& p) {
  return format_text("point %zu (plastic strain %.10g, stress %.10g MPa)", i, p.plastic_strain, p.stress);
}

}  // namespace

HardeningCurve::HardeningCurve(std::vector<Point> points, const Options& options)
    : points_(std::move(points)) {
  if (points_.empty())
    throw std::invalid_argument("HardeningCurve: need at least one point, got none");
  if (points_.front().plastic_strain != 0.0)
    throw std::invalid_argument("HardeningCurve: the first plastic strain must be 0; " +
                                describe(0, points_.front()));
  for (std::size_t i = 0; i < points_.size(); ++i) {
    const Point& p = points_[i];
    if (!std::isfinite(p.plastic_strain) || !std::isfinite(p.stress))
      throw std::invalid_argument("HardeningCurve: non-finite value at " + describe(i, p));
    if (!(p.stress > 0.0))
      throw std::invalid_argument("HardeningCurve: stress must be > 0 at " + describe(i, p));
    if (i == 0) continue;
    const Point& q = points_[i - 1];
    if (!(p.plastic_strain > q.plastic_strain))
      throw std::invalid_argument("HardeningCurve: plastic strains must increase strictly, but " +
                                  describe(i, p) + " does not exceed " + describe(i - 1, q));
    if (!options.allow_softening && p.stress < q.stress)
      throw std::invalid_argument("HardeningCurve: negative slope (softening not allowed) from " +
                                  describe(i - 1, q) + " to " + describe(i, p));
  }
  minimum_stress_ = std::min_element(points_.begin(), points_.end(), [](const Point& a,
                                                                         const Point& b) {
                      return a.stress < b.stress;
                    })->stress;
}

HardeningCurve HardeningCurve::perfectly_plastic(double fy) {
  return HardeningCurve(std::vector<Point>{{0.0, fy}});
}

std::size_t HardeningCurve::segment(double epbar) const {
  if (!(epbar >= 0.0))
    throw std::invalid_argument("HardeningCurve: equivalent plastic strain must be >= 0, got " +
                                std::to_string(epbar));
  // First point with plastic_strain > epbar; the segment starts one before it.
  const auto it = std::upper_bound(points_.begin(), points_.end(), epbar,
                                   [](double e, const Point& p) { return e < p.plastic_strain; });
  return static_cast<std::size_t>(it - points_.begin()) - 1;
}

HardeningCurve::Value HardeningCurve::evaluate(double epbar) const {
  const std::size_t i = segment(epbar);
  if (i + 1 == points_.size()) return {points_.back().stress, 0.0};  // held constant beyond
  const Point& a = points_[i];
  const Point& b = points_[i + 1];
  const double slope = (b.stress - a.stress) / (b.plastic_strain - a.plastic_strain);
  return {a.stress + slope * (epbar - a.plastic_strain), slope};
}

}  // namespace rotcap
