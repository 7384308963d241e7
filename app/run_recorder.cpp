#include "app/run_recorder.hpp"
#include "core/text_format.hpp"
#include "io/atomic_file.hpp"

#include "io/input_error.hpp"

#include <algorithm>
#include <cstdio>
#include <fstream>

namespace rotcap::app {

namespace fs = std::filesystem;

RunRecorder::RunRecorder(fs::path folder, std::vector<std::string> columns, int fields_every)
    : folder_(std::move(folder)),
      csv_(folder_ / "curve.csv", std::move(columns)),
      pvd_(folder_ / "fields.pvd"),
      fields_every_(std::max(1, fields_every)) {
  fs::create_directories(folder_ / "fields");
}

namespace {

std::string field_file_name(int step) { return format_text("step_%04d.vtu", step); }

std::vector<PvdCollection::Entry> field_entries(const std::vector<int>& steps) {
  std::vector<PvdCollection::Entry> entries;
  for (int step : steps) entries.push_back({static_cast<double>(step), "fields/" + field_file_name(step)});
  return entries;
}

}  // namespace

RunRecorder::RunRecorder(fs::path folder, std::vector<std::string> columns, int fields_every,
                         const RecorderContinuation& from)
    : folder_(std::move(folder)),
      csv_(folder_ / "curve.csv", std::move(columns), from.rows),
      pvd_(folder_ / "fields.pvd", field_entries(from.field_steps)),
      fields_every_(std::max(1, fields_every)),
      written_(from.field_steps) {
  fs::create_directories(folder_ / "fields");
  std::vector<std::string> keep;
  for (int step : written_) keep.push_back(field_file_name(step));
  for (const fs::directory_entry& entry : fs::directory_iterator(folder_ / "fields"))
    if (std::find(keep.begin(), keep.end(), entry.path().filename().string()) == keep.end()) fs::remove(entry.path());
}

bool RunRecorder::has_fields(int step) const {
  return std::find(written_.begin(), written_.end(), step) != written_.end();
}

void RunRecorder::write_fields(int step, double load_factor, const ShellModel& model, const Eigen::VectorXd& u,
                               const ElementResults& results) {
  if (has_fields(step)) return;
  const std::string name = field_file_name(step);
  const VtkField state[] = {{"load_factor", 1, {load_factor}}, {"step", 1, {static_cast<double>(step)}}};
  write_shell_fields(folder_ / "fields" / name, model, u, results, state);
  pvd_.add(static_cast<double>(step), folder_ / "fields" / name);
  written_.push_back(step);
}

void RunRecorder::write_summary(const nlohmann::json& summary) const {
  write_file_atomically(folder_ / "summary.json", summary.dump(2) + "\n");
}

}  // namespace rotcap::app
