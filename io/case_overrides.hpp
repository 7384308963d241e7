#pragma once
// Case overrides: a base case file with some keys replaced, written back as TOML (toml++ stays
// behind the .cpp). Used by `rotcap sweep` (the plan's axes) and `rotcap study` (the variants).
//
// A key is a dotted path of case-file keys ("section.designation", "member.length", "steel.fy");
// missing tables on the way are created, an existing value is replaced. Whether the key exists in
// the case-file schema is left to the case reader (io/case_file.hpp), which the caller runs on
// the result. A relative [model] mesh path of the base is made absolute (against the base file's
// folder) so the written case can live in another folder.
#include <filesystem>
#include <span>
#include <string>
#include <string_view>

namespace rotcap {

/// One value in TOML syntax ("\"IPE 200\"", "2000.0", "[1, 2]") and as shown to a reader
/// (strings without quotes). An empty toml text removes the key (the case's default applies).
struct OverrideValue {
  std::string toml;
  std::string display;
};

struct CaseOverride {
  std::string key;
  OverrideValue value;
};

/// An OverrideValue of a number (printed so that it reads back to the same double).
OverrideValue override_number(double value);
/// An OverrideValue of an integer.
OverrideValue override_integer(long long value);
/// The OverrideValue that removes a key.
inline OverrideValue override_removal() { return {"", "(default)"}; }
/// An OverrideValue of a string.
OverrideValue override_string(std::string_view value);

/// base_text (the TOML of base_file) with the overrides applied, in order, as TOML text opening
/// with a comment that names the base and the overrides. Throws InputError naming base_file and
/// the key when the base is not valid TOML or a key's path runs through a value that is not a
/// table ("title.x"), or a value is not valid TOML.
std::string apply_case_overrides(std::string_view base_text, const std::filesystem::path& base_file,
                                 std::span<const CaseOverride> overrides);

/// The whole text of a file; InputError (file: found no such file / a folder) otherwise.
std::string read_text_file(const std::filesystem::path& file, std::string_view what);

}  // namespace rotcap
