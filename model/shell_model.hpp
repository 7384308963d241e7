#pragma once
// ShellModel: the discretised structure every analysis works on, whether generated (hinge zone)
// or read from a Gmsh mesh. Units: mm, N, MPa, rad.
//
// Nodes carry six DOFs in the global frame, in the order of Dof: ux, uy, uz, rx, ry, rz.
// Elements are four-node shells (ShellQ4) with node indices counter-clockwise about the intended
// outward normal. Node groups are sorted, duplicate-free node index lists with the cells that
// defined them (points, lines or quads), so loads can be shared by tributary length or area.

#include <Eigen/Core>
#include <array>
#include <map>
#include <string>
#include <vector>

namespace rotcap {

enum class Dof : int { ux = 0, uy = 1, uz = 2, rx = 3, ry = 4, rz = 5 };
constexpr int kDofsPerNode = 6;

/// Parses "ux" .. "rz"; returns false for anything else.
bool parse_dof(const std::string& name, Dof& dof);
const char* dof_name(Dof dof);

struct NodeGroup {
  int dimension = 0;                       ///< 0 points, 1 curves, 2 surfaces
  std::vector<int> nodes;                  ///< sorted, unique node indices
  std::vector<std::vector<int>> cells;     ///< the group's cells (1, 2 or 4 node indices each)
};

struct ShellElement {
  std::array<int, 4> nodes;
  double thickness = 0.0;                  ///< [mm], > 0
  int region = 0;                          ///< index into ShellModel::region_names
};

/// A support: the listed DOFs of every node of a group are held at zero.
struct Support {
  std::string group;
  std::array<bool, kDofsPerNode> fixed{};  ///< indexed by Dof
};

/// A load on a group: total force [N] and moment [N mm], global axes, shared over the group's
/// nodes by tributary weight (equal shares for points, length for curves, area for surfaces).
struct GroupLoad {
  std::string group;
  Eigen::Vector3d force = Eigen::Vector3d::Zero();
  Eigen::Vector3d moment = Eigen::Vector3d::Zero();
};

/// A rigid section: every node of `group` moves with the reference node as one rigid body,
///   x_i = x_ref + R_ref (X_i - X_ref),   R_i = R_ref,
/// a kinematic coupling exact at large rotations, imposed by elimination (the group's nodes lose
/// their own DOFs). The reference node may belong to no element (it is then exempt from the
/// "used by an element" check); it must not itself be in the group.
struct RigidTie {
  std::string group;
  int reference_node = -1;
};

/// A linear combination of one DOF over nodes, value = (sum_i weights[i] u(nodes[i], dof)) / divisor:
/// a hinge rotation (weights [1/mm] or [-], divisor 1) or a group mean (weights 1, divisor the node
/// count). Used for curve columns and as the controlled quantity of displacement control.
struct DofCombination {
  std::vector<int> nodes;
  Dof dof = Dof::uz;
  std::vector<double> weights;  ///< one per node
  double divisor = 1.0;         ///< != 0
  /// Its value for a full displacement vector u (6 per node).
  double value(const Eigen::VectorXd& u) const;
};

struct ShellModel {
  std::vector<Eigen::Vector3d> nodes;      ///< initial coordinates [mm]
  std::vector<ShellElement> elements;
  std::vector<std::string> region_names;   ///< e.g. "top_flange", "web"; physical surface names
  std::map<std::string, NodeGroup> groups;
  std::vector<Support> supports;
  std::vector<GroupLoad> loads;            ///< the reference load (load factor 1)
  std::vector<GroupLoad> fixed_loads;      ///< applied first and held (e.g. an axial force)
  std::vector<RigidTie> rigid_ties;

  int node_count() const { return static_cast<int>(nodes.size()); }
  int element_count() const { return static_cast<int>(elements.size()); }
  int dof_count() const { return kDofsPerNode * node_count(); }
};

/// Tributary weights of a group's nodes (sum 1), in the order of group.nodes.
std::vector<double> tributary_weights(const ShellModel& model, const NodeGroup& group);

/// The reference load as a global nodal vector of size dof_count().
Eigen::VectorXd reference_load_vector(const ShellModel& model);
/// The same for any list of group loads (e.g. model.fixed_loads).
Eigen::VectorXd load_vector(const ShellModel& model, const std::vector<GroupLoad>& loads);

/// Checks that every element's nodes exist, thicknesses are positive, every node is used by an
/// element and every support or load names an existing group. Throws InputError (io/input_error.hpp
/// is not visible here: throws std::invalid_argument with a message naming the item).
void validate_topology(const ShellModel& model);

/// The mean of dof over the nodes of a group (which must exist).
DofCombination group_mean(const ShellModel& model, const std::string& group, Dof dof);

}  // namespace rotcap
