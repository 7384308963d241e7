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

bool RunRecorder::has_fields(int step) const {
  return std::find(written_.begin(), written_.end(), step) != written_.end();
}

void RunRecorder::write_fields(int step, double load_factor, const ShellModel& model, const Eigen::VectorXd& u,
                               const ElementResults& results) {
  if (has_fields(step)) return;
  const std::string name = format_text("step_%04d.vtu", step);
  const VtkField state[] = {{"load_factor", 1, {load_factor}}, {"step", 1, {static_cast<double>(step)}}};
  write_shell_fields(folder_ / "fields" / name, model, u, results, state);
  pvd_.add(static_cast<double>(step), folder_ / "fields" / name);
  written_.push_back(step);
}

void RunRecorder::write_summary(const nlohmann::json& summary) const {
  write_file_atomically(folder_ / "summary.json", summary.dump(2) + "\n");
}

}  // namespace rotcap::app
