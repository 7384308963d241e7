#pragma once
// ISection: a doubly symmetric I-section and its cross-section properties.
//
// Units: mm (dimensions), mm^2, mm^3, mm^4, mm^6; fy in MPa, moments in N mm.
// Axes: y is the major axis (parallel to the flanges), z the minor axis (along the web), as in
// EN 1993-1-1 1.7. Iy, Wel_y, Wpl_y, Avz are major-axis properties (bending in the web's plane).
//
// Two descriptions of the same section are used side by side (docs/spec/mechanics.md, "The hinge-zone
// model"; docs/spec/interface.md, "Definitions the numbers follow"):
//  - the real section, with four root fillets of radius r (hot-rolled) or none (welded, plated):
//    the handbook values that a designer compares with;
//  - the centre-line plate model that rotcap meshes: flanges of width b and thickness tf on the
//    lines z = +-(h - tf)/2, one web plate of thickness tw and depth h - tf between the flange
//    mid-planes (so it overlaps each flange by tf/2), no fillets. Mp of this model is the moment
//    the analysis is normalised by.

#include <string>

namespace rotcap {

struct ISection {
  std::string designation;   ///< e.g. "IPE 300"; empty for a section given by its plates
  double h = 0.0;            ///< overall depth [mm], > 0
  double b = 0.0;            ///< flange width [mm], > 0
  double tf = 0.0;           ///< flange thickness [mm], 0 < tf < h/2
  double tw = 0.0;           ///< web thickness [mm], 0 < tw < b
  double r = 0.0;            ///< root radius [mm], >= 0; 0 for welded or plated sections
  double weld_throat = 0.0;  ///< fillet-weld throat a [mm] of a welded section, >= 0; needs r = 0
};

/// Cross-section properties about the centroid (doubly symmetric: centroid = shear centre).
struct SectionProperties {
  double A = 0.0;      ///< area [mm^2]
  double Iy = 0.0;     ///< second moment of area, major axis [mm^4]
  double Iz = 0.0;     ///< second moment of area, minor axis [mm^4]
  double It = 0.0;     ///< St Venant torsion constant [mm^4]
  double Iw = 0.0;     ///< warping constant [mm^6]
  double Wel_y = 0.0;  ///< elastic section modulus Iy / (h/2) [mm^3]
  double Wpl_y = 0.0;  ///< plastic section modulus, major axis [mm^3]
  double Wel_z = 0.0;  ///< elastic section modulus Iz / (b/2) [mm^3]
  double Wpl_z = 0.0;  ///< plastic section modulus, minor axis [mm^3]
  double Avz = 0.0;    ///< shear area for a load parallel to the web [mm^2]
};

/// Throws OptionError naming the case-file key of the first bad dimension
/// ("section.depth", "section.flange_width", "section.flange_thickness", "section.web_thickness",
/// "section.root_radius", "section.weld_throat") with the value found and the bound expected:
/// every dimension positive (r, a non-negative) and finite; tf < h/2; tw < b; the flange outstand
/// (b - tw)/2 - r and the clear web depth h - 2 tf - 2 r positive (for a welded section the same
/// with the weld leg sqrt(2) a in place of r); r and a not both positive.
void validate(const ISection& s);

/// Properties of the real section. Rolled (r > 0): the four fillets are quarter-circle spandrels
/// of area (1 - pi/4) r^2 with their centroid 0.2234 r from both faces; It by El Darwish &
/// Johnston (1965); Iw = Iz (h - tf)^2 / 4. Welded or plated (r = 0): the three rectangles, the
/// welds neglected. Calls validate(s).
SectionProperties real_section_properties(const ISection& s);

/// Properties of the centre-line plate model (see the header comment), in closed form:
///   A = 2 b tf + (h - tf) tw,  Wpl_y = b tf (h - tf) + tw (h - tf)^2 / 4,
///   Iy = 2 [b tf^3/12 + b tf ((h - tf)/2)^2] + tw (h - tf)^3 / 12,  Wel_y = Iy / (h/2),
///   Iz = 2 tf b^3/12 + (h - tf) tw^3/12,  Wpl_z = tf b^2/2 + (h - tf) tw^2/4,  Wel_z = Iz/(b/2),
///   It = 2 b tf^3/3 + (h - tf) tw^3/3,  Iw = tf b^3 (h - tf)^2 / 24,  Avz = (h - tf) tw.
/// Calls validate(s).
SectionProperties plate_model_properties(const ISection& s);

/// Elastic moment Mel = fy Wel_y [N mm] for fy > 0 [MPa] (require_yield_strength).
double elastic_moment(const SectionProperties& p, double fy);
/// Plastic moment Mp = fy Wpl_y [N mm] for fy > 0 [MPa].
double plastic_moment(const SectionProperties& p, double fy);

}  // namespace rotcap
