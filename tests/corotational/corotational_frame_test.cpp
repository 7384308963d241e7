// Tests of the diagonal-bisector element frame and its exact spin-fitter
// (elements/corotational/corotational_frame.hpp).
//
// Finite-difference tolerances: elements of size 1, central differences with h = 1e-6; the frame is
// smooth with O(1) third derivatives (sin(phi) ~ 0.7 for these shapes), so the truncation error is
// ~h^2 = 1e-12 and the rounding error ~eps/h = 2e-10; tolerances 1e-8 leave a factor ~50.

#include "elements/corotational/corotational_frame.hpp"
#include "elements/corotational/rotation.hpp"
#include "elements/shell_q4.hpp"
#include "tests/corotational/corotational_test_support.hpp"
#include "tests/test_support.hpp"

#include <random>

namespace rotcap {
namespace {

using testing::random_element;
using testing::random_unit;

TEST(CorotationalFrame, AxesAreOrthonormalAndRightHanded) {
  std::mt19937 rng(21);
  for (int trial = 0; trial < 10; ++trial) {
    const NodalCoordinates x = random_element(rng, 1.0, 0.05);
    const CorotationalFrame frame(x);
    ASSERT_TRUE(frame.valid());
    const Eigen::Matrix3d& R = frame.rotation();
    EXPECT_LT((R.transpose() * R - Eigen::Matrix3d::Identity()).cwiseAbs().maxCoeff(), 1e-15);
    EXPECT_CLOSE(R.determinant(), 1.0, 0.0, 1e-15);
    EXPECT_LT((frame.origin() - x.rowwise().mean()).norm(), 1e-15 * 4.0);
  }
}

TEST(CorotationalFrame, MatchesShellFrame) {
  // The corotational layer rebuilds the frame to differentiate it; it must be ShellFrame::of.
  std::mt19937 rng(22);
  for (int trial = 0; trial < 10; ++trial) {
    const NodalCoordinates x = random_element(rng, 100.0, 3.0);
    const CorotationalFrame frame(x);
    const ShellFrame reference = ShellFrame::of(x);
    EXPECT_LT((frame.rotation() - reference.rotation).cwiseAbs().maxCoeff(), 1e-15);
    EXPECT_LT((frame.origin() - reference.origin).norm(), 1e-13);
  }
}

TEST(CorotationalFrame, CyclicRenumberingTurnsTheFrameByNinetyDegrees) {
  std::mt19937 rng(23);
  const NodalCoordinates x = random_element(rng, 1.0, 0.05);
  NodalCoordinates shifted;
  for (int i = 0; i < 4; ++i) shifted.col(i) = x.col((i + 1) % 4);
  const Eigen::Matrix3d R = CorotationalFrame(x).rotation();
  const Eigen::Matrix3d Rs = CorotationalFrame(shifted).rotation();
  // New diagonals d1' = d2, d2' = -d1: axis 1' = old axis 2, axis 2' = -old axis 1, same normal.
  EXPECT_LT((Rs.col(0) - R.col(1)).norm(), 1e-15);
  EXPECT_LT((Rs.col(1) + R.col(0)).norm(), 1e-15);
  EXPECT_LT((Rs.col(2) - R.col(2)).norm(), 1e-15);
}

TEST(CorotationalFrame, DegenerateElementIsReported) {
  NodalCoordinates x;
  x << 0, 1, 2, 3, 0, 0, 0, 0, 0, 0, 0, 0;  // four collinear nodes: diagonals parallel
  EXPECT_FALSE(CorotationalFrame(x).valid());
}

TEST(CorotationalFrame, SpinFitterMatchesFiniteDifference) {
  // Column k of G is the spin of the frame per unit translation of DOF k:
  // log(Re(x + h e_k) Re(x - h e_k)^T) / (2h) = G e_k + O(h^2).
  std::mt19937 rng(24);
  const double h = 1e-6;
  for (int trial = 0; trial < 5; ++trial) {
    const NodalCoordinates x = random_element(rng, 1.0, 0.1);
    const CorotationalFrame frame(x);
    double worst = 0.0;
    for (int j = 0; j < 12; ++j) {
      NodalCoordinates xp = x, xm = x;
      xp(j % 3, j / 3) += h;
      xm(j % 3, j / 3) -= h;
      const Eigen::Matrix3d Rp = CorotationalFrame(xp).rotation();
      const Eigen::Matrix3d Rm = CorotationalFrame(xm).rotation();
      const Eigen::Vector3d spin = rotation_log(Rp * Rm.transpose()) / (2 * h);
      worst = std::max(worst, (spin - frame.spin_fitter().col(j)).norm());
    }
    EXPECT_LT(worst, 1e-8) << "trial " << trial;
  }
}

TEST(CorotationalFrame, SpinFitterFitsRigidMotions) {
  // G annihilates rigid translations and returns the spin of an infinitesimal rigid rotation:
  // u_i = w x (x_i - x_c) gives G u = w (Felippa & Haugen 2005, spin-fitter property G S = I).
  std::mt19937 rng(25);
  const NodalCoordinates x = random_element(rng, 2.0, 0.1);
  const CorotationalFrame frame(x);
  const Eigen::Vector3d t = random_unit(rng), w = random_unit(rng);
  Eigen::Matrix<double, 12, 1> translation, rotation;
  for (int i = 0; i < 4; ++i) {
    translation.segment<3>(3 * i) = t;
    rotation.segment<3>(3 * i) = w.cross(Eigen::Vector3d(x.col(i) - frame.origin()));
  }
  EXPECT_LT((frame.spin_fitter() * translation).norm(), 1e-15);
  EXPECT_LT((frame.spin_fitter() * rotation - w).norm(), 1e-15);
}

TEST(CorotationalFrame, SpinFitterDerivativeMatchesFiniteDifference) {
  // d(G^T mu)/du for fixed mu by central differences of G^T mu (h = 1e-6, see header).
  std::mt19937 rng(26);
  const double h = 1e-6;
  for (int trial = 0; trial < 5; ++trial) {
    const NodalCoordinates x = random_element(rng, 1.0, 0.1);
    const Eigen::Vector3d mu = 2.0 * random_unit(rng);
    const Eigen::Matrix<double, 12, 12> D = CorotationalFrame(x).spin_fitter_derivative(mu);
    Eigen::Matrix<double, 12, 12> Dfd;
    for (int j = 0; j < 12; ++j) {
      NodalCoordinates xp = x, xm = x;
      xp(j % 3, j / 3) += h;
      xm(j % 3, j / 3) -= h;
      Dfd.col(j) = (CorotationalFrame(xp).spin_fitter().transpose() * mu -
                    CorotationalFrame(xm).spin_fitter().transpose() * mu) /
                   (2 * h);
    }
    const double scale = D.cwiseAbs().maxCoeff();
    EXPECT_LT((D - Dfd).cwiseAbs().maxCoeff(), 1e-8 * scale) << "trial " << trial;
  }
}

}  // namespace
}  // namespace rotcap
