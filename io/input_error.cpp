#include "io/input_error.hpp"

#include <utility>

namespace rotcap {

namespace {
std::string compose(const std::filesystem::path& file, int line, const std::string& key,
                    const std::string& found, const std::string& expected) {
  std::string m = file.string();
  if (line > 0) m += ":" + std::to_string(line);
  m += ": ";
  if (!key.empty()) m += key + ": ";
  m += "found " + found + "; expected " + expected;
  return m;
}
}  // namespace

InputError::InputError(std::filesystem::path file, int line, std::string key, std::string found,
                       std::string expected)
    : std::runtime_error(compose(file, line, key, found, expected)),
      file_(std::move(file)),
      line_(line),
      key_(std::move(key)),
      found_(std::move(found)),
      expected_(std::move(expected)) {}

OutputError::OutputError(const std::filesystem::path& file, const std::string& reason)
    : std::runtime_error(file.string() + ": cannot write: " + reason), file_(file) {}

}  // namespace rotcap
