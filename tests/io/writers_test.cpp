// Output writers: .vtu read back with VTK's own XML reader, the .pvd parsed as XML after every
// add, curve.csv rows read back from disk while the writer is still open.
#include "io/curve_csv.hpp"
#include "io/input_error.hpp"
#include "io/pvd_collection.hpp"
#include "io/vtk_writer.hpp"
#include "tests/io/io_test_support.hpp"

#include <vtkCellData.h>
#include <vtkCellTypes.h>
#include <vtkDataArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLDataElement.h>
#include <vtkXMLDataParser.h>
#include <vtkXMLUnstructuredGridReader.h>

#include <random>

namespace rotcap {
namespace {

TEST(VtkWriter, ReadsBackTheSamePointsCellsAndFields) {
  const testing::ScratchFolder scratch;
  const std::filesystem::path file = scratch / "grid.vtu";
  // 3 x 2 nodes, 2 quads; coordinates and values random (seeded) to test full double precision.
  std::mt19937 rng(20240611);
  std::uniform_real_distribution<double> u(-1.0, 1.0);
  std::vector<Eigen::Vector3d> points;
  for (int j = 0; j < 2; ++j)
    for (int i = 0; i < 3; ++i) points.emplace_back(100.0 * i + u(rng), 50.0 * j + u(rng), u(rng) / 3.0);
  const std::vector<std::array<int, 4>> quads = {{0, 1, 4, 3}, {1, 2, 5, 4}};
  VtkField displacement{"displacement", 3, {}}, temperature{"mises_top", 1, {}}, thickness{"thickness", 1, {7.5, 9.25}};
  for (int k = 0; k < 18; ++k) displacement.values.push_back(u(rng));
  for (int k = 0; k < 6; ++k) temperature.values.push_back(355.0 * u(rng));
  const std::vector<VtkField> point_fields = {displacement, temperature}, cell_fields = {thickness};
  write_vtu(file, points, quads, point_fields, cell_fields);
  EXPECT_FALSE(std::filesystem::exists(file.string() + ".part"));

  vtkNew<vtkXMLUnstructuredGridReader> reader;
  reader->SetFileName(file.c_str());
  reader->Update();
  vtkUnstructuredGrid* grid = reader->GetOutput();
  ASSERT_EQ(grid->GetNumberOfPoints(), 6);
  ASSERT_EQ(grid->GetNumberOfCells(), 2);
  EXPECT_EQ(grid->GetPoints()->GetDataType(), VTK_DOUBLE);
  for (vtkIdType i = 0; i < 6; ++i) {
    double x[3];
    grid->GetPoint(i, x);
    for (int k = 0; k < 3; ++k) EXPECT_EQ(x[k], points[i][k]);
  }
  for (vtkIdType c = 0; c < 2; ++c) {
    EXPECT_EQ(grid->GetCellType(c), VTK_QUAD);
    vtkIdType n = 0;
    const vtkIdType* ids = nullptr;
    grid->GetCellPoints(c, n, ids);
    ASSERT_EQ(n, 4);
    for (int k = 0; k < 4; ++k) EXPECT_EQ(ids[k], quads[c][k]);
  }
  vtkDataArray* d = grid->GetPointData()->GetArray("displacement");
  ASSERT_NE(d, nullptr);
  EXPECT_EQ(d->GetNumberOfComponents(), 3);
  for (vtkIdType i = 0; i < 6; ++i)
    for (int k = 0; k < 3; ++k) EXPECT_EQ(d->GetComponent(i, k), displacement.values[3 * i + k]);
  vtkDataArray* s = grid->GetPointData()->GetArray("mises_top");
  ASSERT_NE(s, nullptr);
  EXPECT_EQ(s->GetNumberOfComponents(), 1);
  for (vtkIdType i = 0; i < 6; ++i) EXPECT_EQ(s->GetComponent(i, 0), temperature.values[i]);
  vtkDataArray* t = grid->GetCellData()->GetArray("thickness");
  ASSERT_NE(t, nullptr);
  EXPECT_EQ(t->GetComponent(0, 0), 7.5);
  EXPECT_EQ(t->GetComponent(1, 0), 9.25);
}

TEST(VtkWriter, RejectsInconsistentArraysAndMissingFolders) {
  const std::vector<Eigen::Vector3d> points = {{0, 0, 0}, {1, 0, 0}, {1, 1, 0}, {0, 1, 0}};
  const std::vector<std::array<int, 4>> quads = {{0, 1, 2, 3}};
  const std::vector<VtkField> wrong = {{"displacement", 3, {0.0, 1.0}}};
  const testing::ScratchFolder scratch;
  const std::filesystem::path folder = scratch.path();
  EXPECT_THROW(write_vtu(folder / "a.vtu", points, quads, wrong, {}), std::invalid_argument);
  const std::vector<std::array<int, 4>> bad_quads = {{0, 1, 2, 4}};
  EXPECT_THROW(write_vtu(folder / "b.vtu", points, bad_quads, {}, {}), std::invalid_argument);
  EXPECT_THROW(write_vtu(folder / "missing" / "c.vtu", points, quads, {}, {}), OutputError);
}

// Parses the .pvd with VTK's XML parser and returns the file attributes of its DataSets.
std::vector<std::string> pvd_files(const std::filesystem::path& pvd) {
  vtkNew<vtkXMLDataParser> parser;
  parser->SetFileName(pvd.c_str());
  EXPECT_EQ(parser->Parse(), 1) << "not valid XML: " << pvd;
  std::vector<std::string> files;
  vtkXMLDataElement* root = parser->GetRootElement();
  if (root == nullptr) return files;
  EXPECT_STREQ(root->GetName(), "VTKFile");
  EXPECT_STREQ(root->GetAttribute("type"), "Collection");
  vtkXMLDataElement* collection = root->FindNestedElementWithName("Collection");
  if (collection == nullptr) {
    ADD_FAILURE() << "no Collection element";
    return files;
  }
  for (int i = 0; i < collection->GetNumberOfNestedElements(); ++i) {
    vtkXMLDataElement* e = collection->GetNestedElement(i);
    EXPECT_STREQ(e->GetName(), "DataSet");
    files.emplace_back(e->GetAttribute("file"));
  }
  return files;
}

TEST(PvdCollection, IsValidXmlListingEveryEntryAfterEachAdd) {
  const testing::ScratchFolder scratch;
  const std::filesystem::path folder = scratch.path();
  std::filesystem::create_directories(folder / "fields");
  PvdCollection pvd(folder / "fields.pvd");
  EXPECT_TRUE(pvd_files(folder / "fields.pvd").empty());  // valid while still empty
  std::vector<std::string> expected;
  for (int step = 0; step < 3; ++step) {
    const std::string name = "fields/step_000" + std::to_string(step) + ".vtu";
    pvd.add(0.25 * step, folder / name);
    expected.push_back(name);
    EXPECT_EQ(pvd_files(folder / "fields.pvd"), expected);
  }
  pvd.add(3.0, folder / "fields" / "a&b.vtu");  // escaped in XML, read back unescaped
  expected.push_back("fields/a&b.vtu");
  EXPECT_EQ(pvd_files(folder / "fields.pvd"), expected);
  EXPECT_NE(testing::read_text(folder / "fields.pvd").find("timestep=\"0.25\""), std::string::npos);
}

TEST(CurveCsv, EveryRowIsOnDiskBeforeTheWriterCloses) {
  const testing::ScratchFolder scratch;
  const std::filesystem::path file = scratch / "curve.csv";
  CurveCsv csv(file, {"step", "load_factor", "ux@tip", "iterations"});
  EXPECT_EQ(testing::read_text(file), "step,load_factor,ux@tip,iterations\n");
  csv.write_row(std::vector<double>{0.0, 0.0, 0.0, 0.0});
  EXPECT_EQ(testing::read_text(file), "step,load_factor,ux@tip,iterations\n0,0,0,0\n");
  csv.write_row(std::vector<double>{1.0, 1.0 / 3.0, -2.5e-7, 4.0});
  EXPECT_EQ(testing::read_text(file),
            "step,load_factor,ux@tip,iterations\n0,0,0,0\n1,0.3333333333,-2.5e-07,4\n");
  EXPECT_EQ(csv.rows(), 2u);
  EXPECT_THROW(csv.write_row(std::vector<double>{1.0}), std::invalid_argument);
  csv.close();
  EXPECT_THROW(CurveCsv(scratch / "no" / "curve.csv", {"step"}), OutputError);
}

}  // namespace
}  // namespace rotcap
