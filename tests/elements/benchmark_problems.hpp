#pragma once
// Linear benchmark problems shared by the element tests (cantilever, twisted beam, drilling
// sensitivity), solved with DenseShellHarness. Problem data of MacNeal & Harder (1985), "A
// proposed standard set of problems to test finite element accuracy", FEAD 1, 3-20, FROM MEMORY
// (widely quoted; docs/spec/references.md sec. 1).

#include "dense_shell_harness.hpp"
#include "materials/elastic_shell_section.hpp"

#include <cmath>
#include <numbers>
#include <utility>
#include <vector>

namespace rotcap::testing {

/// Cantilever strip along x, nx x 1 elements: node i at the bottom edge y = 0, node nx + 1 + i at
/// the top edge y = depth; interior edge i is slanted by offset(i): top node at x_i + offset(i),
/// bottom node at x_i - offset(i). Root (i = 0) and tip (i = nx) edges are straight.
template <class Offset>
DenseShellMesh strip_mesh(int nx, double length, double depth, Offset offset) {
  return structured_mesh(nx, 1, [&](int i, int j) {
    const double x = length * i / nx + (i == 0 || i == nx ? 0.0 : (j == 1 ? 1.0 : -1.0) * offset(i));
    return Eigen::Vector3d(x, depth * j, 0.0);
  });
}

/// All six DOFs of the strip's two root nodes fixed.
inline std::vector<bool> clamp_strip_root(const DenseShellHarness& h, int nx) {
  std::vector<bool> fixed(h.dofs(), false);
  for (const int n : {0, nx + 1})
    for (int k = 0; k < 6; ++k) fixed[6 * n + k] = true;
  return fixed;
}

/// MacNeal & Harder straight cantilever: L = 6, width 0.2, thickness 0.1, E = 1e7, nu = 0.3,
/// 6x1 mesh, root clamped, unit tip loads shared between the two tip nodes.
struct CantileverResults {
  double extension;   ///< mean tip u under P = 1 along x
  double inplane;     ///< mean tip v under P = 1 along y
  double outofplane;  ///< mean tip w under P = 1 along z
  double twist;       ///< (w_top - w_bottom) / width under T = 1 about x (forces -+5 in z)
};

inline CantileverResults solve_macneal_cantilever(const DenseShellMesh& mesh, const ShellQ4::Options& options = {}) {
  constexpr int nx = 6;
  constexpr double width = 0.2;
  const ElasticShellSection section(1.0e7, 0.3, 0.1);
  const DenseShellHarness h(mesh, section, options);
  const std::vector<bool> fixed = clamp_strip_root(h, nx);
  const Eigen::VectorXd zero = Eigen::VectorXd::Zero(h.dofs());
  const int bottom = nx, top = 2 * nx + 1;
  const auto tip_mean = [&](const Eigen::VectorXd& u, int k) { return 0.5 * (u(6 * bottom + k) + u(6 * top + k)); };
  CantileverResults r{};
  Eigen::VectorXd load = zero;
  load(6 * bottom) = load(6 * top) = 0.5;
  r.extension = tip_mean(h.solve(fixed, zero, load), 0);
  load = zero;
  load(6 * bottom + 1) = load(6 * top + 1) = 0.5;
  r.inplane = tip_mean(h.solve(fixed, zero, load), 1);
  load = zero;
  load(6 * bottom + 2) = load(6 * top + 2) = 0.5;
  r.outofplane = tip_mean(h.solve(fixed, zero, load), 2);
  load = zero;
  load(6 * bottom + 2) = -1.0 / width;
  load(6 * top + 2) = 1.0 / width;
  const Eigen::VectorXd ut = h.solve(fixed, zero, load);
  r.twist = (ut(6 * top + 2) - ut(6 * bottom + 2)) / width;
  return r;
}

/// MacNeal & Harder twisted beam: L = 12, width 1.1, thickness 0.32, 90 degrees of twist from
/// root to tip, E = 29e6, nu = 0.22, 12x2 mesh; node (i, j) at x = i, across-width coordinate
/// s = 1.1 (j/2 - 1/2), position (x, s cos phi, s sin phi), phi = 90 deg x / L.
constexpr int kTwistedNx = 12, kTwistedNy = 2;
constexpr double kTwistedLength = 12.0, kTwistedWidth = 1.1, kTwistedThickness = 0.32;
constexpr double kTwistedE = 29.0e6, kTwistedNu = 0.22;

inline DenseShellMesh twisted_beam_mesh() {
  return structured_mesh(kTwistedNx, kTwistedNy, [](int i, int j) {
    const double x = kTwistedLength * i / kTwistedNx;
    const double s = kTwistedWidth * (static_cast<double>(j) / kTwistedNy - 0.5);
    const double phi = 0.5 * std::numbers::pi * x / kTwistedLength;
    return Eigen::Vector3d(x, s * std::cos(phi), s * std::sin(phi));
  });
}

/// Tip deflection along the unit load direction dir (global) of the clamped twisted beam, the
/// unit load shared over the three tip nodes by tributary width (1/4, 1/2, 1/4). Returns the
/// deflection of the tip centre node and the mean over the three tip nodes.
inline std::pair<double, double> twisted_beam_tip(const Eigen::Vector3d& dir, const ShellQ4::Options& options = {}) {
  const ElasticShellSection section(kTwistedE, kTwistedNu, kTwistedThickness);
  const DenseShellHarness h(twisted_beam_mesh(), section, options);
  std::vector<bool> fixed(h.dofs(), false);
  for (int j = 0; j <= kTwistedNy; ++j)
    for (int k = 0; k < 6; ++k) fixed[6 * (j * (kTwistedNx + 1)) + k] = true;
  Eigen::VectorXd load = Eigen::VectorXd::Zero(h.dofs());
  const int tip[3] = {kTwistedNx, 2 * kTwistedNx + 1, 3 * kTwistedNx + 2};
  const double share[3] = {0.25, 0.5, 0.25};
  for (int a = 0; a < 3; ++a) load.segment<3>(6 * tip[a]) = share[a] * dir;
  const Eigen::VectorXd u = h.solve(fixed, Eigen::VectorXd::Zero(h.dofs()), load);
  double mean = 0.0;
  for (int a = 0; a < 3; ++a) mean += u.segment<3>(6 * tip[a]).dot(dir) / 3.0;
  return {u.segment<3>(6 * tip[1]).dot(dir), mean};
}

}  // namespace rotcap::testing
