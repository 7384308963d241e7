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

namespace {

/// Why the computed theta_p differs from beam theory, with the numbers [one paragraph].
std::string theta_p_note(const HingeCase& hinge, double theta_p, std::optional<double> r_beam,
                         ResidualStressKind residual_stress) {
  const double bending = hinge.theta_p_beam, with_shear = hinge.theta_p_beam + hinge.theta_p_shear;
  const double rest = theta_p - with_shear;
  std::string s = format_text("theta_p from the shell's initial slope is %.2f mrad; beam theory gives %.2f mrad for "
                              "bending alone and %.2f mrad with the shear deformation of the web (Timoshenko, "
                              "Av = (h - tf) tw). ",
                              1e3 * theta_p, 1e3 * bending, 1e3 * with_shear);
  if (rest >= 0.0)
    s += format_text("The remaining %.2f mrad (%.0f %% of the computed value) is what beam theory leaves out: the "
                     "flexibility of the plates where the support and the load enter, shear lag in the flanges",
                     1e3 * rest, 100.0 * rest / theta_p) +
         std::string(residual_stress != ResidualStressKind::none
                         ? ", and yielding from the first load step where the residual stresses sit at yield"
                         : "") +
         ". ";
  else
    s += format_text("The shell is %.2f mrad stiffer than that (restraint the beam model does not have). ", -1e3 * rest);
  s += "R and the demand verdict use the computed theta_p";
  if (r_beam) s += format_text("; with the bending-only beam theta_p R would be %.2f", *r_beam);
  return s + ".";
}

nlohmann::json demand_json(const RotationDemand& d, const DemandCheck& c) {
  const bool rotation = d.kind == RotationDemand::Kind::plastic_rotation;
  const double scale = rotation ? 1e3 : 1.0;
  const auto opt = [&](const std::optional<double>& v) { return v ? nlohmann::json(scale * *v) : nlohmann::json(nullptr); };
  return {{"kind", rotation ? "plastic_rotation" : "rotation_capacity"},
          {"required", scale * d.required},
          {"unit", rotation ? "mrad" : ""},
          {"available", opt(c.available)},
          {"margin", opt(c.margin)},
          {"verdict", c.verdict},
          {"required_theta_u_mrad", 1e3 * c.required_theta_u},
          {"basis", "available values use the computed theta_p (the shell's own initial slope), so that theta_u and "
                    "theta_p come from the same curve; the beam-theory theta_p would count elastic shear and plate "
                    "flexibility as plastic rotation"},
          {"note", c.note}};
}

}  // namespace

StageReport hinge_results_report(const HingeCase& hinge, const HingeCurveResult& r, const FailureMode& failure,
                                 const std::optional<RotationDemand>& demand, ResidualStressKind residual_stress) {
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
  // Both R, the available plastic rotation and why theta_p differs from beam theory.
  std::optional<double> r_beam;
  if (r.theta_u) r_beam = *r.theta_u / hinge.theta_p_beam - 1.0;
  j["rotation_capacity_beam_theta_p"] = opt(r_beam, 1.0);
  j["theta_p_beam_with_shear_mrad"] = 1e3 * (hinge.theta_p_beam + hinge.theta_p_shear);
  j["available_plastic_rotation_mrad"] = r.theta_u ? nlohmann::json(1e3 * (*r.theta_u - theta_p)) : nlohmann::json(nullptr);
  j["theta_p_note"] = theta_p_note(hinge, theta_p, r_beam, residual_stress);
  j["demand"] = nullptr;
  std::optional<DemandCheck> check;
  if (demand && r.theta_p) {
    check = check_rotation_demand(*demand, r);
    j["demand"] = demand_json(*demand, *check);
  }
  report.log.push_back(format_text("Mp (plate model) %.2f kNm, Mel %.2f kNm", mp / 1e6, hinge.mel / 1e6));
  report.log.push_back(format_text("M_max %.2f kNm = %.4f Mp at theta %.2f mrad", r.m_max / 1e6, r.m_max / mp,
                                   1e3 * r.theta_at_m_max));
  report.log.push_back(format_text("theta_p %.3f mrad (computed), %.3f mrad (beam theory)", 1e3 * theta_p,
                                   1e3 * hinge.theta_p_beam));
  if (r.k_el_from_first_point_above_limit)
    log_warn("theta_p is a secant: the first curve point is already above 0.5 Mel, so theta_p and R depend on "
             "the first step; rerun with a smaller [analysis] first_step");
  if (r.rotation_capacity) {
    report.log.push_back(format_text("theta_u %.2f mrad, available plastic rotation theta_u - theta_p %.2f mrad, "
                                     "rotation capacity R = %.2f",
                                     1e3 * *r.theta_u, 1e3 * (*r.theta_u - theta_p), *r.rotation_capacity) +
                         (r.rotation_capacity_is_lower_bound ? " (lower bound: the run stopped before M fell back to Mp)"
                                                             : ""));
    report.log.push_back(format_text("R with the beam-theory theta_p (%.2f mrad, bending only) would be %.2f; R uses "
                                     "the computed theta_p (summary.json theta_p_note says why they differ)",
                                     1e3 * hinge.theta_p_beam, *r_beam));
  } else {
    report.log.push_back("rotation capacity: none (" + r.message + ")");
  }
  if (check) report.log.push_back("demand " + check->verdict + ": " + check->note);
  std::string mode_words = failure.mode;  // the identifier as words for the log (summary.json keeps it)
  for (char& ch : mode_words)
    if (ch == '_') ch = ' ';
  report.log.push_back("failure mode: " + mode_words + " (" + failure.reason + ")");
  return report;
}

}  // namespace rotcap::app
