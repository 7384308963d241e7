#include "app/hinge_stages.hpp"

#include "app/hinge_laws_stage.hpp"

#include "app/logging.hpp"
#include "app/sections.hpp"
#include "elements/shell_q4.hpp"
#include "io/svg_plot.hpp"
#include "model/hinge/hinge_curve.hpp"
#include "model/patterns/imperfection.hpp"
#include "model/patterns/residual_stress.hpp"
#include "model/patterns/section_deformation.hpp"
#include "solver/linear_buckling.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

namespace rotcap::app {

namespace {

std::string fmt(const char* f, double a, double b = 0.0, double c = 0.0) {
  char buf[256];
  std::snprintf(buf, sizeof buf, f, a, b, c);
  return buf;
}

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
    const SectionAssignment sections = make_sections(zone.model, input.steel, input.mesh.layers, true);
    BucklingOptions bo;
    bo.prebuckling.threads = threads;
    const int n_modes = std::max(4, input.buckling.modes);
    const BucklingResult b = solve_linear_buckling(zone.model, sections, n_modes, bo);
    report.json["buckling_load_factors"] = b.load_factors;
    report.json["buckling_status"] = buckling_status_name(b.status);
    ModeImperfectionOptions mo;
    mo.amplitude = 1.0;
    const ModeImperfection picked = buckling_mode_imperfection(zone, b.modes, mo);
    report.log.push_back("imperfection: " + picked.message);
    if (picked.found) {
      const double amplitude = imp.local_amplitude.resolve(base_length(imp.local_amplitude, hinge, picked.classification));
      for (std::size_t i = 0; i < offsets.size(); ++i) offsets[i] += amplitude * picked.offsets[i];
      report.json["mode"] = picked.mode + 1;
      report.json["mode_load_factor"] = b.load_factors[picked.mode];
      report.json["mode_classification"] = deformation_mode_name(picked.classification);
      report.json["local_amplitude_mm"] = amplitude;
      report.log.push_back(fmt("imperfection: buckling mode %.0f (load factor %.4g) scaled to %.3g mm", picked.mode + 1.0,
                               b.load_factors[picked.mode], amplitude));
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
    for (std::size_t i = 0; i < offsets.size(); ++i) offsets[i] += local[i];
    report.json["local_amplitude_mm"] = ho.flange_amplitude;
    report.log.push_back(fmt("imperfection: half-sine flange pattern, tip amplitude %.3g mm", ho.flange_amplitude));
  }
  {
    // 3. The global bow, lateral, over the member length.
    GlobalBowOptions go;
    go.amplitude = imp.global_amplitude.resolve(imp.global_amplitude.base == "L" ? zone.span
                                                                                  : base_length(imp.global_amplitude, hinge, DeformationMode::none));
    if (go.amplitude > 0.0) {
      const NodeOffsets bow = global_bow(zone, go);
      for (std::size_t i = 0; i < offsets.size(); ++i) offsets[i] += bow[i];
      report.log.push_back(fmt("imperfection: lateral bow e0 = %.3g mm", go.amplitude));
    }
    report.json["global_amplitude_mm"] = go.amplitude;
  }
  add_offsets(model, offsets);
  return report;
}

StageReport apply_residual_stresses(const CaseInput& input, const HingeCase& hinge, const ShellModel& model,
                                    ShellProblem& problem) {
  StageReport report;
  report.json["pattern"] = enum_name(input.residual_stress);
  if (input.residual_stress == ResidualPattern::none) return report;
  const auto kind = input.residual_stress == ResidualPattern::hot_rolled ? ResidualStressKind::hot_rolled
                                                                         : ResidualStressKind::welded;
  const ResidualStressPattern pattern(kind, hinge.section, input.steel.fy.value_or(0.0));
  const SelfEquilibrium eq = pattern.check();
  report.log.push_back("residual stresses: " + pattern.description());
  report.log.push_back("residual stresses: " + eq.message);
  report.json["description"] = pattern.description();
  report.json["peak_tension_MPa"] = eq.peak_tension;
  report.json["peak_compression_MPa"] = eq.peak_compression;
  report.json["relative_imbalance"] = eq.relative_imbalance;
  // Local stresses at the Gauss points of the perfect geometry (the pattern is a property of the
  // section, not of the imperfect coordinates), constant through the thickness, each the mean over
  // its quadrant of the element (model/patterns/residual_stress.hpp).
  const ShellModel& perfect = hinge.zone.model;
  std::vector<std::array<Eigen::Vector3d, 4>> at_gp(model.elements.size());
  for (int e = 0; e < model.element_count(); ++e) {
    Eigen::Matrix<double, 3, 4> X;
    for (int a = 0; a < 4; ++a) X.col(a) = perfect.nodes[perfect.elements[e].nodes[a]];
    at_gp[e] = gauss_point_residual_stresses(pattern, element_plate_region(perfect, e), X, ShellFrame::of(X).rotation);
  }
  problem.set_initial_stress([&](int e, int gp, int) { return at_gp[e][gp]; });
  return report;
}

double computed_theta_p(const HingeCase& hinge, const std::vector<HingePoint>& curve) {
  std::vector<MomentRotationPoint> points;
  for (const HingePoint& p : curve) points.push_back({p.rotation, p.moment});
  const HingeCurveResult r = extract_hinge_curve(points, hinge.zone.plastic_moment, hinge.mel, hinge.theta_p_beam);
  return r.theta_p.value_or(hinge.theta_p_beam);
}

StageReport report_hinge_results(const CaseInput& input, const HingeCase& hinge, const ShellModel& model,
                                 const std::vector<HingePoint>& curve, const Eigen::VectorXd& u_peak,
                                 const Eigen::VectorXd& u_end, const std::filesystem::path& folder) {
  StageReport report;
  const double mp = hinge.zone.plastic_moment;
  std::vector<MomentRotationPoint> points;
  for (const HingePoint& p : curve) points.push_back({p.rotation, p.moment});
  const HingeCurveResult r = extract_hinge_curve(points, mp, hinge.mel, hinge.theta_p_beam);
  const double theta_p = r.theta_p.value_or(hinge.theta_p_beam);
  auto& j = report.json;
  j["mp_kNm"] = mp / 1e6;
  j["mel_kNm"] = hinge.mel / 1e6;
  if (!hinge.section.designation.empty()) j["mp_handbook_kNm"] = hinge.mp_real / 1e6;
  j["m_max_kNm"] = r.m_max / 1e6;
  j["m_max_over_mp"] = r.m_max / mp;
  j["theta_at_m_max_mrad"] = 1e3 * r.theta_at_m_max;
  j["theta_p_mrad"] = 1e3 * theta_p;
  j["theta_p_beam_mrad"] = 1e3 * hinge.theta_p_beam;
  j["theta_at_mp_mrad"] = r.theta_at_mp ? nlohmann::json(1e3 * *r.theta_at_mp) : nlohmann::json(nullptr);
  j["theta_u_mrad"] = r.theta_u ? nlohmann::json(1e3 * *r.theta_u) : nlohmann::json(nullptr);
  j["rotation_capacity"] = r.rotation_capacity ? nlohmann::json(*r.rotation_capacity) : nlohmann::json(nullptr);
  j["rotation_capacity_is_lower_bound"] = r.rotation_capacity_is_lower_bound;
  j["extraction"] = r.message;
  j["section_class"] = hinge.classification.section_class;
  j["flange_class"] = hinge.classification.flange.section_class;
  j["web_class"] = hinge.classification.web.section_class;
  // Failure mode: the shape of the deformation added after the peak (none if the curve did not
  // fall from its peak by at least 1 % within the run).
  std::string mode = "none";
  std::string why = "the moment did not fall from its peak within the analysed range";
  if (!curve.empty() && curve.back().moment < 0.99 * r.m_max) {
    const SectionDeformationAnalysis analysis(hinge.zone);
    const Classification c = classify_detailed(analysis.analyse(u_end - u_peak));
    mode = deformation_mode_name(c.mode);
    why = c.message;
  }
  j["failure_mode"] = mode;
  j["failure_mode_reason"] = why;
  // The results table for the log.
  report.log.push_back(fmt("Mp (plate model) %.2f kNm, Mel %.2f kNm", mp / 1e6, hinge.mel / 1e6));
  report.log.push_back(fmt("M_max %.2f kNm = %.4f Mp at theta %.2f mrad", r.m_max / 1e6, r.m_max / mp, 1e3 * r.theta_at_m_max));
  report.log.push_back(fmt("theta_p %.3f mrad (computed), %.3f mrad (beam theory)", 1e3 * theta_p, 1e3 * hinge.theta_p_beam));
  if (r.k_el_from_first_point_above_limit)
    log_warn("theta_p is a secant: the first curve point is already above 0.5 Mel, so theta_p and R depend on "
             "the first step; rerun with a smaller [analysis] first_step");
  if (r.rotation_capacity)
    report.log.push_back(fmt("theta_u %.2f mrad, rotation capacity R = %.2f", 1e3 * *r.theta_u, *r.rotation_capacity) +
                         (r.rotation_capacity_is_lower_bound ? " (lower bound: the run stopped before M fell back to Mp)" : ""));
  else
    report.log.push_back("rotation capacity: none (" + r.message + ")");
  report.log.push_back("failure mode: " + mode + " (" + why + ")");
  // curve.svg with the simple hinge laws, the law comparison, hinge_law.csv, report.html and
  // final_state.json (app/hinge_laws_stage.hpp).
  try {
    const DeformedMesh final_mesh = deformed_mesh(model, u_end);
    write_final_state(final_mesh, folder / "final_state.json");
    const StageReport laws = report_hinge_laws(input, hinge, curve, final_mesh, j, folder);
    report.log.insert(report.log.end(), laws.log.begin(), laws.log.end());
    j.update(laws.json);
  } catch (const std::exception& e) {
    log_warn(std::string("hinge laws and report.html not made: ") + e.what());
  }
  return report;
}

}  // namespace rotcap::app
