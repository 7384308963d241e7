#include "app/logging.hpp"

#include <spdlog/sinks/basic_file_sink.h>
#include <spdlog/sinks/stdout_sinks.h>
#include <spdlog/spdlog.h>

#include <memory>

namespace rotcap::app {

namespace {
std::shared_ptr<spdlog::logger> g_logger;
std::shared_ptr<spdlog::sinks::basic_file_sink_mt> g_file;
}  // namespace

void setup_console_logging(bool quiet) {
  auto console = std::make_shared<spdlog::sinks::stdout_sink_mt>();
  console->set_level(quiet ? spdlog::level::warn : spdlog::level::info);
  g_logger = std::make_shared<spdlog::logger>("rotcap", console);
  g_logger->set_pattern("%v");
  g_logger->set_level(spdlog::level::info);
  g_logger->flush_on(spdlog::level::info);
  spdlog::set_default_logger(g_logger);
}

void add_log_file(const std::filesystem::path& folder, bool append) {
  if (!g_logger) setup_console_logging(false);
  close_log_file();
  g_file = std::make_shared<spdlog::sinks::basic_file_sink_mt>((folder / "run.log").string(), !append);
  g_file->set_level(spdlog::level::info);
  g_file->set_pattern("%v");
  g_logger->sinks().push_back(g_file);
}

void close_log_file() {
  if (!g_logger || !g_file) return;
  g_logger->flush();
  auto& sinks = g_logger->sinks();
  sinks.erase(std::remove(sinks.begin(), sinks.end(), g_file), sinks.end());
  g_file.reset();
}

void log_info(const std::string& line) { spdlog::info(line); }
void log_warn(const std::string& line) { spdlog::warn("warning: " + line); }
void log_error(const std::string& line) { spdlog::error("error: " + line); }

}  // namespace rotcap::app
