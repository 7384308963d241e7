#pragma once
// Internal to io/: the readers of the case file's tables, shared by case_file.cpp,
// case_file_analysis.cpp and case_file_general.cpp. Each reads one table into CaseInput,
// validates it (limits, keys that do not apply) and calls finish() for unknown keys.

#include "io/case_input.hpp"
#include "io/toml_table_reader.hpp"

namespace rotcap::detail {

template <class Enum>
Enum read_choice(TableReader& r, std::string_view key, Enum fallback) {
  return static_cast<Enum>(r.choice(key, enum_names<Enum>(), static_cast<int>(fallback)));
}

/// { group = "...", dof = "ux".."rz" } at key_path.
GroupDof read_group_dof(const toml::node& node, const std::filesystem::path& file,
                        const std::string& key_path);

/// The whole case from a parsed table (read_case_file, parse_case_text, case_from_echo).
CaseInput parse_case_table(const toml::table& table, const std::filesystem::path& file);

/// [steel]; needs c.kind.
void read_steel(TableReader r, CaseInput& c);
/// [analysis]; needs c.kind.
void read_analysis(TableReader& table, CaseInput& c);
/// [model], [[thickness]], [[support]], [[load]] from the root table; needs c.file.
void read_general_model(TableReader& root, CaseInput& c);

}  // namespace rotcap::detail
