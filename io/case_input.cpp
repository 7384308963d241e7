#include "io/case_input.hpp"

#include "model/setups/loading_setup.hpp"

namespace rotcap {

namespace {
// The case-file spellings, in the order of each enum's values.
const std::string kModelKind[] = {"generated", "general"};
// The steel curves' spellings are materials' own (steel_curve_kind_name, used in its messages).
const std::string kSteelCurve[] = {
    steel_curve_kind_name(SteelCurveKind::elastic), steel_curve_kind_name(SteelCurveKind::elastic_plastic),
    steel_curve_kind_name(SteelCurveKind::bilinear), steel_curve_kind_name(SteelCurveKind::quadlinear),
    steel_curve_kind_name(SteelCurveKind::table)};

const std::string kStiffenerPlacement[] = {"supports_and_loads", "none", "positions"};
const std::string kCantileverSupport[] = {"fixed", "symmetry"};
const std::string kRestrainedFlange[] = {"both", "top", "bottom"};
const std::string kLocalImperfection[] = {"none", "buckling_mode", "half_sine"};
const std::string kResidualStress[] = {"none", "hot_rolled", "welded"};
const std::string kControl[] = {"linear", "load", "displacement", "arc_length"};
const std::string kArcLengthForm[] = {"cylindrical", "normal_plane"};
const std::string kStepRule[] = {"iterations", "curve"};
}  // namespace

template <> std::span<const std::string> enum_names<ModelKind>() { return kModelKind; }
template <> std::span<const std::string> enum_names<SteelCurveKind>() { return kSteelCurve; }
template <> std::span<const std::string> enum_names<HingeSetup>() {
  // The setups' spellings are their classes' own (LoadingSetup::name()), in enum order.
  static const std::vector<std::string> names = [] {
    std::vector<std::string> n;
    for (int i = 0; i < kHingeSetupCount; ++i) n.emplace_back(loading_setup(static_cast<HingeSetup>(i)).name());
    return n;
  }();
  return names;
}
template <> std::span<const std::string> enum_names<StiffenerPlacement>() { return kStiffenerPlacement; }
template <> std::span<const std::string> enum_names<CantileverSupport>() { return kCantileverSupport; }
template <> std::span<const std::string> enum_names<RestrainedFlange>() { return kRestrainedFlange; }
template <> std::span<const std::string> enum_names<LocalImperfection>() { return kLocalImperfection; }
template <> std::span<const std::string> enum_names<ResidualStressKind>() { return kResidualStress; }
template <> std::span<const std::string> enum_names<Control>() { return kControl; }
template <> std::span<const std::string> enum_names<ArcLength::Form>() { return kArcLengthForm; }
template <> std::span<const std::string> enum_names<StepRule>() { return kStepRule; }

}  // namespace rotcap
