#pragma once
// Hinge-zone mesher: the shell model of an I-beam segment (docs/spec/mechanics.md, "The hinge-zone model";
// docs/spec/interface.md, "Supports and loading of the generated setups").
//
// Geometry (mm): x along the member (0 <= x <= L), z vertical (up), y lateral; the web lies in
// the x-z plane at y = 0. Plates on their centre lines (model/section/i_section.hpp, plate model):
//   top / bottom flange  z = +-(h - tf)/2, width b, thickness tf, n equal elements across
//                        (y_k = -b/2 + k b/n; k = n/2 is y = 0); n = flange_elements for the
//                        compression flange, fewer for the tension flange (below);
//   web                  y = 0, from flange to flange, thickness tw, over h - tf;
//   stiffener            a transverse plate in the y-z plane at its x, on both sides of the web,
//                        full flange width and full web depth, on the compression flange's y
//                        lines and the web's z lines (it shares those nodes), thickness
//                        stiffener_thickness; next to a coarser tension flange one transition
//                        row: a quad per narrow cell, six quads (three extra nodes halfway)
//                        per pair of wide cells, so it meets that flange node to node.
// Cross-section grid (section_grading.hpp; the same at every station): the setup says which
// flange is in compression (LoadingSetup::top_flange_in_compression: hogging cantilever the
// bottom, the beams and uniform moment the top). With c = tension_coarsening (1 <= c <= 3):
//   - compression flange: flange_elements equal elements; tension flange: about
//     flange_elements / c, at least half as many and at least 4, on a subset of the compression
//     flange's y lines (per half, from the web outwards, cells of one fine width, then pairs of
//     cells of two fine widths; section_grading.hpp);
//   - web: the fine size (h - tf) / web_elements from the compression flange to the plastic
//     neutral axis under the axial load (mid-depth moved N / (2 fy tw) towards the tension
//     flange), then growing by at most 1.42 per element up to c times the fine size;
//   - c = 1 is the uniform grid: flange_elements across both flanges, web_elements equal ones.
// The web-flange junctions are shared node lines (node numbering: section_grid.hpp). Region
// indices (ShellElement::region) name ShellModel::region_names = {"top_flange", "bottom_flange",
// "web", "stiffener"}. Quads are counter-clockwise about one normal per plate: +z for both
// flanges, +y for the web, +x for stiffeners.
//
// Node lines along x ("stations", station_grading.hpp): every special x is a station exactly (0,
// L, the setup's loads, lateral restraints, stiffeners). Element length:
//   - hinge region: h_e = aspect * b / flange_elements; the setup places the hinge region from
//     its reach n h_e, n = ceil(1.5 max(h, b) / h_e) (LoadingSetup::stations);
//   - outside it, a target size growing linearly with the distance d from the hinge region,
//     s(d) = min(F h_e, h_e + g d), i.e. a geometric sequence of ratio 1 + g up to F h_e,
//     F = far_element_length (default 6) but at most b / (2 h_e) (>= 1), g = far_growth
//     (default 0.3);
//   - each span between consecutive special x's gets ceil(int dx/s) elements, spaced at equal
//     increments of int dx/s, so no element exceeds its target; the hinge region's ends are node
//     lines too where they lie at least h_e from every special x, so that the hinge elements
//     next to the support (cantilever) or the load (beams) are exactly h_e;
//   - where neighbouring elements still differ by more than 1.05 + g (short spans, rounding),
//     the target is lowered over the larger element to 1 + g times the smaller one, re-limited
//     to the slope g, and the spans are placed again (at most 100 rounds).
//   Elements near a special x may thus be shorter than h_e (two special x's closer than h_e give
//   one short element between them and a graded transition around it). Special x's closer than
//   1e-6 L share one node line.
//
// Supports, loads, groups, the hinge region, the axial load and the hinge rotation of each setup
// (load factor 1 gives M = Mp of the plate model): its class in model/setups/
// (cantilever_setup.hpp, three_point_setup.hpp, four_point_setup.hpp, uniform_moment_setup.hpp).
// What the mesher adds for every setup:
//   Stiffeners: StiffenerPlacement::supports_and_loads places the setup's own (over the supports
//     and under the loads of the beams; none at the rigidly tied or fully fixed end sections,
//     which could not deform). Listed positions are added in either mode except
//     StiffenerPlacement::none; a listed position at a rigid end section is skipped likewise.
//   Lateral restraints: restraint k fixes uy of the flange centre-line node(s) (y = 0) of the
//     chosen flange(s) at x_k, group "restraint_<k>". At a rigidly tied end section
//     (LoadingSetup::tied_section) the group is created but no Support added: the reference
//     node's uy and rx supports already hold both flanges there.
//   Axial load (setups with LoadingSetup::allows_axial_load()): N = axial_load_ratio * A_plate *
//     fy, compression positive (HingeZoneModel::axial_force); the setup applies it.
//
// Hinge rotation theta (docs/spec/interface.md, "Definitions the numbers follow") is sum_i w_i u_i, u_i the
// `dof` displacement of nodes[i] (HingeRotation); each setup's definition is in its class.

#include "model/hinge_zone/hinge_zone_spec.hpp"

namespace rotcap {

/// Checks every field of the spec (section, fy, mesh counts, setup-specific keys); throws OptionError
/// naming the case-file key of the first bad value
/// ("member.length", "member.load_spacing", "member.axial_load_ratio", "member.stiffeners",
/// "member.stiffeners[k]" (k from 0),
/// "member.stiffener_thickness", "restraints.lateral[k].x", "mesh.flange_elements",
/// "mesh.web_elements", "mesh.aspect", "mesh.tension_coarsening",
/// "mesh.far_growth", "mesh.far_element_length", "steel.fy", or a "section.*" key from validate()).
/// The mesh must also stay below kMaxHingeZoneElements shell elements by an estimate (stations
/// at most min(3, far_element_length) hinge element lengths apart over the member, more in the hinge region, times the
/// section's 2 flange_elements + web_elements), reported at "mesh.flange_elements": a longer
/// member or a denser or more slender mesh would exhaust memory (or loop for hours) while building
/// and factorising the model.
inline constexpr double kMaxHingeZoneElements = 1.0e6;
void validate(const HingeZoneSpec& spec);

/// Builds the model (validates the spec first).
HingeZoneModel build_hinge_zone(const HingeZoneSpec& spec);

/// Beam-theory hinge rotation at M = Mp by the same definition as HingeZoneModel::rotation, for
/// Young's modulus E [MPa] > 0 and the plate model's Iy, shear deformation neglected
/// (LoadingSetup::beam_theory_rotation_at_mp: cantilever and three_point Mp L/(3 E I); four_point
/// Mp (3 L - 4 a)/(3 E I); uniform_moment Mp L/(E I)).
double beam_theory_rotation_at_mp(const HingeZoneModel& m, double E);

/// The shear-deformation part of the same rotation at M = Mp (LoadingSetup::shear_rotation_at_mp)
/// for E [MPa] > 0 and 0 <= nu < 0.5, G = E / (2 (1 + nu)), Av = (h - tf) tw of the plate model.
double shear_rotation_at_mp(const HingeZoneModel& m, double E, double nu);

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
