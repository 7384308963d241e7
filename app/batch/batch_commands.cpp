#include "app/batch/batch_commands.hpp"

namespace rotcap::app {

bool BatchCommands::chosen() const { return (sweep && sweep->parsed()) || (study && study->parsed()); }

int BatchCommands::run() const {
  if (sweep && sweep->parsed()) return command_sweep(options);
  return command_study(options);
}

void add_batch_commands(CLI::App& cli, BatchCommands& c) {
  BatchCommandOptions& o = c.options;
  const auto common = [&](CLI::App* cmd) {
    cmd->add_option("-j,--workers", o.workers, "cases run at a time, each a child process (default: one per core)")
        ->check(CLI::Range(1, 1024));
    cmd->add_option("--threads", o.threads, "OpenMP and BLAS threads of each case (default 1)")->check(CLI::Range(1, 256));
    cmd->add_flag("--pdf", o.pdf, "let each case print report.pdf with chromium (default: report.html only)");
  };
  c.sweep = cli.add_subcommand("sweep", "run every case of a sweep plan (a base case and axes over its keys)");
  c.sweep->add_option("PLAN", o.file, "sweep plan (TOML)")->required();
  c.sweep->add_option("-o,--output", o.output,
                      "sweep folder (default: <plan stem>_results next to the plan; an existing one is resumed)");
  common(c.sweep);
  c.sweep->add_flag("--mpi", o.mpi, "hand the cases out over the MPI ranks (under mpirun; rank 0 dispatches)");
  c.study = cli.add_subcommand("study", "run the variants of a case (mesh, step, imperfection) and report R as a band");
  c.study->add_option("CASE", o.file, "case file (TOML) of a generated model")->required();
  c.study->add_option("-o,--output", o.output,
                      "study folder (default: <case stem>_study next to the case; an existing one is resumed)");
  common(c.study);
}

}  // namespace rotcap::app
