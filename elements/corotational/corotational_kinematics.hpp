#pragma once
// CorotationalKinematics: the element-independent corotational layer of a four-node shell
// (Rankin & Brogan 1986, J. Pressure Vessel Technol. 108:165-174; Felippa & Haugen 2005, CMAME
// 194:2285-2335; Battini & Pacoste 2002/2004 for shells). It removes the rigid-body motion with the
// element frame of corotational_frame.hpp, hands the small local deformation to a core element and
// turns the core's local force and tangent back into global ones.
//
// DOF order of every 24-vector, node by node (nodes 1..4):
//   global  [du_x, du_y, du_z, dw_x, dw_y, dw_z]: translation increments (additive, mm) and spatial
//           spins (rad) with the multiplicative update R_i <- exp(skew(dw_i)) R_i (rotation.hpp);
//   local   [u, v, w, rx, ry, rz] in the element frame: the core element's DOFs (shell_q4.hpp).
// Forces are work-conjugate: N for translations, N mm for rotations.
//
// Deformational displacements, per node i (X: initial, x: current coordinates, R0 / Re: initial /
// current frame rotation, X_c / x_c their centroids, R_i the nodal rotation):
//   u_bar_i     = Re^T (x_i - x_c) - R0^T (X_i - X_c)
//   theta_bar_i = log(Re^T R_i R0)
// Force and consistent tangent (derivation in corotational_kinematics.cpp):
//   f = P^T E H^T f_bar
//   K = P^T E (H^T K_bar + Lambda) H E^T P  -  P^T F G  +  G^T N P_t  -  d(G^T mu)/du
//       (material + moment correction K_M)     (K_GR)       (K_GP)       (spin-fitter variation)
// with E = blockdiag(Re), H = blockdiag(I, H(theta_bar_i)), Lambda = blockdiag(0, L(theta_bar_i,
// m_bar_i)), the projector P = P_t - S G (P_t removes the mean translation, S the rigid rotation
// modes, G the spin-fitter) and mu = S^T E H^T f_bar.
// K is the exact derivative of f with respect to [du, dw] and is NOT symmetric. For a core with a
// strain energy (f_bar = dPi/dd_bar, K_bar symmetric) its skew part is exactly
//   K - K^T = -skew(m_i) in the rotation-rotation block of node i, zero elsewhere,
// m_i the element's nodal moment (global axes): spins at one node do not commute, everything else
// does (tested in corotational_kinematics_test.cpp; Simo 1992, CMAME 96:189-200, on the symmetric
// Hessian at equilibrium). After assembly the skew part is -skew(sum of internal nodal moments),
// which at equilibrium equals -skew(M_ext,i) at nodes with applied moments and vanishes elsewhere.
// So the symmetric part (K + K^T)/2, which the sparse solvers factorise, keeps Newton's convergence
// quadratic when no external moment acts on free rotations (the near-quadratic convergence
// Felippa & Haugen 2005 describe), but only linear at a node loaded by a moment about free
// rotations (measured in corotational_newton_test.cpp: a constant contraction per iteration,
// 0.04-0.14 in the load cases tried, against quadratic for the full tangent). By the
// same identity (derived, not tested here), a moment whose skew(M) couples only restrained
// rotations, e.g. a major-axis moment at a reference node with twist restrained, does not spoil it.

#include "elements/corotational/corotational_frame.hpp"
#include "elements/kernel_dispatch.hpp"

#include <Eigen/Core>
#include <array>

namespace rotcap {

using Vec24 = Eigen::Matrix<double, 24, 1>;
using Mat24 = Eigen::Matrix<double, 24, 24>;
/// R_1..R_4, global axes, identity in the initial configuration.
using NodalRotations = std::array<Eigen::Matrix3d, 4>;

class CorotationalKinematics {
 public:
  /// initial_local: the nodes' initial local coordinates R0^T (X_i - X_c) (the core element's
  /// geometry); initial_rotation: R0, the columns of the initial frame's axes.
  /// x: current nodal coordinates; R: current nodal rotations (orthonormal, det +1).
  /// If the current frame is degenerate (valid() false) nothing else is computed.
  CorotationalKinematics(const NodalCoordinates& initial_local,
                         const Eigen::Matrix3d& initial_rotation, const NodalCoordinates& x,
                         const NodalRotations& R);

  bool valid() const { return frame_.valid(); }
  const CorotationalFrame& frame() const { return frame_; }
  /// d_bar: the local deformational displacements [u_bar_i, theta_bar_i] (local frame).
  const Vec24& local_displacements() const { return d_bar_; }

  /// Global force f and (if K != nullptr) the consistent tangent from the core's local force
  /// f_bar = f_bar(d_bar) and (if K != nullptr) its local tangent K_bar = d f_bar / d d_bar.
  /// K_bar may be nullptr only when K is. Requires valid(). kernels: the tangent kernels' flavour.
  void to_global(const Vec24& f_bar, const Mat24* K_bar, Vec24& f, Mat24* K,
                 const kernels::TangentKernels& kernels) const;
  void to_global(const Vec24& f_bar, const Mat24* K_bar, Vec24& f, Mat24* K) const {
    to_global(f_bar, K_bar, f, K, tangent_kernels(active_kernel()));
  }

  /// The projector P (24 x 24, global axes): P v removes from v its rigid-body part, P S = 0.
  Mat24 projector() const;

 private:
  Eigen::Matrix3d initial_rotation_;
  NodalCoordinates relative_;            // x_i - x_c
  CorotationalFrame frame_;
  Vec24 d_bar_ = Vec24::Zero();
  std::array<Eigen::Matrix3d, 4> H_;     // H(theta_bar_i)
};

/// T = blockdiag(R0^T, ..., R0^T) (8 blocks): global -> local components in the fixed initial
/// frame.
/// The linear (small-rotation) element is f = T^T f_bar(T d), K = T^T K_bar T.
Mat24 fixed_frame_transformation(const Eigen::Matrix3d& initial_rotation);

}  // namespace rotcap
