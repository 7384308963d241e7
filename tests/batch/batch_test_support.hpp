#pragma once
// Helpers of the batch tests: CSV rows by column name, JSON files, a rotcap process started in the
// background (for kill -9), and the processes whose command line mentions a path.
#include "tests/cli/cli_runner.hpp"

#include <nlohmann/json.hpp>

#include <signal.h>
#include <sys/wait.h>
#include <unistd.h>

#include <filesystem>
#include <fstream>
#include <map>
#include <string>
#include <vector>

namespace rotcap::testing {

using CsvRow = std::map<std::string, std::string>;

/// RFC 4180 fields of one line (quoted fields may hold commas and doubled quotes).
inline std::vector<std::string> csv_fields(const std::string& line) {
  std::vector<std::string> out(1);
  bool quoted = false;
  for (std::size_t i = 0; i < line.size(); ++i) {
    const char c = line[i];
    if (quoted) {
      if (c == '"' && i + 1 < line.size() && line[i + 1] == '"') out.back() += '"', ++i;
      else if (c == '"') quoted = false;
      else out.back() += c;
    } else if (c == '"') {
      quoted = true;
    } else if (c == ',') {
      out.emplace_back();
    } else {
      out.back() += c;
    }
  }
  return out;
}

/// The rows of a CSV file with a header line, each as column name -> field.
inline std::vector<CsvRow> read_csv_rows(const std::filesystem::path& file) {
  std::ifstream in(file);
  std::string line;
  std::vector<CsvRow> rows;
  if (!std::getline(in, line)) return rows;
  const std::vector<std::string> header = csv_fields(line);
  while (std::getline(in, line)) {
    const std::vector<std::string> f = csv_fields(line);
    CsvRow row;
    for (std::size_t i = 0; i < header.size() && i < f.size(); ++i) row[header[i]] = f[i];
    rows.push_back(row);
  }
  return rows;
}

inline nlohmann::json read_json(const std::filesystem::path& file) {
  std::ifstream in(file);
  return nlohmann::json::parse(in, nullptr, false);
}

/// `rotcap ARGS...` started in the background, stdout and stderr to log; returns its pid.
inline pid_t start_rotcap(const std::vector<std::string>& args, const std::filesystem::path& log) {
  const pid_t pid = ::fork();
  if (pid == 0) {
    FILE* f = std::freopen(log.c_str(), "w", stdout);
    (void)f;
    ::dup2(STDOUT_FILENO, STDERR_FILENO);
    std::vector<char*> argv{const_cast<char*>(ROTCAP_EXE)};
    for (const std::string& a : args) argv.push_back(const_cast<char*>(a.c_str()));
    argv.push_back(nullptr);
    ::execv(ROTCAP_EXE, argv.data());
    ::_exit(127);
  }
  return pid;
}

/// Processes (other than this one) whose command line contains text.
inline int processes_mentioning(const std::string& text) {
  int n = 0;
  for (const auto& entry : std::filesystem::directory_iterator("/proc")) {
    const std::string name = entry.path().filename().string();
    if (name.find_first_not_of("0123456789") != std::string::npos || std::stoi(name) == ::getpid()) continue;
    std::string cmdline = read_text(entry.path() / "cmdline");
    for (char& c : cmdline)
      if (c == '\0') c = ' ';
    n += cmdline.find(text) != std::string::npos;
  }
  return n;
}

/// A summary number as results.csv prints it ("%.6g"; booleans true / false; "" for null).
inline std::string printed(const nlohmann::json& summary, const std::string& key) {
  if (!summary.contains(key)) return "";
  const nlohmann::json& v = summary[key];
  if (v.is_boolean()) return v.get<bool>() ? "true" : "false";
  if (!v.is_number()) return "";
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.6g", v.get<double>());
  return buf;
}

}  // namespace rotcap::testing
