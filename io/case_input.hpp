#pragma once
// CaseInput: everything a case file says, as plain structs with the schema's defaults. The schema
// itself (keys, types, limits) is documented in io/case_file.hpp, which fills these structs.
// Units: mm, N, MPa, rad. Values here are validated (read_case_file checks every limit), except
// that mesh group names are checked only when the mesh is read (io/general_model.hpp).
// `line` members are the 1-based case-file lines of the values, for later error messages.

#include "model/shell_model.hpp"

#include <array>
#include <filesystem>
#include <optional>
#include <span>
#include <string>
#include <string_view>
#include <vector>

namespace rotcap {

enum class ModelKind { generated, general };  ///< [section]+[member], or [model] with a mesh
enum class SteelCurve { elastic, elastic_plastic, bilinear, quadlinear, table };
enum class Setup { cantilever, three_point, four_point, uniform_moment };
enum class StiffenerLayout { supports_and_loads, none, positions };
enum class SupportKind { fixed, symmetry };  ///< cantilever support section
enum class Flange { both, top, bottom };
enum class LocalImperfection { none, buckling_mode, half_sine };
enum class ResidualPattern { none, hot_rolled, welded };
enum class Control { linear, load, displacement, arc_length };
enum class ArcLengthForm { cylindrical, normal_plane };

/// Case-file spellings of an enum's values, in the order of the enum ("elastic", ...).
template <class Enum>
std::span<const std::string> enum_names();
template <> std::span<const std::string> enum_names<ModelKind>();
template <> std::span<const std::string> enum_names<SteelCurve>();
template <> std::span<const std::string> enum_names<Setup>();
template <> std::span<const std::string> enum_names<StiffenerLayout>();
template <> std::span<const std::string> enum_names<SupportKind>();
template <> std::span<const std::string> enum_names<Flange>();
template <> std::span<const std::string> enum_names<LocalImperfection>();
template <> std::span<const std::string> enum_names<ResidualPattern>();
template <> std::span<const std::string> enum_names<Control>();
template <> std::span<const std::string> enum_names<ArcLengthForm>();
template <class Enum>
const std::string& enum_name(Enum value) {
  return enum_names<Enum>()[static_cast<std::size_t>(value)];
}

/// An imperfection amplitude: a length in mm, or a ratio "b/200" of a named length.
struct Amplitude {
  enum class Kind { millimetres, ratio };
  Kind kind = Kind::millimetres;
  double millimetres = 0.0;  ///< kind == millimetres: the amplitude [mm], >= 0
  std::string base;          ///< kind == ratio: "b" (width of the buckled plate),
                             ///< "h" (section depth) or "L" (member length)
  double divisor = 1.0;      ///< kind == ratio: > 0; amplitude = base length / divisor
  std::string text;          ///< as written ("b/200", or the number formatted)

  /// The amplitude [mm] for the given base length [mm] (ignored for kind == millimetres).
  double resolve(double base_length) const {
    return kind == Kind::millimetres ? millimetres : base_length / divisor;
  }
};

struct SectionInput {             ///< doubly symmetric I-section, overall dimensions [mm]
  std::string designation;        ///< canonical table name ("IPE 450"); empty when given by plates
  double depth = 0.0;             ///< h
  double flange_width = 0.0;      ///< b
  double flange_thickness = 0.0;  ///< tf
  double web_thickness = 0.0;     ///< tw
  double root_radius = 0.0;       ///< r of a rolled section (handbook properties only), >= 0
  double weld_throat = 0.0;       ///< a of a welded section (handbook properties only), >= 0
};

struct SteelInput {
  double E = 210000.0;  ///< [MPa] (EN 1993-1-1 3.2.6)
  double nu = 0.3;      ///< (EN 1993-1-1 3.2.6)
  std::optional<double> fy;  ///< [MPa]; required except for curve = elastic in general models
  std::optional<double> fu;  ///< [MPa]; required for quadlinear and bilinear
  SteelCurve curve = SteelCurve::quadlinear;
  std::optional<double> hardening_modulus;  ///< bilinear only [MPa]
  std::vector<std::array<double, 2>> table;  ///< curve = table: [true stress MPa, eq. plastic strain]
};

struct MemberInput {
  Setup setup = Setup::cantilever;
  double length = 0.0;                ///< cantilever: support to load; beams: span [mm]
  std::optional<double> load_spacing; ///< four_point only: distance between the loads [mm]
  double axial_load_ratio = 0.0;      ///< N / N_pl, compression positive, 0 <= n < 1
  SupportKind support = SupportKind::fixed;  ///< cantilever only: fully fixed or a symmetry plane
  StiffenerLayout stiffeners = StiffenerLayout::supports_and_loads;
  std::vector<double> stiffener_positions;   ///< StiffenerLayout::positions: x [mm], ascending
  std::optional<double> stiffener_thickness; ///< [mm]; default tf
};

struct LateralRestraint {
  double x = 0.0;  ///< position along the member [mm], 0 <= x <= length
  Flange flange = Flange::both;
};

struct ImperfectionInput {
  LocalImperfection local = LocalImperfection::buckling_mode;  ///< general models: none
  Amplitude local_amplitude{Amplitude::Kind::ratio, 0.0, "b", 200.0, "b/200"};
  Amplitude global_amplitude{Amplitude::Kind::ratio, 0.0, "L", 1000.0, "L/1000"};  ///< general: 0
};

struct MeshInput {
  /// Defaults: the demo mesh study's converged level, 9 elements per flange outstand
  /// (bench/results/demo_mesh_study.txt); coarser meshes overstate the rotations.
  int flange_elements = 18; ///< across the full flange width, even, >= 4
  int web_elements = 23;    ///< over the web depth, >= 4
  double aspect = 1.0;      ///< element length along the member / flange element width, > 0
  int layers = 5;           ///< through-thickness points, odd, 3..15
};

/// A DOF of a group (the group mean for monitors).
struct GroupDof {
  std::string group;
  Dof dof = Dof::ux;
  int line = 0;
};

struct AnalysisInput {
  Control control = Control::arc_length;  ///< general models: linear
  double force_tolerance = 1e-6;          ///< |r| <= tol |f_ref|
  double displacement_tolerance = 1e-4;   ///< |du| <= tol |u increment of the step|
  int max_iterations = 20;
  double first_step = 0.1;                ///< load-factor size of the first step
  double min_step_ratio = 1e-4;           ///< cut-back floor, relative to first_step
  double max_step_ratio = 10.0;           ///< largest step, relative to first_step
  int target_iterations = 6;              ///< step-size adaptation target
  ArcLengthForm arc_length_form = ArcLengthForm::cylindrical;
  double max_rotation = 0.15;             ///< generated models: stop at this hinge rotation [rad]
  double stop_below = 0.75;               ///< stop when M (or load factor) < stop_below * max
  int max_steps = 500;
  std::optional<double> max_load_factor;  ///< general models (control = load: default 1)
  std::optional<GroupDof> control_dof;    ///< general models, control = displacement
  std::optional<double> max_displacement; ///< with control_dof [mm or rad]
  std::vector<GroupDof> monitor;          ///< general models: curve.csv columns "dof@group"
};

struct BucklingInput {
  int modes = 4;  ///< number of lowest load factors, >= 1
};

struct OutputInput {
  int fields_every = 5;  ///< VTK fields every N converged steps (and at peak and end), >= 1
};

struct ModelInput {
  std::filesystem::path mesh;      ///< resolved against the case file's folder
  std::string mesh_as_written;
  std::optional<double> thickness; ///< default for elements no [[thickness]] covers [mm]
  int line = 0;                    ///< of the mesh key
};

struct ThicknessInput {
  std::string group;  ///< a physical surface
  double value = 0.0; ///< [mm], > 0
  int line = 0;
};

struct SupportInput {
  std::string group;
  std::array<bool, kDofsPerNode> fixed{};  ///< indexed by Dof
  int line = 0;
};

struct LoadInput {
  std::string group;
  std::array<double, 3> force{};   ///< total [N], global axes
  std::array<double, 3> moment{};  ///< total [N mm]
  int line = 0;
};

struct CaseInput {
  std::filesystem::path file;  ///< the case file as given
  std::string title;
  ModelKind kind = ModelKind::generated;
  // Generated models ([section] + [member]):
  SectionInput section;
  MemberInput member;
  std::vector<LateralRestraint> lateral_restraints;
  ResidualPattern residual_stress = ResidualPattern::none;
  // Both kinds:
  SteelInput steel;
  ImperfectionInput imperfection;
  MeshInput mesh;
  AnalysisInput analysis;
  BucklingInput buckling;
  OutputInput output;
  // General models ([model], [[thickness]], [[support]], [[load]]):
  ModelInput model;
  std::vector<ThicknessInput> thickness;
  std::vector<SupportInput> supports;
  std::vector<LoadInput> loads;
};

}  // namespace rotcap
