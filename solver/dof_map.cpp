#include "solver/dof_map.hpp"

#include <stdexcept>
#include <string>

namespace rotcap {

DofMap::DofMap(const ShellModel& model) : node_count_(model.node_count()) {
  std::vector<bool> held(static_cast<std::size_t>(model.dof_count()), false);
  for (const Support& s : model.supports) {
    const auto it = model.groups.find(s.group);
    if (it == model.groups.end())
      throw std::invalid_argument("DofMap: support refers to group '" + s.group + "', which does not exist");
    for (int n : it->second.nodes)
      for (int d = 0; d < kDofsPerNode; ++d)
        if (s.fixed[d]) held[static_cast<std::size_t>(kDofsPerNode * n + d)] = true;
  }
  number(held);
}

DofMap::DofMap(int node_count, const std::vector<bool>& held) : node_count_(node_count) {
  if (node_count < 0 || held.size() != static_cast<std::size_t>(kDofsPerNode) * node_count)
    throw std::invalid_argument("DofMap: held has " + std::to_string(held.size()) +
                                " entries; expected 6 * node_count = " + std::to_string(6L * node_count));
  number(held);
}

void DofMap::number(const std::vector<bool>& held) {
  const int n = static_cast<int>(held.size());
  equation_.assign(held.size(), -1);
  dof_of_equation_.clear();
  dof_of_equation_.reserve(held.size());
  for (int i = 0; i < n; ++i) {
    if (held[i]) continue;
    equation_[i] = static_cast<int>(dof_of_equation_.size());
    dof_of_equation_.push_back(i);
  }
  free_count_ = static_cast<int>(dof_of_equation_.size());
  prescribed_ = Eigen::VectorXd::Zero(n);
}

void DofMap::set_prescribed(int i, double value) {
  if (i < 0 || i >= dof_count() || !is_held(i))
    throw std::invalid_argument("DofMap::set_prescribed: DOF " + std::to_string(i) +
                                " is not a held DOF (need 0 <= i < " + std::to_string(dof_count()) +
                                " and held)");
  prescribed_[i] = value;
}

Eigen::VectorXd DofMap::scatter(const Eigen::VectorXd& x_free) const {
  Eigen::VectorXd full = prescribed_;
  for (int q = 0; q < free_count_; ++q) full[dof_of_equation_[q]] = x_free[q];
  return full;
}

Eigen::VectorXd DofMap::scatter_homogeneous(const Eigen::VectorXd& x_free) const {
  Eigen::VectorXd full = Eigen::VectorXd::Zero(dof_count());
  for (int q = 0; q < free_count_; ++q) full[dof_of_equation_[q]] = x_free[q];
  return full;
}

Eigen::VectorXd DofMap::gather(const Eigen::VectorXd& x_full) const {
  Eigen::VectorXd x(free_count_);
  for (int q = 0; q < free_count_; ++q) x[q] = x_full[dof_of_equation_[q]];
  return x;
}

Eigen::VectorXd free_dof_weights(const DofCombination& combination, const DofMap& dofs, int* held) {
  Eigen::VectorXd c = Eigen::VectorXd::Zero(dofs.free_count());
  int n_held = 0;
  for (std::size_t i = 0; i < combination.nodes.size(); ++i) {
    const int q = dofs.equation(combination.nodes[i], combination.dof);
    if (q >= 0)
      c[q] += combination.weights[i] / combination.divisor;
    else
      ++n_held;
  }
  if (held) *held = n_held;
  return c;
}

}  // namespace rotcap
