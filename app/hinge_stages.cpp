#include "app/hinge_stages.hpp"

#include "app/logging.hpp"
#include "core/option_error.hpp"
#include "core/text_format.hpp"
#include "model/patterns/imperfection.hpp"
#include "model/patterns/residual_stress_field.hpp"
#include "model/patterns/section_deformation.hpp"
#include "solver/linear_buckling.hpp"
#include "solver/section_assignment.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

namespace rotcap::app {

namespace {

/// The base length of a ratio amplitude: "b" = width of the buckled plate (flange outstand b/2 of
/// the plate model, or the web depth h - tf), "h" = section depth, "L" = member length.
double base_length(const Amplitude& a, const HingeCase& hinge, DeformationMode mode) {
  const ISection& s = hinge.section;
  if (a.base == "h") return s.h;
  if (a.base == "L") return hinge.zone.span;
  return mode == DeformationMode::web_local_buckling ? s.h - s.tf : 0.5 * s.b;
}

}  // namespace

StageReport apply_imperfections(const CaseInput& input, const HingeCase& hinge, ShellModel& model, int threads) {
  StageReport report;
  const ImperfectionInput& imp = input.imperfection;
  const HingeZoneModel& zone = hinge.zone;
  NodeOffsets offsets(model.nodes.size(), Eigen::Vector3d::Zero());
  report.json["local"] = enum_name(imp.local);
  bool local_done = false;
  if (imp.local == LocalImperfection::buckling_mode) {
    // 1. Linear buckling of the perfect model under the bending load; the lowest LOCAL mode.
    const SectionAssignment sections = SectionAssignment::for_steel(zone.model, input.steel, input.layers, true);
    BucklingOptions bo;
    bo.prebuckling.threads = threads;
    // The n-th local mode (imperfection.mode) needs room for the global modes in between.
    const int n_modes = std::max({4, input.buckling.modes, imp.mode == 1 ? 0 : imp.mode + 3});
    const BucklingResult b = solve_linear_buckling(zone.model, sections, n_modes, bo);
    report.json["buckling_load_factors"] = b.load_factors;
    report.json["buckling_status"] = buckling_status_name(b.status);
    ModeImperfectionOptions mo;
    mo.amplitude = 1.0;
    mo.local_mode = imp.mode;
    const ModeImperfection picked = buckling_mode_imperfection(zone, b.modes, mo);
    report.log.push_back("imperfection: " + picked.message);
    if (picked.found) {
      const double amplitude = imp.local_amplitude.resolve(base_length(imp.local_amplitude, hinge, picked.classification));
      for (std::size_t i = 0; i < offsets.size(); ++i) offsets[i] += (imp.sign * amplitude) * picked.offsets[i];
      report.json["mode"] = picked.mode + 1;
      report.json["local_mode"] = imp.mode;
      report.json["sign"] = imp.sign;
      report.json["mode_load_factor"] = b.load_factors[picked.mode];
      report.json["mode_classification"] = deformation_mode_name(picked.classification);
      report.json["local_amplitude_mm"] = amplitude;
      report.json["buckle_x_mm"] = picked.distortion_x;
      report.log.push_back(format_text("imperfection: buckling mode %.0f (load factor %.4g) scaled to %.3g mm", picked.mode + 1.0,
                               b.load_factors[picked.mode], amplitude));
    } else if (imp.mode > 1) {
      throw OptionError("imperfection.mode", std::to_string(imp.mode),
                        "a local mode that exists: " + picked.message + "; raise [buckling] modes or lower imperfection.mode");
    } else {
      log_warn("no local buckling mode among the " + std::to_string(b.modes.size()) +
               " lowest modes; the half-sine pattern is used instead");
    }
    report.json["message"] = picked.message;
    local_done = picked.found;
  }
  if (imp.local != LocalImperfection::none && !local_done) {
    // 2. Analytical half-waves on the compression flange at the hinge.
    HalfSineOptions ho;
    ho.flange_amplitude = imp.local_amplitude.resolve(base_length(imp.local_amplitude, hinge, DeformationMode::flange_local_buckling));
    const NodeOffsets local = half_sine_imperfection(zone, ho);
    for (std::size_t i = 0; i < offsets.size(); ++i) offsets[i] += imp.sign * local[i];
    report.json["local_amplitude_mm"] = ho.flange_amplitude;
    report.json["sign"] = imp.sign;
    report.log.push_back(format_text("imperfection: half-sine flange pattern, tip amplitude %.3g mm", ho.flange_amplitude));
  }
  {
    // 3. The global bow, lateral, over the member length.
    GlobalBowOptions go;
    go.amplitude = imp.global_amplitude.resolve(imp.global_amplitude.base == "L" ? zone.span
                                                                                  : base_length(imp.global_amplitude, hinge, DeformationMode::none));
    if (go.amplitude > 0.0) {
      const NodeOffsets bow = global_bow(zone, go);
      for (std::size_t i = 0; i < offsets.size(); ++i) offsets[i] += bow[i];
      report.log.push_back(format_text("imperfection: lateral bow e0 = %.3g mm", go.amplitude));
    }
    report.json["global_amplitude_mm"] = go.amplitude;
  }
  add_offsets(model, offsets);
  return report;
}

StageReport apply_residual_stresses(const CaseInput& input, const HingeCase& hinge, ShellProblem& problem) {
  StageReport report;
  report.json["pattern"] = enum_name(input.residual_stress);
  if (input.residual_stress == ResidualStressKind::none) return report;
  const ResidualStressPattern pattern(input.residual_stress, hinge.section, input.steel.fy);
  const SelfEquilibrium eq = pattern.check();
  report.log.push_back("residual stresses: " + pattern.description());
  report.log.push_back("residual stresses: " + eq.message);
  report.json["description"] = pattern.description();
  report.json["peak_tension_MPa"] = eq.peak_tension;
  report.json["peak_compression_MPa"] = eq.peak_compression;
  report.json["relative_imbalance"] = eq.relative_imbalance;
  // Local stresses at the Gauss points of the perfect geometry (model/residual_stress_field.hpp).
  const GaussPointStressField at_gp = residual_stress_field(pattern, hinge.zone.model);
  problem.set_initial_stress([&](int e, int gp, int) { return at_gp[e][gp]; });
  return report;
}

}  // namespace rotcap::app
