#pragma once
// The membrane-bending strain operator B (6 x 24) of a ShellQ4 Gauss point, applied without
// forming it. At node i with shape-function derivatives (nx, ny) = dN_i/d(x, y) its entries are
// (shell_q4.hpp, strains)
//   e_xx: nx u;  e_yy: ny v;  g_xy: ny u + nx v;  k_xx: nx ry;  k_yy: -ny rx;  k_xy: ny ry - nx rx,
// so it touches only u, v, rx, ry of each node (DOF order of shell_q4.hpp, flat DOFs). The tangent
// kernels (kernels/tangent_kernels.inc) apply it the same way inside B^T C B.
// dn: dN/dx (row 0) and dN/dy (row 1) of the four nodes [1/mm].

#include "materials/shell_section.hpp"

#include <Eigen/Core>

namespace rotcap::strain_operator {

/// g = B d: generalised strains [e_xx, e_yy, g_xy, k_xx, k_yy, k_xy] of the flat DOFs d.
inline Vec6 apply(const Eigen::Matrix<double, 2, 4>& dn, const Eigen::Matrix<double, 24, 1>& d) {
  Vec6 g = Vec6::Zero();
  for (int i = 0; i < 4; ++i) {
    const double nx = dn(0, i), ny = dn(1, i);
    const double u = d(6 * i), v = d(6 * i + 1), rx = d(6 * i + 3), ry = d(6 * i + 4);
    g(0) += nx * u;
    g(1) += ny * v;
    g(2) += ny * u + nx * v;
    g(3) += nx * ry;
    g(4) -= ny * rx;
    g(5) += ny * ry - nx * rx;
  }
  return g;
}

/// f += B^T s for resultant-like s (the work-conjugate nodal forces of s).
inline void add_transpose(const Eigen::Matrix<double, 2, 4>& dn, const Vec6& s, Eigen::Matrix<double, 24, 1>& f) {
  for (int i = 0; i < 4; ++i) {
    const double nx = dn(0, i), ny = dn(1, i);
    f(6 * i) += nx * s(0) + ny * s(2);
    f(6 * i + 1) += ny * s(1) + nx * s(2);
    f(6 * i + 3) -= ny * s(4) + nx * s(5);
    f(6 * i + 4) += nx * s(3) + ny * s(5);
  }
}

}  // namespace rotcap::strain_operator
