#pragma once
// Uniform moment (HingeSetup::uniform_moment, case file "uniform_moment"): equal and opposite end
// moments on a member of length L, the whole member the hinge (sagging: the top flange in
// compression).
//
//   Supports and load: both end sections tied rigidly to reference nodes at (0, 0, 0) and
//     (L, 0, 0), groups "end_section_a" -> "end_a" and "end_section_b" -> "end_b"; each reference
//     node fixed in uy, uz, rx, "end_a" also in ux; moments M_y = +Mp at "end_a" and -Mp at
//     "end_b" (reference load Mp, lever arm and shear span 0).
//   Axial load: N as ShellModel::fixed_loads force -N e_x at "end_b" (the ux support of "end_a"
//     reacts it).
//   Hinge region [0, L]. No stiffener at the tied end sections; a lateral restraint there is held
//     by the reference node (its group is created, no Support added).
//   Hinge rotation theta = ry("end_a") - ry("end_b"), the relative rotation of the end sections.
//   Beam theory: end slopes +-M L / (2 EI), theta = Mp L / (EI).
//   Member-rotation integral (c1, c2) = (0, L). No linear-hardening hinge law: with no moment
//     gradient the whole zone yields at once.

#include "model/setups/loading_setup.hpp"

namespace rotcap {

class UniformMomentSetup final : public LoadingSetup {
 public:
  HingeSetup kind() const override { return HingeSetup::uniform_moment; }
  const char* name() const override { return "uniform_moment"; }
  bool allows_axial_load() const override { return true; }
  SetupStations stations(const HingeZoneSpec& spec, double hinge_reach) const override;
  void apply(const HingeZoneMesh& mesh) const override;
  bool tied_section(int i, int last) const override { return i == 0 || i == last; }
  double beam_theory_rotation_at_mp(const HingeZoneModel& m, double EI) const override;
  double shear_rotation_at_mp(const HingeZoneModel& m, double GAv) const override;
  RotationIntegral rotation_integral(double length, double shear_span) const override;
  std::optional<std::string> no_hardening_hinge_law() const override;
  std::vector<double> hinge_sections(const HingeZoneModel& m) const override;
};

}  // namespace rotcap
