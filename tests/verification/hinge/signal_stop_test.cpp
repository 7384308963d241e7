// SIGTERM during a hinge run: the run stops at its next converged step, writes every output with
// stop_reason "interrupted" and exits with 3 (app/interrupt.hpp). The run is the demo girder at half
// its mesh (a run of a minute or more), signalled once its curve.csv holds a few converged steps.
#include "tests/verification/hinge/hinge_run.hpp"

#include <gtest/gtest.h>

#include <chrono>
#include <csignal>
#include <fstream>
#include <sstream>
#include <sys/wait.h>
#include <thread>
#include <unistd.h>

namespace rotcap::testing {
namespace {

namespace fs = std::filesystem;

int curve_rows(const fs::path& csv) {
  std::ifstream in(csv);
  int rows = 0;
  for (std::string line; std::getline(in, line);) ++rows;
  return rows - 1;  // the header
}

TEST(SignalStop, SigtermStopsAtAConvergedStepWithEveryOutputAndExitThree) {
  const fs::path folder = scratch_folder("signal_stop");
  const fs::path results = folder / "results";
  const std::string exe = ROTCAP_EXE, out = (folder / "out.txt").string();
  const pid_t pid = fork();
  ASSERT_GE(pid, 0);
  if (pid == 0) {
    setenv("OPENBLAS_NUM_THREADS", "1", 1);
    std::freopen(out.c_str(), "w", stdout);
    std::freopen(out.c_str(), "a", stderr);
    execl(exe.c_str(), exe.c_str(), "demo", "-o", results.c_str(), "--mesh-scale", "0.5", "--threads", "1",
          static_cast<char*>(nullptr));
    _exit(127);
  }
  // Wait for three converged steps (the unloaded state is row 0), at most 120 s.
  const auto t0 = std::chrono::steady_clock::now();
  while (curve_rows(results / "curve.csv") < 4 &&
         std::chrono::steady_clock::now() - t0 < std::chrono::seconds(120))
    std::this_thread::sleep_for(std::chrono::milliseconds(100));
  ASSERT_GE(curve_rows(results / "curve.csv"), 4) << read_text(out);
  kill(pid, SIGTERM);
  int status = 0;
  waitpid(pid, &status, 0);
  ASSERT_TRUE(WIFEXITED(status)) << "ended by a signal: " << read_text(out);
  EXPECT_EQ(WEXITSTATUS(status), 3) << read_text(out);
  const nlohmann::json s = read_json(results / "summary.json");
  EXPECT_EQ(s["stop_reason"], "interrupted");
  EXPECT_TRUE(s.contains("m_max_kNm"));
  // Whole rows only, and the pvd names only files that exist.
  const CurveTable curve = read_curve(results / "curve.csv");
  for (const auto& row : curve.rows) EXPECT_EQ(row.size(), curve.columns.size());
  std::istringstream pvd(read_text(results / "fields.pvd"));
  int datasets = 0;
  for (std::string line; std::getline(pvd, line);) {
    const std::size_t f = line.find("file=\"");
    if (f == std::string::npos) continue;
    const std::string file = line.substr(f + 6, line.find('"', f + 6) - f - 6);
    EXPECT_TRUE(fs::exists(results / file)) << file;
    ++datasets;
  }
  EXPECT_GE(datasets, 2);
  EXPECT_NE(read_text(results / "run.log").find("stopped: interrupted"), std::string::npos);
}

}  // namespace
}  // namespace rotcap::testing
