#pragma once
// LoadingSetup: everything one loading arrangement of the hinge zone decides, so that a new setup
// is one class (a file pair here), one line in make_loading_setup and one HingeSetup value with
// its case-file spelling. The generic mesh (stations, grading, plates, stiffener plates, lateral
// restraints) is model/hinge_zone/hinge_zone_mesher.hpp; a setup tells it
//   - its special x's (load points), its hinge region and which end sections are rigid
//     (stations()), and the stiffeners of StiffenerPlacement::supports_and_loads;
//   - its supports, rigid ties, loads, groups and the hinge-rotation measure (apply()), with the
//     hinge moment per load factor, reference load, lever arm and shear span;
//   - where the axial load goes (or that there is none), and which end sections are tied rigidly
//     (a lateral restraint there is held by the tie's reference node);
// and answers, for the rest of the program, the beam-theory rotation at Mp, the coefficients of
// the member-rotation integral and whether the linear-hardening hinge law exists
// (model/laws/hinge_laws.hpp), and the hinge sections and compression flange of the half-sine
// imperfection (model/patterns/imperfection.hpp).
//
// Load factor 1 gives M = Mp of the plate model at the hinge. Units: N, mm, rad. Setups hold no
// state: loading_setup(HingeSetup) returns shared instances.

#include "model/hinge_zone/hinge_zone_spec.hpp"
#include "model/hinge_zone/section_grid.hpp"

#include <memory>
#include <optional>
#include <string>
#include <vector>

namespace rotcap {

/// Coefficients (c1, c2) of the member-rotation integrals of model/laws/hinge_laws.hpp [mm]:
/// theta(M0) = c1 / M0^2 int_0^M0 kappa(m) m dm + c2 kappa(M0).
struct RotationIntegral {
  double c1 = 0.0;
  double c2 = 0.0;
};

/// What a setup asks of the mesher along x (all in [0, L], mm).
struct SetupStations {
  std::vector<double> loads;               ///< load points: special x's (node lines)
  std::vector<double> default_stiffeners;  ///< StiffenerPlacement::supports_and_loads
  bool rigid_start = false;  ///< the x = 0 section is fixed or tied rigidly: no stiffener there
  bool rigid_end = false;    ///< likewise the x = L section
  double hinge_lo = 0.0;     ///< hinge region [hinge_lo, hinge_hi], meshed at h_e
  double hinge_hi = 0.0;
};

/// The meshed hinge zone a setup places its supports, ties, loads and rotation measure on. The
/// nodes and elements are in out.model; out.plate, plastic_moment, axial_force and span are set.
struct HingeZoneMesh {
  const HingeZoneSpec& spec;
  const SectionGrid& grid;
  const Stations& stations;
  HingeZoneModel& out;

  int last() const { return static_cast<int>(stations.x.size()) - 1; }  ///< the x = L station
  /// A new reference node at (x, 0, 0) in the point group `name`; returns its index.
  int add_reference(const std::string& name, double x) const;
};

class LoadingSetup {
 public:
  virtual ~LoadingSetup() = default;

  virtual HingeSetup kind() const = 0;
  /// The case file's spelling ("cantilever", ...).
  virtual const char* name() const = 0;

  // ---- Input rules (member.load_spacing, member.axial_load_ratio, member.support) ----
  virtual bool needs_load_spacing() const { return false; }
  virtual bool allows_axial_load() const { return false; }
  virtual bool allows_support_choice() const { return false; }

  // ---- Mesh ----
  /// Special x's and the hinge region for spec.length = L; hinge_reach = n h_e [mm], the hinge
  /// region's extent from the section(s) of the largest moment.
  virtual SetupStations stations(const HingeZoneSpec& spec, double hinge_reach) const = 0;
  /// Adds supports, ties, loads and groups; sets reference_load, lever_arm, shear_span and
  /// rotation of mesh.out, and the axial load as a fixed load when allows_axial_load().
  virtual void apply(const HingeZoneMesh& mesh) const = 0;
  /// Whether station i (of 0..last) is an end section tied rigidly to a reference node, whose
  /// supports already hold a lateral restraint there.
  virtual bool tied_section(int i, int last) const = 0;

  // ---- Beam theory and hinge laws ----
  /// Hinge rotation at M = Mp by the definition of apply()'s rotation, EI = E Iy of the plate
  /// model [N mm^2], shear deformation neglected.
  virtual double beam_theory_rotation_at_mp(const HingeZoneModel& m, double EI) const = 0;
  /// The part of the same rotation at M = Mp that the shear deformation adds in Timoshenko beam
  /// theory, GAv = G Av of the web [N]: the shear force V over a length s moves the section by
  /// V s / (G Av). Zero where the hinge carries no shear (uniform moment).
  virtual double shear_rotation_at_mp(const HingeZoneModel& m, double GAv) const = 0;
  /// (c1, c2) for the length L > 0 and, where the setup has one, the shear span a; throws
  /// std::invalid_argument for an a out of range.
  virtual RotationIntegral rotation_integral(double length, double shear_span) const = 0;
  /// Why the linear-hardening hinge law does not exist for this setup; nullopt when it does.
  virtual std::optional<std::string> no_hardening_hinge_law() const { return std::nullopt; }

  // ---- Half-sine imperfection ----
  /// The sections x_h [mm] where the local wave trains start.
  virtual std::vector<double> hinge_sections(const HingeZoneModel& m) const = 0;
  /// Whether the top flange is the compression flange (sagging); false for hogging. The mesher
  /// coarsens the other side (HingeZoneSpec::tension_coarsening).
  virtual bool top_flange_in_compression() const { return true; }
};

/// A new instance of the class of `setup`.
std::unique_ptr<LoadingSetup> make_loading_setup(HingeSetup setup);
/// The shared instance of the class of `setup`.
const LoadingSetup& loading_setup(HingeSetup setup);
/// The quoted names of the setups for which `rule` holds, in HingeSetup order, joined by ", " and
/// a final " or " (for messages: "\"cantilever\" or \"uniform_moment\"").
std::string setup_names_where(bool (LoadingSetup::*rule)() const);

}  // namespace rotcap
