#pragma once
// ShellQ4: flat four-node shell in its own local frame, the small-strain "core" element of the
// corotational formulation (and, with a fixed frame, the linear shell).
//
// DOFs, node by node: [u, v, w, rx, ry, rz] in the LOCAL frame (mm, rad); rz is the drilling
// rotation. Node order is counter-clockwise about the local z axis.
// Geometry: local coordinates of the four nodes; rows x, y lie in the mean plane through the
// centroid, row z holds the warping offsets (+-h, zero for a flat element).
// Forces f are work-conjugate to d: [Fx, Fy, Fz, Mx, My, Mz] per node [N, N mm].
//
// Gauss points: 2x2 rule, point k at (xi, eta) = (xi_k, eta_k) / sqrt(3) with
// (xi_k, eta_k) = (-1,-1), (1,-1), (1,1), (-1,1), i.e. in node order. History slots, resultants and
// geometric_stiffness() inputs all use this order.
//
// Formulation (each part cited in shell_q4.cpp):
//  - bending and transverse shear: MITC4 (Dvorkin & Bathe 1984) with Mindlin kinematics
//    u = z ry, v = -z rx, so k_xx = d ry/dx, k_yy = -d rx/dy, k_xy = d ry/dy - d rx/dx,
//    g_xz = dw/dx + ry, g_yz = dw/dy - rx;
//  - membrane: bilinear plus four incompatible modes with Taylor's correction (Taylor, Beresford &
//    Wilson 1976), condensed at element level so the element passes the patch test and bends in
//    plane without shear locking; for a nonlinear section the mode amplitudes are found by a local
//    Newton iteration so the element stays a function of its nodal DOFs and history only;
//  - drilling: Hughes & Brezzi (1989) penalty on e = rz - omega, omega = 1/2 (dv/dx - du/dy) the
//    in-plane infinitesimal rotation of the element's membrane field (bilinear part plus
//    incompatible modes), split into the element mean m and the rest:
//      Pi_d = 1/2 t [gamma_0 A m^2 + gamma int (e - m)^2 dA],
//    gamma_0 = drilling_mean_ratio * G, gamma = drilling_ratio * G, 2x2 Gauss; with
//    drilling_mean_ratio = drilling_ratio it is 1/2 gamma t int e^2 dA. Why the mean is weighted
//    apart and why omega includes the modes: see shell_q4.cpp;
//  - warping: rigid offsets from the mean plane to the nodes (MacNeal 1978 / Taylor 1987 form):
//    d_flat = W d with u_flat = u - z_i ry, v_flat = v + z_i rx, and f = W^T f_flat,
//    K = W^T K_flat W.

#include "elements/kernel_dispatch.hpp"
#include "materials/shell_section.hpp"

#include <Eigen/Core>
#include <array>
#include <optional>
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

/// Outcome of ShellQ4::compute. On anything but Ok the outputs (f, K, out, trial) are unusable.
///  - NegativeJacobian: reserved (the constructor already rejects such geometry);
///  - LocalIterationFailed: the incompatible-mode Newton loop did not converge within
///    max_local_iterations, or its 4x4 tangent was singular;
///  - NotFinite: a non-finite number appeared in the outputs (checked in debug builds, and always
///    for the mode amplitudes).
enum class ElementStatus { Ok, NegativeJacobian, LocalIterationFailed, NotFinite };

class ShellQ4 {
 public:
  struct Options {
    double drilling_ratio = 1.0e-3;     ///< gamma / G, > 0 (Hughes-Brezzi drilling penalty, 2x2 part)
    double shear_correction = 5.0 / 6.0;///< k_s, in (0, 1]
    int max_local_iterations = 25;      ///< incompatible-mode Newton loop (nonlinear sections), >= 1
    /// Local loop converged when |R_alpha| <= local_tolerance * (membrane force scale), the scale
    /// being sum_gp w |G_gp| |N_gp| (the size of the terms that cancel in R_alpha); in (0, 1).
    double local_tolerance = 1.0e-10;
    /// gamma_0 / G for the element-mean part of the drilling penalty, > 0 (Hughes & Brezzi 1989
    /// and Ibrahimbegovic, Taylor & Wilson 1990 use gamma = G).
    double drilling_mean_ratio = 1.0;
    /// Flavour of the tangent kernels (kernel_dispatch.hpp); empty: active_kernel(). Naming an
    /// unsupported flavour throws std::invalid_argument from the constructor.
    std::optional<KernelKind> kernel;
  };
  static constexpr int kGaussPoints = 4;

  /// local: columns are the nodes' local coordinates [mm]. Throws std::invalid_argument if the
  /// element is degenerate (non-positive Jacobian at a Gauss point) or an option is out of range.
  ShellQ4(const Eigen::Matrix<double, 3, 4>& local, const Options& options);
  ShellQ4(const Eigen::Matrix<double, 3, 4>& local) : ShellQ4(local, Options{}) {}

  /// Internal force f(d) and (if K != nullptr) the consistent tangent dK/dd, local frame.
  /// committed / trial hold kGaussPoints * section.layers() slots (Gauss point major); Gauss
  /// point k reads committed[k*L, (k+1)*L) and writes trial[k*L, (k+1)*L), L = section.layers().
  /// The trial history written corresponds to the converged mode amplitudes.
  /// out (optional) receives the resultants at the Gauss points.
  /// Throws std::invalid_argument if a history span is shorter than kGaussPoints * layers().
  /// alpha_start (optional): the incompatible-mode amplitudes the local iteration of a nonlinear
  /// section starts from — pass the element's amplitudes at its committed state, so that with
  /// history-dependent layers the local problem starts where the committed history was made
  /// (from alpha = 0 the return map can meet a different loading path). alpha_end (optional)
  /// receives the converged amplitudes (the caller commits them with the history).
  ElementStatus compute(const Vec24& d, const ShellSection& section,
                        std::span<const LayerState> committed, std::span<LayerState> trial,
                        Vec24& f, Mat24* K, ShellQ4Resultants* out = nullptr,
                        const Eigen::Vector4d* alpha_start = nullptr,
                        Eigen::Vector4d* alpha_end = nullptr) const;

  /// Initial-stress (geometric) stiffness for the membrane forces n[gp] = [Nxx, Nyy, Nxy]:
  /// integral over the element of N_ab u_{,a} . u_{,b} for all three translations (u, v, w).
  /// Uses the bilinear shape functions of the mean plane and the warping transform W.
  Mat24 geometric_stiffness(const std::array<Eigen::Vector3d, 4>& membrane_forces) const;

  double area() const;                                   ///< mean-plane area [mm^2]
  const Eigen::Matrix<double, 3, 4>& local_coordinates() const { return local_; }
  const Options& options() const { return options_; }
  /// The tangent kernels this element uses (options().kernel or active_kernel()).
  const kernels::TangentKernels& kernels() const { return *kernels_; }

 private:
  // Drilling operator: (rz - omega of the bilinear field) = b_drill d_flat at Gauss point gp.
  Eigen::Matrix<double, 1, 24> drilling_operator(int gp) const;
  // Warping transform d_flat = W d and its transpose applied to f and K (W is never formed).
  Vec24 to_flat(const Vec24& d) const;
  void from_flat(Vec24& f, Mat24* K) const;

  Eigen::Matrix<double, 3, 4> local_;
  Options options_;
  const kernels::TangentKernels* kernels_;
  bool warped_ = false;
  // Precomputed per Gauss point by the constructor (geometry only, no material data).
  std::array<Eigen::Matrix<double, 2, 4>, 4> dN_;        // dN/dx, dN/dy
  std::array<double, 4> weight_;                         // w * det J (w = 1 for 2x2 Gauss)
  std::array<Eigen::Matrix<double, 2, 24>, 4> b_shear_;  // MITC4 transverse shear B (flat DOFs)
  std::array<Eigen::Matrix<double, 3, 4>, 4> b_incompatible_;  // membrane strains of the 4 modes
  std::array<Eigen::Matrix<double, 1, 4>, 4> w_incompatible_;  // omega of the 4 modes
  Eigen::Matrix<double, 1, 24> drill_mean_;              // element mean of b_drill
  std::array<Eigen::Matrix<double, 1, 24>, 4> drill_rest_;  // b_drill - drill_mean_ (e - m)
};

/// Element frame of a quadrilateral: origin at the centroid of the four nodes, z along the cross
/// product of the diagonals d1 = x2 - x0, d2 = x3 - x1, x along the bisector d1/|d1| - d2/|d2|
/// of the diagonals' directions, y = z cross x. The construction is symmetric in the nodes: a
/// cyclic renumbering turns the frame by 90 degrees about z and nothing else. The frame is a
/// smooth function of the node positions wherever d1 x d2 != 0. rotation's columns are the
/// frame's axes in global coordinates.
struct ShellFrame {
  Eigen::Vector3d origin;
  Eigen::Matrix3d rotation;
  /// Frame of the four nodes (columns of xyz, global coordinates). Throws std::invalid_argument
  /// when the diagonals are parallel or of zero length (no normal).
  static ShellFrame of(const Eigen::Matrix<double, 3, 4>& xyz);
  /// Local coordinates of the nodes in this frame (3x4): rotation^T (x - origin).
  Eigen::Matrix<double, 3, 4> to_local(const Eigen::Matrix<double, 3, 4>& xyz) const;
};

}  // namespace rotcap
