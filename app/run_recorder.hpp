#pragma once
// RunRecorder: what a run leaves on disk, written as the run goes so that a run that stops early
// keeps every converged step: curve.csv (one row per converged step, flushed), fields/step_NNNN.vtu
// with fields.pvd rewritten after each, and summary.json rewritten at the end (and on failure).
#include "app/field_export.hpp"
#include "io/curve_csv.hpp"
#include "io/pvd_collection.hpp"

#include <nlohmann/json.hpp>

#include <filesystem>
#include <optional>
#include <string>
#include <vector>

namespace rotcap::app {

/// Where a resumed run's files stand: the curve rows and field steps of its last checkpoint.
struct RecorderContinuation {
  std::size_t rows = 0;          ///< curve.csv rows to keep (step 0 included)
  std::vector<int> field_steps;  ///< steps whose fields are on disk and in fields.pvd
};

class RunRecorder {
 public:
  RunRecorder(std::filesystem::path folder, std::vector<std::string> columns, int fields_every);
  /// Continues the files of a run in folder: curve.csv keeps its first `from.rows` rows, fields.pvd
  /// lists the `from.field_steps`, and field files of later steps (written after the checkpoint by
  /// the run that stopped) are removed.
  RunRecorder(std::filesystem::path folder, std::vector<std::string> columns, int fields_every,
              const RecorderContinuation& from);
  /// The steps whose fields are written (for checkpoints).
  const std::vector<int>& field_steps() const { return written_; }
  std::size_t rows() const { return csv_.rows(); }
  void add_row(const std::vector<double>& row) { csv_.write_row(row); }
  /// Fields are due on step 0, every fields_every-th step, and whenever forced (peak, end).
  bool fields_due(int step) const { return step % fields_every_ == 0; }
  /// Writes fields/step_NNNN.vtu (once per step) and adds it to fields.pvd at time = step (monotonic,
  /// so a viewer orders the states as the path went, also past a peak where the load factor falls);
  /// the step's load factor and step number are field data of the .vtu ("load_factor", "step").
  void write_fields(int step, double load_factor, const ShellModel& model, const Eigen::VectorXd& u,
                    const ElementResults& results);
  bool has_fields(int step) const;
  void write_summary(const nlohmann::json& summary) const;
  const std::filesystem::path& folder() const { return folder_; }

 private:
  std::filesystem::path folder_;
  CurveCsv csv_;
  PvdCollection pvd_;
  int fields_every_;
  std::vector<int> written_;
};

}  // namespace rotcap::app
