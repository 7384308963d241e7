#include "solver/shell_element_set.hpp"

#include <stdexcept>
#include <string>

namespace rotcap {

ShellElementSet::ShellElementSet(const ShellModel& model, const SectionAssignment& sections,
                                 const ShellQ4::Options& options)
    : model_(model), sections_(sections) {
  sections.check(model);
  const int n = model.element_count();
  elements_.reserve(static_cast<std::size_t>(n));
  frames_.reserve(static_cast<std::size_t>(n));
  history_offset_.assign(static_cast<std::size_t>(n) + 1, 0);
  for (int e = 0; e < n; ++e) {
    Eigen::Matrix<double, 3, 4> xyz;
    for (int a = 0; a < 4; ++a) xyz.col(a) = model.nodes[model.elements[e].nodes[a]];
    try {
      frames_.push_back(ShellFrame::of(xyz));
      elements_.emplace_back(frames_.back().to_local(xyz), options);
    } catch (const std::invalid_argument& err) {
      throw std::invalid_argument("element " + std::to_string(e) + ": " + err.what());
    }
    const std::size_t slots = static_cast<std::size_t>(ShellQ4::kGaussPoints) * sections.of(e).layers();
    history_offset_[e + 1] = history_offset_[e] + slots;
  }
  committed_.assign(history_offset_.back(), LayerState{});
  trial_ = committed_;
}

Vec24 ShellElementSet::local_dofs(int e, const Eigen::VectorXd& u) const {
  const Eigen::Matrix3d& R = frames_[e].rotation;
  Vec24 d;
  for (int a = 0; a < 4; ++a) {
    const int base = kDofsPerNode * model_.elements[e].nodes[a];
    // d_local = R^T d_global for the translation and the rotation vector of each node.
    d.segment<3>(6 * a) = R.transpose() * u.segment<3>(base);
    d.segment<3>(6 * a + 3) = R.transpose() * u.segment<3>(base + 3);
  }
  return d;
}

void ShellElementSet::rotate_to_global(const Eigen::Matrix3d& R, Mat24& K) {
  // (T^T K T)_{ab} = R K_{ab} R^T for every 3x3 block (a, b) of the block-diagonal T.
  for (int j = 0; j < 8; ++j)
    for (int i = 0; i < 8; ++i) {
      const Eigen::Matrix3d block = R * K.block<3, 3>(3 * i, 3 * j) * R.transpose();
      K.block<3, 3>(3 * i, 3 * j) = block;
    }
}

void ShellElementSet::rotate_to_global(const Eigen::Matrix3d& R, Vec24& f) {
  for (int i = 0; i < 8; ++i) {
    const Eigen::Vector3d v = R * f.segment<3>(3 * i);
    f.segment<3>(3 * i) = v;
  }
}

ElementKernel ShellElementSet::internal_force_kernel(const Eigen::VectorXd& u,
                                                     std::vector<ShellQ4Resultants>* resultants) const {
  if (u.size() != model_.dof_count())
    throw std::invalid_argument("ShellElementSet: displacement vector has " + std::to_string(u.size()) +
                                " entries; need 6 * nodes = " + std::to_string(model_.dof_count()));
  if (resultants && static_cast<int>(resultants->size()) != size())
    throw std::invalid_argument("ShellElementSet: resultants has " + std::to_string(resultants->size()) +
                                " entries; need " + std::to_string(size()));
  return [this, &u, resultants](int e, Mat24* K, Vec24* f) -> ElementStatus {
    const Vec24 d = local_dofs(e, u);
    const std::size_t begin = history_offset_[e];
    const std::size_t count = history_offset_[e + 1] - begin;
    const std::span<const LayerState> committed(committed_.data() + begin, count);
    const std::span<LayerState> trial(trial_.data() + begin, count);
    Vec24 f_local;
    const ElementStatus status = elements_[e].compute(d, sections_.of(e), committed, trial, f_local, K,
                                                      resultants ? &(*resultants)[e] : nullptr);
    if (status != ElementStatus::Ok) return status;
    const Eigen::Matrix3d& R = frames_[e].rotation;
    if (K) rotate_to_global(R, *K);
    if (f) {
      *f = f_local;
      rotate_to_global(R, *f);
    }
    return ElementStatus::Ok;
  };
}

ElementKernel ShellElementSet::geometric_stiffness_kernel(const std::vector<ShellQ4Resultants>& resultants) const {
  if (static_cast<int>(resultants.size()) != size())
    throw std::invalid_argument("ShellElementSet: resultants has " + std::to_string(resultants.size()) +
                                " entries; need " + std::to_string(size()));
  return [this, &resultants](int e, Mat24* K, Vec24* f) -> ElementStatus {
    if (K) {
      std::array<Eigen::Vector3d, ShellQ4::kGaussPoints> n;
      for (int g = 0; g < ShellQ4::kGaussPoints; ++g) n[g] = resultants[e].r[g].head<3>();
      *K = elements_[e].geometric_stiffness(n);
      rotate_to_global(frames_[e].rotation, *K);
    }
    if (f) f->setZero();
    return ElementStatus::Ok;
  };
}

}  // namespace rotcap
