// Residual stress patterns: self-equilibrium on the plate model, the ECCS h/b switch, values at
// the tips and junctions, the welded bands, and the rotation into a shell's local frame.
#include "model/patterns/residual_stress.hpp"
#include "tests/model/patterns/pattern_fields.hpp"
#include "tests/test_support.hpp"

#include <Eigen/Geometry>
#include <cstdio>
#include <map>
#include <random>
#include <stdexcept>

namespace rotcap {
namespace {

constexpr double kFy = 355.0;

ISection plates(double h, double b, double tf, double tw) { return ISection{"", h, b, tf, tw, 0.0, 0.0}; }

// |N| / (fy A) etc. of an exact piecewise-polynomial integration: rounding only.
constexpr double kRoundoff = 1e-13;

TEST(ResidualStress, HotRolledIsSelfEquilibratedOnThePlateModel) {
  for (const char* name : {"IPE 300", "HEB 300", "IPE 600", "HEA 300"}) {
    const ResidualStressPattern p(ResidualStressKind::hot_rolled, *find_section(name), kFy);
    const SelfEquilibrium e = p.check();
    EXPECT_LT(e.relative_imbalance, kRoundoff) << name << ": " << e.message;
    const double fyA = kFy * plate_model_properties(*find_section(name)).A;
    EXPECT_CLOSE(e.N, 0.0, 0.0, kRoundoff * fyA);
    EXPECT_CLOSE(e.B, 0.0, 0.0, kRoundoff * fyA * 300.0 * 300.0);
  }
}

TEST(ResidualStress, WeldedIsSelfEquilibratedOnThePlateModel) {
  for (double c : {0.1, 0.25, 0.5}) {
    ResidualStressOptions o;
    o.welded_compression = c;
    const ResidualStressPattern p(ResidualStressKind::welded, plates(500.0, 200.0, 16.0, 8.0), kFy, o);
    const SelfEquilibrium e = p.check();
    EXPECT_LT(e.relative_imbalance, kRoundoff) << e.message;
    EXPECT_CLOSE(e.peak_tension, kFy, 1e-15, 0.0);
    EXPECT_CLOSE(e.peak_compression, -c * kFy, 1e-15, 0.0);
  }
}

TEST(ResidualStress, HotRolledAmplitudeSwitchesAboveHOverB1_2) {
  // ECCS TC8 Publ. 33 (1984), from memory: 0.5 fy for h/b <= 1.2, 0.3 fy for h/b > 1.2.
  const ResidualStressPattern stocky(ResidualStressKind::hot_rolled, plates(300.0, 250.0, 14.0, 9.0), kFy);
  const ResidualStressPattern deep(ResidualStressKind::hot_rolled, plates(300.5, 250.0, 14.0, 9.0), kFy);
  EXPECT_CLOSE(stocky.amplitude(), 0.5 * kFy, 1e-15, 0.0);  // h/b = 1.2 exactly
  EXPECT_CLOSE(deep.amplitude(), 0.3 * kFy, 1e-15, 0.0);    // h/b = 1.202
  EXPECT_CLOSE(ResidualStressPattern(ResidualStressKind::hot_rolled, *find_section("HEB 300"), kFy).amplitude(),
               0.5 * kFy, 1e-15, 0.0);  // h/b = 1.0
  EXPECT_CLOSE(ResidualStressPattern(ResidualStressKind::hot_rolled, *find_section("IPE 300"), kFy).amplitude(),
               0.3 * kFy, 1e-15, 0.0);  // h/b = 2.0
}

TEST(ResidualStress, HotRolledValuesAtTipsJunctionsAndMidDepth) {
  // IPE 300, h/b = 2: a = 0.3 fy = 106.5 MPa (ECCS 1984, from memory). Flange -a at the tips,
  // +a at the junction, zero at the quarter points; web +a at the junctions, -a/2 at mid-depth.
  const ISection s = *find_section("IPE 300");
  const ResidualStressPattern p(ResidualStressKind::hot_rolled, s, kFy);
  const double a = 106.5, zf = 0.5 * (s.h - s.tf);
  for (PlateRegion f : {PlateRegion::top_flange, PlateRegion::bottom_flange}) {
    EXPECT_CLOSE(p.longitudinal(f, -75.0), -a, 1e-14, 0.0);
    EXPECT_CLOSE(p.longitudinal(f, 75.0), -a, 1e-14, 0.0);
    EXPECT_CLOSE(p.longitudinal(f, 0.0), a, 1e-14, 0.0);
    EXPECT_CLOSE(p.longitudinal(f, 37.5), 0.0, 0.0, 1e-12);
    EXPECT_CLOSE(p.longitudinal(f, -18.75), 0.5 * a, 1e-14, 0.0);
  }
  EXPECT_CLOSE(p.longitudinal(PlateRegion::web, zf), a, 1e-14, 0.0);
  EXPECT_CLOSE(p.longitudinal(PlateRegion::web, -zf), a, 1e-14, 0.0);
  EXPECT_CLOSE(p.longitudinal(PlateRegion::web, 0.0), -0.5 * a, 1e-14, 0.0);
  EXPECT_CLOSE(p.longitudinal(PlateRegion::web, zf / std::sqrt(3.0)), 0.0, 0.0, 1e-12);  // zero of the parabola
  EXPECT_EQ(p.longitudinal(PlateRegion::stiffener, 0.0), 0.0);
  const SelfEquilibrium e = p.check();
  EXPECT_CLOSE(e.peak_tension, a, 1e-14, 0.0);
  EXPECT_CLOSE(e.peak_compression, -a, 1e-14, 0.0);
}

TEST(ResidualStress, WagnerIntegralMatchesClosedForm) {
  // Two code paths: the piecewise integration against the closed form of the chosen pattern,
  // int sigma (y^2 + z^2) dA = -2 tf a b^3 / 24 + (4/15) a tw zf^3 (our derivation: per flange
  // 2 a int_0^{b/2} (1 - 4 y/b) y^2 dy = 2 a (b^3/24 - b^3/16); the flange triangle has zero mean,
  // so its zf^2 term vanishes; the web a int (3/2 (z/zf)^2 - 1/2) z^2 dz = a zf^3 (3/5 - 1/3)).
  const ISection s = *find_section("HEB 300");
  const ResidualStressPattern p(ResidualStressKind::hot_rolled, s, kFy);
  const double a = 0.5 * kFy, zf = 0.5 * (s.h - s.tf);
  const double expected = -2.0 * s.tf * a * s.b * s.b * s.b / 24.0 + 4.0 / 15.0 * a * s.tw * zf * zf * zf;
  EXPECT_CLOSE(p.check().wagner, expected, 1e-13, 0.0);
}

TEST(ResidualStress, WeldedBandsCarryTensionFyAndTheRestCompression) {
  // Welded block pattern after ECCS (1984), from memory: +fy in junction bands, -0.25 fy
  // elsewhere; band widths from each plate's zero net force: flange w_f = 0.25 b / 1.25 = 0.2 b,
  // web 0.25 zf / 1.25 = 0.2 zf from each flange.
  const ISection s = plates(500.0, 200.0, 16.0, 8.0);
  const ResidualStressPattern p(ResidualStressKind::welded, s, kFy);
  const double zf = 242.0;
  EXPECT_CLOSE(p.longitudinal(PlateRegion::top_flange, 0.0), kFy, 1e-15, 0.0);
  EXPECT_CLOSE(p.longitudinal(PlateRegion::top_flange, 19.0), kFy, 1e-15, 0.0);
  EXPECT_CLOSE(p.longitudinal(PlateRegion::top_flange, 21.0), -0.25 * kFy, 1e-15, 0.0);
  EXPECT_CLOSE(p.longitudinal(PlateRegion::bottom_flange, -100.0), -0.25 * kFy, 1e-15, 0.0);
  EXPECT_CLOSE(p.longitudinal(PlateRegion::web, zf), kFy, 1e-15, 0.0);
  EXPECT_CLOSE(p.longitudinal(PlateRegion::web, -0.81 * zf), kFy, 1e-15, 0.0);
  EXPECT_CLOSE(p.longitudinal(PlateRegion::web, 0.79 * zf), -0.25 * kFy, 1e-15, 0.0);
  EXPECT_CLOSE(p.longitudinal(PlateRegion::web, 0.0), -0.25 * kFy, 1e-15, 0.0);
}

TEST(ResidualStress, NoneIsZeroEverywhere) {
  const ResidualStressPattern none;
  EXPECT_EQ(none.longitudinal(PlateRegion::web, 10.0), 0.0);
  const SelfEquilibrium e = none.check();
  EXPECT_EQ(e.N, 0.0);
  EXPECT_EQ(e.relative_imbalance, 0.0);
  const ResidualStressPattern explicit_none(ResidualStressKind::none, *find_section("IPE 300"), kFy);
  EXPECT_EQ(explicit_none.longitudinal(PlateRegion::top_flange, 75.0), 0.0);
  EXPECT_EQ(explicit_none.check().peak_compression, 0.0);
}

TEST(ResidualStress, CoordinatesBeyondThePlateAreClampedOrRejected) {
  const ResidualStressPattern p(ResidualStressKind::hot_rolled, *find_section("IPE 300"), kFy);
  // Within 10 % of b beyond the tip: clamped to the tip value.
  EXPECT_CLOSE(p.longitudinal(PlateRegion::top_flange, 80.0), -106.5, 1e-14, 0.0);
  EXPECT_THROW(p.longitudinal(PlateRegion::top_flange, 100.0), std::out_of_range);
  EXPECT_THROW(p.longitudinal(PlateRegion::web, 200.0), std::out_of_range);
}

TEST(ResidualStress, RejectsBadInput) {
  const ISection s = *find_section("IPE 300");
  EXPECT_THROW(ResidualStressPattern(ResidualStressKind::hot_rolled, s, 0.0), std::invalid_argument);
  ResidualStressOptions o;
  o.welded_compression = 1.0;
  EXPECT_THROW(ResidualStressPattern(ResidualStressKind::welded, s, kFy, o), std::invalid_argument);
}

TEST(ResidualStress, LocalComponentsRotateWithTheElementFrame) {
  const ResidualStressPattern p(ResidualStressKind::hot_rolled, *find_section("IPE 300"), kFy);
  const Eigen::Vector3d point(500.0, -60.0, 144.65);
  const double sigma = p.longitudinal(PlateRegion::top_flange, -60.0);
  // Frame aligned with the member: all of it in s_xx.
  const Eigen::Vector3d aligned = local_residual_stress(p, PlateRegion::top_flange, point, Eigen::Matrix3d::Identity());
  EXPECT_CLOSE(aligned(0), sigma, 1e-15, 0.0);
  EXPECT_EQ(aligned(1), 0.0);
  EXPECT_EQ(aligned(2), 0.0);
  // Frame turned by alpha about the normal z: e1 = (cos, sin, 0), e2 = (-sin, cos, 0); the member
  // axis has components c = cos alpha, s = -sin alpha; sigma_local = [c^2, s^2, c s] sigma, which
  // keeps the trace and rotates back to sigma e_x e_x^T.
  std::mt19937 rng(20240611);
  std::uniform_real_distribution<double> angle(-3.0, 3.0);
  for (int k = 0; k < 5; ++k) {
    const double alpha = angle(rng);
    const Eigen::Matrix3d axes = Eigen::AngleAxisd(alpha, Eigen::Vector3d::UnitZ()).toRotationMatrix();
    const Eigen::Vector3d s = local_residual_stress(p, PlateRegion::top_flange, point, axes);
    const double c = std::cos(alpha), sn = -std::sin(alpha);
    EXPECT_CLOSE(s(0), c * c * sigma, 0.0, 1e-12);
    EXPECT_CLOSE(s(1), sn * sn * sigma, 0.0, 1e-12);
    EXPECT_CLOSE(s(2), c * sn * sigma, 0.0, 1e-12);
    Eigen::Matrix2d local;
    local << s(0), s(2), s(2), s(1);
    const Eigen::Matrix<double, 3, 2> e = axes.leftCols<2>();
    const Eigen::Matrix3d global = e * local * e.transpose();
    EXPECT_CLOSE(global(0, 0), sigma, 1e-13, 0.0);
    EXPECT_CLOSE(global.norm(), std::abs(sigma), 1e-13, 0.0);
  }
  // A web frame (e1 = x, e2 = z in the web plane): the web coordinate is the point's z.
  Eigen::Matrix3d web_axes;
  web_axes << 1, 0, 0, 0, 0, -1, 0, 1, 0;
  const Eigen::Vector3d w = local_residual_stress(p, PlateRegion::web, Eigen::Vector3d(10.0, 0.0, 0.0), web_axes);
  EXPECT_CLOSE(w(0), -0.5 * 106.5, 1e-14, 0.0);
  EXPECT_EQ(local_residual_stress(p, PlateRegion::stiffener, point, Eigen::Matrix3d::Identity()),
            Eigen::Vector3d::Zero());
}

TEST(ResidualStress, MeanOverAnIntervalIntegratesAcrossBandEdges) {
  // Welded 500 x 220 x 12 x 8 (the demo's invented girder), c = 0.25: flange band |y| <= 22 mm.
  const ResidualStressPattern p(ResidualStressKind::welded, plates(500.0, 220.0, 12.0, 8.0), kFy);
  EXPECT_CLOSE(p.mean_longitudinal(PlateRegion::top_flange, -30.0, 30.0), (44.0 - 0.25 * 16.0) * kFy / 60.0, 1e-14, 0.0);
  EXPECT_CLOSE(p.mean_longitudinal(PlateRegion::top_flange, 0.0, 27.5), (22.0 - 0.25 * 5.5) * kFy / 27.5, 1e-14, 0.0);
  EXPECT_CLOSE(p.mean_longitudinal(PlateRegion::top_flange, -110.0, 110.0), 0.0, 0.0, 1e-12 * kFy);
  EXPECT_EQ(p.mean_longitudinal(PlateRegion::top_flange, 5.0, 5.0), kFy);
  EXPECT_EQ(p.mean_longitudinal(PlateRegion::stiffener, 0.0, 10.0), 0.0);
  EXPECT_THROW(p.mean_longitudinal(PlateRegion::web, 10.0, 0.0), std::invalid_argument);
  // Hot-rolled IPE 300 (b = 150, a = 0.5 fy): the flange half [0, 75] has mean 0 (linear a -> -a).
  const ResidualStressPattern h(ResidualStressKind::hot_rolled, *find_section("IPE 300"), kFy);
  EXPECT_CLOSE(h.mean_longitudinal(PlateRegion::bottom_flange, 0.0, 75.0), 0.0, 0.0, 1e-13 * kFy);
}

// Net force of the discrete pattern on every plate of a hinge-zone mesh: sum over elements and
// Gauss points of s_xx * (element area / 4) * t, the 2x2 rule's own integral of the initial stress.
// With quadrant means it is the exact pattern's 0 to round-off for any element count; point values
// at the Gauss points are printed beside it (they put whole Gauss-point strips into the weld band).
TEST(ResidualStress, GaussPointMeansKeepEachPlateSelfEquilibratedOnAnyMesh) {
  const ISection girder = plates(500.0, 220.0, 12.0, 8.0);
  const ResidualStressPattern p(ResidualStressKind::welded, girder, kFy);
  const double g = 1.0 / std::sqrt(3.0);
  const double node_xi[4] = {-1, 1, 1, -1}, node_eta[4] = {-1, -1, 1, 1};
  for (const auto& [nf, nw] : {std::pair{8, 10}, std::pair{12, 15}, std::pair{18, 23}}) {
    HingeZoneSpec spec;
    spec.section = girder;
    spec.setup = HingeSetup::cantilever;
    spec.length = 2000.0;
    spec.flange_elements = nf;
    spec.web_elements = nw;
    const HingeZoneModel h = build_hinge_zone(spec);
    std::map<std::string, std::pair<double, double>> force;  // region -> (means, point values) [N]
    for (int e = 0; e < h.model.element_count(); ++e) {
      const ShellElement& el = h.model.elements[static_cast<std::size_t>(e)];
      const std::string& region = h.model.region_names[static_cast<std::size_t>(el.region)];
      if (region == "stiffener") continue;
      Eigen::Matrix<double, 3, 4> X;
      for (int a = 0; a < 4; ++a) X.col(a) = h.model.nodes[static_cast<std::size_t>(el.nodes[a])];
      const double area = 0.5 * ((X.col(2) - X.col(0)).cross(X.col(3) - X.col(1))).norm();
      const double t = region == "web" ? girder.tw : girder.tf;
      const auto means =
          gauss_point_residual_stresses(p, element_plate_region(h.model, e), X, Eigen::Matrix3d::Identity());
      for (int k = 0; k < 4; ++k) {
        Eigen::Vector3d point = Eigen::Vector3d::Zero();
        for (int a = 0; a < 4; ++a)
          point += 0.25 * (1 + g * node_xi[k] * node_xi[a]) * (1 + g * node_eta[k] * node_eta[a]) * X.col(a);
        const double sampled = local_residual_stress(p, h.model, e, point, Eigen::Matrix3d::Identity())(0);
        force[region].first += means[static_cast<std::size_t>(k)](0) * 0.25 * area * t;
        force[region].second += sampled * 0.25 * area * t;
      }
    }
    for (const auto& [region, f] : force) {
      const double scale = kFy * (region == "web" ? (girder.h - girder.tf) * girder.tw : girder.b * girder.tf);
      std::printf("welded pattern, %d x %d elements, %s: net N / (fy A_plate) per unit length: quadrant means "
                  "%.2e, point values %.4f\n", nf, nw, region.c_str(), f.first / (scale * spec.length),
                  f.second / (scale * spec.length));
      EXPECT_CLOSE(f.first, 0.0, 0.0, 1e-12 * scale * spec.length) << region << ", " << nf << " x " << nw;
    }
    EXPECT_EQ(force.size(), 3u);
  }
}

TEST(ResidualStress, ElementLookupFollowsTheHingeModelRegions) {
  using namespace patterns_test;
  const HingeZoneModel h = ipe300(HingeSetup::three_point, 1200.0);
  const ResidualStressPattern p(ResidualStressKind::hot_rolled, *find_section("IPE 300"), kFy);
  int checked = 0;
  for (int e = 0; e < h.model.element_count(); ++e) {
    Eigen::Vector3d centre = Eigen::Vector3d::Zero();
    for (int n : h.model.elements[static_cast<std::size_t>(e)].nodes)
      centre += 0.25 * h.model.nodes[static_cast<std::size_t>(n)];
    const std::string& region =
        h.model.region_names[static_cast<std::size_t>(h.model.elements[static_cast<std::size_t>(e)].region)];
    const Eigen::Vector3d s = local_residual_stress(p, h.model, e, centre, Eigen::Matrix3d::Identity());
    const double expected = region == "web"         ? p.longitudinal(PlateRegion::web, centre.z())
                            : region == "stiffener" ? 0.0
                                                    : p.longitudinal(PlateRegion::top_flange, centre.y());
    EXPECT_EQ(s(0), expected) << "element " << e << " in " << region;
    ++checked;
  }
  EXPECT_GT(checked, 0);
  ShellModel general = h.model;
  general.region_names[0] = "cover_plate";
  EXPECT_THROW(local_residual_stress(p, general, 0, Eigen::Vector3d::Zero(), Eigen::Matrix3d::Identity()),
               std::invalid_argument);
  EXPECT_THROW(local_residual_stress(p, h.model, -1, Eigen::Vector3d::Zero(), Eigen::Matrix3d::Identity()),
               std::out_of_range);
}

}  // namespace
}  // namespace rotcap
