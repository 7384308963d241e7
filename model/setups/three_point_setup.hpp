#pragma once
// Three-point bending (HingeSetup::three_point, case file "three_point"): a simply supported beam
// of span L with one load at midspan, where the hinge forms (sagging: the top flange in
// compression).
//
//   Supports: the end bearings of end_bearings.hpp.
//   Load: P = 4 Mp / L downward at the top-flange centre-line node at L/2, group "load_point"
//     (M = P L / 4; lever arm L/4, shear span L/2). Group "midspan_bottom": the bottom-flange
//     centre-line node at L/2. No axial load.
//   Hinge region [L/2 - n h_e, L/2 + n h_e]. Stiffeners (StiffenerPlacement::supports_and_loads)
//     over both supports and under the load.
//   Hinge rotation theta = 4 delta_mid / L, delta_mid = -uz("midspan_bottom").
//   Beam theory: delta = P L^3 / (48 EI), theta = 4 delta / L = Mp L / (3 EI).
//   Member-rotation integral (c1, c2) = (L, 0), as two cantilevers of length L/2.

#include "model/setups/loading_setup.hpp"

namespace rotcap {

class ThreePointSetup final : public LoadingSetup {
 public:
  HingeSetup kind() const override { return HingeSetup::three_point; }
  const char* name() const override { return "three_point"; }
  SetupStations stations(const HingeZoneSpec& spec, double hinge_reach) const override;
  void apply(const HingeZoneMesh& mesh) const override;
  bool tied_section(int, int) const override { return false; }
  double beam_theory_rotation_at_mp(const HingeZoneModel& m, double EI) const override;
  double shear_rotation_at_mp(const HingeZoneModel& m, double GAv) const override;
  RotationIntegral rotation_integral(double length, double shear_span) const override;
  std::vector<double> hinge_sections(const HingeZoneModel& m) const override;
};

}  // namespace rotcap
