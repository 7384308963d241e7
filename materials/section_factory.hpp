#pragma once
// make_shell_section: the ShellSection a steel model and a plate thickness call for.
//   steel.curve = "elastic"  -> ElasticShellSection(E, nu, t)        (layers() = 0)
//   any other curve          -> LayeredShellSection of J2PlaneStress(E, nu, hardening_curve(steel))
//                               with `layers` Simpson points (odd, 3..15), `substeps` per plastic update
// Throws std::invalid_argument (naming the case-file key) for an invalid model, t <= 0 or a bad
// layer count. The section is immutable and may be shared by all elements of one thickness.

#include "materials/j2_plane_stress.hpp"
#include "materials/shell_section.hpp"
#include "materials/steel_curve.hpp"

#include <memory>

namespace rotcap {

std::shared_ptr<const ShellSection> make_shell_section(const SteelModel& steel, double thickness,
                                                       int layers = 5,
                                                       const SteelCurveOptions& options = {},
                                                       int substeps = J2PlaneStress::Options{}.substeps);

}  // namespace rotcap
