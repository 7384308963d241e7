#include "model/hinge/rotation_demand.hpp"

#include "core/check.hpp"
#include "core/text_format.hpp"

namespace rotcap {

DemandCheck check_rotation_demand(const RotationDemand& d, const HingeCurveResult& r) {
  ROTCAP_CHECK(r.theta_p.has_value() && *r.theta_p > 0.0, "an extraction without theta_p");
  ROTCAP_CHECK(d.required > 0.0, "a demand of " + format_number(d.required));
  const double theta_p = *r.theta_p;
  const bool rotation = d.kind == RotationDemand::Kind::plastic_rotation;
  DemandCheck c;
  c.required_theta_u = rotation ? theta_p + d.required : theta_p * (1.0 + d.required);
  const auto text = [&](double v) {
    return rotation ? format_text("%.1f mrad", 1e3 * v) : format_text("R = %.2f", v);
  };
  if (r.theta_u) c.available = rotation ? *r.theta_u - theta_p : *r.rotation_capacity;
  if (!c.available) {
    c.verdict = "not met";
    c.note = "the hinge does not reach Mp (M_max = " + format_text("%.3f", r.m_max / r.mp) +
             " Mp): no plastic rotation is available at Mp; required " + text(d.required);
    return c;
  }
  c.margin = *c.available - d.required;
  const bool enough = *c.available >= d.required;
  if (r.rotation_capacity_is_lower_bound && !enough) {
    c.verdict = "not shown";
    c.note = "available at least " + text(*c.available) + " (the run stopped above Mp), required " +
             text(d.required) + ": run further (a larger [analysis] max_rotation) to decide";
    return c;
  }
  c.verdict = enough ? "met" : "not met";
  c.note = "available " + std::string(r.rotation_capacity_is_lower_bound ? "at least " : "") + text(*c.available) +
           ", required " + text(d.required) + ", margin " +
           (rotation ? format_text("%+.1f mrad", 1e3 * *c.margin) : format_text("%+.2f", *c.margin));
  return c;
}

}  // namespace rotcap
