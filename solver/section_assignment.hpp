#pragma once
// SectionAssignment: which ShellSection each element of a model uses.
//
// Owns one section object per distinct (material, thickness) pair and an index per element, so a
// mesh of thousands of elements with two plate thicknesses holds two section objects. Sections
// are immutable and stateless to the caller (history lives in the solver's LayerState arrays), so
// several threads may use one section concurrently.
//
// Factories: elastic() builds ElasticShellSection (materials/elastic_shell_section.hpp) from E, nu
// and each element's thickness; for_steel() the section a steel model calls for at each thickness
// (materials/section_factory.hpp). Others through add_section()/assign().

#include "materials/layered_shell_section.hpp"
#include "materials/shell_section.hpp"
#include "materials/steel_curve.hpp"
#include "model/shell_model.hpp"

#include <memory>
#include <vector>

namespace rotcap {

class SectionAssignment {
 public:
  SectionAssignment() = default;
  SectionAssignment(SectionAssignment&&) = default;
  SectionAssignment& operator=(SectionAssignment&&) = default;

  /// Elastic isotropic sections: E > 0 [MPa], -1 < nu < 0.5, one per distinct element thickness
  /// (exact equality of the doubles). Throws std::invalid_argument on bad E, nu or thickness.
  static SectionAssignment elastic(const ShellModel& model, double E, double nu);

  /// One section per distinct element thickness from make_shell_section(steel, t, layers): layered
  /// J2 sections, or elastic ones for curve = "elastic" or elastic_only (linear and buckling
  /// analyses use E and nu alone). Throws OptionError for an invalid steel model or layer count.
  static SectionAssignment for_steel(const ShellModel& model, const SteelModel& steel,
                                     const LayeredShellSection::Options& layers, bool elastic_only);

  /// Adds a section and returns its index.
  int add_section(std::shared_ptr<const ShellSection> section);
  /// Element e (0 <= e < element_count()) uses section s (0 <= s < section_count()); grows the
  /// element table as needed (unassigned elements get -1).
  void assign(int element, int section);

  int section_count() const { return static_cast<int>(sections_.size()); }
  int element_count() const { return static_cast<int>(index_.size()); }
  const ShellSection& section(int s) const { return *sections_[s]; }
  /// Index of element e's section, -1 if unassigned.
  int index(int element) const { return index_[element]; }
  /// Section of element e; e must be assigned.
  const ShellSection& of(int element) const { return *sections_[index_[element]]; }

  /// Throws std::invalid_argument unless every one of model's elements has a section whose
  /// thickness equals the element's thickness (relative 1e-12).
  void check(const ShellModel& model) const;

 private:
  std::vector<std::shared_ptr<const ShellSection>> sections_;
  std::vector<int> index_;
};

}  // namespace rotcap
