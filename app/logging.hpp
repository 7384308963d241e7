#pragma once
// Logging for the command line: spdlog to the console (unless --quiet) and, once the output folder
// is known, also to <folder>/run.log with the same lines. Keep spdlog out of widely included headers.
#include <filesystem>
#include <string>

namespace rotcap::app {

void setup_console_logging(bool quiet);
/// Adds <folder>/run.log as a second sink (truncates an existing file).
/// append: continue an existing run.log (rotcap resume) instead of starting it anew.
void add_log_file(const std::filesystem::path& folder, bool append = false);
/// Flushes and detaches the file sink.
void close_log_file();

void log_info(const std::string& line);
void log_warn(const std::string& line);
void log_error(const std::string& line);

}  // namespace rotcap::app
