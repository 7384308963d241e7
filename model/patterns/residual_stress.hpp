#pragma once
// Longitudinal residual stress patterns of doubly symmetric I-sections on the centre-line plate
// model (model/section/i_section.hpp): flanges of width b at z = +-zf, zf = (h - tf)/2, a web of depth
// h - tf = 2 zf between the flange mid-planes (docs/spec/mechanics.md, "Material": residual stresses enter
// as initial stresses at every layer point).
//
// Units: MPa for stresses, mm for coordinates, N and N mm for resultants. Tension positive,
// compression negative. The stress acts along the member axis x only (uniaxial), is constant
// through the thickness and along x. Stiffeners carry none.
//
// Plate coordinates: a flange is parametrised by y in [-b/2, b/2] (y = 0 at the web), the web by
// z in [-zf, zf] (z = 0 at mid-depth), the hinge-zone mesher's global y and z.
//
// hot_rolled (ECCS TC8 Publ. 33, 1984, "Ultimate limit state calculation of sway frames with rigid
// joints"; shape and magnitudes from memory, see docs/spec/references.md section 4):
//   amplitude  a = 0.5 fy for h/b <= 1.2, a = 0.3 fy for h/b > 1.2;
//   flange     sigma(y) = a (1 - 4 |y| / b): -a at the tips, +a at the junction (linear);
//   web        sigma(z) = a (3/2 (z/zf)^2 - 1/2): +a at both junctions, -a/2 at mid-depth.
//   The flange triangle integrates to zero over b by itself, so the web must carry no net force
//   either. ECCS pairs the triangle with a web in tension or a parabolic web (from memory); a web
//   in uniform tension would leave a net tensile force, which a pattern used as an initial stress
//   must not have (Szalai & Papp, J. Constr. Steel Res. 61 (2005) 845-861, abstract: common
//   patterns that violate the equilibrium equations falsify twisting problems). The even
//   parabola is the one quadratic that is continuous with the flange at both junctions (one
//   stress at the shared node line) and self-equilibrated; symmetry in y and z makes N, My, Mz
//   and the bimoment vanish exactly.
//
// welded (after the ECCS 1984 simplified pattern for welded I-sections, from memory, low
// confidence; block shape as measured by Le, Paradowska, Bradford, Liu & Valipour, "Residual
// stresses in welded high-strength steel I-beams", J. Constr. Steel Res. (accepted 2019),
// abstract: tension peaks at the flange-web junctions, a roughly uniform compression elsewhere):
//   tension +fy in a band at each flange-web junction, compression -c fy elsewhere in the plate,
//   c = ResidualStressOptions::welded_compression (0.25 from memory); the band widths make each
//   plate self-equilibrated on its own:
//     flange  |y| <= w_f/2,           w_f = c b / (1 + c)          (fy w_f = c fy (b - w_f));
//     web     zf - |z| <= w_w,        w_w = c zf / (1 + c)         (2 fy w_w = c fy (2 zf - 2 w_w)).
//   No tension at the flange tips (rolled or sheared plate edges; flame-cut tips are not modelled).
//
// Resultants (SelfEquilibrium) on the plate model:
//   N = int sigma dA,  My = int sigma z dA,  Mz = int sigma y dA,  B = int sigma omega dA with the
//   sectorial coordinate omega = -y z of the flanges (0 on the web), and the Wagner integral
//   int sigma (y^2 + z^2) dA (a residual stress changes the torsional stiffness by it; reported,
//   not required to vanish). Evaluated exactly: the patterns are piecewise quadratic and each
//   piece is integrated in closed form.

#include "model/section/i_section.hpp"
#include "model/shell_model.hpp"

#include <Eigen/Core>
#include <array>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

namespace rotcap {

/// Same order as the case file's [residual_stress] pattern values.
enum class ResidualStressKind { none, hot_rolled, welded };

/// Plates of the hinge-zone model (ShellModel::region_names of model/hinge_zone/hinge_zone_mesher.hpp).
enum class PlateRegion { top_flange, bottom_flange, web, stiffener };

/// "top_flange", "bottom_flange", "web", "stiffener" -> the region; anything else -> nullopt.
std::optional<PlateRegion> plate_region(std::string_view region_name);
const char* residual_stress_kind_name(ResidualStressKind kind);

struct ResidualStressOptions {
  /// Welded pattern: compression outside the weld bands, as a fraction c of fy; 0 < c < 1.
  double welded_compression = 0.25;
  /// Coordinates up to this fraction of the plate width beyond its edges are clamped onto the
  /// plate (imperfection offsets move nodes slightly); further out is an error. >= 0.
  double edge_tolerance = 0.1;
};

/// Resultants of a pattern over the plate model and its extreme values.
struct SelfEquilibrium {
  double N = 0.0;                 ///< net axial force [N]
  double My = 0.0;                ///< major-axis moment int sigma z dA [N mm]
  double Mz = 0.0;                ///< minor-axis moment int sigma y dA [N mm]
  double B = 0.0;                 ///< bimoment int sigma omega dA [N mm^2]
  double wagner = 0.0;            ///< int sigma (y^2 + z^2) dA [N mm^2]
  double peak_tension = 0.0;      ///< largest stress [MPa] (>= 0)
  double peak_compression = 0.0;  ///< most negative stress [MPa] (<= 0)
  /// max(|N| / (fy A), |My| / (fy A zf), |Mz| / (fy A b/2)) [-]; 0 for a pattern of kind none.
  double relative_imbalance = 0.0;
  std::string message;  ///< one line for `rotcap check`, quoting the numbers
};

class ResidualStressPattern {
 public:
  /// Kind none: zero everywhere.
  ResidualStressPattern() = default;
  /// Throws std::invalid_argument from validate(section), for fy <= 0 ("steel.fy") or for
  /// options out of range ("residual_stress.welded_compression", "residual_stress.edge_tolerance").
  ResidualStressPattern(ResidualStressKind kind, const ISection& section, double fy,
                        const ResidualStressOptions& options = {});

  ResidualStressKind kind() const { return kind_; }
  /// hot_rolled: a (0.5 fy or 0.3 fy); welded: the tension fy; none: 0 [MPa].
  double amplitude() const { return amplitude_; }
  /// One line naming the pattern, its source and its parameters.
  std::string description() const;

  /// sigma_R [MPa] at flange coordinate y (top_flange, bottom_flange) or web coordinate z (web);
  /// 0 for a stiffener. Throws std::out_of_range for a coordinate beyond the plate by more than
  /// edge_tolerance times its width.
  double longitudinal(PlateRegion region, double y_or_z) const;

  /// Mean of sigma_R over [s0, s1] of the plate coordinate (s0 <= s1), integrated exactly over
  /// the pattern's pieces [MPa]; the point value when s1 - s0 is below 1e-12 of the plate width.
  /// Same region rules and edge tolerance as longitudinal().
  double mean_longitudinal(PlateRegion region, double s0, double s1) const;

  /// Exact resultants over the plate model (see the header comment).
  SelfEquilibrium check() const;

 private:
  struct Piece {  // sigma(s) = c0 + c1 s + c2 s^2 on [s0, s1]
    double s0, s1, c0, c1, c2;
  };
  double evaluate(const std::vector<Piece>& plate, double s) const;
  double mean(const std::vector<Piece>& plate, double s0, double s1) const;
  double clamp_to_plate(const std::vector<Piece>& plate, double s) const;
  /// The pieces of a region's plate; nullptr for a stiffener or kind none (zero stress).
  const std::vector<Piece>* plate_of(PlateRegion region) const;

  ResidualStressKind kind_ = ResidualStressKind::none;
  ISection section_;
  double fy_ = 0.0;
  double amplitude_ = 0.0;
  double zf_ = 0.0;
  ResidualStressOptions options_;
  std::vector<Piece> flange_, web_;  // breakpoints ascending, covering [-b/2, b/2] and [-zf, zf]
};

/// Local plane-stress components [s_xx, s_yy, s_xy] [MPa] of the uniaxial longitudinal stress at
/// a point of a shell whose local axes are the columns of `axes` (global components):
///   with c = e1 . e_x, s = e2 . e_x (e_x the member axis), sigma_local = [c^2, s^2, c s] sigma_R,
/// the rotation of the tensor sigma_R e_x e_x^T into the element frame. `point` is global
/// [mm]: y is used on the flanges, z on the web. Zero for a stiffener.
Eigen::Vector3d local_residual_stress(const ResidualStressPattern& pattern, PlateRegion region,
                                      const Eigen::Vector3d& point, const Eigen::Matrix3d& axes);

/// The initial stresses of a four-node element at its 2x2 Gauss points: Gauss point k, at
/// (xi_k, eta_k) / sqrt(3) with corner k at (xi_k, eta_k) = (-1,-1), (1,-1), (1,1), (-1,1) (ShellQ4's
/// order), gets local_residual_stress of the MEAN of sigma_R over its quadrant of the element
/// (parent square [0, xi_k] x [0, eta_k]) instead of the point value. `corners` are the perfect
/// geometry's node coordinates [mm] (columns), `axes` the element frame. For the mesher's
/// elements, whose sides run along and across the member, the quadrant spans one interval of the
/// plate coordinate and the 2x2 weights equal the quadrant areas, so the discrete pattern keeps
/// the exact pattern's net force on every plate to round-off: a band edge inside an element no
/// longer puts a whole Gauss point's strip into tension (point sampling made the welded
/// pattern's tension band 27.5, 18.3 and 24.4 mm wide per side for 8, 12 and 18 elements across
/// a 220 mm flange instead of 22 mm, with a net force the equilibrium step then had to absorb).
std::array<Eigen::Vector3d, 4> gauss_point_residual_stresses(const ResidualStressPattern& pattern, PlateRegion region,
                                                             const Eigen::Matrix<double, 3, 4>& corners,
                                                             const Eigen::Matrix3d& axes);

/// The plate region of element `element` of a hinge-zone ShellModel, looked up by region name.
/// Throws std::invalid_argument for a region name that is not one of PlateRegion's (a general
/// mesh's plates have no pattern) and std::out_of_range for a bad element index.
PlateRegion element_plate_region(const ShellModel& model, int element);

/// local_residual_stress for element `element` of a hinge-zone ShellModel (element_plate_region).
Eigen::Vector3d local_residual_stress(const ResidualStressPattern& pattern, const ShellModel& model, int element,
                                      const Eigen::Vector3d& point, const Eigen::Matrix3d& axes);

}  // namespace rotcap
