// rotcap sweep PLAN.toml: every case of a sweep plan, each a `rotcap run` child process.
#include "app/batch/batch_commands.hpp"
#include "app/batch/batch_folder.hpp"
#include "app/batch/batch_runner.hpp"
#include "app/batch/sweep_mpi.hpp"
#include "app/batch/sweep_setup.hpp"

#include <iostream>

namespace rotcap::app {

int command_sweep(const BatchCommandOptions& options) {
  if (options.mpi) return command_sweep_mpi(options);
  // 1. The plan, every case validated, before anything runs or is written.
  const SweepSetup setup = prepare_sweep(options);
  // 2. The cases, N at a time; finished ones (an earlier run) are skipped.
  const BatchOptions batch = sweep_batch_options(options, setup);
  std::cout << "[sweep] " << setup.jobs.size() << " cases from " << options.file.string() << " into "
            << setup.folder.string() << ", " << batch.workers << " at a time, " << batch.threads_per_case
            << " thread(s) each\n";
  const std::vector<CaseOutcome> outcomes = run_batch(setup.jobs, batch, std::cout);
  // 3. results.csv, the plots, index.html.
  return finish_sweep(setup, outcomes);
}

}  // namespace rotcap::app
