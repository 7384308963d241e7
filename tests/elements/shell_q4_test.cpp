// ShellQ4 unit tests: rigid-body modes (exactly six zero eigenvalues), symmetry, linearity,
// argument checks, history bookkeeping per Gauss point and the local-iteration status.
#include "elements/shell_q4.hpp"
#include "materials/elastic_shell_section.hpp"
#include "tests/test_support.hpp"

#include <Eigen/Eigenvalues>
#include <iostream>
#include <limits>
#include <random>
#include <vector>

namespace rotcap {
namespace {

// Steel plate, mm / N / MPa.
const ElasticShellSection kSteel(210000.0, 0.3, 10.0);

Eigen::Matrix<double, 3, 4> flat_rectangle() {
  Eigen::Matrix<double, 3, 4> x;
  x << -50.0, 50.0, 50.0, -50.0, -40.0, -40.0, 40.0, 40.0, 0.0, 0.0, 0.0, 0.0;
  return x;
}

// General convex quadrilateral (no two sides parallel), centred as ShellFrame would.
Eigen::Matrix<double, 3, 4> distorted_quad() {
  Eigen::Matrix<double, 3, 4> x;
  x << 0.0, 120.0, 150.0, -25.0, 0.0, -20.0, 110.0, 70.0, 0.0, 0.0, 0.0, 0.0;
  x.topRows<2>().colwise() -= 0.25 * x.topRows<2>().rowwise().sum();
  return x;
}

// Warped: offsets +-h from the mean plane (h = 4 mm on a ~100 mm element).
Eigen::Matrix<double, 3, 4> warped_quad() {
  Eigen::Matrix<double, 3, 4> x = distorted_quad();
  x.row(2) << 4.0, -4.0, 4.0, -4.0;
  return x;
}

Mat24 stiffness(const ShellQ4& e, const ShellSection& s) {
  Vec24 f;
  Mat24 k;
  EXPECT_EQ(e.compute(Vec24::Zero(), s, {}, {}, f, &k), ElementStatus::Ok);
  EXPECT_LT(f.norm(), 1e-300);
  return k;
}

void expect_six_rigid_modes(const Eigen::Matrix<double, 3, 4>& x, const char* name) {
  const ShellQ4 e(x);
  const Mat24 k = stiffness(e, kSteel);
  EXPECT_LT((k - k.transpose()).norm(), 1e-12 * k.norm()) << name;
  const Eigen::SelfAdjointEigenSolver<Mat24> eig(0.5 * (k + k.transpose()));
  const auto lambda = eig.eigenvalues();
  const double lmax = lambda(23);
  std::cout << name << ": eigenvalue / max:";
  for (int i = 0; i < 9; ++i) std::cout << " " << lambda(i) / lmax;
  std::cout << " ... (lambda_max " << lmax << " N/mm)\n";
  for (int i = 0; i < 6; ++i) EXPECT_LT(std::abs(lambda(i)) / lmax, 1e-10) << name << " mode " << i;
  // The softest deformation mode is the drilling mode with gamma = 1e-3 G; its ratio to the largest
  // membrane eigenvalue is about 1e-5 here, so 1e-7 is "clearly positive" with a wide margin over
  // the rigid modes' round-off (< 1e-14).
  EXPECT_GT(lambda(6) / lmax, 1e-7) << name;
}

TEST(ShellQ4, FlatElementHasExactlySixZeroEigenvalues) { expect_six_rigid_modes(flat_rectangle(), "flat"); }
TEST(ShellQ4, DistortedElementHasExactlySixZeroEigenvalues) { expect_six_rigid_modes(distorted_quad(), "distorted"); }
TEST(ShellQ4, WarpedElementHasExactlySixZeroEigenvalues) { expect_six_rigid_modes(warped_quad(), "warped"); }

TEST(ShellQ4, RigidMotionOfWarpedElementIsStressFree) {
  // Infinitesimal rigid motion u = c + theta x X of the real (warped) nodes.
  const auto x = warped_quad();
  const ShellQ4 e(x);
  const Eigen::Vector3d c(0.3, -0.2, 0.5), theta(2e-3, -1e-3, 3e-3);
  Vec24 d;
  for (int a = 0; a < 4; ++a) {
    d.segment<3>(6 * a) = c + theta.cross(Eigen::Vector3d(x.col(a)));
    d.segment<3>(6 * a + 3) = theta;
  }
  Vec24 f;
  ShellQ4Resultants out;
  ASSERT_EQ(e.compute(d, kSteel, {}, {}, f, nullptr, &out), ElementStatus::Ok);
  const Mat24 k = stiffness(e, kSteel);
  EXPECT_LT(f.norm(), 1e-12 * k.norm() * d.norm());
  for (int gp = 0; gp < 4; ++gp) {
    EXPECT_LT(out.g[gp].norm(), 1e-15);
    EXPECT_LT(out.q[gp].norm(), 1e-9);
  }
}

TEST(ShellQ4, ResidualOfElasticSectionIsStiffnessTimesDofs) {
  std::mt19937 rng(7);
  std::uniform_real_distribution<double> u(-1.0, 1.0);
  const ShellQ4 e(warped_quad());
  Vec24 d;
  for (int i = 0; i < 24; ++i) d(i) = (i % 6 < 3 ? 0.1 : 1e-3) * u(rng);
  Vec24 f;
  Mat24 k;
  ASSERT_EQ(e.compute(d, kSteel, {}, {}, f, &k), ElementStatus::Ok);
  EXPECT_LT((f - k * d).norm(), 1e-12 * f.norm());
  EXPECT_LT((k - stiffness(e, kSteel)).norm(), 1e-13 * k.norm());
}

TEST(ShellQ4, AreaIsMeanPlaneArea) {
  // Shoelace formula for the distorted quad.
  const auto x = distorted_quad();
  double a = 0.0;
  for (int i = 0; i < 4; ++i) a += 0.5 * (x(0, i) * x(1, (i + 1) % 4) - x(0, (i + 1) % 4) * x(1, i));
  EXPECT_CLOSE(ShellQ4(x).area(), a, 1e-14, 0.0);
  EXPECT_CLOSE(ShellQ4(flat_rectangle()).area(), 8000.0, 1e-14, 0.0);
}

TEST(ShellQ4, RejectsClockwiseAndDegenerateGeometry) {
  Eigen::Matrix<double, 3, 4> cw = flat_rectangle();
  cw.col(1).swap(cw.col(3));
  EXPECT_THROW(ShellQ4{cw}, std::invalid_argument);
  Eigen::Matrix<double, 3, 4> collapsed = flat_rectangle();
  collapsed.col(2) = collapsed.col(1);
  collapsed.col(3) = collapsed.col(0);
  EXPECT_THROW(ShellQ4{collapsed}, std::invalid_argument);
}

TEST(ShellQ4, RejectsOptionsOutOfRange) {
  ShellQ4::Options o;
  o.drilling_ratio = 0.0;
  EXPECT_THROW(ShellQ4(flat_rectangle(), o), std::invalid_argument);
  o = {};
  o.shear_correction = 1.5;
  EXPECT_THROW(ShellQ4(flat_rectangle(), o), std::invalid_argument);
  o = {};
  o.max_local_iterations = 0;
  EXPECT_THROW(ShellQ4(flat_rectangle(), o), std::invalid_argument);
  o = {};
  o.local_tolerance = 0.0;
  EXPECT_THROW(ShellQ4(flat_rectangle(), o), std::invalid_argument);
}

// A one-layer linear section that adds a per-point initial membrane force read from the
// committed slot (initial_stress * t) and records its input strain in the trial slot. It reports
// is_linear() = false, so the element runs the local Newton loop.
class ProbingSection final : public ShellSection {
 public:
  double thickness() const override { return base_.thickness(); }
  double shear_modulus() const override { return base_.shear_modulus(); }
  double youngs_modulus() const override { return base_.youngs_modulus(); }
  int layers() const override { return 1; }
  bool is_linear() const override { return false; }
  void respond(const Vec6& g, std::span<const LayerState> committed, std::span<LayerState> trial,
               Vec6& r, Mat6& c) const override {
    EXPECT_EQ(committed.size(), 1u);
    EXPECT_EQ(trial.size(), 1u);
    base_.respond(g, {}, {}, r, c);
    r.head<3>() += committed[0].initial_stress * thickness();
    trial[0].plastic_strain = g.head<3>();
    trial[0].equivalent_plastic_strain = committed[0].equivalent_plastic_strain;
  }
  SurfaceStresses surfaces(const Vec6& g, std::span<const LayerState>) const override {
    return base_.surfaces(g, {});
  }

 private:
  ElasticShellSection base_{210000.0, 0.3, 10.0};
};

TEST(ShellQ4, PassesEachGaussPointItsOwnHistoryAndRecordsConvergedStrains) {
  const ShellQ4 e(distorted_quad());
  const ProbingSection section;
  std::vector<LayerState> committed(4), trial(4);
  for (int gp = 0; gp < 4; ++gp) {
    committed[gp].initial_stress = Eigen::Vector3d(10.0 * (gp + 1), -5.0 * gp, 2.0);
    committed[gp].equivalent_plastic_strain = gp;
  }
  std::mt19937 rng(11);
  std::uniform_real_distribution<double> u(-1.0, 1.0);
  Vec24 d;
  for (int i = 0; i < 24; ++i) d(i) = (i % 6 < 3 ? 0.05 : 1e-3) * u(rng);
  Vec24 f;
  ShellQ4Resultants out;
  ASSERT_EQ(e.compute(d, section, committed, trial, f, nullptr, &out), ElementStatus::Ok);
  for (int gp = 0; gp < 4; ++gp) {
    EXPECT_EQ(trial[gp].equivalent_plastic_strain, gp);
    // The strain recorded in the trial slot is the one of the converged mode amplitudes.
    EXPECT_LT((trial[gp].plastic_strain - out.g[gp].head<3>()).norm(), 1e-15);
    Vec6 r;
    Mat6 c;
    kSteel.respond(out.g[gp], {}, {}, r, c);
    EXPECT_LT((out.r[gp].head<3>() - r.head<3>() - committed[gp].initial_stress * 10.0).norm(), 1e-9);
  }
}

// Elastic response plus a strong cubic membrane term, for the local-iteration status.
class StiffeningSection final : public ShellSection {
 public:
  double thickness() const override { return 10.0; }
  double shear_modulus() const override { return base_.shear_modulus(); }
  double youngs_modulus() const override { return base_.youngs_modulus(); }
  int layers() const override { return 0; }
  bool is_linear() const override { return false; }
  void respond(const Vec6& g, std::span<const LayerState>, std::span<LayerState>, Vec6& r,
               Mat6& c) const override {
    base_.respond(g, {}, {}, r, c);
    const double beta = 2.1e6 / 1e-6;  // doubles the axial stiffness at a strain of 1e-3
    for (int i = 0; i < 3; ++i) {
      r(i) += beta * g(i) * g(i) * g(i);
      c(i, i) += 3.0 * beta * g(i) * g(i);
    }
  }
  SurfaceStresses surfaces(const Vec6& g, std::span<const LayerState>) const override {
    return base_.surfaces(g, {});
  }

 private:
  ElasticShellSection base_{210000.0, 0.3, 10.0};
};

TEST(ShellQ4, ReportsLocalIterationFailureWhenModesDoNotConverge) {
  // In-plane bending state with strains ~1e-3: needs several Newton steps on alpha.
  const auto x = distorted_quad();
  Vec24 d = Vec24::Zero();
  for (int a = 0; a < 4; ++a) d(6 * a) = 1e-3 * x(0, a) * x(1, a) / 50.0 + 1e-3 * x(0, a);
  const StiffeningSection section;
  Vec24 f;
  Mat24 k;
  ShellQ4::Options one;
  one.max_local_iterations = 1;
  EXPECT_EQ(ShellQ4(x, one).compute(d, section, {}, {}, f, &k), ElementStatus::LocalIterationFailed);
  EXPECT_EQ(ShellQ4(x).compute(d, section, {}, {}, f, &k), ElementStatus::Ok);
}

// A broken section that returns NaN resultants: compute must report a non-Ok status (the mode
// amplitudes are checked in every build type; f and K in debug builds).
class NanSection final : public ShellSection {
 public:
  double thickness() const override { return 10.0; }
  double shear_modulus() const override { return 80000.0; }
  double youngs_modulus() const override { return 210000.0; }
  int layers() const override { return 0; }
  bool is_linear() const override { return linear_; }
  void respond(const Vec6&, std::span<const LayerState>, std::span<LayerState>, Vec6& r, Mat6& c) const override {
    r.setConstant(std::numeric_limits<double>::quiet_NaN());
    c = Mat6::Identity() * 1e6;
  }
  SurfaceStresses surfaces(const Vec6&, std::span<const LayerState>) const override { return {}; }
  bool linear_ = true;
};

TEST(ShellQ4, ReportsNonFiniteSectionResponse) {
  const ShellQ4 e(distorted_quad());
  NanSection section;
  Vec24 f;
  Mat24 k;
  Vec24 d = Vec24::Constant(1e-3);
  EXPECT_EQ(e.compute(d, section, {}, {}, f, &k), ElementStatus::NotFinite);
  section.linear_ = false;
  EXPECT_NE(e.compute(d, section, {}, {}, f, &k), ElementStatus::Ok);
}

TEST(ShellQ4, RejectsHistorySpansThatAreTooShort) {
  const ProbingSection section;
  std::vector<LayerState> committed(3), trial(4);
  Vec24 f;
  EXPECT_THROW(ShellQ4(flat_rectangle()).compute(Vec24::Zero(), section, committed, trial, f, nullptr),
               std::invalid_argument);
}

}  // namespace
}  // namespace rotcap
