#include "io/vtk_writer.hpp"

#include "io/input_error.hpp"

#include <vtkCellArray.h>
#include <vtkCellData.h>
#include <vtkDoubleArray.h>
#include <vtkFieldData.h>
#include <vtkIdTypeArray.h>
#include <vtkNew.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkUnstructuredGrid.h>
#include <vtkXMLUnstructuredGridWriter.h>

#include <stdexcept>

namespace rotcap {

namespace {

vtkNew<vtkDoubleArray> make_array(const VtkField& field, std::size_t items, const char* where) {
  if (field.components < 1 || field.values.size() != items * static_cast<std::size_t>(field.components))
    throw std::invalid_argument(std::string("write_vtu: ") + where + " field '" + field.name + "' has " +
                                std::to_string(field.values.size()) + " values; expected " +
                                std::to_string(field.components) + " x " + std::to_string(items));
  vtkNew<vtkDoubleArray> a;
  a->SetName(field.name.c_str());
  a->SetNumberOfComponents(field.components);
  a->SetNumberOfTuples(static_cast<vtkIdType>(items));
  for (std::size_t i = 0; i < field.values.size(); ++i) a->SetValue(static_cast<vtkIdType>(i), field.values[i]);
  return a;
}

}  // namespace

void write_vtu(const std::filesystem::path& file, std::span<const Eigen::Vector3d> points,
               std::span<const std::array<int, 4>> quads, std::span<const VtkField> point_fields,
               std::span<const VtkField> cell_fields, std::span<const VtkField> field_data) {
  vtkNew<vtkPoints> pts;
  pts->SetDataTypeToDouble();
  pts->SetNumberOfPoints(static_cast<vtkIdType>(points.size()));
  for (std::size_t i = 0; i < points.size(); ++i)
    pts->SetPoint(static_cast<vtkIdType>(i), points[i].x(), points[i].y(), points[i].z());

  vtkNew<vtkCellArray> cells;
  cells->AllocateExact(static_cast<vtkIdType>(quads.size()), static_cast<vtkIdType>(4 * quads.size()));
  for (const auto& q : quads) {
    vtkIdType ids[4];
    for (int k = 0; k < 4; ++k) {
      if (q[k] < 0 || static_cast<std::size_t>(q[k]) >= points.size())
        throw std::invalid_argument("write_vtu: quad node index " + std::to_string(q[k]) +
                                    " outside 0.." + std::to_string(points.size()));
      ids[k] = q[k];
    }
    cells->InsertNextCell(4, ids);
  }

  vtkNew<vtkUnstructuredGrid> grid;
  grid->SetPoints(pts);
  grid->SetCells(VTK_QUAD, cells);
  for (const VtkField& f : point_fields) grid->GetPointData()->AddArray(make_array(f, points.size(), "point"));
  for (const VtkField& f : cell_fields) grid->GetCellData()->AddArray(make_array(f, quads.size(), "cell"));
  for (const VtkField& f : field_data) grid->GetFieldData()->AddArray(make_array(f, 1, "field-data"));

  std::error_code ec;
  const std::filesystem::path folder = file.parent_path();
  if (!folder.empty() && !std::filesystem::is_directory(folder, ec))
    throw OutputError(file, "the folder " + folder.string() + " does not exist");
  const std::filesystem::path temporary = file.string() + ".part";
  vtkNew<vtkXMLUnstructuredGridWriter> writer;
  writer->SetFileName(temporary.string().c_str());
  writer->SetInputData(grid);
  writer->SetDataModeToBinary();
  writer->SetHeaderTypeToUInt64();
  if (writer->Write() != 1) {
    std::filesystem::remove(temporary, ec);
    throw OutputError(file, "the VTK XML writer failed (permissions or disk space?)");
  }
  std::filesystem::rename(temporary, file, ec);
  if (ec) throw OutputError(file, "renaming the finished file failed: " + ec.message());
}

}  // namespace rotcap
