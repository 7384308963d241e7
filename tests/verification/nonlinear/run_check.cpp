// nonlinear_run_check: checks the results folder of a `rotcap run` of a general model, for the
// end-to-end ctest entries of tests/verification/nonlinear (run_case.cmake runs rotcap, then this).
//
// Usage: nonlinear_run_check FOLDER CASE.toml [--stop-reason=S] [--min-cutbacks=N]
//                            [--last=COLUMN=VALUE,REL] [--group-means]
// Always checked (the "consistent partial results" contract of docs/spec/interface.md):
//  - summary.json parses, has a string stop_reason and solver.steps / cutbacks / iterations;
//  - curve.csv has one row per converged step plus the unloaded row (rows = solver.steps + 1), its
//    step column counting 0, 1, ..., steps;
//  - fields.pvd parses as XML (VTK's parser); every DataSet it lists exists and reads back as an
//    unstructured grid with one point per model node; the last one is fields/step_<steps>.vtu at
//    the last curve row's load factor (the final state is labelled with its own step).
// Options: --stop-reason: summary.json stop_reason equals S; --min-cutbacks: solver.cutbacks >= N;
// --last: the last curve row's COLUMN is VALUE within relative REL; --group-means: every
// "dof@group" column of the last row equals the mean of that DOF over the group's nodes in the
// last .vtu (displacement / rotation point arrays), to the 10 significant digits curve.csv keeps.
// Exit code 0 when every check passes, 1 otherwise (each failure printed).

#include "io/case_file.hpp"
#include "io/general_model.hpp"

#include <nlohmann/json.hpp>
#include <vtkDataArray.h>
#include <vtkFieldData.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLDataElement.h>
#include <vtkXMLDataParser.h>
#include <vtkXMLUnstructuredGridReader.h>

#include <cmath>
#include <cstdio>
#include <filesystem>
#include <fstream>
#include <iostream>
#include <sstream>
#include <string>
#include <vector>

namespace fs = std::filesystem;

namespace {

int failures = 0;

void check(bool ok, const std::string& what) {
  std::printf("%s %s\n", ok ? "  ok  " : "  FAIL", what.c_str());
  if (!ok) ++failures;
}

struct Curve {
  std::vector<std::string> columns;
  std::vector<std::vector<double>> rows;
  int column(const std::string& name) const {
    for (std::size_t i = 0; i < columns.size(); ++i)
      if (columns[i] == name) return static_cast<int>(i);
    return -1;
  }
};

std::vector<std::string> split(const std::string& line, char sep) {
  std::vector<std::string> out;
  std::stringstream s(line);
  std::string item;
  while (std::getline(s, item, sep)) out.push_back(item);
  return out;
}

Curve read_curve(const fs::path& file) {
  Curve c;
  std::ifstream in(file);
  std::string line;
  if (!std::getline(in, line)) return c;
  c.columns = split(line, ',');
  while (std::getline(in, line)) {
    std::vector<double> row;
    for (const std::string& v : split(line, ',')) row.push_back(std::strtod(v.c_str(), nullptr));
    c.rows.push_back(row);
  }
  return c;
}

struct Dataset {
  double time = 0.0;
  std::string file;
};

std::vector<Dataset> read_pvd(const fs::path& pvd, bool& parsed) {
  std::vector<Dataset> out;
  vtkNew<vtkXMLDataParser> parser;
  parser->SetFileName(pvd.c_str());
  parsed = parser->Parse() == 1;
  if (!parsed) return out;
  vtkXMLDataElement* collection = parser->GetRootElement()->FindNestedElementWithName("Collection");
  if (!collection) return out;
  for (int i = 0; i < collection->GetNumberOfNestedElements(); ++i) {
    vtkXMLDataElement* d = collection->GetNestedElement(i);
    if (std::string(d->GetName()) != "DataSet") continue;
    Dataset s;
    d->GetScalarAttribute("timestep", s.time);
    s.file = d->GetAttribute("file") ? d->GetAttribute("file") : "";
    out.push_back(s);
  }
  return out;
}

bool close(double a, double b, double rel) { return std::abs(a - b) <= rel * std::max(std::abs(b), 1e-300); }

}  // namespace

int main(int argc, char** argv) {
  if (argc < 3) {
    std::cerr << "usage: nonlinear_run_check FOLDER CASE.toml [options]\n";
    return 1;
  }
  const fs::path folder = argv[1];
  const rotcap::ShellModel model = rotcap::build_general_model(rotcap::read_case_file(argv[2]));
  std::printf("checking %s (%d nodes)\n", folder.c_str(), model.node_count());
  // summary.json
  nlohmann::json summary;
  {
    std::ifstream in(folder / "summary.json");
    summary = nlohmann::json::parse(in, nullptr, false);
  }
  check(!summary.is_discarded(), "summary.json parses");
  if (summary.is_discarded()) return 1;
  const bool has_reason = summary.contains("stop_reason") && summary["stop_reason"].is_string();
  check(has_reason, "summary.json has stop_reason: " + (has_reason ? summary["stop_reason"].get<std::string>() : ""));
  const nlohmann::json solver = summary.value("solver", nlohmann::json::object());
  const bool has_solver = solver.contains("steps") && solver.contains("cutbacks") && solver.contains("iterations");
  check(has_solver, "summary.json has solver.steps, cutbacks, iterations: " + solver.dump());
  if (!has_solver) return 1;
  const int steps = solver["steps"].get<int>();
  // curve.csv
  const Curve curve = read_curve(folder / "curve.csv");
  check(static_cast<int>(curve.rows.size()) == steps + 1,
        "curve.csv rows " + std::to_string(curve.rows.size()) + " == solver.steps + 1 = " + std::to_string(steps + 1));
  bool counting = !curve.rows.empty();
  for (std::size_t k = 0; k < curve.rows.size(); ++k) counting &= curve.rows[k][0] == static_cast<double>(k);
  check(counting, "curve.csv step column counts 0, 1, ..., steps");
  if (curve.rows.empty()) return 1;
  const std::vector<double>& last = curve.rows.back();
  const int lf = curve.column("load_factor");
  // fields.pvd and its datasets
  bool parsed = false;
  const std::vector<Dataset> sets = read_pvd(folder / "fields.pvd", parsed);
  check(parsed, "fields.pvd parses as XML");
  check(!sets.empty(), "fields.pvd lists " + std::to_string(sets.size()) + " datasets");
  vtkSmartPointer<vtkUnstructuredGrid> last_grid;
  for (const Dataset& d : sets) {
    vtkNew<vtkXMLUnstructuredGridReader> reader;
    const fs::path file = folder / d.file;
    const bool exists = fs::exists(file);
    if (exists) {
      reader->SetFileName(file.c_str());
      reader->Update();
    }
    const bool ok = exists && reader->GetOutput() && reader->GetOutput()->GetNumberOfPoints() == model.node_count();
    check(ok, d.file + " reads back with " + std::to_string(model.node_count()) + " points");
    if (ok) last_grid = reader->GetOutput();
  }
  if (!sets.empty()) {
    char name[64];
    std::snprintf(name, sizeof name, "fields/step_%04d.vtu", steps);
    check(sets.back().file == name, "last dataset " + sets.back().file + " is " + name);
    // The pvd time is the step (monotonic past a peak); the load factor is the .vtu's field data.
    check(sets.back().time == static_cast<double>(steps),
          "last dataset's timestep " + std::to_string(sets.back().time) + " is the last step");
    for (std::size_t k = 1; k < sets.size(); ++k)
      check(sets[k].time > sets[k - 1].time, "pvd timesteps ascend at " + sets[k].file);
    vtkDataArray* lf_field = last_grid ? last_grid->GetFieldData()->GetArray("load_factor") : nullptr;
    check(lf >= 0 && lf_field && close(lf_field->GetComponent(0, 0), last[lf], 1e-9),
          "last dataset's load_factor field data is the last load factor");
  }
  // Options.
  for (int i = 3; i < argc; ++i) {
    const std::string a = argv[i];
    if (a.rfind("--stop-reason=", 0) == 0) {
      const std::string want = a.substr(14);
      check(has_reason && summary["stop_reason"] == want, "stop_reason is '" + want + "'");
    } else if (a.rfind("--min-cutbacks=", 0) == 0) {
      const int want = std::stoi(a.substr(15));
      const int got = solver["cutbacks"].get<int>();
      check(got >= want, "solver.cutbacks " + std::to_string(got) + " >= " + std::to_string(want));
    } else if (a.rfind("--last=", 0) == 0) {
      const std::vector<std::string> p = split(a.substr(7), '=');
      const std::vector<std::string> v = split(p.size() == 2 ? p[1] : "", ',');
      const int c = p.size() == 2 ? curve.column(p[0]) : -1;
      const bool ok = c >= 0 && v.size() == 2 && close(last[c], std::stod(v[0]), std::stod(v[1]));
      check(ok, "last row " + a.substr(7) + ": found " + (c >= 0 ? std::to_string(last[c]) : std::string("no column")));
    } else if (a == "--group-means") {
      check(last_grid != nullptr, "a last .vtu to take the group means from");
      if (!last_grid) continue;
      vtkDataArray* disp = last_grid->GetPointData()->GetArray("displacement");
      vtkDataArray* rot = last_grid->GetPointData()->GetArray("rotation");
      check(disp && rot, "last .vtu has displacement and rotation point arrays");
      if (!disp || !rot) continue;
      int compared = 0;
      for (std::size_t c = 0; c < curve.columns.size(); ++c) {
        const std::vector<std::string> p = split(curve.columns[c], '@');
        rotcap::Dof dof;
        if (p.size() != 2 || !rotcap::parse_dof(p[0], dof) || !model.groups.count(p[1])) continue;
        const int k = static_cast<int>(dof);
        vtkDataArray* array = k < 3 ? disp : rot;
        double mean = 0.0;
        for (int n : model.groups.at(p[1]).nodes) mean += array->GetComponent(n, k % 3);
        mean /= static_cast<double>(model.groups.at(p[1]).nodes.size());
        // curve.csv keeps 10 significant digits (%.10g).
        check(std::abs(last[c] - mean) <= 1e-9 * std::max(1.0, std::abs(mean)),
              curve.columns[c] + " " + std::to_string(last[c]) + " == group mean " + std::to_string(mean));
        ++compared;
      }
      check(compared > 0, std::to_string(compared) + " recorded columns compared");
    } else {
      check(false, "unknown option " + a);
    }
  }
  std::printf("%s: %d failure(s)\n", folder.c_str(), failures);
  return failures == 0 ? 0 : 1;
}
