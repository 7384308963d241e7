#pragma once
// Test helpers for the hinge-zone verification: run the rotcap binary on a case file of
// tests/data/hinge/ and read what it leaves behind.
//
// The binary is ROTCAP_EXE (compile definition, $<TARGET_FILE:rotcap>); each run writes into a
// fresh folder ROTCAP_HINGE_SCRATCH/<name>/results; case files are found through
// ROTCAP_SOURCE_DIR (set by rotcap_test) or the working directory (the source root). Every run
// uses --threads 1, so the timings printed are single-core times.
//
// Units as in the results folder: kN m, mrad in curve.csv and summary.json.

#include <nlohmann/json.hpp>

#include <Eigen/Core>
#include <filesystem>
#include <string>
#include <vector>

namespace rotcap::testing {

struct HingeRun {
  int exit_code = -1;                 ///< the process's exit status, -1 if it did not exit normally
  std::string out, err;               ///< stdout, stderr
  double wall_s = 0.0;                ///< wall-clock time of the run [s]
  std::filesystem::path results;      ///< the results folder (-o)
};

/// A path relative to the source root (ROTCAP_SOURCE_DIR, else the working directory).
std::filesystem::path source_path(const std::filesystem::path& relative);
/// tests/data/hinge/<file> under the source root.
std::filesystem::path hinge_case(const std::string& file);
/// A whole text file ("" if it cannot be read).
std::string read_text(const std::filesystem::path& file);

/// Runs `rotcap <command> <case> -o <scratch>/results --threads 1 <extra>`; `name` names the
/// scratch folder, emptied first unless keep_scratch (to test a pre-existing results folder).
/// Prints the command, exit code and run time.
HingeRun run_rotcap(const std::string& command, const std::filesystem::path& case_file, const std::string& name,
                    const std::string& extra = "", bool keep_scratch = false);

/// A fresh, empty scratch folder ROTCAP_HINGE_SCRATCH/<name>.
std::filesystem::path scratch_folder(const std::string& name);

nlohmann::json read_json(const std::filesystem::path& file);

/// curve.csv: a header line of column names, then rows of numbers.
struct CurveTable {
  std::vector<std::string> columns;
  std::vector<std::vector<double>> rows;
  int column(const std::string& name) const;             ///< -1 if absent
  std::vector<double> values(const std::string& name) const;  ///< a whole column (empty if absent)
};
CurveTable read_curve(const std::filesystem::path& file);

/// The "displacement" point array of a .vtu file as a full 6-DOF vector (rotations from the
/// "rotation" array), and the file's point coordinates.
struct VtuField {
  std::vector<Eigen::Vector3d> points;
  Eigen::VectorXd u;  ///< 6 per point: ux uy uz rx ry rz
};
VtuField read_vtu_field(const std::filesystem::path& file);

/// The dataset files a .pvd lists (relative to the .pvd's folder), in order.
std::vector<std::string> pvd_datasets(const std::filesystem::path& pvd);

/// Prints "<what>: reference R (<source>), result X, error E %".
void print_comparison(const std::string& what, double reference, double result, const std::string& source);

}  // namespace rotcap::testing
