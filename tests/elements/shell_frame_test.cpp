// ShellFrame: orthonormal, centred, symmetric in the nodes, and it follows rigid motions.
#include "elements/shell_q4.hpp"
#include "tests/test_support.hpp"

#include <Eigen/Geometry>
#include <random>

namespace rotcap {
namespace {

Eigen::Matrix<double, 3, 4> warped_quad() {
  Eigen::Matrix<double, 3, 4> x;
  x << 0.0, 2.1, 2.4, -0.3,  //
      0.0, 0.2, 1.9, 1.5,    //
      0.1, -0.05, 0.2, 0.0;
  return x;
}

Eigen::Matrix3d random_rotation(std::mt19937& rng) {
  std::uniform_real_distribution<double> u(-1.0, 1.0);
  const Eigen::Vector4d q(u(rng), u(rng), u(rng), u(rng));
  return Eigen::Quaterniond(q(0), q(1), q(2), q(3)).normalized().toRotationMatrix();
}

TEST(ShellFrame, IsOrthonormalRightHandedAndCentred) {
  const auto x = warped_quad();
  const ShellFrame frame = ShellFrame::of(x);
  const Eigen::Matrix3d r = frame.rotation;
  EXPECT_LT((r.transpose() * r - Eigen::Matrix3d::Identity()).norm(), 1e-14);
  EXPECT_CLOSE(r.determinant(), 1.0, 1e-14, 0.0);
  EXPECT_LT((frame.origin - 0.25 * x.rowwise().sum()).norm(), 1e-15);
  const auto local = frame.to_local(x);
  // Centroid at the origin; warping offsets +h, -h, +h, -h (diagonals are normal to e3).
  EXPECT_LT(local.rowwise().sum().norm(), 1e-14);
  EXPECT_NEAR(local(2, 0), local(2, 2), 1e-15);
  EXPECT_NEAR(local(2, 1), local(2, 3), 1e-15);
  EXPECT_NEAR(local(2, 0), -local(2, 1), 1e-15);
  EXPECT_GT(std::abs(local(2, 0)), 1e-3);
}

TEST(ShellFrame, SquareInXyPlaneGivesGlobalAxes) {
  Eigen::Matrix<double, 3, 4> x;
  x << 1.0, 3.0, 3.0, 1.0, -1.0, -1.0, 1.0, 1.0, 5.0, 5.0, 5.0, 5.0;
  const ShellFrame frame = ShellFrame::of(x);
  EXPECT_LT((frame.rotation - Eigen::Matrix3d::Identity()).norm(), 1e-15);
  EXPECT_LT((frame.origin - Eigen::Vector3d(2.0, 0.0, 5.0)).norm(), 1e-15);
}

TEST(ShellFrame, CyclicRenumberingTurnsFrameByQuarterTurn) {
  const auto x = warped_quad();
  Eigen::Matrix<double, 3, 4> shifted;
  for (int a = 0; a < 4; ++a) shifted.col(a) = x.col((a + 1) % 4);
  const ShellFrame f0 = ShellFrame::of(x), f1 = ShellFrame::of(shifted);
  EXPECT_LT((f1.rotation.col(2) - f0.rotation.col(2)).norm(), 1e-14);
  EXPECT_LT((f1.rotation.col(0) - f0.rotation.col(1)).norm(), 1e-14);
  EXPECT_LT((f1.rotation.col(1) + f0.rotation.col(0)).norm(), 1e-14);
}

TEST(ShellFrame, FollowsRigidMotionAndKeepsLocalCoordinates) {
  std::mt19937 rng(20240611);
  const auto x = warped_quad();
  const ShellFrame f0 = ShellFrame::of(x);
  for (int trial = 0; trial < 5; ++trial) {
    const Eigen::Matrix3d q = random_rotation(rng);
    const Eigen::Vector3d c(1.5, -2.0, 0.7 * trial);
    const Eigen::Matrix<double, 3, 4> y = (q * x).colwise() + c;
    const ShellFrame f1 = ShellFrame::of(y);
    EXPECT_LT((f1.rotation - q * f0.rotation).norm(), 1e-13);
    EXPECT_LT((f1.to_local(y) - f0.to_local(x)).norm(), 1e-13);
  }
}

TEST(ShellFrame, RejectsCollapsedQuadrilateral) {
  Eigen::Matrix<double, 3, 4> x;
  x << 0.0, 1.0, 2.0, 3.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0;  // all nodes on a line
  EXPECT_THROW(ShellFrame::of(x), std::invalid_argument);
}

}  // namespace
}  // namespace rotcap
