// Patch tests on the distorted five-element patch of MacNeal & Harder (1985), "A proposed standard
// set of problems to test finite element accuracy", Finite Elem. Anal. Des. 1, 3-20 (patch
// geometry, load fields and exact values FROM MEMORY, widely quoted; docs/spec/references.md sec. 1),
// and the invariance of the linear element under a rigid rotation of the whole patch.
#include "dense_shell_harness.hpp"
#include "materials/elastic_shell_section.hpp"
#include "tests/test_support.hpp"

#include <Eigen/Eigenvalues>
#include <Eigen/Geometry>
#include <functional>
#include <iostream>
#include <limits>

namespace rotcap {
namespace {

using testing::DenseShellHarness;
using testing::DenseShellMesh;

// 0.24 x 0.12 rectangle, interior nodes (0.04,0.02), (0.18,0.03), (0.16,0.08), (0.08,0.08);
// t = 0.001, E = 1e6, nu = 0.25 (MacNeal & Harder 1985, from memory).
constexpr double kE = 1.0e6, kNu = 0.25, kT = 0.001;
constexpr int kBoundaryNodes = 4;

DenseShellMesh patch_mesh() {
  DenseShellMesh m;
  m.nodes = {{0.0, 0.0, 0.0},  {0.24, 0.0, 0.0},  {0.24, 0.12, 0.0}, {0.0, 0.12, 0.0},
             {0.04, 0.02, 0.0}, {0.18, 0.03, 0.0}, {0.16, 0.08, 0.0}, {0.08, 0.08, 0.0}};
  m.elements = {{4, 5, 6, 7}, {0, 1, 5, 4}, {1, 2, 6, 5}, {2, 3, 7, 6}, {3, 0, 4, 7}};
  return m;
}

// Exact fields (local plate axes), per node: [u, v, w, rx, ry, rz].
using Field = std::function<Eigen::Matrix<double, 6, 1>(const Eigen::Vector3d&)>;

// Membrane: u = 1e-3 (x + y/2), v = 1e-3 (y + x/2); rotation omega = 1/2 (v_x - u_y) = 0.
Eigen::Matrix<double, 6, 1> membrane_field(const Eigen::Vector3d& p) {
  Eigen::Matrix<double, 6, 1> u = Eigen::Matrix<double, 6, 1>::Zero();
  u(0) = 1e-3 * (p.x() + 0.5 * p.y());
  u(1) = 1e-3 * (p.y() + 0.5 * p.x());
  return u;
}

// Bending: w = 1e-3 (x^2 + xy + y^2)/2, rx = w_y, ry = -w_x (zero transverse shear with
// g_xz = w_x + ry, g_yz = w_y - rx).
Eigen::Matrix<double, 6, 1> bending_field(const Eigen::Vector3d& p) {
  Eigen::Matrix<double, 6, 1> u = Eigen::Matrix<double, 6, 1>::Zero();
  const double x = p.x(), y = p.y();
  u(2) = 0.5e-3 * (x * x + x * y + y * y);
  u(3) = 1e-3 * (0.5 * x + y);
  u(4) = -1e-3 * (x + 0.5 * y);
  return u;
}

// Solves the patch with the boundary nodes prescribed from field (rotated by q into global axes),
// all interior DOFs free and no loads; returns the global solution.
Eigen::VectorXd solve_patch(const DenseShellHarness& h, const Field& field, const Eigen::Matrix3d& q,
                            const std::vector<Eigen::Vector3d>& plate_coordinates) {
  std::vector<bool> fixed(h.dofs(), false);
  Eigen::VectorXd prescribed = Eigen::VectorXd::Zero(h.dofs());
  for (int n = 0; n < kBoundaryNodes; ++n) {
    const Eigen::Matrix<double, 6, 1> u = field(plate_coordinates[n]);
    prescribed.segment<3>(6 * n) = q * u.head<3>();
    prescribed.segment<3>(6 * n + 3) = q * u.tail<3>();
    for (int k = 0; k < 6; ++k) fixed[6 * n + k] = true;
  }
  return h.solve(fixed, prescribed, Eigen::VectorXd::Zero(h.dofs()));
}

// Largest error of the interior nodal DOFs against the exact field, relative to the field's size.
double interior_error(const Eigen::VectorXd& u, const Field& field, const DenseShellMesh& m) {
  double err = 0.0, size = 0.0;
  for (int n = 0; n < static_cast<int>(m.nodes.size()); ++n) {
    const Eigen::Matrix<double, 6, 1> exact = field(m.nodes[n]);
    size = std::max(size, exact.cwiseAbs().maxCoeff());
    if (n >= kBoundaryNodes) err = std::max(err, (u.segment<6>(6 * n) - exact).cwiseAbs().maxCoeff());
  }
  return err / size;
}

TEST(PatchTest, MembraneConstantStressIsExactOnDistortedPatch) {
  const ElasticShellSection section(kE, kNu, kT);
  const DenseShellHarness h(patch_mesh(), section);
  const Eigen::VectorXd u = solve_patch(h, membrane_field, Eigen::Matrix3d::Identity(), h.mesh().nodes);
  // Exact: sigma_x = sigma_y = E/(1-nu^2) (1 + nu) 1e-3 = 1333.33, tau_xy = G 1e-3 = 400
  // (MacNeal & Harder 1985: 1333 and 400, from memory).
  const double sx = kE / (1.0 - kNu * kNu) * (1.0 + kNu) * 1e-3, txy = kE / (2.0 * (1.0 + kNu)) * 1e-3;
  double worst = 0.0;
  for (int e = 0; e < h.element_count(); ++e) {
    // Element axes follow ShellFrame (x along the diagonals' bisector): rotate the exact stress.
    const Eigen::Matrix2d r = h.frame(e).rotation.topLeftCorner<2, 2>();
    Eigen::Matrix2d s;
    s << sx, txy, txy, sx;
    const Eigen::Matrix2d sl = r.transpose() * s * r;
    const ShellQ4Resultants out = h.resultants(e, u);
    for (int gp = 0; gp < 4; ++gp) {
      const Eigen::Vector3d n = out.r[gp].head<3>() / kT;
      const Eigen::Vector3d exact(sl(0, 0), sl(1, 1), sl(0, 1));
      worst = std::max(worst, (n - exact).cwiseAbs().maxCoeff() / sx);
      EXPECT_LT(out.r[gp].tail<3>().norm(), 1e-12 * sx * kT * kT);
    }
  }
  const double node_err = interior_error(u, membrane_field, h.mesh());
  std::cout << "membrane patch: exact sigma_x = sigma_y = " << sx << ", tau_xy = " << txy
            << "; max stress error / sigma_x = " << worst << ", interior nodal error = " << node_err << "\n";
  EXPECT_LT(worst, 1e-8);
  EXPECT_LT(node_err, 1e-8);
}

TEST(PatchTest, BendingConstantMomentIsExactOnDistortedPatch) {
  const ElasticShellSection section(kE, kNu, kT);
  const DenseShellHarness h(patch_mesh(), section);
  const Eigen::VectorXd u = solve_patch(h, bending_field, Eigen::Matrix3d::Identity(), h.mesh().nodes);
  // Curvatures k_xx = -w_xx = -1e-3, k_yy = -1e-3, k_xy = -2 w_xy = -1e-3 (sign convention of
  // shell_section.hpp), so M_x = M_y = -D (1 + nu) 1e-3 = -1.111e-7, M_xy = -D (1 - nu)/2 1e-3 =
  // -0.333e-7 (MacNeal & Harder 1985 quote the magnitudes 1.111e-7 and 0.333e-7, from memory).
  const double dplate = kE * kT * kT * kT / (12.0 * (1.0 - kNu * kNu));
  const double mx = -dplate * (1.0 + kNu) * 1e-3, mxy = -dplate * 0.5 * (1.0 - kNu) * 1e-3;
  double worst = 0.0, worst_q = 0.0;
  for (int e = 0; e < h.element_count(); ++e) {
    const Eigen::Matrix2d r = h.frame(e).rotation.topLeftCorner<2, 2>();
    Eigen::Matrix2d m;
    m << mx, mxy, mxy, mx;
    const Eigen::Matrix2d ml = r.transpose() * m * r;
    const ShellQ4Resultants out = h.resultants(e, u);
    for (int gp = 0; gp < 4; ++gp) {
      const Eigen::Vector3d exact(ml(0, 0), ml(1, 1), ml(0, 1));
      worst = std::max(worst, (out.r[gp].tail<3>() - exact).cwiseAbs().maxCoeff() / std::abs(mx));
      worst_q = std::max(worst_q, out.q[gp].norm());
      EXPECT_LT(out.r[gp].head<3>().norm(), 1e-12 * std::abs(mx) / kT);
    }
  }
  const double node_err = interior_error(u, bending_field, h.mesh());
  std::cout << "bending patch: exact M_x = M_y = " << mx << ", M_xy = " << mxy
            << " (surface stress " << 6.0 * mx / (kT * kT) << "); max moment error / |M_x| = " << worst
            << ", max |Q| = " << worst_q << ", interior nodal error = " << node_err << "\n";
  EXPECT_LT(worst, 1e-8);
  EXPECT_LT(node_err, 1e-8);
  // Q = 0 exactly; |Q| is compared with the shear force scale |M_x| / (patch size 0.1).
  EXPECT_LT(worst_q, 1e-8 * std::abs(mx) / 0.1);
}

// Invariance: the same patch and fields, turned by a rigid rotation q in space. In global axes the
// membrane and bending DOFs mix, so the solution's round-off is set by the condition number of
// the interior stiffness, kappa ~ 12 (L/t)^2 x (mesh factor): with a backward-stable LDL^T the
// relative error is bounded by ~ kappa * eps (Higham, Accuracy and Stability of Numerical
// Algorithms, 2002, ch. 7 and 11). The test uses t = 0.01 (kappa ~ 1e6) and checks the bound
// 100 kappa eps, with kappa computed from the eigenvalues.
TEST(PatchTest, RigidRotationOfWholePatchGivesSameLocalResults) {
  const ElasticShellSection section(kE, kNu, 0.01);
  const Field both = [](const Eigen::Vector3d& p) -> Eigen::Matrix<double, 6, 1> {
    return membrane_field(p) + bending_field(p);
  };
  const DenseShellHarness flat(patch_mesh(), section);
  const Eigen::VectorXd u0 = solve_patch(flat, both, Eigen::Matrix3d::Identity(), flat.mesh().nodes);

  // A fixed, arbitrary rotation (axis not along any coordinate axis) and translation.
  const Eigen::Matrix3d q =
      Eigen::AngleAxisd(1.234, Eigen::Vector3d(0.3, -0.8, 0.52).normalized()).toRotationMatrix();
  DenseShellMesh rotated = patch_mesh();
  for (auto& p : rotated.nodes) p = q * p + Eigen::Vector3d(5.0, -3.0, 2.0);
  const DenseShellHarness turned(rotated, section);
  const Eigen::VectorXd u1 = solve_patch(turned, both, q, flat.mesh().nodes);

  double worst_r = 0.0, worst_u = 0.0, scale_n = 0.0, scale_m = 0.0;
  for (int e = 0; e < flat.element_count(); ++e) {
    const ShellQ4Resultants a = flat.resultants(e, u0);
    for (int gp = 0; gp < 4; ++gp) {
      scale_n = std::max(scale_n, a.r[gp].head<3>().cwiseAbs().maxCoeff());
      scale_m = std::max(scale_m, a.r[gp].tail<3>().cwiseAbs().maxCoeff());
    }
  }
  for (int e = 0; e < flat.element_count(); ++e) {
    const ShellQ4Resultants a = flat.resultants(e, u0), b = turned.resultants(e, u1);
    for (int gp = 0; gp < 4; ++gp) {
      worst_r = std::max(worst_r, (a.r[gp].head<3>() - b.r[gp].head<3>()).cwiseAbs().maxCoeff() / scale_n);
      worst_r = std::max(worst_r, (a.r[gp].tail<3>() - b.r[gp].tail<3>()).cwiseAbs().maxCoeff() / scale_m);
    }
  }
  for (int n = 0; n < static_cast<int>(flat.mesh().nodes.size()); ++n) {
    worst_u = std::max(worst_u, (q * u0.segment<3>(6 * n) - u1.segment<3>(6 * n)).norm() / u0.cwiseAbs().maxCoeff());
    worst_u = std::max(worst_u, (q * u0.segment<3>(6 * n + 3) - u1.segment<3>(6 * n + 3)).norm() / u0.cwiseAbs().maxCoeff());
  }
  // Condition number of the interior (free) stiffness in the turned frame.
  const Eigen::MatrixXd k = turned.stiffness();
  const int nf = k.rows() - 6 * kBoundaryNodes;
  const Eigen::MatrixXd kff = k.bottomRightCorner(nf, nf);
  const Eigen::VectorXd lambda = Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd>(kff).eigenvalues();
  const double kappa = lambda.maxCoeff() / lambda.minCoeff();
  const double bound = 100.0 * kappa * std::numeric_limits<double>::epsilon();
  std::cout << "rotated patch: max resultant difference (relative) = " << worst_r
            << ", max nodal difference (relative) = " << worst_u << "; kappa(K_ff) = " << kappa
            << ", bound 100 kappa eps = " << bound << "\n";
  EXPECT_LT(worst_r, bound);
  EXPECT_LT(worst_u, bound);
}

}  // namespace
}  // namespace rotcap
