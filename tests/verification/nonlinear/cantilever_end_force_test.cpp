// Cantilever strip under a transverse end force, solved by the whole nonlinear solver chain
// (ShellModel -> ShellProblem with corotational shells -> PathFollower, load control).
//
// Problem: K.Y. Sze, X.H. Liu, S.H. Lo, "Popular benchmark problems for geometric nonlinear
// analysis of shells", FEAD 40 (2004) 1551-1569, "cantilever subjected to end shear force". Data
// from memory (docs/spec/references.md 2.1): L = 10, b = 1, t = 0.1, E = 1.2e6, nu = 0, clamped at x = 0, a
// force P along z at the free end that keeps its direction; E I = 100, so the load parameter
// P L^2 / E I equals P, P_max = 4.
// Reference: the inextensible elastica E I theta'' + P cos(theta) = 0, theta(0) = 0, theta'(L) = 0,
// solved by shooting with RK4 (docs/spec/references.md 2.1, DERIVED; re-computed for this test with 4000
// RK4 steps, same values to the digits given). With nu = 0 and L / t = 100 the shell differs from
// the elastica only by shear and membrane strains of order (t/L)^2 and P/(E A) = 3e-5.
// Error measure: relative error of the tip deflection W (along P) and of the shortening -U, at
// the two nodes' mean; limit 2 %. The tip rotation is compared the same way.

#include "tests/test_support.hpp"
#include "tests/verification/nonlinear/benchmark_meshes.hpp"
#include "tests/verification/nonlinear/path_record.hpp"

#include <cmath>
#include <cstdio>

namespace rotcap::verification {
namespace {

constexpr double kLength = 10.0, kWidth = 1.0, kThickness = 0.1, kE = 1.2e6;
constexpr int kElements = 16;

struct ElasticaPoint {
  double P, W, shortening, rotation;  // DERIVED, docs/spec/references.md 2.1
};
constexpr ElasticaPoint kElastica[] = {
    {1.0, 3.017, 0.564, 0.4614}, {2.0, 4.935, 1.606, 0.7817}, {3.0, 6.033, 2.544, 0.9860}, {4.0, 6.700, 3.289, 1.1212}};

TEST(EndForceVerification, TipDeflectionAndShorteningMatchTheElastica) {
  ShellModel model = cantilever_strip(kLength, kWidth, kThickness, kElements);
  model.loads.push_back({"tip", Eigen::Vector3d(0.0, 0.0, 1.0), Eigen::Vector3d::Zero()});  // P = lambda
  const SectionAssignment sections = SectionAssignment::elastic(model, kE, 0.0);
  ShellProblem problem(model, sections, {.element = {}, .threads = 1});
  LoadControl control;
  PathOptions o;
  o.first_step = 0.25;
  PathRecord all;
  double lambda = 0.0;
  std::printf("end force (Sze, Liu & Lo 2004, setup from memory; inextensible elastica, DERIVED), %d elements\n",
              kElements);
  for (const ElasticaPoint& ref : kElastica) {
    o.max_load_factor = ref.P;
    const PathRecord r = follow_path(problem, control, o, lambda);
    ASSERT_EQ(r.summary.status, PathStatus::Completed) << r.summary.message;
    ASSERT_DOUBLE_EQ(r.summary.load_factor, ref.P);
    append(all, r);
    lambda = ref.P;
    const Eigen::VectorXd u = problem.displacements();
    const double W = group_mean(model, "tip", Dof::uz, u);
    const double shortening = -group_mean(model, "tip", Dof::ux, u);
    // Rotation about -y (the tip turns from +x towards +z).
    const int tip_node = model.groups.at("tip").nodes.front();
    const double rotation = -u[kDofsPerNode * tip_node + static_cast<int>(Dof::ry)];
    std::printf("  P %.0f: W %.4f (elastica %.3f, error %+.2f %%), -U %.4f (%.3f, %+.2f %%), rotation %.4f "
                "(%.4f, %+.2f %%)\n",
                ref.P, W, ref.W, 100 * (W / ref.W - 1), shortening, ref.shortening,
                100 * (shortening / ref.shortening - 1), rotation, ref.rotation, 100 * (rotation / ref.rotation - 1));
    EXPECT_CLOSE(W, ref.W, 0.02, 0.0) << "P = " << ref.P;
    EXPECT_CLOSE(shortening, ref.shortening, 0.02, 0.0) << "P = " << ref.P;
    EXPECT_CLOSE(rotation, ref.rotation, 0.02, 0.0) << "P = " << ref.P;
  }
  std::printf("  %d steps, %d iterations (%.2f per step), %d cut-backs\n", all.summary.steps, all.summary.iterations,
              all.mean_iterations(), all.summary.cutbacks);
}

}  // namespace
}  // namespace rotcap::verification
