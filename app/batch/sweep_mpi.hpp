#pragma once
// `rotcap sweep PLAN.toml --mpi` under mpirun: the same cases, folders and outputs as a sweep on
// one machine, spread over the MPI ranks. Rank 0 reads the plan (every case validated first),
// makes the sweep folder, and hands out case indices one at a time to whichever worker rank asks
// next (dynamic dispatch: MPI_Recv from any source); each worker rank runs its case as a `rotcap
// run` child process with the same runner as a single machine (run_one_case) and reports back.
// Rank 0 then writes results.csv, status.csv, the plots and index.html. With one rank, rank 0
// runs the cases itself (--workers at a time). The sweep folder must be on a file system that
// every rank sees (the same path on every machine). No other communication: MPI messages only.
// Built only with the CMake option ROTCAP_MPI (ON when MPI is found); otherwise --mpi is an
// input error (exit 2) saying so.
#include "app/batch/batch_commands.hpp"

namespace rotcap::app {

/// Whether this binary was built with MPI.
bool mpi_built();

int command_sweep_mpi(const BatchCommandOptions& options);

}  // namespace rotcap::app
