#pragma once
// Finite rotations (the group SO(3)) for the corotational shell: rotation vectors, their
// exponential and logarithm, the tangent operator between pseudo-vector increments and spins, and
// nodal rotation storage with a multiplicative update.
//
// Conventions (used by every caller in rotcap):
//  - A rotation vector theta has angle |theta| [rad] and axis theta/|theta|; R = exp(skew(theta)).
//  - A spin is a spatial (left) infinitesimal rotation: R + dR = exp(skew(dw)) R, i.e.
//    skew(dw) = dR R^T. Global rotational DOF increments of the shell model are spins.
//  - spin_tangent T_s(theta) maps a rotation-vector increment to the spin it causes:
//    dw = T_s(theta) dtheta; rotation_vector_tangent H(theta) = T_s(theta)^-1 maps back:
//    dtheta = H(theta) dw. Both are defined for |theta| < 2 pi (H is singular at 2 pi).
//  - Finite rotations are composed multiplicatively, never by adding rotation vectors.
//
// Sources: Argyris (1982), "An excursion into large rotations", CMAME 32:85-155 (exponential map);
// Ibrahimbegovic, Frey & Kozar (1995), IJNME 38:3653-3673 and Ibrahimbegovic (1997), "On the choice
// of finite rotation parameters", CMAME 149:49-71 (tangent operator and its inverse);
// Felippa & Haugen (2005), CMAME 194:2285-2335, and its appendix (H, and the derivative of
// H^T m, their "L" matrix, needed for the moment-correction stiffness);
// Spurrier (1978), J. Spacecraft Rockets 15(4):255 (singularity-free quaternion extraction).

#include <Eigen/Core>
#include <Eigen/Geometry>

namespace rotcap {

/// skew(v) w = v x w.
Eigen::Matrix3d skew(const Eigen::Vector3d& v);

/// Axial vector of the skew-symmetric part of A: axial(skew(v)) = v.
Eigen::Vector3d axial(const Eigen::Matrix3d& A);

/// exp(skew(theta)) by Rodrigues' formula, accurate for every |theta| (series below 1e-4).
Eigen::Matrix3d rotation_exp(const Eigen::Vector3d& theta);

/// The rotation vector of R with angle in [0, pi]; R must be orthonormal with det +1 (to rounding).
/// Robust near 0 (no division by a small sine) and near pi (extraction via Spurrier's quaternion).
/// At exactly pi the sign of the axis is arbitrary (both vectors give the same R).
Eigen::Vector3d rotation_log(const Eigen::Matrix3d& R);

/// Unit quaternion of R (Spurrier 1978), with non-negative scalar part.
Eigen::Quaterniond quaternion_of(const Eigen::Matrix3d& R);

/// T_s(theta) = I + (1 - cos t)/t^2 skew(theta) + (t - sin t)/t^3 skew(theta)^2, t = |theta|.
Eigen::Matrix3d spin_tangent(const Eigen::Vector3d& theta);

/// H(theta) = T_s(theta)^-1 = I - 1/2 skew(theta) + eta(t) skew(theta)^2,
/// eta = (1 - (t/2) cot(t/2)) / t^2 (Felippa & Haugen 2005). Requires |theta| < 2 pi.
Eigen::Matrix3d rotation_vector_tangent(const Eigen::Vector3d& theta);

/// L(theta, m) = d(H(theta)^T m)/d theta for a fixed vector m:
/// L = eta [ (theta.m) I + theta m^T - 2 m theta^T ] + mu skew(theta)^2 m theta^T - 1/2 skew(m),
/// mu = (d eta/dt) / t (Felippa & Haugen 2005, appendix). Requires |theta| < 2 pi.
Eigen::Matrix3d rotation_vector_tangent_derivative(const Eigen::Vector3d& theta,
                                                   const Eigen::Vector3d& m);

/// The scalar coefficients eta(t) and mu(t) of H and L (exposed for tests), 0 <= t < 2 pi.
double tangent_eta(double t);
double tangent_mu(double t);

/// A nodal rotation, stored as a unit quaternion so that repeated updates stay orthonormal.
/// Starts at the identity (the initial configuration).
class NodalRotation {
 public:
  NodalRotation() = default;
  explicit NodalRotation(const Eigen::Matrix3d& R) : q_(quaternion_of(R)) {}

  /// Multiplicative update by a spin (spatial incremental rotation vector) dw:
  /// R <- exp(skew(dw)) R. Never adds rotation vectors.
  void rotate(const Eigen::Vector3d& dw);

  Eigen::Matrix3d matrix() const { return q_.toRotationMatrix(); }
  /// Total rotation vector (angle in [0, pi]); for output only, never for updating.
  Eigen::Vector3d vector() const;
  const Eigen::Quaterniond& quaternion() const { return q_; }

 private:
  Eigen::Quaterniond q_ = Eigen::Quaterniond::Identity();
};

}  // namespace rotcap
