#pragma once
// One child process of the batch runner: fork + execve of a program with its stdout and stderr
// sent to a log file and some environment variables set; waited for with waitpid.
// Contracts:
//  - The child dies with its parent (prctl PR_SET_PDEATHSIG, SIGKILL, Linux): a batch killed with
//    kill -9 leaves no case running that a rerun could collide with.
//  - The child runs in a process group of its own, so Ctrl-C at the terminal reaches the parent
//    only (which decides what to pass on) and never counts as a second signal in the child.
//  - Everything the child needs (argv, envp, the log's descriptor) is made before fork; between
//    fork and exec only async-signal-safe calls run.
//  - start_child throws std::runtime_error when the log cannot be opened or fork fails; a program
//    that cannot be executed shows as exit code 127 with the reason in the log.
#include <sys/types.h>

#include <filesystem>
#include <optional>
#include <string>
#include <utility>
#include <vector>

namespace rotcap::app {

struct ChildSpec {
  std::filesystem::path program;
  std::vector<std::string> args;                            ///< without argv[0]
  std::vector<std::pair<std::string, std::string>> env;     ///< set (or replaced) in the child
  std::filesystem::path log_file;                           ///< stdout and stderr, truncated
};

struct ChildExit {
  int exit_code = -1;  ///< the exit status, -1 when a signal ended the child
  int signal = 0;      ///< the signal that ended it, 0 when it exited
  /// "exit code 3" or "killed by signal 9 (Killed)".
  std::string describe() const;
};

/// The running program's own binary (/proc/self/exe resolved).
std::filesystem::path own_executable();

pid_t start_child(const ChildSpec& spec);
/// The child's end if it has ended (waitpid WNOHANG), else nothing.
std::optional<ChildExit> poll_child(pid_t pid);
/// Waits for the child's end.
ChildExit wait_child(pid_t pid);

}  // namespace rotcap::app
