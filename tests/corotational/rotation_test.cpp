// Tests of the SO(3) utilities (elements/corotational/rotation.hpp).
//
// Finite-difference tolerances: a central difference with step h has truncation error
// h^2/6 |f'''| and rounding error ~ eps |f| / h. All functions here are O(1) with O(1) third
// derivatives for |theta| <= 3, so with h = 1e-5 both are ~1e-10 to 1e-11; tolerances are 1e-8.

#include "elements/corotational/rotation.hpp"
#include "tests/test_support.hpp"

#include <cmath>
#include <numbers>
#include <random>

namespace rotcap {
namespace {

constexpr double kPi = std::numbers::pi;

Eigen::Vector3d random_unit(std::mt19937& rng) {
  std::normal_distribution<double> g(0.0, 1.0);
  return Eigen::Vector3d(g(rng), g(rng), g(rng)).normalized();
}

double max_abs(const Eigen::MatrixXd& a) { return a.cwiseAbs().maxCoeff(); }

TEST(Rotation, ExpIsOrthonormalWithUnitDeterminant) {
  std::mt19937 rng(11);
  for (double angle : {0.0, 1e-9, 1e-4, 0.3, 1.0, 3.0, kPi}) {
    const Eigen::Matrix3d R = rotation_exp(angle * random_unit(rng));
    EXPECT_LT(max_abs(R.transpose() * R - Eigen::Matrix3d::Identity()), 1e-15) << angle;
    EXPECT_CLOSE(R.determinant(), 1.0, 0.0, 1e-15);
  }
}

TEST(Rotation, ExpMatchesAxisAngleFormula) {
  // Rodrigues' rotation about z by 90 degrees maps x to y (right-hand rule).
  const Eigen::Matrix3d R = rotation_exp(Eigen::Vector3d(0.0, 0.0, 0.5 * kPi));
  const Eigen::Vector3d y = R * Eigen::Vector3d::UnitX();
  EXPECT_CLOSE(y.x(), 0.0, 0.0, 1e-15);
  EXPECT_CLOSE(y.y(), 1.0, 0.0, 1e-15);
  // And it agrees with Eigen's independent AngleAxis construction for a skew axis.
  std::mt19937 rng(3);
  const Eigen::Vector3d axis = random_unit(rng);
  const Eigen::Matrix3d Q = Eigen::AngleAxisd(2.5, axis).toRotationMatrix();
  EXPECT_LT(max_abs(rotation_exp(2.5 * axis) - Q), 1e-15);
}

TEST(Rotation, LogInvertsExpFromZeroToNearPi) {
  std::mt19937 rng(5);
  for (double angle : {0.0, 1e-12, 1e-8, 1e-5, 1e-2, 0.5, 2.0, 3.0, kPi - 1e-4, kPi - 1e-7,
                       kPi - 1e-10}) {
    for (int k = 0; k < 5; ++k) {
      const Eigen::Vector3d theta = angle * random_unit(rng);
      const Eigen::Vector3d back = rotation_log(rotation_exp(theta));
      // Absolute error of the rotation vector; near pi the axis is recovered from the symmetric
      // part of R (Spurrier), so it stays at rounding level.
      EXPECT_LT((back - theta).norm(), 4e-15 * std::max(1.0, angle)) << "angle " << angle;
    }
  }
}

TEST(Rotation, LogAtPiGivesAVectorOfTheSameRotation) {
  std::mt19937 rng(6);
  for (int k = 0; k < 5; ++k) {
    const Eigen::Vector3d theta = kPi * random_unit(rng);
    const Eigen::Matrix3d R = rotation_exp(theta);
    const Eigen::Vector3d back = rotation_log(R);
    EXPECT_CLOSE(back.norm(), kPi, 1e-15, 0.0);
    EXPECT_LT(max_abs(rotation_exp(back) - R), 1e-15);
  }
}

TEST(Rotation, SpinTangentTimesInverseIsIdentity) {
  std::mt19937 rng(7);
  for (double angle : {0.0, 1e-6, 0.05, 0.1, 0.29, 0.31, 1.0, 2.5, 3.1, 5.0}) {
    const Eigen::Vector3d theta = angle * random_unit(rng);
    const Eigen::Matrix3d prod = spin_tangent(theta) * rotation_vector_tangent(theta);
    EXPECT_LT(max_abs(prod - Eigen::Matrix3d::Identity()), 1e-14) << "angle " << angle;
  }
}

TEST(Rotation, SpinTangentIsTheSpinOfARotationVectorIncrement) {
  // exp(theta + h e_k) exp(theta)^T = exp(skew(h T_s e_k)) + O(h^2): central difference of the
  // spin axial((R(+h) - R(-h)) R^T) / (2h), error ~ h^2 (tolerance in the file header).
  std::mt19937 rng(8);
  const double h = 1e-5;
  for (double angle : {1e-3, 0.7, 2.9}) {
    const Eigen::Vector3d theta = angle * random_unit(rng);
    const Eigen::Matrix3d R = rotation_exp(theta);
    const Eigen::Matrix3d Ts = spin_tangent(theta);
    for (int k = 0; k < 3; ++k) {
      const Eigen::Vector3d e = Eigen::Vector3d::Unit(k);
      const Eigen::Matrix3d dR = (rotation_exp(theta + h * e) - rotation_exp(theta - h * e)) / (2 * h);
      const Eigen::Vector3d spin = axial(dR * R.transpose());
      EXPECT_LT((spin - Ts.col(k)).norm(), 1e-8) << "angle " << angle << " k " << k;
    }
  }
}

TEST(Rotation, SeriesAndClosedFormsAgreeAtTheirSwitch) {
  // eta and mu switch from series to closed form at t = 0.3; both branches must agree there to the
  // closed forms' own accuracy (about 1e-13 for eta and 1e-10 for mu at t = 0.3).
  const double t = 0.3;
  const double h = 0.5 * t;
  const double eta_closed = (1.0 - h * std::cos(h) / std::sin(h)) / (t * t);
  const double s = std::sin(h);
  const double mu_closed = (t * (t + std::sin(t)) - 8.0 * s * s) / (4.0 * t * t * t * t * s * s);
  EXPECT_CLOSE(tangent_eta(t - 1e-14), eta_closed, 1e-12, 0.0);
  EXPECT_CLOSE(tangent_mu(t - 1e-14), mu_closed, 1e-9, 0.0);
  // Limits at 0: eta -> 1/12, mu -> 1/360 (series of x cot x).
  EXPECT_CLOSE(tangent_eta(0.0), 1.0 / 12.0, 1e-15, 0.0);
  EXPECT_CLOSE(tangent_mu(0.0), 1.0 / 360.0, 1e-15, 0.0);
}

TEST(Rotation, MuIsTheDerivativeOfEtaOverT) {
  // mu = eta'(t)/t; central difference with h = 1e-5 (error ~ h^2 eta''' ~ 1e-12).
  const double h = 1e-5;
  for (double t : {0.05, 0.2, 0.5, 1.5, 3.0, 5.0}) {
    const double d = (tangent_eta(t + h) - tangent_eta(t - h)) / (2 * h);
    EXPECT_CLOSE(tangent_mu(t), d / t, 1e-8, 1e-12) << "t " << t;
  }
}

TEST(Rotation, MomentDerivativeMatchesFiniteDifference) {
  // L(theta, m) = d(H(theta)^T m)/d theta by central differences (h = 1e-5, error ~ 1e-10).
  std::mt19937 rng(9);
  const double h = 1e-5;
  for (double angle : {0.0, 0.01, 0.25, 0.35, 1.2, 2.8}) {
    const Eigen::Vector3d theta = angle * random_unit(rng);
    const Eigen::Vector3d m = 3.0 * random_unit(rng);
    const Eigen::Matrix3d L = rotation_vector_tangent_derivative(theta, m);
    for (int k = 0; k < 3; ++k) {
      const Eigen::Vector3d e = Eigen::Vector3d::Unit(k);
      const Eigen::Vector3d d = (rotation_vector_tangent(theta + h * e).transpose() * m -
                                 rotation_vector_tangent(theta - h * e).transpose() * m) /
                                (2 * h);
      EXPECT_LT((L.col(k) - d).norm(), 1e-8 * m.norm()) << "angle " << angle << " k " << k;
    }
  }
}

TEST(NodalRotation, UpdateIsMultiplicativeNotAdditive) {
  // Two non-coaxial spins: exp(b) exp(a), which differs from exp(a + b) by O(|a||b|).
  const Eigen::Vector3d a(0.8, 0.0, 0.0), b(0.0, 0.6, 0.0);
  NodalRotation r;
  r.rotate(a);
  r.rotate(b);
  EXPECT_LT(max_abs(r.matrix() - rotation_exp(b) * rotation_exp(a)), 1e-15);
  EXPECT_GT(max_abs(r.matrix() - rotation_exp(a + b)), 0.1);
}

TEST(NodalRotation, StaysOrthonormalOverManyUpdates) {
  std::mt19937 rng(10);
  NodalRotation r;
  Eigen::Matrix3d reference = Eigen::Matrix3d::Identity();
  for (int k = 0; k < 10000; ++k) {
    const Eigen::Vector3d dw = 0.3 * random_unit(rng);
    r.rotate(dw);
    reference = rotation_exp(dw) * reference;
  }
  const Eigen::Matrix3d R = r.matrix();
  EXPECT_LT(max_abs(R.transpose() * R - Eigen::Matrix3d::Identity()), 1e-14);
  EXPECT_LT(max_abs(R - reference), 1e-11);  // rounding accumulates over 10^4 products
  EXPECT_LT(max_abs(rotation_exp(r.vector()) - R), 1e-14);
}

}  // namespace
}  // namespace rotcap
