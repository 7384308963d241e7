#pragma once
// What a hinge-zone model is built from (HingeZoneSpec, filled by the case-file reader) and what
// the mesher returns (HingeZoneModel). Geometry, units and the mesh: hinge_zone_mesher.hpp; what
// each loading setup adds (supports, loads, the hinge rotation): its class in model/setups/.

#include "model/hinge_zone/section_grid.hpp"
#include "model/section/i_section.hpp"
#include "model/shell_model.hpp"

#include <optional>
#include <vector>

namespace rotcap {

class LoadingSetup;

/// Loading arrangement (same order as the case file's "setup" values); each has its class in
/// model/setups/ (loading_setup(HingeSetup)).
enum class HingeSetup { cantilever, three_point, four_point, uniform_moment };
inline constexpr int kHingeSetupCount = 4;  ///< number of HingeSetup values
/// Where transverse web stiffeners go (same order as the case file's "stiffeners" modes).
enum class StiffenerPlacement { supports_and_loads, none, positions };
/// Which flange a lateral restraint holds (same order as the case file's "flange" values).
enum class RestrainedFlange { both, top, bottom };

struct LateralBrace {
  double x = 0.0;  ///< [mm], 0 <= x <= length
  RestrainedFlange flange = RestrainedFlange::both;
};

/// The cantilever's support section: fully fixed (all DOFs of all its nodes), or a symmetry plane
/// (ux, ry, rz held at every node, uy and uz on the web line; the flanges may contract sideways),
/// as at midspan of a three-point-bending specimen of twice the length.
enum class CantileverSupport { fixed, symmetry };

struct HingeZoneSpec {
  ISection section;
  HingeSetup setup = HingeSetup::cantilever;
  double length = 0.0;        ///< [mm] > 0; cantilever: support to load point; beams: span
  double load_spacing = 0.0;  ///< [mm] four_point only: distance between the loads, 0 < s < L
  StiffenerPlacement stiffeners = StiffenerPlacement::supports_and_loads;
  std::vector<double> stiffener_positions;    ///< extra stiffeners, x [mm] in [0, L]
  std::optional<double> stiffener_thickness;  ///< [mm] > 0; default tf
  std::vector<LateralBrace> lateral_restraints;
  /// Mesh defaults: the demo mesh study's converged level, 9 elements per flange outstand
  /// (bench/results/demo_mesh_study.txt); coarser meshes overstate the rotations.
  int flange_elements = 18;   ///< across the full flange width; even, >= 4
  int web_elements = 23;      ///< over the web depth h - tf; >= 4
  double aspect = 1.0;        ///< element length / flange element width in the hinge region, > 0
  /// Coarsening of the tension side, 1 <= c <= 3 (hinge_zone_mesher.hpp, "Cross-section grid"):
  /// the tension flange gets about flange_elements / c elements, the web's tension part elements
  /// up to c times the fine size; 1 is the uniform mesh. The defaults 2, 6 and 0.3 of these three
  /// keys cut the free DOFs by 31-35 % at M_max within 0.1 % and R within 2 % of the uniform
  /// mesh (1, 3, 0.2) on three cases (bench/results/mesh_grading.txt).
  double tension_coarsening = 2.0;
  /// Largest element length along x outside the hinge region, in hinge element lengths h_e,
  /// 1 <= value <= 10; the mesher also keeps it at most b/2.
  double far_element_length = 6.0;
  /// Slope of the element length along x outside the hinge region (element ratio 1 + g),
  /// 0.05 <= g <= 0.5.
  double far_growth = 0.3;
  double axial_load_ratio = 0.0;  ///< N / (A_plate fy), 0 <= n < 1; cantilever, uniform_moment only
  double fy = 355.0;          ///< [MPa] > 0, for Mp and N
  CantileverSupport cantilever_support = CantileverSupport::fixed;
};

/// How the hinge rotation follows from the displacements: theta = sum_i weights[i] * u(nodes[i], dof)
/// (divisor 1; weights [1/mm] for translations, [-] for rotations).
using HingeRotation = DofCombination;

struct HingeZoneModel {
  ShellModel model;
  HingeSetup setup = HingeSetup::cantilever;
  SectionProperties plate;         ///< plate-model properties (what is meshed)
  double plastic_moment = 0.0;     ///< Mp = fy Wpl_y of the plate model [N mm]
  double moment_per_load_factor = 0.0;  ///< hinge moment at load factor 1 [N mm] (= plastic_moment)
  double reference_load = 0.0;     ///< |P| per load point [N], or the end moment [N mm] (uniform_moment)
  double lever_arm = 0.0;          ///< M = reference_load * lever_arm [mm]; 0 for uniform_moment
  double axial_force = 0.0;        ///< N [N], compression positive
  double hinge_element_length = 0.0;  ///< h_e [mm]
  double span = 0.0;               ///< L [mm]
  double shear_span = 0.0;         ///< a [mm] (four_point), L (cantilever), L/2 (three_point), 0
  std::vector<double> stations;    ///< x of every node line, ascending [mm]
  SectionGrid grid;                ///< the cross-section's node lines and numbering at every station
  std::vector<double> stiffener_x; ///< x of the stiffeners meshed [mm]
  HingeRotation rotation;

  /// The setup object of `setup` (always the current value of the field; model/setups/).
  const LoadingSetup& loading() const;
};

}  // namespace rotcap
