#include "app/output_folder.hpp"

#include "io/input_error.hpp"

#include <system_error>

namespace rotcap::app {

namespace fs = std::filesystem;

fs::path prepare_output_folder(const fs::path& case_file, const std::optional<fs::path>& requested,
                               bool overwrite) {
  const fs::path folder = requested ? *requested
                                    : case_file.parent_path() / (case_file.stem().string() + "_results");
  std::error_code ec;
  if (fs::exists(folder, ec)) {
    if (!overwrite)
      throw InputError(folder, 0, "-o", "an existing output folder " + folder.string(),
                       "a new folder, or --overwrite to replace its results");
    if (!fs::is_directory(folder, ec))
      throw InputError(folder, 0, "-o", "a file, not a folder", "a folder path");
    // Remove only what rotcap writes, so a user's own files in the folder survive.
    for (const char* name : {"curve.csv", "summary.json", "fields.pvd", "fields", "modes.pvd", "modes",
                             "buckling.json", "curve.svg", "run.log", "hinge_law.csv", "report.html",
                             "displacements.csv", "final_state.json", "report.pdf", "checkpoint.h5",
                             "checkpoint.h5.part"})
      fs::remove_all(folder / name, ec);
  }
  fs::create_directories(folder, ec);
  if (ec) throw OutputError(folder, "cannot create the output folder: " + ec.message());
  return folder;
}

}  // namespace rotcap::app
