#pragma once
// Four-point bending (HingeSetup::four_point, case file "four_point"): a simply supported beam of
// span L with two equal loads at x = a and L - a, a = (L - load_spacing) / 2; the hinge is the
// constant-moment zone between them (sagging: the top flange in compression).
//
//   Supports: the end bearings of end_bearings.hpp.
//   Loads: P = Mp / a downward at each of the top-flange centre-line nodes at a and L - a, groups
//     "load_point_a", "load_point_b" (M = P a; lever arm and shear span a). Groups
//     "deflection_a", "deflection_b": the bottom-flange centre-line nodes at a and L - a. No
//     axial load. Needs member.load_spacing, 0 < s < L.
//   Hinge region [a - n h_e, L - a + n h_e] (the constant-moment zone and n h_e each side).
//     Stiffeners (StiffenerPlacement::supports_and_loads) over both supports and under the loads.
//   Hinge rotation theta = 2 delta / a, delta the mean of -uz at "deflection_a" and
//     "deflection_b": the relative rotation of the chords from the bearings to the load points,
//     which bound the constant-moment zone.
//   Beam theory: delta(a) = P a^2 (3 L - 4 a) / (6 EI), theta = 2 delta / a = Mp (3 L - 4 a) / (3 EI).
//   Member-rotation integral (c1, c2) = (2a, L - 2a), 0 < a <= L/2.

#include "model/setups/loading_setup.hpp"

namespace rotcap {

class FourPointSetup final : public LoadingSetup {
 public:
  HingeSetup kind() const override { return HingeSetup::four_point; }
  const char* name() const override { return "four_point"; }
  bool needs_load_spacing() const override { return true; }
  SetupStations stations(const HingeZoneSpec& spec, double hinge_reach) const override;
  void apply(const HingeZoneMesh& mesh) const override;
  bool tied_section(int, int) const override { return false; }
  double beam_theory_rotation_at_mp(const HingeZoneModel& m, double EI) const override;
  double shear_rotation_at_mp(const HingeZoneModel& m, double GAv) const override;
  RotationIntegral rotation_integral(double length, double shear_span) const override;
  std::vector<double> hinge_sections(const HingeZoneModel& m) const override;

  /// a = (L - load_spacing) / 2 [mm].
  static double shear_span(const HingeZoneSpec& spec) { return 0.5 * (spec.length - spec.load_spacing); }
};

}  // namespace rotcap
