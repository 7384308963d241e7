#include "io/pvd_collection.hpp"
#include "core/text_format.hpp"

#include "io/atomic_file.hpp"
#include "io/input_error.hpp"
#include "io/xml_text.hpp"

#include <algorithm>
#include <cstdio>
#include <sstream>
#include <fstream>

namespace rotcap {

PvdCollection::PvdCollection(std::filesystem::path pvd_file) : file_(std::move(pvd_file)) { write(); }

PvdCollection::PvdCollection(std::filesystem::path pvd_file, std::vector<Entry> entries)
    : file_(std::move(pvd_file)), entries_(std::move(entries)) {
  std::stable_sort(entries_.begin(), entries_.end(), [](const Entry& a, const Entry& b) { return a.time < b.time; });
  write();
}

void PvdCollection::add(double time, const std::filesystem::path& dataset) {
  const std::filesystem::path folder = std::filesystem::absolute(file_).parent_path();
  const std::filesystem::path relative = std::filesystem::absolute(dataset).lexically_relative(folder);
  const Entry entry{time, (relative.empty() ? dataset : relative).generic_string()};
  entries_.insert(std::upper_bound(entries_.begin(), entries_.end(), entry,
                                   [](const Entry& a, const Entry& b) { return a.time < b.time; }),
                  entry);
  write();
}

void PvdCollection::write() const {
  std::ostringstream out;
  out << "<?xml version=\"1.0\"?>\n"
      << "<VTKFile type=\"Collection\" version=\"0.1\" byte_order=\"LittleEndian\">\n"
      << "  <Collection>\n";
  for (const Entry& e : entries_) {
    out << "    <DataSet timestep=\"" << format_text("%.17g", e.time) << "\" group=\"\" part=\"0\" file=\""
        << escape_xml_text(e.file) << "\"/>\n";
  }
  out << "  </Collection>\n</VTKFile>\n";
  write_file_atomically(file_, out.str());
}

}  // namespace rotcap
