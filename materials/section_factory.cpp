#include "materials/section_factory.hpp"

#include "materials/elastic_shell_section.hpp"
#include "materials/layered_shell_section.hpp"

namespace rotcap {

std::shared_ptr<const ShellSection> make_shell_section(const SteelModel& steel, double thickness,
                                                       int layers,
                                                       const SteelCurveOptions& options, int substeps) {
  validate(steel, options);
  if (!has_yield(steel))
    return std::make_shared<const ElasticShellSection>(steel.E, steel.nu, thickness);
  LayeredShellSection::Options o;
  o.layers = layers;
  J2PlaneStress::Options point;
  point.substeps = substeps;
  return std::make_shared<const LayeredShellSection>(
      J2PlaneStress(steel.E, steel.nu, hardening_curve(steel, options), point), thickness, o);
}

}  // namespace rotcap
