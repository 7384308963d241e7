#include "solver/blas_threads.hpp"

// Declared weak: resolved when the BLAS in use is OpenBLAS, null with any other BLAS.
extern "C" void openblas_set_num_threads(int) __attribute__((weak));

namespace rotcap::solver {

bool use_one_blas_thread() {
  if (openblas_set_num_threads == nullptr) return false;
  openblas_set_num_threads(1);
  return true;
}

}  // namespace rotcap::solver
