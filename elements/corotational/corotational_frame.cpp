#include "elements/corotational/corotational_frame.hpp"

#include "elements/corotational/rotation.hpp"

#include <cmath>

namespace rotcap {

namespace {

constexpr double kMinSinPhi = 1.0e-10;  // diagonals closer to parallel than this: degenerate

// Node k's sign and diagonal in d1 = x_3 - x_1, d2 = x_4 - x_2 (nodes 0-based).
constexpr int kDiagonal[4] = {0, 1, 0, 1};
constexpr double kSign[4] = {-1.0, -1.0, 1.0, 1.0};

using Row6 = Eigen::Matrix<double, 1, 6>;
using Jac36 = Eigen::Matrix<double, 3, 6>;

}  // namespace

CorotationalFrame::CorotationalFrame(const NodalCoordinates& x) {
  origin_ = x.rowwise().mean();
  const Eigen::Vector3d d1 = x.col(2) - x.col(0);
  const Eigen::Vector3d d2 = x.col(3) - x.col(1);
  length1_ = d1.norm();
  length2_ = d2.norm();
  if (!(length1_ > 0.0) || !(length2_ > 0.0)) return;
  e1_ = d1 / length1_;
  e2_ = d2 / length2_;
  const Eigen::Vector3d cross = e1_.cross(e2_);
  sin_phi_ = cross.norm();
  cos_phi_ = e1_.dot(e2_);
  if (!(sin_phi_ > kMinSinPhi)) return;
  n_ = cross / sin_phi_;
  const Eigen::Vector3d a = (e1_ - e2_).normalized();
  const Eigen::Vector3d b = (e1_ + e2_).normalized();
  rotation_.col(0) = a;
  rotation_.col(1) = b;
  rotation_.col(2) = a.cross(b);  // equals n_ to rounding; keeps the triad exactly right-handed

  // Spin-fitter blocks G_1, G_2 (header; derivation: omega.a = n.db, omega.b = -n.da,
  // omega.n = b.da, with de_k = (I - e_k e_k^T) dd_k / |d_k|).
  const Eigen::Vector3d p1 = n_.cross(e1_), p2 = n_.cross(e2_);
  const Eigen::Matrix3d g1 =
      (-e2_ * n_.transpose() / sin_phi_ + 0.5 * n_ * p1.transpose()) / length1_;
  const Eigen::Matrix3d g2 =
      (e1_ * n_.transpose() / sin_phi_ + 0.5 * n_ * p2.transpose()) / length2_;
  for (int k = 0; k < 4; ++k)
    spin_fitter_.block<3, 3>(0, 3 * k) = kSign[k] * (kDiagonal[k] == 0 ? g1 : g2);
  valid_ = true;
}

Eigen::Matrix<double, 12, 12> CorotationalFrame::spin_fitter_derivative(
    const Eigen::Vector3d& mu) const {
  // mu^T d omega_e = g1.dd1 + g2.dd2 with
  //   g1 = alpha1 n + beta1 p1,  alpha1 = -(mu.e2)/(sin phi |d1|), beta1 = (mu.n)/(2 |d1|),
  //   g2 = alpha2 n + beta2 p2,  alpha2 =  (mu.e1)/(sin phi |d2|), beta2 = (mu.n)/(2 |d2|),
  //   p_k = n x e_k.
  // Differentiate every factor with respect to q = [d1; d2] (row gradients, 3x6 Jacobians).
  const Eigen::Matrix3d I = Eigen::Matrix3d::Identity();
  const double c = cos_phi_, s = sin_phi_, L1 = length1_, L2 = length2_;
  const Eigen::Vector3d& e1 = e1_;
  const Eigen::Vector3d& e2 = e2_;
  const Eigen::Vector3d& n = n_;

  // de_k = (I - e_k e_k^T) dd_k / L_k; dL_k = e_k . dd_k.
  Jac36 De1 = Jac36::Zero(), De2 = Jac36::Zero();
  De1.leftCols<3>() = (I - e1 * e1.transpose()) / L1;
  De2.rightCols<3>() = (I - e2 * e2.transpose()) / L2;
  Row6 Dinv_L1 = Row6::Zero(), Dinv_L2 = Row6::Zero();
  Dinv_L1.leftCols<3>() = -e1.transpose() / (L1 * L1);
  Dinv_L2.rightCols<3>() = -e2.transpose() / (L2 * L2);
  // c = e1.e2; s = sqrt(1 - c^2): ds = -c dc / s, d(1/s) = c dc / s^3.
  const Row6 Dc = e2.transpose() * De1 + e1.transpose() * De2;
  const Row6 Dinv_s = (c / (s * s * s)) * Dc;
  // dn is in the plane of e1, e2 with dn.e1 = -n.de1, dn.e2 = -n.de2:
  // dn = -[(n.dd1/L1)(e1 - c e2) + (n.dd2/L2)(e2 - c e1)] / s^2.
  Jac36 Dn;
  Dn.leftCols<3>() = -(e1 - c * e2) * n.transpose() / (s * s * L1);
  Dn.rightCols<3>() = -(e2 - c * e1) * n.transpose() / (s * s * L2);
  // dp_k = dn x e_k + n x de_k.
  const Jac36 Dp1 = -skew(e1) * Dn + skew(n) * De1;
  const Jac36 Dp2 = -skew(e2) * Dn + skew(n) * De2;

  const double mu_e1 = mu.dot(e1), mu_e2 = mu.dot(e2), mu_n = mu.dot(n);
  const Row6 Dmu_e1 = mu.transpose() * De1, Dmu_e2 = mu.transpose() * De2;
  const Row6 Dmu_n = mu.transpose() * Dn;

  const double alpha1 = -mu_e2 / (s * L1), beta1 = 0.5 * mu_n / L1;
  const double alpha2 = mu_e1 / (s * L2), beta2 = 0.5 * mu_n / L2;
  const Row6 Dalpha1 = -(Dmu_e2 / (s * L1) + (mu_e2 / L1) * Dinv_s + (mu_e2 / s) * Dinv_L1);
  const Row6 Dalpha2 = Dmu_e1 / (s * L2) + (mu_e1 / L2) * Dinv_s + (mu_e1 / s) * Dinv_L2;
  const Row6 Dbeta1 = 0.5 * (Dmu_n / L1 + mu_n * Dinv_L1);
  const Row6 Dbeta2 = 0.5 * (Dmu_n / L2 + mu_n * Dinv_L2);

  const Eigen::Vector3d p1 = n.cross(e1), p2 = n.cross(e2);
  Eigen::Matrix<double, 6, 6> J;  // rows [g1; g2], columns [d1; d2]
  J.topRows<3>() = n * Dalpha1 + alpha1 * Dn + p1 * Dbeta1 + beta1 * Dp1;
  J.bottomRows<3>() = n * Dalpha2 + alpha2 * Dn + p2 * Dbeta2 + beta2 * Dp2;

  // Chain rule to nodal translations: G^T mu at node a is sign_a g_{diag(a)}, and
  // d(d_j)/d(x_b) = sign_b when diag(b) = j.
  Eigen::Matrix<double, 12, 12> D;
  for (int a = 0; a < 4; ++a)
    for (int b = 0; b < 4; ++b)
      D.block<3, 3>(3 * a, 3 * b) =
          (kSign[a] * kSign[b]) * J.block<3, 3>(3 * kDiagonal[a], 3 * kDiagonal[b]);
  return D;
}

}  // namespace rotcap
