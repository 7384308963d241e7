#include "io/atomic_file.hpp"

#include "io/input_error.hpp"

#include <fstream>
#include <system_error>

namespace rotcap {

void write_file_atomically(const std::filesystem::path& file, std::string_view text) {
  const std::filesystem::path part = file.string() + ".part";
  {
    std::ofstream out(part, std::ios::binary | std::ios::trunc);
    if (!out) throw OutputError(file, "cannot create " + part.string());
    out.write(text.data(), static_cast<std::streamsize>(text.size()));
    out.flush();
    if (!out) throw OutputError(file, "writing " + part.string() + " failed");
  }
  std::error_code ec;
  std::filesystem::rename(part, file, ec);
  if (ec) throw OutputError(file, "renaming " + part.string() + " failed: " + ec.message());
}

}  // namespace rotcap
