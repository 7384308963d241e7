// Deformation-shape analysis on synthetic fields of an IPE 300 cantilever hinge-zone model:
// rigid section motions give no distortion, flange waves, web bulges and lateral-torsional
// fields get their labels, small fields none, and the two tie-break rules of the header.
#include "model/patterns/section_deformation.hpp"
#include "tests/model/patterns/pattern_fields.hpp"
#include "tests/test_support.hpp"

#include <algorithm>
#include <random>
#include <stdexcept>

namespace rotcap {
namespace {

using namespace patterns_test;
using Motion = Eigen::Matrix<double, 6, 1>;

constexpr double kL = 1200.0, kB = 150.0, kZf = 144.65, kH = 300.0;

const HingeZoneModel& cantilever() {
  static const HingeZoneModel h = ipe300(HingeSetup::cantilever, kL);
  return h;
}

TEST(SectionDeformation, ReadsThePlateGeometryFromTheModel) {
  const SectionDeformationAnalysis a(cantilever());
  EXPECT_CLOSE(a.geometry().b, kB, 1e-14, 0.0);
  EXPECT_CLOSE(a.geometry().zf, kZf, 1e-14, 0.0);
  EXPECT_CLOSE(a.geometry().tf, 10.7, 1e-14, 0.0);
  EXPECT_CLOSE(a.geometry().tw, 7.1, 1e-14, 0.0);
  EXPECT_CLOSE(a.geometry().h(), kH, 1e-14, 0.0);
  EXPECT_EQ(a.station_count(), static_cast<int>(cantilever().stations.size()));
}

TEST(SectionDeformation, RigidSectionMotionHasNoDistortion) {
  // Each station moves as a rigid section by its own (smooth, seeded random) small motion.
  std::mt19937 rng(7);
  std::uniform_real_distribution<double> coef(-1.0, 1.0);
  Motion amp, freq, phase;
  for (int k = 0; k < 6; ++k) {
    amp(k) = (k < 3 ? 2.0 : 0.01) * coef(rng);
    freq(k) = 0.01 * coef(rng);
    phase(k) = 3.0 * coef(rng);
  }
  auto q = [&](double x) {
    Motion m;
    for (int k = 0; k < 6; ++k) m(k) = amp(k) * std::sin(freq(k) * x + phase(k));
    return m;
  };
  const SectionDeformation d = SectionDeformationAnalysis(cantilever()).analyse(rigid_field(cantilever().model, q));
  for (const StationDeformation& s : d.stations) {
    for (int k = 0; k < 6; ++k) EXPECT_CLOSE(s.rigid(k), q(s.x)(k), 0.0, 1e-12) << "x = " << s.x << ", dof " << k;
    EXPECT_LT(s.top_flange, 1e-12);
    EXPECT_LT(s.bottom_flange, 1e-12);
    EXPECT_LT(s.web, 1e-12);
    EXPECT_CLOSE(s.lateral_torsional, std::abs(q(s.x)(1)) + std::abs(q(s.x)(3)) * 0.5 * kH, 1e-12, 1e-12);
  }
}

TEST(SectionDeformation, FiniteBendingRotationIsNoDistortion) {
  // Sections turned about y by up to 0.15 rad (exact rotation, not linearised): the flanges shift
  // uniformly by z (cos theta - 1), which the junction reference removes.
  const ShellModel& m = cantilever().model;
  const Eigen::VectorXd u = field(m, [&](const Eigen::Vector3d& p) {
    const double theta = 0.15 * p.x() / kL;
    const Eigen::Vector3d r(0.0, p.y(), p.z());
    return Eigen::Vector3d(Eigen::AngleAxisd(theta, Eigen::Vector3d::UnitY()) * r - r +
                           Eigen::Vector3d(0, 0, -0.3 * p.x()));
  });
  const SectionDeformation d = SectionDeformationAnalysis(cantilever()).analyse(u);
  EXPECT_LT(d.flange.value, 1e-12);
  EXPECT_LT(d.web.value, 1e-12);
  EXPECT_LT(d.lateral_torsional.value, 1e-12);
  EXPECT_EQ(classify(d), DeformationMode::none);
}

TEST(SectionDeformation, FlangeWaveIsFlangeLocalBuckling) {
  // Bottom flange turning about its junction, 2 y/b sin(pi x / lambda), A = 1 mm, lambda = b/2.
  const ShellModel& m = cantilever().model;
  const double A = 1.0, lambda = 0.5 * kB;
  const Eigen::VectorXd u = bottom_flange_wave(m, A, kB, lambda);
  const SectionDeformation d = SectionDeformationAnalysis(cantilever()).analyse(u);
  // Second code path for the expected value: with the section symmetric (sum y = sum z = 0) the
  // least-squares twist is theta_x = sum y u_z / sum (y^2 + z^2) over the station's nodes, and
  // the bottom-flange distortion max |u_z - theta_x y| (the junction has u_z = 0).
  const std::vector<int> plates = [&] {
    std::vector<int> all = region_of_nodes(m, "top_flange"), b = region_of_nodes(m, "bottom_flange"),
                     w = region_of_nodes(m, "web");
    all.insert(all.end(), b.begin(), b.end());
    all.insert(all.end(), w.begin(), w.end());
    std::sort(all.begin(), all.end());
    all.erase(std::unique(all.begin(), all.end()), all.end());
    return all;
  }();
  double expected = 0.0;
  for (double xs : cantilever().stations) {
    double num = 0.0, den = 0.0;
    for (int n : plates) {
      const Eigen::Vector3d& p = m.nodes[static_cast<std::size_t>(n)];
      if (std::abs(p.x() - xs) > 1e-9) continue;
      num += p.y() * u(6 * n + 2);
      den += p.y() * p.y() + p.z() * p.z();
    }
    const double theta = num / den;
    for (int n : region_of_nodes(m, "bottom_flange")) {
      const Eigen::Vector3d& p = m.nodes[static_cast<std::size_t>(n)];
      if (std::abs(p.x() - xs) < 1e-9) expected = std::max(expected, std::abs(u(6 * n + 2) - theta * p.y()));
    }
  }
  EXPECT_CLOSE(d.bottom_flange.value, expected, 1e-12, 0.0);
  EXPECT_GT(d.bottom_flange.value, 0.9 * A);  // the fitted twist takes a few per cent
  EXPECT_CLOSE(std::remainder(d.bottom_flange.x - 0.5 * lambda, lambda), 0.0, 0.0, 1e-9);  // at a crest
  EXPECT_EQ(d.flange.station, d.bottom_flange.station);
  EXPECT_LT(d.web.value, 0.1 * A);
  const Classification c = classify_detailed(d);
  EXPECT_EQ(c.mode, DeformationMode::flange_local_buckling) << c.message;
}

TEST(SectionDeformation, WebBulgeIsWebLocalBuckling) {
  // Web bulge A sin(pi (z + zf)/hw) sin(pi x / hw): the rigid fit takes its mean as U_y, the
  // chord between the junctions gives it back, so W = A max over stations |sin(pi x / hw)| (the
  // mid-depth node z = 0 exists for 10 web elements).
  const double A = 2.0, hw = 2.0 * kZf;
  const SectionDeformation d = SectionDeformationAnalysis(cantilever()).analyse(web_bulge(cantilever().model, A, kZf));
  double expected = 0.0;
  for (double x : cantilever().stations)
    if (x < 3.0 * hw) expected = std::max(expected, A * std::abs(std::sin(kPi * x / hw)));
  EXPECT_CLOSE(d.web.value, expected, 1e-12, 0.0);
  EXPECT_LT(d.flange.value, 1e-12);
  const Classification c = classify_detailed(d);
  EXPECT_EQ(c.mode, DeformationMode::web_local_buckling) << c.message;
}

Eigen::VectorXd lateral_torsional_field(double uy, double twist) {
  return rigid_field(cantilever().model, [&](double x) {
    Motion q = Motion::Zero();
    q(1) = uy * std::sin(kPi * x / kL);
    q(3) = twist * std::sin(kPi * x / kL);
    return q;
  });
}

TEST(SectionDeformation, LateralTorsionalFieldIsLateralTorsional) {
  const SectionDeformation d = SectionDeformationAnalysis(cantilever()).analyse(lateral_torsional_field(2.0, 0.01));
  double expected = 0.0;
  for (double x : cantilever().stations)
    expected = std::max(expected, (2.0 + 0.01 * 0.5 * kH) * std::sin(kPi * x / kL));
  EXPECT_CLOSE(d.lateral_torsional.value, expected, 1e-12, 0.0);
  EXPECT_LT(d.flange.value, 1e-12);
  EXPECT_LT(d.web.value, 1e-12);
  EXPECT_EQ(classify(d), DeformationMode::lateral_torsional) << classify_detailed(d).message;
}

TEST(SectionDeformation, FieldsBelowTheThresholdAreNone) {
  // Threshold h/1000 = 0.3 mm.
  const SectionDeformationAnalysis a(cantilever());
  const SectionDeformation lt = a.analyse(lateral_torsional_field(0.1, 0.0005));  // T = 0.175 mm
  EXPECT_EQ(classify(lt), DeformationMode::none) << classify_detailed(lt).message;
  const SectionDeformation wave = a.analyse(bottom_flange_wave(cantilever().model, 0.2, kB, 0.5 * kB));
  EXPECT_EQ(classify(wave), DeformationMode::none) << classify_detailed(wave).message;
  EXPECT_CLOSE(classify_detailed(wave).threshold, 0.3, 1e-14, 0.0);
  // The same wave counts once the threshold is lowered.
  ClassifyOptions fine;
  fine.none_ratio = 1e-4;
  EXPECT_EQ(classify(wave, fine), DeformationMode::flange_local_buckling);
}

TEST(SectionDeformation, DistortionBeatsRigidMotionWhenAtLeastHalfOfIt) {
  // T = 2 + 0.01 * 150 = 3.5 mm near mid-length, plus a bottom-flange wave near the support.
  const SectionDeformationAnalysis a(cantilever());
  const Eigen::VectorXd lt = lateral_torsional_field(2.0, 0.01);
  const SectionDeformation strong = a.analyse(lt + bottom_flange_wave(cantilever().model, 2.5, kB, 0.5 * kB));
  const SectionDeformation weak = a.analyse(lt + bottom_flange_wave(cantilever().model, 1.0, kB, 0.5 * kB));
  ASSERT_GT(2.0 * strong.flange.value, strong.lateral_torsional.value);
  ASSERT_LT(2.0 * weak.flange.value, weak.lateral_torsional.value);
  EXPECT_EQ(classify(strong), DeformationMode::flange_local_buckling) << classify_detailed(strong).message;
  EXPECT_EQ(classify(weak), DeformationMode::lateral_torsional) << classify_detailed(weak).message;
}

TEST(SectionDeformation, WebBentByAFlangeRotationIsFlangeBuckling) {
  // The bottom flange turns by phi(x) about its junction; the web follows that rotation at its
  // bottom edge and is pinned at the top: u_y = (phi hw / 2) ((1 - s)^3 - (1 - s)), s = (z + zf)/hw,
  // slope -phi at s = 0 (the web's rotation about x there), peak 0.19 phi hw.
  const ShellModel& m = cantilever().model;
  const double phi0 = 0.02, lambda = 0.5 * kB, hw = 2.0 * kZf;
  auto phi = [&](double x) { return x < 3.0 * lambda ? phi0 * std::sin(kPi * x / lambda) : 0.0; };
  const Eigen::VectorXd flange = field(
      m, [&](const Eigen::Vector3d& p) { return Eigen::Vector3d(0.0, 0.0, phi(p.x()) * p.y()); },
      region_of_nodes(m, "bottom_flange"));
  const Eigen::VectorXd web = field(
      m,
      [&](const Eigen::Vector3d& p) {
        const double t = 1.0 - (p.z() + kZf) / hw;
        return Eigen::Vector3d(0.0, 0.5 * phi(p.x()) * hw * (t * t * t - t), 0.0);
      },
      region_of_nodes(m, "web"));
  const Classification c = classify_detailed(SectionDeformationAnalysis(cantilever()).analyse(flange + web));
  EXPECT_EQ(c.mode, DeformationMode::flange_local_buckling) << c.message;
  EXPECT_GT(c.flange_ratio, 4.0 * c.web_ratio) << c.message;
}

TEST(SectionDeformation, FlangesTurnedByAWebBulgeAreWebBuckling) {
  // A web bulge with both flanges following its junction rotation pi W / hw freely (the most a
  // flange can be dragged): F/(b/2) = pi W/hw < 4 W/hw.
  const ShellModel& m = cantilever().model;
  const double A = 2.0, hw = 2.0 * kZf;
  auto wave = [&](double x) { return x < 3.0 * hw ? std::sin(kPi * x / hw) : 0.0; };
  Eigen::VectorXd u = web_bulge(m, A, kZf);
  for (const char* name : {"top_flange", "bottom_flange"})
    for (int n : region_of_nodes(m, name)) {
      const Eigen::Vector3d& p = m.nodes[static_cast<std::size_t>(n)];
      // Web slope du_y/dz = +pi A/hw (bottom), -pi A/hw (top); a rotation theta about x has
      // du_y/dz = -theta and u_z = theta y, so each flange turns with the web's edge.
      const double slope = (p.z() > 0.0 ? -1.0 : 1.0) * kPi * A / hw * wave(p.x());
      u(6 * n + 2) = -slope * p.y();
    }
  const Classification c = classify_detailed(SectionDeformationAnalysis(cantilever()).analyse(u));
  EXPECT_EQ(c.mode, DeformationMode::web_local_buckling) << c.message;
}

TEST(SectionDeformation, RejectsBadInput) {
  const SectionDeformationAnalysis a(cantilever());
  EXPECT_THROW(a.analyse(Eigen::VectorXd::Zero(12)), std::invalid_argument);
  HingeZoneModel renamed = cantilever();
  renamed.model.region_names[2] = "plate";
  EXPECT_THROW(SectionDeformationAnalysis{renamed}, std::invalid_argument);
  ClassifyOptions bad;
  bad.distortion_preference = 0.5;
  EXPECT_THROW(classify(a.analyse(Eigen::VectorXd::Zero(cantilever().model.dof_count())), bad), std::invalid_argument);
}

}  // namespace
}  // namespace rotcap
