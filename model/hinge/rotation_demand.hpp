#pragma once
// The engineer's question for a plastic hinge: does it rotate as far as the collapse mechanism needs?
// A demand is a required plastic rotation theta_pl,req [rad] (from the mechanism analysis of the
// frame) or a required rotation capacity R_req (e.g. R >= 3, common practice for plastic global
// analysis). The available values come from the extracted curve (model/hinge/hinge_curve.hpp) with
// the computed theta_p (the shell's own initial slope):
//   available plastic rotation  theta_pl = theta_u - theta_p,   R = theta_u / theta_p - 1.
// Verdict (margin = available - required, in the demand's unit):
//   - the curve fell back to Mp (theta_u final): "met" when available >= required, else "not met";
//   - the run ended above Mp (theta_u is a lower bound): "met" when the lower bound already reaches
//     the demand, else "not shown" (the run stopped first: a larger max_rotation would tell);
//   - M_max < Mp: "not met" (the hinge never develops Mp; no rotation is available at Mp).
// Why the computed theta_p and not the beam-theory one: theta_u and theta_p then come from the same
// curve, so theta_u - theta_p counts only rotation beyond the member's actual elastic response;
// beam theory's smaller theta_p (no shear deformation, no plate flexibility at support and load, no
// early yield where residual stresses sit at yield) would count that elastic rotation as plastic
// and overstate R.
#include "model/hinge/hinge_curve.hpp"

#include <optional>
#include <string>

namespace rotcap {

struct RotationDemand {
  enum class Kind { plastic_rotation, rotation_capacity };
  Kind kind = Kind::plastic_rotation;
  double required = 0.0;  ///< theta_pl,req [rad] or R_req [-]; > 0
};

struct DemandCheck {
  std::optional<double> available;  ///< theta_u - theta_p [rad] or R [-]; none when M_max < Mp
  std::optional<double> margin;     ///< available - required (same unit)
  std::string verdict;              ///< "met", "not met" or "not shown"
  double required_theta_u = 0.0;    ///< the theta_u the demand needs [rad]: theta_p + theta_pl,req or theta_p (1 + R_req)
  std::string note;                 ///< one sentence with the numbers
};

/// The demand against the extraction (which must have a theta_p).
DemandCheck check_rotation_demand(const RotationDemand& demand, const HingeCurveResult& extraction);

}  // namespace rotcap
