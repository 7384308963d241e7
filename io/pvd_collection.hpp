#pragma once
// PvdCollection: a ParaView-style collection file (.pvd) listing datasets (.vtu) against a time
// value (load step or mode number), in ascending time whatever the order of add(). The whole file is rewritten after every add(),
// under a temporary name and renamed, so at any moment the .pvd on disk is valid XML listing
// every dataset added so far (a run that stops early leaves a readable collection).
// Dataset paths are stored relative to the .pvd's folder, with '/' separators.
// Throws OutputError when the file cannot be written.

#include <filesystem>
#include <string>
#include <vector>

namespace rotcap {

class PvdCollection {
 public:
  struct Entry {
    double time = 0.0;
    std::string file;  ///< relative to the .pvd's folder
  };

  /// Writes an empty collection at once (replacing any file of that name).
  explicit PvdCollection(std::filesystem::path pvd_file);

  /// Continues a collection with these entries (a resumed run), rewriting the file at once.
  PvdCollection(std::filesystem::path pvd_file, std::vector<Entry> entries);
  /// Adds dataset (any path; stored relative to the .pvd's folder) and rewrites the file.
  void add(double time, const std::filesystem::path& dataset);

  const std::filesystem::path& file() const { return file_; }
  const std::vector<Entry>& entries() const { return entries_; }

 private:
  void write() const;

  std::filesystem::path file_;
  std::vector<Entry> entries_;
};

}  // namespace rotcap
