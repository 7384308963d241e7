#include "elements/corotational/corotational_shell_q4.hpp"

#include "elements/corotational/rotation.hpp"

#include <stdexcept>
#include <string>

namespace rotcap {

namespace {

// The initial frame: the same diagonal-bisector definition as ShellFrame::of (checked by the test
// CorotationalFrame.MatchesShellFrame), built here by CorotationalFrame so that the initial and the
// current frames come from one implementation and d_bar vanishes exactly in the initial state.
ShellFrame initial_frame_of(const NodalCoordinates& X) {
  const CorotationalFrame frame(X);
  if (!frame.valid())
    throw std::invalid_argument(
        "CorotationalShellQ4: degenerate element, the diagonals x3 - x1 and x4 - x2 are parallel "
        "or of zero length (need |e1 x e2| > 1e-10)");
  ShellFrame f;
  f.origin = frame.origin();
  f.rotation = frame.rotation();
  return f;
}

NodalCoordinates local_of(const ShellFrame& frame, const NodalCoordinates& X) {
  return frame.rotation.transpose() * (X.colwise() - frame.origin);
}

// T^T A T for T = blockdiag(R0^T): every 3x3 block becomes R0 A_ij R0^T.
Mat24 to_global_axes(const Eigen::Matrix3d& R0, const Mat24& A) {
  Mat24 out;
  for (int i = 0; i < 8; ++i)
    for (int j = 0; j < 8; ++j)
      out.block<3, 3>(3 * i, 3 * j).noalias() = R0 * A.block<3, 3>(3 * i, 3 * j) * R0.transpose();
  return out;
}

}  // namespace

CorotationalShellQ4::CorotationalShellQ4(const NodalCoordinates& X, const Options& options)
    : X_(X),
      initial_frame_(initial_frame_of(X)),
      kinematics_(options.kinematics),
      core_(local_of(initial_frame_, X), options.core) {}

ElementStatus CorotationalShellQ4::compute(const NodalCoordinates& x, const NodalRotations& R,
                                           const ShellSection& section,
                                           std::span<const LayerState> committed,
                                           std::span<LayerState> trial, Vec24& f, Mat24* K,
                                           ShellQ4Resultants* out, const Eigen::Vector4d* alpha_start,
                                           Eigen::Vector4d* alpha_end) const {
  if (!x.allFinite() || !R[0].allFinite() || !R[1].allFinite() || !R[2].allFinite() ||
      !R[3].allFinite())
    return ElementStatus::NotFinite;

  if (kinematics_ == Kinematics::Linear) {
    Vec24 d;
    for (int i = 0; i < 4; ++i) {
      d.segment<3>(6 * i) = x.col(i) - X_.col(i);
      d.segment<3>(6 * i + 3) = rotation_log(R[i]);
    }
    return compute_linear(d, section, committed, trial, f, K, out, alpha_start, alpha_end);
  }

  const CorotationalKinematics kin(core_.local_coordinates(), initial_frame_.rotation, x, R);
  if (!kin.valid()) return ElementStatus::NegativeJacobian;

  Vec24 f_bar;
  Mat24 K_bar;
  const ElementStatus status = core_.compute(kin.local_displacements(), section, committed, trial,
                                             f_bar, K != nullptr ? &K_bar : nullptr, out, alpha_start,
                                             alpha_end);
  if (status != ElementStatus::Ok) return status;
  kin.to_global(f_bar, K != nullptr ? &K_bar : nullptr, f, K, core_.kernels());
  if (!f.allFinite() || (K != nullptr && !K->allFinite())) return ElementStatus::NotFinite;
  return ElementStatus::Ok;
}

ElementStatus CorotationalShellQ4::compute_linear(const Vec24& d, const ShellSection& section,
                                                  std::span<const LayerState> committed,
                                                  std::span<LayerState> trial, Vec24& f, Mat24* K,
                                                  ShellQ4Resultants* out, const Eigen::Vector4d* alpha_start,
                                                  Eigen::Vector4d* alpha_end) const {
  if (!d.allFinite()) return ElementStatus::NotFinite;
  const Eigen::Matrix3d& R0 = initial_frame_.rotation;
  Vec24 d_bar;
  for (int i = 0; i < 8; ++i) d_bar.segment<3>(3 * i) = R0.transpose() * d.segment<3>(3 * i);
  Vec24 f_bar;
  Mat24 K_bar;
  const ElementStatus status =
      core_.compute(d_bar, section, committed, trial, f_bar, K != nullptr ? &K_bar : nullptr, out, alpha_start,
                    alpha_end);
  if (status != ElementStatus::Ok) return status;
  for (int i = 0; i < 8; ++i) f.segment<3>(3 * i) = R0 * f_bar.segment<3>(3 * i);
  if (K != nullptr) *K = to_global_axes(R0, K_bar);
  if (!f.allFinite() || (K != nullptr && !K->allFinite())) return ElementStatus::NotFinite;
  return ElementStatus::Ok;
}

Mat24 CorotationalShellQ4::geometric_stiffness(
    const std::array<Eigen::Vector3d, 4>& membrane_forces) const {
  return to_global_axes(initial_frame_.rotation, core_.geometric_stiffness(membrane_forces));
}

ShellFrame CorotationalShellQ4::current_frame(const NodalCoordinates& x) const {
  if (kinematics_ == Kinematics::Linear) return initial_frame_;
  const CorotationalFrame frame(x);
  if (!frame.valid()) return initial_frame_;
  ShellFrame f;
  f.origin = frame.origin();
  f.rotation = frame.rotation();
  return f;
}

}  // namespace rotcap
