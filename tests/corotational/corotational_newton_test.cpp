// Newton's method on a small corotational shell model, dense assembly (depends only on the
// corotational layer and ShellQ4):
//  - the consistent tangent converges quadratically and the roll-up matches the closed form;
//  - with forces only, the symmetric part of the tangent (what sparse Cholesky / LDL^T factorise)
//    also converges quadratically: the skew part, -skew(m_int) per node, vanishes at equilibrium;
//  - with applied nodal moments about free rotations the skew part tends to -skew(M_ext) instead,
//    and the symmetrised tangent converges only linearly (documented and measured here).
//
// Problem: cantilever strip rolled up by an end moment. Setup of Sze, Liu & Lo (2004), FEAD
// 40:1551-1569, problem "cantilever subjected to end moment" (from memory, not read in the paper):
// L = 12, b = 1, t = 0.1, E = 1.2e6, nu = 0, clamped at x = 0, moment M about the width axis at the
// free end. Reference (DERIVED, pure-bending circle of radius EI/M): tip rotation theta = M L / EI,
// tip displacements U = L (sin(theta)/theta - 1), W = L (1 - cos(theta))/theta.

#include "elements/corotational/corotational_shell_q4.hpp"
#include "elements/corotational/rotation.hpp"
#include "materials/elastic_shell_section.hpp"
#include "tests/test_support.hpp"

#include <Eigen/Dense>
#include <cmath>
#include <cstdio>
#include <numbers>
#include <vector>

namespace rotcap {
namespace {

struct Strip {
  static constexpr int kElements = 12;
  static constexpr int kNodes = 2 * (kElements + 1);
  static constexpr double kLength = 12.0, kWidth = 1.0;
  ElasticShellSection section{1.2e6, 0.0, 0.1};
  std::vector<CorotationalShellQ4> elements;
  std::vector<std::array<int, 4>> connectivity;
  std::vector<Eigen::Vector3d> X, x;
  std::vector<Eigen::Matrix3d> R;

  Strip() {
    for (int i = 0; i <= kElements; ++i)
      for (int j = 0; j < 2; ++j)
        X.emplace_back(kLength * i / kElements, kWidth * j, 0.0);  // node 2 i + j
    for (int i = 0; i < kElements; ++i) {
      const std::array<int, 4> n{2 * i, 2 * i + 2, 2 * i + 3, 2 * i + 1};
      NodalCoordinates c;
      for (int k = 0; k < 4; ++k) c.col(k) = X[n[k]];
      elements.emplace_back(c);
      connectivity.push_back(n);
    }
    x = X;
    R.assign(kNodes, Eigen::Matrix3d::Identity());
  }
  static bool fixed(int dof) { return dof < 12; }  // nodes 0 and 1 (x = 0) clamped

  // Internal force and tangent, all 6 * kNodes DOFs.
  void assemble(Eigen::VectorXd& f, Eigen::MatrixXd& K) const {
    f.setZero(6 * kNodes);
    K.setZero(6 * kNodes, 6 * kNodes);
    for (std::size_t e = 0; e < elements.size(); ++e) {
      NodalCoordinates c;
      NodalRotations r;
      for (int k = 0; k < 4; ++k) {
        c.col(k) = x[connectivity[e][k]];
        r[k] = R[connectivity[e][k]];
      }
      Vec24 fe;
      Mat24 Ke;
      EXPECT_EQ(elements[e].compute(c, r, section, {}, {}, fe, &Ke), ElementStatus::Ok);
      for (int a = 0; a < 4; ++a) {
        f.segment<6>(6 * connectivity[e][a]) += fe.segment<6>(6 * a);
        for (int b = 0; b < 4; ++b)
          K.block<6, 6>(6 * connectivity[e][a], 6 * connectivity[e][b]) += Ke.block<6, 6>(6 * a, 6 * b);
      }
    }
  }
  // Additive translations, multiplicative rotations R <- exp(dw) R.
  void update(const Eigen::VectorXd& du) {
    for (int n = 0; n < kNodes; ++n) {
      x[n] += du.segment<3>(6 * n);
      R[n] = rotation_exp(du.segment<3>(6 * n + 3)) * R[n];
    }
  }
};

// Relative residual reachable in double precision: the membrane stiffness E t = 1.2e5 times
// coordinates ~10 against loads ~10 leaves ~1e-10 of rounding in the residual.
constexpr double kRoundingFloor = 1e-9;

// Newton history of one load level: relative residual |r| / |F| before each iteration and the
// energy norm |du . r| of each correction. The energy norm is the convergence measure: the residual
// itself mixes stiff membrane and soft bending errors and need not decrease monotonically.
struct History {
  std::vector<double> residual, energy;
  bool converged = false;
};

History newton(Strip& strip, const Eigen::VectorXd& load, bool symmetrise) {
  History h;
  const int n = 6 * Strip::kNodes - 12;
  for (int it = 0; it < 40; ++it) {
    Eigen::VectorXd f;
    Eigen::MatrixXd K;
    strip.assemble(f, K);
    const Eigen::VectorXd r = (load - f).tail(n);
    h.residual.push_back(r.norm() / load.norm());
    if (h.residual.back() < kRoundingFloor) {
      h.converged = true;
      break;
    }
    Eigen::MatrixXd Kf = K.bottomRightCorner(n, n);
    if (symmetrise) Kf = (0.5 * (Kf + Kf.transpose())).eval();
    Eigen::VectorXd du = Eigen::VectorXd::Zero(6 * Strip::kNodes);
    du.tail(n) = Kf.partialPivLu().solve(r);
    h.energy.push_back(std::abs(du.tail(n).dot(r)));
    strip.update(du);
  }
  return h;
}

void print(const char* label, const History& h) {
  for (std::size_t k = 0; k < h.energy.size(); ++k)
    std::printf("  %s iteration %zu: |r|/|F| = %.3e, |du.r| = %.3e\n", label, k, h.residual[k],
                h.energy[k]);
}

// Quadratic convergence, as an iteration count: once the energy norm of the correction has fallen
// below 1e-4 of the first one, a quadratically convergent iteration needs at most 3 more
// corrections to reach the rounding floor (1e-4 -> 1e-8 -> 1e-16 -> floor), a linear one with rate
// 0.2 needs about 15.
int corrections_after_1e4(const History& h) {
  for (std::size_t k = 0; k < h.energy.size(); ++k)
    if (h.energy[k] < 1e-4 * h.energy[0]) return static_cast<int>(h.energy.size() - 1 - k);
  return 0;
}

// Loads at the free end, shared equally by its two nodes: moment about -y (curls the strip
// towards +z), torque about x, forces along y and z.
Eigen::VectorXd end_load(double moment_y, double torque_x, double force_y, double force_z) {
  Eigen::VectorXd load = Eigen::VectorXd::Zero(6 * Strip::kNodes);
  for (int node : {Strip::kNodes - 2, Strip::kNodes - 1}) {
    load(6 * node + 1) = 0.5 * force_y;
    load(6 * node + 2) = 0.5 * force_z;
    load(6 * node + 3) = 0.5 * torque_x;
    load(6 * node + 4) = -0.5 * moment_y;
  }
  return load;
}

// max |K - K^T| over the free DOFs relative to max |K| there, at the current state.
double free_skew(const Strip& strip) {
  Eigen::VectorXd f;
  Eigen::MatrixXd K;
  strip.assemble(f, K);
  const int n = 6 * Strip::kNodes - 12;
  const Eigen::MatrixXd Kf = K.bottomRightCorner(n, n);
  return (Kf - Kf.transpose()).cwiseAbs().maxCoeff() / Kf.cwiseAbs().maxCoeff();
}

constexpr double kEI = 1.2e6 * 1.0 * 0.1 * 0.1 * 0.1 / 12.0;  // E b t^3 / 12 = 100

TEST(CorotationalNewton, ConsistentTangentConvergesQuadraticallyToTheRolledUpStrip) {
  Strip strip;
  const double theta = 0.5 * std::numbers::pi;  // quarter circle
  const double M = theta * kEI / Strip::kLength;
  History last;
  for (int step = 1; step <= 4; ++step) {
    last = newton(strip, end_load(0.25 * step * M, 0.0, 0.0, 0.0), false);
    ASSERT_TRUE(last.converged) << "step " << step;
    EXPECT_LE(corrections_after_1e4(last), 3) << "step " << step;
  }
  print("roll-up, step 4,", last);
  // Tip (mid-width of the free end) against the pure-bending circle.
  const Eigen::Vector3d tip = 0.5 * (strip.x[Strip::kNodes - 2] + strip.x[Strip::kNodes - 1]);
  const double U = Strip::kLength * (std::sin(theta) / theta - 1.0);  // -4.3606 (DERIVED)
  const double W = Strip::kLength * (1.0 - std::cos(theta)) / theta;  //  7.6394 (DERIVED)
  std::printf("  tip U = %.5f (closed form %.5f), W = %.5f (closed form %.5f)\n",
              tip.x() - Strip::kLength, U, tip.z(), W);
  // 12 flat elements on a quarter circle: each chord of 0.13 rad keeps the arc length, an error of
  // order (0.13)^2 / 24 ~ 7e-4 relative in the tip position; tolerance 2e-3 of L.
  EXPECT_CLOSE(tip.x() - Strip::kLength, U, 0.0, 2e-3 * Strip::kLength);
  EXPECT_CLOSE(tip.z(), W, 0.0, 2e-3 * Strip::kLength);
  const Eigen::Vector3d tip_rotation = rotation_log(strip.R[Strip::kNodes - 1]);
  EXPECT_CLOSE(-tip_rotation.y(), theta, 1e-3, 0.0);
}

TEST(CorotationalNewton, TipForceDeflectionMatchesTheElastica) {
  // Cantilever under a transverse tip force, Sze, Liu & Lo (2004) problem 2.1 in dimensionless form
  // (setup from memory): alpha = P L^2 / EI. Reference: inextensible elastica, DERIVED in
  // docs/spec/references.md section 2.1 (shooting + RK4) for L = 10: at alpha = 2, W = 4.935,
  // -U = 1.606, tip rotation 0.7817; at alpha = 4, W = 6.700, -U = 3.289, rotation 1.1212.
  Strip strip;
  struct Reference { double alpha, w, u, rotation; };
  const Reference references[] = {{2.0, 0.4935, 0.1606, 0.7817}, {4.0, 0.6700, 0.3289, 1.1212}};
  const double L = Strip::kLength;
  double alpha = 0.0;
  for (const Reference& ref : references) {
    while (alpha < ref.alpha - 1e-12) {
      alpha += 0.5;
      ASSERT_TRUE(newton(strip, end_load(0.0, 0.0, 0.0, alpha * kEI / (L * L)), false).converged)
          << "alpha " << alpha;
    }
    const Eigen::Vector3d tip = 0.5 * (strip.x[Strip::kNodes - 2] + strip.x[Strip::kNodes - 1]);
    const double rotation = -rotation_log(strip.R[Strip::kNodes - 1]).y();
    std::printf("  alpha %.1f: W/L = %.4f (elastica %.4f), -U/L = %.4f (%.4f), rotation %.4f (%.4f)\n",
                ref.alpha, tip.z() / L, ref.w, (L - tip.x()) / L, ref.u, rotation, ref.rotation);
    // 12 elements: the O(h^2) discretisation error of a flat-facet model with h = L/12 is
    // ~(1/12)^2 / 12 ~ 6e-4 of L for smooth curvature; the references have 4 digits (5e-5 L).
    // Tolerance 2e-3 L for the displacements, 2e-3 relative for the rotation.
    EXPECT_CLOSE(tip.z() / L, ref.w, 0.0, 2e-3);
    EXPECT_CLOSE((L - tip.x()) / L, ref.u, 0.0, 2e-3);
    EXPECT_CLOSE(rotation, ref.rotation, 2e-3, 0.0);
  }
}

TEST(CorotationalNewton, SymmetrisedTangentConvergesQuadraticallyUnderForces) {
  // Tip forces out of plane (z) and sideways (y): a spatial large-deflection state, no applied
  // moments. At equilibrium every free node's internal moment is zero, so the skew part of the
  // assembled tangent vanishes and its symmetric part is the exact Jacobian there.
  Strip full, symmetric;
  History hf, hs;
  for (int step = 1; step <= 4; ++step) {
    // Up to P L^2 / EI = 2 (tip deflection ~0.6 L), with a sideways force 0.3 of it.
    const double P = 0.5 * step * kEI / (Strip::kLength * Strip::kLength);
    const Eigen::VectorXd load = end_load(0.0, 0.0, 0.3 * P, P);
    hf = newton(full, load, false);
    hs = newton(symmetric, load, true);
    ASSERT_TRUE(hf.converged && hs.converged) << "step " << step;
    EXPECT_LE(corrections_after_1e4(hf), 3) << "step " << step;
    EXPECT_LE(corrections_after_1e4(hs), 3) << "step " << step;
  }
  print("forces, full tangent, step 4,", hf);
  print("forces, symmetrised, step 4,", hs);
  const double skew = free_skew(full);
  std::printf("  at equilibrium: max |K - K^T| / max |K| (free DOFs) = %.3e\n", skew);
  EXPECT_LT(skew, 1e-12);
  const Eigen::Vector3d tip = 0.5 * (full.x[Strip::kNodes - 2] + full.x[Strip::kNodes - 1]);
  EXPECT_GT(tip.z(), 0.4 * Strip::kLength);  // a genuinely large deflection
  for (int n = 0; n < Strip::kNodes; ++n) EXPECT_LT((full.x[n] - symmetric.x[n]).norm(), 1e-8);
}

TEST(CorotationalNewton, SymmetrisedTangentConvergesLinearlyUnderAppliedMoments) {
  // End moment and torque about free rotations: at equilibrium the skew part of the tangent is
  // -skew(M_ext) at the loaded nodes, so the symmetrised Newton iteration is a fixed-point iteration
  // with a constant contraction. It reaches the same state as the full tangent but needs more
  // iterations; the full tangent stays quadratic.
  Strip full, symmetric;
  const double M = 0.5 * std::numbers::pi * kEI / Strip::kLength;
  History hf, hs;
  int iterations_full = 0, iterations_symmetric = 0;
  for (int step = 1; step <= 4; ++step) {
    const Eigen::VectorXd load = end_load(0.25 * step * M, 0.1 * step * M, 0.0, 0.02 * step * M);
    hf = newton(full, load, false);
    hs = newton(symmetric, load, true);
    ASSERT_TRUE(hf.converged && hs.converged) << "step " << step;
    EXPECT_LE(corrections_after_1e4(hf), 3) << "step " << step;
    iterations_full += static_cast<int>(hf.energy.size());
    iterations_symmetric += static_cast<int>(hs.energy.size());
  }
  print("moments, full tangent, step 4,", hf);
  print("moments, symmetrised, step 4,", hs);
  const double skew = free_skew(full);
  std::printf("  iterations over 4 steps: full %d, symmetrised %d; at equilibrium "
              "max |K - K^T| / max |K| = %.3e\n",
              iterations_full, iterations_symmetric, skew);
  EXPECT_GT(skew, 1e-6);  // -skew(M_ext) at the loaded nodes
  EXPECT_GT(corrections_after_1e4(hs), 3);  // linear, not quadratic
  for (int n = 0; n < Strip::kNodes; ++n) EXPECT_LT((full.x[n] - symmetric.x[n]).norm(), 1e-8);
}

}  // namespace
}  // namespace rotcap
