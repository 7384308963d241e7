#pragma once
// The residual-stress field of a hinge-zone model at the Gauss points of every shell element, ready
// to be set as initial layer stresses (constant through the thickness). The pattern is a property
// of the section, not of the imperfect coordinates: the field is evaluated on the PERFECT model's
// geometry, each Gauss point the mean over its quadrant of the element
// (gauss_point_residual_stresses in model/residual_stress.hpp), in each element's ShellFrame.
#include "model/patterns/residual_stress.hpp"
#include "model/shell_model.hpp"

#include <Eigen/Core>

#include <array>
#include <vector>

namespace rotcap {

/// Local in-plane stresses [MPa] (sigma_xx, sigma_yy, tau_xy in the element frame) at the 2x2 Gauss
/// points of each element of `perfect`, in ShellQ4's Gauss-point order.
using GaussPointStressField = std::vector<std::array<Eigen::Vector3d, 4>>;

GaussPointStressField residual_stress_field(const ResidualStressPattern& pattern, const ShellModel& perfect);

}  // namespace rotcap
