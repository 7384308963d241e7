#pragma once
// The numbers a hinge-zone run reports, from its converged curve: the extraction (docs/spec/interface.md
// definitions, model/hinge_curve.hpp) done once per run, the failure mode from the deformation
// added after the peak, and their summary.json keys and log lines.
#include "app/hinge_case.hpp"
#include "app/hinge_stages.hpp"
#include "model/hinge/hinge_curve.hpp"
#include "model/hinge/rotation_demand.hpp"
#include "model/patterns/residual_stress.hpp"

#include <optional>

#include <Eigen/Core>

#include <string>
#include <vector>

namespace rotcap::app {

/// One converged point of the hinge curve.
struct HingePoint {
  int step = 0;
  double load_factor = 0.0;
  double moment = 0.0;     ///< [N mm]
  double rotation = 0.0;   ///< [rad]
  double max_plastic_strain = 0.0;
  int iterations = 0;
  int negative_pivots = 0;
};

std::vector<MomentRotationPoint> moment_rotation_points(const std::vector<HingePoint>& curve);

/// The extraction of the reported numbers from the curve (Mp, Mel, theta_p_beam of the case).
HingeCurveResult extract_hinge_results(const HingeCase& hinge, const std::vector<HingePoint>& curve);

struct FailureMode {
  std::string mode = "none";  ///< DeformationMode name, or "none"
  std::string reason = "the moment did not fall from its peak within the analysed range";
};

/// The shape of the deformation added after the peak (u_end - u_peak, full vectors); "none" unless
/// the curve fell from its peak by at least 1 % within the run.
FailureMode classify_failure(const HingeCase& hinge, const std::vector<HingePoint>& curve,
                             const HingeCurveResult& extraction, const Eigen::VectorXd& u_peak,
                             const Eigen::VectorXd& u_end);

/// summary.json's result keys (mp_kNm, m_max_kNm, theta_p_mrad, rotation_capacity, failure_mode, ...;
/// both R, with the computed and with the beam-theory theta_p, and why they differ; the available
/// plastic rotation; the demand's verdict when the case has one) and the results table for the log.
StageReport hinge_results_report(const HingeCase& hinge, const HingeCurveResult& extraction,
                                 const FailureMode& failure, const std::optional<RotationDemand>& demand,
                                 ResidualStressKind residual_stress);

}  // namespace rotcap::app
