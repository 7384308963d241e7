#pragma once
// Hinge-zone mesher: the shell model of an I-beam segment (mechanics.md, "The hinge-zone model";
// interface.md, "Supports and loading of the generated setups").
//
// Geometry (mm): x along the member (0 <= x <= L), z vertical (up), y lateral; the web lies in
// the x-z plane at y = 0. Plates on their centre lines (model/section/i_section.hpp, plate model):
//   top / bottom flange  z = +-(h - tf)/2, width b, thickness tf, flange_elements across
//                        (y_k = -b/2 + k b/flange_elements; k = flange_elements/2 is y = 0);
//   web                  y = 0, from flange to flange, thickness tw, web_elements over h - tf;
//   stiffener            a transverse plate in the y-z plane at its x, on both sides of the web,
//                        full flange width and full web depth, on the flanges' y lines and the
//                        web's z lines (it shares those nodes), thickness stiffener_thickness.
// The web-flange junctions are shared node lines. Region indices (ShellElement::region) name
// ShellModel::region_names = {"top_flange", "bottom_flange", "web", "stiffener"}.
// Quads are counter-clockwise about one normal per plate: +z for both flanges, +y for the web,
// +x for stiffeners.
//
// Node lines along x ("stations"): every special x is a station exactly (0, L, loads, lateral
// restraints, stiffeners). Element length:
//   - hinge region: h_e = aspect * b / flange_elements, where the hinge region is
//       cantilever      [0, n h_e],               n = ceil(1.5 max(h, b) / h_e)
//       three_point     [L/2 - n h_e, L/2 + n h_e]
//       four_point      [a - n h_e, L - a + n h_e] (the constant-moment zone and n h_e each side)
//       uniform_moment  [0, L];
//   - outside it, a target size growing linearly with the distance d from the hinge region,
//     s(d) = min(3 h_e, h_e + 0.2 d), i.e. a geometric sequence of ratio 1.2 up to 3 h_e;
//   - each span between consecutive special x's gets ceil(int dx/s) elements, spaced at equal
//     increments of int dx/s, so no element exceeds its target; the hinge region's ends are node
//     lines too where they lie at least h_e from every special x, so that the hinge elements
//     next to the support (cantilever) or the load (beams) are exactly h_e;
//   - where neighbouring elements still differ by more than 25 % (short spans, rounding), the
//     target is lowered over the larger element to 1.2 times the smaller one, re-limited to the
//     slope 0.2, and the spans are placed again (at most 100 rounds).
//   Elements near a special x may thus be shorter than h_e (two special x's closer than h_e give
//   one short element between them and a graded transition around it). Special x's closer than
//   1e-6 L share one node line.
//
// Supports, loads and groups per setup (load factor 1 gives M = Mp of the plate model):
//   cantilever: x = 0 section, group "support", all six DOFs fixed. x = L section, group
//     "end_section", tied rigidly (RigidTie) to the reference node at (L, 0, 0), group
//     "load_point" (used by no element), which is fixed in uy and rx; reference load
//     F_z = -Mp / L at "load_point" (M = P L at the support).
//   three_point: bearings at the bottom-flange centre-line node over each support, groups
//     "bearing_a" (x = 0; ux, uy, uz fixed) and "bearing_b" (x = L; uy, uz fixed); twist held by
//     fixing uy of the top-flange centre-line node there, groups "twist_a", "twist_b". Load
//     P = 4 Mp / L downward at the top-flange centre-line node at L/2, group "load_point"
//     (M = P L / 4). Group "midspan_bottom": the bottom-flange centre-line node at L/2.
//   four_point: as three_point, with P = Mp / a at each of the top-flange centre-line nodes at
//     x = a and L - a, groups "load_point_a", "load_point_b" (a = (L - load_spacing)/2; M = P a).
//     Groups "deflection_a", "deflection_b": the bottom-flange centre-line nodes at a and L - a.
//   uniform_moment: both end sections tied rigidly to reference nodes at (0, 0, 0) and (L, 0, 0),
//     groups "end_section_a" -> "end_a" and "end_section_b" -> "end_b"; each reference node fixed
//     in uy, uz, rx, "end_a" also in ux; moments M_y = +Mp at "end_a" and -Mp at "end_b" (sagging:
//     the top flange in compression).
//   Stiffeners (StiffenerPlacement::supports_and_loads): over the supports and under the loads of
//     three_point / four_point; none at the rigidly tied or fully fixed end sections of cantilever
//     and uniform_moment (they could not deform). Listed positions are added in either mode except
//     StiffenerPlacement::none; a listed position at a rigid end section is skipped likewise.
//   Lateral restraints: restraint k fixes uy of the flange centre-line node(s) (y = 0) of the
//     chosen flange(s) at x_k, group "restraint_<k>". At a rigidly tied end section the group is
//     created but no Support added: the reference node's uy and rx supports already hold both
//     flanges there.
//   Axial load (cantilever, uniform_moment): N = axial_load_ratio * A_plate * fy, compression
//     positive, as ShellModel::fixed_loads force -N e_x at "load_point" (cantilever) or at "end_b"
//     (uniform_moment; the ux support of "end_a" reacts it).
//
// Hinge rotation theta (interface.md, "Definitions the numbers follow") is sum_i w_i u_i, u_i the
// `dof` displacement of nodes[i] (HingeRotation):
//   cantilever      theta = delta_tip / L,  delta_tip = -uz("load_point");
//   three_point     theta = 4 delta_mid / L, delta_mid = -uz("midspan_bottom");
//   four_point      theta = 2 delta / a, delta the mean of -uz at "deflection_a" and
//                   "deflection_b": the relative rotation of the chords from the bearings to the
//                   load points, which bound the constant-moment zone;
//   uniform_moment  theta = ry("end_a") - ry("end_b"), the relative rotation of the end sections.

#include "model/section/i_section.hpp"
#include "model/shell_model.hpp"

#include <optional>
#include <vector>

namespace rotcap {

/// Loading arrangement (same order as the case file's "setup" values).
enum class HingeSetup { cantilever, three_point, four_point, uniform_moment };
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
  int flange_elements = 8;    ///< across the full flange width; even, >= 4
  int web_elements = 10;      ///< over the web depth h - tf; >= 4
  double aspect = 1.0;        ///< element length / flange element width in the hinge region, > 0
  double axial_load_ratio = 0.0;  ///< N / (A_plate fy), 0 <= n < 1; cantilever, uniform_moment only
  double fy = 355.0;          ///< [MPa] > 0, for Mp and N
  CantileverSupport cantilever_support = CantileverSupport::fixed;
};

/// How the hinge rotation follows from the displacements: theta = sum_i weights[i] * u(nodes[i], dof).
struct HingeRotation {
  std::vector<int> nodes;
  Dof dof = Dof::uz;
  std::vector<double> weights;  ///< [1/mm] for translations, [-] for rotations
};

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
  std::vector<double> stiffener_x; ///< x of the stiffeners meshed [mm]
  HingeRotation rotation;
};

/// Builds the model. Throws std::invalid_argument naming the case-file key of a bad value
/// ("member.length", "member.load_spacing", "member.axial_load_ratio", "member.stiffeners",
/// "member.stiffeners[k]" (k from 0),
/// "member.stiffener_thickness", "restraints.lateral[k].x", "mesh.flange_elements",
/// "mesh.web_elements", "mesh.aspect", "steel.fy", or a "section.*" key from validate()).
HingeZoneModel build_hinge_zone(const HingeZoneSpec& spec);

/// Beam-theory hinge rotation at M = Mp by the same definition as HingeZoneModel::rotation, for
/// Young's modulus E [MPa] and the plate model's Iy, shear deformation neglected:
/// cantilever and three_point Mp L/(3 E I); four_point Mp (3 L - 4 a)/(3 E I); uniform_moment
/// Mp L/(E I).
double beam_theory_rotation_at_mp(const HingeZoneModel& m, double E);

struct MeshStatistics {
  int nodes = 0;
  int elements = 0;
  int dofs = 0;          ///< 6 per node
  int tied_nodes = 0;    ///< nodes of rigid-tie groups (their DOFs are eliminated)
  int fixed_dofs = 0;    ///< distinct (node, DOF) pairs held by supports
  int free_dofs = 0;     ///< dofs - 6 tied_nodes - fixed_dofs: the unknowns of the solve
};

MeshStatistics mesh_statistics(const ShellModel& model);

}  // namespace rotcap
