#pragma once
// Contract between shell elements and materials: the through-thickness response of a shell at one
// in-plane integration point, in the element's local frame (x, y in the mid-plane, z the normal).
//
// Generalised strains  g = [e_xx, e_yy, g_xy, k_xx, k_yy, k_xy]
//   e: mid-surface membrane strains (g_xy engineering shear) [-]
//   k: curvatures, with the strain at height z being e + z k (k_xy engineering twist) [1/mm]
// Stress resultants    r = [N_xx, N_yy, N_xy, M_xx, M_yy, M_xy]
//   N = integral of sigma dz [N/mm];  M = integral of sigma z dz [N mm/mm]
// Transverse shear is elastic and not part of this interface: Q = k_s G t gamma is formed by the
// element from transverse_shear_modulus() and thickness().
//
// History: a section with layers() = n > 0 owns n LayerState slots per in-plane point. respond()
// reads the committed slots and writes trial slots; the caller commits trial -> committed only when
// a load step converges (and discards trial on a cut-back). Stateless sections have layers() = 0
// and ignore both spans.
// Materials know nothing of elements: this header is the whole interface between the two.

#include <Eigen/Core>
#include <array>
#include <span>

namespace rotcap {

using Vec6 = Eigen::Matrix<double, 6, 1>;
using Mat6 = Eigen::Matrix<double, 6, 6>;

/// History of one through-thickness integration point (plane stress, local element axes).
struct LayerState {
  Eigen::Vector3d plastic_strain = Eigen::Vector3d::Zero();   ///< [eps_xx, eps_yy, gamma_xy] [-]
  double equivalent_plastic_strain = 0.0;                      ///< accumulated, [-]
  Eigen::Vector3d initial_stress = Eigen::Vector3d::Zero();   ///< residual stress [MPa], added to the elastic stress
  double dissipation = 0.0;                                    ///< plastic work per unit volume [N mm / mm^3]
  Eigen::Vector3d strain = Eigen::Vector3d::Zero();            ///< total strain of the state [-] (start of a substep path)
};

/// Stresses at the bottom (z = -t/2), middle and top (z = +t/2) surfaces, for output only.
struct SurfaceStresses {
  std::array<Eigen::Vector3d, 3> stress;        ///< [s_xx, s_yy, s_xy] [MPa], bottom, middle, top
  std::array<double, 3> equivalent_plastic_strain{0.0, 0.0, 0.0};
};

class ShellSection {
 public:
  virtual ~ShellSection() = default;
  /// Plate thickness t [mm], > 0.
  virtual double thickness() const = 0;
  /// Shear modulus G used for transverse shear and drilling stiffness [MPa], > 0.
  virtual double shear_modulus() const = 0;
  /// Young's modulus E [MPa] (elastic reference, e.g. for stabilisation and scaling), > 0.
  virtual double youngs_modulus() const = 0;
  /// Number of LayerState slots per in-plane point (0 for a stateless section).
  virtual int layers() const = 0;
  /// True when respond() is linear in g and history-free (lets elements skip local iterations).
  virtual bool is_linear() const = 0;
  /// Resultants r(g) and the consistent tangent C = dr/dg. committed/trial have layers() entries.
  virtual void respond(const Vec6& g, std::span<const LayerState> committed,
                       std::span<LayerState> trial, Vec6& r, Mat6& C) const = 0;
  /// Surface stresses for the strain g with the given (already updated) history; for output.
  virtual SurfaceStresses surfaces(const Vec6& g, std::span<const LayerState> history) const = 0;
};

}  // namespace rotcap
