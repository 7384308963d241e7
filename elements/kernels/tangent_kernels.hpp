#pragma once
// The dense kernels of the element tangents, on plain column-major double arrays. One source
// (tangent_kernels.inc) is compiled once per flavour (tangent_kernels_baseline.cpp,
// tangent_kernels_avx2.cpp); kernel_dispatch.hpp picks the flavour at run time. The arrays cross
// the boundary as raw pointers because each flavour instantiates Eigen under its own namespace
// (the AVX2 object must not lend its instantiations to baseline callers through the linker).
// Contracts (sizes are rows x cols, column-major, all in the element's conventions):

namespace rotcap::kernels {

/// The ShellQ4 tangent parts at the converged mode amplitudes (shell_q4.cpp, condensed tangent):
///   K_dd = sum_gp w [B^T C B + k_s B_s^T B_s + k_d b_d^T b_d] + k_0 m^T m,
///   K_da = sum_gp w [B^T C_m B_i - k_d b_d^T w_i],   K_ad = sum_gp w [B_i^T (C B)_m - k_d w_i^T b_d],
/// B the membrane-bending strain operator from dN (shell_q4.cpp), C_m / (C B)_m the membrane
/// columns / rows of C.
struct ShellTangentInput {
  const double* dN;             ///< 4 Gauss points x (2 x 4): dN/dx, dN/dy [1/mm]
  const double* weight;         ///< 4: w det J [mm^2]
  const double* C;              ///< 4 x (6 x 6): section tangents
  const double* b_incompatible; ///< 4 x (3 x 4): B_i, membrane strains of the modes
  const double* w_incompatible; ///< 4 x (1 x 4): w_i, in-plane rotation of the modes
  const double* b_shear;        ///< 4 x (2 x 24): B_s, MITC4 shear
  const double* b_drill;        ///< 4 x (1 x 24): b_d, drilling operator minus its mean
  const double* drill_mean;     ///< 1 x 24: m, element mean of the drilling operator
  double shear_stiffness;       ///< k_s = shear correction G t [N/mm]
  double drill_stiffness;       ///< k_d = drilling ratio G t [N/mm]
  double drill_mean_stiffness;  ///< k_0 = drilling mean ratio G t A [N mm]
};

/// The corotational tangent (corotational_kinematics.cpp, terms (1) and (2)):
///   K = W^T (H^T K_bar + Lambda) B - P^T F G,  W = E^T P,  B = H W,
/// from P's translation columns Pc (its rotation columns are unit columns) and the node positions
/// relative to the centroid that define P (corotational_kinematics.cpp).
struct CorotationalTangentInput {
  const double* K_bar;  ///< 24 x 24, local core tangent
  const double* Pc;     ///< 24 x 12, P(:, translations)
  const double* Re;     ///< 3 x 3, current frame
  const double* H;      ///< 4 x (3 x 3): H(theta_bar_i)
  const double* L;      ///< 4 x (3 x 3): Lambda_i = dH^T m_bar / dtheta_bar
  const double* F;      ///< 24 x 3: [skew(f_g,1); ...; skew(f_g,8)]
  const double* G;      ///< 3 x 12: spin-fitter
  const double* relative;  ///< 3 x 4: x_i - x_c, current nodes relative to their centroid [mm]
};

struct TangentKernels {
  /// K_dd (24 x 24), K_da (24 x 4), K_ad (4 x 24), overwritten.
  void (*shell_tangent)(const ShellTangentInput& in, double* k_dd, double* k_da, double* k_ad);
  /// K (24 x 24) -= K_da (24 x 4) A (4 x 24).
  void (*subtract_condensed)(const double* k_da, const double* a, double* k);
  /// K (24 x 24), overwritten.
  void (*corotational_tangent)(const CorotationalTangentInput& in, double* k);
};

namespace baseline {
extern const TangentKernels table;
}
namespace avx2 {
extern const TangentKernels table;  ///< defined only when ROTCAP_KERNEL_AVX2 is set
}

}  // namespace rotcap::kernels
