#pragma once
// Helpers for the corotational tests: a linear mock core element, seeded random element
// geometries and configurations, and the central finite-difference tangent of a global force.
//
// Mock core (stands in for ShellQ4 so the corotational layer is tested on its own): a random SPD
// 24x24 matrix with the six rigid-body modes of the element's initial local geometry projected
// out, K_bar = Q A Q, Q = I - V V^T (V: orthonormal basis of the rigid modes), f_bar = K_bar d_bar.
// Its local force is then self-equilibrated and invariant to infinitesimal rigid motions, as a real
// small-strain element's is.

#include "elements/corotational/corotational_kinematics.hpp"
#include "elements/corotational/rotation.hpp"

#include <Eigen/Dense>
#include <functional>
#include <random>

namespace rotcap::testing {

inline Eigen::Vector3d random_unit(std::mt19937& rng) {
  std::normal_distribution<double> g(0.0, 1.0);
  return Eigen::Vector3d(g(rng), g(rng), g(rng)).normalized();
}

/// Random SPD stiffness with the rigid modes of the local geometry removed.
inline Mat24 mock_core_stiffness(const NodalCoordinates& local, unsigned seed) {
  std::mt19937 rng(seed);
  std::normal_distribution<double> g(0.0, 1.0);
  Eigen::Matrix<double, 24, 6> V = Eigen::Matrix<double, 24, 6>::Zero();
  for (int i = 0; i < 4; ++i) {
    for (int k = 0; k < 3; ++k) {
      const Eigen::Vector3d e = Eigen::Vector3d::Unit(k);
      V.block<3, 1>(6 * i, k) = e;                                  // translation along e
      V.block<3, 1>(6 * i, 3 + k) = e.cross(Eigen::Vector3d(local.col(i)));  // rotation about e
      V.block<3, 1>(6 * i + 3, 3 + k) = e;
    }
  }
  const Eigen::HouseholderQR<Eigen::Matrix<double, 24, 6>> qr(V);
  const Eigen::Matrix<double, 24, 6> basis =
      qr.householderQ() * Eigen::Matrix<double, 24, 6>::Identity();
  const Mat24 Q = Mat24::Identity() - basis * basis.transpose();
  Mat24 M;
  for (int i = 0; i < 24; ++i)
    for (int j = 0; j < 24; ++j) M(i, j) = g(rng);
  const Mat24 A = M * M.transpose() / 24.0 + Mat24::Identity();
  return Q * A * Q;
}

/// A random, slightly warped, convex quadrilateral of size ~size, placed with a random rotation
/// and offset in space. Nodes counter-clockwise about the plane's normal.
inline NodalCoordinates random_element(std::mt19937& rng, double size, double warp) {
  std::uniform_real_distribution<double> u(-0.15, 0.15);
  NodalCoordinates X;
  const double corner[4][2] = {{-0.5, -0.5}, {0.5, -0.5}, {0.5, 0.5}, {-0.5, 0.5}};
  for (int i = 0; i < 4; ++i) {
    const double z = (i % 2 == 0 ? warp : -warp);
    X.col(i) = size * Eigen::Vector3d(corner[i][0] + u(rng), corner[i][1] + u(rng), z);
  }
  const Eigen::Matrix3d Q = rotation_exp(2.0 * random_unit(rng));
  const Eigen::Vector3d c = 3.0 * size * random_unit(rng);
  return (Q * X).colwise() + c;
}

/// A deformed configuration: a large rigid motion of X (angle up to ~2.5 rad) plus a random
/// deformation of relative size strain (translations strain * size, rotations rotation).
inline void random_configuration(std::mt19937& rng, const NodalCoordinates& X, double size,
                                 double strain, double rotation, NodalCoordinates& x,
                                 NodalRotations& R) {
  const Eigen::Matrix3d Q = rotation_exp(2.5 * random_unit(rng));
  const Eigen::Vector3d c = size * random_unit(rng);
  x = (Q * X).colwise() + c;
  for (int i = 0; i < 4; ++i) {
    x.col(i) += strain * size * random_unit(rng);
    R[i] = rotation_exp(rotation * random_unit(rng)) * Q;
  }
}

/// Global force of one configuration (f only), the function the tangent is checked against.
using GlobalForce = std::function<Vec24(const NodalCoordinates&, const NodalRotations&)>;

/// Central finite-difference tangent: translations perturbed additively, x_i += h_u e_k;
/// rotations multiplicatively, R_i <- exp(h_r e_k) R_i (the spin the tangent refers to).
inline Mat24 finite_difference_tangent(const GlobalForce& force, const NodalCoordinates& x,
                                       const NodalRotations& R, double h_u, double h_r) {
  Mat24 K;
  for (int i = 0; i < 4; ++i) {
    for (int k = 0; k < 3; ++k) {
      NodalCoordinates xp = x, xm = x;
      xp(k, i) += h_u;
      xm(k, i) -= h_u;
      K.col(6 * i + k) = (force(xp, R) - force(xm, R)) / (2.0 * h_u);
      NodalRotations Rp = R, Rm = R;
      const Eigen::Vector3d e = Eigen::Vector3d::Unit(k);
      Rp[i] = rotation_exp(h_r * e) * R[i];
      Rm[i] = rotation_exp(-h_r * e) * R[i];
      K.col(6 * i + 3 + k) = (force(x, Rp) - force(x, Rm)) / (2.0 * h_r);
    }
  }
  return K;
}

/// D K D with D = diag(length for translations, 1 for rotations): every entry in units of energy,
/// so translation and rotation blocks can be compared on one scale.
inline Mat24 energy_scaled(const Mat24& K, double length) {
  Vec24 d;
  for (int i = 0; i < 4; ++i) {
    d.segment<3>(6 * i).setConstant(length);
    d.segment<3>(6 * i + 3).setConstant(1.0);
  }
  return d.asDiagonal() * K * d.asDiagonal();
}

/// Block-diagonal rotation of a 24-vector or matrix by Q (8 blocks).
inline Mat24 block_rotation(const Eigen::Matrix3d& Q) {
  Mat24 T = Mat24::Zero();
  for (int i = 0; i < 8; ++i) T.block<3, 3>(3 * i, 3 * i) = Q;
  return T;
}

}  // namespace rotcap::testing
