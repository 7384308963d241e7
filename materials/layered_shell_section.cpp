#include "materials/layered_shell_section.hpp"

#include "core/option_error.hpp"

#include <cmath>
#include <limits>
#include <stdexcept>
#include <string>

namespace rotcap {

void LayeredShellSection::Options::validate() const {
  if (layers < 3 || layers > 15 || layers % 2 == 0)
    throw OptionError("mesh.layers", std::to_string(layers), "an odd number of layers, 3 <= layers <= 15");
  if (material_substeps < 1 || material_substeps > 64)
    throw OptionError("analysis.material_substeps", std::to_string(material_substeps),
                      "an integer 1 <= material_substeps <= 64 (backward-Euler substeps of a plastic layer update)");
}

LayeredShellSection::LayeredShellSection(J2PlaneStress material, double t, const Options& options)
    : material_(std::move(material)), t_(t), n_(options.layers) {
  if (!(t > 0.0) || !std::isfinite(t))
    throw std::invalid_argument("LayeredShellSection: thickness t = " + std::to_string(t) +
                                " must be > 0");
  options.validate();
  // Composite Simpson: h = t/(n-1), weights h/3 [1, 4, 2, ..., 4, 1].
  const double h = t / (n_ - 1);
  z_.resize(static_cast<std::size_t>(n_));
  w_.resize(static_cast<std::size_t>(n_));
  for (int i = 0; i < n_; ++i) {
    const auto k = static_cast<std::size_t>(i);
    z_[k] = -0.5 * t + i * h;
    w_[k] = (i == 0 || i == n_ - 1) ? h / 3.0 : (i % 2 == 1 ? 4.0 * h / 3.0 : 2.0 * h / 3.0);
  }
  z_[static_cast<std::size_t>(n_ / 2)] = 0.0;  // exact mid-surface despite round-off
}

void LayeredShellSection::check_slots(std::size_t size, const char* what) const {
  // Programmer error (the caller sized the history wrongly): always checked.
  if (size != static_cast<std::size_t>(n_))
    throw std::logic_error(std::string(__FILE__) + ":" + std::to_string(__LINE__) +
                           ": LayeredShellSection: " + what + " holds " + std::to_string(size) +
                           " slots, layers() = " + std::to_string(n_));
}

ReturnStatus LayeredShellSection::evaluate(const Vec6& g, std::span<const LayerState> committed,
                                           std::span<LayerState> trial, Vec6& r,
                                           Mat6* C) const {
  check_slots(committed.size(), "committed");
  check_slots(trial.size(), "trial");
  r.setZero();
  if (C) C->setZero();
  ReturnStatus worst = ReturnStatus::Elastic;
  Eigen::Vector3d sigma;
  Eigen::Matrix3d D;
  // Layers that stay elastic have D = C_el (J2PlaneStress): their weights are summed and C_el is
  // added once, sum w C_el = (sum w) C_el (the same tangent, to round-off).
  double w_elastic = 0.0, wz_elastic = 0.0, wzz_elastic = 0.0;
  for (std::size_t i = 0; i < z_.size(); ++i) {
    const double z = z_[i], w = w_[i];
    // eps(z) = e + z k
    const Eigen::Vector3d eps = g.head<3>() + z * g.tail<3>();
    const ReturnStatus s = material_.update(eps, committed[i], trial[i], sigma, C ? &D : nullptr);
    if (s == ReturnStatus::NotConverged) worst = s;
    else if (s == ReturnStatus::Plastic && worst == ReturnStatus::Elastic) worst = s;
    // N = sum w sigma, M = sum w z sigma
    r.head<3>() += w * sigma;
    r.tail<3>() += (w * z) * sigma;
    if (!C) continue;
    if (s == ReturnStatus::Elastic) {
      w_elastic += w;
      wz_elastic += w * z;
      wzz_elastic += w * z * z;
      continue;
    }
    // dN/de = sum w D, dN/dk = dM/de = sum w z D, dM/dk = sum w z^2 D
    C->topLeftCorner<3, 3>() += w * D;
    C->topRightCorner<3, 3>() += (w * z) * D;
    C->bottomRightCorner<3, 3>() += (w * z * z) * D;
  }
  if (C && w_elastic > 0.0) {
    const Eigen::Matrix3d& c_el = material_.elastic_matrix();
    C->topLeftCorner<3, 3>() += w_elastic * c_el;
    C->topRightCorner<3, 3>() += wz_elastic * c_el;
    C->bottomRightCorner<3, 3>() += wzz_elastic * c_el;
  }
  if (C) C->bottomLeftCorner<3, 3>() = C->topRightCorner<3, 3>().transpose();
  return worst;
}

void LayeredShellSection::respond(const Vec6& g, std::span<const LayerState> committed,
                                  std::span<LayerState> trial, Vec6& r, Mat6& C) const {
  if (evaluate(g, committed, trial, r, &C) == ReturnStatus::NotConverged) {
    r.setConstant(std::numeric_limits<double>::quiet_NaN());
    C.setConstant(std::numeric_limits<double>::quiet_NaN());
  }
}

SurfaceStresses LayeredShellSection::surfaces(const Vec6& g,
                                              std::span<const LayerState> history) const {
  check_slots(history.size(), "history");
  SurfaceStresses out;
  const std::size_t idx[3] = {0, static_cast<std::size_t>(n_ / 2),
                              static_cast<std::size_t>(n_ - 1)};
  for (int s = 0; s < 3; ++s) {
    const std::size_t i = idx[s];
    const Eigen::Vector3d eps = g.head<3>() + z_[i] * g.tail<3>();
    out.stress[static_cast<std::size_t>(s)] = material_.stress(eps, history[i]);
    out.equivalent_plastic_strain[static_cast<std::size_t>(s)] =
        history[i].equivalent_plastic_strain;
  }
  return out;
}

void LayeredShellSection::set_initial_stress(
    std::span<LayerState> layers, const std::function<Eigen::Vector3d(double z)>& s) const {
  check_slots(layers.size(), "layers");
  for (std::size_t i = 0; i < layers.size(); ++i) layers[i].initial_stress = s(z_[i]);
}

void LayeredShellSection::set_initial_stress(std::span<LayerState> layers,
                                             std::span<const Eigen::Vector3d> per_layer) const {
  check_slots(layers.size(), "layers");
  check_slots(per_layer.size(), "per_layer");
  for (std::size_t i = 0; i < layers.size(); ++i) layers[i].initial_stress = per_layer[i];
}

}  // namespace rotcap
