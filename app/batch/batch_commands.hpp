#pragma once
// `rotcap sweep PLAN.toml` and `rotcap study CASE.toml`: many runs of `rotcap run` as child
// processes (app/batch/batch_runner.hpp). Registered on the command line by add_batch_commands;
// main runs the chosen one. Exit codes: 0 every case done; 2 bad plan or case (before any run);
// 3 some case failed or the batch was interrupted (every other result kept); 1 internal error.
#include <CLI/CLI.hpp>

#include <filesystem>
#include <optional>

namespace rotcap::app {

struct BatchCommandOptions {
  std::filesystem::path file;                   ///< PLAN.toml (sweep) or CASE.toml (study)
  std::optional<std::filesystem::path> output;  ///< -o DIR
  int workers = 0;                              ///< child processes at a time; 0: one per core
  int threads = 1;                              ///< threads of each child
  bool mpi = false;                             ///< sweep --mpi
  bool pdf = false;                             ///< --pdf: each case prints its report.pdf
};

struct BatchCommands {
  CLI::App* sweep = nullptr;
  CLI::App* study = nullptr;
  BatchCommandOptions options;
  /// Whether one of the two was chosen on the command line (after parsing).
  bool chosen() const;
  /// Runs the chosen one; its exit code.
  int run() const;
};

void add_batch_commands(CLI::App& cli, BatchCommands& commands);

int command_sweep(const BatchCommandOptions& options);
int command_study(const BatchCommandOptions& options);

}  // namespace rotcap::app
