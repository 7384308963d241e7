// Checkpoints and `rotcap resume` (app/run_checkpoint.hpp): a run stopped by SIGTERM or killed with
// SIGKILL at random moments, then resumed, must give the uninterrupted run's curve.csv to the bit;
// a finished run extended with --max-rotation must give the curve of a run made with that
// max_rotation from the start. The run is tests/data/hinge/class4_flange.toml (uniform moment on a
// slender-flange section, traced past its peak with negative pivots, about 2 s of path).
#include "tests/verification/hinge/hinge_run.hpp"

#include <gtest/gtest.h>

#include <chrono>
#include <memory>
#include <csignal>
#include <fstream>
#include <random>
#include <sstream>
#include <sys/wait.h>
#include <thread>
#include <unistd.h>

namespace rotcap::testing {
namespace {

namespace fs = std::filesystem;

/// Starts `rotcap ARGS...` in its own process group (so that a kill reaches the PDF printer too).
pid_t start_rotcap(const std::vector<std::string>& args, const fs::path& out) {
  const pid_t pid = fork();
  if (pid != 0) return pid;
  setpgid(0, 0);
  setenv("OPENBLAS_NUM_THREADS", "1", 1);
  setenv("OMP_NUM_THREADS", "1", 1);
  std::freopen(out.c_str(), "w", stdout);
  std::freopen(out.c_str(), "a", stderr);
  std::vector<char*> argv{const_cast<char*>(ROTCAP_EXE)};
  for (const std::string& a : args) argv.push_back(const_cast<char*>(a.c_str()));
  argv.push_back(nullptr);
  execv(ROTCAP_EXE, argv.data());
  _exit(127);
}

int wait_exit_code(pid_t pid) {
  int status = 0;
  waitpid(pid, &status, 0);
  return WIFEXITED(status) ? WEXITSTATUS(status) : -1;
}

/// What a stopped run must leave, whenever it stopped: whole curve rows, a collection naming only
/// files that exist, a summary that is valid JSON or absent.
void expect_consistent_folder(const fs::path& results, const std::string& context) {
  const std::string csv = read_text(results / "curve.csv");
  if (!csv.empty()) {
    EXPECT_EQ(csv.back(), '\n') << context << ": curve.csv ends in a partial row";
    std::istringstream lines(csv);
    std::string header, line;
    std::getline(lines, header);
    const auto commas = std::count(header.begin(), header.end(), ',');
    while (std::getline(lines, line)) EXPECT_EQ(std::count(line.begin(), line.end(), ','), commas) << context << ": " << line;
  }
  if (fs::exists(results / "fields.pvd"))
    for (const std::string& file : pvd_datasets(results / "fields.pvd"))
      EXPECT_TRUE(fs::exists(results / file)) << context << ": fields.pvd names a missing " << file;
  if (fs::exists(results / "summary.json")) {
    std::ifstream in(results / "summary.json");
    EXPECT_FALSE(nlohmann::json::parse(in, nullptr, false).is_discarded()) << context << ": summary.json is not JSON";
  }
}

/// Each test makes its own uninterrupted reference run (ctest runs the tests as separate processes,
/// possibly at the same time, so they share no folder).
/// Lines in a results folder's curve.csv so far (header included; 0 before it exists).
long curve_lines(const fs::path& results) {
  const std::string csv = read_text(results / "curve.csv");
  return std::count(csv.begin(), csv.end(), '\n');
}

/// `rotcap run` of the class4_flange case into results, started in the background.
pid_t start_class4_run(const fs::path& results, const fs::path& out) {
  return start_rotcap({"run", hinge_case("class4_flange.toml").string(), "-o", results.string(), "--threads", "1"}, out);
}

class Resume : public ::testing::Test {
 protected:
  void SetUp() override {
    const std::string test = ::testing::UnitTest::GetInstance()->current_test_info()->name();
    reference_ = std::make_unique<HingeRun>(
        run_rotcap("run", hinge_case("class4_flange.toml"), "resume_reference_" + test));
  }
  std::unique_ptr<HingeRun> reference_;
};

TEST_F(Resume, SigtermThenResumeGivesTheUninterruptedCurveToTheBit) {
  ASSERT_EQ(reference_->exit_code, 0) << reference_->err;
  const std::string reference_csv = read_text(reference_->results / "curve.csv");
  const fs::path scratch = scratch_folder("resume_sigterm"), results = scratch / "results";
  const pid_t pid = start_class4_run(results, scratch / "out.txt");
  const auto t0 = std::chrono::steady_clock::now();
  while (curve_lines(results) < 8 && std::chrono::steady_clock::now() - t0 < std::chrono::seconds(60))
    std::this_thread::sleep_for(std::chrono::milliseconds(20));
  kill(pid, SIGTERM);
  ASSERT_EQ(wait_exit_code(pid), 3) << read_text(scratch / "out.txt");
  EXPECT_EQ(read_json(results / "summary.json")["stop_reason"], "interrupted");
  EXPECT_NE(read_text(results / "curve.csv"), reference_csv) << "the run was not interrupted before its end";
  const pid_t resumed = start_rotcap({"resume", results.string()}, scratch / "resume.txt");
  ASSERT_EQ(wait_exit_code(resumed), 0) << read_text(scratch / "resume.txt");
  EXPECT_EQ(read_text(results / "curve.csv"), reference_csv);
  const nlohmann::json s = read_json(results / "summary.json"), r = read_json(reference_->results / "summary.json");
  EXPECT_EQ(s["m_max_kNm"], r["m_max_kNm"]);
  EXPECT_EQ(s["theta_u_mrad"], r["theta_u_mrad"]);
  EXPECT_EQ(s["solver"]["steps"], r["solver"]["steps"]);
  EXPECT_EQ(s["solver"]["iterations"], r["solver"]["iterations"]);
  EXPECT_TRUE(s.contains("resumed_from_step"));
  EXPECT_EQ(pvd_datasets(results / "fields.pvd"), pvd_datasets(reference_->results / "fields.pvd"));
  EXPECT_NE(read_text(results / "run.log").find("reproduced to the bit"), std::string::npos);
  expect_consistent_folder(results, "after resume");
}

TEST_F(Resume, KillNineAtTwentyRandomMomentsLeavesWholeFilesAndResumeFinishesTheSameCurve) {
  ASSERT_EQ(reference_->exit_code, 0) << reference_->err;
  const std::string reference_csv = read_text(reference_->results / "curve.csv");
  const double path_s = read_json(reference_->results / "summary.json")["solver"]["wall_s"].get<double>();
  const long steps = std::count(reference_csv.begin(), reference_csv.end(), '\n') - 2;  // header, step 0
  ASSERT_GE(steps, 4);
  // A random moment of the path: once curve.csv holds a random number of steps, plus a random part
  // of a step's time (so the kill falls anywhere in a step: solving, writing fields or checkpoint).
  std::mt19937 random(20261203);
  std::uniform_int_distribution<long> step_of(0, steps - 1);
  std::uniform_real_distribution<double> within(0.0, path_s / double(steps));
  int resumed = 0, finished_before_kill = 0;
  for (int trial = 0; trial < 20; ++trial) {
    const std::string context = "trial " + std::to_string(trial);
    const fs::path scratch = scratch_folder("resume_kill_" + std::to_string(trial)), results = scratch / "results";
    const long rows_wanted = step_of(random) + 2;
    const double delay = within(random);
    const pid_t pid = start_class4_run(results, scratch / "out.txt");
    const auto t0 = std::chrono::steady_clock::now();
    // Before the start checkpoint (written after step 0's row and fields) there is nothing to resume.
    while ((curve_lines(results) < rows_wanted || !fs::exists(results / "checkpoint.h5")) &&
           std::chrono::steady_clock::now() - t0 < std::chrono::seconds(60))
      std::this_thread::sleep_for(std::chrono::milliseconds(2));
    std::this_thread::sleep_for(std::chrono::duration<double>(delay));
    kill(-pid, SIGKILL);
    wait_exit_code(pid);
    expect_consistent_folder(results, context + " after kill -9");
    if (fs::exists(results / "summary.json")) {  // the path had ended; the report was being made
      ++finished_before_kill;
      EXPECT_EQ(read_text(results / "curve.csv"), reference_csv) << context;
      continue;
    }
    const pid_t again = start_rotcap({"resume", results.string()}, scratch / "resume.txt");
    ASSERT_EQ(wait_exit_code(again), 0) << context << ": " << read_text(scratch / "resume.txt");
    EXPECT_EQ(read_text(results / "curve.csv"), reference_csv) << context;
    expect_consistent_folder(results, context + " after resume");
    ++resumed;
    fs::remove_all(scratch);
  }
  std::printf("kill -9 trials: 20, resumed %d, killed after the path had ended %d\n", resumed, finished_before_kill);
  EXPECT_GE(resumed, 15);
}

TEST(ResumeExtension, FinishedRunExtendedWithLargerMaxRotationEqualsARunMadeWithIt) {
  // class4_flange stops below 0.05 rad on its falling branch; class1_hardening stops at max_rotation.
  const fs::path scratch = scratch_folder("resume_extend");
  const std::string text = read_text(hinge_case("class1_hardening.toml"));
  const std::string key = "max_rotation = 0.024";
  ASSERT_NE(text.find(key), std::string::npos);
  std::string longer = text;
  longer.replace(longer.find(key), key.size(), "max_rotation = 0.036");
  std::ofstream(scratch / "long.toml") << longer;
  const HingeRun whole = run_rotcap("run", scratch / "long.toml", "resume_extend_whole");
  ASSERT_EQ(whole.exit_code, 0) << whole.err;
  const HingeRun first = run_rotcap("run", hinge_case("class1_hardening.toml"), "resume_extend_first");
  ASSERT_EQ(first.exit_code, 0) << first.err;
  const pid_t refused = start_rotcap({"resume", first.results.string()}, scratch / "refused.txt");
  EXPECT_EQ(wait_exit_code(refused), 2);
  EXPECT_NE(read_text(scratch / "refused.txt").find("--max-rotation"), std::string::npos) << read_text(scratch / "refused.txt");
  const pid_t extended = start_rotcap({"resume", first.results.string(), "--max-rotation", "0.036"}, scratch / "extended.txt");
  ASSERT_EQ(wait_exit_code(extended), 0) << read_text(scratch / "extended.txt");
  EXPECT_EQ(read_text(first.results / "curve.csv"), read_text(whole.results / "curve.csv"));
  const nlohmann::json s = read_json(first.results / "summary.json");
  EXPECT_EQ(s["stop_reason"], "rotation reached max_rotation");
  EXPECT_EQ(s["input"]["analysis"]["max_rotation"], 0.036);
}

TEST_F(Resume, RunKilledAfterItsLastStepBeforeItsOutputsOnlyWritesThem) {
  // The last checkpoint holds the step at which the stop criterion was met; a kill before
  // summary.json leaves the run finished in all but its outputs. Resume must take no further step.
  ASSERT_EQ(reference_->exit_code, 0) << reference_->err;
  const fs::path scratch = scratch_folder("resume_outputs_only");
  fs::copy(reference_->results, scratch / "results", fs::copy_options::recursive);
  for (const char* name : {"summary.json", "report.html", "report.pdf", "curve.svg", "hinge_law.csv"})
    fs::remove(scratch / "results" / name);
  const pid_t resumed = start_rotcap({"resume", (scratch / "results").string()}, scratch / "resume.txt");
  ASSERT_EQ(wait_exit_code(resumed), 0) << read_text(scratch / "resume.txt");
  EXPECT_EQ(read_text(scratch / "results" / "curve.csv"), read_text(reference_->results / "curve.csv"));
  const nlohmann::json s = read_json(scratch / "results" / "summary.json"), r = read_json(reference_->results / "summary.json");
  EXPECT_EQ(s["stop_reason"], r["stop_reason"]);
  EXPECT_EQ(s["m_max_kNm"], r["m_max_kNm"]);
  EXPECT_EQ(s["solver"]["steps"], r["solver"]["steps"]);
  EXPECT_NE(read_text(scratch / "results" / "run.log").find("writing its outputs"), std::string::npos);
}

TEST_F(Resume, DamagedCheckpointOrChangedCaseIsBadInputNamingTheFile) {
  const fs::path scratch = scratch_folder("resume_bad");
  fs::create_directories(scratch / "empty");
  const pid_t none = start_rotcap({"resume", (scratch / "empty").string()}, scratch / "none.txt");
  EXPECT_EQ(wait_exit_code(none), 2);
  EXPECT_NE(read_text(scratch / "none.txt").find("checkpoint.h5"), std::string::npos) << read_text(scratch / "none.txt");
  // A copy of the reference folder whose checkpoint has 16 bytes changed half way through (in the
  // arrays of the state).
  fs::copy(reference_->results, scratch / "damaged", fs::copy_options::recursive);
  {
    const auto middle = static_cast<std::streamoff>(fs::file_size(scratch / "damaged" / "checkpoint.h5") / 2);
    std::fstream f(scratch / "damaged" / "checkpoint.h5", std::ios::in | std::ios::out | std::ios::binary);
    f.seekp(middle);
    f.write("damaged damaged ", 16);
  }
  fs::remove(scratch / "damaged" / "summary.json");
  const pid_t damaged = start_rotcap({"resume", (scratch / "damaged").string()}, scratch / "damaged.txt");
  EXPECT_EQ(wait_exit_code(damaged), 2) << read_text(scratch / "damaged.txt");
  EXPECT_NE(read_text(scratch / "damaged.txt").find("checkpoint.h5: found an unreadable array"), std::string::npos)
      << read_text(scratch / "damaged.txt");
  // A case file edited after the run began: the checkpoint no longer describes it.
  fs::copy_file(hinge_case("elastic_cantilever.toml"), scratch / "edited.toml");
  const HingeRun run = run_rotcap("run", scratch / "edited.toml", "resume_bad_edited");
  ASSERT_EQ(run.exit_code, 0) << run.err;
  std::ofstream(scratch / "edited.toml", std::ios::app) << "\n# edited\n";
  fs::remove(run.results / "summary.json");
  const pid_t edited = start_rotcap({"resume", run.results.string()}, scratch / "edited.txt");
  EXPECT_EQ(wait_exit_code(edited), 2);
  EXPECT_NE(read_text(scratch / "edited.txt").find("edited.toml: found a case file that is missing or changed"),
            std::string::npos) << read_text(scratch / "edited.txt");
}

}  // namespace
}  // namespace rotcap::testing

namespace rotcap::testing {
namespace {

TEST(ResumeGeneral, GeneralModelStoppedBySigtermResumesToTheUninterruptedCurve) {
  // tests/data/nonlinear/cutback.toml: a Gmsh strip under load control with cut-backs (6 steps).
  const fs::path case_file = source_path("tests/data/nonlinear/cutback.toml");
  const HingeRun whole = run_rotcap("run", case_file, "resume_general_whole");
  ASSERT_EQ(whole.exit_code, 0) << whole.err;
  const fs::path scratch = scratch_folder("resume_general"), results = scratch / "results";
  const pid_t pid = start_rotcap({"run", case_file.string(), "-o", results.string(), "--threads", "1"},
                                 scratch / "out.txt");
  const auto t0 = std::chrono::steady_clock::now();
  while (!fs::exists(results / "curve.csv") && std::chrono::steady_clock::now() - t0 < std::chrono::seconds(60))
    std::this_thread::sleep_for(std::chrono::milliseconds(1));
  kill(pid, SIGTERM);  // stops at the next converged step
  ASSERT_EQ(wait_exit_code(pid), 3) << read_text(scratch / "out.txt");
  EXPECT_NE(read_text(results / "curve.csv"), read_text(whole.results / "curve.csv"));
  const pid_t resumed = start_rotcap({"resume", results.string()}, scratch / "resume.txt");
  ASSERT_EQ(wait_exit_code(resumed), 0) << read_text(scratch / "resume.txt");
  EXPECT_EQ(read_text(results / "curve.csv"), read_text(whole.results / "curve.csv"));
  EXPECT_EQ(read_json(results / "summary.json")["stop_reason"], read_json(whole.results / "summary.json")["stop_reason"]);
  // A run that finished needs no resume: refused, naming the stop reason.
  const pid_t again = start_rotcap({"resume", results.string()}, scratch / "again.txt");
  EXPECT_EQ(wait_exit_code(again), 2);
  EXPECT_NE(read_text(scratch / "again.txt").find("finished"), std::string::npos) << read_text(scratch / "again.txt");
}

TEST(ResumeGeneral, CheckpointEveryZeroWritesNoCheckpointAndResumeSaysSo) {
  const fs::path scratch = scratch_folder("resume_general_none");
  fs::copy_file(source_path("tests/data/nonlinear/strip.msh"), scratch / "strip.msh");
  std::string text = read_text(source_path("tests/data/nonlinear/cutback.toml"));
  ASSERT_NE(text.find("[output]"), std::string::npos);
  text.replace(text.find("[output]"), 8, "[output]\ncheckpoint_every = 0");
  std::ofstream(scratch / "none.toml") << text;
  const HingeRun run = run_rotcap("run", scratch / "none.toml", "resume_general_none_run");
  ASSERT_EQ(run.exit_code, 0) << run.err;
  EXPECT_FALSE(fs::exists(run.results / "checkpoint.h5"));
  EXPECT_EQ(read_json(run.results / "summary.json")["input"]["output"]["checkpoint_every"], 0);
  const pid_t resumed = start_rotcap({"resume", run.results.string()}, scratch / "resume.txt");
  EXPECT_EQ(wait_exit_code(resumed), 2);
  EXPECT_NE(read_text(scratch / "resume.txt").find("no checkpoint.h5 in the folder"), std::string::npos)
      << read_text(scratch / "resume.txt");
}

}  // namespace
}  // namespace rotcap::testing
