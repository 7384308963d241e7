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

// IPE 300 at the default counts 18 x 23, tension side coarsened 2 x, no stiffener plates (the
// stiffener test adds them).
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
  EXPECT_EQ(tension_flange_elements(18, 2.0), 10);  // per half 9 -> 5: 1 cell of one width, 4 of two
  EXPECT_EQ(tension_flange_elements(20, 2.0), 12);  // per half 10 -> 6 (10 - 5 is odd: no pairs)
  EXPECT_EQ(tension_flange_elements(18, 3.0), 10);  // at most half the count
  EXPECT_EQ(tension_flange_elements(6, 2.0), 6);    // per half 3: no even reduction
  for (int nf = 4; nf <= 40; nf += 2)
    for (double c : {1.0, 1.3, 1.5, 2.0, 2.5, 3.0}) {
      const int n = tension_flange_elements(nf, c);
      EXPECT_EQ(n % 2, 0);
      EXPECT_GE(n, 4);
      EXPECT_LE(n, nf);
    }
}

TEST(SectionGrading, TensionFlangeLinesAreASymmetricSubsetWithPairedWideCells) {
  EXPECT_EQ(tension_flange_indices(18, 10), (std::vector<int>{0, 2, 4, 6, 8, 9, 10, 12, 14, 16, 18}));
  EXPECT_EQ(tension_flange_indices(8, 8), (std::vector<int>{0, 1, 2, 3, 4, 5, 6, 7, 8}));
  for (int nf = 4; nf <= 40; nf += 2)
    for (double c : {1.0, 1.5, 2.0}) {
      const int n = tension_flange_elements(nf, c);
      const std::vector<int> k = tension_flange_indices(nf, n);
      ASSERT_EQ(static_cast<int>(k.size()), n + 1);
      EXPECT_EQ(k[n / 2], nf / 2);  // the web junction
      int wide = 0;
      for (int j = 0; j < n; ++j) {
        EXPECT_EQ(k[j] + k[n - j], nf);  // symmetric about the web
        const int w = k[j + 1] - k[j];
        EXPECT_TRUE(w == 1 || w == 2);
        if (w == 2) {
          ++wide;
        } else {
          EXPECT_EQ(wide % 2, 0);  // cells of two come in pairs
          wide = 0;
        }
      }
      EXPECT_EQ(wide % 2, 0);
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

// Every stiffener edge on a flange or the web is an edge of that plate (no hanging nodes where the
// stiffener meets the coarse flange), and the stiffener covers its b x (h - tf) exactly.
TEST(SectionGrading, StiffenerPlatesMeetTheCoarseFlangeConformingly) {
  for (HingeSetup setup : {HingeSetup::three_point, HingeSetup::four_point}) {
    HingeZoneSpec s = coarse_spec(setup, 2400.0);
    s.stiffeners = StiffenerPlacement::supports_and_loads;
    const HingeZoneModel h = build_hinge_zone(s);
    ASSERT_GE(h.stiffener_x.size(), 3u);
    EXPECT_EQ(h.grid.nt(), 18);
    EXPECT_EQ(h.grid.nb(), 10);
    const ShellModel& m = h.model;
    std::set<std::pair<int, int>> plate_edges;  // flanges and web
    std::map<std::pair<int, int>, int> stiffener_edges;
    double area = 0.0;
    for (const auto& e : m.elements)
      for (int a = 0; a < 4; ++a) {
        const int p = e.nodes[a], q = e.nodes[(a + 1) % 4];
        if (e.region == 3) ++stiffener_edges[{std::min(p, q), std::max(p, q)}];
        else plate_edges.insert({std::min(p, q), std::max(p, q)});
      }
    for (const auto& e : m.elements)
      if (e.region == 3) {
        const auto& x = m.nodes;
        const Eigen::Vector3d n = (x[e.nodes[2]] - x[e.nodes[0]]).cross(x[e.nodes[3]] - x[e.nodes[1]]);
        EXPECT_GT(n.normalized().x(), 1.0 - 1e-12) << "CCW about +x";
        area += 0.5 * n.norm();
      }
    const double zf = 0.5 * (s.section.h - s.section.tf), tol = 1e-9 * s.section.h;
    EXPECT_CLOSE(area, h.stiffener_x.size() * s.section.b * 2.0 * zf, 1e-12, 0.0);
    for (const auto& [edge, count] : stiffener_edges) {
      const Eigen::Vector3d& a = m.nodes[edge.first];
      const Eigen::Vector3d& b = m.nodes[edge.second];
      const bool on_flange = std::abs(std::abs(a.z()) - zf) <= tol && std::abs(a.z() - b.z()) <= tol;
      const bool on_web = std::abs(a.y()) <= tol && std::abs(b.y()) <= tol;
      if (on_flange || on_web) {
        EXPECT_TRUE(plate_edges.count(edge)) << "stiffener edge " << edge.first << "-" << edge.second << " hangs";
      } else if (std::abs(std::abs(a.y()) - 0.5 * s.section.b) > tol) {
        EXPECT_EQ(count, 2) << "interior stiffener edge " << edge.first << "-" << edge.second;
      }
    }
    EXPECT_NO_THROW(validate_topology(m));
  }
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
