#pragma once
// Where a command writes its results: -o DIR, or <case file stem>_results/ next to the case file.
// An existing folder is only reused with --overwrite (then its old result files are removed first,
// so nothing stale survives); otherwise InputError (exit code 2).
#include <filesystem>
#include <optional>

namespace rotcap::app {

std::filesystem::path prepare_output_folder(const std::filesystem::path& case_file,
                                            const std::optional<std::filesystem::path>& requested,
                                            bool overwrite);

}  // namespace rotcap::app
