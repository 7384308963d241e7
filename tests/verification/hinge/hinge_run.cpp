#include "tests/verification/hinge/hinge_run.hpp"

#include <sys/wait.h>
#include <vtkDataArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridReader.h>

#include <chrono>
#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <fstream>
#include <regex>
#include <sstream>
#include <stdexcept>

#ifndef ROTCAP_EXE
#error "ROTCAP_EXE must name the rotcap binary"
#endif
#ifndef ROTCAP_HINGE_SCRATCH
#error "ROTCAP_HINGE_SCRATCH must name a scratch folder"
#endif

namespace rotcap::testing {

namespace fs = std::filesystem;

std::string read_text(const fs::path& path) {
  std::ifstream in(path);
  std::ostringstream s;
  s << in.rdbuf();
  return s.str();
}

namespace {

std::string quoted(const fs::path& p) { return "'" + p.string() + "'"; }

}  // namespace

fs::path source_path(const fs::path& relative) {
  const char* env = std::getenv("ROTCAP_SOURCE_DIR");
  const fs::path root = env ? fs::path(env) : fs::current_path();
  return root / relative;
}

fs::path hinge_case(const std::string& file) { return source_path(fs::path("tests") / "data" / "hinge" / file); }

fs::path scratch_folder(const std::string& name) {
  const fs::path p = fs::path(ROTCAP_HINGE_SCRATCH) / name;
  fs::remove_all(p);
  fs::create_directories(p);
  return p;
}

HingeRun run_rotcap(const std::string& command, const fs::path& case_file, const std::string& name,
                    const std::string& extra, bool keep_scratch) {
  const fs::path scratch = keep_scratch ? fs::path(ROTCAP_HINGE_SCRATCH) / name : scratch_folder(name);
  fs::create_directories(scratch);
  HingeRun r;
  r.results = scratch / "results";
  const fs::path out = scratch / "stdout.txt", err = scratch / "stderr.txt";
  // Single-threaded BLAS whatever the caller's environment: a path through a flat plateau may
  // take other steps when CHOLMOD's BLAS sums in another order (measured: the uniform-moment EPP
  // case needs 52 steps with one BLAS thread, 70+ with two).
  const std::string line = "OPENBLAS_NUM_THREADS=1 " + quoted(ROTCAP_EXE) + " " + command + " " + quoted(case_file) + " -o " +
                           quoted(r.results) + " --threads 1 " + extra;
  const auto t0 = std::chrono::steady_clock::now();
  const int status = std::system((line + " >" + quoted(out) + " 2>" + quoted(err)).c_str());
  r.wall_s = std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
  r.exit_code = (status != -1 && WIFEXITED(status)) ? WEXITSTATUS(status) : -1;
  r.out = read_text(out);
  r.err = read_text(err);
  std::printf("ran: rotcap %s %s%s -> exit %d in %.2f s\n", command.c_str(), case_file.filename().c_str(),
              extra.empty() ? "" : (" " + extra).c_str(), r.exit_code, r.wall_s);
  return r;
}

nlohmann::json read_json(const fs::path& file) {
  std::ifstream in(file);
  if (!in) throw std::runtime_error("cannot open " + file.string());
  return nlohmann::json::parse(in);
}

int CurveTable::column(const std::string& name) const {
  for (std::size_t i = 0; i < columns.size(); ++i)
    if (columns[i] == name) return static_cast<int>(i);
  return -1;
}

std::vector<double> CurveTable::values(const std::string& name) const {
  std::vector<double> v;
  const int c = column(name);
  if (c < 0) return v;
  for (const auto& row : rows) v.push_back(row.at(c));
  return v;
}

CurveTable read_curve(const fs::path& file) {
  CurveTable t;
  std::ifstream in(file);
  std::string line;
  if (!std::getline(in, line)) return t;
  std::stringstream head(line);
  for (std::string cell; std::getline(head, cell, ',');) t.columns.push_back(cell);
  while (std::getline(in, line)) {
    if (line.empty()) continue;
    std::stringstream s(line);
    std::vector<double> row;
    for (std::string cell; std::getline(s, cell, ',');) row.push_back(std::stod(cell));
    t.rows.push_back(row);
  }
  return t;
}

VtuField read_vtu_field(const fs::path& file) {
  vtkNew<vtkXMLUnstructuredGridReader> reader;
  reader->SetFileName(file.c_str());
  reader->Update();
  vtkUnstructuredGrid* grid = reader->GetOutput();
  if (!grid || grid->GetNumberOfPoints() == 0) throw std::runtime_error("cannot read " + file.string());
  vtkDataArray* disp = grid->GetPointData()->GetArray("displacement");
  vtkDataArray* rot = grid->GetPointData()->GetArray("rotation");
  if (!disp || !rot) throw std::runtime_error(file.string() + " lacks displacement or rotation");
  VtuField f;
  const vtkIdType n = grid->GetNumberOfPoints();
  f.points.resize(n);
  f.u.resize(6 * n);
  for (vtkIdType i = 0; i < n; ++i) {
    double p[3], d[3], r[3];
    grid->GetPoints()->GetPoint(i, p);
    disp->GetTuple(i, d);
    rot->GetTuple(i, r);
    f.points[i] = Eigen::Vector3d(p[0], p[1], p[2]);
    for (int k = 0; k < 3; ++k) {
      f.u[6 * i + k] = d[k];
      f.u[6 * i + 3 + k] = r[k];
    }
  }
  return f;
}

std::vector<std::string> pvd_datasets(const fs::path& pvd) {
  const std::string text = read_text(pvd);
  const std::regex file_attr("file=\"([^\"]+)\"");
  std::vector<std::string> files;
  for (auto it = std::sregex_iterator(text.begin(), text.end(), file_attr); it != std::sregex_iterator(); ++it)
    files.push_back((*it)[1]);
  return files;
}

void print_comparison(const std::string& what, double reference, double result, const std::string& source) {
  std::printf("%s: reference %.6g (%s), result %.6g, error %+.2f %%\n", what.c_str(), reference, source.c_str(),
              result, 100.0 * (result - reference) / reference);
}

}  // namespace rotcap::testing
