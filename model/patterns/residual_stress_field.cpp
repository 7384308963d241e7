#include "model/patterns/residual_stress_field.hpp"

#include "elements/shell_q4.hpp"

namespace rotcap {

GaussPointStressField residual_stress_field(const ResidualStressPattern& pattern, const ShellModel& perfect) {
  GaussPointStressField at_gp(perfect.elements.size());
  for (int e = 0; e < perfect.element_count(); ++e) {
    Eigen::Matrix<double, 3, 4> X;
    for (int a = 0; a < 4; ++a) X.col(a) = perfect.nodes[perfect.elements[e].nodes[a]];
    at_gp[e] = gauss_point_residual_stresses(pattern, element_plate_region(perfect, e), X, ShellFrame::of(X).rotation);
  }
  return at_gp;
}

}  // namespace rotcap
