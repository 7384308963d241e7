#pragma once
// CorotationalShellQ4: the four-node shell for large rotations and small strains. A ShellQ4 core
// element, built once on the initial local coordinates, sees only the deformational displacements
// d_bar of CorotationalKinematics; this class turns its local force and tangent into global ones
// (Felippa & Haugen 2005, CMAME 194:2285-2335; Rankin & Brogan 1986).
//
// DOFs, node by node, global axes: [ux, uy, uz, rx, ry, rz] (mm, rad), forces [N, N mm]. In the
// corotational mode the rotational entries of the tangent refer to spatial spin increments dw_i
// with the update R_i <- exp(skew(dw_i)) R_i (rotation.hpp); translations are additive.
// Stress resultants (out) are in the CURRENT element frame (current_frame()), per unit length of
// the core element's local axes; surface stresses follow from section.surfaces(out->g[gp], ...).
//
// Modes (Options::kinematics):
//  - Corotational: f = P^T E H^T f_bar(d_bar), K the consistent tangent (not symmetric: its skew
//    part is -skew(m_i) per node; see corotational_kinematics.hpp before symmetrising it).
//  - Linear: the corotational layer off: fixed initial frame, d_bar = T d with
//    T = blockdiag(R0^T) and d = [x_i - X_i, theta_i] (theta_i = log R_i, small rotations),
//    f = T^T f_bar(T d), K = T^T K_bar T: exactly the linear element in global axes.
// No heap allocation in compute(); the object is immutable after construction and may be used
// from several threads with separate history spans.

#include "elements/corotational/corotational_kinematics.hpp"
#include "elements/shell_q4.hpp"

#include <Eigen/Core>
#include <array>
#include <span>

namespace rotcap {

class CorotationalShellQ4 {
 public:
  enum class Kinematics { Corotational, Linear };
  struct Options {
    Kinematics kinematics = Kinematics::Corotational;
    ShellQ4::Options core;  ///< options of the local core element
  };

  /// X: initial nodal coordinates [mm], counter-clockwise about the intended normal. Throws
  /// std::invalid_argument if the frame is degenerate (diagonals parallel) or ShellQ4 rejects the
  /// geometry (non-positive Jacobian).
  CorotationalShellQ4(const NodalCoordinates& X, const Options& options);
  explicit CorotationalShellQ4(const NodalCoordinates& X) : CorotationalShellQ4(X, Options{}) {}

  /// Internal force f and (if K != nullptr) the tangent at the configuration x (current nodal
  /// coordinates) and R (current nodal rotations, identity initially), global axes.
  /// committed / trial: ShellQ4::kGaussPoints * section.layers() slots (Gauss point major).
  /// alpha_start / alpha_end: the core's incompatible-mode amplitudes (see ShellQ4::compute).
  /// Status: Ok; NegativeJacobian also when the current frame is degenerate; NotFinite when the
  /// input or the result holds NaN / inf; otherwise the core element's status. For any status but
  /// Ok, f, K and trial are unspecified.
  ElementStatus compute(const NodalCoordinates& x, const NodalRotations& R,
                        const ShellSection& section, std::span<const LayerState> committed,
                        std::span<LayerState> trial, Vec24& f, Mat24* K,
                        ShellQ4Resultants* out = nullptr, const Eigen::Vector4d* alpha_start = nullptr,
                        Eigen::Vector4d* alpha_end = nullptr) const;

  /// The linear element for a global displacement vector d (rotations as small rotation vectors),
  /// whatever the mode: f = T^T f_bar(T d), K = T^T K_bar T.
  ElementStatus compute_linear(const Vec24& d, const ShellSection& section,
                               std::span<const LayerState> committed, std::span<LayerState> trial,
                               Vec24& f, Mat24* K, ShellQ4Resultants* out = nullptr,
                               const Eigen::Vector4d* alpha_start = nullptr,
                               Eigen::Vector4d* alpha_end = nullptr) const;

  /// Geometric (initial-stress) stiffness for linear buckling about the initial configuration:
  /// T^T K_sigma T with K_sigma = core().geometric_stiffness(membrane_forces) (local membrane
  /// forces [Nxx, Nyy, Nxy] per Gauss point, N/mm), global axes.
  Mat24 geometric_stiffness(const std::array<Eigen::Vector3d, 4>& membrane_forces) const;

  /// The element frame at the nodes x (the initial frame in the linear mode); for output.
  /// For a degenerate x the returned frame is the initial one.
  ShellFrame current_frame(const NodalCoordinates& x) const;

  const ShellQ4& core() const { return core_; }
  const ShellFrame& initial_frame() const { return initial_frame_; }
  const NodalCoordinates& initial_coordinates() const { return X_; }
  Kinematics kinematics() const { return kinematics_; }

 private:
  NodalCoordinates X_;
  ShellFrame initial_frame_;
  Kinematics kinematics_;
  ShellQ4 core_;
};

}  // namespace rotcap
