#include "solver/section_assignment.hpp"

#include "materials/elastic_shell_section.hpp"
#include "materials/section_factory.hpp"

#include <cmath>
#include <map>
#include <stdexcept>
#include <string>

namespace rotcap {

namespace {

/// One section per distinct element thickness (exact equality of the doubles), made by make(t).
template <class Make>
SectionAssignment one_per_thickness(const ShellModel& model, Make make) {
  SectionAssignment out;
  std::map<double, int> by_thickness;
  for (int e = 0; e < model.element_count(); ++e) {
    const double t = model.elements[e].thickness;
    auto it = by_thickness.find(t);
    if (it == by_thickness.end()) it = by_thickness.emplace(t, out.add_section(make(t))).first;
    out.assign(e, it->second);
  }
  return out;
}

}  // namespace

SectionAssignment SectionAssignment::elastic(const ShellModel& model, double E, double nu) {
  return one_per_thickness(model, [&](double t) { return std::make_shared<const ElasticShellSection>(E, nu, t); });
}

SectionAssignment SectionAssignment::for_steel(const ShellModel& model, const SteelModel& steel,
                                                const LayeredShellSection::Options& layers, bool elastic_only) {
  if (elastic_only || !has_yield(steel)) return elastic(model, steel.E, steel.nu);
  return one_per_thickness(model, [&](double t) { return make_shell_section(steel, t, layers.layers, {}, layers.material_substeps); });
}

int SectionAssignment::add_section(std::shared_ptr<const ShellSection> section) {
  if (!section) throw std::invalid_argument("SectionAssignment::add_section: null section");
  sections_.push_back(std::move(section));
  return section_count() - 1;
}

void SectionAssignment::assign(int element, int section) {
  if (element < 0 || section < 0 || section >= section_count())
    throw std::invalid_argument("SectionAssignment::assign: element " + std::to_string(element) +
                                ", section " + std::to_string(section) + "; need element >= 0 and 0 <= section < " +
                                std::to_string(section_count()));
  if (element >= element_count()) index_.resize(static_cast<std::size_t>(element) + 1, -1);
  index_[element] = section;
}

void SectionAssignment::check(const ShellModel& model) const {
  if (element_count() != model.element_count())
    throw std::invalid_argument("SectionAssignment: " + std::to_string(element_count()) +
                                " elements assigned; the model has " + std::to_string(model.element_count()));
  for (int e = 0; e < model.element_count(); ++e) {
    if (index_[e] < 0)
      throw std::invalid_argument("SectionAssignment: element " + std::to_string(e) + " has no section");
    const double t = model.elements[e].thickness;
    const double ts = sections_[index_[e]]->thickness();
    if (std::abs(ts - t) > 1e-12 * std::abs(t))
      throw std::invalid_argument("SectionAssignment: element " + std::to_string(e) + " has thickness " +
                                  std::to_string(t) + " but its section has " + std::to_string(ts));
  }
}

}  // namespace rotcap
