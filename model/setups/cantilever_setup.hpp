#pragma once
// Cantilever (HingeSetup::cantilever, case file "cantilever"): a member of length L from its
// support section (x = 0) to the load point (x = L); the hinge forms at the support (hogging: the
// bottom flange in compression).
//
//   Support: the x = 0 section, group "support": all six DOFs of all its nodes fixed
//     (CantileverSupport::fixed), or a symmetry plane (CantileverSupport::symmetry): ux, ry, rz of
//     every node, uy and uz of the web line, group "support_web".
//   Load: the x = L section, group "end_section", tied rigidly (RigidTie) to the reference node at
//     (L, 0, 0), group "load_point" (used by no element), fixed in uy and rx; reference load
//     F_z = -Mp / L at "load_point" (M = P L at the support; lever arm and shear span L).
//   Axial load: N as ShellModel::fixed_loads force -N e_x at "load_point".
//   Hinge region [0, n h_e]. No stiffener at either end (fixed, tied); a lateral restraint at
//     x = L is held by the reference node (its group is created, no Support added).
//   Hinge rotation theta = delta_tip / L, delta_tip = -uz("load_point").
//   Beam theory: delta = P L^3 / (3 EI), theta = delta / L = Mp L / (3 EI).
//   Member-rotation integral (c1, c2) = (L, 0): M(x) = M0 (1 - x/L).

#include "model/setups/loading_setup.hpp"

namespace rotcap {

class CantileverSetup final : public LoadingSetup {
 public:
  HingeSetup kind() const override { return HingeSetup::cantilever; }
  const char* name() const override { return "cantilever"; }
  bool allows_axial_load() const override { return true; }
  bool allows_support_choice() const override { return true; }
  SetupStations stations(const HingeZoneSpec& spec, double hinge_reach) const override;
  void apply(const HingeZoneMesh& mesh) const override;
  bool tied_section(int i, int last) const override { return i == last; }
  double beam_theory_rotation_at_mp(const HingeZoneModel& m, double EI) const override;
  double shear_rotation_at_mp(const HingeZoneModel& m, double GAv) const override;
  RotationIntegral rotation_integral(double length, double shear_span) const override;
  std::vector<double> hinge_sections(const HingeZoneModel& m) const override;
  bool top_flange_in_compression() const override { return false; }
};

}  // namespace rotcap
