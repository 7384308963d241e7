// Linear static analysis: cantilever plate strip against Euler-Bernoulli beam theory, reaction
// balance, the global transform (a tilted copy of the model), and K against a dense assembly of
// the same element matrices.
#include "solver/linear_static.hpp"

#include "tests/solver/assembly_fixture.hpp"
#include "tests/solver/plate_mesh.hpp"
#include "tests/test_support.hpp"

#include <Eigen/Geometry>
#include <cmath>
#include <cstdio>

namespace rotcap {
namespace {

using testing::rectangular_plate;
using testing::support;

// Narrow cantilever strip: L = 100 mm, b = 10 mm, t = 1 mm, E = 210 000 MPa, nu = 0 (so the
// plate strip is exactly a beam of EI = E b t^3 / 12, no anticlastic coupling), clamped at x = 0,
// total tip force P = -1 N (z) shared along the edge x = L by length.
constexpr double kL = 100.0, kB = 10.0, kT = 1.0, kE = 210000.0, kP = 1.0;

ShellModel cantilever_strip(int nx, int ny) {
  ShellModel m = rectangular_plate(kL, kB, nx, ny, kT);
  m.supports.push_back(support("x0", {"ux", "uy", "uz", "rx", "ry", "rz"}));
  GroupLoad load;
  load.group = "xa";
  load.force = Eigen::Vector3d(0.0, 0.0, -kP);
  m.loads.push_back(load);
  return m;
}

double mean_along(const ShellModel& m, const std::string& group, const Eigen::VectorXd& u, const Eigen::Vector3d& dir) {
  double s = 0.0;
  for (int v : m.groups.at(group).nodes) s += dir.dot(u.segment<3>(6 * v));
  return s / static_cast<double>(m.groups.at(group).nodes.size());
}

TEST(LinearStatic, CantileverStripTipDeflectionMatchesBeamTheory) {
  const ShellModel m = cantilever_strip(20, 2);
  const SectionAssignment sections = SectionAssignment::elastic(m, kE, 0.0);
  const LinearStaticResult r = solve_linear_static(m, sections);
  ASSERT_TRUE(r.ok()) << r.message;
  // Euler-Bernoulli beam theory, cantilever under a tip force: delta = P L^3 / (3 E I),
  // I = b t^3 / 12 (any strength-of-materials text, e.g. Gere & Timoshenko, Mechanics of
  // Materials; DERIVED in docs/spec/references.md sec. 1). Transverse shear adds P L / (k G A) = 6e-5 of
  // delta here, well inside the tolerance.
  const double I = kB * kT * kT * kT / 12.0;
  const double delta_ref = kP * kL * kL * kL / (3.0 * kE * I);
  const double delta = -mean_along(m, "xa", r.displacements, Eigen::Vector3d::UnitZ());
  std::printf("[ cantilever strip 20x2 ] delta = %.6f mm, PL^3/(3EI) = %.6f mm, error %.3f %%\n", delta, delta_ref,
              100.0 * (delta - delta_ref) / delta_ref);
  EXPECT_CLOSE(delta, delta_ref, 0.01, 0.0);
  // Tip slope (rotation about y): P L^2 / (2 E I), same beam theory.
  const double slope_ref = kP * kL * kL / (2.0 * kE * I);
  double slope = 0.0;
  for (int v : m.groups.at("xa").nodes) slope += r.displacements[6 * v + 4] / 3.0;
  std::printf("[ cantilever strip 20x2 ] tip slope = %.6f rad, PL^2/(2EI) = %.6f rad, error %.3f %%\n", slope,
              slope_ref, 100.0 * (slope - slope_ref) / slope_ref);
  EXPECT_CLOSE(slope, slope_ref, 0.01, 0.0);
}

TEST(LinearStatic, ReactionsBalanceAppliedLoadToRoundOff) {
  const ShellModel m = cantilever_strip(20, 2);
  const SectionAssignment sections = SectionAssignment::elastic(m, kE, 0.0);
  const LinearStaticResult r = solve_linear_static(m, sections);
  ASSERT_TRUE(r.ok()) << r.message;
  // The solve is backward stable: |K u - f| is a few machine epsilons (2.2e-16) of the terms that
  // cancel in K u - f (max (|K||u| + |f|), about 8e5 N here), not of |f| = 1 N.
  EXPECT_LT(r.backward_error, 10.0 * 2.2e-16);
  const double roundoff = r.residual / r.backward_error;  // = max (|K||u| + |f|) [N]
  // Summed over the model, reactions + applied loads = minus the summed free-DOF residuals (each
  // element's internal forces are self-equilibrated), so the resultant force and moment (about
  // the origin) vanish to that round-off: allow 100 eps of the cancelling-term size.
  Eigen::Vector3d force = Eigen::Vector3d::Zero(), moment = Eigen::Vector3d::Zero();
  for (int v = 0; v < m.node_count(); ++v) {
    const Eigen::Vector3d fv = r.reactions.segment<3>(6 * v) + r.applied.segment<3>(6 * v);
    force += fv;
    moment += m.nodes[v].cross(fv) + r.reactions.segment<3>(6 * v + 3) + r.applied.segment<3>(6 * v + 3);
  }
  std::printf("[ reactions ] backward error %.3g, |sum force| %.3g N, |sum moment| %.3g N mm, scale %.3g N\n",
              r.backward_error, force.norm(), moment.norm(), roundoff);
  EXPECT_LT(force.norm(), 100.0 * 2.2e-16 * roundoff);
  EXPECT_LT(moment.norm(), 100.0 * 2.2e-16 * roundoff * kL);
  // The clamped edge takes the whole force P (+z) and the moment -P L about y.
  double rz = 0.0, my = 0.0;
  for (int v : m.groups.at("x0").nodes) {
    rz += r.reactions[6 * v + 2];
    my += r.reactions[6 * v + 4] + (m.nodes[v].cross(r.reactions.segment<3>(6 * v)))[1];
  }
  EXPECT_CLOSE(rz, kP, 0.0, 100.0 * 2.2e-16 * roundoff);
  EXPECT_CLOSE(my, -kP * kL, 0.0, 100.0 * 2.2e-16 * roundoff * kL);
  // Reactions appear only at held DOFs.
  const DofMap dofs(m);
  for (int i = 0; i < m.dof_count(); ++i)
    if (!dofs.is_held(i)) {
      EXPECT_EQ(r.reactions[i], 0.0) << "reaction at free DOF " << i;
    }
  EXPECT_EQ(r.statistics.free_dofs, r.statistics.dofs - 18);
  EXPECT_GT(r.statistics.factor_nonzeros, 0.0);
  EXPECT_EQ(static_cast<int>(r.resultants.size()), m.element_count());
}

TEST(LinearStatic, TiltedModelGivesTheSameDeflectionAlongTheLoad) {
  // The same strip rotated rigidly in space (nodes and load): the deflection along the rotated
  // load direction and the support reactions' magnitude are unchanged. Checks frames and the
  // global <-> local transform against the axis-aligned run.
  const ShellModel flat = cantilever_strip(10, 2);
  ShellModel tilted = flat;
  const Eigen::Matrix3d Q =
      (Eigen::AngleAxisd(0.7, Eigen::Vector3d(1.0, 2.0, 3.0).normalized())).toRotationMatrix();
  for (auto& x : tilted.nodes) x = Q * x;
  tilted.loads[0].force = Q * flat.loads[0].force;
  const SectionAssignment s_flat = SectionAssignment::elastic(flat, kE, 0.0);
  const SectionAssignment s_tilted = SectionAssignment::elastic(tilted, kE, 0.0);
  const LinearStaticResult a = solve_linear_static(flat, s_flat);
  const LinearStaticResult b = solve_linear_static(tilted, s_tilted);
  ASSERT_TRUE(a.ok() && b.ok());
  // Both runs are backward stable, so they differ by the forward error, at most
  // cond(K) eps |u| = 5.7e7 * 2.2e-16 |u| = 1.3e-8 |u| (cond(K) of this 10 x 2 strip measured with
  // a dense eigen-solve: 5.7e7).
  const double u_max = a.displacements.cwiseAbs().maxCoeff();
  const double bound = 5.7e7 * 2.2e-16 * u_max;
  for (int v = 0; v < flat.node_count(); ++v) {
    EXPECT_LT((Q * a.displacements.segment<3>(6 * v) - b.displacements.segment<3>(6 * v)).norm(), bound);
    EXPECT_LT((Q * a.displacements.segment<3>(6 * v + 3) - b.displacements.segment<3>(6 * v + 3)).norm(), bound);
  }
}

TEST(LinearStatic, AssembledStiffnessEqualsDenseAssemblyOfElementMatrices) {
  ShellModel m = cantilever_strip(3, 2);
  m.nodes[5].z() += 0.3;  // one warped element pair, so no entry is trivially zero by symmetry
  const SectionAssignment sections = SectionAssignment::elastic(m, kE, 0.3);
  LinearShellSystem system(m, sections);
  ASSERT_TRUE(system.assemble_stiffness().ok);
  // Dense reference: element matrices from the same kernel, summed in element order, symmetric part.
  const Eigen::VectorXd zero = Eigen::VectorXd::Zero(m.dof_count());
  const ElementKernel kernel = system.elements().internal_force_kernel(zero);
  std::vector<Mat24> k(static_cast<std::size_t>(m.element_count()));
  for (int e = 0; e < m.element_count(); ++e) {
    ASSERT_EQ(kernel(e, &k[e], nullptr), ElementStatus::Ok);
    k[e] = (0.5 * (k[e] + k[e].transpose())).eval();
  }
  const Eigen::MatrixXd dense = testing::dense_assembly(element_nodes(m), system.dofs(), k);
  const Eigen::MatrixXd sparse = testing::to_dense(system.pattern(), system.stiffness_values());
  EXPECT_LT((sparse - dense).cwiseAbs().maxCoeff(), 1e-12 * dense.cwiseAbs().maxCoeff());
  // The rotated element matrix equals T^T K_local T with T = blockdiag(R^T).
  const int e = 4;
  Vec24 f;
  Mat24 k_local;
  ASSERT_EQ(system.elements().element(e).compute(Vec24::Zero(), sections.of(e), {}, {}, f, &k_local),
            ElementStatus::Ok);
  Mat24 T = Mat24::Zero();
  for (int b = 0; b < 8; ++b) T.block<3, 3>(3 * b, 3 * b) = system.elements().frame(e).rotation.transpose();
  Mat24 k_global;
  ASSERT_EQ(kernel(e, &k_global, nullptr), ElementStatus::Ok);
  EXPECT_LT((k_global - T.transpose() * k_local * T).cwiseAbs().maxCoeff(), 1e-12 * k_local.cwiseAbs().maxCoeff());
}

TEST(LinearStatic, ReportsMechanismsInsteadOfSolving) {
  // (a) free-floating strip: six rigid-body modes; (b) the edge x = 0 pinned (translations only):
  // the strip can turn about that edge. A singular K factorises with round-off pivots of either
  // sign, so either outcome is a correct report; a solution is not.
  ShellModel floating = cantilever_strip(4, 1);
  floating.supports.clear();
  ShellModel hinged = cantilever_strip(4, 1);
  hinged.supports = {support("x0", {"ux", "uy", "uz"})};
  for (const ShellModel* m : {&floating, &hinged}) {
    const SectionAssignment sections = SectionAssignment::elastic(*m, kE, 0.3);
    const LinearStaticResult r = solve_linear_static(*m, sections);
    std::printf("[ mechanism ] %s: %s\n", linear_static_status_name(r.status), r.message.c_str());
    EXPECT_TRUE(r.status == LinearStaticStatus::NotPositiveDefinite || r.status == LinearStaticStatus::Mechanism)
        << r.message;
    EXPECT_EQ(r.displacements.size(), 0);
  }
  // A well-supported strip passes the pivot test by a wide margin.
  const ShellModel clamped = cantilever_strip(4, 1);
  const SectionAssignment clamped_sections = SectionAssignment::elastic(clamped, kE, 0.3);
  LinearShellSystem system(clamped, clamped_sections);
  ASSERT_TRUE(solve_linear_static(system).ok());
  std::printf("[ mechanism ] clamped strip: min pivot ratio %.3g\n", system.stiffness_factor().min_pivot_ratio());
  EXPECT_GT(system.stiffness_factor().min_pivot_ratio(), 1e3 * system.options().mechanism_pivot_ratio);
}

}  // namespace
}  // namespace rotcap
