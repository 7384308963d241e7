#pragma once
// The batch runner: every case of a list as its own child process (`rotcap run`, see
// case_folder.hpp), at most `workers` at a time. A case that crashes, fails or is killed never stops
// the others. Cases whose folder is finished (case_folder.hpp) are skipped, so a batch that was
// killed (even with kill -9) loses only the cases that were running, and a rerun runs only those
// and the ones not started.
// While it runs it keeps the status table (status.csv in the batch folder: case, state, exit_code,
// reason, wall_s; rewritten atomically on every change) and prints a progress line with an ETA on
// every change. SIGINT / SIGTERM (app/interrupt.hpp) stop it from starting more cases and are
// passed on to the running ones (SIGTERM), which stop at their next converged step with
// stop_reason "interrupted" and are not counted finished.
#include "app/batch/case_folder.hpp"

#include <filesystem>
#include <iosfwd>
#include <string>
#include <vector>

namespace rotcap::app {

struct BatchOptions {
  int workers = 1;                 ///< child processes at a time, >= 1
  int threads_per_case = 1;        ///< OpenMP / BLAS threads of each child
  bool pdf = false;                ///< let each case print report.pdf (ROTCAP_NO_PDF otherwise)
  std::filesystem::path program;   ///< the binary to run (own_executable())
  std::filesystem::path status_csv;
  std::string label = "batch";     ///< opens every progress line
};

/// Runs the jobs; returns one outcome per job, in job order.
std::vector<CaseOutcome> run_batch(const std::vector<BatchJob>& jobs, const BatchOptions& options, std::ostream& progress);

/// Runs one job to its end in this thread (prepare, child, wait, marker): the MPI workers' unit.
CaseOutcome run_one_case(const BatchJob& job, const BatchOptions& options);

/// Writes status.csv of the outcomes (atomically).
void write_status_table(const std::vector<BatchJob>& jobs, const std::vector<CaseOutcome>& outcomes,
                        const std::filesystem::path& file);

/// The status table as aligned text (case, state, exit, wall, reason) for the console.
std::string status_table_text(const std::vector<BatchJob>& jobs, const std::vector<CaseOutcome>& outcomes);

}  // namespace rotcap::app
