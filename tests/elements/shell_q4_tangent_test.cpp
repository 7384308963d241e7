// Finite-difference check of ShellQ4's condensed consistent tangent with a smooth nonlinear
// section: this checks the incompatible-mode condensation K = K_dd - K_da K_aa^-1 K_ad at the
// converged modes, the full 6x6 membrane-bending coupling and the warping transform.
#include "elements/shell_q4.hpp"
#include "materials/elastic_shell_section.hpp"
#include "tests/test_support.hpp"

#include <iostream>
#include <random>

namespace rotcap {
namespace {

// Stateless smooth nonlinear section with a membrane-bending coupling, so C is a full symmetric
// 6x6 matrix (as for a yielded layered section):
//   r = dPsi/dg,  Psi = 1/2 g.C0 g + sum_i beta_i g_i^4 / 4 + c_b (e_xx k_xx)^2 / 2.
// beta_i makes the cubic term equal to the linear diagonal term at |g_i| = g_ref_i; c_b makes the
// coupling stiffness c_b k_xx^2 a tenth of C0_00 at k_xx = kappa_ref.
class CubicSection final : public ShellSection {
 public:
  CubicSection() {
    Vec6 r;
    base_.respond(Vec6::Zero(), {}, {}, r, c0_);
    const double eps_ref = 2e-3, kappa_ref = 2e-3 / 5.0;  // membrane strain, curvature (t = 10)
    for (int i = 0; i < 6; ++i) {
      const double g_ref = i < 3 ? eps_ref : kappa_ref;
      beta_(i) = c0_(i, i) / (g_ref * g_ref);
    }
    coupling_ = 0.1 * c0_(0, 0) / (kappa_ref * kappa_ref);
  }
  double thickness() const override { return 10.0; }
  double shear_modulus() const override { return base_.shear_modulus(); }
  double youngs_modulus() const override { return base_.youngs_modulus(); }
  int layers() const override { return 0; }
  bool is_linear() const override { return false; }
  void respond(const Vec6& g, std::span<const LayerState>, std::span<LayerState>, Vec6& r,
               Mat6& c) const override {
    r = c0_ * g + beta_.cwiseProduct(g.cwiseAbs2().cwiseProduct(g));
    c = c0_;
    for (int i = 0; i < 6; ++i) c(i, i) += 3.0 * beta_(i) * g(i) * g(i);
    const double e = g(0), k = g(3);
    r(0) += coupling_ * e * k * k;
    r(3) += coupling_ * e * e * k;
    c(0, 0) += coupling_ * k * k;
    c(3, 3) += coupling_ * e * e;
    c(0, 3) += 2.0 * coupling_ * e * k;
    c(3, 0) += 2.0 * coupling_ * e * k;
  }
  SurfaceStresses surfaces(const Vec6& g, std::span<const LayerState>) const override {
    return base_.surfaces(g, {});
  }

 private:
  ElasticShellSection base_{210000.0, 0.3, 10.0};
  Mat6 c0_;
  Vec6 beta_;
  double coupling_ = 0.0;
};

void check_tangent(const Eigen::Matrix<double, 3, 4>& x, const char* name) {
  ShellQ4::Options options;
  // The FD quotient divides force errors by h: the modes are converged far below the default so
  // that their error (<= 1e-13 of the force scale) stays below the truncation error.
  options.local_tolerance = 1e-13;
  const ShellQ4 element(x, options);
  const CubicSection section;
  std::mt19937 rng(20240612);
  std::uniform_real_distribution<double> u(-1.0, 1.0);
  // Translations ~0.2 mm and rotations ~2e-3 on a ~100 mm element: strains ~2e-3 and curvatures
  // ~4e-4 /mm, where the cubic terms are as large as the linear ones.
  Vec24 d;
  for (int i = 0; i < 24; ++i) d(i) = (i % 6 < 3 ? 0.2 : 2e-3) * u(rng);
  Vec24 f;
  Mat24 k;
  ASSERT_EQ(element.compute(d, section, {}, {}, f, &k), ElementStatus::Ok);

  // Central differences: error = h^2/6 f''' (truncation) + eps |f| / h (round-off). With the step
  // h_j = 1e-5 * (0.2 mm or 2e-3 rad), |h / d| ~ 1e-5, so the truncation error is ~1e-10 of K
  // (f''' ~ K / d^2) and the round-off ~1e-16 / 1e-5 = 1e-11 of K; the bound 1e-7 on the largest
  // entry error relative to the largest entry leaves a wide margin and still catches any missing
  // term (a wrong condensation shows up at the 1e-2 level).
  Mat24 k_fd;
  for (int j = 0; j < 24; ++j) {
    const double h = 1e-5 * (j % 6 < 3 ? 0.2 : 2e-3);
    Vec24 dp = d, dm = d, fp, fm;
    dp(j) += h;
    dm(j) -= h;
    ASSERT_EQ(element.compute(dp, section, {}, {}, fp, nullptr), ElementStatus::Ok);
    ASSERT_EQ(element.compute(dm, section, {}, {}, fm, nullptr), ElementStatus::Ok);
    k_fd.col(j) = (fp - fm) / (2.0 * h);
  }
  // Compare entries as energies: scale row and column j by the DOF's typical size (0.2 mm or
  // 2e-3 rad), so translation and rotation blocks weigh alike.
  Mat24 s = Mat24::Zero();
  for (int j = 0; j < 24; ++j) s(j, j) = j % 6 < 3 ? 0.2 : 2e-3;
  const Mat24 ks = s * k * s, kfs = s * k_fd * s;
  const double err = (ks - kfs).cwiseAbs().maxCoeff() / ks.cwiseAbs().maxCoeff();
  // The same check against the uncondensed elastic tangent shows the nonlinearity matters.
  Vec24 f0;
  Mat24 k0;
  ASSERT_EQ(element.compute(d, ElasticShellSection(210000.0, 0.3, 10.0), {}, {}, f0, &k0), ElementStatus::Ok);
  const double nonlinearity = (s * (k - k0) * s).cwiseAbs().maxCoeff() / ks.cwiseAbs().maxCoeff();
  std::cout << name << ": max |K - K_fd| / max |K| = " << err
            << "   (max |K - K_elastic| / max |K| = " << nonlinearity << ")\n";
  EXPECT_LT(err, 1e-7) << name;
  EXPECT_GT(nonlinearity, 1e-2) << name;
  EXPECT_LT((k - k.transpose()).cwiseAbs().maxCoeff(), 1e-10 * k.cwiseAbs().maxCoeff()) << name;
}

TEST(ShellQ4Tangent, MatchesCentralDifferencesOnDistortedElement) {
  Eigen::Matrix<double, 3, 4> x;
  x << 0.0, 120.0, 150.0, -25.0, 0.0, -20.0, 110.0, 70.0, 0.0, 0.0, 0.0, 0.0;
  x.topRows<2>().colwise() -= 0.25 * x.topRows<2>().rowwise().sum();
  check_tangent(x, "distorted");
}

TEST(ShellQ4Tangent, MatchesCentralDifferencesOnWarpedElement) {
  Eigen::Matrix<double, 3, 4> x;
  x << 0.0, 120.0, 150.0, -25.0, 0.0, -20.0, 110.0, 70.0, 4.0, -4.0, 4.0, -4.0;
  x.topRows<2>().colwise() -= 0.25 * x.topRows<2>().rowwise().sum();
  check_tangent(x, "warped");
}

}  // namespace
}  // namespace rotcap
