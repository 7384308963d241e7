#pragma once
// Test helper: runs the rotcap binary as a user would and captures its exit code, stdout and
// stderr. The binary's path comes from the compile definition ROTCAP_EXE (tests/cli/CMakeLists.txt
// sets it to $<TARGET_FILE:rotcap>), scratch folders go under ROTCAP_CLI_SCRATCH (the test's
// build folder), and data files are found through ROTCAP_SOURCE_DIR (set by rotcap_test) or the
// working directory (the source root).

#include <sys/wait.h>

#include <cstdlib>
#include <filesystem>
#include <fstream>
#include <sstream>
#include <string>

#ifndef ROTCAP_EXE
#error "ROTCAP_EXE must name the rotcap binary"
#endif
#ifndef ROTCAP_CLI_SCRATCH
#error "ROTCAP_CLI_SCRATCH must name a scratch folder"
#endif

namespace rotcap::testing {

struct CommandOutcome {
  int exit_code = -1;  ///< the process's exit status, -1 if it did not exit normally
  std::string out;     ///< stdout
  std::string err;     ///< stderr
};

inline std::filesystem::path source_root() {
  const char* env = std::getenv("ROTCAP_SOURCE_DIR");
  return env ? std::filesystem::path(env) : std::filesystem::current_path();
}

/// A fresh, empty scratch folder for one test (removed first if a previous run left it).
inline std::filesystem::path scratch_folder(const std::string& name) {
  const std::filesystem::path p = std::filesystem::path(ROTCAP_CLI_SCRATCH) / name;
  std::filesystem::remove_all(p);
  std::filesystem::create_directories(p);
  return p;
}

inline std::string read_text(const std::filesystem::path& path) {
  std::ifstream in(path);
  std::ostringstream s;
  s << in.rdbuf();
  return s.str();
}

/// Runs `rotcap ARGS` (ARGS already shell-quoted where needed) with stdout and stderr sent to
/// files in `scratch`.
inline CommandOutcome run_rotcap(const std::string& args, const std::filesystem::path& scratch) {
  const std::filesystem::path out = scratch / "stdout.txt", err = scratch / "stderr.txt";
  const std::string command = std::string("OPENBLAS_NUM_THREADS=1 '") + ROTCAP_EXE + "' " + args + " >'" + out.string() + "' 2>'" +
                              err.string() + "'";
  const int status = std::system(command.c_str());
  CommandOutcome r;
  r.exit_code = (status != -1 && WIFEXITED(status)) ? WEXITSTATUS(status) : -1;
  r.out = read_text(out);
  r.err = read_text(err);
  return r;
}

}  // namespace rotcap::testing
