#pragma once
// One BLAS thread for the whole process.
//
// Contract: after use_one_blas_thread() every BLAS call of this process (CHOLMOD's supernodes, the
// dense kernels of SupernodalLdlt) runs on the calling thread. rotcap's own OpenMP threads already
// share the cores: SupernodalLdlt calls dgemm/dtrsm from inside its parallel regions, and a threaded
// OpenBLAS there starts its own thread pool on top (the demo took 80 s instead of 26 s on 2 cores,
// most of it in the kernel scheduler; bench/results/demo.txt). One thread also makes the sums, and so
// the curves, independent of the environment.
// Acts on OpenBLAS (the Debian default) through its openblas_set_num_threads; with any other BLAS
// it does nothing and returns false. Call it outside parallel regions, before the first solve.

namespace rotcap::solver {

/// Sets the BLAS library to one thread; true when the library offered the call (OpenBLAS).
bool use_one_blas_thread();

}  // namespace rotcap::solver
