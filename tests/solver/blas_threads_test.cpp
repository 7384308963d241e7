// use_one_blas_thread (solver/blas_threads.hpp): the process's BLAS ends on one thread whatever it
// was set to before (OPENBLAS_NUM_THREADS in the environment, or a call).
#include "solver/blas_threads.hpp"

#include <gtest/gtest.h>

extern "C" void openblas_set_num_threads(int) __attribute__((weak));
extern "C" int openblas_get_num_threads(void) __attribute__((weak));

namespace rotcap::solver {
namespace {

TEST(BlasThreads, OpenBlasSetToTwoThreadsEndsOnOneAfterUseOneBlasThread) {
  if (openblas_set_num_threads == nullptr || openblas_get_num_threads == nullptr) {
    EXPECT_FALSE(use_one_blas_thread()) << "without OpenBLAS the call reports that it did nothing";
    GTEST_SKIP() << "the BLAS of this build is not OpenBLAS";
  }
  openblas_set_num_threads(2);
  EXPECT_TRUE(use_one_blas_thread());
  EXPECT_EQ(openblas_get_num_threads(), 1);
}

}  // namespace
}  // namespace rotcap::solver
