// Imperfections of hinge-zone models: the global bow, the analytical half-sine local pattern
// (amplitudes, shapes, the compression flange, compatibility at shared nodes) and the choice and
// scaling of a local buckling mode.
#include "core/check.hpp"
#include "model/patterns/imperfection.hpp"
#include "tests/model/patterns/pattern_fields.hpp"
#include "tests/test_support.hpp"

#include <algorithm>
#include <stdexcept>

namespace rotcap {
namespace {

using namespace patterns_test;
using Motion = Eigen::Matrix<double, 6, 1>;

constexpr double kL = 1200.0, kB = 150.0, kZf = 144.65;

const HingeZoneModel& cantilever() {
  static const HingeZoneModel h = ipe300(HingeSetup::cantilever, kL);
  return h;
}

bool used(const ShellModel& m, int node) {
  for (const auto& e : m.elements)
    if (std::find(e.nodes.begin(), e.nodes.end(), node) != e.nodes.end()) return true;
  return false;
}

double max_abs(const NodeOffsets& o, int component, const std::vector<int>& nodes) {
  double v = 0.0;
  for (int n : nodes) v = std::max(v, std::abs(o[static_cast<std::size_t>(n)](component)));
  return v;
}

TEST(GlobalBow, HalfSineIsZeroAtTheEndsAndE0AtMidLength) {
  const HingeZoneModel& h = cantilever();
  const double e0 = kL / 1000.0;
  const NodeOffsets o = global_bow(h, {e0, BowShape::half_sine});
  ASSERT_EQ(o.size(), h.model.nodes.size());
  for (std::size_t i = 0; i < o.size(); ++i) {
    const double x = h.model.nodes[i].x();
    EXPECT_CLOSE(o[i].y(), e0 * std::sin(kPi * x / kL), 0.0, 1e-15);
    EXPECT_EQ(o[i].x(), 0.0);
    EXPECT_EQ(o[i].z(), 0.0);
    if (x == 0.0 || x == kL) {
      EXPECT_CLOSE(o[i].y(), 0.0, 0.0, 1e-15);
    }
  }
  double largest = 0.0;
  for (const auto& v : o) largest = std::max(largest, v.y());
  EXPECT_LE(largest, e0);
  EXPECT_GT(largest, 0.99 * e0);  // a station lies near L/2
  // The bow moves whole sections: no distortion, a lateral-torsional shape.
  Eigen::VectorXd u = Eigen::VectorXd::Zero(h.model.dof_count());
  for (std::size_t i = 0; i < o.size(); ++i) u.segment<3>(6 * static_cast<Eigen::Index>(i)) = o[i];
  const SectionDeformation d = SectionDeformationAnalysis(h).analyse(u);
  EXPECT_LT(d.flange.value + d.web.value, 1e-15);
  EXPECT_EQ(classify(d), DeformationMode::lateral_torsional);
}

TEST(GlobalBow, FreeTipShapeIsLargestAtTheTip) {
  const HingeZoneModel& h = cantilever();
  const NodeOffsets o = global_bow(h, {2.0, BowShape::free_tip});
  for (std::size_t i = 0; i < o.size(); ++i) {
    const double x = h.model.nodes[i].x();
    EXPECT_CLOSE(o[i].y(), 2.0 * (1.0 - std::cos(0.5 * kPi * x / kL)), 0.0, 1e-15);
  }
  const int tip = h.model.groups.at("load_point").nodes.front();
  EXPECT_CLOSE(o[static_cast<std::size_t>(tip)].y(), 2.0, 1e-15, 0.0);
  EXPECT_THROW(global_bow(h, {-1.0, BowShape::half_sine}), std::invalid_argument);
}

TEST(HalfSine, CompressionFlangeTipsReachTheAmplitudeNextToTheSupport) {
  // Cantilever: hogging at the support, the bottom flange is compressed. A_f = b/200 = 0.75 mm
  // (EN 1993-1-5 Annex C Table C.2, from memory).
  const HingeZoneModel& h = cantilever();
  HalfSineOptions o;
  o.flange_amplitude = kB / 200.0;
  const NodeOffsets d = half_sine_imperfection(h, o);
  const std::vector<int> bottom = region_of_nodes(h.model, "bottom_flange"),
                         top = region_of_nodes(h.model, "top_flange");
  EXPECT_CLOSE(max_abs(d, 2, bottom), 0.75, 1e-14, 0.0);
  EXPECT_EQ(max_abs(d, 2, top), 0.0);
  EXPECT_EQ(max_abs(d, 1, bottom), 0.0);
  const double lambda = 0.5 * kB;  // 75 mm = 4 elements of 18.75 mm
  for (int n : bottom) {
    const Eigen::Vector3d& p = h.model.nodes[static_cast<std::size_t>(n)];
    const double dz = d[static_cast<std::size_t>(n)].z();
    // First half-wave at full amplitude: sin(pi x / lambda) = 1 at x = lambda/2 = 37.5 mm (a station),
    // linear across: 2 y / b; zero at the junction and at the support.
    if (p.x() <= lambda) {
      EXPECT_CLOSE(dz, 0.75 * 2.0 * p.y() / kB * std::sin(kPi * p.x() / lambda), 0.0, 1e-14);
    }
    if (std::abs(p.x() - 0.5 * lambda) < 1e-9 && std::abs(p.y() - 75.0) < 1e-9) {
      EXPECT_CLOSE(dz, 0.75, 1e-14, 0.0);
    }
    if (p.y() == 0.0 || p.x() == 0.0) {
      EXPECT_EQ(dz, 0.0);
    }
    // Faded out after half_waves = 3 half-waves.
    if (p.x() >= 3.0 * lambda) {
      EXPECT_EQ(dz, 0.0);
    }
  }
  // The section-deformation analysis sees it as flange local buckling of about the amplitude.
  Eigen::VectorXd u = Eigen::VectorXd::Zero(h.model.dof_count());
  for (std::size_t i = 0; i < d.size(); ++i) u.segment<3>(6 * static_cast<Eigen::Index>(i)) = d[i];
  const SectionDeformation s = SectionDeformationAnalysis(h).analyse(u);
  EXPECT_EQ(classify(s), DeformationMode::flange_local_buckling) << classify_detailed(s).message;
  EXPECT_GT(s.bottom_flange.value, 0.9 * 0.75);
  EXPECT_LE(s.bottom_flange.value, 0.75 * (1.0 + 1e-12));
}

TEST(HalfSine, CompressionFlangeOfBeamsIsTheTopFlangeAtTheLoad) {
  // Three-point bending sags: the top flange is compressed; the wave has a node at the load
  // (L/2, where the stiffener is) and crests lambda/2 either side.
  const HingeZoneModel h = ipe300(HingeSetup::three_point, kL);
  HalfSineOptions o;
  o.flange_amplitude = 1.0;
  const NodeOffsets d = half_sine_imperfection(h, o);
  const std::vector<int> top = region_of_nodes(h.model, "top_flange");
  EXPECT_CLOSE(max_abs(d, 2, top), 1.0, 1e-14, 0.0);
  EXPECT_EQ(max_abs(d, 2, region_of_nodes(h.model, "bottom_flange")), 0.0);
  for (int n : top) {
    const Eigen::Vector3d& p = h.model.nodes[static_cast<std::size_t>(n)];
    const double dz = d[static_cast<std::size_t>(n)].z();
    if (std::abs(p.x() - 0.5 * kL) < 1e-9) {
      EXPECT_CLOSE(dz, 0.0, 0.0, 1e-15);
    }
    if (std::abs(p.x() - 0.5 * kL) >= 3.0 * 0.5 * kB) {
      EXPECT_EQ(dz, 0.0);
    }
  }
  // Stiffener nodes off the flanges follow the flange fields by linear interpolation in z; the
  // stiffener at L/2 sits on the wave's node, so it stays flat.
  for (int n : region_of_nodes(h.model, "stiffener"))
    EXPECT_CLOSE(d[static_cast<std::size_t>(n)].norm(), 0.0, 0.0, 1e-15);
}

TEST(HalfSine, SharedNodesGetOneCompatibleOffset) {
  // Flange wave and web bulge together, a stiffener inside the first flange half-wave
  // (x = 37.5 mm): every node has one offset, the junction lines none, and the stiffener's own
  // nodes the web's lateral field and the interpolated flange field.
  const HingeZoneModel h = ipe300(HingeSetup::cantilever, kL, {37.5});
  HalfSineOptions o;
  o.flange_amplitude = 0.75;
  o.web_amplitude = 1.4;
  const NodeOffsets d = half_sine_imperfection(h, o);
  const std::vector<int> top = region_of_nodes(h.model, "top_flange"),
                         bottom = region_of_nodes(h.model, "bottom_flange"), web = region_of_nodes(h.model, "web"),
                         stiffener = region_of_nodes(h.model, "stiffener");
  ASSERT_FALSE(stiffener.empty());
  EXPECT_CLOSE(max_abs(d, 1, web), 1.4, 1e-14, 0.0);
  for (int n : web) {
    const bool junction =
        std::binary_search(top.begin(), top.end(), n) || std::binary_search(bottom.begin(), bottom.end(), n);
    if (junction) {
      EXPECT_CLOSE(d[static_cast<std::size_t>(n)].norm(), 0.0, 0.0, 1e-15) << "junction node " << n;
    } else {
      EXPECT_EQ(d[static_cast<std::size_t>(n)].z(), 0.0);
    }
  }
  int interior = 0;
  for (int n : stiffener) {
    const Eigen::Vector3d& p = h.model.nodes[static_cast<std::size_t>(n)];
    if (std::abs(std::abs(p.z()) - kZf) < 1e-9 || p.y() == 0.0) continue;  // on a flange or the web
    ++interior;
    const double s = (p.z() + kZf) / (2.0 * kZf);
    // Bottom flange field at (x, y): A_f (2 y / b) sin(pi x / lambda) = 0.75 (2 y / b) at the crest.
    EXPECT_CLOSE(d[static_cast<std::size_t>(n)].z(), (1.0 - s) * 0.75 * 2.0 * p.y() / kB, 0.0, 1e-14);
    // Web field at (x, z), whatever y: the stiffener moves with the web in its own plane.
    const Eigen::Vector3d on_web(p.x(), 0.0, p.z());
    for (int w : web)
      if ((h.model.nodes[static_cast<std::size_t>(w)] - on_web).norm() < 1e-9) {
        EXPECT_CLOSE(d[static_cast<std::size_t>(n)].y(), d[static_cast<std::size_t>(w)].y(), 0.0, 1e-15);
      }
  }
  EXPECT_GT(interior, 0);
  // Reference nodes (in no element) get nothing.
  const int ref = h.model.groups.at("load_point").nodes.front();
  EXPECT_FALSE(used(h.model, ref));
  EXPECT_EQ(d[static_cast<std::size_t>(ref)].norm(), 0.0);
}

TEST(HalfSine, RejectsElementsLongerThanHalfAHalfWave) {
  HingeZoneSpec s;
  s.section = *find_section("IPE 300");
  s.length = kL;
  s.flange_elements = 8;
  s.web_elements = 10;
  s.aspect = 3.0;  // h_e = 56.25 mm > lambda / 2 = 37.5 mm
  const HingeZoneModel h = build_hinge_zone(s);
  HalfSineOptions o;
  o.flange_amplitude = 0.75;
  EXPECT_THROW(half_sine_imperfection(h, o), std::invalid_argument);
  o.flange_amplitude = -1.0;
  EXPECT_THROW(half_sine_imperfection(cantilever(), o), std::invalid_argument);
}

Eigen::VectorXd lateral_torsional_mode() {
  return rigid_field(cantilever().model, [](double x) {
    Motion q = Motion::Zero();
    q(1) = 1.0 * std::sin(kPi * x / kL);
    q(3) = 0.01 * std::sin(kPi * x / kL);
    return q;
  });
}

TEST(BucklingModeImperfection, RejectsALateralTorsionalModeAndScalesTheFlangeWave) {
  const HingeZoneModel& h = cantilever();
  // Mode 0: pure lateral-torsional; mode 1: a flange wave of arbitrary scale (17 mm) with some
  // twist dragged along; mode 2: a web bulge (never reached).
  const std::vector<Eigen::VectorXd> modes{
      lateral_torsional_mode(), bottom_flange_wave(h.model, 17.0, kB, 0.5 * kB) + 0.2 * lateral_torsional_mode(),
      web_bulge(h.model, 3.0, kZf)};
  ModeImperfectionOptions o;
  o.amplitude = kB / 200.0;
  const ModeImperfection r = buckling_mode_imperfection(h, modes, o);
  ASSERT_TRUE(r.found) << r.message;
  EXPECT_EQ(r.mode, 1);
  EXPECT_EQ(r.classification, DeformationMode::flange_local_buckling);
  ASSERT_EQ(r.classifications.size(), 2u);
  EXPECT_EQ(r.classifications[0], DeformationMode::lateral_torsional);
  // The scaled offsets, read back as a field, have the largest flange distortion = amplitude.
  Eigen::VectorXd u = Eigen::VectorXd::Zero(h.model.dof_count());
  for (std::size_t i = 0; i < r.offsets.size(); ++i) u.segment<3>(6 * static_cast<Eigen::Index>(i)) = r.offsets[i];
  EXPECT_CLOSE(SectionDeformationAnalysis(h).analyse(u).flange.value, 0.75, 1e-12, 0.0);
  EXPECT_CLOSE((u - r.scale * modes[1]).cwiseAbs().maxCoeff(), 0.0, 0.0, 1e-15 * r.scale * 17.0 * 10.0);
}

TEST(BucklingModeImperfection, ScalesAWebModeByItsWebDistortion) {
  const HingeZoneModel& h = cantilever();
  const std::vector<Eigen::VectorXd> modes{web_bulge(h.model, -0.02, kZf)};
  ModeImperfectionOptions o;
  o.amplitude = 2.0 * kZf / 200.0;
  const ModeImperfection r = buckling_mode_imperfection(h, modes, o);
  ASSERT_TRUE(r.found) << r.message;
  EXPECT_EQ(r.classification, DeformationMode::web_local_buckling);
  Eigen::VectorXd u = Eigen::VectorXd::Zero(h.model.dof_count());
  for (std::size_t i = 0; i < r.offsets.size(); ++i) u.segment<3>(6 * static_cast<Eigen::Index>(i)) = r.offsets[i];
  EXPECT_CLOSE(SectionDeformationAnalysis(h).analyse(u).web.value, o.amplitude, 1e-12, 0.0);
}

TEST(BucklingModeImperfection, ReportsWhenNoModeIsLocal) {
  const HingeZoneModel& h = cantilever();
  const Eigen::VectorXd in_plane = rigid_field(h.model, [](double x) {
    Motion q = Motion::Zero();
    q(2) = -x * x * 1e-5;
    q(4) = 2e-5 * x;
    return q;
  });
  const std::vector<Eigen::VectorXd> modes{lateral_torsional_mode(), in_plane,
                                           Eigen::VectorXd::Zero(h.model.dof_count())};
  ModeImperfectionOptions o;
  o.amplitude = 0.75;
  const ModeImperfection r = buckling_mode_imperfection(h, modes, o);
  EXPECT_FALSE(r.found);
  EXPECT_EQ(r.mode, -1);
  EXPECT_TRUE(r.offsets.empty());
  EXPECT_EQ(r.classifications, (std::vector<DeformationMode>{DeformationMode::lateral_torsional, DeformationMode::none,
                                                             DeformationMode::none}));
  EXPECT_NE(r.message.find("no local mode among the 3 modes"), std::string::npos) << r.message;
  const std::vector<Eigen::VectorXd> wrong{Eigen::VectorXd::Zero(7)};
  EXPECT_THROW(buckling_mode_imperfection(h, wrong, o), InternalError);
}

TEST(Offsets, AddAndCombine) {
  HingeZoneModel h = ipe300(HingeSetup::cantilever, 600.0);
  const NodeOffsets bow = global_bow(h, {1.0, BowShape::half_sine});
  HalfSineOptions o;
  o.flange_amplitude = 0.5;
  const NodeOffsets local = half_sine_imperfection(h, o);
  const NodeOffsets both = combine(bow, local);
  const std::vector<Eigen::Vector3d> before = h.model.nodes;
  add_offsets(h.model, both);
  for (std::size_t i = 0; i < before.size(); ++i) EXPECT_EQ(h.model.nodes[i], before[i] + bow[i] + local[i]);
  EXPECT_THROW(add_offsets(h.model, NodeOffsets(3)), InternalError);  // programming errors
  EXPECT_THROW(combine(bow, NodeOffsets(3)), InternalError);
}

}  // namespace
}  // namespace rotcap
