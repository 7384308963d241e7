#pragma once
// Geometric imperfections of a hinge-zone model (model/hinge_zone/hinge_zone_mesher.hpp) as node offsets
// [mm] to add to the model's coordinates (docs/spec/mechanics.md, "Linear buckling and imperfections").
// Every function returns one offset per node (size node_count()), computed from the coordinates
// the model has when it is called: compute all offsets from the perfect model, then add them
// (add_offsets). A node shared by two plates (flange-web junction, stiffener edges) gets one
// offset, because every pattern below is one continuous field of the position.
//
// Global bow (lateral, y):
//   half_sine  dy = e0 sin(pi x / L): zero at both ends. The default for every setup, since each
//              holds uy at both ends: the cantilever's load point is restrained laterally and
//              against twist (docs/spec/interface.md, "Supports and loading"), the beams at their bearings
//              and twist restraints, the uniform-moment ends at their reference nodes.
//   free_tip   dy = e0 (1 - cos(pi x / (2 L))): the quarter-wave of a cantilever with a free tip
//              (largest at x = L); for studies that release the tip.
//   EN 1993-1-5 C.5 Table C.2 gives e0 = L/400 for a member (from memory); the case file default
//   is L/1000. The bow follows the whole length L; lateral restraints in between do not shorten it.
//
// Half-sine local pattern (analytical, EN 1993-1-5 C.5 Table C.2 "local panel", amplitude from the
// input, e.g. b/200; from memory):
//   along x   w(x) = sum over hinge sections x_h of sin(pi (x - x_h) / lambda) e(|x - x_h|), a wave
//             train with a node at x_h (where a support or a stiffener holds the section) and an
//             envelope e(d) = 1 for d <= lambda, 0.5 (1 + cos(pi (d - lambda) / ((n - 1) lambda)))
//             for lambda < d < n lambda, 0 beyond: n = half_waves half-waves each side, the first at
//             full amplitude, the rest fading out (for n = 1 only the first);
//   hinge sections x_h (LoadingSetup::hinge_sections, model/setups/): cantilever x = 0 (the
//             support; only x >= 0 exists), three_point L/2 (the load), four_point a and L - a
//             (the loads), uniform_moment L/2;
//   flange    dz = A_f (2 y / b) w_f(x) (antisymmetric: the flange turns about the junction, one
//             outstand up, the other down) or A_f (2 |y| / b) w_f(x) (symmetric), lambda_f = b/2,
//             the outstand width c of the plate model; zero at the junction, +-A_f at the tips;
//   web       dy = A_w sin(pi (z + zf) / (2 zf)) w_w(x), lambda_w = h_w = 2 zf (sine across the
//             depth, zero at the junctions);
//   the compression flange by default (LoadingSetup::top_flange_in_compression): bottom for
//             the cantilever (hogging at the support under the downward tip load), top for
//             three_point, four_point and uniform_moment (sagging);
//   the field between the flanges: dz interpolates linearly in z between the two flange fields at
//             the same (x, y) (only stiffener nodes lie there off the web), dy is the web field at
//             (x, z) for every node between the flanges. Nodes used by no element (reference nodes
//             of rigid ties) get no local offset.
//   Each plate's offsets are finally scaled so that the largest nodal |offset| equals its amplitude
//   exactly (the nodes need not sit on a crest). The element length along x must not exceed
//   lambda / 2 (else std::invalid_argument), so a node lies within lambda / 4 of every crest.
//
// Buckling-mode local imperfection: the first mode (in the order given, lowest load factor first)
// that section_deformation classifies as flange or web local buckling (or the n-th such mode,
// ModeImperfectionOptions::local_mode), scaled so that its largest
// out-of-plane plate distortion (relative to the section's rigid motion at that station, as
// defined in model/patterns/section_deformation.hpp) equals the amplitude. Each mode is classified after
// normalising its largest nodal translation to h, so the none threshold (none_ratio h) is relative.

#include "model/hinge_zone/hinge_zone_mesher.hpp"
#include "model/patterns/section_deformation.hpp"

#include <Eigen/Core>
#include <optional>
#include <span>
#include <string>
#include <vector>

namespace rotcap {

using NodeOffsets = std::vector<Eigen::Vector3d>;  ///< one offset per node [mm]

enum class BowShape { half_sine, free_tip };

struct GlobalBowOptions {
  double amplitude = 0.0;  ///< e0 [mm], finite, >= 0 (sign: +y)
  BowShape shape = BowShape::half_sine;
};

/// Lateral bow. Throws OptionError for a bad amplitude ("imperfection.global_amplitude").
NodeOffsets global_bow(const HingeZoneModel& hinge, const GlobalBowOptions& options);

enum class ImperfectFlange { compression, top, bottom, both, none };
enum class FlangeWave { antisymmetric, symmetric };

struct HalfSineOptions {
  double flange_amplitude = 0.0;  ///< A_f [mm] at the flange tips, >= 0
  double web_amplitude = 0.0;     ///< A_w [mm] at mid-depth, >= 0 (0: no web pattern)
  ImperfectFlange flange = ImperfectFlange::compression;
  FlangeWave across = FlangeWave::antisymmetric;
  std::optional<double> flange_half_wave;  ///< lambda_f [mm] > 0; default b/2
  std::optional<double> web_half_wave;     ///< lambda_w [mm] > 0; default h - tf
  int half_waves = 3;                      ///< n >= 1 each side of a hinge section
};

/// Analytical local pattern. Throws OptionError naming the option ("imperfection.*" keys for
/// amplitudes) for a negative amplitude, a half-wave <= 0, n < 1, or ("mesh.aspect") elements along
/// x longer than lambda / 2 near a hinge section.
NodeOffsets half_sine_imperfection(const HingeZoneModel& hinge, const HalfSineOptions& options);

struct ModeImperfectionOptions {
  double amplitude = 0.0;  ///< largest plate distortion after scaling [mm], > 0
  int local_mode = 1;      ///< take the n-th local mode in the order given (1: the first), >= 1
  ClassifyOptions classify;
};

struct ModeImperfection {
  bool found = false;
  int mode = -1;  ///< index into the modes given; -1 if none
  DeformationMode classification = DeformationMode::none;
  std::vector<DeformationMode> classifications;  ///< of every mode examined, in order
  double scale = 0.0;                            ///< offsets = scale * mode translations
  double distortion_x = 0.0;                     ///< x of the largest plate distortion [mm]
  NodeOffsets offsets;                           ///< empty when !found
  /// "mode 1 (from 0) of 4 (flange_local_buckling), ..." or "no local mode among the 4 modes: ..."
  std::string message;
};

/// modes: full displacement vectors (6 per node, size dof_count()), lowest load factor first.
/// Throws OptionError for a bad amplitude, InternalError for a vector of the wrong size; a mode that
/// is zero is classified none.
ModeImperfection buckling_mode_imperfection(const HingeZoneModel& hinge, std::span<const Eigen::VectorXd> modes,
                                            const ModeImperfectionOptions& options);

/// model.nodes[i] += offsets[i]. InternalError when the sizes differ.
void add_offsets(ShellModel& model, const NodeOffsets& offsets);

/// Sum of two offset fields of the same size (InternalError otherwise).
NodeOffsets combine(const NodeOffsets& a, const NodeOffsets& b);

}  // namespace rotcap
