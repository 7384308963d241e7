#include "elements/corotational/corotational_kinematics.hpp"

#include "elements/corotational/rotation.hpp"

#include <array>

namespace rotcap {

namespace {

using Mat24x3 = Eigen::Matrix<double, 24, 3>;
using Mat3x24 = Eigen::Matrix<double, 3, 24>;

}  // namespace

CorotationalKinematics::CorotationalKinematics(const NodalCoordinates& initial_local,
                                               const Eigen::Matrix3d& initial_rotation,
                                               const NodalCoordinates& x, const NodalRotations& R)
    : initial_rotation_(initial_rotation), frame_(x) {
  if (!frame_.valid()) return;
  const Eigen::Matrix3d& Re = frame_.rotation();
  relative_ = x.colwise() - frame_.origin();
  for (int i = 0; i < 4; ++i) {
    // Felippa & Haugen (2005), deformational kinematics: translation in the current frame minus
    // the initial local position; deformational rotation Re^T R_i R0 (rigid rotation removed).
    d_bar_.segment<3>(6 * i) = Re.transpose() * relative_.col(i) - initial_local.col(i);
    const Eigen::Vector3d theta = rotation_log(Re.transpose() * R[i] * initial_rotation_);
    d_bar_.segment<3>(6 * i + 3) = theta;
    H_[i] = rotation_vector_tangent(theta);
  }
}

Mat24 CorotationalKinematics::projector() const {
  // P = P_t - S G: P_t removes the mean translation from the translation blocks; S (24 x 3) holds
  // the rigid rotation modes, S_i = [-skew(x_i - x_c); I], so that a rigid spin dw gives the
  // nodal increments S dw; G (3 x 24) is the spin-fitter with zero rotational columns.
  // (the projector and spin-fitter of Felippa & Haugen 2005.)
  Mat24 P = Mat24::Identity();
  Mat24x3 S;
  Mat3x24 G = Mat3x24::Zero();
  for (int i = 0; i < 4; ++i) {
    for (int j = 0; j < 4; ++j)
      P.block<3, 3>(6 * i, 6 * j) -= 0.25 * Eigen::Matrix3d::Identity();
    S.block<3, 3>(6 * i, 0) = -skew(relative_.col(i));
    S.block<3, 3>(6 * i + 3, 0).setIdentity();
    G.block<3, 3>(0, 6 * i) = frame_.spin_fitter().block<3, 3>(0, 3 * i);
  }
  P.noalias() -= S * G;
  return P;
}

void CorotationalKinematics::to_global(const Vec24& f_bar, const Mat24* K_bar, Vec24& f, Mat24* K,
                                       const kernels::TangentKernels& kernels) const {
  const Eigen::Matrix3d& Re = frame_.rotation();

  // f_g = E H^T f_bar: local moments through H^T (virtual work of d theta_bar = H dw_bar), then
  // every block to global axes.
  Vec24 fg;
  for (int i = 0; i < 4; ++i) {
    fg.segment<3>(6 * i) = Re * f_bar.segment<3>(6 * i);
    fg.segment<3>(6 * i + 3) = Re * (H_[i].transpose() * f_bar.segment<3>(6 * i + 3));
  }

  // f = P^T f_g = P_t f_g - G^T (S^T f_g); mu = S^T f_g = sum_i (x_i - x_c) x n_i + m_i.
  Eigen::Vector3d mean_force = Eigen::Vector3d::Zero();
  Eigen::Vector3d mu = Eigen::Vector3d::Zero();
  for (int i = 0; i < 4; ++i) {
    mean_force += 0.25 * fg.segment<3>(6 * i);
    mu += relative_.col(i).cross(fg.segment<3>(6 * i)) + fg.segment<3>(6 * i + 3);
  }
  const Eigen::Matrix<double, 12, 1> Gmu = frame_.spin_fitter().transpose() * mu;
  f = fg;
  for (int i = 0; i < 4; ++i) f.segment<3>(6 * i) -= mean_force + Gmu.segment<3>(3 * i);

  if (K == nullptr) return;

  // Variation of f = P^T E H^T f_bar (Felippa & Haugen 2005, consistent tangent, generalised to the
  // exact spin-fitter of corotational_frame.hpp):
  //  (1) E delta(H^T f_bar) = E (H^T K_bar + Lambda) B d,  B = H E^T P  (material + K_M);
  //  (2) (delta E) H^T f_bar = skew(d omega_e) f_g = -F G d, F = [skew(f_g,1); ...; skew(f_g,8)];
  //  (3) -(delta S)^T f_g with P^T = P_t - G^T S^T: +G^T N P_t d,
  //      N = [skew(n_1) 0 ... skew(n_4) 0];
  //  (4) -(delta G)^T mu = -d(G^T mu)/du d (frame curvature; corotational_frame.cpp).
  // P's rotation columns are unit columns (P_t and S G touch translation columns only), so only
  // Pc = P(:, translations), 24 x 12, is formed:
  //   rows of translation i: delta_ij I - I/4 + skew(x_i - x_c) G_j;  rows of rotation i: -G_j.
  // Terms (1) and (2) are the kernel's (kernels/tangent_kernels.hpp).
  const Eigen::Matrix<double, 3, 12>& G = frame_.spin_fitter();
  Eigen::Matrix<double, 24, 12> Pc;
  for (int i = 0; i < 4; ++i) {
    const Eigen::Matrix3d sk = skew(relative_.col(i));
    for (int j = 0; j < 4; ++j) {
      Pc.block<3, 3>(6 * i, 3 * j).noalias() = sk * G.middleCols<3>(3 * j);
      Pc.block<3, 3>(6 * i, 3 * j).diagonal().array() += i == j ? 0.75 : -0.25;
      Pc.block<3, 3>(6 * i + 3, 3 * j) = -G.middleCols<3>(3 * j);
    }
  }
  std::array<Eigen::Matrix3d, 4> L;
  for (int i = 0; i < 4; ++i)
    L[i] = rotation_vector_tangent_derivative(d_bar_.segment<3>(6 * i + 3), f_bar.segment<3>(6 * i + 3));
  Mat24x3 F;
  for (int i = 0; i < 8; ++i) F.middleRows<3>(3 * i) = skew(fg.segment<3>(3 * i));
  static_assert(sizeof(std::array<Eigen::Matrix3d, 4>) == 36 * sizeof(double));
  kernels::CorotationalTangentInput in;
  in.K_bar = K_bar->data();
  in.Pc = Pc.data();
  in.Re = Re.data();
  in.H = H_[0].data();
  in.L = L[0].data();
  in.F = F.data();
  in.G = G.data();
  in.relative = relative_.data();
  kernels.corotational_tangent(in, K->data());

  // (3) + (4): translation rows and columns only. N P_t has blocks skew(n_j) - mean_k skew(n_k).
  Eigen::Matrix<double, 3, 12> NPt;
  const Eigen::Matrix3d mean_skew = skew(mean_force);
  for (int j = 0; j < 4; ++j) NPt.middleCols<3>(3 * j) = skew(fg.segment<3>(6 * j)) - mean_skew;
  const Eigen::Matrix<double, 12, 12> Ktt =
      G.transpose().lazyProduct(NPt) - frame_.spin_fitter_derivative(mu);
  for (int a = 0; a < 4; ++a)
    for (int b = 0; b < 4; ++b) K->block<3, 3>(6 * a, 6 * b) += Ktt.block<3, 3>(3 * a, 3 * b);
}

Mat24 fixed_frame_transformation(const Eigen::Matrix3d& initial_rotation) {
  Mat24 T = Mat24::Zero();
  for (int i = 0; i < 8; ++i) T.block<3, 3>(3 * i, 3 * i) = initial_rotation.transpose();
  return T;
}

}  // namespace rotcap
