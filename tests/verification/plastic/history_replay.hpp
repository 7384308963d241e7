#pragma once
// HistoryReplay: a second, independent code path to the layer history of a ShellProblem.
//
// ShellProblem keeps its LayerState arrays private; the verification tests that must look at every
// layer point (dissipation, which points switch between elastic and plastic during Newton) rebuild
// them here. The trial history of an element is a deterministic function of the committed history
// and the element's nodal configuration (the incompatible modes are found afresh by every compute),
// so evaluating the same CorotationalShellQ4 elements at the same configurations from the same
// committed history reproduces ShellProblem's history to round-off. The test checks that claim
// (max equivalent plastic strain against ShellProblem::max_plastic_strain()).
//
// Configuration: nodal translations u_i (additive) and rotation matrices R_i, updated like
// ShellProblem::update (R_i <- exp(skew(dw_i)) R_i for the free rotational DOFs), or set from
// ShellProblem::displacements() (rotation vectors log R_i). Models without rigid ties only.
// Layout of the history: ShellQ4::kGaussPoints * layers slots per element, Gauss point major.

#include "elements/corotational/corotational_shell_q4.hpp"
#include "elements/corotational/rotation.hpp"
#include "model/shell_model.hpp"
#include "solver/dof_map.hpp"
#include "solver/section_assignment.hpp"

#include <span>
#include <stdexcept>
#include <vector>

namespace rotcap::testing {

class HistoryReplay {
 public:
  HistoryReplay(const ShellModel& model, const SectionAssignment& sections,
                const CorotationalShellQ4::Options& options = {})
      : model_(model), sections_(sections) {
    if (!model.rigid_ties.empty()) throw std::invalid_argument("HistoryReplay: rigid ties not supported");
    offset_.assign(model.elements.size() + 1, 0);
    for (int e = 0; e < model.element_count(); ++e) {
      NodalCoordinates X;
      for (int a = 0; a < 4; ++a) X.col(a) = model.nodes[model.elements[e].nodes[a]];
      elements_.emplace_back(X, options);
      offset_[e + 1] = offset_[e] + ShellQ4::kGaussPoints * sections.of(e).layers();
    }
    committed_.assign(offset_.back(), LayerState{});
    trial_ = committed_;
    u_.assign(model.nodes.size(), Eigen::Vector3d::Zero());
    R_.assign(model.nodes.size(), Eigen::Matrix3d::Identity());
  }

  /// Configuration from a full displacement vector (translations, rotation vectors).
  void set_configuration(const Eigen::VectorXd& full) {
    for (int n = 0; n < model_.node_count(); ++n) {
      u_[n] = full.segment<3>(kDofsPerNode * n);
      R_[n] = rotation_exp(full.segment<3>(kDofsPerNode * n + 3));
    }
  }
  /// The same increment ShellProblem::update(du) applies (du over the free DOFs of dofs).
  void update(const DofMap& dofs, const Eigen::VectorXd& du) {
    for (int n = 0; n < model_.node_count(); ++n) {
      Eigen::Vector3d w = Eigen::Vector3d::Zero();
      for (int k = 0; k < 3; ++k) {
        const int qu = dofs.equation(n, static_cast<Dof>(k));
        if (qu >= 0) u_[n][k] += du[qu];
        const int qr = dofs.equation(n, static_cast<Dof>(3 + k));
        if (qr >= 0) w[k] = du[qr];
      }
      R_[n] = rotation_exp(w) * R_[n];
    }
  }

  /// Writes the trial history of every element at the current configuration; false if an element
  /// fails.
  bool evaluate() {
    for (int e = 0; e < model_.element_count(); ++e) {
      NodalCoordinates x;
      NodalRotations R;
      for (int a = 0; a < 4; ++a) {
        const int n = model_.elements[e].nodes[a];
        x.col(a) = model_.nodes[n] + u_[n];
        R[a] = R_[n];
      }
      Vec24 f;
      if (elements_[e].compute(x, R, sections_.of(e), committed(e), trial(e), f, nullptr) != ElementStatus::Ok)
        return false;
    }
    return true;
  }
  void commit() { committed_ = trial_; }

  /// Sets initial_stress of every committed and trial slot (same signature as ShellProblem's).
  template <class Stress>
  void set_initial_stress(const Stress& stress) {
    for (int e = 0; e < model_.element_count(); ++e) {
      const int layers = sections_.of(e).layers();
      for (int gp = 0; gp < ShellQ4::kGaussPoints; ++gp)
        for (int k = 0; k < layers; ++k) {
          const std::size_t i = offset_[e] + static_cast<std::size_t>(gp * layers + k);
          committed_[i].initial_stress = trial_[i].initial_stress = stress(e, gp, k);
        }
    }
  }

  std::span<const LayerState> committed(int e) const { return {committed_.data() + offset_[e], count(e)}; }
  std::span<LayerState> trial(int e) { return {trial_.data() + offset_[e], count(e)}; }
  const std::vector<LayerState>& committed_all() const { return committed_; }
  const std::vector<LayerState>& trial_all() const { return trial_; }

  /// Number of layer points whose trial state flows plastically in this increment.
  int plastic_points() const {
    int n = 0;
    for (std::size_t i = 0; i < trial_.size(); ++i)
      n += trial_[i].equivalent_plastic_strain > committed_[i].equivalent_plastic_strain;
    return n;
  }
  double max_committed_plastic_strain() const {
    double m = 0.0;
    for (const LayerState& s : committed_) m = std::max(m, s.equivalent_plastic_strain);
    return m;
  }

 private:
  std::size_t count(int e) const { return offset_[e + 1] - offset_[e]; }

  const ShellModel& model_;
  const SectionAssignment& sections_;
  std::vector<CorotationalShellQ4> elements_;
  std::vector<std::size_t> offset_;
  std::vector<LayerState> committed_, trial_;
  std::vector<Eigen::Vector3d> u_;
  std::vector<Eigen::Matrix3d> R_;
};

}  // namespace rotcap::testing
