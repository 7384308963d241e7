#pragma once
// StepConstraint: the extra equation that fixes the load factor in a path-following step. Every
// driver runs the same Newton corrector with two solves per iteration (Batoz & Dhatt 1979):
//   K du_r = -r,   K du_f = f_ref,   du = du_r + dlambda du_f,
// and differs only in how dlambda is chosen:
//  - LoadControl:         lambda fixed during the corrector (dlambda = 0 after the predictor);
//  - DisplacementControl: c . Du fixed, c a weighting of DOFs (one DOF or a group mean);
//  - ArcLength:           Crisfield's (1981) cylindrical constraint |Du|_W = ds on translational DOFs,
//                         or Riks' (1979) normal plane (updated form, Ramm 1981) as an option.
// "size" is the step's control parameter: a load-factor increment, a displacement increment of the
// controlled quantity, or an arc length, in the constraint's own measure.

#include <Eigen/Core>

#include <memory>

namespace rotcap {

class StepConstraint {
 public:
  virtual ~StepConstraint() = default;
  /// The control measure of an elastic step of unit load factor, given du_f = K^-1 f_ref at the start of
  /// the step; the driver turns first_step (a load-factor size) into the constraint's own measure with it.
  virtual double measure_of(const Eigen::VectorXd& du_f) const = 0;
  /// Predictor load-factor increment for a step of the given size. previous_increment is the last
  /// converged step's Du (empty before the first step) and sets the direction through limit points.
  virtual double predict(const Eigen::VectorXd& du_f, double size,
                         const Eigen::VectorXd& previous_increment) const = 0;
  /// Corrector: the dlambda that keeps the constraint with Du_new = Du + du_r + dlambda du_f.
  /// Returns false when no admissible root exists (the driver then cuts the step back).
  virtual bool correct(const Eigen::VectorXd& du_r, const Eigen::VectorXd& du_f,
                       const Eigen::VectorXd& Du, double size, double& dlambda) const = 0;
  /// The constraint's controlled quantity for a total displacement u and load factor lambda (for
  /// landing on a limit): lambda for load control, c . u for displacement control, NaN for arc length.
  virtual double controlled_value(const Eigen::VectorXd& u, double lambda) const = 0;
};

class LoadControl final : public StepConstraint {
 public:
  double measure_of(const Eigen::VectorXd&) const override { return 1.0; }
  double predict(const Eigen::VectorXd&, double size, const Eigen::VectorXd&) const override { return size; }
  bool correct(const Eigen::VectorXd&, const Eigen::VectorXd&, const Eigen::VectorXd&, double,
               double& dlambda) const override {
    dlambda = 0.0;
    return true;
  }
  double controlled_value(const Eigen::VectorXd&, double lambda) const override { return lambda; }
};

class DisplacementControl final : public StepConstraint {
 public:
  /// c: weights over the free DOFs so that c . u is the controlled displacement (c != 0).
  explicit DisplacementControl(Eigen::VectorXd c) : c_(std::move(c)) {}
  double measure_of(const Eigen::VectorXd& du_f) const override;
  double predict(const Eigen::VectorXd& du_f, double size, const Eigen::VectorXd&) const override;
  bool correct(const Eigen::VectorXd& du_r, const Eigen::VectorXd& du_f, const Eigen::VectorXd& Du,
               double size, double& dlambda) const override;
  double controlled_value(const Eigen::VectorXd& u, double) const override { return c_.dot(u); }

 private:
  Eigen::VectorXd c_;
};

class ArcLength final : public StepConstraint {
 public:
  enum class Form { Cylindrical, NormalPlane };
  /// weights: 1 for the DOFs in the arc-length norm (translations), 0 for the others.
  ArcLength(Eigen::VectorXd weights, Form form) : w_(std::move(weights)), form_(form) {}
  double measure_of(const Eigen::VectorXd& du_f) const override { return norm(du_f); }
  double predict(const Eigen::VectorXd& du_f, double size,
                 const Eigen::VectorXd& previous_increment) const override;
  bool correct(const Eigen::VectorXd& du_r, const Eigen::VectorXd& du_f, const Eigen::VectorXd& Du,
               double size, double& dlambda) const override;
  double controlled_value(const Eigen::VectorXd&, double) const override;

 private:
  double dot(const Eigen::VectorXd& a, const Eigen::VectorXd& b) const { return (a.array() * w_.array() * b.array()).sum(); }
  double norm(const Eigen::VectorXd& a) const;
  Eigen::VectorXd w_;
  Form form_;
};

}  // namespace rotcap
