// Tests of CorotationalShellQ4 with the real ShellQ4 core and the elastic section
// (elements/corotational/corotational_shell_q4.hpp, materials/elastic_shell_section.hpp).
//
// Geometry in mm: elements of size 100 mm, t = 8 mm, steel E = 210000 MPa, nu = 0.3.
// Tangent check tolerance: central differences with h_u = 1e-5 * size = 1e-3 mm and h_r = 1e-5 rad.
// The geometric nonlinearity varies on the length scale of the element (and 1 rad for rotations), so
// the truncation error is ~ (h/size)^2 / 6 |K| ~ 2e-11 |K|; rounding is eps |f| / h ~ 1e-12 |K| for
// strains ~1e-2 (|f| ~ 1e-2 |K| size). Tolerance 1e-8 relative to max |K| (energy scaled, see
// corotational_test_support.hpp). Leaving out any one term of K raises the error to at least
// 4e-5 (the spin-fitter variation; K_M, K_GR, K_GP give 1e-3..2e-2), so the check sees each term.

#include "elements/corotational/corotational_shell_q4.hpp"
#include "elements/corotational/rotation.hpp"
#include "materials/elastic_shell_section.hpp"
#include "tests/allocation_counter.hpp"
#include "tests/corotational/corotational_test_support.hpp"
#include "tests/test_support.hpp"

#include <cmath>
#include <cstdio>
#include <numbers>
#include <random>

namespace rotcap {
namespace {

using namespace rotcap::testing;

constexpr double kSize = 100.0;  // mm

const ElasticShellSection& steel_plate() {
  static const ElasticShellSection section(210000.0, 0.3, 8.0);
  return section;
}

Vec24 force_of(const CorotationalShellQ4& element, const NodalCoordinates& x,
               const NodalRotations& R) {
  Vec24 f;
  const ElementStatus status = element.compute(x, R, steel_plate(), {}, {}, f, nullptr);
  EXPECT_EQ(status, ElementStatus::Ok);
  return f;
}

NodalRotations identity_rotations() {
  NodalRotations R;
  R.fill(Eigen::Matrix3d::Identity());
  return R;
}

TEST(CorotationalShellQ4, TangentMatchesFiniteDifferenceOfForce) {
  std::mt19937 rng(41);
  for (int trial = 0; trial < 4; ++trial) {
    // Flat elements (trials 0, 1) and warped ones (2, 3; warp 2 % of the size).
    const CorotationalShellQ4 element(random_element(rng, kSize, trial < 2 ? 0.0 : 0.02));
    NodalCoordinates x;
    NodalRotations R;
    random_configuration(rng, element.initial_coordinates(), kSize, 0.01, 0.1, x, R);
    Vec24 f;
    Mat24 K;
    ASSERT_EQ(element.compute(x, R, steel_plate(), {}, {}, f, &K), ElementStatus::Ok);
    const Mat24 K_fd = finite_difference_tangent(
        [&](const NodalCoordinates& xx, const NodalRotations& RR) { return force_of(element, xx, RR); },
        x, R, 1e-5 * kSize, 1e-5);
    const double scale = energy_scaled(K, kSize).cwiseAbs().maxCoeff();
    const double error = energy_scaled(K - K_fd, kSize).cwiseAbs().maxCoeff() / scale;
    EXPECT_LT(error, 1e-8) << "trial " << trial;
    std::printf("  trial %d: max |K - K_fd| / max |K| = %.3e (energy scaled)\n", trial, error);
  }
}

TEST(CorotationalShellQ4, SkewPartIsMinusTheSkewOfTheNodalMoments) {
  // The identity of CorotationalKinematics.SkewPartIsMinusTheSkewOfTheNodalMoments, with the real
  // core (the elastic section has an energy). Rounding: K - K^T is formed from entries ~max |K|.
  std::mt19937 rng(48);
  const CorotationalShellQ4 element(random_element(rng, kSize, 0.02));
  NodalCoordinates x;
  NodalRotations R;
  random_configuration(rng, element.initial_coordinates(), kSize, 0.01, 0.1, x, R);
  Vec24 f;
  Mat24 K;
  ASSERT_EQ(element.compute(x, R, steel_plate(), {}, {}, f, &K), ElementStatus::Ok);
  Mat24 expected = Mat24::Zero();
  for (int i = 0; i < 4; ++i)
    expected.block<3, 3>(6 * i + 3, 6 * i + 3) = -skew(Eigen::Vector3d(f.segment<3>(6 * i + 3)));
  const double error = (K - K.transpose() - expected).cwiseAbs().maxCoeff();
  std::printf("  max |K - K^T + skew(m)| = %.3e N mm, max |skew(m)| = %.3e N mm, max |K| = %.3e\n",
              error, expected.cwiseAbs().maxCoeff(), K.cwiseAbs().maxCoeff());
  EXPECT_LT(error, 1e-14 * K.cwiseAbs().maxCoeff());
  EXPECT_LT(error, 1e-6 * expected.cwiseAbs().maxCoeff());
}

TEST(CorotationalShellQ4, PureRigidMotionGivesNoStrainAndNoForce) {
  std::mt19937 rng(42);
  const CorotationalShellQ4 element(random_element(rng, kSize, 0.02));
  const NodalCoordinates& X = element.initial_coordinates();
  Vec24 f_scale;
  {
    // A reference force level: the element stretched by 1e-3.
    NodalCoordinates x = X;
    x.col(2) += 1e-3 * (X.col(2) - X.col(0));
    f_scale = force_of(element, x, identity_rotations());
  }
  for (double angle : {0.5 * std::numbers::pi, 3.0}) {
    const Eigen::Matrix3d Q = rotation_exp(angle * random_unit(rng));
    const NodalCoordinates x = (Q * X).colwise() + Eigen::Vector3d(250.0, -40.0, 1000.0);
    NodalRotations R;
    R.fill(Q);
    Vec24 f;
    ShellQ4Resultants out;
    ASSERT_EQ(element.compute(x, R, steel_plate(), {}, {}, f, nullptr, &out), ElementStatus::Ok);
    // |f| relative to the force of a 1e-3 stretch: rounding of coordinates ~1e3 mm times E t.
    EXPECT_LT(f.cwiseAbs().maxCoeff(), 1e-9 * f_scale.cwiseAbs().maxCoeff()) << angle;
    for (int gp = 0; gp < 4; ++gp) EXPECT_LT(out.g[gp].cwiseAbs().maxCoeff(), 1e-12) << angle;
  }
}

TEST(CorotationalShellQ4, RigidRotationOfDeformedStateRotatesTheForces) {
  std::mt19937 rng(43);
  const CorotationalShellQ4 element(random_element(rng, kSize, 0.02));
  NodalCoordinates x;
  NodalRotations R;
  random_configuration(rng, element.initial_coordinates(), kSize, 0.01, 0.1, x, R);
  Vec24 f;
  Mat24 K;
  ShellQ4Resultants out;
  ASSERT_EQ(element.compute(x, R, steel_plate(), {}, {}, f, &K, &out), ElementStatus::Ok);
  const Eigen::Vector3d skew_axis = Eigen::Vector3d(0.3, 1.0, -0.7).normalized();
  for (const Eigen::Vector3d& rigid :
       {Eigen::Vector3d(0.0, 0.0, 0.5 * std::numbers::pi), Eigen::Vector3d(3.0 * skew_axis)}) {
    const Eigen::Matrix3d Q = rotation_exp(rigid);
    const NodalCoordinates xq = (Q * x).colwise() + Eigen::Vector3d(-500.0, 20.0, 300.0);
    NodalRotations Rq;
    for (int i = 0; i < 4; ++i) Rq[i] = Q * R[i];
    Vec24 fq;
    Mat24 Kq;
    ShellQ4Resultants outq;
    ASSERT_EQ(element.compute(xq, Rq, steel_plate(), {}, {}, fq, &Kq, &outq), ElementStatus::Ok);
    const Mat24 T = block_rotation(Q);
    // Same local strains (objectivity) and rotated forces; coordinates ~1e3 mm carry rounding
    // ~1e-13 mm into d_bar, i.e. ~1e-11 relative to the strains here.
    for (int gp = 0; gp < 4; ++gp)
      EXPECT_LT((outq.g[gp] - out.g[gp]).cwiseAbs().maxCoeff(), 1e-10 * out.g[gp].cwiseAbs().maxCoeff());
    EXPECT_LT((fq - T * f).cwiseAbs().maxCoeff(), 1e-9 * f.cwiseAbs().maxCoeff());
    EXPECT_LT((Kq - T * K * T.transpose()).cwiseAbs().maxCoeff(), 1e-9 * K.cwiseAbs().maxCoeff());
  }
}

TEST(CorotationalShellQ4, SmallDisplacementsApproachTheLinearElementQuadratically) {
  // f_corotational(a d) - f_linear(a d) = O(a^2): ratio 4 when the amplitude halves.
  std::mt19937 rng(44);
  CorotationalShellQ4::Options linear_options;
  linear_options.kinematics = CorotationalShellQ4::Kinematics::Linear;
  const NodalCoordinates X = random_element(rng, kSize, 0.02);
  const CorotationalShellQ4 corotational(X), linear(X, linear_options);
  Vec24 d;
  for (int i = 0; i < 4; ++i) {
    d.segment<3>(6 * i) = kSize * random_unit(rng);  // translations scale with the element size
    d.segment<3>(6 * i + 3) = random_unit(rng);
  }
  double previous = 0.0;
  for (double a : {1e-3, 5e-4, 2.5e-4, 1.25e-4}) {
    NodalCoordinates x = X;
    NodalRotations R;
    for (int i = 0; i < 4; ++i) {
      x.col(i) += a * d.segment<3>(6 * i);
      R[i] = rotation_exp(a * d.segment<3>(6 * i + 3));
    }
    const double difference = (force_of(corotational, x, R) - force_of(linear, x, R)).norm();
    if (previous > 0.0) {
      const double ratio = previous / difference;
      EXPECT_CLOSE(ratio, 4.0, 0.03, 0.0) << "amplitude " << a;
      std::printf("  amplitude %.4g: |f_cr - f_lin| = %.4e N, ratio to previous %.4f\n", a,
                  difference, ratio);
    }
    previous = difference;
  }
}

TEST(CorotationalShellQ4, LinearModeIsTheRotatedLinearElement) {
  // Linear mode: f = T^T K_bar T d and K = T^T K_bar T, T = blockdiag(R0^T), K_bar the core
  // element's stiffness; computed here independently with dense products.
  std::mt19937 rng(45);
  CorotationalShellQ4::Options options;
  options.kinematics = CorotationalShellQ4::Kinematics::Linear;
  const CorotationalShellQ4 element(random_element(rng, kSize, 0.02), options);
  const Mat24 T = fixed_frame_transformation(element.initial_frame().rotation);
  Vec24 f0;
  Mat24 K_bar;
  ASSERT_EQ(element.core().compute(Vec24::Zero(), steel_plate(), {}, {}, f0, &K_bar),
            ElementStatus::Ok);
  Vec24 d;
  for (int i = 0; i < 24; ++i) d(i) = 1e-3 * std::normal_distribution<double>(0.0, 1.0)(rng);
  NodalCoordinates x = element.initial_coordinates();
  NodalRotations R;
  for (int i = 0; i < 4; ++i) {
    x.col(i) += d.segment<3>(6 * i);
    R[i] = rotation_exp(d.segment<3>(6 * i + 3));
  }
  Vec24 f;
  Mat24 K;
  ASSERT_EQ(element.compute(x, R, steel_plate(), {}, {}, f, &K), ElementStatus::Ok);
  const Vec24 f_expected = T.transpose() * K_bar * T * d;
  const Mat24 K_expected = T.transpose() * K_bar * T;
  // Rounding only: x - X loses ~1e-16 * 300 mm of d ~ 1e-3, i.e. ~1e-11 relative.
  EXPECT_LT((f - f_expected).cwiseAbs().maxCoeff(), 1e-10 * f_expected.cwiseAbs().maxCoeff());
  EXPECT_LT((K - K_expected).cwiseAbs().maxCoeff(), 1e-14 * K_expected.cwiseAbs().maxCoeff());
  // compute_linear takes d directly: no coordinate rounding.
  Vec24 f_direct;
  ASSERT_EQ(element.compute_linear(d, steel_plate(), {}, {}, f_direct, nullptr), ElementStatus::Ok);
  EXPECT_LT((f_direct - f_expected).cwiseAbs().maxCoeff(), 1e-13 * f_expected.cwiseAbs().maxCoeff());
}

TEST(CorotationalShellQ4, TangentInTheInitialStateIsTheLinearStiffness) {
  // At d = 0 the local force vanishes, so the corotational tangent reduces to P^T E K_bar E^T P,
  // which equals T^T K_bar T because the core's stiffness annihilates its rigid-body modes.
  std::mt19937 rng(46);
  for (double warp : {0.0, 0.02}) {
    const NodalCoordinates X = random_element(rng, kSize, warp);
    CorotationalShellQ4::Options linear_options;
    linear_options.kinematics = CorotationalShellQ4::Kinematics::Linear;
    const CorotationalShellQ4 corotational(X), linear(X, linear_options);
    Vec24 f_cr, f_lin;
    Mat24 K_cr, K_lin;
    ASSERT_EQ(corotational.compute(X, identity_rotations(), steel_plate(), {}, {}, f_cr, &K_cr),
              ElementStatus::Ok);
    ASSERT_EQ(linear.compute(X, identity_rotations(), steel_plate(), {}, {}, f_lin, &K_lin),
              ElementStatus::Ok);
    const double scale = energy_scaled(K_lin, kSize).cwiseAbs().maxCoeff();
    const double error = energy_scaled(K_cr - K_lin, kSize).cwiseAbs().maxCoeff() / scale;
    std::printf("  warp %.2f: max |K_cr - K_lin| / max |K_lin| = %.3e\n", warp, error);
    EXPECT_LT(error, 1e-10) << "warp " << warp;
    EXPECT_LT(f_cr.cwiseAbs().maxCoeff(), 1e-12 * scale / kSize);
  }
}

TEST(CorotationalShellQ4, GeometricStiffnessOfAFlatElementIsIndependentOfItsOrientation) {
  // The initial-stress matrix integrates N_ab u_,a . u_,b over all three translation components,
  // so its 3x3 blocks are multiples of I and (flat element: no warping offsets, no rotational
  // entries) the rotation T^T K_sigma T to global axes leaves it unchanged, whatever R0 is.
  NodalCoordinates flat;
  flat << -50.0, 50.0, 60.0, -40.0, -40.0, -35.0, 45.0, 40.0, 0.0, 0.0, 0.0, 0.0;
  const Eigen::Matrix3d Q = rotation_exp(Eigen::Vector3d(0.4, -1.1, 2.0));
  const CorotationalShellQ4 element(Q * flat);
  std::array<Eigen::Vector3d, 4> n;
  for (int gp = 0; gp < 4; ++gp) n[gp] = Eigen::Vector3d(-150.0 + 10.0 * gp, 20.0, 5.0);  // N/mm
  const Mat24 K_local = element.core().geometric_stiffness(n);
  const Mat24 K_global = element.geometric_stiffness(n);
  const double scale = K_local.cwiseAbs().maxCoeff();
  EXPECT_GT(scale, 0.0);
  EXPECT_LT((K_global - K_global.transpose()).cwiseAbs().maxCoeff(), 1e-14 * scale);
  EXPECT_LT((K_global - K_local).cwiseAbs().maxCoeff(), 1e-14 * scale);
}

TEST(CorotationalShellQ4, ComputeAllocatesNoHeapMemory) {
  // docs/spec/style.md habit 13: no heap allocation in element kernels (fixed-size Eigen types only).
  std::mt19937 rng(49);
  const CorotationalShellQ4 element(random_element(rng, kSize, 0.02));
  NodalCoordinates x;
  NodalRotations R;
  random_configuration(rng, element.initial_coordinates(), kSize, 0.01, 0.1, x, R);
  Vec24 f;
  Mat24 K;
  ShellQ4Resultants out;
  ElementStatus status;
  long allocations;
  {
    const AllocationCounter counter;
    status = element.compute(x, R, steel_plate(), {}, {}, f, &K, &out);
    allocations = counter.count();
  }
  EXPECT_EQ(status, ElementStatus::Ok);
  EXPECT_EQ(allocations, 0);
  {
    // The counter does see allocations (guards against a silently inactive interposer).
    const AllocationCounter counter;
    const Eigen::MatrixXd heap = Eigen::MatrixXd::Identity(30, 30);
    allocations = counter.count();
    EXPECT_EQ(heap.rows(), 30);
  }
  EXPECT_GE(allocations, 1);
}

TEST(CorotationalShellQ4, DegenerateConfigurationIsReportedNotThrown) {
  std::mt19937 rng(47);
  const CorotationalShellQ4 element(random_element(rng, kSize, 0.0));
  NodalCoordinates x;
  x << 0, 1, 2, 3, 0, 0, 0, 0, 0, 0, 0, 0;  // collapsed onto a line
  Vec24 f;
  EXPECT_EQ(element.compute(x, identity_rotations(), steel_plate(), {}, {}, f, nullptr),
            ElementStatus::NegativeJacobian);
  x(0, 0) = std::nan("");
  EXPECT_EQ(element.compute(x, identity_rotations(), steel_plate(), {}, {}, f, nullptr),
            ElementStatus::NotFinite);
}

}  // namespace
}  // namespace rotcap
