#include "model/setups/loading_setup.hpp"

#include "model/setups/cantilever_setup.hpp"
#include "model/setups/four_point_setup.hpp"
#include "model/setups/three_point_setup.hpp"
#include "model/setups/uniform_moment_setup.hpp"

#include <array>
#include <stdexcept>

namespace rotcap {

int HingeZoneMesh::add_reference(const std::string& name, double x) const {
  ShellModel& m = out.model;
  const int ref = m.node_count();
  m.nodes.emplace_back(x, 0.0, 0.0);
  m.groups[name] = point_group(ref);
  return ref;
}

std::unique_ptr<LoadingSetup> make_loading_setup(HingeSetup setup) {
  switch (setup) {
    case HingeSetup::cantilever: return std::make_unique<CantileverSetup>();
    case HingeSetup::three_point: return std::make_unique<ThreePointSetup>();
    case HingeSetup::four_point: return std::make_unique<FourPointSetup>();
    case HingeSetup::uniform_moment: return std::make_unique<UniformMomentSetup>();
  }
  throw std::logic_error("make_loading_setup: unknown HingeSetup " + std::to_string(static_cast<int>(setup)));
}

const LoadingSetup& loading_setup(HingeSetup setup) {
  static const auto all = [] {
    std::array<std::unique_ptr<LoadingSetup>, kHingeSetupCount> a;
    for (int i = 0; i < kHingeSetupCount; ++i) a[i] = make_loading_setup(static_cast<HingeSetup>(i));
    return a;
  }();
  const int i = static_cast<int>(setup);
  if (i < 0 || i >= kHingeSetupCount) throw std::logic_error("loading_setup: unknown HingeSetup " + std::to_string(i));
  return *all[i];
}

const LoadingSetup& HingeZoneModel::loading() const { return loading_setup(setup); }

std::string setup_names_where(bool (LoadingSetup::*rule)() const) {
  std::vector<std::string> names;
  for (int i = 0; i < kHingeSetupCount; ++i) {
    const LoadingSetup& s = loading_setup(static_cast<HingeSetup>(i));
    if ((s.*rule)()) names.push_back('"' + std::string(s.name()) + '"');
  }
  std::string out;
  for (std::size_t k = 0; k < names.size(); ++k)
    out += (k == 0 ? "" : (k + 1 == names.size() ? " or " : ", ")) + names[k];
  return out;
}

}  // namespace rotcap
