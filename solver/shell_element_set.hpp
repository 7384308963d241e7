#pragma once
// ShellElementSet: the model's ShellQ4 elements built once in their INITIAL local frames, with
// the element-level kernels the Assembler calls for the linear analyses.
//
// Frames: ShellFrame::of(the element's four nodes); R = frame.rotation has the local axes as
// columns, in global coordinates. Element DOFs (node by node: 3 translations, 3 rotations) are
// transformed per 3-vector:  d_local = T d_global,  T = blockdiag(R^T, ..., R^T) (8 blocks), so
//   K_global = T^T K_local T,   f_global = T^T f_local
// (rotations are vectors, so translations and rotations rotate alike).
//
// History: one committed and one trial LayerState array per element, sized
// ShellQ4::kGaussPoints * section.layers(); the linear analyses evaluate the virgin state
// (committed history all default). Distinct elements own disjoint slots, so kernels may run
// concurrently for different elements.

#include "elements/shell_q4.hpp"
#include "model/shell_model.hpp"
#include "solver/assembler.hpp"
#include "solver/section_assignment.hpp"

#include <Eigen/Core>
#include <vector>

namespace rotcap {

class ShellElementSet {
 public:
  /// Builds every element; throws std::invalid_argument naming the element if one is degenerate
  /// (ShellQ4's check) or has no section. model and sections must outlive the set.
  ShellElementSet(const ShellModel& model, const SectionAssignment& sections,
                  const ShellQ4::Options& options = {});
  ShellElementSet(const ShellModel&&, const SectionAssignment&, const ShellQ4::Options& = {}) = delete;
  ShellElementSet(const ShellModel&, const SectionAssignment&&, const ShellQ4::Options& = {}) = delete;

  int size() const { return static_cast<int>(elements_.size()); }
  const ShellQ4& element(int e) const { return elements_[e]; }
  const ShellFrame& frame(int e) const { return frames_[e]; }
  const std::vector<ShellFrame>& frames() const { return frames_; }

  /// Local DOFs of element e from a full global vector u (size 6 nodes).
  Vec24 local_dofs(int e, const Eigen::VectorXd& u) const;

  /// Kernel: tangent K (and internal force f) of each element at the displacement u (full,
  /// global; u must outlive the kernel), transformed to global DOFs. If resultants is not null it
  /// must have size() entries and receives each element's Gauss-point resultants (local frame).
  ElementKernel internal_force_kernel(const Eigen::VectorXd& u,
                                      std::vector<ShellQ4Resultants>* resultants = nullptr) const;

  /// Kernel: geometric (initial-stress) stiffness of each element for the membrane forces
  /// [Nxx, Nyy, Nxy] of the given resultants (local frames), transformed to global DOFs.
  /// f, if requested, is zero. resultants must outlive the kernel.
  ElementKernel geometric_stiffness_kernel(const std::vector<ShellQ4Resultants>& resultants) const;

  /// K <- T^T K T and f <- T^T f for the rotation R of a frame (see the file comment).
  static void rotate_to_global(const Eigen::Matrix3d& R, Mat24& K);
  static void rotate_to_global(const Eigen::Matrix3d& R, Vec24& f);

 private:
  const ShellModel& model_;
  const SectionAssignment& sections_;
  std::vector<ShellQ4> elements_;
  std::vector<ShellFrame> frames_;
  std::vector<std::size_t> history_offset_;   // size() + 1 entries
  std::vector<LayerState> committed_;
  mutable std::vector<LayerState> trial_;
};

}  // namespace rotcap
