#include "materials/steel_curve.hpp"

#include "core/check.hpp"
#include "core/option_error.hpp"
#include "core/text_format.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>

namespace rotcap {

namespace {

[[noreturn]] void fail(const std::string& message) { throw std::invalid_argument(message); }

[[noreturn]] void reject(const std::string& key, double found, const std::string& expected) {
  throw OptionError(key, format_number(found), expected);
}

void require_elastic_constants(const SteelModel& s) {
  if (!(s.E > 0.0) || !std::isfinite(s.E)) reject("steel.E", s.E, "E > 0 [MPa]");
  if (!(s.nu >= 0.0 && s.nu < 0.5)) reject("steel.nu", s.nu, "0 <= nu < 0.5");
}

void require_strengths(const SteelModel& s, bool fu_strictly_above) {
  require_yield_strength(s.fy);
  if (!std::isfinite(s.fu) || s.fu < s.fy || (fu_strictly_above && s.fu == s.fy))
    reject("steel.fu", s.fu, std::string(fu_strictly_above ? "fu > fy (" : "fu >= fy (") + format_number(s.fy) +
                           ") for curve = \"" + steel_curve_kind_name(s.kind) + "\"");
}

}  // namespace

const char* steel_curve_kind_name(SteelCurveKind kind) {
  switch (kind) {
    case SteelCurveKind::elastic: return "elastic";
    case SteelCurveKind::elastic_plastic: return "elastic_plastic";
    case SteelCurveKind::bilinear: return "bilinear";
    case SteelCurveKind::quadlinear: return "quadlinear";
    case SteelCurveKind::table: return "table";
  }
  return "?";
}

void require_yield_strength(double fy) {
  if (!(fy > 0.0) || !std::isfinite(fy)) reject("steel.fy", fy, "fy > 0 [MPa]");
}

QuadlinearParameters yun_gardner_quadlinear(double E, double fy, double fu) {
  if (!(E > 0.0) || !(fy > 0.0) || !(fu >= fy))
    fail("yun_gardner_quadlinear: need E > 0 and 0 < fy <= fu; got E = " + format_number(E) +
         ", fy = " + format_number(fy) + ", fu = " + format_number(fu));
  // Yun & Gardner (2017), J. Constr. Steel Res. 133:36-46 -- formulas FROM MEMORY
  // (docs/spec/references.md section 5, status MEMORY).
  QuadlinearParameters q{};
  const double ratio = fy / fu;
  q.eps_y = fy / E;
  q.eps_sh = std::clamp(0.1 * ratio - 0.055, 0.015, 0.03);
  q.eps_u = std::max(0.6 * (1.0 - ratio), 0.06);
  q.c1_eps_u = q.eps_sh + 0.25 * (q.eps_u - q.eps_sh);
  q.c2_eps_u = q.eps_sh + 0.4 * (q.eps_u - q.eps_sh);
  q.E_sh = (fu - fy) / (q.c2_eps_u - q.eps_sh);
  q.f_c1 = fy + q.E_sh * (q.c1_eps_u - q.eps_sh);
  return q;
}

void validate(const SteelModel& s, const SteelCurveOptions& options) {
  ROTCAP_CHECK(options.points_per_segment >= 1 && options.points_per_segment <= 1000,
               "SteelCurveOptions.points_per_segment = " + std::to_string(options.points_per_segment));
  ROTCAP_CHECK(options.max_engineering_strain > 0.0,
               "SteelCurveOptions.max_engineering_strain = " + format_number(options.max_engineering_strain));
  require_elastic_constants(s);
  switch (s.kind) {
    case SteelCurveKind::elastic: return;
    case SteelCurveKind::elastic_plastic:
      require_yield_strength(s.fy);
      return;
    case SteelCurveKind::bilinear: {
      require_strengths(s, true);
      if (!(s.hardening_modulus > 0.0 && s.hardening_modulus < s.E))
        reject("steel.hardening_modulus", s.hardening_modulus,
               "0 < hardening_modulus < E (" + format_number(s.E) +
                   ") for curve = \"bilinear\" (use \"elastic_plastic\" for E_h = 0)");
      const double eps_u = s.fy / s.E + (s.fu - s.fy) / s.hardening_modulus;
      if (eps_u > options.max_engineering_strain)
        reject("steel.hardening_modulus", s.hardening_modulus,
               "a modulus that reaches fu (" + format_number(s.fu) + ") by engineering strain " +
                   format_number(options.max_engineering_strain) + " (this one at " + format_number(eps_u) +
                   ", beyond the engineering-to-true conversion), or curve = \"table\"");
      return;
    }
    case SteelCurveKind::quadlinear: {
      require_strengths(s, false);
      const QuadlinearParameters q = yun_gardner_quadlinear(s.E, s.fy, s.fu);
      if (!(q.eps_y < q.eps_sh))
        reject("steel.fy", s.fy,
               "a yield strain fy / E (" + format_number(q.eps_y) + ") below the strain-hardening onset eps_sh = " +
                   format_number(q.eps_sh) + " of the quad-linear model");
      if (q.eps_u > options.max_engineering_strain)
        reject("steel.fu", s.fu,
               "a quad-linear ultimate strain eps_u (" + format_number(q.eps_u) + " with fy = " + format_number(s.fy) +
                   ") within " + format_number(options.max_engineering_strain));
      return;
    }
    case SteelCurveKind::table: {
      if (s.table.empty()) throw OptionError("steel.table", "an empty table", "rows [true stress, plastic strain]");
      for (std::size_t i = 0; i < s.table.size(); ++i)
        if (!std::isfinite(s.table[i][0]) || !std::isfinite(s.table[i][1]))
          throw OptionError("steel.table[" + std::to_string(i) + "]", "a non-finite value", "finite numbers");
      return;  // ordering, sign and slope: checked by HardeningCurve with the row index
    }
  }
}

void require_structural_steel_values(const SteelModel& s) {
  const auto within = [](const char* key, double v, double lo, double hi, const char* what) {
    if (!(v >= lo && v <= hi))
      throw OptionError(key, format_number(v),
                        std::string(what) + " of a structural steel in MPa (N/mm2), " + format_number(lo) +
                            " to " + format_number(hi) + " (a value far outside is usually given in other units)");
  };
  within("steel.E", s.E, 150000.0, 250000.0, "a Young's modulus");
  within("steel.fy", s.fy, 100.0, 1500.0, "a yield strength");
  if (s.kind == SteelCurveKind::bilinear || s.kind == SteelCurveKind::quadlinear)
    within("steel.fu", s.fu, 150.0, 2000.0, "a tensile strength");
}

bool has_yield(const SteelModel& steel) { return steel.kind != SteelCurveKind::elastic; }

std::vector<EngineeringPoint> engineering_curve(const SteelModel& s) {
  const double eps_y = s.fy / s.E;
  switch (s.kind) {
    case SteelCurveKind::bilinear:
      return {{eps_y, s.fy}, {eps_y + (s.fu - s.fy) / s.hardening_modulus, s.fu}};
    case SteelCurveKind::quadlinear: {
      const QuadlinearParameters q = yun_gardner_quadlinear(s.E, s.fy, s.fu);
      // eps_y < eps_sh (validated) < c1_eps_u < eps_u, since eps_sh <= 0.03 < 0.06 <= eps_u.
      return {{q.eps_y, s.fy}, {q.eps_sh, s.fy}, {q.c1_eps_u, q.f_c1}, {q.eps_u, s.fu}};
    }
    default:
      fail(std::string("engineering_curve: steel.curve = \"") + steel_curve_kind_name(s.kind) +
           "\" is not defined by an engineering curve");
  }
}

HardeningCurve::Point engineering_to_true(const EngineeringPoint& p, double E) {
  // Arasaratnam, Sivakumaran & Tait (2011), Table 2: sigma_t = sigma_e (1 + eps_e),
  // eps_t = ln(1 + eps_e); plastic part eps_pl = eps_t - sigma_t / E.
  const double sigma_t = p.stress * (1.0 + p.strain);
  return {std::log1p(p.strain) - sigma_t / E, sigma_t};
}

HardeningCurve hardening_curve(const SteelModel& s, const SteelCurveOptions& options) {
  validate(s, options);
  switch (s.kind) {
    case SteelCurveKind::elastic:
      fail("steel.curve = \"elastic\" has no yield stress: the section must be elastic "
           "(ElasticShellSection), no hardening curve exists");
    case SteelCurveKind::elastic_plastic: return HardeningCurve::perfectly_plastic(s.fy);
    case SteelCurveKind::table: {
      std::vector<HardeningCurve::Point> pts;
      pts.reserve(s.table.size());
      for (const auto& row : s.table) pts.push_back({row[1], row[0]});
      return HardeningCurve(std::move(pts));
    }
    case SteelCurveKind::bilinear:
    case SteelCurveKind::quadlinear: break;
  }
  const std::vector<EngineeringPoint> eng = engineering_curve(s);
  const HardeningCurve::Point yield = engineering_to_true(eng.front(), s.E);
  std::vector<HardeningCurve::Point> pts{{0.0, yield.stress}};
  const int m = options.points_per_segment;
  for (std::size_t i = 0; i + 1 < eng.size(); ++i) {
    for (int j = 1; j <= m; ++j) {
      // Sample the engineering segment at equal strain steps; the last sample is the breakpoint.
      const double a = static_cast<double>(j) / m;
      const EngineeringPoint e =
          j == m ? eng[i + 1]
                 : EngineeringPoint{eng[i].strain + a * (eng[i + 1].strain - eng[i].strain),
                                    eng[i].stress + a * (eng[i + 1].stress - eng[i].stress)};
      const HardeningCurve::Point t = engineering_to_true(e, s.E);
      // Plastic strain measured from the converted yield point (see the header).
      pts.push_back({t.plastic_strain - yield.plastic_strain, t.stress});
    }
  }
  return HardeningCurve(std::move(pts));
}

}  // namespace rotcap
