#pragma once
// ElasticShellSection: homogeneous isotropic linear-elastic plate, closed-form resultants
//   N = A e,  M = D k,  A = E t/(1-nu^2) [[1,nu,0],[nu,1,0],[0,0,(1-nu)/2]],  D = A t^2/12
// (Kirchhoff-Love plate constants, e.g. Timoshenko & Woinowsky-Krieger, Theory of Plates, 1959).

#include "materials/shell_section.hpp"

#include <stdexcept>
#include <string>

namespace rotcap {

class ElasticShellSection final : public ShellSection {
 public:
  /// E > 0 [MPa], -1 < nu < 0.5, t > 0 [mm].
  ElasticShellSection(double E, double nu, double t) : E_(E), nu_(nu), t_(t) {
    if (!(E > 0.0) || !(nu > -1.0 && nu < 0.5) || !(t > 0.0))
      throw std::invalid_argument("ElasticShellSection: need E > 0, -1 < nu < 0.5, t > 0; got E=" +
                                  std::to_string(E) + " nu=" + std::to_string(nu) +
                                  " t=" + std::to_string(t));
    Eigen::Matrix3d a;
    a << 1.0, nu, 0.0, nu, 1.0, 0.0, 0.0, 0.0, 0.5 * (1.0 - nu);
    a *= E * t / (1.0 - nu * nu);
    C_.setZero();
    C_.topLeftCorner<3, 3>() = a;
    C_.bottomRightCorner<3, 3>() = a * (t * t / 12.0);
  }
  double thickness() const override { return t_; }
  double shear_modulus() const override { return E_ / (2.0 * (1.0 + nu_)); }
  double youngs_modulus() const override { return E_; }
  double poisson_ratio() const { return nu_; }
  int layers() const override { return 0; }
  bool is_linear() const override { return true; }
  void respond(const Vec6& g, std::span<const LayerState>, std::span<LayerState>, Vec6& r,
               Mat6& C) const override {
    r.noalias() = C_ * g;
    C = C_;
  }
  SurfaceStresses surfaces(const Vec6& g, std::span<const LayerState>) const override {
    SurfaceStresses s;
    const Mat6& c = C_;
    const Eigen::Matrix3d q = c.topLeftCorner<3, 3>() / t_;  // plane-stress stiffness [MPa]
    const double z[3] = {-0.5 * t_, 0.0, 0.5 * t_};
    for (int i = 0; i < 3; ++i) s.stress[i] = q * (g.head<3>() + z[i] * g.tail<3>());
    return s;
  }

 private:
  double E_, nu_, t_;
  Mat6 C_;
};

}  // namespace rotcap
