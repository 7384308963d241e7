#include "materials/j2_plane_stress.hpp"

#include <Eigen/LU>

#include <algorithm>
#include <cmath>
#include <limits>
#include <stdexcept>
#include <string>

namespace rotcap {

namespace {

const double kSqrt2of3 = std::sqrt(2.0 / 3.0);

/// sigma^T P sigma = A + B of return_once() (= 2/3 sigma_vm^2), one expression for every elastic test.
double yield_measure(const Eigen::Vector3d& s) {
  const double sum = s(0) + s(1), diff = s(0) - s(1);
  return sum * sum / 6.0 + (0.5 * diff * diff + 2.0 * s(2) * s(2));
}

}  // namespace

J2PlaneStress::J2PlaneStress(double E, double nu, HardeningCurve curve, const Options& options)
    : E_(E), nu_(nu), curve_(std::move(curve)), options_(options) {
  if (!(E > 0.0) || !std::isfinite(E))
    throw std::invalid_argument("J2PlaneStress: E = " + std::to_string(E) + " must be > 0");
  if (!(nu > -1.0 && nu < 0.5))
    throw std::invalid_argument("J2PlaneStress: nu = " + std::to_string(nu) +
                                " must satisfy -1 < nu < 0.5");
  if (!(options.tolerance > 0.0 && options.tolerance < 1.0e-3))
    throw std::invalid_argument("J2PlaneStress::Options.tolerance = " +
                                std::to_string(options.tolerance) + " must satisfy 0 < tol < 1e-3");
  if (options.substeps < 1 || options.substeps > 64)
    throw std::invalid_argument("J2PlaneStress::Options.substeps = " + std::to_string(options.substeps) +
                                " must satisfy 1 <= n <= 64");
  if (options.max_iterations < 5 || options.max_iterations > 1000)
    throw std::invalid_argument("J2PlaneStress::Options.max_iterations = " +
                                std::to_string(options.max_iterations) +
                                " must satisfy 5 <= n <= 1000");
  C_ << 1.0, nu, 0.0, nu, 1.0, 0.0, 0.0, 0.0, 0.5 * (1.0 - nu);
  C_ *= E / (1.0 - nu * nu);
  C_inverse_ = C_.inverse();
}

double J2PlaneStress::von_mises(const Eigen::Vector3d& s) {
  return std::sqrt(std::max(0.0, s(0) * s(0) - s(0) * s(1) + s(1) * s(1) + 3.0 * s(2) * s(2)));
}

Eigen::Vector3d J2PlaneStress::stress(const Eigen::Vector3d& strain,
                                      const LayerState& history) const {
  return C_ * (strain - history.plastic_strain) + history.initial_stress;
}

ReturnStatus J2PlaneStress::update(const Eigen::Vector3d& strain, const LayerState& committed,
                                   LayerState& trial, Eigen::Vector3d& stress,
                                   Eigen::Matrix3d* tangent) const {
  // The elastic test once here for every point (most are elastic); return_once() repeats it for
  // each substep and handles bad input (a status, never a throw).
  const Eigen::Vector3d s_tr = this->stress(strain, committed);
  const double ep_n = committed.equivalent_plastic_strain;
  if (!s_tr.allFinite() || !(ep_n >= 0.0) || !std::isfinite(ep_n))
    return return_once(strain, committed, trial, stress, tangent, nullptr);
  const double s_y = curve_.evaluate(ep_n).stress;
  if (1.5 * yield_measure(s_tr) <= s_y * s_y) {
    trial = committed;
    trial.strain = strain;
    stress = s_tr;
    if (tangent) *tangent = C_;
    return ReturnStatus::Elastic;
  }
  return options_.substeps > 1 ? substepped(strain, committed, trial, stress, tangent)
                               : return_once(strain, committed, trial, stress, tangent, nullptr);
}

ReturnStatus J2PlaneStress::substepped(const Eigen::Vector3d& strain, const LayerState& committed,
                                       LayerState& trial, Eigen::Vector3d& stress,
                                       Eigen::Matrix3d* tangent) const {
  // Chain rule over the substeps k = 1..n, eps_k = eps_n + (k/n) (eps - eps_n):
  //   d s_tr,k = C ((k/n) I - G_{k-1}) d eps,   G = d eps_p / d eps,  g = d a / d eps (a = epbar),
  //   d s_k = S_t d s_tr,k + S_a g_{k-1} d eps,  G_k = (k/n) I - C^-1 d s_k / d eps,
  //   g_k = A_t d s_tr,k / d eps + A_a g_{k-1}   (S, A: ReturnJacobians of substep k).
  const int n = options_.substeps;
  const Eigen::Vector3d increment = strain - committed.strain;
  LayerState from = committed;
  Eigen::Matrix3d G = Eigen::Matrix3d::Zero(), ds = Eigen::Matrix3d::Zero();
  Eigen::RowVector3d g = Eigen::RowVector3d::Zero();
  ReturnStatus worst = ReturnStatus::Elastic;
  ReturnJacobians J;
  for (int k = 1; k <= n; ++k) {
    const double f = double(k) / n;
    const Eigen::Vector3d eps_k = k == n ? strain : Eigen::Vector3d(committed.strain + f * increment);
    const double previous_dgamma = J.dgamma;
    J = ReturnJacobians{};
    J.dgamma = previous_dgamma;
    J.derivatives = tangent != nullptr;
    const ReturnStatus s = return_once(eps_k, from, trial, stress, nullptr, &J);
    if (s == ReturnStatus::NotConverged) return s;
    if (s == ReturnStatus::Plastic) worst = s;
    if (s == ReturnStatus::Elastic) J.dgamma = 0.0;
    if (tangent) {
      const Eigen::Matrix3d T = C_ * (f * Eigen::Matrix3d::Identity() - G);
      ds = J.ds_dtrial * T + J.ds_da * g;
      G = f * Eigen::Matrix3d::Identity() - C_inverse_ * ds;
      g = J.da_dtrial * T + J.da_da * g;
    }
    from = trial;
  }
  // The chain is not symmetric (each substep starts from a history that depends on eps); the
  // global solvers need a symmetric tangent, so the symmetric part is returned: Newton then
  // converges a little slower than quadratically (demo: 177 against 166 iterations).
  if (tangent) *tangent = 0.5 * (ds + ds.transpose());
  return worst;
}

ReturnStatus J2PlaneStress::return_once(const Eigen::Vector3d& strain, const LayerState& committed,
                                        LayerState& trial, Eigen::Vector3d& stress,
                                        Eigen::Matrix3d* tangent, ReturnJacobians* jacobians) const {
  trial = committed;
  trial.strain = strain;
  const Eigen::Vector3d s_tr = this->stress(strain, committed);
  stress = s_tr;
  if (tangent) *tangent = C_;
  const double ep_n = committed.equivalent_plastic_strain;
  // Never throw from here (callers run in parallel loops): bad input is a status.
  if (!s_tr.allFinite() || !(ep_n >= 0.0) || !std::isfinite(ep_n))
    return ReturnStatus::NotConverged;

  const HardeningCurve::Value y_n = curve_.evaluate(ep_n);
  // Trial stress in the common eigenbasis of C and P (Simo & Taylor 1986):
  //   A = (s11 + s22)^2 / 6 (eigenvalue 1/3 of P),  B = (s22 - s11)^2 / 2 + 2 s12^2 (eigenvalues
  //   1 and 2 of P), so that sigma^T P sigma = A + B.
  const double sum = s_tr(0) + s_tr(1);
  const double diff = s_tr(0) - s_tr(1);
  const double A = sum * sum / 6.0;
  const double B = 0.5 * diff * diff + 2.0 * s_tr(2) * s_tr(2);
  // Elastic: f_trial = 1/2 (A + B) - 1/3 sigma_y^2 <= 0 (A + B = yield_measure(s_tr)).
  if (1.5 * yield_measure(s_tr) <= y_n.stress * y_n.stress) return ReturnStatus::Elastic;

  // Eigenvalues of C P: a = E / (3 (1 - nu)) for the sum mode, 2G for the other two.
  const double a = E_ / (3.0 * (1.0 - nu_));
  const double g2 = E_ / (1.0 + nu_);
  // phi^2(dgamma) = A / (1 + a dgamma)^2 + B / (1 + 2G dgamma)^2  (Simo & Hughes 1998, 3.4).
  struct Eval {
    double F, dF, phi2, ep;
    HardeningCurve::Value y;
  };
  auto evaluate = [&](double dg) {
    Eval e{};
    const double d1 = 1.0 + a * dg, d2 = 1.0 + g2 * dg;
    e.phi2 = A / (d1 * d1) + B / (d2 * d2);
    const double dphi2 = -2.0 * (A * a / (d1 * d1 * d1) + B * g2 / (d2 * d2 * d2));
    const double phi = std::sqrt(e.phi2);
    // epbar_{n+1} = epbar_n + sqrt(2/3) dgamma phi(dgamma)
    e.ep = ep_n + kSqrt2of3 * dg * phi;
    e.y = curve_.evaluate(e.ep);
    // F = 1/2 phi^2 - 1/3 sigma_y^2,  dF = 1/2 dphi^2 - 2/3 sigma_y H d epbar / d dgamma
    const double dep = kSqrt2of3 * (phi + dg * 0.5 * dphi2 / phi);
    e.F = 0.5 * e.phi2 - e.y.stress * e.y.stress / 3.0;
    e.dF = 0.5 * dphi2 - 2.0 / 3.0 * e.y.stress * e.y.slope * dep;
    return e;
  };

  // Bracket: phi <= phi_tr / (1 + c dgamma), c = min(a, 2G), and sigma_y >= minimum stress,
  // so F(hi) <= 0 at 1 + c hi = sqrt(3/2) phi_tr / sigma_min.
  const double c = std::min(a, g2);
  double lo = 0.0;
  double hi = (std::sqrt(1.5 * (A + B)) / curve_.minimum_stress() - 1.0) / c;
  // Start from the substep before's dgamma (equal strain increments), else from 0.
  double dg = jacobians && jacobians->dgamma > 0.0 && jacobians->dgamma < hi ? jacobians->dgamma : 0.0;
  Eval e = evaluate(dg);
  bool converged = false;
  for (int it = 0; it < options_.max_iterations; ++it) {
    const double r = e.F / (e.y.stress * e.y.stress / 3.0);  // (sigma_vm/sigma_y)^2 - 1
    if (std::abs(r) <= options_.tolerance) {
      converged = true;
      break;
    }
    if (e.F > 0.0) lo = dg; else hi = dg;
    if (hi - lo <= 4.0 * std::numeric_limits<double>::epsilon() * hi) {
      converged = true;  // bracket collapsed to round-off: dgamma is as exact as it can be
      break;
    }
    double next = dg - e.F / e.dF;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);  // Newton left the bracket: bisect
    dg = next;
    e = evaluate(dg);
  }

  // Returned stress: trial scaled mode by mode, sigma = (I + dgamma C P)^{-1} sigma_tr.
  const double d1 = 1.0 + a * dg, d2 = 1.0 + g2 * dg;
  const double sum_n = sum / d1, diff_n = diff / d2;
  stress << 0.5 * (sum_n + diff_n), 0.5 * (sum_n - diff_n), s_tr(2) / d2;
  const Eigen::Vector3d Ps(2.0 / 3.0 * stress(0) - stress(1) / 3.0,
                           2.0 / 3.0 * stress(1) - stress(0) / 3.0, 2.0 * stress(2));
  const double phi2 = stress.dot(Ps);
  trial.plastic_strain = committed.plastic_strain + dg * Ps;
  trial.equivalent_plastic_strain = ep_n + kSqrt2of3 * dg * std::sqrt(phi2);
  // Plastic work of the step: sigma : d eps_p = dgamma sigma^T P sigma >= 0.
  trial.dissipation = committed.dissipation + dg * phi2;
  if (!converged || !stress.allFinite()) return ReturnStatus::NotConverged;

  auto return_tangent = [&](Eigen::Matrix3d& out) {
    // Xi = (C^-1 + dgamma P)^-1, diagonal in the eigenbasis v1 = [1,1,0]/sqrt2,
    // v2 = [1,-1,0]/sqrt2, v3 = [0,0,1] with eigenvalues c_i / (1 + dgamma c_i p_i).
    const double x1 = E_ / (1.0 - nu_) / d1;
    const double x2 = g2 / d2;
    const double x3 = 0.5 * g2 / d2;
    Eigen::Matrix3d Xi;
    Xi << 0.5 * (x1 + x2), 0.5 * (x1 - x2), 0.0, 0.5 * (x1 - x2), 0.5 * (x1 + x2), 0.0, 0.0, 0.0,
        x3;
    // C_ep = Xi - n n^T / (sigma^T P n + beta),  n = Xi P sigma,
    // beta = 2/3 H sigma^T P sigma / (1 - 2/3 H dgamma)  (Simo & Hughes 1998, section 3.4,
    // isotropic hardening only; H the slope of the curve at epbar_{n+1}).
    const double H = curve_.evaluate(trial.equivalent_plastic_strain).slope;
    const Eigen::Vector3d n = Xi * Ps;
    const double beta = 2.0 / 3.0 * H * phi2 / (1.0 - 2.0 / 3.0 * H * dg);
    out = Xi - (n * n.transpose()) / (Ps.dot(n) + beta);
  };
  if (tangent) return_tangent(*tangent);
  if (jacobians) jacobians->dgamma = dg;
  if (jacobians && jacobians->derivatives) {
    // At the converged dgamma (e): F(dgamma; s_tr, a_n) = 1/2 phi^2 - 1/3 sigma_y(ep)^2 with
    // ep = a_n + sqrt(2/3) dgamma phi, so dF/da_n = -2/3 sigma_y H and, at fixed dgamma,
    // dphi^2/ds_tr = (sum/3) [1,1,0] / d1^2 + [diff, -diff, 4 s12] / d2^2.
    const double sy = e.y.stress, H = e.y.slope, phi = std::sqrt(e.phi2);
    const Eigen::RowVector3d dphi2_ds = (sum / 3.0 / (d1 * d1)) * Eigen::RowVector3d(1.0, 1.0, 0.0) +
                                        Eigen::RowVector3d(diff, -diff, 4.0 * s_tr(2)) / (d2 * d2);
    const Eigen::RowVector3d dphi_ds = dphi2_ds / (2.0 * phi);
    const double dep_ddg = kSqrt2of3 * (phi + dg * 0.5 * (-2.0 * (A * a / (d1 * d1 * d1) + B * g2 / (d2 * d2 * d2))) / phi);
    const Eigen::RowVector3d dF_ds = 0.5 * dphi2_ds - 2.0 / 3.0 * sy * H * kSqrt2of3 * dg * dphi_ds;
    const double ddg_da = 2.0 / 3.0 * sy * H / e.dF;
    const Eigen::RowVector3d ddg_ds = -dF_ds / e.dF;
    // d s / d dgamma at fixed s_tr, mode by mode.
    const double dsum = -a * sum / (d1 * d1), ddiff = -g2 * diff / (d2 * d2);
    const Eigen::Vector3d ds_ddg(0.5 * (dsum + ddiff), 0.5 * (dsum - ddiff), -g2 * s_tr(2) / (d2 * d2));
    // d s / d s_tr = C_alg C^-1 (C_alg the consistent tangent at fixed history).
    Eigen::Matrix3d Calg;
    return_tangent(Calg);
    jacobians->ds_dtrial = Calg * C_inverse_;
    jacobians->ds_da = ds_ddg * ddg_da;
    jacobians->da_dtrial = kSqrt2of3 * dg * dphi_ds + dep_ddg * ddg_ds;
    jacobians->da_da = 1.0 + dep_ddg * ddg_da;
  }
  return ReturnStatus::Plastic;
}

}  // namespace rotcap
