#pragma once
// The simple hinge laws beside a shell hinge curve, and how far the shell curve follows each
// (model/hinge_laws.hpp, model/moment_curvature.hpp, model/fitted_hinge_law.hpp):
//   (a) elastic-perfectly plastic at Mp with the shell's k_el;
//   (b) linear strain-hardening hinge (spread of plasticity with the steel's hardening modulus);
//   (c) moment-curvature integration of the plate-model section (with the residual-stress pattern),
//       integrated along the member by beam theory, its elastic compliance matched to the shell:
//       theta = theta_int + M (1/k_el - 1/k_beam), k_beam = Mp / theta_p_beam;
//   the fitted multilinear law of the shell curve itself.
// (a) and (b) are drawn over max(1.5 theta_last, 2 theta_p); (b) and (c) need a yielding steel.
// Comparison of each law with the shell curve (all moments N mm, rotations rad):
//   M_law at the shell's theta at M_max and at theta_u, the relative error (M_shell - M_law) / M_law
//   there (at theta_u the shell's moment is Mp where the falling branch crosses it, else its last
//   point); the first rotation from which the shell falls more than 5 % below the law, compared
//   from 2 theta_p for (a), (b) (a sharp knee a real section rounds off) and from theta_p for (c);
//   the largest |M_shell - M_law| / Mp over shell points with theta <= 5 theta_p in the law's range.
#include "materials/steel_curve.hpp"
#include "model/laws/fitted_hinge_law.hpp"
#include "model/hinge/hinge_curve.hpp"
#include "model/laws/hinge_laws.hpp"
#include "model/hinge_zone/hinge_zone_mesher.hpp"
#include "model/laws/moment_curvature.hpp"
#include "model/patterns/residual_stress.hpp"

#include <optional>
#include <string>
#include <vector>

namespace rotcap {

struct HingeLawCurve {
  std::string key;    ///< "elastic_perfectly_plastic", "linear_hardening", "moment_curvature"
  std::string label;  ///< "(a) elastic-perfectly plastic at Mp", ...
  std::vector<MomentRotationPoint> curve;  ///< empty: not defined (note says why)
  std::string note;
};

struct HingeLawComparison {
  bool defined = false;
  std::optional<double> m_at_theta_at_m_max;      ///< [N mm]
  std::optional<double> error_at_theta_at_m_max;  ///< (M_shell - M_law) / M_law
  std::optional<double> m_at_theta_u;             ///< [N mm]
  std::optional<double> error_at_theta_u;
  std::optional<double> theta_first_below_5pct;   ///< [rad]
  double compared_from_theta_over_theta_p = 0.0;
  double max_difference_over_mp_up_to_5_theta_p = 0.0;
  double law_end_theta = 0.0;                     ///< [rad]
};

/// What the laws are built from: the hinge-zone model, its section and steel, the residual-stress
/// pattern kind, and the beam-theory theta_p of the same rotation definition.
struct HingeLawInputs {
  const HingeZoneModel& zone;
  const ISection& section;
  const SteelModel& steel;
  ResidualStressKind residual_stress = ResidualStressKind::none;
  double theta_p_beam = 0.0;  ///< [rad]
};

struct HingeLawSet {
  double k_el = 0.0;    ///< the shell's initial slope [N mm/rad] (beam theory when absent)
  double theta_p = 0.0; ///< Mp / k_el [rad]
  std::vector<HingeLawCurve> laws;                ///< (a), then (b), (c) for a yielding steel
  std::vector<HingeLawComparison> comparisons;    ///< one per law, same order
  std::optional<HardeningHingeLaw> hardening;     ///< law (b) with its slope
  std::optional<MomentCurvatureCurve> moment_curvature;  ///< the section curve of law (c)
  FittedHingeLaw fitted;
};

/// Builds and compares the laws for the shell curve `shell` and its extraction `extraction`.
HingeLawSet compare_hinge_laws(const std::vector<MomentRotationPoint>& shell, const HingeCurveResult& extraction,
                               const HingeLawInputs& inputs);

}  // namespace rotcap
