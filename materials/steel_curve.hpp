#pragma once
// Steel models of a case file ([steel] table) and the hardening curve each one defines.
//
// Units: MPa for E, fy, fu and moduli; strains dimensionless.
// Kinds (case-file key steel.curve):
//   elastic          no yield; the section must be elastic (hardening_curve() throws).
//   elastic_plastic  ideal plasticity: true flow stress fy at every plastic strain (EN 1993-1-5
//                    C.6 model (a), from memory). Used as an idealisation in true measures, so it
//                    is NOT converted (a converted engineering plateau would harden).
//   bilinear         engineering curve: E up to fy, then slope E_h = hardening_modulus > 0 up to
//                    fu (requires fu > fy), converted to true measures.
//   quadlinear       hot-rolled steel, Yun & Gardner (2017), J. Constr. Steel Res. 133:36-46
//                    (formulas FROM MEMORY, docs/spec/references.md section 5): elastic, yield plateau to
//                    eps_sh, linear hardening E_sh to C1 eps_u, then linear to (eps_u, fu);
//                    converted to true measures.
//   table            true stress against equivalent plastic strain, given directly
//                    (rows [stress, plastic strain], the order of the case-file table); the table
//                    defines the yield stress; fy keeps its role in Mp and classification only.
//
// Engineering -> true conversion, before necking (Arasaratnam, Sivakumaran & Tait 2011, ISRN
// Civil Eng. Art. 656401, Table 2, as in docs/spec/references.md section 5):
//   sigma_t = sigma_e (1 + eps_e),  eps_t = ln(1 + eps_e),  eps_pl = eps_t - sigma_t / E.
// At the yield point this gives eps_pl = ln(1+eps_y) - eps_y(1+eps_y) ~ -1.5 eps_y^2 (about
// -4e-6 for S355) because the true elastic line is not exactly sigma_t = E eps_t; plastic strains
// are measured from the converted yield point so the curve starts at 0 as the J2 law needs. Each
// engineering segment is sampled at points_per_segment equal steps, since the converted curve is
// curved between the engineering breakpoints (chord error ~ E_h d eps_e^2 / 4 per segment).
// Beyond eps_u (the last engineering point) the true stress is held constant (HardeningCurve's
// rule); the conversion itself is not valid past necking.

#include "materials/hardening_curve.hpp"

#include <array>
#include <string>
#include <vector>

namespace rotcap {

enum class SteelCurveKind { elastic, elastic_plastic, bilinear, quadlinear, table };

/// Case-file spelling ("elastic", "elastic_plastic", ...).
const char* steel_curve_kind_name(SteelCurveKind kind);
/// The one check of a yield strength, wherever fy is used (sections, Mp, residual stresses):
/// throws OptionError("steel.fy", value, "fy > 0 [MPa]") unless 0 < fy < infinity.
void require_yield_strength(double fy);

struct SteelModel {
  double E = 210000.0;   ///< Young's modulus [MPa], > 0
  double nu = 0.3;       ///< Poisson's ratio, 0 <= nu < 0.5
  double fy = 355.0;     ///< yield strength [MPa], > 0
  double fu = 490.0;     ///< tensile strength [MPa], >= fy (bilinear: > fy)
  SteelCurveKind kind = SteelCurveKind::quadlinear;
  double hardening_modulus = 0.0;            ///< bilinear E_h [MPa], 0 < E_h < E
  std::vector<std::array<double, 2>> table;  ///< table rows [true stress MPa, eq. plastic strain]
};

struct SteelCurveOptions {
  int points_per_segment = 8;           ///< samples per engineering segment, 1 <= n <= 1000
  double max_engineering_strain = 0.5;  ///< limit of the conversion (necking of structural
                                        ///< steels is at ~0.1-0.25 engineering strain), > 0
};

/// Engineering stress-strain point.
struct EngineeringPoint {
  double strain;  ///< eps_e [-]
  double stress;  ///< sigma_e [MPa]
};

/// Strains and modulus of the quad-linear model (Yun & Gardner 2017, from memory):
///   eps_sh = 0.1 fy/fu - 0.055 bounded to [0.015, 0.03],  eps_u = 0.6 (1 - fy/fu) >= 0.06,
///   C1 eps_u = eps_sh + 0.25 (eps_u - eps_sh),  C2 eps_u = eps_sh + 0.4 (eps_u - eps_sh),
///   E_sh = (fu - fy) / (C2 eps_u - eps_sh).
struct QuadlinearParameters {
  double eps_y;     ///< fy / E
  double eps_sh;    ///< onset of strain hardening
  double c1_eps_u;  ///< end of the first hardening branch
  double c2_eps_u;  ///< defines E_sh
  double eps_u;     ///< strain at fu
  double E_sh;      ///< first hardening slope [MPa]
  double f_c1;      ///< engineering stress at c1_eps_u [MPa]
};
/// Requires E > 0 and 0 < fy <= fu (throws std::invalid_argument otherwise).
QuadlinearParameters yun_gardner_quadlinear(double E, double fy, double fu);

/// Checks every field the model's kind uses; throws OptionError naming the case-file key ("steel.E",
/// "steel.nu", "steel.fy", "steel.fu", "steel.hardening_modulus"), its value and the rule, or std::invalid_argument for a
/// combination no single key owns (quad-linear strains, conversion limits, a non-finite table row).
void validate(const SteelModel& steel, const SteelCurveOptions& options = {});

/// Plausibility in the case file's units (MPa) for a structural steel, beyond validate(): 150000 <=
/// E <= 250000, 100 <= fy <= 1500, 150 <= fu <= 2000 (fu where the curve uses it). Values outside are
/// almost always a unit slip (Pa, kN/cm2); throws OptionError naming the key, the value and the
/// units expected. For models of steel I-beams (generated models); general models may hold any
/// elastic material in consistent units.
void require_structural_steel_values(const SteelModel& steel);

/// True unless kind is elastic.
bool has_yield(const SteelModel& steel);

/// Engineering breakpoints from the yield point on ((fy/E, fy) first) for bilinear and
/// quadlinear; throws std::invalid_argument for the other kinds.
std::vector<EngineeringPoint> engineering_curve(const SteelModel& steel);

/// sigma_t and eps_pl = ln(1+eps_e) - sigma_t/E of one engineering point (not shifted).
HardeningCurve::Point engineering_to_true(const EngineeringPoint& p, double E);

/// The hardening curve of the model (validates first). Throws std::invalid_argument for kind
/// elastic, whose section must be elastic.
HardeningCurve hardening_curve(const SteelModel& steel, const SteelCurveOptions& options = {});

}  // namespace rotcap
