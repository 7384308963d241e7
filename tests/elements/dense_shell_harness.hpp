#pragma once
// DenseShellHarness: a tiny dense assembly of linear ShellQ4 elements, for element verification
// tests only (a few hundred DOFs). Each element's local frame comes from ShellFrame::of on its
// global node coordinates; element DOFs are rotated with the 24x24 block matrix T = diag(R^T),
// d_local = T d_global, so K_global = T^T K_local T. Supports are prescribed DOF values; the
// remaining system is solved with a dense LDL^T (Eigen::LDLT), whose pivots also give the inertia.
// Global DOFs: node n owns 6n .. 6n+5 = [ux, uy, uz, rx, ry, rz] in global axes.

#include "elements/shell_q4.hpp"

#include <Eigen/Dense>
#include <array>
#include <stdexcept>
#include <utility>
#include <vector>

namespace rotcap::testing {

struct DenseShellMesh {
  std::vector<Eigen::Vector3d> nodes;
  std::vector<std::array<int, 4>> elements;  ///< counter-clockwise about the intended normal
};

class DenseShellHarness {
 public:
  DenseShellHarness(DenseShellMesh mesh, const ShellSection& section,
                    const ShellQ4::Options& options = {})
      : mesh_(std::move(mesh)), section_(&section) {
    for (const auto& e : mesh_.elements) {
      const Eigen::Matrix<double, 3, 4> xyz = coordinates(e);
      frames_.push_back(ShellFrame::of(xyz));
      elements_.emplace_back(frames_.back().to_local(xyz), options);
    }
  }

  int dofs() const { return 6 * static_cast<int>(mesh_.nodes.size()); }
  int element_count() const { return static_cast<int>(mesh_.elements.size()); }
  const ShellQ4& element(int e) const { return elements_[e]; }
  const ShellFrame& frame(int e) const { return frames_[e]; }
  const DenseShellMesh& mesh() const { return mesh_; }

  /// d_local = T d_global for element e.
  Mat24 rotation(int e) const {
    Mat24 t = Mat24::Zero();
    for (int b = 0; b < 8; ++b) t.block<3, 3>(3 * b, 3 * b) = frames_[e].rotation.transpose();
    return t;
  }

  Vec24 local_dofs(int e, const Eigen::VectorXd& u) const {
    Vec24 dg;
    for (int a = 0; a < 4; ++a) dg.segment<6>(6 * a) = u.segment<6>(6 * mesh_.elements[e][a]);
    return rotation(e) * dg;
  }

  /// Global dense stiffness at d = 0 (linear analysis).
  Eigen::MatrixXd stiffness() const {
    Eigen::MatrixXd k = Eigen::MatrixXd::Zero(dofs(), dofs());
    for (int e = 0; e < element_count(); ++e) {
      Vec24 f;
      Mat24 ke;
      const ElementStatus status = elements_[e].compute(Vec24::Zero(), *section_, {}, {}, f, &ke);
      if (status != ElementStatus::Ok) throw std::runtime_error("element compute failed");
      const Mat24 t = rotation(e);
      const Mat24 kg = t.transpose() * ke * t;
      for (int a = 0; a < 4; ++a)
        for (int b = 0; b < 4; ++b)
          k.block<6, 6>(6 * mesh_.elements[e][a], 6 * mesh_.elements[e][b]) += kg.block<6, 6>(6 * a, 6 * b);
    }
    return k;
  }

  /// Solves K u = load for the free DOFs with u = prescribed on the fixed DOFs; returns all of u.
  /// non_positive_pivots (optional) receives the number of D entries <= 0 of K_ff = L D L^T.
  Eigen::VectorXd solve(const std::vector<bool>& fixed, const Eigen::VectorXd& prescribed,
                        const Eigen::VectorXd& load, int* non_positive_pivots = nullptr) const {
    const Eigen::MatrixXd k = stiffness();
    std::vector<int> free;
    for (int i = 0; i < dofs(); ++i)
      if (!fixed[i]) free.push_back(i);
    const int nf = static_cast<int>(free.size());
    Eigen::MatrixXd kff(nf, nf);
    Eigen::VectorXd rhs(nf);
    Eigen::VectorXd u = Eigen::VectorXd::Zero(dofs());
    for (int i = 0; i < dofs(); ++i)
      if (fixed[i]) u(i) = prescribed(i);
    const Eigen::VectorXd ku = k * u;
    for (int a = 0; a < nf; ++a) {
      rhs(a) = load(free[a]) - ku(free[a]);
      for (int b = 0; b < nf; ++b) kff(a, b) = k(free[a], free[b]);
    }
    const Eigen::LDLT<Eigen::MatrixXd> ldlt(kff);
    if (ldlt.info() != Eigen::Success) throw std::runtime_error("LDLT failed");
    if (non_positive_pivots != nullptr) {
      const Eigen::VectorXd dvec = ldlt.vectorD();
      const double dmax = dvec.cwiseAbs().maxCoeff();
      *non_positive_pivots = 0;
      for (int a = 0; a < nf; ++a)
        if (!(dvec(a) > 1.0e-14 * dmax)) ++*non_positive_pivots;
    }
    const Eigen::VectorXd uf = ldlt.solve(rhs);
    for (int a = 0; a < nf; ++a) u(free[a]) = uf(a);
    return u;
  }

  ShellQ4Resultants resultants(int e, const Eigen::VectorXd& u) const {
    ShellQ4Resultants out;
    Vec24 f;
    if (elements_[e].compute(local_dofs(e, u), *section_, {}, {}, f, nullptr, &out) != ElementStatus::Ok)
      throw std::runtime_error("element compute failed");
    return out;
  }

 private:
  Eigen::Matrix<double, 3, 4> coordinates(const std::array<int, 4>& e) const {
    Eigen::Matrix<double, 3, 4> xyz;
    for (int a = 0; a < 4; ++a) xyz.col(a) = mesh_.nodes[e[a]];
    return xyz;
  }

  DenseShellMesh mesh_;
  const ShellSection* section_;
  std::vector<ShellFrame> frames_;
  std::vector<ShellQ4> elements_;
};

/// Structured mesh of a strip: (nx+1) x (ny+1) nodes, node(i, j) = j * (nx + 1) + i, placed by
/// position(i, j); elements counter-clockwise for a right-handed (i, j) parametrisation.
template <class Position>
DenseShellMesh structured_mesh(int nx, int ny, Position position) {
  DenseShellMesh mesh;
  for (int j = 0; j <= ny; ++j)
    for (int i = 0; i <= nx; ++i) mesh.nodes.push_back(position(i, j));
  for (int j = 0; j < ny; ++j)
    for (int i = 0; i < nx; ++i) {
      const int n0 = j * (nx + 1) + i;
      mesh.elements.push_back({n0, n0 + 1, n0 + nx + 2, n0 + nx + 1});
    }
  return mesh;
}

}  // namespace rotcap::testing
