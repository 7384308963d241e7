#pragma once
// The parts of `rotcap sweep` that the single-machine and the MPI runs share: reading and
// expanding the plan (every case validated before anything runs), the sweep folder and its jobs,
// and the outputs once the cases have ended (results.csv, status.csv, the plots and index.html).
#include "app/batch/batch_commands.hpp"
#include "app/batch/batch_runner.hpp"
#include "app/batch/case_folder.hpp"
#include "io/sweep_plan.hpp"

#include <filesystem>
#include <vector>

namespace rotcap::app {

struct SweepSetup {
  SweepPlan plan;
  std::vector<PlannedCase> cases;
  std::filesystem::path folder;
  std::vector<BatchJob> jobs;  ///< one per case, same order
};

/// The plan read and expanded (InputError on a bad plan). create_folder: make and lock the
/// sweep folder (rank 0 and single-machine runs); the MPI workers only compute its path.
SweepSetup prepare_sweep(const BatchCommandOptions& options, bool create_folder = true);

/// The runner options of a sweep's cases on this machine (workers, threads, PDF, status.csv).
BatchOptions sweep_batch_options(const BatchCommandOptions& options, const SweepSetup& setup);

/// Writes results.csv, status.csv, the plots and index.html; prints the status table; returns
/// the exit code (0 every case done, 3 otherwise).
int finish_sweep(const SweepSetup& setup, const std::vector<CaseOutcome>& outcomes);

}  // namespace rotcap::app
