#pragma once
// Case files: TOML -> CaseInput (io/case_input.hpp). This comment is the case-file reference;
// the README's user documentation follows it. Units: mm, N, MPa, rad.
//
// Strict reading: an unknown key or table anywhere is an error naming it (and the nearest valid
// key); a wrong type names the type found and expected; a value outside its limits names the
// limit; a key that does not apply to the chosen option (e.g. steel.table with curve =
// "bilinear", analysis.record_dofs in a generated model) is an error rather than silently ignored.
// All errors are InputError ("file:line: key: found ...; expected ..."). Which keys a table takes
// is checked here; the values of the keys a component owns are checked by that component right
// after parsing (SteelModel, ISection, HingeZoneSpec with its LoadingSetup, PathOptions,
// LayeredShellSection::Options: their validate() throws OptionError, placed here at the key's line).
// A case is either generated ([section] + [member]) or general ([model] with a Gmsh mesh), never
// both. Integers are accepted where numbers are expected.
//
// key                         type / values                       default        limits
// --------------------------- ----------------------------------- -------------- --------------------
// title                       string                              ""
// [section] (generated)       either designation = "IPE 450" (the built-in table of
//                             model/section/section_table.hpp: IPE, HEA, HEB; any spacing or case), or
//                             depth, flange_width, flange_thickness, web_thickness: numbers, all
//                             required, > 0; 2 flange_thickness < depth; web_thickness <
//                             flange_width; optional root_radius (rolled) or weld_throat
//                             (welded) [mm], default 0, used only for the handbook properties
//                             and checked by model/section/i_section.hpp validate()
// [steel] E                   number                              210000         E > 0
//         nu                  number                              0.3            0 <= nu < 0.5
//         curve               "elastic" | "elastic_plastic" | "bilinear" | "quadlinear" | "table"
//                                                                 "quadlinear"
//         fy                  number; required for generated models and every curve but elastic
//                             and table (a table without fy: its first stress; with fy, the
//                             first stress must equal it within 0.5 %)
//                                                                 -              fy > 0
//                             generated models: 150000 <= E <= 250000, 100 <= fy <= 1500,
//                             150 <= fu <= 2000 (MPa of a structural steel: a unit slip otherwise)
//         fu                  number; bilinear and quadlinear only, required
//                                                                 -              fu >= fy (bilinear: >)
//         hardening_modulus   number; bilinear only, required     -              0 < E_h < E
//         table               [[true stress, eq. plastic strain], ...]; table only, required;
//                             stresses > 0 and non-decreasing, strains start at 0, strictly
//                             increasing
// [member] (generated)
//         setup               "cantilever" | "three_point" | "four_point" | "uniform_moment"
//                                                                 required
//         length              number [mm]                         required       >= section depth
//         load_spacing        number [mm]; four_point only, required          0 < a < length
//         axial_load_ratio    number, N/N_pl, compression > 0     0              0 <= n < 1;
//                                                                                0 for three_point
//                                                                                and four_point
//         support             "fixed" | "symmetry" (cantilever only): the support section fully
//                             fixed, or a symmetry plane (ux, ry, rz at all nodes, uy and uz on the
//                             web line)                            "fixed"
//         stiffeners          "supports_and_loads" | "none" | [x, ...] [mm]
//                                                                 "supports_and_loads"
//                                                                                0 <= x <= length,
//                                                                                strictly increasing
//         stiffener_thickness number [mm] (not with "none")       tf             > 0
// [restraints] (generated)
//         lateral             [{ x = number, flange = "both" | "top" | "bottom" }, ...]
//                                                                 []             0 <= x <= length;
//                                                                                flange default "both"
// [imperfection]
//         local               "none" | "buckling_mode" | "half_sine" (general: no half_sine)
//                                                                 "buckling_mode" (general: "none")
//         local_amplitude     number [mm] or "S/n" with S = b (width of the buckled plate),
//                             h (section depth) or L (member length); general models: number only;
//                             not with local = "none"             "b/200"        >= 0; n > 0
//         mode                integer (local = "buckling_mode" only): which local buckling mode,
//                             1 = the lowest mode classified as flange or web local buckling,
//                             2 the next, ...; [buckling] modes are raised to mode + 3 when fewer
//                                                                 1              >= 1
//         sign                integer (not with local = "none"): 1 the local pattern as computed,
//                             -1 reversed (a buckling mode's sign is arbitrary)
//                                                                 1              1 or -1
//         global_amplitude    as local_amplitude                  "L/1000" (general: 0)
// [residual_stress] (generated)
//         pattern             "none" | "hot_rolled" | "welded"    "none"
// [mesh]  flange_elements     integer (generated only)            18             even, >= 4
//         web_elements        integer (generated only)            23             >= 4
//         aspect              number (generated only)             1.0            > 0
//         tension_coarsening  number (generated only): tension flange about flange_elements / c
//                             across, web tension part up to c times the fine size; 1 uniform
//                                                                 2.0            1 <= c <= 3
//         far_element_length  number (generated only): largest element length along the member
//                             outside the hinge region, in hinge element lengths (<= b/2)
//                                                                 6.0            1..10
//         far_growth          number (generated only): growth of the element length per element
//                             along the member outside the hinge region
//                                                                 0.3            0.05..0.5
//         layers              integer                             5              odd, 3..15
// [analysis]
//         control             "linear" | "load" | "displacement" | "arc_length"
//                                                                 "arc_length" (general: "linear")
//         force_tolerance     number: |residual| <= tol * |reference load|
//                                                                 1e-6           0 < tol < 1
//         displacement_tolerance  number: |correction| <= tol * |step increment|
//                                                                 1e-4           0 < tol < 1
//         max_iterations      integer, Newton iterations per step 20             >= 1
//         first_step          number: load-factor size of the first step (arc length: the first
//                             arc expressed as a load-factor step)
//                                                                 0.1 (generated: 0.05)  > 0
//         min_step_ratio      number: cut-back floor / first_step 1e-4           0 < r <= 1
//         max_step_ratio      number: largest step / first_step   10 (generated: 20)  >= 1
//         step_rule           "curve" | "iterations": steps sized by the monitored curve (the hinge
//                             rotation; general: control_dof, required) or by the iteration count
//                                                                 "iterations" (generated: "curve")
//         plastic_step        number: step_rule "curve", plastic rotation per step / its elastic
//                             value at load factor 1               0.1            0 < p < 1
//         turning_step        number [degrees]: step_rule "curve", turn of the normalised curve
//                             per step                             10             0 < a <= 45
//         target_iterations   integer: step-size adaptation target (grow below it, shrink
//                             above twice it)                     6              1 <= t <= max_iterations
//         material_substeps   integer: backward-Euler substeps of a plastic layer update
//                                                                 4              1 <= n <= 64
//         arc_length_form     "cylindrical" | "normal_plane"      "cylindrical"
//         max_rotation        number [rad] (generated only): stop at this hinge rotation
//                                                                 0.15           0 < x <= 1
//         stop_below          number: stop on the falling branch when M (general: the load
//                             factor) < stop_below * maximum      0.75           0 < s < 1
//         max_steps           integer                             500            >= 1
//         max_load_factor     number (general only): stop landing on this load factor
//                                                                 control "load": 1; else none
//                                                                                > 0
//         control_dof         { group = string, dof = "ux".."rz" } (general only); required for
//                             control = "displacement"; comes with max_displacement
//         max_displacement    number [mm or rad] (general only): run until control_dof reaches it
//                                                                 -              != 0
//         record_dofs         [{ group, dof }, ...] (general only): curve.csv column "dof@group"
//                             (group mean)                        []
// [demand] (generated; optional): the rotation the collapse mechanism needs at this hinge, one of
//         plastic_rotation_mrad  number [mrad]: required plastic rotation theta_pl,req
//                                                                 -              0 < x <= 1000
//         rotation_capacity   number: required R = theta_u / theta_p - 1
//                                                                 -              0 < R <= 100
//                             The verdict (met / not met / not shown) and its margin are in summary.json
//                             ("demand"), the log, curve.svg and report.html.
// [buckling]
//         modes               integer: lowest load factors to find (`rotcap buckling -n`
//                             overrides); no shift is needed      4              1 <= n <= 50
// [output]
//         fields_every        integer: VTK fields every N converged steps (and at peak and end)
//         checkpoint_every    integer: checkpoint.h5 every N converged steps and at a stop (0: none)
//                                                                 5              >= 1
// [model] (general)
//         mesh                string: Gmsh MSH 4.1 ASCII file, relative to the case file's folder
//                                                                 required       the file exists
//         thickness           number [mm]: elements no [[thickness]] covers
//                                                                 -              > 0
// [[thickness]] (general)  group = physical surface (string), value = number [mm] > 0; both required
// [[support]]   (general)  group = physical group, fix = ["ux", ..., "rz"] (non-empty); both
//                          required; at least one [[support]]
// [[load]]      (general)  group = physical group (required); force = [Fx, Fy, Fz] [N],
//                          moment = [Mx, My, Mz] [N mm], totals shared by tributary length or area;
//                          at least one of force / moment; at least one [[load]]
// Array positions in key paths are 0-based: support[0] is the first [[support]].

#include "io/case_input.hpp"
#include "io/input_error.hpp"

#include <filesystem>
#include <string_view>

namespace rotcap {

/// Reads and validates a case file. Throws InputError on any bad input (missing or unreadable
/// file, TOML syntax, schema). [model] mesh is resolved against the case file's folder and must
/// exist; its contents (and the group names) are checked by build_general_model.
CaseInput read_case_file(const std::filesystem::path& path);

/// The same for TOML text in memory (bundled cases, tests); file names the source in messages
/// and its folder is the base of relative mesh paths.
CaseInput parse_case_text(std::string_view text, const std::filesystem::path& file);

}  // namespace rotcap
