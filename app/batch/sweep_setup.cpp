#include "app/batch/sweep_setup.hpp"

#include "app/batch/batch_folder.hpp"
#include "app/batch/batch_runner.hpp"
#include "app/batch/sweep_pages.hpp"
#include "app/batch/sweep_results.hpp"
#include "app/commands.hpp"
#include "io/atomic_file.hpp"

#include <iostream>

namespace rotcap::app {

SweepSetup prepare_sweep(const BatchCommandOptions& options, bool create_folder) {
  SweepSetup s;
  s.plan = read_sweep_plan(options.file);
  s.cases = expand_sweep_plan(s.plan);
  if (create_folder) {
    s.folder = open_batch_folder(options.file, options.output, "_results");
  } else {
    const std::filesystem::path& in = options.file;
    s.folder = options.output ? *options.output : (in.has_parent_path() ? in.parent_path() : ".") / (in.stem().string() + "_results");
  }
  for (const PlannedCase& c : s.cases) s.jobs.push_back({c.name, s.folder / "cases" / c.name, c.case_text});
  return s;
}

int finish_sweep(const SweepSetup& s, const std::vector<CaseOutcome>& outcomes) {
  std::vector<SweepRow> rows;
  bool all_done = true;
  for (std::size_t i = 0; i < s.cases.size(); ++i) {
    rows.push_back(sweep_row(s.cases[i], s.jobs[i].folder, outcomes[i]));
    all_done = all_done && outcomes[i].state == CaseState::done;
  }
  write_status_table(s.jobs, outcomes, s.folder / "status.csv");
  write_file_atomically(s.folder / "results.csv", sweep_results_csv(s.plan, rows));
  write_sweep_pages(s.plan, rows, s.folder);
  std::cout << status_table_text(s.jobs, outcomes);
  std::cout << "results: " << (s.folder / "results.csv").string() << ", " << (s.folder / "index.html").string() << "\n";
  return all_done ? kExitOk : kExitStoppedEarly;
}

BatchOptions sweep_batch_options(const BatchCommandOptions& options, const SweepSetup& setup) {
  BatchOptions batch;
  batch.workers = worker_count(options.workers);
  batch.threads_per_case = options.threads;
  batch.pdf = options.pdf;
  batch.program = own_executable();
  batch.status_csv = setup.folder / "status.csv";
  batch.label = "sweep";
  return batch;
}

}  // namespace rotcap::app
