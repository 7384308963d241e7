// `rotcap report DIR`: re-makes curve.svg, the law comparison (summary.json keys "laws" and
// "fitted_law"), hinge_law.csv and report.html from a results folder of a generated hinge-zone
// run, without re-running the analysis. Reads:
//   summary.json      the input echo ("input": section, steel, member, restraints,
//                     residual_stress, mesh, title) and the reported numbers;
//   curve.csv         step, load_factor, moment_kNm, rotation_mrad, ... (docs/spec/interface.md);
//   final_state.json  the deformed mesh at the end (io/final_state.hpp); optional: without
//                     it the page has no picture of the deformed hinge zone.
// The case is read back from the echo by the case-file reader (case_from_echo) and the hinge-zone
// model rebuilt (build_hinge_case) for Mp, Mel, theta_p and the classification; the mechanics of the
// run are not repeated. Exit 2 for a folder that is not a
// generated run's results.
#include "app/commands.hpp"
#include "io/atomic_file.hpp"
#include "app/hinge_case.hpp"
#include "app/hinge_law_outputs.hpp"
#include "app/hinge_report_page.hpp"
#include "app/hinge_results.hpp"
#include "app/logging.hpp"
#include "io/case_echo.hpp"
#include "io/final_state.hpp"
#include "io/input_error.hpp"

#include <fstream>
#include <sstream>

namespace rotcap::app {

namespace fs = std::filesystem;
using nlohmann::json;

namespace {

/// curve.csv rows: step, load_factor, moment_kNm, rotation_mrad, ... (columns found by name).
std::vector<HingePoint> read_curve(const fs::path& file) {
  std::ifstream in(file);
  if (!in) throw InputError(file, 0, "curve.csv", "no such file", "the curve.csv of a run");
  std::string line;
  std::getline(in, line);
  std::vector<std::string> cols;
  {
    std::stringstream ss(line);
    for (std::string c; std::getline(ss, c, ',');) cols.push_back(c);
  }
  auto col = [&](const std::string& name) {
    for (std::size_t i = 0; i < cols.size(); ++i)
      if (cols[i] == name) return static_cast<int>(i);
    throw InputError(file, 1, name, "no such column", "the columns of a generated run's curve.csv");
  };
  const int i_step = col("step"), i_lf = col("load_factor"), i_m = col("moment_kNm"), i_r = col("rotation_mrad");
  std::vector<HingePoint> curve;
  int n = 1;
  while (std::getline(in, line)) {
    ++n;
    if (line.empty()) continue;
    std::vector<double> v;
    std::stringstream ss(line);
    try {
      for (std::string c; std::getline(ss, c, ',');) v.push_back(std::stod(c));
    } catch (const std::exception&) {
      throw InputError(file, n, "row", line, "numbers");
    }
    if (v.size() != cols.size()) throw InputError(file, n, "row", line, std::to_string(cols.size()) + " values");
    HingePoint p;
    p.step = static_cast<int>(v[i_step]);
    p.load_factor = v[i_lf];
    p.moment = 1e6 * v[i_m];
    p.rotation = 1e-3 * v[i_r];
    curve.push_back(p);
  }
  if (curve.size() < 3) throw InputError(file, n, "rows", std::to_string(curve.size()), "at least 3 converged points");
  return curve;
}

}  // namespace

int command_report(const CommandOptions& options) {
  const fs::path folder = options.case_file;  // the results folder (the CLI's positional argument)
  const fs::path summary_file = folder / "summary.json";
  std::ifstream in(summary_file);
  if (!in) throw InputError(summary_file, 0, "DIR", "no summary.json in " + folder.string(), "a results folder of `rotcap run`");
  json summary;
  try {
    summary = json::parse(in);
  } catch (const json::exception& e) {
    throw InputError(summary_file, 0, "summary.json", e.what(), "valid JSON");
  }
  in.close();
  if (!summary.contains("input")) throw InputError(summary_file, 0, "input", "no input echo", "the summary.json of a run");
  const CaseInput input = case_from_echo(summary.at("input"), summary_file);
  if (input.kind != ModelKind::generated)
    throw InputError(summary_file, 0, "input.kind", "\"" + enum_name(input.kind) + "\"",
                     "the results of a generated hinge-zone model ([section] + [member])");
  const HingeCase hinge = build_hinge_case(input);
  const std::vector<HingePoint> curve = read_curve(folder / "curve.csv");
  DeformedMesh mesh;
  if (fs::exists(folder / "final_state.json"))
    mesh = read_final_state(folder / "final_state.json");
  else
    log_warn("no final_state.json in " + folder.string() + ": the report has no picture of the deformed hinge zone");
  const std::vector<MomentRotationPoint> points = moment_rotation_points(curve);
  const HingeCurveResult extraction = extract_hinge_results(hinge, curve);
  const HingeLawSet laws = compare_hinge_laws(
      points, extraction, {hinge.zone, hinge.section, input.steel, input.residual_stress, hinge.theta_p_beam});
  const StageReport outputs = write_hinge_law_outputs(input.title, points, extraction, laws, hinge.zone.plastic_moment, folder);
  for (const auto& l : outputs.log) log_info(l);
  summary.update(outputs.json);
  write_hinge_report(input, hinge, points, extraction, laws, mesh, summary, folder);
  write_file_atomically(summary_file, summary.dump(2) + "\n");
  log_info("re-made curve.svg, hinge_law.csv, report.html and the law comparison in " + summary_file.string());
  return kExitOk;
}

}  // namespace rotcap::app
