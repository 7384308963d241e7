// The two flavours of the element tangent kernels (elements/kernel_dispatch.hpp): on a CPU with
// AVX2 and FMA the AVX2 flavour must give the baseline's element tangent to round-off, and the
// residual and the trial history, which no kernel touches, bit for bit. Elsewhere the AVX2 tests
// are skipped.
#include "elements/corotational/corotational_shell_q4.hpp"
#include "elements/kernel_dispatch.hpp"
#include "materials/layered_shell_section.hpp"
#include "tests/corotational/corotational_test_support.hpp"

#include <gtest/gtest.h>

#include <cstdio>
#include <cstdlib>
#include <cstring>
#include <random>
#include <stdexcept>
#include <vector>

namespace rotcap {
namespace {

using namespace rotcap::testing;

constexpr double kSize = 100.0;  // mm

// S355-like layered plate with hardening, so that the return map and the elastic-plastic tangent
// are both exercised at 1 % strain.
const LayeredShellSection& plastic_plate() {
  static const LayeredShellSection section(
      J2PlaneStress(210000.0, 0.3, HardeningCurve({{0.0, 355.0}, {0.02, 400.0}, {0.1, 480.0}})), 8.0);
  return section;
}

CorotationalShellQ4 element_with(const NodalCoordinates& X, KernelKind kind) {
  CorotationalShellQ4::Options options;
  options.core.kernel = kind;
  return CorotationalShellQ4(X, options);
}

TEST(KernelDispatch, BaselineIsAlwaysAvailableAndNamed) {
  EXPECT_TRUE(kernel_supported(KernelKind::Baseline));
  EXPECT_STREQ(kernel_name(KernelKind::Baseline), "baseline");
  EXPECT_STREQ(kernel_name(KernelKind::Avx2), "avx2");
  const KernelKind active = active_kernel();
  EXPECT_TRUE(kernel_supported(active));
  // The forced choice of the environment is what the process runs with.
  const char* forced = std::getenv("ROTCAP_KERNEL");
  if (forced != nullptr && std::strcmp(forced, "baseline") == 0) {
    EXPECT_EQ(active, KernelKind::Baseline);
  }
  if (!kernel_supported(KernelKind::Avx2)) {
    EXPECT_EQ(active, KernelKind::Baseline);
    EXPECT_THROW(tangent_kernels(KernelKind::Avx2), std::invalid_argument);
  }
}

TEST(KernelDispatch, Avx2TangentEqualsBaselineToRoundOffAndResidualBitForBit) {
  if (!kernel_supported(KernelKind::Avx2)) GTEST_SKIP() << "no AVX2 + FMA flavour on this build or CPU";
  std::mt19937 rng(2026);
  const std::size_t slots = ShellQ4::kGaussPoints * static_cast<std::size_t>(plastic_plate().layers());
  int plastic_trials = 0;
  for (int trial = 0; trial < 6; ++trial) {
    const NodalCoordinates X = random_element(rng, kSize, trial % 2 == 0 ? 0.0 : 0.02);
    const CorotationalShellQ4 base = element_with(X, KernelKind::Baseline);
    const CorotationalShellQ4 avx2 = element_with(X, KernelKind::Avx2);
    NodalCoordinates x;
    NodalRotations R;
    random_configuration(rng, X, kSize, 0.01, 0.1, x, R);
    const std::vector<LayerState> committed(slots);
    std::vector<LayerState> trial_base(slots), trial_avx2(slots);
    Vec24 f_base, f_avx2;
    Mat24 K_base, K_avx2;
    ASSERT_EQ(base.compute(x, R, plastic_plate(), committed, trial_base, f_base, &K_base), ElementStatus::Ok);
    ASSERT_EQ(avx2.compute(x, R, plastic_plate(), committed, trial_avx2, f_avx2, &K_avx2), ElementStatus::Ok);
    // The residual and the history are computed outside the kernels: identical.
    EXPECT_EQ(std::memcmp(f_base.data(), f_avx2.data(), sizeof(double) * 24), 0) << "trial " << trial;
    for (std::size_t k = 0; k < slots; ++k) {
      EXPECT_EQ(trial_base[k].equivalent_plastic_strain, trial_avx2[k].equivalent_plastic_strain);
      if (trial_base[k].equivalent_plastic_strain > 0.0) ++plastic_trials;
    }
    // The tangent: the same expressions with FMA and another summation order. Entries run over
    // 5 to 6 orders of magnitude (rotations vs translations, length 100 mm), so compare in the
    // energy-scaled form; a few hundred operations at unit round-off 1.1e-16 bound the difference
    // by about 1e-13 of the largest entry.
    const double scale = energy_scaled(K_base, kSize).cwiseAbs().maxCoeff();
    const double difference = energy_scaled(K_avx2 - K_base, kSize).cwiseAbs().maxCoeff() / scale;
    EXPECT_LT(difference, 1e-12) << "trial " << trial;
    std::printf("  trial %d: max |K_avx2 - K_baseline| / max |K| = %.3e (energy scaled)\n", trial, difference);
  }
  EXPECT_GT(plastic_trials, 0) << "the configurations must yield some layer points";
}

}  // namespace
}  // namespace rotcap
