// sweep --mpi: rank 0 dispatches case indices dynamically, the other ranks run them (see the header).
#include "app/batch/sweep_mpi.hpp"

#include "app/batch/batch_folder.hpp"
#include "app/batch/batch_runner.hpp"
#include "app/batch/sweep_setup.hpp"
#include "app/commands.hpp"
#include "app/interrupt.hpp"
#include "io/input_error.hpp"

#include <mpi.h>

#include <iostream>

namespace rotcap::app {

namespace {

constexpr int kTagAsk = 1;    ///< worker -> 0: {finished index or -1}
constexpr int kTagCase = 2;   ///< 0 -> worker: {index to run, or -1: stop}

/// MPI_Init on construction, MPI_Finalize on destruction (also when an exception leaves).
struct MpiSession {
  MpiSession() {
    int ready = 0;
    MPI_Initialized(&ready);
    if (!ready) MPI_Init(nullptr, nullptr);
  }
  ~MpiSession() {
    int done = 0;
    MPI_Finalized(&done);
    if (!done) MPI_Finalize();
  }
  MpiSession(const MpiSession&) = delete;
  MpiSession& operator=(const MpiSession&) = delete;
};

void worker(const SweepSetup& setup, const BatchCommandOptions& options) {
  BatchOptions batch;
  batch.threads_per_case = options.threads;
  batch.pdf = options.pdf;
  batch.program = own_executable();
  int finished = -1;
  for (;;) {
    MPI_Send(&finished, 1, MPI_INT, 0, kTagAsk, MPI_COMM_WORLD);
    int index = -1;
    MPI_Recv(&index, 1, MPI_INT, 0, kTagCase, MPI_COMM_WORLD, MPI_STATUS_IGNORE);
    if (index < 0) return;
    run_one_case(setup.jobs[static_cast<std::size_t>(index)], batch);
    finished = index;
  }
}

std::vector<CaseOutcome> dispatcher(const SweepSetup& setup, int ranks) {
  std::vector<CaseOutcome> outcomes(setup.jobs.size());
  std::vector<int> queue;
  for (std::size_t i = 0; i < setup.jobs.size(); ++i) {
    if (std::optional<CaseOutcome> done = finished_outcome(setup.jobs[i])) outcomes[i] = *done;
    else queue.push_back(static_cast<int>(i));
  }
  std::cout << "[sweep mpi] " << setup.jobs.size() << " cases, " << queue.size() << " to run on " << ranks - 1
            << " worker rank(s)\n";
  std::size_t next = 0, finished = 0;
  int active = ranks - 1;
  while (active > 0) {
    int index = -1;
    MPI_Status status;
    MPI_Recv(&index, 1, MPI_INT, MPI_ANY_SOURCE, kTagAsk, MPI_COMM_WORLD, &status);
    if (index >= 0) {
      const BatchJob& job = setup.jobs[static_cast<std::size_t>(index)];
      std::optional<CaseOutcome> o = recorded_outcome(job.folder);
      outcomes[static_cast<std::size_t>(index)] = o ? *o : CaseOutcome{CaseState::failed, std::nullopt, 0, "no batch_case.json", 0.0, false};
      ++finished;
      std::cout << "[sweep mpi] " << finished << "/" << queue.size() << " " << job.name << ": "
                << case_state_name(outcomes[static_cast<std::size_t>(index)].state) << " on rank " << status.MPI_SOURCE
                << "\n" << std::flush;
    }
    int reply = -1;
    if (next < queue.size() && !interrupt_requested()) {
      reply = queue[next++];
      outcomes[static_cast<std::size_t>(reply)].state = CaseState::running;
    } else {
      --active;
    }
    MPI_Send(&reply, 1, MPI_INT, status.MPI_SOURCE, kTagCase, MPI_COMM_WORLD);
    write_status_table(setup.jobs, outcomes, setup.folder / "status.csv");
  }
  for (std::size_t i = next; i < queue.size(); ++i) outcomes[static_cast<std::size_t>(queue[i])].state = CaseState::queued;
  return outcomes;
}

}  // namespace

bool mpi_built() { return true; }

int command_sweep_mpi(const BatchCommandOptions& options) {
  MpiSession session;
  int rank = 0, ranks = 1;
  MPI_Comm_rank(MPI_COMM_WORLD, &rank);
  MPI_Comm_size(MPI_COMM_WORLD, &ranks);
  // 1. Rank 0 reads the plan and makes the folder; a bad plan ends every rank with exit 2
  //    (broadcast: plan read, or kExitBadInput).
  SweepSetup setup;
  int setup_code = kExitOk;
  if (rank == 0) {
    try {
      setup = prepare_sweep(options, true);
    } catch (const InputError&) {
      setup_code = kExitBadInput;
      MPI_Bcast(&setup_code, 1, MPI_INT, 0, MPI_COMM_WORLD);
      throw;
    }
  }
  MPI_Bcast(&setup_code, 1, MPI_INT, 0, MPI_COMM_WORLD);
  if (setup_code != kExitOk) return setup_code;  // workers; rank 0 has thrown the message
  if (rank != 0) setup = prepare_sweep(options, false);
  // 2. The cases.
  if (ranks == 1) {
    return finish_sweep(setup, run_batch(setup.jobs, sweep_batch_options(options, setup), std::cout));
  }
  if (rank != 0) {
    worker(setup, options);
    return kExitOk;
  }
  const std::vector<CaseOutcome> outcomes = dispatcher(setup, ranks);
  // 3. The outputs, from rank 0 only.
  return finish_sweep(setup, outcomes);
}

}  // namespace rotcap::app
