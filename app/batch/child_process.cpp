#include "app/batch/child_process.hpp"

#include <fcntl.h>
#include <signal.h>
#include <sys/prctl.h>
#include <sys/wait.h>
#include <unistd.h>

#include <cerrno>
#include <cstring>
#include <stdexcept>

extern char** environ;

namespace rotcap::app {

namespace {

ChildExit from_status(int status) {
  ChildExit e;
  if (WIFEXITED(status)) e.exit_code = WEXITSTATUS(status);
  else if (WIFSIGNALED(status)) e.signal = WTERMSIG(status);
  return e;
}

}  // namespace

std::string ChildExit::describe() const {
  if (signal == 0) return "exit code " + std::to_string(exit_code);
  const char* name = strsignal(signal);
  return "killed by signal " + std::to_string(signal) + (name ? std::string(" (") + name + ")" : std::string());
}

std::filesystem::path own_executable() { return std::filesystem::read_symlink("/proc/self/exe"); }

pid_t start_child(const ChildSpec& spec) {
  // argv and envp before fork.
  std::vector<std::string> argv_text{spec.program.string()};
  argv_text.insert(argv_text.end(), spec.args.begin(), spec.args.end());
  std::vector<char*> argv;
  for (std::string& a : argv_text) argv.push_back(a.data());
  argv.push_back(nullptr);
  std::vector<std::string> env_text;
  for (char** e = environ; *e; ++e) {
    const std::string entry(*e);
    bool replaced = false;
    for (const auto& [name, value] : spec.env) replaced = replaced || entry.rfind(name + "=", 0) == 0;
    if (!replaced) env_text.push_back(entry);
  }
  for (const auto& [name, value] : spec.env) env_text.push_back(name + "=" + value);
  std::vector<char*> envp;
  for (std::string& e : env_text) envp.push_back(e.data());
  envp.push_back(nullptr);
  const int log = ::open(spec.log_file.c_str(), O_WRONLY | O_CREAT | O_TRUNC | O_CLOEXEC, 0644);
  if (log < 0) throw std::runtime_error("cannot open " + spec.log_file.string() + ": " + std::strerror(errno));
  const pid_t parent = ::getpid();
  const pid_t pid = ::fork();
  if (pid < 0) {
    const int err = errno;
    ::close(log);
    throw std::runtime_error(std::string("fork failed: ") + std::strerror(err));
  }
  if (pid == 0) {
    ::prctl(PR_SET_PDEATHSIG, SIGKILL);
    if (::getppid() != parent) ::_exit(127);  // the parent died before prctl took effect
    ::setpgid(0, 0);  // signals from the terminal reach the batch only, which passes on one
    ::dup2(log, STDOUT_FILENO);
    ::dup2(log, STDERR_FILENO);
    ::execve(argv[0], argv.data(), envp.data());
    const char* msg = "batch runner: execve failed: ";
    ssize_t ignored = ::write(STDERR_FILENO, msg, std::strlen(msg));
    const char* why = std::strerror(errno);
    ignored = ::write(STDERR_FILENO, why, std::strlen(why));
    (void)ignored;
    ::_exit(127);
  }
  ::close(log);
  return pid;
}

std::optional<ChildExit> poll_child(pid_t pid) {
  int status = 0;
  pid_t r;
  do r = ::waitpid(pid, &status, WNOHANG);
  while (r < 0 && errno == EINTR);
  if (r == 0) return std::nullopt;
  if (r < 0) throw std::runtime_error(std::string("waitpid failed: ") + std::strerror(errno));
  return from_status(status);
}

ChildExit wait_child(pid_t pid) {
  int status = 0;
  pid_t r;
  do r = ::waitpid(pid, &status, 0);
  while (r < 0 && errno == EINTR);
  if (r < 0) throw std::runtime_error(std::string("waitpid failed: ") + std::strerror(errno));
  return from_status(status);
}

}  // namespace rotcap::app
