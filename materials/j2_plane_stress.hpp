#pragma once
// J2PlaneStress: von Mises plasticity in plane stress with isotropic hardening, at one material
// point. Small strains (with a true-stress / log-strain hardening curve, as the corotational
// shell supplies moderate strains in a rotating frame).
//
// Vectors (local element axes): strain eps = [e_xx, e_yy, g_xy] (engineering shear g = 2 e_xy),
// stress sigma = [s_xx, s_yy, s_xy] [MPa]. Tension positive.
// Constitutive law:  sigma = C (eps - eps_p) + sigma_0,  C the plane-stress isotropic matrix,
// sigma_0 the initial (residual) stress of the point, which is part of the stress that yields.
// Yield function (Simo & Hughes, Computational Inelasticity, 1998, section 3.4):
//   f = 1/2 sigma^T P sigma - 1/3 sigma_y(epbar)^2,  P = 1/3 [[2,-1,0],[-1,2,0],[0,0,6]],
//   so that sigma^T P sigma = 2/3 sigma_vm^2 and f <= 0 <=> sigma_vm <= sigma_y.
// Flow (associative): d eps_p = dgamma P sigma, d epbar = dgamma sqrt(2/3) sqrt(sigma^T P sigma).
// Integration: backward Euler, return by the plane-stress projection of Simo & Taylor (1986),
// "A return mapping algorithm for plane stress elastoplasticity", IJNME 22:649-670: the trial
// stress is scaled in the common eigenbasis of C and P, and the consistency condition is one
// scalar equation in dgamma, solved by Newton's method safeguarded by bisection on a bracket
// (the hardening curve is piecewise linear, so Newton alone may jump across a kink). The
// returned tangent is the algorithmically consistent one (Simo & Hughes 1998, section 3.4).
//
// Substeps: a plastic update is integrated in Options::substeps equal backward-Euler substeps along
// the straight strain path from the committed strain to the new one (an elastic update is exact in
// one). Backward Euler is first-order accurate on non-proportional paths (Simo & Hughes 1998,
// section 3.3), and the plates of a buckling hinge see strongly non-proportional strain increments:
// on the demo's coarse mesh, 4 substeps moved R from -2.5 % to -0.1 % of the constant-step 0.025
// result at 51 load steps (bench/results/curve_step_study.txt). The tangent is the consistent
// tangent of the whole chain: d sigma / d eps through every substep's dependence on the trial
// stress and on the hardening variable the substep before left (chain rule, tangent_chain()).
//
// History (LayerState from shell_section.hpp): update() reads the committed state and writes the
// trial state: strain, plastic_strain, equivalent_plastic_strain, and dissipation += dgamma
// sigma^T P sigma = sigma : d eps_p (the plastic work of the step, >= 0); initial_stress is copied.
// No heap allocation anywhere in update().

#include "materials/hardening_curve.hpp"
#include "materials/shell_section.hpp"

#include <Eigen/Core>

namespace rotcap {

/// Outcome of one material-point update.
enum class ReturnStatus {
  Elastic,       ///< trial stress inside or on the yield surface; tangent = C
  Plastic,       ///< returned to the yield surface; tangent = consistent elastoplastic tangent
  NotConverged,  ///< consistency not met within max_iterations, or non-finite input: the
                 ///< outputs hold the last iterate and must not be used
};

class J2PlaneStress {
 public:
  struct Options {
    /// Consistency tolerance on r = (sigma_vm / sigma_y)^2 - 1, 0 < tol < 1e-3.
    double tolerance = 1.0e-13;
    /// Newton / bisection iterations of the consistency equation, 5 <= n <= 1000.
    int max_iterations = 200;
    /// Backward-Euler substeps of a plastic update, 1 <= n <= 64 (1: one step, Simo & Taylor).
    int substeps = 4;
  };

  /// E > 0 [MPa], -1 < nu < 0.5; throws std::invalid_argument naming the broken condition.
  J2PlaneStress(double E, double nu, HardeningCurve curve, const Options& options);
  J2PlaneStress(double E, double nu, HardeningCurve curve)
      : J2PlaneStress(E, nu, std::move(curve), Options{}) {}

  /// Stress and (if tangent != nullptr) the consistent tangent d sigma / d eps at strain eps,
  /// starting from the committed history; writes the trial history.
  ReturnStatus update(const Eigen::Vector3d& strain, const LayerState& committed,
                      LayerState& trial, Eigen::Vector3d& stress,
                      Eigen::Matrix3d* tangent) const;

  /// sigma = C (eps - eps_p) + sigma_0 for a given (already updated) history, no return map.
  Eigen::Vector3d stress(const Eigen::Vector3d& strain, const LayerState& history) const;

  /// Von Mises equivalent stress sqrt(s_xx^2 - s_xx s_yy + s_yy^2 + 3 s_xy^2) [MPa].
  static double von_mises(const Eigen::Vector3d& stress);

  const Eigen::Matrix3d& elastic_matrix() const { return C_; }
  double youngs_modulus() const { return E_; }
  double poisson_ratio() const { return nu_; }
  double shear_modulus() const { return 0.5 * E_ / (1.0 + nu_); }
  const HardeningCurve& curve() const { return curve_; }
  const Options& options() const { return options_; }

 private:
  /// Derivatives of one backward-Euler return (trial stress s_tr, hardening variable a_n) -> (s, a).
  struct ReturnJacobians {
    Eigen::Matrix3d ds_dtrial = Eigen::Matrix3d::Identity();
    Eigen::Vector3d ds_da = Eigen::Vector3d::Zero();
    Eigen::RowVector3d da_dtrial = Eigen::RowVector3d::Zero();
    double da_da = 1.0;
    double dgamma = 0.0;  ///< in: the first guess of the consistency iteration; out: the converged one
    bool derivatives = true;  ///< false: only dgamma is wanted
  };
  /// One backward-Euler step from `committed` to `strain` (Simo & Taylor); `jacobians` (optional)
  /// receives the derivatives the substep chain needs, `tangent` (optional) the consistent tangent.
  ReturnStatus return_once(const Eigen::Vector3d& strain, const LayerState& committed, LayerState& trial,
                           Eigen::Vector3d& stress, Eigen::Matrix3d* tangent, ReturnJacobians* jacobians) const;
  /// The substep chain (options_.substeps > 1, trial stress outside the yield surface).
  ReturnStatus substepped(const Eigen::Vector3d& strain, const LayerState& committed, LayerState& trial,
                          Eigen::Vector3d& stress, Eigen::Matrix3d* tangent) const;

  double E_, nu_;
  HardeningCurve curve_;
  Options options_;
  Eigen::Matrix3d C_, C_inverse_;
};

}  // namespace rotcap
