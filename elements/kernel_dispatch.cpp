#include "elements/kernel_dispatch.hpp"

#include <cstdlib>
#include <cstring>
#include <stdexcept>

namespace rotcap {

const char* kernel_name(KernelKind kind) { return kind == KernelKind::Avx2 ? "avx2" : "baseline"; }

bool kernel_supported(KernelKind kind) {
  if (kind == KernelKind::Baseline) return true;
#if defined(ROTCAP_KERNEL_AVX2)
  __builtin_cpu_init();
  return __builtin_cpu_supports("avx2") && __builtin_cpu_supports("fma");
#else
  return false;
#endif
}

KernelKind active_kernel() {
  static const KernelKind kind = [] {
    const char* forced = std::getenv("ROTCAP_KERNEL");
    if (forced != nullptr && std::strcmp(forced, "baseline") == 0) return KernelKind::Baseline;
    return kernel_supported(KernelKind::Avx2) ? KernelKind::Avx2 : KernelKind::Baseline;
  }();
  return kind;
}

const kernels::TangentKernels& tangent_kernels(KernelKind kind) {
  if (!kernel_supported(kind))
    throw std::invalid_argument(std::string("tangent_kernels: the ") + kernel_name(kind) +
                                " kernels are not in this build or not supported by this CPU");
#if defined(ROTCAP_KERNEL_AVX2)
  if (kind == KernelKind::Avx2) return kernels::avx2::table;
#endif
  return kernels::baseline::table;
}

}  // namespace rotcap
