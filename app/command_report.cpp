// `rotcap report DIR`: re-makes curve.svg, the law comparison (summary.json keys "laws" and
// "fitted_law"), hinge_law.csv and report.html from a results folder of a generated hinge-zone
// run, without re-running the analysis. Reads:
//   summary.json      the input echo ("input": section, steel, member, restraints,
//                     residual_stress, mesh, title) and the reported numbers;
//   curve.csv         step, load_factor, moment_kNm, rotation_mrad, ... (interface.md);
//   final_state.json  the deformed mesh at the end (app/hinge_laws_stage.hpp); optional: without
//                     it the page has no picture of the deformed hinge zone.
// The hinge-zone model is rebuilt from the echo (build_hinge_case) for Mp, Mel, theta_p and the
// classification; the mechanics of the run are not repeated. Exit 2 for a folder that is not a
// generated run's results.
#include "app/commands.hpp"
#include "io/atomic_file.hpp"
#include "app/hinge_case.hpp"
#include "app/hinge_laws_stage.hpp"
#include "app/logging.hpp"
#include "io/input_error.hpp"

#include <fstream>
#include <sstream>

namespace rotcap::app {

namespace fs = std::filesystem;
using nlohmann::json;

namespace {

template <class Enum>
Enum enum_of(const json& j, const char* key, const fs::path& file) {
  const std::string v = j.at(key).get<std::string>();
  const auto names = enum_names<Enum>();
  for (std::size_t i = 0; i < names.size(); ++i)
    if (names[i] == v) return static_cast<Enum>(i);
  throw InputError(file, 0, std::string("input.") + key, "\"" + v + "\"", "a value rotcap writes");
}

std::optional<double> opt(const json& j, const char* key) {
  if (!j.contains(key) || j.at(key).is_null()) return std::nullopt;
  return j.at(key).get<double>();
}

/// The parts of CaseInput that build the hinge-zone model and the laws, from summary.json's echo.
CaseInput input_from_echo(const json& e, const fs::path& file) {
  CaseInput c;
  c.file = e.value("file", std::string());
  c.title = e.value("title", std::string());
  if (e.value("kind", std::string()) != "generated")
    throw InputError(file, 0, "input.kind", "\"" + e.value("kind", std::string()) + "\"",
                     "the results of a generated hinge-zone model ([section] + [member])");
  const json& s = e.at("section");
  c.section.designation = s.at("designation").is_null() ? "" : s.at("designation").get<std::string>();
  c.section.depth = s.at("depth");
  c.section.flange_width = s.at("flange_width");
  c.section.flange_thickness = s.at("flange_thickness");
  c.section.web_thickness = s.at("web_thickness");
  c.section.root_radius = s.value("root_radius", 0.0);
  c.section.weld_throat = s.value("weld_throat", 0.0);
  const json& st = e.at("steel");
  c.steel.E = st.at("E");
  c.steel.nu = st.at("nu");
  c.steel.fy = opt(st, "fy");
  c.steel.fu = opt(st, "fu");
  c.steel.curve = enum_of<SteelCurve>(st, "curve", file);
  c.steel.hardening_modulus = opt(st, "hardening_modulus");
  if (st.contains("table")) c.steel.table = st.at("table").get<std::vector<std::array<double, 2>>>();
  const json& m = e.at("member");
  c.member.setup = enum_of<Setup>(m, "setup", file);
  c.member.length = m.at("length");
  c.member.axial_load_ratio = m.value("axial_load_ratio", 0.0);
  c.member.load_spacing = opt(m, "load_spacing");
  if (m.contains("stiffeners")) {
    if (m.at("stiffeners").is_array()) {
      c.member.stiffeners = StiffenerLayout::positions;
      c.member.stiffener_positions = m.at("stiffeners").get<std::vector<double>>();
    } else {
      c.member.stiffeners = enum_of<StiffenerLayout>(m, "stiffeners", file);
    }
  }
  c.member.stiffener_thickness = opt(m, "stiffener_thickness");
  if (e.contains("restraints"))
    for (const json& r : e.at("restraints").at("lateral"))
      c.lateral_restraints.push_back({r.at("x").get<double>(), enum_of<Flange>(r, "flange", file)});
  c.residual_stress = enum_of<ResidualPattern>(e.at("residual_stress"), "pattern", file);
  const json& mesh = e.at("mesh");
  c.mesh.layers = mesh.value("layers", 5);
  c.mesh.flange_elements = mesh.value("flange_elements", 8);
  c.mesh.web_elements = mesh.value("web_elements", 10);
  c.mesh.aspect = mesh.value("aspect", 1.0);
  return c;
}

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
  const CaseInput input = input_from_echo(summary.at("input"), summary_file);
  const HingeCase hinge = build_hinge_case(input);
  const std::vector<HingePoint> curve = read_curve(folder / "curve.csv");
  DeformedMesh mesh;
  if (fs::exists(folder / "final_state.json"))
    mesh = read_final_state(folder / "final_state.json");
  else
    log_warn("no final_state.json in " + folder.string() + ": the report has no picture of the deformed hinge zone");
  const StageReport laws = report_hinge_laws(input, hinge, curve, mesh, summary, folder);
  for (const auto& l : laws.log) log_info(l);
  summary.update(laws.json);
  write_file_atomically(summary_file, summary.dump(2) + "\n");
  log_info("re-made curve.svg, hinge_law.csv, report.html and the law comparison in " + summary_file.string());
  return kExitOk;
}

}  // namespace rotcap::app
