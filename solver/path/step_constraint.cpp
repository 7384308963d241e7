#include "solver/path/step_constraint.hpp"

#include <cmath>
#include <limits>

namespace rotcap {

double DisplacementControl::measure_of(const Eigen::VectorXd& du_f) const { return std::abs(c_.dot(du_f)); }

double DisplacementControl::predict(const Eigen::VectorXd& du_f, double size, const Eigen::VectorXd&) const {
  // c . (dlambda du_f) = size; the sign of c . du_f flips past a limit point of the load, so the
  // controlled displacement keeps growing while the load factor may fall.
  const double cf = c_.dot(du_f);
  return size / cf;
}

bool DisplacementControl::correct(const Eigen::VectorXd& du_r, const Eigen::VectorXd& du_f,
                                  const Eigen::VectorXd&, double, double& dlambda) const {
  // c . (du_r + dlambda du_f) = 0 keeps the controlled displacement at the predictor's value.
  const double cf = c_.dot(du_f);
  if (!(std::abs(cf) > 0.0) || !std::isfinite(cf)) return false;
  dlambda = -c_.dot(du_r) / cf;
  return std::isfinite(dlambda);
}

double ArcLength::norm(const Eigen::VectorXd& a) const { return std::sqrt(dot(a, a)); }

double ArcLength::predict(const Eigen::VectorXd& du_f, double size,
                          const Eigen::VectorXd& previous_increment) const {
  // |dlambda du_f|_W = ds; the sign follows the previous converged increment (Feng, Peric & Owen 1996:
  // sign of Du_prev . du_f), which passes limit points and snap-backs; the first step loads positively.
  double sign = 1.0;
  if (previous_increment.size() == du_f.size() && norm(previous_increment) > 0.0)
    sign = dot(previous_increment, du_f) >= 0.0 ? 1.0 : -1.0;
  return sign * size / norm(du_f);
}

bool ArcLength::correct(const Eigen::VectorXd& du_r, const Eigen::VectorXd& du_f, const Eigen::VectorXd& Du,
                        double size, double& dlambda) const {
  if (form_ == Form::NormalPlane) {
    // Updated normal plane (Ramm 1981): the correction is orthogonal to the current increment,
    // Du . (du_r + dlambda du_f) = 0.
    const double df = dot(Du, du_f);
    if (!(std::abs(df) > 0.0)) return false;
    dlambda = -dot(Du, du_r) / df;
    return std::isfinite(dlambda);
  }
  // Cylindrical (Crisfield 1981): |Du + du_r + dlambda du_f|_W^2 = ds^2, i.e.
  //   a dl^2 + b dl + c = 0, a = |du_f|^2, b = 2 du_f.(Du + du_r), c = |Du + du_r|^2 - ds^2.
  const Eigen::VectorXd base = Du + du_r;  // one allocation per iteration, outside element loops
  const double a = dot(du_f, du_f);
  const double b = 2.0 * dot(du_f, base);
  const double c = dot(base, base) - size * size;
  const double disc = b * b - 4.0 * a * c;
  if (!(a > 0.0) || disc < 0.0) return false;
  const double sq = std::sqrt(disc);
  const double q = -0.5 * (b + std::copysign(sq, b));  // numerically stable roots (Press et al.)
  const double r1 = q / a;
  const double r2 = (q != 0.0) ? c / q : r1;
  // Root selection: the one whose new increment makes the smaller angle with the current one
  // (Crisfield 1981), which prevents doubling back along the path.
  const double dot1 = dot(Du, base) + r1 * dot(Du, du_f);
  const double dot2 = dot(Du, base) + r2 * dot(Du, du_f);
  dlambda = dot1 >= dot2 ? r1 : r2;
  return std::isfinite(dlambda);
}

double ArcLength::controlled_value(const Eigen::VectorXd&, double) const {
  return std::numeric_limits<double>::quiet_NaN();
}

}  // namespace rotcap
