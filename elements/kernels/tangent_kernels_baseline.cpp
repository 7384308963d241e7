// The baseline flavour of the element tangent kernels: the build's own flags (x86-64 baseline in
// Release, SSE2 packets in Eigen).
#include "elements/kernels/tangent_kernels.hpp"

#define ROTCAP_KERNEL_FLAVOUR baseline
#include "elements/kernels/tangent_kernels.inc"
