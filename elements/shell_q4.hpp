#pragma once
// ShellQ4: flat four-node shell in its own local frame, the small-strain "core" element of the
// corotational formulation (and, with a fixed frame, the linear shell).
//
// DOFs, node by node: [u, v, w, rx, ry, rz] in the LOCAL frame (mm, rad); rz is the drilling
// rotation. Node order is counter-clockwise about the local z axis.
// Geometry: local coordinates of the four nodes; rows x, y lie in the mean plane through the
// centroid, row z holds the warping offsets (+-h, zero for a flat element).
//
// Formulation (each part cited in shell_q4.cpp):
//  - bending and transverse shear: MITC4 (Dvorkin & Bathe 1984) with Mindlin kinematics
//    u = z ry, v = -z rx, so k_xx = d ry/dx, k_yy = -d rx/dy, k_xy = d ry/dy - d rx/dx,
//    g_xz = dw/dx + ry, g_yz = dw/dy - rx;
//  - membrane: bilinear plus four incompatible modes with Taylor's correction (Taylor, Beresford &
//    Wilson 1976), condensed at element level so the element passes the patch test and bends in
//    plane without shear locking; for a nonlinear section the mode amplitudes are found by a local
//    Newton iteration so the element stays a function of its nodal DOFs and history only;
//  - drilling: Hughes & Brezzi (1989) penalty  1/2 gamma t int (rz - omega)^2 dA, omega the
//    in-plane infinitesimal rotation of the bilinear field, gamma = drilling_ratio * G, 2x2 Gauss;
//  - warping: rigid offsets from the mean plane to the nodes (MacNeal 1978 / Taylor 1987 form).

#include "materials/shell_section.hpp"

#include <Eigen/Core>
#include <array>
#include <span>

namespace rotcap {

using Vec24 = Eigen::Matrix<double, 24, 1>;
using Mat24 = Eigen::Matrix<double, 24, 24>;

/// Resultants at the 2x2 Gauss points of one element, local frame (output and geometric stiffness).
struct ShellQ4Resultants {
  std::array<Vec6, 4> r;               ///< [Nxx, Nyy, Nxy, Mxx, Myy, Mxy] per Gauss point
  std::array<Eigen::Vector2d, 4> q;    ///< transverse shear forces [Qx, Qy] [N/mm]
  std::array<Vec6, 4> g;               ///< generalised strains, as in shell_section.hpp
};

enum class ElementStatus { Ok, NegativeJacobian, LocalIterationFailed, NotFinite };

class ShellQ4 {
 public:
  struct Options {
    double drilling_ratio = 1.0e-3;     ///< gamma / G, > 0 (Hughes-Brezzi drilling penalty)
    double shear_correction = 5.0 / 6.0;///< k_s, in (0, 1]
    int max_local_iterations = 25;      ///< incompatible-mode Newton loop (nonlinear sections)
  };
  static constexpr int kGaussPoints = 4;

  /// local: columns are the nodes' local coordinates [mm]. Throws std::invalid_argument if the
  /// element is degenerate (non-positive Jacobian at a Gauss point).
  ShellQ4(const Eigen::Matrix<double, 3, 4>& local, const Options& options);
  ShellQ4(const Eigen::Matrix<double, 3, 4>& local) : ShellQ4(local, Options{}) {}

  /// Internal force f(d) and (if K != nullptr) the consistent tangent dK/dd, local frame.
  /// committed / trial hold kGaussPoints * section.layers() slots (Gauss point major).
  /// out (optional) receives the resultants at the Gauss points.
  ElementStatus compute(const Vec24& d, const ShellSection& section,
                        std::span<const LayerState> committed, std::span<LayerState> trial,
                        Vec24& f, Mat24* K, ShellQ4Resultants* out = nullptr) const;

  /// Initial-stress (geometric) stiffness for the membrane forces n[gp] = [Nxx, Nyy, Nxy]:
  /// integral over the element of N_ab u_{,a} . u_{,b} for all three translations (u, v, w).
  Mat24 geometric_stiffness(const std::array<Eigen::Vector3d, 4>& membrane_forces) const;

  double area() const;                                   ///< mean-plane area [mm^2]
  const Eigen::Matrix<double, 3, 4>& local_coordinates() const { return local_; }

 private:
  Eigen::Matrix<double, 3, 4> local_;
  Options options_;
  // Precomputed per Gauss point: shape-function derivatives, det J, MITC4 tying data,
  // incompatible-mode derivatives, warping transform. Filled by the constructor.
  struct GaussData;
  std::array<Eigen::Matrix<double, 2, 4>, 4> dN_;        // dN/dx, dN/dy at each Gauss point
  std::array<double, 4> weight_;                         // w * det J
  std::array<Eigen::Matrix<double, 2, 24>, 4> b_shear_;  // MITC4 transverse shear B
  std::array<Eigen::Matrix<double, 3, 4>, 4> b_incompatible_;  // membrane strains of the 4 modes
  Eigen::Matrix<double, 24, 24> warping_;                // offset transform (identity if flat)
};

/// Element frame of a quadrilateral: origin at the centroid of the four nodes, z along the cross
/// product of the diagonals, x along the bisector of the diagonals' directions, so that the frame
/// is invariant to node renumbering by rotation. rotation's columns are the frame's axes in
/// global coordinates.
struct ShellFrame {
  Eigen::Vector3d origin;
  Eigen::Matrix3d rotation;
  /// Frame of the four nodes (columns of xyz, global coordinates).
  static ShellFrame of(const Eigen::Matrix<double, 3, 4>& xyz);
  /// Local coordinates of the nodes in this frame (3x4).
  Eigen::Matrix<double, 3, 4> to_local(const Eigen::Matrix<double, 3, 4>& xyz) const;
};

}  // namespace rotcap
