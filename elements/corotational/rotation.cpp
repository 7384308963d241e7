#include "elements/corotational/rotation.hpp"

#include <cmath>

namespace rotcap {

namespace {

// Below these angles the closed forms lose digits to cancellation and the Taylor series is used.
// Each series is truncated where its first omitted term is below 1e-16 relative at the switch.
constexpr double kSmallAngleExp = 1.0e-4;   // sin t / t: omitted t^4/120 < 1e-18
constexpr double kSmallAngleTangent = 0.1;  // (t - sin t)/t^3: omitted t^10/6227020800 < 1e-19
constexpr double kSmallAngleEta = 0.3;      // eta, mu: omitted terms below 1e-18 (see below)

}  // namespace

Eigen::Matrix3d skew(const Eigen::Vector3d& v) {
  Eigen::Matrix3d s;
  s << 0.0, -v.z(), v.y(), v.z(), 0.0, -v.x(), -v.y(), v.x(), 0.0;
  return s;
}

Eigen::Vector3d axial(const Eigen::Matrix3d& A) {
  return 0.5 * Eigen::Vector3d(A(2, 1) - A(1, 2), A(0, 2) - A(2, 0), A(1, 0) - A(0, 1));
}

Eigen::Matrix3d rotation_exp(const Eigen::Vector3d& theta) {
  // Rodrigues: R = I + (sin t / t) Th + ((1 - cos t) / t^2) Th^2 (Argyris 1982);
  // 1 - cos t is written 2 sin^2(t/2) to avoid cancellation.
  const double t = theta.norm();
  double a, b;
  if (t < kSmallAngleExp) {
    const double t2 = t * t;
    a = 1.0 - t2 / 6.0;
    b = 0.5 - t2 / 24.0;
  } else {
    const double s = std::sin(0.5 * t) / (0.5 * t);
    a = std::sin(t) / t;
    b = 0.5 * s * s;
  }
  const Eigen::Matrix3d th = skew(theta);
  return Eigen::Matrix3d::Identity() + a * th + b * th * th;
}

Eigen::Quaterniond quaternion_of(const Eigen::Matrix3d& R) {
  // Spurrier (1978): 4 w^2 = 1 + tr R and 4 v_i^2 = 1 + 2 R_ii - tr R, so the largest of tr R and
  // the R_ii picks the largest quaternion component, which is >= 1/2 (the squares sum to 1); it is
  // found by a square root and the others by dividing by it.
  const double tr = R.trace();
  double w, v[3];
  int i = 0;
  if (R(1, 1) > R(i, i)) i = 1;
  if (R(2, 2) > R(i, i)) i = 2;
  if (tr >= R(i, i)) {
    w = 0.5 * std::sqrt(1.0 + tr);
    const double f = 0.25 / w;
    v[0] = f * (R(2, 1) - R(1, 2));
    v[1] = f * (R(0, 2) - R(2, 0));
    v[2] = f * (R(1, 0) - R(0, 1));
  } else {
    const int j = (i + 1) % 3, k = (i + 2) % 3;
    v[i] = std::sqrt(0.5 * R(i, i) + 0.25 * (1.0 - tr));
    const double f = 0.25 / v[i];
    w = f * (R(k, j) - R(j, k));
    v[j] = f * (R(j, i) + R(i, j));
    v[k] = f * (R(k, i) + R(i, k));
  }
  Eigen::Quaterniond q(w, v[0], v[1], v[2]);
  if (q.w() < 0.0) q.coeffs() = -q.coeffs();  // q and -q are the same rotation; pick angle <= pi
  q.normalize();
  return q;
}

Eigen::Vector3d rotation_log(const Eigen::Matrix3d& R) {
  // theta = 2 atan2(|q_v|, q_w) q_v / |q_v|: atan2 is well conditioned at 0 and at pi, unlike
  // acos((tr R - 1)/2) near either end.
  const Eigen::Quaterniond q = quaternion_of(R);
  const Eigen::Vector3d v = q.vec();
  const double s = v.norm();
  // For s < 1e-8, 2 atan2(s, w)/s = (2/w)(1 - s^2/(3 w^2) + ...) with the omitted part < 1e-16.
  const double factor = s < 1.0e-8 ? 2.0 / q.w() : 2.0 * std::atan2(s, q.w()) / s;
  return factor * v;
}

Eigen::Matrix3d spin_tangent(const Eigen::Vector3d& theta) {
  // T_s = sum_k Th^k / (k+1)! (the left Jacobian of exp; Ibrahimbegovic et al. 1995).
  const double t = theta.norm();
  const double t2 = t * t;
  double b, c;
  if (t < kSmallAngleExp) {
    b = 0.5 - t2 / 24.0;
  } else {
    const double s = std::sin(0.5 * t) / (0.5 * t);
    b = 0.5 * s * s;  // (1 - cos t)/t^2 without cancellation
  }
  if (t < kSmallAngleTangent) {
    c = 1.0 / 6.0 - t2 / 120.0 + t2 * t2 / 5040.0 - t2 * t2 * t2 / 362880.0 +
        t2 * t2 * t2 * t2 / 39916800.0;
  } else {
    c = (t - std::sin(t)) / (t2 * t);  // (t - sin t)/t^3
  }
  const Eigen::Matrix3d th = skew(theta);
  return Eigen::Matrix3d::Identity() + b * th + c * th * th;
}

double tangent_eta(double t) {
  // eta = (1 - (t/2) cot(t/2)) / t^2 = sum_{n>=1} |B_2n| / (2n)! t^(2n-2) (Bernoulli numbers B;
  // from the Laurent series of x cot x). At t = 0.3 the first omitted term (n = 8) is < 1e-20.
  if (t < kSmallAngleEta) {
    const double t2 = t * t;
    return 1.0 / 12.0 +
           t2 * (1.0 / 720.0 +
                 t2 * (1.0 / 30240.0 +
                       t2 * (1.0 / 1209600.0 +
                             t2 * (1.0 / 47900160.0 +
                                   t2 * (691.0 / 1307674368000.0 + t2 * (7.0 / 523069747200.0))))));
  }
  const double h = 0.5 * t;
  return (1.0 - h * std::cos(h) / std::sin(h)) / (t * t);
}

double tangent_mu(double t) {
  // mu = eta'(t) / t = (t (t + sin t) - 8 sin^2(t/2)) / (4 t^4 sin^2(t/2)) (Felippa & Haugen 2005,
  // appendix); the series is the term-by-term derivative of eta's. At t = 0.3 the first omitted
  // term is < 3e-18; above it the closed form loses about 1e-11 relative to cancellation, on a
  // term that is itself O(t^3) in L.
  if (t < kSmallAngleEta) {
    const double t2 = t * t;
    return 2.0 / 720.0 +
           t2 * (4.0 / 30240.0 +
                 t2 * (6.0 / 1209600.0 +
                       t2 * (8.0 / 47900160.0 +
                             t2 * (10.0 * 691.0 / 1307674368000.0 +
                                   t2 * (12.0 * 7.0 / 523069747200.0)))));
  }
  const double s = std::sin(0.5 * t);
  return (t * (t + std::sin(t)) - 8.0 * s * s) / (4.0 * t * t * t * t * s * s);
}

Eigen::Matrix3d rotation_vector_tangent(const Eigen::Vector3d& theta) {
  // H = T_s^-1 = I - 1/2 Th + eta Th^2 (Felippa & Haugen 2005; Ibrahimbegovic 1997).
  const Eigen::Matrix3d th = skew(theta);
  return Eigen::Matrix3d::Identity() - 0.5 * th + tangent_eta(theta.norm()) * th * th;
}

Eigen::Matrix3d rotation_vector_tangent_derivative(const Eigen::Vector3d& theta,
                                                   const Eigen::Vector3d& m) {
  // H^T m = m + 1/2 theta x m + eta theta x (theta x m); differentiate each term in theta, with
  // d eta = mu theta^T d theta (Felippa & Haugen 2005, appendix, matrix L).
  const double t = theta.norm();
  const double eta = tangent_eta(t);
  const double mu = tangent_mu(t);
  const Eigen::Matrix3d th = skew(theta);
  const Eigen::Vector3d th2m = th * (th * m);
  return eta * (theta.dot(m) * Eigen::Matrix3d::Identity() + theta * m.transpose() -
                2.0 * m * theta.transpose()) +
         mu * th2m * theta.transpose() - 0.5 * skew(m);
}

void NodalRotation::rotate(const Eigen::Vector3d& dw) {
  // q(dw) = [cos(t/2), sin(t/2) dw/t]; left multiplication is the spatial update exp(dw) R.
  const double t = dw.norm();
  const double half = 0.5 * t;
  const double s = t < kSmallAngleExp ? 0.5 - t * t / 48.0 : std::sin(half) / t;
  const Eigen::Quaterniond dq(std::cos(half), s * dw.x(), s * dw.y(), s * dw.z());
  q_ = dq * q_;
  q_.normalize();
}

Eigen::Vector3d NodalRotation::vector() const {
  Eigen::Quaterniond q = q_;
  if (q.w() < 0.0) q.coeffs() = -q.coeffs();
  const double s = q.vec().norm();
  const double factor = s < 1.0e-8 ? 2.0 / q.w() : 2.0 * std::atan2(s, q.w()) / s;
  return factor * q.vec();
}

}  // namespace rotcap
