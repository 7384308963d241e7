#include "model/section/section_class.hpp"
#include "core/text_format.hpp"

#include "materials/steel_curve.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <sstream>
#include <stdexcept>

namespace rotcap {

namespace {

std::string num(double v) { return format_text("%.6g", v); }

// Class of a part from its c/t and the three limits (EN 1993-1-1 5.5.2(6): the lowest class
// whose limit is met; Class 4 beyond the Class-3 limit).
int class_of(double c_over_t, const std::array<double, 3>& limits) {
  for (int k = 0; k < 3; ++k)
    if (c_over_t <= limits[k]) return k + 1;
  return 4;
}

PartClassification part(double c, double t, const std::array<double, 3>& limits) {
  PartClassification p;
  p.c = c;
  p.t = t;
  p.c_over_t = c / t;
  p.limits = limits;
  p.section_class = class_of(p.c_over_t, limits);
  return p;
}

}  // namespace

SectionClassification classify_section(const ISection& s, double fy, double axial_ratio) {
  validate(s);
  require_yield_strength(fy);
  if (!(axial_ratio >= 0.0 && axial_ratio <= 1.0))
    throw std::invalid_argument("member.axial_load_ratio = " + num(axial_ratio) +
                                ": expected 0 <= N/Npl <= 1 (compression positive)");
  SectionClassification out;
  const double eps = std::sqrt(235.0 / fy);  // Table 5.2, sheet 3
  out.epsilon = eps;
  out.axial_ratio = axial_ratio;

  // Widths c between the toes of the fillets (rolled) or of the weld legs sqrt(2) a (welded).
  const bool welded = s.weld_throat > 0.0;
  const double leg = welded ? std::numbers::sqrt2 * s.weld_throat : s.r;
  const double c_flange = 0.5 * (s.b - s.tw) - leg;
  const double c_web = s.h - 2.0 * s.tf - 2.0 * leg;

  // Flange: outstand in compression, Table 5.2 sheet 2.
  out.flange = part(c_flange, s.tf, {9.0 * eps, 10.0 * eps, 14.0 * eps});

  // Web: internal part in bending and compression, Table 5.2 sheet 1.
  const double N = axial_ratio * real_section_properties(s).A * fy;
  const double alpha = std::min(1.0, 0.5 + N / (2.0 * fy * s.tw * c_web));
  const double psi = 2.0 * axial_ratio - 1.0;
  out.alpha = alpha;
  out.psi = psi;
  std::array<double, 3> web_limits{};
  if (alpha > 0.5) {
    web_limits[0] = 396.0 * eps / (13.0 * alpha - 1.0);
    web_limits[1] = 456.0 * eps / (13.0 * alpha - 1.0);
  } else {
    web_limits[0] = 36.0 * eps / alpha;
    web_limits[1] = 41.5 * eps / alpha;
  }
  web_limits[2] = psi > -1.0 ? 42.0 * eps / (0.67 + 0.33 * psi) : 62.0 * eps * (1.0 - psi) * std::sqrt(-psi);
  out.web = part(c_web, s.tw, web_limits);

  out.section_class = std::max(out.flange.section_class, out.web.section_class);
  return out;
}

}  // namespace rotcap
