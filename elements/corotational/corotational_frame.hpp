#pragma once
// CorotationalFrame: the element frame that follows a four-node shell through large motions, with
// its exact first derivative (the spin-fitter G) and the derivative of G^T mu, which the consistent
// corotational tangent needs.
//
// Definition (the same as ShellFrame::of in elements/shell_q4.hpp): nodes x_1..x_4 (columns),
// diagonals d1 = x_3 - x_1, d2 = x_4 - x_2 with unit vectors e1, e2;
//   origin  x_c = (x_1 + x_2 + x_3 + x_4) / 4,
//   axis 1  a = (e1 - e2) / |e1 - e2|   (bisector, roughly along the edge 1 -> 2),
//   axis 2  b = (e1 + e2) / |e1 + e2|   (the other bisector; a.b = 0 exactly since |e1| = |e2|),
//   axis 3  n = a x b = (e1 x e2) / |e1 x e2|.
// Only x_1..x_4 enter; the frame does not depend on nodal rotations.
//
// Spin-fitter (derived here exactly for this frame; G plays the role of the spin-fitter of
// Felippa & Haugen 2005 and of Battini & Pacoste 2002 for shells): the frame's spatial spin is
// d omega_e = G du, du = [du_1; du_2; du_3; du_4] the nodal translation increments (global, mm),
//   d omega_e = G_1 dd1 + G_2 dd2,
//   G_1 = ( -e2 n^T / sin(phi) + 1/2 n (n x e1)^T ) / |d1|,
//   G_2 = (  e1 n^T / sin(phi) + 1/2 n (n x e2)^T ) / |d2|,   sin(phi) = |e1 x e2|,
// from omega.a = n.db, omega.b = -n.da, omega.n = b.da with da = (I - a a^T)(de1 - de2)/|e1 - e2|
// etc.: the out-of-plane part tilts the normal with the diagonals, the in-plane part is the mean
// in-plane rotation rate of the two diagonals. G annihilates rigid translations and G S = I for the
// rigid rotation modes S (the defining property of a spin-fitter in Felippa & Haugen 2005).

#include <Eigen/Core>

namespace rotcap {

using NodalCoordinates = Eigen::Matrix<double, 3, 4>;  ///< columns: nodes 1..4 [mm]

class CorotationalFrame {
 public:
  /// Frame of the nodes x. valid() is false when the diagonals are (nearly) parallel or of zero
  /// length: sin(phi) <= 1e-10 or |d_k| == 0; the other members are then meaningless.
  explicit CorotationalFrame(const NodalCoordinates& x);

  bool valid() const { return valid_; }
  const Eigen::Vector3d& origin() const { return origin_; }
  /// Columns a, b, n in global coordinates (orthonormal, det +1).
  const Eigen::Matrix3d& rotation() const { return rotation_; }
  /// G (3 x 12): d omega_e = G du, du = [du_1; du_2; du_3; du_4] [1/mm].
  const Eigen::Matrix<double, 3, 12>& spin_fitter() const { return spin_fitter_; }
  /// d(G^T mu)/du (12 x 12) for a fixed vector mu (global axes). Not symmetric in general: the
  /// spin omega_e is not the differential of a function of u.
  Eigen::Matrix<double, 12, 12> spin_fitter_derivative(const Eigen::Vector3d& mu) const;

 private:
  bool valid_ = false;
  Eigen::Vector3d origin_ = Eigen::Vector3d::Zero();
  Eigen::Matrix3d rotation_ = Eigen::Matrix3d::Identity();
  Eigen::Matrix<double, 3, 12> spin_fitter_ = Eigen::Matrix<double, 3, 12>::Zero();
  // Diagonal data kept for spin_fitter_derivative.
  Eigen::Vector3d e1_, e2_, n_;
  double length1_ = 0.0, length2_ = 0.0, cos_phi_ = 0.0, sin_phi_ = 0.0;
};

}  // namespace rotcap
