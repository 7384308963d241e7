#include "model/shell_model.hpp"

#include "core/check.hpp"

#include <Eigen/Geometry>
#include <stdexcept>

namespace rotcap {

namespace {
constexpr const char* kDofNames[kDofsPerNode] = {"ux", "uy", "uz", "rx", "ry", "rz"};
}

bool parse_dof(const std::string& name, Dof& dof) {
  for (int i = 0; i < kDofsPerNode; ++i)
    if (name == kDofNames[i]) {
      dof = static_cast<Dof>(i);
      return true;
    }
  return false;
}

const char* dof_name(Dof dof) { return kDofNames[static_cast<int>(dof)]; }

std::vector<double> tributary_weights(const ShellModel& model, const NodeGroup& group) {
  // Weight of a node = its share of the group's measure: 1 per point; half of each line's length
  // to each end; a quarter of each quad's area (mean of the two triangle splits) to each corner.
  std::map<int, double> share;
  double total = 0.0;
  for (const auto& cell : group.cells) {
    double measure = 1.0;
    if (cell.size() == 2) {
      measure = (model.nodes[cell[1]] - model.nodes[cell[0]]).norm();
    } else if (cell.size() == 4) {
      const Eigen::Vector3d d1 = model.nodes[cell[2]] - model.nodes[cell[0]];
      const Eigen::Vector3d d2 = model.nodes[cell[3]] - model.nodes[cell[1]];
      measure = 0.5 * d1.cross(d2).norm();
    }
    for (int n : cell) share[n] += measure / static_cast<double>(cell.size());
    total += measure;
  }
  std::vector<double> w(group.nodes.size(), 0.0);
  if (group.cells.empty() || !(total > 0.0)) {
    // A group given only as nodes (or of zero measure): equal shares.
    for (auto& x : w) x = 1.0 / static_cast<double>(w.size());
    return w;
  }
  for (std::size_t i = 0; i < group.nodes.size(); ++i) w[i] = share[group.nodes[i]] / total;
  return w;
}

Eigen::VectorXd reference_load_vector(const ShellModel& model) { return load_vector(model, model.loads); }

Eigen::VectorXd load_vector(const ShellModel& model, const std::vector<GroupLoad>& loads) {
  Eigen::VectorXd f = Eigen::VectorXd::Zero(model.dof_count());
  for (const auto& load : loads) {
    const NodeGroup& g = model.groups.at(load.group);
    const std::vector<double> w = tributary_weights(model, g);
    for (std::size_t i = 0; i < g.nodes.size(); ++i) {
      f.segment<3>(kDofsPerNode * g.nodes[i]) += w[i] * load.force;
      f.segment<3>(kDofsPerNode * g.nodes[i] + 3) += w[i] * load.moment;
    }
  }
  return f;
}

void validate_topology(const ShellModel& model) {
  std::vector<char> used(model.nodes.size(), 0);
  for (std::size_t e = 0; e < model.elements.size(); ++e) {
    const ShellElement& el = model.elements[e];
    for (int n : el.nodes) {
      if (n < 0 || n >= model.node_count())
        throw std::invalid_argument("element " + std::to_string(e) + " refers to node " +
                                    std::to_string(n) + ", which does not exist");
      used[n] = 1;
    }
    if (!(el.thickness > 0.0))
      throw std::invalid_argument("element " + std::to_string(e) + " has thickness " +
                                  std::to_string(el.thickness) + "; expected > 0");
  }
  for (const auto& tie : model.rigid_ties) {
    if (tie.reference_node < 0 || tie.reference_node >= model.node_count())
      throw std::invalid_argument("rigid tie of group '" + tie.group + "' refers to node " +
                                  std::to_string(tie.reference_node) + ", which does not exist");
    used[tie.reference_node] = 1;
    const auto g = model.groups.find(tie.group);
    if (g == model.groups.end())
      throw std::invalid_argument("rigid tie refers to group '" + tie.group + "', which does not exist");
    for (int n : g->second.nodes)
      if (n == tie.reference_node)
        throw std::invalid_argument("rigid tie of group '" + tie.group + "' contains its own reference node");
  }
  for (std::size_t n = 0; n < used.size(); ++n)
    if (!used[n])
      throw std::invalid_argument("node " + std::to_string(n) +
                                  " is used by no shell element (a free node makes the stiffness singular)");
  for (const auto& s : model.supports)
    if (!model.groups.count(s.group))
      throw std::invalid_argument("support refers to group '" + s.group + "', which does not exist");
  for (const auto* loads : {&model.loads, &model.fixed_loads})
    for (const auto& l : *loads)
      if (!model.groups.count(l.group))
      throw std::invalid_argument("load refers to group '" + l.group + "', which does not exist");
}

double DofCombination::value(const Eigen::VectorXd& u) const {
  ROTCAP_CHECK(weights.size() == nodes.size(), "one weight per node");
  double sum = 0.0;
  for (std::size_t i = 0; i < nodes.size(); ++i) sum += weights[i] * u[kDofsPerNode * nodes[i] + static_cast<int>(dof)];
  return sum / divisor;
}

DofCombination group_mean(const ShellModel& model, const std::string& group, Dof dof) {
  const auto it = model.groups.find(group);
  ROTCAP_CHECK(it != model.groups.end(), "no group '" + group + "'");
  DofCombination c;
  c.nodes = it->second.nodes;
  c.dof = dof;
  c.weights.assign(c.nodes.size(), 1.0);
  c.divisor = static_cast<double>(c.nodes.size());
  return c;
}

}  // namespace rotcap
