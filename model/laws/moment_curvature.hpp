#pragma once
// Moment-curvature of a doubly symmetric I-section by fibre integration (major-axis bending), the
// "simple" section law that the shell result is compared with (no local buckling by construction).
//
// Section: the centre-line PLATE MODEL that rotcap meshes (model/section/i_section.hpp), not the real
// section with fillets: flanges of width b and thickness tf centred on z = +-zf, zf = (h - tf)/2,
// and a web of thickness tw over [-zf, zf] (it overlaps each flange by tf/2, as in the plate
// model's Wpl_y = b tf (h - tf) + tw (h - tf)^2 / 4). So M tends to fy Wpl_y of the plate model,
// the Mp the shell run is normalised by, and My = fy Wel_y = fy Iy / (h/2).
//
// Fibres: every plate is cut into strips (flange: `flange_strips_width` across b times
// `flange_strips_thickness` through tf; web: `web_strips` over its depth); each strip is
// integrated with two Gauss points in z (so sum A z^2 = Iy and sum A |z| = Wpl_y / 2 are exact
// for a strip that does not cross z = 0; strip counts are even so none does). Residual stress
// (model/patterns/residual_stress.hpp, longitudinal) is sampled at the strip centre and held constant over
// the strip.
//
// Fibre law: uniaxial stress-strain curve of the SAME material as the shell's layers. The shell's
// J2 law uses the hardening curve sigma_y(epbar) (true stress against logarithmic plastic strain,
// materials/steel_curve.hpp) with the small strain of the corotated element frame; loaded
// uniaxially, that law gives the fibre strain eps = sigma / E + epbar at sigma = sigma_y(epbar)
// (no further true/engineering conversion, which would make the fibre differ from the shell's
// material point). The curve is odd in eps (same in tension and compression) and held constant
// beyond its last point, like HardeningCurve.
//
// Loading: every fibre's strain is eps_i = eps_R,i + eps_0 + kappa z_i, eps_R,i = sigma_R,i / E
// (the residual stress is elastic; |sigma_R| < fy), kappa >= 0 the curvature [1/mm] (positive:
// tension at +z), eps_0 the axial strain found for N = sum sigma_i A_i = axial_force (safeguarded
// Newton in eps_0, Press et al., Numerical Recipes 2nd ed. 1992, sec. 9.4 "rtsafe", from memory).
// M = sum sigma_i A_i z_i [N mm]. The curvature grows monotonically, so every fibre's strain
// changes monotonically from its residual state and the total-strain (deformation) evaluation is
// exact for this path. Curvature is stepped from 0 until the extreme strain (at z = +-h/2, edge of
// the outer strips) reaches max_strain: the law's ultimate strain (its last point), or
// MomentCurvatureOptions::max_strain when given or when the law has no hardening point.
//
// Units: mm, N, MPa; kappa [1/mm], M [N mm].

#include "materials/hardening_curve.hpp"
#include "model/section/i_section.hpp"
#include "model/patterns/residual_stress.hpp"

#include <array>
#include <span>
#include <string>
#include <vector>

namespace rotcap {

/// Piecewise-linear odd uniaxial law sigma(eps), elastic (slope E) up to the first point.
class UniaxialFibreLaw {
 public:
  /// points: (strain, stress) pairs from the yield point on, strain strictly increasing,
  /// stress > 0 and non-decreasing, point 0 on the elastic line (stress = E strain).
  /// Throws std::invalid_argument naming the point.
  UniaxialFibreLaw(double E, std::vector<std::array<double, 2>> points);
  /// The fibre law of a hardening curve (see the header comment): eps_i = epbar_i + sigma_i / E.
  static UniaxialFibreLaw from_hardening_curve(double E, std::span<const HardeningCurve::Point> curve);

  double stress(double eps) const;
  double tangent(double eps) const;  ///< d sigma / d eps (right-hand slope at a breakpoint)
  double E() const { return E_; }
  double yield_stress() const { return points_.front()[1]; }
  double yield_strain() const { return points_.front()[0]; }
  /// Strain of the last point (the ultimate strain of the data); equals yield_strain() for a
  /// perfectly plastic law.
  double ultimate_strain() const { return points_.back()[0]; }
  /// First segment with slope > 0.005 E (a true-stress yield plateau rises with slope ~ fy, about
  /// 0.0017 E for S355, which is not counted): its start strain (onset of strain hardening) and slope.
  /// has_hardening() false: no such segment (perfectly plastic).
  bool has_hardening() const { return hardening_segment_ >= 0; }
  double hardening_onset_strain() const;
  double hardening_modulus() const;  ///< tangent modulus E_t of that segment [MPa]; 0 if none
  const std::vector<std::array<double, 2>>& points() const { return points_; }

 private:
  double E_;
  std::vector<std::array<double, 2>> points_;
  int hardening_segment_ = -1;
};

struct Fibre {
  double z = 0.0;                ///< lever arm [mm]
  double area = 0.0;             ///< [mm^2]
  double residual_stress = 0.0;  ///< sigma_R [MPa], tension positive
  double z_edge = 0.0;           ///< outer |z| of the strip it belongs to [mm] (first yield)
};

struct FibreMeshOptions {
  int flange_strips_width = 20;      ///< across b, even, >= 2
  int flange_strips_thickness = 8;   ///< through tf, >= 1
  int web_strips = 40;               ///< over h - tf, even, >= 2
};

/// Fibres of the plate model of `section` with the residual stress of `pattern` (kind none: 0).
/// Throws std::invalid_argument for bad strip counts (names the option) or a bad section.
std::vector<Fibre> plate_model_fibres(const ISection& section, const ResidualStressPattern& pattern,
                                      const FibreMeshOptions& options = {});

/// Fibres of a solid rectangle b x d centred on z = 0 (checks against closed forms).
std::vector<Fibre> rectangle_fibres(double b, double d, int strips);

struct MomentCurvatureOptions {
  double axial_force = 0.0;    ///< N held constant [N], tension positive (compression negative)
  double max_strain = 0.0;     ///< extreme-fibre strain to stop at; 0: see the header comment
  double perfectly_plastic_max_strain = 0.15;  ///< used when the law has no hardening, > eps_y
  int elastic_steps = 20;      ///< equal steps from 0 to 2 kappa_y, >= 2
  int plastic_steps = 200;     ///< geometric steps from 2 kappa_y to kappa_max, >= 2
  double axial_tolerance = 1e-10;  ///< |N - axial_force| <= tol * sum |fy A_i|
};

struct MomentCurvaturePoint {
  double kappa = 0.0;        ///< [1/mm]
  double moment = 0.0;       ///< [N mm]
  double axial_strain = 0.0; ///< eps_0
};

struct MomentCurvatureCurve {
  std::vector<MomentCurvaturePoint> points;  ///< from (0, M_0) on; kappa increasing
  double first_yield_curvature = 0.0;  ///< kappa at which the first strip edge reaches fy [1/mm]
  double first_yield_moment = 0.0;     ///< M there (elastic: E I kappa_y) [N mm]
  double EI = 0.0;                     ///< E sum A z^2 [N mm^2]
  double max_strain = 0.0;             ///< extreme strain at the last point
  double peak_moment = 0.0;            ///< largest M of the curve [N mm]
  std::string message;                 ///< one line quoting the numbers
};

/// M(kappa) of the fibres (see the header comment). Throws std::invalid_argument for an empty
/// fibre set, options out of range, or an axial force the section cannot carry.
MomentCurvatureCurve moment_curvature(std::span<const Fibre> fibres, const UniaxialFibreLaw& law,
                                      const MomentCurvatureOptions& options = {});

}  // namespace rotcap
