#pragma once
// Run-time choice of the element tangent kernels (elements/kernels/): the dense parts of the
// ShellQ4 tangent and of the corotational tangent transformation, compiled twice, once for
// baseline x86-64 (SSE2) and once for x86-64-v3 (AVX2 + FMA), from one source.
//
// Choice (active_kernel(), made once per process): Avx2 when the build has that flavour
// (ROTCAP_KERNEL_AVX2, x86-64 GCC or Clang) and the CPU reports AVX2 and FMA; otherwise Baseline.
// The environment variable ROTCAP_KERNEL=baseline forces the baseline flavour (to compare, or on
// a machine whose feature report is not to be trusted); any other value is ignored.
// Both flavours compute the same expressions; they differ at round-off level only (FMA contraction
// and another summation order), so a run is bit-reproducible for one binary on one machine, not
// across machines whose CPUs pick different flavours.
//
// Interface rule: no Eigen type crosses into a flavour (each is compiled with its own Eigen
// instantiation, see kernels/tangent_kernels.hpp); TangentKernels holds plain function pointers.

#include "elements/kernels/tangent_kernels.hpp"

namespace rotcap {

enum class KernelKind { Baseline, Avx2 };

/// "baseline" or "avx2" (summary.json, logs).
const char* kernel_name(KernelKind kind);
/// True when this build has the flavour and this CPU can run it.
bool kernel_supported(KernelKind kind);
/// The flavour every element uses unless its options name one (see the file comment).
KernelKind active_kernel();
/// The function table of a flavour; kind must be supported (else std::invalid_argument).
const kernels::TangentKernels& tangent_kernels(KernelKind kind);

}  // namespace rotcap
