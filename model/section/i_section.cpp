#include "model/section/i_section.hpp"

#include "core/option_error.hpp"
#include "core/text_format.hpp"
#include "materials/steel_curve.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>
#include <stdexcept>

namespace rotcap {

namespace {

std::string num(double v) { return format_number(v); }

[[noreturn]] void reject(const std::string& key, double found, const std::string& expected) {
  throw OptionError(key, num(found) + " mm", expected);
}

void require_positive(const std::string& key, double v) {
  if (!(v > 0.0) || !std::isfinite(v)) reject(key, v, "a finite value > 0");
}

// Quarter-circle spandrel (the root fillet) of radius r: area (1 - pi/4) r^2; centroid at
// e = r (10 - 3 pi) / (12 - 3 pi) = 0.2234 r from both straight faces; second moment about a
// straight face r^4 (1 - 5 pi/16), from the square r^2 minus the quarter disc centred on its far
// corner (parallel-axis theorem on the disc, I_disc,centre = pi r^4 / 16).
struct Fillet {
  double area, e, i_own;
  explicit Fillet(double r) {
    constexpr double pi = std::numbers::pi;
    area = (1.0 - pi / 4.0) * r * r;
    e = r * (10.0 - 3.0 * pi) / (12.0 - 3.0 * pi);
    i_own = r * r * r * r * (1.0 - 5.0 * pi / 16.0) - area * e * e;
  }
};

}  // namespace

void validate(const ISection& s) {
  require_positive("section.depth", s.h);
  require_positive("section.flange_width", s.b);
  require_positive("section.flange_thickness", s.tf);
  require_positive("section.web_thickness", s.tw);
  if (!(s.r >= 0.0) || !std::isfinite(s.r)) reject("section.root_radius", s.r, "a finite value >= 0");
  if (!(s.weld_throat >= 0.0) || !std::isfinite(s.weld_throat))
    reject("section.weld_throat", s.weld_throat, "a finite value >= 0");
  if (!(2.0 * s.tf < s.h))
    reject("section.flange_thickness", s.tf, "tf < h/2 = " + num(0.5 * s.h) + " mm (the flanges leave no web)");
  if (!(s.tw < s.b)) reject("section.web_thickness", s.tw, "tw < b = " + num(s.b) + " mm");
  if (s.r > 0.0 && s.weld_throat > 0.0)
    reject("section.weld_throat", s.weld_throat,
           "0 for a rolled section (root_radius = " + num(s.r) + " mm); a weld throat is for welded sections");
  // The fillet (or the weld leg sqrt(2) a) must leave a flat part of flange outstand and of web.
  const bool welded = s.weld_throat > 0.0;
  const double corner = welded ? std::numbers::sqrt2 * s.weld_throat : s.r;
  const std::string key = welded ? "section.weld_throat" : "section.root_radius";
  const double value = welded ? s.weld_throat : s.r;
  const double scale = welded ? std::numbers::sqrt2 : 1.0;
  const double outstand_limit = 0.5 * (s.b - s.tw) / scale;
  const double web_limit = 0.5 * (s.h - 2.0 * s.tf) / scale;
  if (!(corner < 0.5 * (s.b - s.tw)))
    reject(key, value, "< " + num(outstand_limit) + " mm, so that the flange outstand (b - tw)/2 keeps a flat part");
  if (!(corner < 0.5 * (s.h - 2.0 * s.tf)))
    reject(key, value, "< " + num(web_limit) + " mm, so that the web h - 2 tf keeps a flat part");
}

SectionProperties real_section_properties(const ISection& s) {
  validate(s);
  const double h = s.h, b = s.b, tf = s.tf, tw = s.tw, r = s.r;
  const double hw = h - 2.0 * tf;  // clear web depth between the flanges' inner faces
  const Fillet f(r);
  SectionProperties p;
  p.A = 2.0 * b * tf + hw * tw + 4.0 * f.area;
  // Parallel-axis sums of the two flanges, the web and four fillets (centroids at z = +-(hw/2 - e),
  // y = +-(tw/2 + e)).
  const double zf = 0.5 * (h - tf), zr = 0.5 * hw - f.e, yr = 0.5 * tw + f.e;
  p.Iy = 2.0 * (b * tf * tf * tf / 12.0 + b * tf * zf * zf) + tw * hw * hw * hw / 12.0 +
         4.0 * (f.i_own + f.area * zr * zr);
  p.Iz = 2.0 * tf * b * b * b / 12.0 + hw * tw * tw * tw / 12.0 + 4.0 * (f.i_own + f.area * yr * yr);
  p.Wel_y = p.Iy / (0.5 * h);
  p.Wel_z = p.Iz / (0.5 * b);
  // Plastic moduli: twice the first moment of a half section about the equal-area axis.
  p.Wpl_y = b * tf * (h - tf) + 0.25 * tw * hw * hw + 4.0 * f.area * zr;
  p.Wpl_z = 0.5 * tf * b * b + 0.25 * hw * tw * tw + 4.0 * f.area * yr;
  // St Venant torsion: thin rectangles b tf^3/3 with Roark's end correction 0.21 tf^4 per flange
  // (0.42 tf^4 in all), the web hw tw^3/3, and the web-flange junction term 2 alpha D^4 of
  // El Darwish & Johnston, "Torsion of structural shapes", J. Struct. Div. ASCE 91(ST1), 1965,
  // with D the diameter of the circle inscribed in the junction. The coefficients of alpha are as
  // quoted in section tables (recalled, not read in the paper); they reproduce the tabulated It
  // of all 66 IPE/HEA/HEB rows of the built-in table within 0.4 % (tests/model/).
  if (r > 0.0) {
    const double alpha = -0.042 + 0.2204 * tw / tf + 0.1355 * r / tf - 0.0865 * r * tw / (tf * tf) -
                         0.0725 * tw * tw / (tf * tf);
    const double D = ((tf + r) * (tf + r) + tw * (r + 0.25 * tw)) / (2.0 * r + tf);
    p.It = 2.0 / 3.0 * b * tf * tf * tf + hw * tw * tw * tw / 3.0 + 2.0 * alpha * D * D * D * D -
           0.42 * tf * tf * tf * tf;
  } else {
    // No fillet: the open thin-walled section (Vlasov), with the same flange end correction.
    p.It = 2.0 / 3.0 * b * tf * tf * tf + hw * tw * tw * tw / 3.0 - 0.42 * tf * tf * tf * tf;
  }
  // Warping constant of a doubly symmetric I: the flanges, distance h - tf apart, bend laterally
  // in opposite senses (Timoshenko & Gere 1961, ch. 5): Iw = Iz (h - tf)^2 / 4.
  p.Iw = p.Iz * (h - tf) * (h - tf) / 4.0;
  // Shear area, EN 1993-1-1 6.2.6(3): rolled I (a) Av = A - 2 b tf + (tw + 2 r) tf, not less than
  // eta hw tw; welded (d) Av = eta hw tw; eta = 1.0 (conservative value the clause allows).
  p.Avz = r > 0.0 ? std::max(p.A - 2.0 * b * tf + (tw + 2.0 * r) * tf, hw * tw) : hw * tw;
  return p;
}

SectionProperties plate_model_properties(const ISection& s) {
  validate(s);
  const double b = s.b, tf = s.tf, tw = s.tw;
  const double d = s.h - s.tf;  // distance between flange mid-planes = web plate depth
  SectionProperties p;
  p.A = 2.0 * b * tf + d * tw;
  p.Iy = 2.0 * (b * tf * tf * tf / 12.0 + b * tf * 0.25 * d * d) + tw * d * d * d / 12.0;
  p.Iz = 2.0 * tf * b * b * b / 12.0 + d * tw * tw * tw / 12.0;
  p.Wel_y = p.Iy / (0.5 * s.h);
  p.Wel_z = p.Iz / (0.5 * b);
  p.Wpl_y = b * tf * d + 0.25 * tw * d * d;
  p.Wpl_z = 0.5 * tf * b * b + 0.25 * d * tw * tw;
  // Thin plates on the centre lines: sum of b t^3/3 (no end corrections: this is what a shell
  // model of three plates carries), and the flange-only warping constant tf b^3 d^2 / 24.
  p.It = 2.0 / 3.0 * b * tf * tf * tf + d * tw * tw * tw / 3.0;
  p.Iw = tf * b * b * b * d * d / 24.0;
  p.Avz = d * tw;
  return p;
}

double elastic_moment(const SectionProperties& p, double fy) {
  require_yield_strength(fy);
  return fy * p.Wel_y;
}

double plastic_moment(const SectionProperties& p, double fy) {
  require_yield_strength(fy);
  return fy * p.Wpl_y;
}

}  // namespace rotcap
