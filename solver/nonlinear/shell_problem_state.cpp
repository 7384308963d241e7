// ShellProblem::state and ShellProblem::restore: the committed state as plain arrays and back
// (checkpoints; see shell_problem.hpp for the contract).
#include "solver/nonlinear/shell_problem.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>
#include <string>

namespace rotcap {

namespace {

constexpr std::size_t kHistoryWidth = 11;

void append_history(const std::vector<LayerState>& history, std::vector<double>& out) {
  out.reserve(history.size() * kHistoryWidth);
  for (const LayerState& s : history) {
    out.insert(out.end(), s.plastic_strain.data(), s.plastic_strain.data() + 3);
    out.push_back(s.equivalent_plastic_strain);
    out.insert(out.end(), s.initial_stress.data(), s.initial_stress.data() + 3);
    out.push_back(s.dissipation);
    out.insert(out.end(), s.strain.data(), s.strain.data() + 3);
  }
}

void read_history(const std::vector<double>& in, std::vector<LayerState>& history, const char* what) {
  if (in.size() != history.size() * kHistoryWidth)
    throw std::invalid_argument(std::string("ShellProblem::restore: ") + what + " holds " + std::to_string(in.size()) +
                                " numbers, the model needs " + std::to_string(history.size() * kHistoryWidth));
  for (std::size_t i = 0; i < history.size(); ++i) {
    const double* p = in.data() + kHistoryWidth * i;
    history[i].plastic_strain = Eigen::Vector3d(p[0], p[1], p[2]);
    history[i].equivalent_plastic_strain = p[3];
    history[i].initial_stress = Eigen::Vector3d(p[4], p[5], p[6]);
    history[i].dissipation = p[7];
    history[i].strain = Eigen::Vector3d(p[8], p[9], p[10]);
  }
}

void append_modes(const std::vector<Eigen::Vector4d>& modes, std::vector<double>& out) {
  for (const Eigen::Vector4d& a : modes) out.insert(out.end(), a.data(), a.data() + 4);
}

void read_modes(const std::vector<double>& in, std::vector<Eigen::Vector4d>& modes, const char* what) {
  if (in.size() != 4 * modes.size())
    throw std::invalid_argument(std::string("ShellProblem::restore: ") + what + " holds " + std::to_string(in.size()) +
                                " numbers, the model needs " + std::to_string(4 * modes.size()));
  for (std::size_t e = 0; e < modes.size(); ++e) modes[e] = Eigen::Vector4d(in.data() + 4 * e);
}

/// Largest |a - b| / max(|b|, tiny) over the history numbers (0 when bit-identical).
double largest_difference(const std::vector<LayerState>& a, const std::vector<double>& b) {
  std::vector<double> flat;
  append_history(a, flat);
  double worst = 0.0;
  for (std::size_t i = 0; i < flat.size(); ++i)
    if (flat[i] != b[i]) worst = std::max(worst, std::abs(flat[i] - b[i]) / std::max(std::abs(b[i]), 1e-300));
  return worst;
}

}  // namespace

ShellProblemState ShellProblem::state() const {
  ShellProblemState s;
  for (const Eigen::Vector3d& u : u_committed_) s.translations.insert(s.translations.end(), u.data(), u.data() + 3);
  for (const Eigen::Matrix3d& R : R_committed_) s.rotations.insert(s.rotations.end(), R.data(), R.data() + 9);
  for (const Eigen::Vector3d& u : u_factored_)
    s.factored_translations.insert(s.factored_translations.end(), u.data(), u.data() + 3);
  for (const Eigen::Matrix3d& R : R_factored_)
    s.factored_rotations.insert(s.factored_rotations.end(), R.data(), R.data() + 9);
  append_history(history_committed_, s.history);
  append_history(history_previous_, s.history_previous);
  append_modes(alpha_committed_, s.modes);
  append_modes(alpha_previous_, s.modes_previous);
  s.indefinite_before_last_evaluation = indefinite_before_last_;
  s.indefinite = indefinite_;
  s.statistics = {double(factorisations_), double(indefinite_factorisations_), factor_seconds_, assembly_seconds_,
                  indefinite_seconds_};
  return s;
}

double ShellProblem::restore(const ShellProblemState& s, bool reevaluate) {
  const std::size_t nodes = u_.size();
  if (s.translations.size() != 3 * nodes || s.rotations.size() != 9 * nodes || s.statistics.size() != 5 ||
      (reevaluate && (s.factored_translations.size() != 3 * nodes || s.factored_rotations.size() != 9 * nodes)))
    throw std::invalid_argument("ShellProblem::restore: the state is of another model (" +
                                std::to_string(s.translations.size() / 3) + " nodes, the model has " +
                                std::to_string(nodes) + ")");
  auto place = [&](const std::vector<double>& translations, const std::vector<double>& rotations) {
    for (std::size_t n = 0; n < nodes; ++n) {
      u_[n] = Eigen::Vector3d(translations.data() + 3 * n);
      R_[n] = Eigen::Matrix3d(rotations.data() + 9 * n);
    }
  };
  double difference = 0.0;
  if (reevaluate) {
    // The path follower's last factorisation (its factored configuration, the history before the
    // step), then the converged evaluation (the state's configuration, the same history).
    read_history(s.history_previous, history_committed_, "history_previous");
    read_modes(s.modes_previous, alpha_committed_, "modes_previous");
    history_trial_ = history_committed_;
    alpha_trial_ = alpha_committed_;
    indefinite_ = s.indefinite_before_last_evaluation;
    place(s.factored_translations, s.factored_rotations);
    Eigen::VectorXd f;
    if (evaluate(f, true) != EvaluationStatus::Ok)
      throw std::runtime_error("ShellProblem::restore: the tangent at the restored state failed: " + message_);
    place(s.translations, s.rotations);
    if (evaluate(f, false) != EvaluationStatus::Ok)
      throw std::runtime_error("ShellProblem::restore: the evaluation at the restored state failed: " + message_);
    difference = largest_difference(history_trial_, s.history);
    commit();  // the previous history becomes history_previous_
  } else {
    place(s.translations, s.rotations);
    u_committed_ = u_;
    R_committed_ = R_;
    read_history(s.history_previous, history_previous_, "history_previous");
    read_modes(s.modes_previous, alpha_previous_, "modes_previous");
    indefinite_ = s.indefinite;
    indefinite_before_last_ = s.indefinite_before_last_evaluation;
  }
  if (!reevaluate || difference != 0.0) {  // the stored history (with the re-evaluated tangent, if any)
    read_history(s.history, history_committed_, "history");
    read_modes(s.modes, alpha_committed_, "modes");
    history_trial_ = history_committed_;
    alpha_trial_ = alpha_committed_;
  }
  factorisations_ = static_cast<int>(s.statistics[0]);
  indefinite_factorisations_ = static_cast<int>(s.statistics[1]);
  factor_seconds_ = s.statistics[2];
  assembly_seconds_ = s.statistics[3];
  indefinite_seconds_ = s.statistics[4];
  return difference;
}

}  // namespace rotcap
