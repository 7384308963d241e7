#include "app/batch/batch_runner.hpp"

#include "app/interrupt.hpp"
#include "app/batch/csv_field.hpp"
#include "core/text_format.hpp"
#include "io/atomic_file.hpp"

#include <signal.h>

#include <algorithm>
#include <chrono>
#include <map>
#include <ostream>
#include <sstream>
#include <thread>

namespace rotcap::app {

namespace {

using Clock = std::chrono::steady_clock;

double seconds_since(Clock::time_point t) { return std::chrono::duration<double>(Clock::now() - t).count(); }

std::string clock_text(double s) {
  const long total = std::lround(std::max(0.0, s));
  return format_text("%ld:%02ld:%02ld", total / 3600, (total / 60) % 60, total % 60);
}

/// "[sweep] 3/6 finished (2 done, 1 failed), 2 running, 1 queued; elapsed 0:00:12, ETA 0:00:20"
std::string progress_line(const BatchOptions& o, const std::vector<CaseOutcome>& outcomes, Clock::time_point start,
                          double run_wall_sum, int run_finished) {
  int done = 0, failed = 0, running = 0, queued = 0;
  for (const CaseOutcome& c : outcomes) {
    done += c.state == CaseState::done;
    failed += c.state == CaseState::failed;
    running += c.state == CaseState::running;
    queued += c.state == CaseState::queued;
  }
  std::string line = format_text("[%s] %d/%zu finished (%d done, %d failed), %d running, %d queued; elapsed %s", o.label.c_str(),
                                 done + failed, outcomes.size(), done, failed, running, queued,
                                 clock_text(seconds_since(start)).c_str());
  if (run_finished > 0 && running + queued > 0) {
    // Cases still to run, each taking the mean wall time of those finished in this batch, shared
    // by the workers (the running ones counted as half done).
    const double mean = run_wall_sum / run_finished;
    const double left = (queued + 0.5 * running) * mean / std::max(1, o.workers);
    line += ", ETA " + clock_text(left);
  }
  return line;
}

}  // namespace

void write_status_table(const std::vector<BatchJob>& jobs, const std::vector<CaseOutcome>& outcomes,
                        const std::filesystem::path& file) {
  std::string text = "case,state,exit_code,reason,wall_s\n";
  for (std::size_t i = 0; i < jobs.size(); ++i) {
    const CaseOutcome& o = outcomes[i];
    text += csv_field(jobs[i].name) + "," + case_state_name(o.state) + "," +
            (o.exit_code ? std::to_string(*o.exit_code) : std::string()) + "," + csv_field(o.reason) + "," +
            (o.state == CaseState::done || o.state == CaseState::failed ? format_text("%.2f", o.wall_s) : std::string()) + "\n";
  }
  write_file_atomically(file, text);
}

std::string status_table_text(const std::vector<BatchJob>& jobs, const std::vector<CaseOutcome>& outcomes) {
  std::size_t width = 4;
  for (const BatchJob& j : jobs) width = std::max(width, j.name.size());
  std::ostringstream s;
  s << format_text("%-*s  %-7s  %4s  %9s  %s\n", int(width), "case", "state", "exit", "wall [s]", "reason");
  for (std::size_t i = 0; i < jobs.size(); ++i) {
    const CaseOutcome& o = outcomes[i];
    const std::string exit = o.exit_code ? std::to_string(*o.exit_code) : (o.signal ? "sig" + std::to_string(o.signal) : "");
    s << format_text("%-*s  %-7s  %4s  %9.1f  %s%s\n", int(width), jobs[i].name.c_str(), case_state_name(o.state), exit.c_str(),
                     o.wall_s, o.reason.c_str(), o.from_earlier_run ? " (earlier run)" : "");
  }
  return s.str();
}

CaseOutcome run_one_case(const BatchJob& job, const BatchOptions& options) {
  prepare_case_folder(job);
  const Clock::time_point start = Clock::now();
  const pid_t pid = start_child(case_child(job, options.program, options.threads_per_case, options.pdf));
  const ChildExit exit = wait_child(pid);
  return record_case_end(job, exit, seconds_since(start));
}

std::vector<CaseOutcome> run_batch(const std::vector<BatchJob>& jobs, const BatchOptions& options, std::ostream& progress) {
  std::vector<CaseOutcome> outcomes(jobs.size());
  std::vector<std::size_t> queue;
  for (std::size_t i = 0; i < jobs.size(); ++i) {
    if (std::optional<CaseOutcome> done = finished_outcome(jobs[i])) outcomes[i] = *done;
    else queue.push_back(i);
  }
  const std::size_t skipped = jobs.size() - queue.size();
  if (skipped > 0)
    progress << "[" << options.label << "] " << skipped << " of " << jobs.size()
             << " cases finished in an earlier run (skipped; delete a case's folder to run it again)\n";
  struct Running {
    std::size_t index;
    pid_t pid;
    Clock::time_point start;
  };
  std::vector<Running> running;
  const Clock::time_point start = Clock::now();
  double wall_sum = 0.0;
  int finished_here = 0;
  std::size_t next = 0;
  bool changed = true;
  bool forwarded = false;
  while (next < queue.size() || !running.empty()) {
    while (next < queue.size() && static_cast<int>(running.size()) < options.workers && !interrupt_requested()) {
      const std::size_t i = queue[next++];
      prepare_case_folder(jobs[i]);
      running.push_back({i, start_child(case_child(jobs[i], options.program, options.threads_per_case, options.pdf)), Clock::now()});
      outcomes[i].state = CaseState::running;
      changed = true;
    }
    if (interrupt_requested() && !forwarded) {
      // The rest stay queued; the running cases (own process groups: the terminal's signal did
      // not reach them) stop at their next converged step.
      next = queue.size();
      for (const Running& r : running) ::kill(r.pid, SIGTERM);
      forwarded = true;
    }
    for (auto it = running.begin(); it != running.end();) {
      if (const std::optional<ChildExit> exit = poll_child(it->pid)) {
        const double wall = seconds_since(it->start);
        outcomes[it->index] = record_case_end(jobs[it->index], *exit, wall);
        wall_sum += wall;
        ++finished_here;
        it = running.erase(it);
        changed = true;
      } else {
        ++it;
      }
    }
    if (changed) {
      write_status_table(jobs, outcomes, options.status_csv);
      progress << progress_line(options, outcomes, start, wall_sum, finished_here) << std::endl;
      changed = false;
    }
    if (!running.empty()) std::this_thread::sleep_for(std::chrono::milliseconds(100));
  }
  write_status_table(jobs, outcomes, options.status_csv);
  return outcomes;
}

}  // namespace rotcap::app
