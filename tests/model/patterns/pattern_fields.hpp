#pragma once
// Synthetic displacement fields on hinge-zone models for the deformation-shape and imperfection
// tests: rigid section motions, a flange wave, a web bulge, a lateral-torsional field.
#include "model/hinge_zone/hinge_zone_mesher.hpp"
#include "model/section/section_table.hpp"

#include <Eigen/Core>
#include <Eigen/Geometry>
#include <cmath>
#include <functional>
#include <numbers>
#include <vector>

namespace rotcap::patterns_test {

constexpr double kPi = std::numbers::pi;

// IPE 300 (b = 150, h = 300, tf = 10.7: zf = 144.65, hw = 289.3), 8 x 10 elements, h_e = 18.75 mm,
// on the uniform grid (tension_coarsening 1, far region of before): the closed-form expectations
// of the pattern tests use its symmetry (sum y = sum z = 0 at a station, a mid-depth web node).
inline HingeZoneModel ipe300(HingeSetup setup, double length, std::vector<double> stiffeners = {}) {
  HingeZoneSpec s;
  s.section = *find_section("IPE 300");
  s.setup = setup;
  s.length = length;
  s.flange_elements = 8;
  s.web_elements = 10;
  s.tension_coarsening = 1.0;
  s.far_element_length = 3.0;
  s.far_growth = 0.2;
  if (setup == HingeSetup::four_point) s.load_spacing = 0.4 * length;
  s.stiffener_positions = std::move(stiffeners);
  return build_hinge_zone(s);
}

inline std::vector<int> region_of_nodes(const ShellModel& m, const std::string& name) {
  int r = -1;
  for (std::size_t i = 0; i < m.region_names.size(); ++i)
    if (m.region_names[i] == name) r = static_cast<int>(i);
  std::vector<bool> in(m.nodes.size(), false);
  for (const auto& e : m.elements)
    if (e.region == r)
      for (int n : e.nodes) in[static_cast<std::size_t>(n)] = true;
  std::vector<int> out;
  for (std::size_t i = 0; i < in.size(); ++i)
    if (in[i]) out.push_back(static_cast<int>(i));
  return out;
}

// A field u(node) of translations from a function of the node's coordinates, on the given nodes
// (all nodes when empty); rotations zero.
inline Eigen::VectorXd field(const ShellModel& m, const std::function<Eigen::Vector3d(const Eigen::Vector3d&)>& f,
                             const std::vector<int>& nodes = {}) {
  Eigen::VectorXd u = Eigen::VectorXd::Zero(m.dof_count());
  auto set = [&](int n) { u.segment<3>(6 * n) = f(m.nodes[static_cast<std::size_t>(n)]); };
  if (nodes.empty())
    for (int n = 0; n < m.node_count(); ++n) set(n);
  else
    for (int n : nodes) set(n);
  return u;
}

// Small rigid section motion about (x, 0, 0): u = U(x) + theta(x) x (0, y, z).
inline Eigen::VectorXd rigid_field(const ShellModel& m, const std::function<Eigen::Matrix<double, 6, 1>(double x)>& q) {
  return field(m, [&](const Eigen::Vector3d& p) {
    const Eigen::Matrix<double, 6, 1> s = q(p.x());
    return Eigen::Vector3d(s.head<3>() + s.tail<3>().cross(Eigen::Vector3d(0.0, p.y(), p.z())));
  });
}

// Antisymmetric wave of the bottom flange: dz = A (2 y / b) sin(pi x / lambda) for x < 3 lambda.
inline Eigen::VectorXd bottom_flange_wave(const ShellModel& m, double A, double b, double lambda) {
  return field(
      m,
      [&](const Eigen::Vector3d& p) {
        const double w = p.x() < 3.0 * lambda ? std::sin(kPi * p.x() / lambda) : 0.0;
        return Eigen::Vector3d(0.0, 0.0, A * 2.0 * p.y() / b * w);
      },
      region_of_nodes(m, "bottom_flange"));
}

// Web bulge: dy = A sin(pi (z + zf) / (2 zf)) sin(pi x / hw) for x < 3 hw.
inline Eigen::VectorXd web_bulge(const ShellModel& m, double A, double zf) {
  const double hw = 2.0 * zf;
  return field(
      m,
      [&](const Eigen::Vector3d& p) {
        const double w = p.x() < 3.0 * hw ? std::sin(kPi * p.x() / hw) : 0.0;
        return Eigen::Vector3d(0.0, A * std::sin(kPi * (p.z() + zf) / hw) * w, 0.0);
      },
      region_of_nodes(m, "web"));
}

}  // namespace rotcap::patterns_test
