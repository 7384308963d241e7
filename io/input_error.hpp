#pragma once
// InputError: the single exception type for bad input anywhere in io/ (case files, mesh files,
// group names, paths). The app catches it and exits with code 2; nothing in io/ reports bad input
// any other way.
//
// what() reads
//     <file>:<line>: <key>: found <found>; expected <expected>
// The ":<line>" part is left out when the line is unknown (line 0), the "<key>: " part when there
// is no key. Lines are 1-based. A key is a TOML key path with 0-based array indices
// ("analysis.max_steps", "support[0].group", "steel.table[2]") or, for mesh files, the section
// being read ("$Elements").

#include <filesystem>
#include <stdexcept>
#include <string>

namespace rotcap {

class InputError : public std::runtime_error {
 public:
  InputError(std::filesystem::path file, int line, std::string key, std::string found,
             std::string expected);

  const std::filesystem::path& file() const noexcept { return file_; }
  int line() const noexcept { return line_; }  ///< 1-based, 0 when unknown
  const std::string& key() const noexcept { return key_; }
  const std::string& found() const noexcept { return found_; }
  const std::string& expected() const noexcept { return expected_; }

 private:
  std::filesystem::path file_;
  int line_;
  std::string key_;
  std::string found_;
  std::string expected_;
};

/// An output file or folder that cannot be written (missing folder, no permission, disk full).
/// Distinct from InputError: the inputs were fine, the environment was not.
class OutputError : public std::runtime_error {
 public:
  OutputError(const std::filesystem::path& file, const std::string& reason);
  const std::filesystem::path& file() const noexcept { return file_; }

 private:
  std::filesystem::path file_;
};

}  // namespace rotcap
