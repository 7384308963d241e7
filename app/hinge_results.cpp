#include "app/hinge_results.hpp"

#include "app/logging.hpp"
#include "core/text_format.hpp"
#include "model/patterns/section_deformation.hpp"

namespace rotcap::app {

std::vector<MomentRotationPoint> moment_rotation_points(const std::vector<HingePoint>& curve) {
  std::vector<MomentRotationPoint> points;
  points.reserve(curve.size());
  for (const HingePoint& p : curve) points.push_back({p.rotation, p.moment});
  return points;
}

HingeCurveResult extract_hinge_results(const HingeCase& hinge, const std::vector<HingePoint>& curve) {
  return extract_hinge_curve(moment_rotation_points(curve), hinge.zone.plastic_moment, hinge.mel, hinge.theta_p_beam);
}

FailureMode classify_failure(const HingeCase& hinge, const std::vector<HingePoint>& curve,
                             const HingeCurveResult& r, const Eigen::VectorXd& u_peak, const Eigen::VectorXd& u_end) {
  FailureMode f;
  if (!curve.empty() && curve.back().moment < 0.99 * r.m_max) {
    const SectionDeformationAnalysis analysis(hinge.zone);
    const Classification c = classify_detailed(analysis.analyse(u_end - u_peak));
    f.mode = deformation_mode_name(c.mode);
    f.reason = c.message;
  }
  return f;
}

StageReport hinge_results_report(const HingeCase& hinge, const HingeCurveResult& r, const FailureMode& failure) {
  StageReport report;
  const double mp = hinge.zone.plastic_moment;
  const double theta_p = r.theta_p.value_or(hinge.theta_p_beam);
  const auto opt = [](const std::optional<double>& v, double scale) {
    return v ? nlohmann::json(scale * *v) : nlohmann::json(nullptr);
  };
  auto& j = report.json;
  j["mp_kNm"] = mp / 1e6;
  j["mel_kNm"] = hinge.mel / 1e6;
  if (!hinge.section.designation.empty()) j["mp_handbook_kNm"] = hinge.mp_real / 1e6;
  j["m_max_kNm"] = r.m_max / 1e6;
  j["m_max_over_mp"] = r.m_max / mp;
  j["theta_at_m_max_mrad"] = 1e3 * r.theta_at_m_max;
  j["theta_p_mrad"] = 1e3 * theta_p;
  j["theta_p_beam_mrad"] = 1e3 * hinge.theta_p_beam;
  j["theta_at_mp_mrad"] = opt(r.theta_at_mp, 1e3);
  j["theta_u_mrad"] = opt(r.theta_u, 1e3);
  j["rotation_capacity"] = opt(r.rotation_capacity, 1.0);
  j["rotation_capacity_is_lower_bound"] = r.rotation_capacity_is_lower_bound;
  j["extraction"] = r.message;
  j["section_class"] = hinge.classification.section_class;
  j["flange_class"] = hinge.classification.flange.section_class;
  j["web_class"] = hinge.classification.web.section_class;
  j["failure_mode"] = failure.mode;
  j["failure_mode_reason"] = failure.reason;
  report.log.push_back(format_text("Mp (plate model) %.2f kNm, Mel %.2f kNm", mp / 1e6, hinge.mel / 1e6));
  report.log.push_back(format_text("M_max %.2f kNm = %.4f Mp at theta %.2f mrad", r.m_max / 1e6, r.m_max / mp,
                                   1e3 * r.theta_at_m_max));
  report.log.push_back(format_text("theta_p %.3f mrad (computed), %.3f mrad (beam theory)", 1e3 * theta_p,
                                   1e3 * hinge.theta_p_beam));
  if (r.k_el_from_first_point_above_limit)
    log_warn("theta_p is a secant: the first curve point is already above 0.5 Mel, so theta_p and R depend on "
             "the first step; rerun with a smaller [analysis] first_step");
  if (r.rotation_capacity)
    report.log.push_back(format_text("theta_u %.2f mrad, rotation capacity R = %.2f", 1e3 * *r.theta_u,
                                      *r.rotation_capacity) +
                         (r.rotation_capacity_is_lower_bound ? " (lower bound: the run stopped before M fell back to Mp)"
                                                             : ""));
  else
    report.log.push_back("rotation capacity: none (" + r.message + ")");
  report.log.push_back("failure mode: " + failure.mode + " (" + failure.reason + ")");
  return report;
}

}  // namespace rotcap::app
