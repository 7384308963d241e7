#include "solver/rigid_ties.hpp"

#include <Eigen/Geometry>
#include <stdexcept>
#include <string>

namespace rotcap {

namespace {
Eigen::Matrix3d skew(const Eigen::Vector3d& v) {
  Eigen::Matrix3d s;
  s << 0.0, -v.z(), v.y(), v.z(), 0.0, -v.x(), -v.y(), v.x(), 0.0;
  return s;
}
}  // namespace

RigidTieSet::RigidTieSet(const ShellModel& model) {
  const int n = model.node_count();
  master_.resize(n);
  for (int i = 0; i < n; ++i) master_[i] = i;
  for (const RigidTie& tie : model.rigid_ties) {
    const NodeGroup& g = model.groups.at(tie.group);
    for (int node : g.nodes) {
      if (master_[node] != node)
        throw std::invalid_argument("node " + std::to_string(node) + " is tied to two reference nodes");
      master_[node] = tie.reference_node;
      ++slaves_;
    }
  }
  for (const Support& s : model.supports)
    for (int node : model.groups.at(s.group).nodes)
      if (is_slave(node))
        throw std::invalid_argument("support on group '" + s.group + "' holds node " + std::to_string(node) +
                                    ", which is tied to a rigid section: support its reference node instead");
  for (const auto* loads : {&model.loads, &model.fixed_loads})
    for (const GroupLoad& l : *loads)
      for (int node : model.groups.at(l.group).nodes)
        if (is_slave(node))
          throw std::invalid_argument("load on group '" + l.group + "' acts on node " + std::to_string(node) +
                                      ", which is tied to a rigid section: load its reference node instead");
  tied_flag_.assign(model.elements.size(), 0);
  for (int e = 0; e < model.element_count(); ++e)
    for (int node : model.elements[e].nodes)
      if (is_slave(node)) tied_flag_[e] = 1;
  for (int e = 0; e < model.element_count(); ++e)
    if (tied_flag_[e]) tied_elements_.push_back(e);
}

std::vector<bool> RigidTieSet::held_dofs(const ShellModel& model) const {
  std::vector<bool> held(model.dof_count(), false);
  for (const Support& s : model.supports)
    for (int node : model.groups.at(s.group).nodes)
      for (int d = 0; d < kDofsPerNode; ++d)
        if (s.fixed[d]) held[kDofsPerNode * node + d] = true;
  for (int node = 0; node < model.node_count(); ++node)
    if (is_slave(node))
      for (int d = 0; d < kDofsPerNode; ++d) held[kDofsPerNode * node + d] = true;
  return held;
}

std::vector<ElementNodes> RigidTieSet::effective_nodes(const ShellModel& model) const {
  std::vector<ElementNodes> nodes(model.elements.size());
  for (int e = 0; e < model.element_count(); ++e)
    for (int a = 0; a < 4; ++a) nodes[e][a] = master_[model.elements[e].nodes[a]];
  return nodes;
}

void RigidTieSet::place_slaves(const std::vector<Eigen::Vector3d>& X, std::vector<Eigen::Vector3d>& u,
                               std::vector<Eigen::Matrix3d>& R) const {
  for (std::size_t s = 0; s < master_.size(); ++s) {
    const int m = master_[s];
    if (m == static_cast<int>(s)) continue;
    u[s] = X[m] + u[m] + R[m] * (X[s] - X[m]) - X[s];
    R[s] = R[m];
  }
}

void RigidTieSet::complete_linear(const std::vector<Eigen::Vector3d>& X, Eigen::VectorXd& u) const {
  for (std::size_t s = 0; s < master_.size(); ++s) {
    const int m = master_[s];
    if (m == static_cast<int>(s)) continue;
    const Eigen::Vector3d theta = u.segment<3>(kDofsPerNode * m + 3);
    u.segment<3>(kDofsPerNode * s) = u.segment<3>(kDofsPerNode * m) + theta.cross(X[s] - X[m]);
    u.segment<3>(kDofsPerNode * s + 3) = theta;
  }
}

void RigidTieSet::transform(const std::array<int, 4>& nodes, const std::array<Eigen::Vector3d, 4>& r, Mat24* K,
                            Vec24& f) const {
  // T maps the effective nodes' increments to the element's DOFs, block by node (identity for
  // untied nodes); K_r is the tie's second variation on the masters' spins.
  Mat24 T = Mat24::Identity();
  Mat24 Kr = Mat24::Zero();
  for (int a = 0; a < 4; ++a) {
    if (!is_slave(nodes[a])) continue;
    T.block<3, 3>(6 * a, 6 * a + 3) = -skew(r[a]);
    const Eigen::Vector3d fs = f.segment<3>(6 * a);
    const Eigen::Matrix3d rf = r[a] * fs.transpose();
    Kr.block<3, 3>(6 * a + 3, 6 * a + 3) = 0.5 * (rf + rf.transpose()) - fs.dot(r[a]) * Eigen::Matrix3d::Identity();
  }
  if (K) *K = T.transpose() * (*K) * T + Kr;
  f = T.transpose() * f;
}

}  // namespace rotcap
