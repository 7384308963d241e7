// Tests of the corotational layer on its own (elements/corotational/corotational_kinematics.hpp),
// with the linear mock core of corotational_test_support.hpp: f_bar = K_bar d_bar.
//
// Tangent check (Felippa & Haugen 2005, consistency of K with f): central differences with steps
// h_u = 1e-5 * size (translations) and h_r = 1e-5 rad (rotations). Truncation error
// h^2/6 |f'''| ~ 2e-11 |K| (f''' ~ |K| / size^2 for these O(1) configurations); rounding error
// eps |f| / h ~ 2e-11 |K| (|f| ~ 0.1 |K| size). Tolerance 1e-8 relative to max |K| (energy scaled),
// a margin of ~100 over both, while leaving out any one term of K gives errors of 7e-3 or more.

#include "elements/corotational/corotational_kinematics.hpp"
#include "elements/corotational/rotation.hpp"
#include "tests/allocation_counter.hpp"
#include "tests/corotational/corotational_test_support.hpp"
#include "tests/test_support.hpp"

#include <cmath>
#include <numbers>
#include <random>

namespace rotcap {
namespace {

using namespace rotcap::testing;

// One element with a mock core: initial geometry, frame and local stiffness.
struct MockElement {
  NodalCoordinates X;
  Eigen::Matrix3d R0;
  NodalCoordinates local;
  Mat24 K_bar;

  MockElement(const NodalCoordinates& X_, unsigned seed) : X(X_) {
    const CorotationalFrame frame(X);
    R0 = frame.rotation();
    local = R0.transpose() * (X.colwise() - frame.origin());
    K_bar = mock_core_stiffness(local, seed);
  }
  CorotationalKinematics kinematics(const NodalCoordinates& x, const NodalRotations& R) const {
    return CorotationalKinematics(local, R0, x, R);
  }
  void compute(const NodalCoordinates& x, const NodalRotations& R, Vec24& f, Mat24* K) const {
    const CorotationalKinematics kin = kinematics(x, R);
    const Vec24 f_bar = K_bar * kin.local_displacements();
    kin.to_global(f_bar, &K_bar, f, K);
  }
  Vec24 force(const NodalCoordinates& x, const NodalRotations& R) const {
    Vec24 f;
    compute(x, R, f, nullptr);
    return f;
  }
};

NodalRotations identity_rotations() {
  NodalRotations R;
  R.fill(Eigen::Matrix3d::Identity());
  return R;
}

TEST(CorotationalKinematics, TangentMatchesFiniteDifferenceOfForce) {
  std::mt19937 rng(31);
  const double size = 1.0;
  for (int trial = 0; trial < 6; ++trial) {
    const MockElement element(random_element(rng, size, 0.05), 100 + trial);
    NodalCoordinates x;
    NodalRotations R;
    // Strains up to 5 %, local rotations up to 0.4 rad: every term of K is exercised.
    random_configuration(rng, element.X, size, 0.05, 0.4, x, R);
    Vec24 f;
    Mat24 K;
    element.compute(x, R, f, &K);
    const Mat24 K_fd = finite_difference_tangent(
        [&](const NodalCoordinates& xx, const NodalRotations& RR) { return element.force(xx, RR); },
        x, R, 1e-5 * size, 1e-5);
    const double scale = energy_scaled(K, size).cwiseAbs().maxCoeff();
    const double error = energy_scaled(K - K_fd, size).cwiseAbs().maxCoeff() / scale;
    EXPECT_LT(error, 1e-8) << "trial " << trial;
    std::printf("  trial %d: max |K - K_fd| / max |K| = %.3e (energy scaled)\n", trial, error);
    // The consistent tangent is not symmetric away from equilibrium: its skew part is O(|f|).
    const double skew_part = energy_scaled(K - K.transpose(), size).cwiseAbs().maxCoeff() / scale;
    EXPECT_GT(skew_part, 1e-4) << "trial " << trial;
  }
}

TEST(CorotationalKinematics, PureRigidMotionGivesNoDeformationAndNoForce) {
  std::mt19937 rng(32);
  const MockElement element(random_element(rng, 1.0, 0.05), 7);
  for (double angle : {0.5 * std::numbers::pi, 3.0}) {
    const Eigen::Matrix3d Q = rotation_exp(angle * random_unit(rng));
    const NodalCoordinates x = (Q * element.X).colwise() + Eigen::Vector3d(0.3, -2.0, 5.0);
    NodalRotations R;
    R.fill(Q);
    const CorotationalKinematics kin = element.kinematics(x, R);
    EXPECT_LT(kin.local_displacements().cwiseAbs().maxCoeff(), 1e-14) << angle;
    Vec24 f;
    element.compute(x, R, f, nullptr);
    EXPECT_LT(f.cwiseAbs().maxCoeff(), 1e-13 * element.K_bar.cwiseAbs().maxCoeff()) << angle;
  }
}

TEST(CorotationalKinematics, RigidRotationOfDeformedStateRotatesTheForces) {
  // Objectivity: superposing a rigid motion (Q, c) on a deformed state leaves d_bar unchanged and
  // rotates f and K with Q: f' = diag(Q) f, K' = diag(Q) K diag(Q)^T.
  std::mt19937 rng(33);
  const MockElement element(random_element(rng, 1.0, 0.05), 8);
  NodalCoordinates x;
  NodalRotations R;
  random_configuration(rng, element.X, 1.0, 0.05, 0.3, x, R);
  Vec24 f;
  Mat24 K;
  element.compute(x, R, f, &K);
  const Vec24 d_bar = element.kinematics(x, R).local_displacements();

  const Eigen::Vector3d skew_axis = Eigen::Vector3d(1.0, -2.0, 0.5).normalized();
  for (const Eigen::Vector3d& rigid :
       {Eigen::Vector3d(0.0, 0.0, 0.5 * std::numbers::pi), Eigen::Vector3d(3.0 * skew_axis)}) {
    const Eigen::Matrix3d Q = rotation_exp(rigid);
    const NodalCoordinates xq = (Q * x).colwise() + Eigen::Vector3d(10.0, 0.0, -4.0);
    NodalRotations Rq;
    for (int i = 0; i < 4; ++i) Rq[i] = Q * R[i];
    Vec24 fq;
    Mat24 Kq;
    element.compute(xq, Rq, fq, &Kq);
    const Mat24 T = block_rotation(Q);
    EXPECT_LT((element.kinematics(xq, Rq).local_displacements() - d_bar).cwiseAbs().maxCoeff(),
              1e-14);
    EXPECT_LT((fq - T * f).cwiseAbs().maxCoeff(), 1e-13 * f.cwiseAbs().maxCoeff());
    EXPECT_LT((Kq - T * K * T.transpose()).cwiseAbs().maxCoeff(), 1e-13 * K.cwiseAbs().maxCoeff());
  }
}

TEST(CorotationalKinematics, InternalForceIsSelfEquilibratedInTheCurrentConfiguration) {
  // f = P^T (...) with P S = 0: zero resultant force and moment about the origin, exactly.
  std::mt19937 rng(34);
  const MockElement element(random_element(rng, 1.0, 0.05), 9);
  NodalCoordinates x;
  NodalRotations R;
  random_configuration(rng, element.X, 1.0, 0.05, 0.3, x, R);
  const Vec24 f = element.force(x, R);
  Eigen::Vector3d force = Eigen::Vector3d::Zero(), moment = Eigen::Vector3d::Zero();
  for (int i = 0; i < 4; ++i) {
    force += f.segment<3>(6 * i);
    moment += Eigen::Vector3d(x.col(i)).cross(Eigen::Vector3d(f.segment<3>(6 * i))) +
              f.segment<3>(6 * i + 3);
  }
  const double scale = f.cwiseAbs().maxCoeff() * (1.0 + x.cwiseAbs().maxCoeff());
  EXPECT_LT(force.norm(), 1e-14 * scale);
  EXPECT_LT(moment.norm(), 1e-14 * scale);
}

TEST(CorotationalKinematics, ProjectorRemovesRigidModesAndIsIdempotent) {
  std::mt19937 rng(35);
  const MockElement element(random_element(rng, 1.0, 0.05), 10);
  NodalCoordinates x;
  NodalRotations R;
  random_configuration(rng, element.X, 1.0, 0.05, 0.3, x, R);
  const CorotationalKinematics kin = element.kinematics(x, R);
  const Mat24 P = kin.projector();
  EXPECT_LT((P * P - P).cwiseAbs().maxCoeff(), 1e-14);
  const Eigen::Vector3d w = random_unit(rng), t = random_unit(rng);
  Vec24 rigid;
  for (int i = 0; i < 4; ++i) {
    rigid.segment<3>(6 * i) = t + w.cross(Eigen::Vector3d(x.col(i) - kin.frame().origin()));
    rigid.segment<3>(6 * i + 3) = w;
  }
  EXPECT_LT((P * rigid).cwiseAbs().maxCoeff(), 1e-15 * 10.0);
}

TEST(CorotationalKinematics, SmallDisplacementsApproachTheLinearElementQuadratically) {
  // f_corotational(a d) - T^T K_bar T (a d) = O(a^2): the ratio of the differences for amplitudes
  // a and a/2 tends to 4.
  std::mt19937 rng(36);
  const MockElement element(random_element(rng, 1.0, 0.05), 11);
  const Mat24 T = fixed_frame_transformation(element.R0);
  Vec24 d;
  for (int i = 0; i < 24; ++i) d(i) = std::normal_distribution<double>(0.0, 1.0)(rng);
  double previous = 0.0;
  for (double a : {1e-2, 5e-3, 2.5e-3, 1.25e-3}) {
    NodalCoordinates x = element.X;
    NodalRotations R;
    for (int i = 0; i < 4; ++i) {
      x.col(i) += a * d.segment<3>(6 * i);
      R[i] = rotation_exp(a * d.segment<3>(6 * i + 3));
    }
    const Vec24 f_linear = T.transpose() * element.K_bar * T * (a * d);
    const double difference = (element.force(x, R) - f_linear).norm();
    if (previous > 0.0) {
      const double ratio = previous / difference;
      EXPECT_CLOSE(ratio, 4.0, 0.03, 0.0) << "amplitude " << a;
      std::printf("  amplitude %.4g: |f_cr - f_lin| = %.4e, ratio to previous %.4f\n", a,
                  difference, ratio);
    }
    previous = difference;
  }
}

TEST(CorotationalKinematics, SkewPartIsMinusTheSkewOfTheNodalMoments) {
  // Exact structure of the non-symmetric part. For a core with an energy (f_bar = dPi/dd_bar), f is
  // the spin gradient of Pi; spins at one node do not commute (right-invariant fields on SO(3):
  // [X_a, X_b] = -eps_abc X_c), everything else does, so K - K^T = -skew(m_i) in the rotation
  // block of node i (m_i the element's nodal moment) and zero elsewhere. Hence the assembled
  // tangent is symmetric at equilibrium except at nodes carrying external moments
  // (Simo 1992, CMAME 96:189-200, on the symmetric Hessian at equilibrium).
  std::mt19937 rng(39);
  for (int trial = 0; trial < 3; ++trial) {
    const MockElement element(random_element(rng, 1.0, 0.05), 200 + trial);
    NodalCoordinates x;
    NodalRotations R;
    random_configuration(rng, element.X, 1.0, 0.05, 0.4, x, R);
    Vec24 f;
    Mat24 K;
    element.compute(x, R, f, &K);
    Mat24 expected = Mat24::Zero();
    for (int i = 0; i < 4; ++i)
      expected.block<3, 3>(6 * i + 3, 6 * i + 3) = -skew(Eigen::Vector3d(f.segment<3>(6 * i + 3)));
    EXPECT_GT(expected.cwiseAbs().maxCoeff(), 1e-2 * K.cwiseAbs().maxCoeff());
    EXPECT_LT((K - K.transpose() - expected).cwiseAbs().maxCoeff(), 1e-14 * K.cwiseAbs().maxCoeff())
        << "trial " << trial;
  }
}

TEST(CorotationalKinematics, InitialStateIsUndeformed) {
  std::mt19937 rng(37);
  const MockElement element(random_element(rng, 1.0, 0.1), 12);
  const CorotationalKinematics kin = element.kinematics(element.X, identity_rotations());
  EXPECT_LT(kin.local_displacements().cwiseAbs().maxCoeff(), 1e-15 * 10.0);
}

TEST(CorotationalKinematics, TransformationAllocatesNoHeapMemory) {
  std::mt19937 rng(40);
  const MockElement element(random_element(rng, 1.0, 0.05), 13);
  NodalCoordinates x;
  NodalRotations R;
  random_configuration(rng, element.X, 1.0, 0.05, 0.3, x, R);
  Vec24 f;
  Mat24 K;
  long allocations;
  {
    const AllocationCounter counter;
    const CorotationalKinematics kin = element.kinematics(x, R);
    const Vec24 f_bar = element.K_bar * kin.local_displacements();
    kin.to_global(f_bar, &element.K_bar, f, &K);
    allocations = counter.count();
  }
  EXPECT_EQ(allocations, 0);
}

TEST(FixedFrameTransformation, IsBlockDiagonalTransposeOfTheFrame) {
  std::mt19937 rng(38);
  const Eigen::Matrix3d R0 = rotation_exp(2.0 * random_unit(rng));
  const Mat24 T = fixed_frame_transformation(R0);
  EXPECT_LT((T * T.transpose() - Mat24::Identity()).cwiseAbs().maxCoeff(), 1e-15);
  const Eigen::Vector3d v = random_unit(rng);
  Vec24 g = Vec24::Zero();
  g.segment<3>(9) = v;  // node 2, rotation block
  EXPECT_LT(((T * g).segment<3>(9) - R0.transpose() * v).norm(), 1e-15);
}

}  // namespace
}  // namespace rotcap
