// rotcap sweep end to end: six built-in sections on two workers, killed with kill -9 and resumed;
// every row of results.csv against the case's own `rotcap run`; a case that fails mid-run.
#include "tests/batch/batch_test_support.hpp"

#include <gtest/gtest.h>

#include <chrono>
#include <cstdlib>
#include <set>
#include <thread>

namespace fs = std::filesystem;
using namespace rotcap::testing;

namespace {

const fs::path kData = source_root() / "tests/data/batch";

/// results.csv columns read from summary.json, as the README lists them.
const std::vector<std::string> kSummaryColumns = {
    "mp_kNm", "m_max_kNm", "m_max_over_mp", "theta_at_m_max_mrad", "theta_p_mrad", "theta_p_beam_mrad",
    "theta_u_mrad", "rotation_capacity", "rotation_capacity_is_lower_bound", "available_plastic_rotation_mrad"};

int count_finished(const fs::path& status_csv) {
  int n = 0;
  for (const CsvRow& r : read_csv_rows(status_csv)) n += r.at("state") == "done" || r.at("state") == "failed";
  return n;
}

}  // namespace

TEST(Sweep, KilledSweepRerunsOnlyUnfinishedCasesAndEveryRowEqualsTheCasesOwnRun) {
  ::setenv("ROTCAP_NO_PDF", "1", 1);
  const fs::path scratch = scratch_folder("sweep_sections");
  const fs::path out = scratch / "sweep";
  const std::string plan = (kData / "sections_plan.toml").string();

  // 1. Start the sweep on two workers and kill -9 it once some, not all, cases have finished.
  const pid_t pid = start_rotcap({"sweep", plan, "-o", out.string(), "-j", "2"}, scratch / "first_run.txt");
  bool killed = false;
  int status = 0;
  for (int i = 0; i < 6000 && !killed; ++i) {
    std::this_thread::sleep_for(std::chrono::milliseconds(20));
    const int finished = fs::exists(out / "status.csv") ? count_finished(out / "status.csv") : 0;
    if (finished >= 1 && finished < 6) {
      ASSERT_EQ(::kill(pid, SIGKILL), 0);
      killed = true;
    } else if (::waitpid(pid, &status, WNOHANG) == pid) {
      FAIL() << "the sweep ended before it could be killed: " << read_text(scratch / "first_run.txt");
    }
  }
  ASSERT_TRUE(killed) << "no case finished within 120 s";
  ASSERT_EQ(::waitpid(pid, &status, 0), pid);
  ASSERT_TRUE(WIFSIGNALED(status) && WTERMSIG(status) == SIGKILL);
  // The running cases died with the sweep (no child is left writing into the folder).
  std::this_thread::sleep_for(std::chrono::milliseconds(300));
  EXPECT_EQ(processes_mentioning(out.string()), 0);
  std::map<std::string, std::string> finished_before;  // case -> its batch_case.json
  for (const auto& e : fs::directory_iterator(out / "cases"))
    if (fs::exists(e.path() / "batch_case.json"))
      finished_before[e.path().filename().string()] = read_text(e.path() / "batch_case.json");
  ASSERT_GE(finished_before.size(), 1u);
  ASSERT_LT(finished_before.size(), 6u);

  // 2. Rerun: only the unfinished cases run; the finished ones keep their marker byte for byte.
  const CommandOutcome rerun = run_rotcap("sweep '" + plan + "' -o '" + out.string() + "' -j 2", scratch);
  ASSERT_EQ(rerun.exit_code, 0) << rerun.out << rerun.err;
  EXPECT_NE(rerun.out.find(std::to_string(finished_before.size()) + " of 6 cases finished in an earlier run"), std::string::npos)
      << rerun.out;
  for (const auto& [name, marker] : finished_before)
    EXPECT_EQ(read_text(out / "cases" / name / "batch_case.json"), marker) << name << " was run again";
  const std::vector<CsvRow> status_rows = read_csv_rows(out / "status.csv");
  ASSERT_EQ(status_rows.size(), 6u);
  for (const CsvRow& r : status_rows) EXPECT_EQ(r.at("state"), "done") << r.at("case") << ": " << r.at("reason");

  // 3. Every row of results.csv equals the case's own `rotcap run` to the printed digits.
  const std::vector<CsvRow> rows = read_csv_rows(out / "results.csv");
  ASSERT_EQ(rows.size(), 6u);
  std::set<std::string> sections;
  for (const CsvRow& row : rows) {
    SCOPED_TRACE(row.at("case"));
    sections.insert(row.at("section.designation"));
    const fs::path own = scratch / "own" / row.at("case");
    const CommandOutcome run =
        run_rotcap("run '" + (out / row.at("folder") / "case.toml").string() + "' -o '" + own.string() + "' --threads 1 --quiet",
                   scratch);
    ASSERT_EQ(run.exit_code, 0) << run.err;
    const nlohmann::json summary = read_json(own / "summary.json");
    ASSERT_TRUE(summary.is_object());
    EXPECT_EQ(summary["input"]["section"]["designation"].get<std::string>(), row.at("section.designation"));
    for (const std::string& c : kSummaryColumns) EXPECT_EQ(row.at(c), printed(summary, c)) << c;
    for (const char* c : {"section_class", "flange_class", "web_class"})
      EXPECT_EQ(row.at(c), std::to_string(summary[c].get<int>())) << c;
    EXPECT_EQ(row.at("failure_mode"), summary["failure_mode"].get<std::string>());
    EXPECT_EQ(row.at("stop_reason"), summary["stop_reason"].get<std::string>());
    EXPECT_FALSE(row.at("flange_c_over_t").empty());
  }
  EXPECT_EQ(sections.size(), 6u);
  EXPECT_TRUE(fs::exists(out / "index.html"));
  EXPECT_NE(read_text(out / "index.html").find("cases/" + rows.front().at("case") + "/report.html"), std::string::npos);
  EXPECT_NE(read_text(out / "r_vs_flange_ct.svg").find("EN 1993-1-1:2005, Table 5.2"), std::string::npos);
}

TEST(Sweep, ACaseThatFailsMidRunIsRecordedFailedAndTheSweepGoesOn) {
  ::setenv("ROTCAP_NO_PDF", "1", 1);
  const fs::path scratch = scratch_folder("sweep_failing_case");
  const fs::path out = scratch / "sweep";
  const CommandOutcome r = run_rotcap("sweep '" + (kData / "failing_case_plan.toml").string() + "' -o '" + out.string() + "' -j 2", scratch);
  EXPECT_EQ(r.exit_code, 3) << r.out << r.err;
  const std::vector<CsvRow> rows = read_csv_rows(out / "results.csv");
  ASSERT_EQ(rows.size(), 2u);
  EXPECT_EQ(rows[0].at("state"), "done");
  EXPECT_EQ(rows[0].at("analysis.max_iterations"), "20");
  EXPECT_EQ(rows[1].at("state"), "failed");
  EXPECT_EQ(rows[1].at("exit_code"), "3");
  const nlohmann::json summary = read_json(out / rows[1].at("folder") / "summary.json");
  ASSERT_TRUE(summary.is_object());
  const std::string stop = summary["stop_reason"].get<std::string>();
  EXPECT_EQ(rows[1].at("stop_reason"), stop);
  EXPECT_NE(rows[1].at("reason").find(stop), std::string::npos) << rows[1].at("reason");
  EXPECT_NE(r.out.find("failed"), std::string::npos);
}

TEST(Sweep, SigtermStopsTheSweepAndTheRerunFinishesIt) {
  ::setenv("ROTCAP_NO_PDF", "1", 1);
  const fs::path scratch = scratch_folder("sweep_sigterm");
  const fs::path out = scratch / "sweep";
  const std::string plan = (kData / "sections_plan.toml").string();
  const pid_t pid = start_rotcap({"sweep", plan, "-o", out.string(), "-j", "2"}, scratch / "first_run.txt");
  bool running = false;
  for (int i = 0; i < 6000 && !running; ++i) {
    std::this_thread::sleep_for(std::chrono::milliseconds(10));
    if (fs::exists(out / "status.csv"))
      for (const CsvRow& r : read_csv_rows(out / "status.csv")) running = running || r.at("state") == "running";
  }
  ASSERT_TRUE(running);
  ASSERT_EQ(::kill(pid, SIGTERM), 0);
  int status = 0;
  ASSERT_EQ(::waitpid(pid, &status, 0), pid);
  ASSERT_TRUE(WIFEXITED(status)) << read_text(scratch / "first_run.txt");
  EXPECT_EQ(WEXITSTATUS(status), 3) << read_text(scratch / "first_run.txt");
  int done = 0;
  for (const CsvRow& r : read_csv_rows(out / "status.csv")) {
    done += r.at("state") == "done";
    // Stopped at a converged step, or ended by the signal when it came before the case had
    // installed its handler (the first moments of a run): either way not finished.
    if (r.at("state") == "failed") {
      EXPECT_TRUE(r.at("reason").find("interrupted") != std::string::npos || r.at("reason").find("signal 15") != std::string::npos)
          << r.at("reason");
    }
  }
  EXPECT_LT(done, 6);
  const CommandOutcome rerun = run_rotcap("sweep '" + plan + "' -o '" + out.string() + "' -j 2", scratch);
  ASSERT_EQ(rerun.exit_code, 0) << rerun.out << rerun.err;
  if (done > 0) {
    EXPECT_NE(rerun.out.find(std::to_string(done) + " of 6 cases finished in an earlier run"), std::string::npos) << rerun.out;
  }
  for (const CsvRow& r : read_csv_rows(out / "results.csv")) EXPECT_EQ(r.at("state"), "done") << r.at("case");
}
