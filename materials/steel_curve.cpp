#include "materials/steel_curve.hpp"

#include <algorithm>
#include <cmath>
#include <sstream>
#include <stdexcept>

namespace rotcap {

namespace {

std::string num(double v) {
  std::ostringstream s;
  s.precision(10);
  s << v;
  return s.str();
}

[[noreturn]] void fail(const std::string& message) { throw std::invalid_argument(message); }

void require_elastic_constants(const SteelModel& s) {
  if (!(s.E > 0.0) || !std::isfinite(s.E)) fail("steel.E = " + num(s.E) + " must be > 0");
  if (!(s.nu > -1.0 && s.nu < 0.5))
    fail("steel.nu = " + num(s.nu) + " must satisfy -1 < nu < 0.5");
}

void require_strengths(const SteelModel& s, bool fu_strictly_above) {
  if (!(s.fy > 0.0) || !std::isfinite(s.fy)) fail("steel.fy = " + num(s.fy) + " must be > 0");
  if (!std::isfinite(s.fu) || s.fu < s.fy || (fu_strictly_above && s.fu == s.fy))
    fail("steel.fu = " + num(s.fu) + (fu_strictly_above ? " must be > " : " must be >= ") +
         "steel.fy = " + num(s.fy) + " for steel.curve = \"" + steel_curve_kind_name(s.kind) +
         "\"");
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

bool parse_steel_curve_kind(const std::string& name, SteelCurveKind& kind) {
  for (SteelCurveKind k : {SteelCurveKind::elastic, SteelCurveKind::elastic_plastic,
                           SteelCurveKind::bilinear, SteelCurveKind::quadlinear,
                           SteelCurveKind::table}) {
    if (name == steel_curve_kind_name(k)) {
      kind = k;
      return true;
    }
  }
  return false;
}

QuadlinearParameters yun_gardner_quadlinear(double E, double fy, double fu) {
  if (!(E > 0.0) || !(fy > 0.0) || !(fu >= fy))
    fail("yun_gardner_quadlinear: need E > 0 and 0 < fy <= fu; got E = " + num(E) +
         ", fy = " + num(fy) + ", fu = " + num(fu));
  // Yun & Gardner (2017), J. Constr. Steel Res. 133:36-46 -- formulas FROM MEMORY
  // (references.md section 5, status MEMORY).
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
  if (options.points_per_segment < 1 || options.points_per_segment > 1000)
    fail("SteelCurveOptions.points_per_segment = " + std::to_string(options.points_per_segment) +
         " must satisfy 1 <= n <= 1000");
  if (!(options.max_engineering_strain > 0.0))
    fail("SteelCurveOptions.max_engineering_strain = " + num(options.max_engineering_strain) +
         " must be > 0");
  require_elastic_constants(s);
  switch (s.kind) {
    case SteelCurveKind::elastic: return;
    case SteelCurveKind::elastic_plastic:
      if (!(s.fy > 0.0) || !std::isfinite(s.fy)) fail("steel.fy = " + num(s.fy) + " must be > 0");
      return;
    case SteelCurveKind::bilinear: {
      require_strengths(s, true);
      if (!(s.hardening_modulus > 0.0 && s.hardening_modulus < s.E))
        fail("steel.hardening_modulus = " + num(s.hardening_modulus) +
             " must satisfy 0 < E_h < steel.E = " + num(s.E) +
             " for steel.curve = \"bilinear\" (use \"elastic_plastic\" for E_h = 0)");
      const double eps_u = s.fy / s.E + (s.fu - s.fy) / s.hardening_modulus;
      if (eps_u > options.max_engineering_strain)
        fail("steel.hardening_modulus = " + num(s.hardening_modulus) + " reaches steel.fu = " +
             num(s.fu) + " only at engineering strain " + num(eps_u) + " > " +
             num(options.max_engineering_strain) +
             ", beyond the validity of the engineering-to-true conversion; use a larger "
             "modulus or steel.curve = \"table\"");
      return;
    }
    case SteelCurveKind::quadlinear: {
      require_strengths(s, false);
      const QuadlinearParameters q = yun_gardner_quadlinear(s.E, s.fy, s.fu);
      if (!(q.eps_y < q.eps_sh))
        fail("steel.fy / steel.E = " + num(q.eps_y) +
             " must be below the strain-hardening onset eps_sh = " + num(q.eps_sh) +
             " of the quad-linear model");
      if (q.eps_u > options.max_engineering_strain)
        fail("quad-linear ultimate strain eps_u = " + num(q.eps_u) + " (steel.fy = " + num(s.fy) +
             ", steel.fu = " + num(s.fu) + ") exceeds " + num(options.max_engineering_strain));
      return;
    }
    case SteelCurveKind::table: {
      if (s.table.empty()) fail("steel.table must not be empty for steel.curve = \"table\"");
      for (std::size_t i = 0; i < s.table.size(); ++i)
        if (!std::isfinite(s.table[i][0]) || !std::isfinite(s.table[i][1]))
          fail("steel.table row " + std::to_string(i) + " holds a non-finite value");
      return;  // ordering, sign and slope: checked by HardeningCurve with the row index
    }
  }
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
