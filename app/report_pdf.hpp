#pragma once
// report.pdf: report.html printed by headless Chromium (its print stylesheet: A4, see
// io/report_html.hpp), when a `chromium` executable is on PATH.
//
// Contract:
//  - Chromium runs as a child process (fork + execv with an argument vector: no shell, so paths
//    need no quoting), in a process group of its own, with a fresh profile folder under the system
//    temporary folder (removed afterwards), its output discarded;
//  - it is stopped (SIGKILL to its process group) after timeout_s seconds;
//  - the PDF is written next to the HTML as file.part and renamed when Chromium succeeded, so a
//    stale or half-written report.pdf never stays behind a failure (an old report.pdf is removed);
//  - never throws for a missing Chromium, a failed or timed-out print: the result says what happened.
#include <filesystem>
#include <optional>
#include <string>

namespace rotcap::app {

struct PdfResult {
  enum class Status { written, no_chromium, failed } status = Status::failed;
  std::string message;  ///< one line for the log
};

/// The full path of `name` found in PATH (an executable regular file), or nothing.
std::optional<std::filesystem::path> find_on_path(const std::string& name);

/// The Chromium that prints report.pdf: find_on_path("chromium"), or nothing when the environment
/// variable ROTCAP_NO_PDF is set (non-empty): the batch runner sets it for its cases (app/batch/),
/// so a sweep of hundreds of cases does not start a browser for each.
std::optional<std::filesystem::path> pdf_printer();
/// Prints html to pdf with headless Chromium; timeout_s > 0.
PdfResult print_report_pdf(const std::filesystem::path& html, const std::filesystem::path& pdf, double timeout_s = 120.0);

}  // namespace rotcap::app
