#pragma once
// TableReader: strict, typed access to one TOML table of a case file (internal to io/).
//
// Every getter records its key as known; finish() then rejects any key of the table that no
// getter asked for, naming it, its line and the nearest known key. Type and range errors throw
// InputError with the key path (e.g. "analysis.max_steps", "load[0].force[2]") and the line of
// the value (toml++ source regions; the table's own line when the key is absent).
// A reader over an absent table (nullptr) is valid: every getter returns its fallback.
// Numbers: an integer is accepted where a floating-point number is expected, and a
// floating-point number with an integral value where an integer is expected.

#include "io/input_error.hpp"

#include <toml++/toml.h>

#include <array>
#include <filesystem>
#include <optional>
#include <span>
#include <string>
#include <string_view>
#include <vector>

namespace rotcap::detail {

/// "a string (\"abc\")", "an integer (5)", "a number (2.5)", "a boolean (true)", "an array",
/// "a table", "a date", ...
std::string describe_node(const toml::node& node);

/// 1-based line where the node's value begins (0 when unknown).
int node_line(const toml::node& node);

class TableReader {
 public:
  /// path: key path of the table ("" for the root, "analysis", "support[1]"); line: its line.
  TableReader(std::filesystem::path file, const toml::table* table, std::string path, int line);

  bool present() const { return table_ != nullptr; }
  const std::filesystem::path& file() const { return file_; }
  const std::string& path() const { return path_; }
  int line() const { return line_; }
  /// "path.key" (or "key" at the root).
  std::string key_path(std::string_view key) const;
  /// Line of the key's value; the table's line when the key is absent.
  int line_of(std::string_view key) const;

  /// Marks key as known and tells whether it is present.
  bool has(std::string_view key);
  /// Marks key as known; nullptr when absent.
  const toml::node* node(std::string_view key);

  std::optional<double> optional_number(std::string_view key);
  double number(std::string_view key, double fallback);
  /// what: the expectation when missing, e.g. "the overall depth h in mm".
  double required_number(std::string_view key, std::string_view what);
  std::optional<int> optional_integer(std::string_view key);
  int integer(std::string_view key, int fallback);
  std::optional<std::string> optional_string(std::string_view key);
  std::string string(std::string_view key, std::string fallback);
  std::string required_string(std::string_view key, std::string_view what);
  /// Index of the value in names, fallback when absent; any other string is an error listing
  /// the names (with a suggestion).
  int choice(std::string_view key, std::span<const std::string> names, int fallback);
  /// [x, y, z] of three numbers.
  std::array<double, 3> vector3(std::string_view key, std::array<double, 3> fallback);
  /// Type-checked array or table; nullptr when absent.
  const toml::array* optional_array(std::string_view key);
  const toml::table* optional_table(std::string_view key);
  /// Reader over the sub-table key (absent -> a reader with present() == false and line 0).
  TableReader child(std::string_view key);

  /// Throws "found <value>; expected <constraint>" unless ok.
  void check(std::string_view key, double value, bool ok, std::string_view constraint) const;
  /// Marks key as known and throws when it is present: it does not apply here (expected says why).
  void forbid(std::string_view key, std::string_view expected);
  /// Rejects every key no getter asked for.
  void finish() const;

  [[noreturn]] void fail(std::string_view key, const std::string& found,
                         const std::string& expected) const;

 private:
  std::filesystem::path file_;
  const toml::table* table_;
  std::string path_;
  int line_;
  /// Throws the unknown-key error of a key in the table that misspells `key` (a missing required
  /// key is usually a typo); returns when there is none.
  void throw_if_misspelt(std::string_view key) const;
  std::vector<std::string> known_;
};

/// Numeric value of an array element or a value node: integer or floating point; else throws
/// with the given key path.
double number_value(const toml::node& node, const std::filesystem::path& file,
                    const std::string& key_path);
std::string string_value(const toml::node& node, const std::filesystem::path& file,
                         const std::string& key_path);
/// The element as a table (inline table inside an array), else throws.
const toml::table& table_value(const toml::node& node, const std::filesystem::path& file,
                               const std::string& key_path);

}  // namespace rotcap::detail
