#include "app/batch/case_folder.hpp"

#include "io/atomic_file.hpp"

#include <fstream>
#include <sstream>

namespace rotcap::app {

namespace {

std::string read_all(const std::filesystem::path& file) {
  std::ifstream in(file, std::ios::binary);
  std::ostringstream s;
  s << in.rdbuf();
  return s.str();
}

/// The last line of the child's log that reports an error, else its last line.
std::string last_error_line(const std::filesystem::path& log) {
  std::istringstream in(read_all(log));
  std::string line, last, error;
  while (std::getline(in, line)) {
    if (line.empty()) continue;
    last = line;
    if (line.find("error") != std::string::npos) error = line;
  }
  return error.empty() ? last : error;
}

}  // namespace

const char* case_state_name(CaseState state) {
  switch (state) {
    case CaseState::queued: return "queued";
    case CaseState::running: return "running";
    case CaseState::done: return "done";
    case CaseState::failed: return "failed";
  }
  return "?";
}

std::optional<nlohmann::json> read_summary(const std::filesystem::path& folder) {
  std::ifstream in(folder / "summary.json");
  if (!in) return std::nullopt;
  nlohmann::json j = nlohmann::json::parse(in, nullptr, false);
  if (j.is_discarded() || !j.is_object()) return std::nullopt;
  return j;
}

std::optional<CaseOutcome> finished_outcome(const BatchJob& job) {
  std::error_code ec;
  if (!std::filesystem::is_regular_file(job.folder / kMarkerName, ec)) return std::nullopt;
  if (read_all(job.folder / kCaseFileName) != job.case_text) return std::nullopt;
  const std::optional<nlohmann::json> summary = read_summary(job.folder);
  if (!summary || !summary->contains("stop_reason") || !(*summary)["stop_reason"].is_string()) return std::nullopt;
  if ((*summary)["stop_reason"].get<std::string>() == "interrupted") return std::nullopt;
  std::optional<CaseOutcome> o = recorded_outcome(job.folder);
  if (o) o->from_earlier_run = true;
  return o;
}

std::optional<CaseOutcome> recorded_outcome(const std::filesystem::path& folder) {
  std::ifstream in(folder / kMarkerName);
  if (!in) return std::nullopt;
  const nlohmann::json m = nlohmann::json::parse(in, nullptr, false);
  if (m.is_discarded() || !m.is_object()) return std::nullopt;
  CaseOutcome o;
  o.state = m.value("state", "") == "done" ? CaseState::done : CaseState::failed;
  if (m.contains("exit_code") && m["exit_code"].is_number_integer()) o.exit_code = m["exit_code"].get<int>();
  o.signal = m.value("signal", 0);
  o.reason = m.value("reason", "");
  o.wall_s = m.value("wall_s", 0.0);
  return o;
}

void prepare_case_folder(const BatchJob& job) {
  std::filesystem::remove_all(job.folder);
  std::filesystem::create_directories(job.folder);
  write_file_atomically(job.folder / kCaseFileName, job.case_text);
}

ChildSpec case_child(const BatchJob& job, const std::filesystem::path& program, int threads, bool pdf) {
  ChildSpec spec;
  spec.program = program;
  spec.args = {"run", (job.folder / kCaseFileName).string(), "-o", job.folder.string(), "--overwrite", "--quiet",
               "--threads", std::to_string(threads)};
  const std::string n = std::to_string(threads);
  spec.env = {{"OMP_NUM_THREADS", n}, {"OPENBLAS_NUM_THREADS", n}};
  if (!pdf) spec.env.push_back({"ROTCAP_NO_PDF", "1"});
  spec.log_file = job.folder / kChildLogName;
  return spec;
}

CaseOutcome record_case_end(const BatchJob& job, const ChildExit& exit, double wall_s) {
  CaseOutcome o;
  o.wall_s = wall_s;
  o.signal = exit.signal;
  if (exit.signal == 0) o.exit_code = exit.exit_code;
  o.state = (exit.signal == 0 && exit.exit_code == 0) ? CaseState::done : CaseState::failed;
  const std::optional<nlohmann::json> summary = read_summary(job.folder);
  const std::string stop = summary ? summary->value("stop_reason", "") : "";
  if (o.state == CaseState::done) {
    o.reason = stop;
  } else if (exit.signal != 0) {
    o.reason = exit.describe();
  } else if (!stop.empty()) {
    o.reason = exit.describe() + ": " + stop;
  } else {
    o.reason = exit.describe() + ": " + last_error_line(job.folder / kChildLogName);
  }
  nlohmann::json m = {{"case", job.name}, {"state", case_state_name(o.state)},
                      {"exit_code", o.exit_code ? nlohmann::json(*o.exit_code) : nlohmann::json(nullptr)},
                      {"signal", o.signal}, {"reason", o.reason}, {"wall_s", wall_s}};
  write_file_atomically(job.folder / kMarkerName, m.dump(2) + "\n");
  return o;
}

}  // namespace rotcap::app
