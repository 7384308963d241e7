// The AVX2 + FMA flavour of the element tangent kernels; elements/CMakeLists.txt compiles this file
// alone with -mavx2 -mfma. Eigen is renamed before its headers are read, so that every Eigen
// instantiation made here (256-bit packets) has names of its own and cannot stand in for the
// baseline ones at link time; tangent_kernels.hpp (plain pointers) is the only shared interface.
#include "elements/kernels/tangent_kernels.hpp"

#if !defined(__AVX2__) || !defined(__FMA__)
#error "tangent_kernels_avx2.cpp must be compiled with -mavx2 -mfma"
#endif

#define Eigen rotcap_eigen_avx2
#define ROTCAP_KERNEL_FLAVOUR avx2
#include "elements/kernels/tangent_kernels.inc"
