#pragma once
// VTK XML unstructured-grid files (.vtu) of four-node shell meshes: plain arrays in, a file out.
// No mechanics here: the caller chooses the points (usually the reference coordinates, with the
// displacement as a point field so a viewer can warp by it) and the fields.
//
// Format: vtkXMLUnstructuredGridWriter, binary (base64 inside the XML, zlib-compressed), points
// as Float64, cells VTK_QUAD with the given node order, fields as Float64 arrays. The file is
// written under a temporary name and renamed, so a run that stops mid-write never leaves a
// truncated .vtu behind.
// Errors: inconsistent array sizes or node indices -> std::invalid_argument (a caller's bug);
// a file that cannot be written -> OutputError (io/input_error.hpp).

#include <Eigen/Core>
#include <array>
#include <filesystem>
#include <span>
#include <string>
#include <vector>

namespace rotcap {

/// A named array on points or cells, item-major: values[i * components + k].
struct VtkField {
  std::string name;
  int components = 1;          ///< 1 for a scalar, 3 for a vector; >= 1
  std::vector<double> values;  ///< size = components * (number of points or cells)
};

/// Writes file (.vtu). points: coordinates [mm]; quads: 0-based indices into points. field_data:
/// values of the whole dataset (one tuple each, e.g. the step's load factor), VTK FieldData.
void write_vtu(const std::filesystem::path& file, std::span<const Eigen::Vector3d> points,
               std::span<const std::array<int, 4>> quads, std::span<const VtkField> point_fields,
               std::span<const VtkField> cell_fields, std::span<const VtkField> field_data = {});

}  // namespace rotcap
