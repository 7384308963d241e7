#pragma once
// Turning analysis results into VTK fields (io/ writes plain arrays; only app/ knows both sides).
// Point fields: displacement [mm], rotation (rotation vector) [rad]. Cell fields, per element in its
// own local frame, mean of the four Gauss points: membrane_force [Nxx, Nyy, Nxy] [N/mm],
// bending_moment [Mxx, Myy, Mxy] [N mm/mm]; von_mises_{bottom,middle,top} [MPa] and
// plastic_strain_{bottom,middle,top} [-] (largest Gauss point); thickness [mm]; region index.
#include "elements/shell_q4.hpp"
#include "io/vtk_writer.hpp"
#include "model/shell_model.hpp"

#include <Eigen/Core>
#include <array>
#include <filesystem>
#include <span>
#include <vector>

namespace rotcap::app {

struct ElementResults {
  std::vector<ShellQ4Resultants> resultants;             ///< per element
  std::vector<std::array<SurfaceStresses, 4>> surfaces;  ///< per element and Gauss point
};

/// Writes one .vtu of the model with the displacement u (full, 6 per node) and element results;
/// field_data: values of the whole state (load_factor, step, ...), one number each.
void write_shell_fields(const std::filesystem::path& vtu, const ShellModel& model, const Eigen::VectorXd& u,
                        const ElementResults& results, std::span<const VtkField> field_data = {});

}  // namespace rotcap::app
