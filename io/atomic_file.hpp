#pragma once
// write_file_atomically: writes text to <file>.part and renames it onto file, so a reader (or a run
// that stops half way) never sees a half-written result file. Throws OutputError naming the file.
#include <filesystem>
#include <string_view>

namespace rotcap {

void write_file_atomically(const std::filesystem::path& file, std::string_view text);

}  // namespace rotcap
