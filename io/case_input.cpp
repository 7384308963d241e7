#include "io/case_input.hpp"

namespace rotcap {

namespace {
// The spellings, in the order of each enum's values.
const std::string kModelKind[] = {"generated", "general"};
const std::string kSteelCurve[] = {"elastic", "elastic_plastic", "bilinear", "quadlinear", "table"};
const std::string kSetup[] = {"cantilever", "three_point", "four_point", "uniform_moment"};
const std::string kStiffenerLayout[] = {"supports_and_loads", "none", "positions"};
const std::string kSupportKind[] = {"fixed", "symmetry"};
const std::string kFlange[] = {"both", "top", "bottom"};
const std::string kLocalImperfection[] = {"none", "buckling_mode", "half_sine"};
const std::string kResidualPattern[] = {"none", "hot_rolled", "welded"};
const std::string kControl[] = {"linear", "load", "displacement", "arc_length"};
const std::string kArcLengthForm[] = {"cylindrical", "normal_plane"};
}  // namespace

template <> std::span<const std::string> enum_names<ModelKind>() { return kModelKind; }
template <> std::span<const std::string> enum_names<SteelCurve>() { return kSteelCurve; }
template <> std::span<const std::string> enum_names<Setup>() { return kSetup; }
template <> std::span<const std::string> enum_names<StiffenerLayout>() { return kStiffenerLayout; }
template <> std::span<const std::string> enum_names<SupportKind>() { return kSupportKind; }
template <> std::span<const std::string> enum_names<Flange>() { return kFlange; }
template <> std::span<const std::string> enum_names<LocalImperfection>() { return kLocalImperfection; }
template <> std::span<const std::string> enum_names<ResidualPattern>() { return kResidualPattern; }
template <> std::span<const std::string> enum_names<Control>() { return kControl; }
template <> std::span<const std::string> enum_names<ArcLengthForm>() { return kArcLengthForm; }

}  // namespace rotcap
