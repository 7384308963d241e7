// Cross-section grid of the hinge-zone mesh with a coarse tension side (section_grading.hpp):
// counts per station, shared junctions, conforming quads, web z lines, which flange is coarse for
// each setup, and the plate areas.
#include "model/hinge_zone/hinge_zone_mesher.hpp"
#include "model/hinge_zone/section_grading.hpp"
#include "model/section/section_table.hpp"
#include "model/setups/loading_setup.hpp"
#include "tests/test_support.hpp"

#include <Eigen/Geometry>
#include <array>
#include <cmath>
#include <map>
#include <set>

namespace rotcap {
namespace {

// IPE 300 at the default counts 18 x 23, tension side coarsened 2 x, no stiffener plates.
HingeZoneSpec coarse_spec(HingeSetup setup, double length) {
  HingeZoneSpec s;
  s.section = *find_section("IPE 300");
  s.setup = setup;
  s.length = length;
  s.tension_coarsening = 2.0;
  s.stiffeners = StiffenerPlacement::none;
  if (setup == HingeSetup::four_point) s.load_spacing = 0.4 * length;
  return s;
}

const HingeSetup kSetups[] = {HingeSetup::cantilever, HingeSetup::three_point, HingeSetup::four_point,
                              HingeSetup::uniform_moment};

TEST(SectionGrading, TensionFlangeCountIsEvenAndWithinFourAndTheFineCount) {
  EXPECT_EQ(tension_flange_elements(18, 1.0), 18);
  EXPECT_EQ(tension_flange_elements(18, 2.0), 10);  // 9 rounds to the even 10 (lround(4.5) = 5)
  EXPECT_EQ(tension_flange_elements(20, 2.0), 10);
  EXPECT_EQ(tension_flange_elements(18, 3.0), 6);
  EXPECT_EQ(tension_flange_elements(6, 3.0), 4);
  for (int nf = 4; nf <= 40; nf += 2)
    for (double c : {1.0, 1.3, 1.5, 2.0, 2.5, 3.0}) {
      const int n = tension_flange_elements(nf, c);
      EXPECT_EQ(n % 2, 0);
      EXPECT_GE(n, 4);
      EXPECT_LE(n, nf);
    }
}

TEST(SectionGrading, CoarseningOneGivesTheUniformWebExactly) {
  const std::vector<double> z = web_lines(144.65, 23, 1.0, false, 0.0);
  ASSERT_EQ(z.size(), 24u);
  for (int m = 0; m <= 23; ++m) EXPECT_EQ(z[m], (m - 0.5 * 23) * (2.0 * 144.65 / 23));
}

TEST(SectionGrading, WebLinesAreMonotoneFineOnTheCompressionSideWithBoundedRatio) {
  const double zf = 144.65, hf = 2.0 * zf / 23;
  for (bool top : {false, true})
    for (double c : {1.5, 2.0, 3.0}) {
      const std::vector<double> z = web_lines(zf, 23, c, top, 0.0);
      ASSERT_GE(z.size(), 3u);
      EXPECT_EQ(z.front(), -zf);
      EXPECT_EQ(z.back(), zf);
      EXPECT_LT(z.size(), 24u) << "coarsening must remove web elements";
      for (std::size_t m = 0; m + 1 < z.size(); ++m) {
        const double size = z[m + 1] - z[m];
        EXPECT_GT(size, 0.0);
        EXPECT_LE(size, c * hf * (1.0 + 1e-12));
        // Elements wholly between the compression flange and mid-depth (the neutral axis here).
        const bool compression_half = top ? z[m] >= 0.0 : z[m + 1] <= 0.0;
        if (compression_half) {
          EXPECT_LE(size, hf * (1.0 + 1e-12)) << "fine size up to the neutral axis";
        }
        if (m + 2 < z.size()) {
          const double next = z[m + 2] - z[m + 1];
          EXPECT_LE(std::max(size / next, next / size), 1.5);  // exp(kWebGrowth) = 1.42 plus rounding
        }
      }
    }
}

TEST(SectionGrading, AxialLoadMovesTheFinePartPastMidDepth) {
  // e = N / (2 fy tw): the compression zone reaches e beyond mid-depth; with e >= zf all fine.
  const double zf = 144.65, hf = 2.0 * zf / 23;
  const std::vector<double> z = web_lines(zf, 23, 2.0, false, 50.0);  // bottom flange compressed
  for (std::size_t m = 0; m + 1 < z.size(); ++m)
    if (z[m + 1] <= 50.0) {
      EXPECT_LE(z[m + 1] - z[m], hf * (1.0 + 1e-12));
    }
  EXPECT_EQ(web_lines(zf, 23, 2.0, false, zf).size(), 24u);
}

TEST(SectionGrading, CoarsensTheTensionFlangeOfEachSetup) {
  for (HingeSetup setup : kSetups) {
    const HingeZoneModel h = build_hinge_zone(coarse_spec(setup, 2400.0));
    const bool top_compressed = loading_setup(setup).top_flange_in_compression();
    EXPECT_EQ(top_compressed, setup != HingeSetup::cantilever);  // cantilever: hogging
    EXPECT_EQ(top_compressed ? h.grid.nt() : h.grid.nb(), 18) << h.loading().name();
    EXPECT_EQ(top_compressed ? h.grid.nb() : h.grid.nt(), 10) << h.loading().name();
    EXPECT_LT(h.grid.nw(), 23);
  }
}

TEST(SectionGrading, KeepsBothFlangesFineWhereStiffenerPlatesMeetThem) {
  HingeZoneSpec s = coarse_spec(HingeSetup::three_point, 2400.0);
  s.stiffeners = StiffenerPlacement::supports_and_loads;
  const HingeZoneModel h = build_hinge_zone(s);
  EXPECT_EQ(h.stiffener_x.size(), 3u);
  EXPECT_EQ(h.grid.nb(), 18);
  EXPECT_EQ(h.grid.nt(), 18);
  EXPECT_LT(h.grid.nw(), 23);  // the web is still graded; the stiffeners follow its z lines
  EXPECT_NO_THROW(validate_topology(h.model));
}

TEST(SectionGrading, EveryStationHoldsPerNodesWithSharedJunctions) {
  for (HingeSetup setup : kSetups) {
    const HingeZoneSpec s = coarse_spec(setup, 2400.0);
    const HingeZoneModel h = build_hinge_zone(s);
    const SectionGrid& g = h.grid;
    const int stations = static_cast<int>(h.stations.size());
    EXPECT_EQ(g.per(), g.nb() + 1 + g.nt() + 1 + g.nw() - 1);
    // Station nodes first, then only reference nodes (no stiffeners here).
    EXPECT_GE(h.model.node_count(), stations * g.per());
    EXPECT_LE(h.model.node_count(), stations * g.per() + 2);
    const double zf = 0.5 * (s.section.h - s.section.tf);
    for (int i = 0; i < stations; ++i) {
      EXPECT_EQ(g.web(i, 0), g.bottom_centre(i));
      EXPECT_EQ(g.web(i, g.nw()), g.top_centre(i));
      for (int n : {g.bottom_centre(i), g.top_centre(i)}) EXPECT_EQ(h.model.nodes[n].y(), 0.0);
      EXPECT_EQ(h.model.nodes[g.bottom_centre(i)].z(), -zf);
      EXPECT_EQ(h.model.nodes[g.top_centre(i)].z(), zf);
      for (int m = 1; m < g.nw(); ++m) EXPECT_EQ(h.model.nodes[g.web(i, m)].z(), g.z_web[m]);
    }
    EXPECT_NO_THROW(validate_topology(h.model));
  }
}

// Quads are conforming when every edge is shared by two elements of its plate, or lies on the
// plate's boundary (member ends, flange tips, the web's flange junction lines).
TEST(SectionGrading, QuadsConformWithinEveryPlate) {
  for (HingeSetup setup : kSetups) {
    const HingeZoneSpec s = coarse_spec(setup, 2400.0);
    const HingeZoneModel h = build_hinge_zone(s);
    const ShellModel& m = h.model;
    const double L = s.length, half_b = 0.5 * s.section.b, zf = 0.5 * (s.section.h - s.section.tf), tol = 1e-9 * L;
    std::map<std::array<int, 3>, int> edges;  // (region, lower node, higher node) -> elements
    for (const auto& e : m.elements)
      for (int a = 0; a < 4; ++a) {
        const int p = e.nodes[a], q = e.nodes[(a + 1) % 4];
        ++edges[{e.region, std::min(p, q), std::max(p, q)}];
      }
    auto on = [&](double v, double w) { return std::abs(v - w) <= tol; };
    for (const auto& [key, count] : edges) {
      ASSERT_LE(count, 2);
      if (count == 2) continue;
      const Eigen::Vector3d& a = m.nodes[key[1]];
      const Eigen::Vector3d& b = m.nodes[key[2]];
      const bool end = (on(a.x(), 0.0) && on(b.x(), 0.0)) || (on(a.x(), L) && on(b.x(), L));
      const bool boundary = key[0] == 2 ? (std::abs(std::abs(a.z()) - zf) <= tol && on(a.z(), b.z()))
                                        : (std::abs(std::abs(a.y()) - half_b) <= tol && on(a.y(), b.y()));
      EXPECT_TRUE(end || boundary) << h.loading().name() << ": free edge " << key[1] << "-" << key[2] << " in region "
                                   << key[0];
    }
  }
}

TEST(SectionGrading, PlateAreasEqualThePlateModel) {
  for (HingeSetup setup : kSetups) {
    const HingeZoneSpec s = coarse_spec(setup, 2400.0);
    const HingeZoneModel h = build_hinge_zone(s);
    std::array<double, 3> area{};  // top flange, bottom flange, web [mm^2]
    double volume = 0.0;           // of the three plates [mm^3]
    for (const auto& e : h.model.elements) {
      const auto& x = h.model.nodes;
      const double a = 0.5 * (x[e.nodes[2]] - x[e.nodes[0]]).cross(x[e.nodes[3]] - x[e.nodes[1]]).norm();
      area[e.region] += a;
      volume += a * e.thickness;
    }
    const double L = s.length, b = s.section.b, d = s.section.h - s.section.tf;
    EXPECT_CLOSE(area[0], b * L, 1e-12, 0.0);
    EXPECT_CLOSE(area[1], b * L, 1e-12, 0.0);
    EXPECT_CLOSE(area[2], d * L, 1e-12, 0.0);
    EXPECT_CLOSE(volume, h.plate.A * L, 1e-12, 0.0);
  }
}

}  // namespace
}  // namespace rotcap
