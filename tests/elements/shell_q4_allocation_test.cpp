// ShellQ4::compute must not touch the heap (fixed-size Eigen kernels only). The test counts the
// allocations made while compute() runs (tests/allocation_counter.hpp: glibc or AddressSanitizer
// only; skipped elsewhere).
#include "elements/shell_q4.hpp"
#include "materials/elastic_shell_section.hpp"
#include "tests/allocation_counter.hpp"

#include <gtest/gtest.h>

#if defined(__GLIBC__)
namespace {
double* volatile probe = nullptr;
}  // namespace
#endif

namespace rotcap {
namespace {

// Stateless nonlinear section so that the local Newton loop runs too.
class SofteningSection final : public ShellSection {
 public:
  double thickness() const override { return 10.0; }
  double shear_modulus() const override { return base_.shear_modulus(); }
  double youngs_modulus() const override { return base_.youngs_modulus(); }
  int layers() const override { return 0; }
  bool is_linear() const override { return false; }
  void respond(const Vec6& g, std::span<const LayerState>, std::span<LayerState>, Vec6& r,
               Mat6& c) const override {
    base_.respond(g, {}, {}, r, c);
    for (int i = 0; i < 3; ++i) {
      r(i) += 1.0e11 * g(i) * g(i) * g(i);
      c(i, i) += 3.0e11 * g(i) * g(i);
    }
  }
  SurfaceStresses surfaces(const Vec6& g, std::span<const LayerState>) const override {
    return base_.surfaces(g, {});
  }

 private:
  ElasticShellSection base_{210000.0, 0.3, 10.0};
};

TEST(ShellQ4, ComputeDoesNotAllocate) {
#if !defined(__GLIBC__)
  GTEST_SKIP() << "malloc interposition needs glibc";
#else
  Eigen::Matrix<double, 3, 4> x;
  x << -60.0, 55.0, 70.0, -40.0, -45.0, -35.0, 50.0, 30.0, 3.0, -3.0, 3.0, -3.0;
  const ShellQ4 element(x);
  const ElasticShellSection elastic(210000.0, 0.3, 10.0);
  const SofteningSection nonlinear;
  Vec24 d;
  for (int i = 0; i < 24; ++i) d(i) = (i % 6 < 3 ? 0.05 : 1e-3) * ((i * 7) % 5 - 2);
  Vec24 f;
  Mat24 k;
  ShellQ4Resultants out;
  // Warm-up outside the counted region, then count.
  ASSERT_EQ(element.compute(d, elastic, {}, {}, f, &k, &out), ElementStatus::Ok);
  long allocations = 0;
  {
    const testing::AllocationCounter counter;
    const ElementStatus s1 = element.compute(d, elastic, {}, {}, f, &k, &out);
    const ElementStatus s2 = element.compute(d, nonlinear, {}, {}, f, &k, &out);
    const ElementStatus s3 = element.compute(d, nonlinear, {}, {}, f, nullptr);
    const Mat24 kg = element.geometric_stiffness({out.r[0].head<3>(), out.r[1].head<3>(), out.r[2].head<3>(),
                                                  out.r[3].head<3>()});
    allocations = counter.count();
    EXPECT_EQ(s1, ElementStatus::Ok);
    EXPECT_EQ(s2, ElementStatus::Ok);
    EXPECT_EQ(s3, ElementStatus::Ok);
    EXPECT_TRUE(kg.allFinite());
  }
  EXPECT_EQ(allocations, 0);
  // Positive control: the counter does see an allocation made through operator new.
  {
    const testing::AllocationCounter counter;
    probe = new double[4];  // stored in a volatile global so the pair cannot be elided
    allocations = counter.count();
  }
  delete[] probe;
  EXPECT_GE(allocations, 1);
#endif
}

}  // namespace
}  // namespace rotcap
