#pragma once
// Deformation shape of a hinge-zone model: how much of a displacement field is rigid motion of
// the cross-sections and how much is out-of-plane distortion of the flanges and the web, station
// by station, and a label for it (flange or web local buckling, lateral-torsional, none). Used to
// pick a local buckling mode as an imperfection (model/patterns/imperfection.hpp) and to name the failure
// mode of a run from the displacement increment between the peak and the end.
//
// Input: a full displacement vector, 6 entries per node in the order of Dof (ux .. rz) [mm, rad];
// only the translations are used. Geometry as in model/hinge_zone/hinge_zone_mesher.hpp: x along the member,
// web in the x-z plane at y = 0, flanges at z = +-zf. Plates are recognised by their elements'
// region names ("top_flange", "bottom_flange", "web"); stiffener-only and reference nodes (used by
// no element) are ignored. Nodes belong to the station (node line) whose x they lie on.
//
// At each station, with r = X - X_c measured from the section centre X_c (the midpoint of the two
// flange-web junction nodes):
//  1. rigid motion: the six section DOFs q = (U, theta) minimising sum_i |u_i - (U + theta x r_i)|^2
//     over the section's flange and web nodes (small-displacement rigid body, linear least squares);
//  2. residual  d_i = u_i - (U + theta x r_i);
//  3. flange distortion: d_z at each flange node minus d_z at that flange's junction node, so the
//     measure is the out-of-plane deflection of the plate relative to the edge the web supports
//     (a uniform shift of a flange, e.g. the second-order (cos theta - 1) z of a finite bending
//     rotation, is no distortion); the station value is the largest magnitude over the flange;
//  4. web distortion: d_y at each web node minus the chord between its two junction nodes (linear
//     in z); the station value is the largest magnitude;
//  5. lateral-torsional measure: |U_y| + |theta_x| h / 2 (rigid lateral displacement and twist).
//
// Classification (classify), with F = largest flange distortion, W = largest web distortion,
// T = largest lateral-torsional measure over all stations [mm], b the flange width, h_w = 2 zf:
//  a. none when F, W and T are all below none_ratio * h (default h/1000);
//  b. the distorted plate: the flange when F / (b/2) >= web_weight * W / h_w, else the web. The
//     plate measures are deflections per plate width (the EN 1993-1-5 Annex C way of sizing local
//     imperfections, b/200). Why web_weight = 4: a web bent only by the rotation phi = F / (b/2)
//     of a buckling flange's junction (other edge pinned or fixed) deflects at most
//     0.19 phi h_w (cubic shapes s^3 - s, s^2 (s - 1); our derivation), i.e. W / h_w <= 0.19 F/(b/2),
//     while a web bulging as a half-sine across its depth turns the junction, and a flange that
//     follows it freely, by at most pi W / h_w, i.e. F/(b/2) <= 3.14 W / h_w; 4 separates the two.
//     On elastic buckling modes of IPE 300 and HEA 300 cantilevers and an IPE 600 three-point beam
//     computed with rotcap's linear buckling solver during development, (W/h_w) / (F/(b/2)) was
//     0.15-0.20 for the flange modes and 0.38-0.47 for the web modes (threshold 1/4);
//  c. local buckling of that plate when its distortion D (F or W, mm) satisfies
//     distortion_preference * D >= T (default 2: distortion wins when at least half the rigid
//     lateral-torsional motion, since local buckling drags some twist with it) and D >= the none
//     threshold; otherwise lateral_torsional.

#include "model/hinge_zone/hinge_zone_mesher.hpp"

#include <Eigen/Core>
#include <string>
#include <vector>

namespace rotcap {

enum class DeformationMode { none, flange_local_buckling, web_local_buckling, lateral_torsional };
const char* deformation_mode_name(DeformationMode mode);

using SectionMotion = Eigen::Matrix<double, 6, 1>;  ///< (U_x, U_y, U_z, theta_x, theta_y, theta_z) [mm, rad]

/// Shape of one station.
struct StationDeformation {
  double x = 0.0;                               ///< station position [mm]
  SectionMotion rigid = SectionMotion::Zero();  ///< fitted rigid motion about the section centre
  double top_flange = 0.0;                      ///< largest |out-of-plane distortion| of the top flange [mm]
  double bottom_flange = 0.0;                   ///< same for the bottom flange [mm]
  double web = 0.0;                             ///< largest |out-of-plane distortion| of the web [mm]
  double lateral_torsional = 0.0;               ///< |U_y| + |theta_x| h/2 [mm]
};

/// A largest value over the stations and where it occurs.
struct PeakMeasure {
  double value = 0.0;  ///< [mm]
  double x = 0.0;      ///< station position [mm]
  int station = -1;    ///< index into SectionDeformation::stations; -1 when there are none
};

/// Plate dimensions of the hinge-zone model, read from its nodes and elements.
struct HingeSectionGeometry {
  double b = 0.0;                                ///< flange width [mm]
  double zf = 0.0;                               ///< flange mid-plane height |z| [mm]
  double tf = 0.0;                               ///< flange thickness [mm]
  double tw = 0.0;                               ///< web thickness [mm]
  double h() const { return 2.0 * zf + tf; }     ///< overall depth [mm]
  double web_depth() const { return 2.0 * zf; }  ///< h - tf [mm]
};

struct SectionDeformation {
  HingeSectionGeometry geometry;
  std::vector<StationDeformation> stations;  ///< ascending x
  PeakMeasure top_flange, bottom_flange;
  PeakMeasure flange;  ///< the larger of top_flange and bottom_flange
  PeakMeasure web;
  PeakMeasure lateral_torsional;
};

struct ClassifyOptions {
  double none_ratio = 1e-3;            ///< threshold = none_ratio * h; > 0
  double web_weight = 4.0;             ///< rule b of the header; > 0
  double distortion_preference = 2.0;  ///< rule c of the header; >= 1
};

/// The label and the numbers that led to it.
struct Classification {
  DeformationMode mode = DeformationMode::none;
  double flange_ratio = 0.0;  ///< F / (b/2)
  double web_ratio = 0.0;     ///< W / h_w
  double threshold = 0.0;     ///< none_ratio * h [mm]
  /// e.g. "flange_local_buckling: flange distortion F = 1.2 mm at x = 37.5 mm ...": F, W the largest
  /// out-of-plane distortion of a flange and of the web, T the lateral-torsional measure
  /// |U_y| + |theta_x| h/2, D the distortion of the plate the label names (all mm).
  std::string message;
};

/// Station index of a hinge-zone model, built once, then applied to any number of fields.
class SectionDeformationAnalysis {
 public:
  /// Copies what it needs (no reference to `hinge` is kept). Throws std::invalid_argument when
  /// the model lacks the regions "top_flange", "bottom_flange" and "web", when a flange or web
  /// node lies on no station, or when a station lacks a flange-web junction node.
  explicit SectionDeformationAnalysis(const HingeZoneModel& hinge);

  /// u: full displacement vector of size 6 * node count (std::invalid_argument otherwise).
  SectionDeformation analyse(const Eigen::VectorXd& u) const;

  const HingeSectionGeometry& geometry() const { return geometry_; }
  int station_count() const { return static_cast<int>(stations_.size()); }

 private:
  struct Station {
    double x = 0.0;
    Eigen::Vector3d centre = Eigen::Vector3d::Zero();
    std::vector<int> all;               // distinct flange and web nodes of the section
    std::vector<int> top, bottom, web;  // per plate; web by ascending z, junctions included
    int top_junction = -1, bottom_junction = -1;
    Eigen::Matrix<double, 6, 6> normal_inverse = Eigen::Matrix<double, 6, 6>::Zero();
  };
  std::vector<Eigen::Vector3d> positions_;  // the model's node coordinates at construction
  HingeSectionGeometry geometry_;
  std::vector<Station> stations_;
};

/// Applies the rule of the header. Throws std::invalid_argument for options out of range.
Classification classify_detailed(const SectionDeformation& d, const ClassifyOptions& options = {});
DeformationMode classify(const SectionDeformation& d, const ClassifyOptions& options = {});

}  // namespace rotcap
