// sweep --mpi in a build without MPI (CMake option ROTCAP_MPI off or MPI not found).
#include "app/batch/sweep_mpi.hpp"

#include "io/input_error.hpp"

namespace rotcap::app {

bool mpi_built() { return false; }

int command_sweep_mpi(const BatchCommandOptions& options) {
  throw InputError(options.file, 0, "--mpi", "a rotcap built without MPI (CMake option ROTCAP_MPI off or MPI not found)",
                   "a build with MPI (Debian: apt-get install libopenmpi-dev, then configure again), or run without --mpi");
}

}  // namespace rotcap::app
