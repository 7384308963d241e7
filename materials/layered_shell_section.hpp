#pragma once
// LayeredShellSection: a plate of thickness t of one J2 plane-stress material, integrated through
// the thickness at n points (layers). Implements the ShellSection contract (shell_section.hpp:
// generalised strains g = [e_xx, e_yy, g_xy, k_xx, k_yy, k_xy], resultants [N, M]).
//
// Kinematics: the strain at height z is eps(z) = e + z k (z in [-t/2, t/2], positive along the
// element normal). Resultants and the consistent tangent, with D(z) = d sigma / d eps of the
// material (J2PlaneStress::update):
//   N = int sigma dz,  M = int sigma z dz,
//   dN/de = int D dz,  dN/dk = dM/de = int D z dz,  dM/dk = int D z^2 dz.
//
// Through-thickness rule: composite Simpson with n odd, 3 <= n <= 15, equal spacing
// h = t / (n - 1), weights h/3 [1, 4, 2, 4, ..., 2, 4, 1] (e.g. Davis & Rabinowitz, Methods of
// Numerical Integration, 2nd ed. 1984; error -(t/180) h^4 f'''' for smooth f).
// Why Simpson rather than Gauss-Lobatto (both sample the two surfaces, where yield starts):
//  - both integrate the elastic response exactly (sigma z is quadratic in z; Simpson is exact
//    for cubics), so the elastic section equals ElasticShellSection for every n;
//  - the stress profile of a yielded plate has kinks (elastic core / plastic zones), where
//    either rule converges only like h^2, so the higher polynomial degree of Lobatto buys
//    nothing; and the fully plastic bending profile sigma = fy sign(z) has its kink at the
//    mid-surface, which for n = 5, 9, 13 is a Simpson panel boundary: Simpson then gives the
//    plastic moment fy t^2/4 of the plate exactly, whereas 5-point Lobatto underestimates it by
//    8.7 % (sum of w_i |xi_i| = 0.913). The plastic moment of the plates governs the falling
//    branch after local buckling, so the default n = 5 is chosen to get it right.
// Layer i (0-based) sits at z_i = -t/2 + i h: layer 0 is the bottom surface, layer n-1 the top,
// layer (n-1)/2 the mid-surface.
//
// History: n LayerState slots per in-plane point, in layer order; respond() reads committed and
// writes trial (see shell_section.hpp). If the return map fails at any layer (NotConverged:
// practically only for non-finite strains) respond() sets r and C to quiet NaN so the element
// reports a non-finite result; evaluate() returns that status directly.
// No heap allocation in respond() / evaluate() / surfaces(). The section is immutable after
// construction: one object may serve every element of a thickness, from any number of threads.

#include "materials/j2_plane_stress.hpp"
#include "materials/shell_section.hpp"

#include <functional>
#include <vector>

namespace rotcap {

class LayeredShellSection final : public ShellSection {
 public:
  struct Options {
    int layers = 5;  ///< integration points through the thickness, odd, 3 <= n <= 15
    /// Backward-Euler substeps of a plastic layer update (J2PlaneStress::Options::substeps),
    /// 1 <= n <= 64; the case-file key analysis.material_substeps.
    int material_substeps = J2PlaneStress::Options{}.substeps;
    /// Throws OptionError("mesh.layers" or "analysis.material_substeps", ...) outside the rules above.
    void validate() const;
  };

  /// t > 0 [mm]; throws std::invalid_argument naming the broken condition.
  LayeredShellSection(J2PlaneStress material, double t, const Options& options);
  LayeredShellSection(J2PlaneStress material, double t)
      : LayeredShellSection(std::move(material), t, Options{}) {}

  double thickness() const override { return t_; }
  double shear_modulus() const override { return material_.shear_modulus(); }
  double youngs_modulus() const override { return material_.youngs_modulus(); }
  int layers() const override { return n_; }
  bool is_linear() const override { return false; }

  void respond(const Vec6& g, std::span<const LayerState> committed, std::span<LayerState> trial,
               Vec6& r, Mat6& C) const override;
  /// As respond(), returning the worst layer status (NotConverged > Plastic > Elastic); C is
  /// computed only if C != nullptr.
  ReturnStatus evaluate(const Vec6& g, std::span<const LayerState> committed,
                        std::span<LayerState> trial, Vec6& r, Mat6* C) const;
  /// Bottom (layer 0), middle (layer (n-1)/2) and top (layer n-1) stresses from the history.
  SurfaceStresses surfaces(const Vec6& g, std::span<const LayerState> history) const override;

  /// Height z_i [mm] and weight w_i [mm] of layer i, 0 <= i < n (sum of w_i = t).
  double layer_position(int i) const { return z_[static_cast<std::size_t>(i)]; }
  double layer_weight(int i) const { return w_[static_cast<std::size_t>(i)]; }

  /// Residual stresses: sets initial_stress of each slot to s(z_i) [MPa] (other fields kept).
  void set_initial_stress(std::span<LayerState> layers,
                          const std::function<Eigen::Vector3d(double z)>& s) const;
  /// Residual stresses given per layer, per_layer.size() == n.
  void set_initial_stress(std::span<LayerState> layers,
                          std::span<const Eigen::Vector3d> per_layer) const;

  const J2PlaneStress& material() const { return material_; }

 private:
  void check_slots(std::size_t size, const char* what) const;

  J2PlaneStress material_;
  double t_;
  int n_;
  std::vector<double> z_, w_;
};

}  // namespace rotcap
