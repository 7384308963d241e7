#include "app/field_export.hpp"

#include "io/vtk_writer.hpp"

#include <algorithm>
#include <cmath>

namespace rotcap::app {

namespace {
double von_mises(const Eigen::Vector3d& s) {
  return std::sqrt(s[0] * s[0] - s[0] * s[1] + s[1] * s[1] + 3.0 * s[2] * s[2]);
}
}  // namespace

void write_shell_fields(const std::filesystem::path& vtu, const ShellModel& model, const Eigen::VectorXd& u,
                        const ElementResults& results, std::span<const VtkField> field_data) {
  const int n = model.node_count();
  const int m = model.element_count();
  VtkField disp{"displacement", 3, std::vector<double>(3 * n)};
  VtkField rot{"rotation", 3, std::vector<double>(3 * n)};
  for (int i = 0; i < n; ++i)
    for (int k = 0; k < 3; ++k) {
      disp.values[3 * i + k] = u[kDofsPerNode * i + k];
      rot.values[3 * i + k] = u[kDofsPerNode * i + 3 + k];
    }
  VtkField nf{"membrane_force", 3, std::vector<double>(3 * m, 0.0)};
  VtkField mf{"bending_moment", 3, std::vector<double>(3 * m, 0.0)};
  const char* surface_names[3] = {"bottom", "middle", "top"};
  std::vector<VtkField> vm, ep;
  for (const char* s : surface_names) {
    vm.push_back({std::string("von_mises_") + s, 1, std::vector<double>(m, 0.0)});
    ep.push_back({std::string("plastic_strain_") + s, 1, std::vector<double>(m, 0.0)});
  }
  VtkField thickness{"thickness", 1, std::vector<double>(m)};
  VtkField region{"region", 1, std::vector<double>(m)};
  for (int e = 0; e < m; ++e) {
    thickness.values[e] = model.elements[e].thickness;
    region.values[e] = model.elements[e].region;
    if (e < static_cast<int>(results.resultants.size()))
      for (int gp = 0; gp < 4; ++gp)
        for (int k = 0; k < 3; ++k) {
          nf.values[3 * e + k] += 0.25 * results.resultants[e].r[gp][k];
          mf.values[3 * e + k] += 0.25 * results.resultants[e].r[gp][3 + k];
        }
    if (e < static_cast<int>(results.surfaces.size()))
      for (int gp = 0; gp < 4; ++gp)
        for (int s = 0; s < 3; ++s) {
          vm[s].values[e] += 0.25 * von_mises(results.surfaces[e][gp].stress[s]);
          ep[s].values[e] = std::max(ep[s].values[e], results.surfaces[e][gp].equivalent_plastic_strain[s]);
        }
  }
  std::vector<std::array<int, 4>> quads(m);
  for (int e = 0; e < m; ++e) quads[e] = model.elements[e].nodes;
  std::vector<VtkField> cells{nf, mf};
  for (auto& f : vm) cells.push_back(std::move(f));
  for (auto& f : ep) cells.push_back(std::move(f));
  cells.push_back(std::move(thickness));
  cells.push_back(std::move(region));
  const std::vector<VtkField> points{std::move(disp), std::move(rot)};
  write_vtu(vtu, model.nodes, quads, points, cells, field_data);
}

}  // namespace rotcap::app
