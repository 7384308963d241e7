#pragma once
// CaseInput: everything a case file says. Where a component has an options struct of its own
// (ISection, HingeZoneSpec, SteelModel, PathOptions, LayeredShellSection::Options), the case file
// fills that struct directly and the component validates it (its validate(), throwing OptionError);
// io adds only what no component owns (the model kind, imperfection amplitudes, stopping rules,
// general-model groups). The schema (keys, types, limits) is documented in io/case_file.hpp.
// Units: mm, N, MPa, rad. Values here are validated (read_case_file checks every limit), except
// that mesh group names are checked only when the mesh is read (io/general_model.hpp).
// `line` members are the 1-based case-file lines of the values, for later error messages.

#include "materials/layered_shell_section.hpp"
#include "materials/steel_curve.hpp"
#include "model/hinge/rotation_demand.hpp"
#include "model/hinge_zone/hinge_zone_mesher.hpp"
#include "model/patterns/residual_stress.hpp"
#include "model/shell_model.hpp"
#include "solver/path/path_follower.hpp"
#include "solver/path/step_constraint.hpp"

#include <array>
#include <filesystem>
#include <optional>
#include <span>
#include <string>
#include <string_view>
#include <vector>

namespace rotcap {

enum class ModelKind { generated, general };  ///< [section]+[member], or [model] with a mesh
enum class LocalImperfection { none, buckling_mode, half_sine };
enum class Control { linear, load, displacement, arc_length };

/// Case-file spellings of an enum's values, in the order of the enum ("elastic", ...). The enums
/// themselves belong to the components that use them (materials, model, solver); io owns only
/// their spellings.
template <class Enum>
std::span<const std::string> enum_names();
template <> std::span<const std::string> enum_names<ModelKind>();
template <> std::span<const std::string> enum_names<SteelCurveKind>();
template <> std::span<const std::string> enum_names<HingeSetup>();
template <> std::span<const std::string> enum_names<StiffenerPlacement>();
template <> std::span<const std::string> enum_names<CantileverSupport>();
template <> std::span<const std::string> enum_names<RestrainedFlange>();
template <> std::span<const std::string> enum_names<LocalImperfection>();
template <> std::span<const std::string> enum_names<ResidualStressKind>();
template <> std::span<const std::string> enum_names<Control>();
template <> std::span<const std::string> enum_names<StepRule>();
template <> std::span<const std::string> enum_names<ArcLength::Form>();
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

struct ImperfectionInput {
  LocalImperfection local = LocalImperfection::buckling_mode;  ///< general models: none
  Amplitude local_amplitude{Amplitude::Kind::ratio, 0.0, "b", 200.0, "b/200"};
  Amplitude global_amplitude{Amplitude::Kind::ratio, 0.0, "L", 1000.0, "L/1000"};  ///< general: 0
  int mode = 1;  ///< buckling_mode: the n-th LOCAL mode (1 = the lowest local one), >= 1
  int sign = 1;  ///< +1 or -1: the local pattern as computed or reversed (not with local = none)
};

/// A DOF of a group (the group mean for recorded curve columns).
struct GroupDof {
  std::string group;
  Dof dof = Dof::ux;
  int line = 0;
};

/// [analysis]: the path-following options (owned and validated by PathOptions) and the stopping
/// rules of the app.
struct AnalysisInput {
  Control control = Control::arc_length;  ///< general models: linear
  PathOptions path;                       ///< tolerances, step sizes, max_steps (generated models:
                                          ///< first_step 0.05, max_step_ratio 1)
  ArcLength::Form arc_length_form = ArcLength::Form::Cylindrical;
  double max_rotation = 0.15;             ///< generated models: stop at this hinge rotation [rad]
  double stop_below = 0.75;               ///< stop when M (or load factor) < stop_below * max
  std::optional<double> max_load_factor;  ///< general models (control = load: default 1)
  std::optional<GroupDof> control_dof;    ///< general models, control = displacement
  std::optional<double> max_displacement; ///< with control_dof [mm or rad]
  std::vector<GroupDof> record_dofs;      ///< general models: curve.csv columns "dof@group"
};

struct BucklingInput {
  int modes = 4;  ///< number of lowest load factors, >= 1
};

struct OutputInput {
  int fields_every = 5;  ///< VTK fields every N converged steps (and at peak and end), >= 1
  /// checkpoint.h5 every N converged steps and at a stop (0: none), >= 0; also at the start state.
  int checkpoint_every = 1;
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
  // Generated models: [section] -> zone.section, [member], [restraints] lateral, [mesh]
  // flange_elements, web_elements, aspect, tension_coarsening, far_element_length,
  // far_growth; zone.fy is steel.fy.
  HingeZoneSpec zone;
  ResidualStressKind residual_stress = ResidualStressKind::none;
  std::optional<RotationDemand> demand;  ///< [demand]: required plastic rotation or R
  // Both kinds:
  SteelModel steel;  ///< general models without fy: curve = "table" takes the table's first stress,
                     ///< "elastic" uses none; fu defaults to fy where the curve does not use it
  ImperfectionInput imperfection;
  LayeredShellSection::Options layers;  ///< [mesh] layers
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
