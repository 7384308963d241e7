#include "app/report_pdf.hpp"

#include "core/text_format.hpp"

#include <fcntl.h>
#include <signal.h>
#include <sys/wait.h>
#include <unistd.h>

#include <chrono>
#include <cstdlib>
#include <system_error>
#include <thread>
#include <vector>

namespace rotcap::app {

namespace fs = std::filesystem;

std::optional<fs::path> find_on_path(const std::string& name) {
  const char* path = std::getenv("PATH");
  if (path == nullptr) return std::nullopt;
  const std::string all = path;
  for (std::size_t start = 0; start <= all.size();) {
    const std::size_t end = std::min(all.find(':', start), all.size());
    const fs::path candidate = fs::path(all.substr(start, end - start)) / name;
    std::error_code ec;
    if (end > start && fs::is_regular_file(candidate, ec) && ::access(candidate.c_str(), X_OK) == 0) return candidate;
    start = end + 1;
  }
  return std::nullopt;
}

namespace {

/// Runs argv[0] with argv (no shell), output to /dev/null, in its own process group; the exit code,
/// or -1 when it could not start, was killed by a signal or ran past timeout_s (then killed).
int run_with_timeout(const std::vector<std::string>& args, double timeout_s, bool& timed_out) {
  std::vector<char*> argv;
  for (const std::string& a : args) argv.push_back(const_cast<char*>(a.c_str()));
  argv.push_back(nullptr);
  const pid_t pid = ::fork();
  if (pid < 0) return -1;
  if (pid == 0) {
    ::setpgid(0, 0);
    const int null = ::open("/dev/null", O_RDWR);
    if (null >= 0) ::dup2(null, 0), ::dup2(null, 1), ::dup2(null, 2);
    ::execv(argv[0], argv.data());
    ::_exit(127);
  }
  ::setpgid(pid, pid);  // also here, so the group exists before any kill below
  const auto deadline = std::chrono::steady_clock::now() + std::chrono::duration<double>(timeout_s);
  timed_out = false;
  int status = 0;
  for (;;) {
    const pid_t done = ::waitpid(pid, &status, WNOHANG);
    if (done == pid) break;
    if (done < 0) return -1;
    if (std::chrono::steady_clock::now() > deadline) {
      ::kill(-pid, SIGKILL);
      ::waitpid(pid, &status, 0);
      timed_out = true;
      return -1;
    }
    std::this_thread::sleep_for(std::chrono::milliseconds(50));
  }
  ::kill(-pid, SIGKILL);  // helpers Chromium may have left in its group
  return WIFEXITED(status) ? WEXITSTATUS(status) : -1;
}

}  // namespace

std::optional<fs::path> pdf_printer() {
  const char* off = std::getenv("ROTCAP_NO_PDF");
  if (off && *off) return std::nullopt;
  return find_on_path("chromium");
}

PdfResult print_report_pdf(const fs::path& html, const fs::path& pdf, double timeout_s) {
  std::error_code ec;
  fs::remove(pdf, ec);
  const auto chromium = pdf_printer();
  if (!chromium)
    return {PdfResult::Status::no_chromium, find_on_path("chromium")
                                                ? "report.pdf not made: ROTCAP_NO_PDF is set (report.html prints from a browser)"
                                                : "report.pdf not made: no chromium on PATH (report.html prints from a browser)"};
  std::string profile_template = (fs::temp_directory_path(ec) / "rotcap-pdf-XXXXXX").string();
  if (ec || ::mkdtemp(profile_template.data()) == nullptr)
    return {PdfResult::Status::failed, "report.pdf not made: no temporary folder for the browser profile"};
  const fs::path profile = profile_template;
  const fs::path part = pdf.string() + ".part";
  const std::vector<std::string> args{chromium->string(), "--headless", "--no-sandbox", "--disable-gpu",
                                      "--disable-background-networking", "--disable-component-update",
                                      "--disable-sync", "--no-first-run", "--user-data-dir=" + profile.string(),
                                      "--no-pdf-header-footer", "--print-to-pdf=" + fs::absolute(part).string(),
                                      fs::absolute(html).string()};
  bool timed_out = false;
  const int code = run_with_timeout(args, timeout_s, timed_out);
  fs::remove_all(profile, ec);
  if (code != 0 || !fs::exists(part) || fs::file_size(part, ec) == 0) {
    fs::remove(part, ec);
    return {PdfResult::Status::failed,
            timed_out ? format_text("report.pdf not made: chromium ran longer than %.0f s", timeout_s)
                      : format_text("report.pdf not made: chromium exited with code %d", code)};
  }
  fs::rename(part, pdf, ec);
  if (ec) return {PdfResult::Status::failed, "report.pdf not made: " + ec.message()};
  return {PdfResult::Status::written, "report.pdf written (report.html printed by headless chromium)"};
}

}  // namespace rotcap::app
