// Hinge-zone mesher: topology, grading, supports and loads of the four setups.
#include "model/hinge_zone/hinge_zone_mesher.hpp"
#include "model/section/section_table.hpp"
#include "tests/test_support.hpp"

#include <Eigen/Geometry>
#include <algorithm>
#include <cmath>
#include <functional>
#include <random>
#include <set>
#include <stdexcept>
#include <string>

namespace rotcap {
namespace {

// IPE 200 (b = 100), 4 x 4 elements, aspect 1: h_e = 25 mm; hinge region 1.5 max(h, b) = 300 mm
// = 12 h_e, so a 300 mm cantilever is uniformly meshed.
HingeZoneSpec small_spec(HingeSetup setup, double length) {
  HingeZoneSpec s;
  s.section = *find_section("IPE 200");
  s.setup = setup;
  s.length = length;
  s.flange_elements = 4;
  s.web_elements = 4;
  s.fy = 355.0;
  return s;
}

HingeZoneSpec ipe300_spec(HingeSetup setup, double length) {
  HingeZoneSpec s;
  s.section = *find_section("IPE 300");
  s.setup = setup;
  s.length = length;
  s.flange_elements = 8;  // the tests' coarse mesh (the spec's default is the converged 18 x 23)
  s.web_elements = 10;
  if (setup == HingeSetup::four_point) s.load_spacing = 0.4 * length;
  return s;
}

int node_of(const ShellModel& m, const std::string& group) {
  const NodeGroup& g = m.groups.at(group);
  EXPECT_EQ(g.nodes.size(), 1u) << group;
  return g.nodes.front();
}

bool fixed(const ShellModel& m, const std::string& group, Dof d) {
  for (const auto& s : m.supports)
    if (s.group == group && s.fixed[static_cast<int>(d)]) return true;
  return false;
}

TEST(HingeZoneMesher, CountsNodesAndElementsOfSmallCantilever) {
  const HingeZoneModel h = build_hinge_zone(small_spec(HingeSetup::cantilever, 300.0));
  // 13 stations of 2 (4 + 1) + 3 = 13 nodes, plus the load reference node; per interval
  // 2 x 4 flange + 4 web elements; no stiffeners at the fixed and the tied end.
  EXPECT_EQ(h.stations.size(), 13u);
  EXPECT_EQ(h.model.node_count(), 13 * 13 + 1);
  EXPECT_EQ(h.model.element_count(), 12 * 12);
  EXPECT_TRUE(h.stiffener_x.empty());
  const MeshStatistics st = mesh_statistics(h.model);
  EXPECT_EQ(st.nodes, 170);
  EXPECT_EQ(st.elements, 144);
  EXPECT_EQ(st.dofs, 1020);
  EXPECT_EQ(st.tied_nodes, 13);
  EXPECT_EQ(st.fixed_dofs, 13 * 6 + 2);  // the support section and uy, rx of the reference node
  EXPECT_EQ(st.free_dofs, 1020 - 6 * 13 - 80);
  for (std::size_t i = 0; i + 1 < h.stations.size(); ++i) EXPECT_CLOSE(h.stations[i + 1] - h.stations[i], 25.0, 1e-12, 0.0);
}

TEST(HingeZoneMesher, CountsNodesAndElementsOfSmallThreePointBeam) {
  const HingeZoneModel h = build_hinge_zone(small_spec(HingeSetup::three_point, 600.0));
  // Hinge region 300 mm each side of midspan covers the span: 25 stations; stiffeners at 0, L/2,
  // L with nf (nw - 1) = 12 own nodes and nf nw = 16 elements each.
  EXPECT_EQ(h.stations.size(), 25u);
  EXPECT_EQ(h.stiffener_x, (std::vector<double>{0.0, 300.0, 600.0}));
  EXPECT_EQ(h.model.node_count(), 25 * 13 + 3 * 12);
  EXPECT_EQ(h.model.element_count(), 24 * 12 + 3 * 16);
  EXPECT_EQ(mesh_statistics(h.model).fixed_dofs, 3 + 2 + 1 + 1);  // bearings and twist restraints
}

TEST(HingeZoneMesher, PutsANodeLineAtEverySpecialX) {
  HingeZoneSpec s = ipe300_spec(HingeSetup::four_point, 4321.0);
  s.load_spacing = 1234.5;
  s.stiffener_positions = {777.7, 3000.0};
  s.lateral_restraints = {{1543.25, RestrainedFlange::top}, {2000.0, RestrainedFlange::both}, {3000.0, RestrainedFlange::bottom}};
  const HingeZoneModel h = build_hinge_zone(s);
  const double a = 0.5 * (4321.0 - 1234.5);
  for (double x : {0.0, a, 4321.0 - a, 4321.0, 777.7, 3000.0, 1543.25, 2000.0}) {
    const bool found = std::any_of(h.stations.begin(), h.stations.end(), [&](double st) { return std::abs(st - x) <= 1e-9 * 4321.0; });
    EXPECT_TRUE(found) << "x = " << x;
  }
  EXPECT_EQ(h.stiffener_x.size(), 6u);  // two supports, two loads, two listed
  // Every element-node sits on a station.
  for (const auto& e : h.model.elements)
    for (int n : e.nodes) {
      const double x = h.model.nodes[n].x();
      EXPECT_TRUE(std::binary_search(h.stations.begin(), h.stations.end(), x)) << "node " << n;
    }
}

// Lengths of the elements along the member.
std::vector<double> lengths(const HingeZoneModel& h) {
  std::vector<double> d;
  for (std::size_t i = 0; i + 1 < h.stations.size(); ++i) d.push_back(h.stations[i + 1] - h.stations[i]);
  return d;
}

double worst_ratio(const std::vector<double>& d) {
  double r = 1.0;
  for (std::size_t i = 0; i + 1 < d.size(); ++i) r = std::max(r, std::max(d[i] / d[i + 1], d[i + 1] / d[i]));
  return r;
}

// The far-region grading of before (3 h_e, slope 0.2) and a coarser one (6 h_e, slope 0.3).
struct FarGrading {
  double size, growth;
};
const FarGrading kFarGradings[] = {{3.0, 0.2}, {6.0, 0.3}};

TEST(HingeZoneMesher, GradesElementLengthsAwayFromTheHinge) {
  for (const FarGrading& far : kFarGradings) {
    HingeZoneSpec s = ipe300_spec(HingeSetup::cantilever, 3000.0);
    s.far_element_length = far.size;
    s.far_growth = far.growth;
    const HingeZoneModel h = build_hinge_zone(s);
    const double he = 150.0 / 8.0;  // aspect 1, b / flange_elements
    EXPECT_CLOSE(h.hinge_element_length, he, 1e-15, 0.0);
    const std::vector<double> d = lengths(h);
    SCOPED_TRACE("far_element_length " + std::to_string(far.size));
    // Hinge region: ceil(1.5 * 300 / 18.75) = 24 elements of exactly h_e from the support.
    for (int i = 0; i < 24; ++i) EXPECT_CLOSE(d[i], he, 1e-9, 0.0) << "element " << i;
    // Beyond it: growing by at most 1.05 + growth per element, up to at most far_element_length
    // h_e and b/2 = 4 h_e (so 3 h_e and 4 h_e here), reaching close to it.
    const double largest = std::min(far.size, 0.5 * 150.0 / he) * he;
    EXPECT_LE(worst_ratio(d), 1.05 + far.growth);
    EXPECT_LE(*std::max_element(d.begin(), d.end()), largest * (1.0 + 1e-12));
    EXPECT_GT(*std::max_element(d.begin(), d.end()), largest - 0.5 * he);
    for (std::size_t i = 24; i + 1 < d.size(); ++i) EXPECT_GE(d[i + 1], d[i] * (1.0 - 1e-9)) << "element " << i;
  }
}

TEST(HingeZoneMesher, KeepsTheGradingBoundForRandomSpecialPositions) {
  for (const FarGrading& far : kFarGradings) {
    std::mt19937 rng(20240611);  // seeded: the same 40 layouts on every run
    std::uniform_real_distribution<double> u(0.0, 1.0);
    for (int trial = 0; trial < 40; ++trial) {
      HingeZoneSpec s = ipe300_spec(static_cast<HingeSetup>(trial % 4), 1000.0 + 5000.0 * u(rng));
      s.far_element_length = far.size;
      s.far_growth = far.growth;
      if (s.setup == HingeSetup::four_point) s.load_spacing = s.length * (0.1 + 0.7 * u(rng));
      for (int k = 0; k < trial % 4; ++k) s.lateral_restraints.push_back({s.length * u(rng), RestrainedFlange::both});
      if (trial % 3 == 0) s.stiffener_positions.push_back(s.length * u(rng));
      s.aspect = 0.5 + 1.5 * u(rng);
      const HingeZoneModel h = build_hinge_zone(s);
      const std::vector<double> d = lengths(h);
      SCOPED_TRACE("trial " + std::to_string(trial) + ", far_element_length " + std::to_string(far.size));
      EXPECT_LE(worst_ratio(d), 1.05 + far.growth);
      EXPECT_LE(*std::max_element(d.begin(), d.end()), far.size * h.hinge_element_length * (1.0 + 1e-12));
      EXPECT_LE(*std::max_element(d.begin(), d.end()), std::max(0.5 * 150.0, h.hinge_element_length) * (1.0 + 1e-12));
    }
  }
}

TEST(HingeZoneMesher, ReferenceLoadTimesLeverArmGivesMp) {
  // Mp of the IPE 300 plate model in S355: fy [b tf (h - tf) + tw (h - tf)^2 / 4] = 355 x
  // 612 884.2 mm^3 = 217.574 kNm (hand arithmetic, 7 figures).
  const double Mp_hand = 355.0 * 612884.2;
  for (HingeSetup setup : {HingeSetup::cantilever, HingeSetup::three_point, HingeSetup::four_point, HingeSetup::uniform_moment}) {
    const double L = 2400.0;
    const HingeZoneModel h = build_hinge_zone(ipe300_spec(setup, L));
    SCOPED_TRACE(static_cast<int>(setup));
    EXPECT_CLOSE(h.plastic_moment, Mp_hand, 1e-7, 0.0);
    const double Mp = h.plastic_moment;
    EXPECT_EQ(h.moment_per_load_factor, Mp);
    const ShellModel& m = h.model;
    // Statics from the assembled reference load vector (an independent path through the group
    // weights): the moment at the hinge section about the y axis.
    const Eigen::VectorXd f = reference_load_vector(m);
    double total_fz = 0.0, moment_about_origin = 0.0, applied_my = 0.0;
    for (int n = 0; n < m.node_count(); ++n) {
      total_fz += f[6 * n + 2];
      moment_about_origin += -m.nodes[n].x() * f[6 * n + 2];  // downward force at x: sagging about 0
      applied_my += f[6 * n + 4];
    }
    switch (setup) {
      case HingeSetup::cantilever:  // hogging at the support: M = P L
        EXPECT_CLOSE(moment_about_origin, Mp, 1e-12, 0.0);
        EXPECT_CLOSE(-m.loads.at(0).force.z() * h.lever_arm, Mp, 1e-12, 0.0);
        EXPECT_EQ(h.lever_arm, L);
        break;
      case HingeSetup::three_point: {  // reaction P/2 at x = 0: M(L/2) = P L / 4
        const double P = -total_fz;
        EXPECT_CLOSE(0.5 * P * 0.5 * L, Mp, 1e-12, 0.0);
        EXPECT_CLOSE(-m.loads.at(0).force.z() * h.lever_arm, Mp, 1e-12, 0.0);
        break;
      }
      case HingeSetup::four_point: {  // reaction P at x = 0: M(a) = P a, a = 0.3 L
        const double a = 0.3 * L, P = -0.5 * total_fz;
        EXPECT_CLOSE(h.shear_span, a, 1e-12, 0.0);
        EXPECT_CLOSE(P * a, Mp, 1e-12, 0.0);
        ASSERT_EQ(m.loads.size(), 2u);
        for (const auto& l : m.loads) EXPECT_CLOSE(-l.force.z() * h.lever_arm, Mp, 1e-12, 0.0);
        break;
      }
      case HingeSetup::uniform_moment:
        EXPECT_CLOSE(f[6 * node_of(m, "end_a") + 4], Mp, 1e-12, 0.0);
        EXPECT_CLOSE(f[6 * node_of(m, "end_b") + 4], -Mp, 1e-12, 0.0);
        EXPECT_CLOSE(applied_my, 0.0, 0.0, 1e-6 * Mp);
        EXPECT_EQ(h.lever_arm, 0.0);
        break;
    }
  }
}

TEST(HingeZoneMesher, SharesNodesBetweenPlatesWithoutDuplicates) {
  HingeZoneSpec s = ipe300_spec(HingeSetup::four_point, 3000.0);
  s.stiffener_positions = {500.0};
  const HingeZoneModel h = build_hinge_zone(s);
  const ShellModel& m = h.model;
  // No two element nodes closer than 1e-6 h (the reference nodes of rigid ties are excluded: a
  // centroid may coincide with a web node of the section it is tied to).
  std::vector<std::array<double, 4>> pts;
  std::vector<char> used(m.node_count(), 0);
  for (const auto& e : m.elements)
    for (int n : e.nodes) used[n] = 1;
  for (int n = 0; n < m.node_count(); ++n)
    if (used[n]) pts.push_back({m.nodes[n].x(), m.nodes[n].y(), m.nodes[n].z(), double(n)});
  std::sort(pts.begin(), pts.end());
  const double tol = 1e-6 * s.section.h;
  for (std::size_t i = 0; i + 1 < pts.size(); ++i)
    for (std::size_t j = i + 1; j < pts.size() && pts[j][0] - pts[i][0] <= tol; ++j)
      EXPECT_FALSE(std::abs(pts[j][1] - pts[i][1]) <= tol && std::abs(pts[j][2] - pts[i][2]) <= tol)
          << "nodes " << pts[i][3] << " and " << pts[j][3] << " coincide";
  // Junctions: nodes used by two regions. Flange-web: one per station and flange; stiffener-web:
  // nw + 1 per stiffener; stiffener-flange: the flange's n + 1 per stiffener. With the default
  // tension_coarsening 2 (sagging: the bottom flange in tension): top flange 8, bottom flange 4
  // (per half 4 -> 2 cells of two), web 10 -> 9 (5 fine to mid-depth, 2 growing, 2 coarse).
  std::vector<std::set<int>> by_region(4);
  for (const auto& e : m.elements)
    for (int n : e.nodes) by_region[e.region].insert(n);
  auto shared = [&](int r1, int r2) {
    int c = 0;
    for (int n : by_region[r1]) c += by_region[r2].count(n) ? 1 : 0;
    return c;
  };
  const int stations = static_cast<int>(h.stations.size()), stiffeners = static_cast<int>(h.stiffener_x.size());
  EXPECT_EQ(stiffeners, 5);
  EXPECT_EQ(shared(0, 2), stations);  // top flange - web
  EXPECT_EQ(shared(1, 2), stations);  // bottom flange - web
  EXPECT_EQ(h.grid.nt(), 8);
  EXPECT_EQ(h.grid.nb(), 4);
  EXPECT_EQ(h.grid.nw(), 9);
  EXPECT_EQ(shared(3, 2), stiffeners * 10);
  EXPECT_EQ(shared(3, 0), stiffeners * 9);
  EXPECT_EQ(shared(3, 1), stiffeners * 5);
  EXPECT_EQ(m.region_names, (std::vector<std::string>{"top_flange", "bottom_flange", "web", "stiffener"}));
}

TEST(HingeZoneMesher, ElementsHavePositiveAreaAndOneNormalPerPlate) {
  HingeZoneSpec s = ipe300_spec(HingeSetup::three_point, 2000.0);
  const HingeZoneModel h = build_hinge_zone(s);
  const Eigen::Vector3d expected[4] = {Eigen::Vector3d::UnitZ(), Eigen::Vector3d::UnitZ(), Eigen::Vector3d::UnitY(),
                                       Eigen::Vector3d::UnitX()};
  const double thickness[4] = {10.7, 10.7, 7.1, 10.7};
  for (const auto& e : h.model.elements) {
    const auto& x = h.model.nodes;
    const Eigen::Vector3d n = (x[e.nodes[2]] - x[e.nodes[0]]).cross(x[e.nodes[3]] - x[e.nodes[1]]);
    EXPECT_GT(0.5 * n.norm(), 1.0);  // mm^2; the smallest element here is ~ 19 x 29 mm
    EXPECT_GT(n.normalized().dot(expected[e.region]), 1.0 - 1e-12);
    EXPECT_EQ(e.thickness, thickness[e.region]);
  }
}

TEST(HingeZoneMesher, ProducesValidTopologyForEverySetup) {
  for (HingeSetup setup : {HingeSetup::cantilever, HingeSetup::three_point, HingeSetup::four_point, HingeSetup::uniform_moment}) {
    HingeZoneSpec s = ipe300_spec(setup, 2500.0);
    s.lateral_restraints = {{1200.0, RestrainedFlange::both}, {2500.0, RestrainedFlange::top}};
    if (setup == HingeSetup::cantilever || setup == HingeSetup::uniform_moment) s.axial_load_ratio = 0.2;
    const HingeZoneModel h = build_hinge_zone(s);
    EXPECT_NO_THROW(validate_topology(h.model)) << static_cast<int>(setup);
  }
}

TEST(HingeZoneMesher, SupportsTheCantileverAsSpecified) {
  HingeZoneSpec s = ipe300_spec(HingeSetup::cantilever, 1500.0);
  s.axial_load_ratio = 0.3;
  const HingeZoneModel h = build_hinge_zone(s);
  const ShellModel& m = h.model;
  // Top flange (tension) 4 of 8 elements; the web keeps 10: under N = 0.3 Npl the neutral axis
  // lies 111 mm above mid-depth, so only 33 mm of the 289.3 mm web may grow (section_grading.hpp).
  EXPECT_EQ(h.grid.nt(), 4);
  EXPECT_EQ(h.grid.nw(), 10);
  const int per_station = (8 + 1) + (4 + 1) + 10 - 1;
  EXPECT_EQ(m.groups.at("support").nodes.size(), static_cast<std::size_t>(per_station));
  for (int n : m.groups.at("support").nodes) EXPECT_EQ(m.nodes[n].x(), 0.0);
  for (int d = 0; d < 6; ++d) EXPECT_TRUE(fixed(m, "support", static_cast<Dof>(d)));
  EXPECT_EQ(m.groups.at("end_section").nodes.size(), static_cast<std::size_t>(per_station));
  for (int n : m.groups.at("end_section").nodes) EXPECT_EQ(m.nodes[n].x(), 1500.0);
  const int ref = node_of(m, "load_point");
  EXPECT_EQ(m.nodes[ref], Eigen::Vector3d(1500.0, 0.0, 0.0));
  ASSERT_EQ(m.rigid_ties.size(), 1u);
  EXPECT_EQ(m.rigid_ties[0].group, "end_section");
  EXPECT_EQ(m.rigid_ties[0].reference_node, ref);
  for (const auto& e : m.elements) EXPECT_EQ(std::count(e.nodes.begin(), e.nodes.end(), ref), 0);
  EXPECT_TRUE(fixed(m, "load_point", Dof::uy));
  EXPECT_TRUE(fixed(m, "load_point", Dof::rx));
  EXPECT_FALSE(fixed(m, "load_point", Dof::uz));
  EXPECT_FALSE(fixed(m, "load_point", Dof::ry));
  // Axial load: 0.3 A_plate fy, compressing (pointing into the member, -x at x = L).
  ASSERT_EQ(m.fixed_loads.size(), 1u);
  EXPECT_EQ(m.fixed_loads[0].group, "load_point");
  EXPECT_CLOSE(m.fixed_loads[0].force.x(), -0.3 * 5264.03 * 355.0, 1e-6, 0.0);
  // theta = delta_tip / L with delta_tip = -uz(load_point).
  EXPECT_EQ(h.rotation.nodes, std::vector<int>{ref});
  EXPECT_EQ(h.rotation.dof, Dof::uz);
  EXPECT_CLOSE(h.rotation.weights.at(0), -1.0 / 1500.0, 1e-15, 0.0);
}

TEST(HingeZoneMesher, SupportsTheBeamSetupsOnBearings) {
  for (HingeSetup setup : {HingeSetup::three_point, HingeSetup::four_point}) {
    const double L = 3000.0, zf = 0.5 * (300.0 - 10.7);
    const HingeZoneModel h = build_hinge_zone(ipe300_spec(setup, L));
    const ShellModel& m = h.model;
    EXPECT_EQ(m.nodes[node_of(m, "bearing_a")], Eigen::Vector3d(0.0, 0.0, -zf));
    EXPECT_EQ(m.nodes[node_of(m, "bearing_b")], Eigen::Vector3d(L, 0.0, -zf));
    EXPECT_EQ(m.nodes[node_of(m, "twist_a")], Eigen::Vector3d(0.0, 0.0, zf));
    EXPECT_EQ(m.nodes[node_of(m, "twist_b")], Eigen::Vector3d(L, 0.0, zf));
    EXPECT_TRUE(fixed(m, "bearing_a", Dof::ux) && fixed(m, "bearing_a", Dof::uy) && fixed(m, "bearing_a", Dof::uz));
    EXPECT_TRUE(!fixed(m, "bearing_b", Dof::ux) && fixed(m, "bearing_b", Dof::uy) && fixed(m, "bearing_b", Dof::uz));
    EXPECT_TRUE(fixed(m, "twist_a", Dof::uy) && !fixed(m, "twist_a", Dof::uz));
    EXPECT_TRUE(m.rigid_ties.empty());
    if (setup == HingeSetup::three_point) {
      EXPECT_EQ(m.nodes[node_of(m, "load_point")], Eigen::Vector3d(0.5 * L, 0.0, zf));
      const int mid = node_of(m, "midspan_bottom");
      EXPECT_EQ(m.nodes[mid], Eigen::Vector3d(0.5 * L, 0.0, -zf));
      EXPECT_EQ(h.rotation.nodes, std::vector<int>{mid});
      EXPECT_CLOSE(h.rotation.weights.at(0), -4.0 / L, 1e-15, 0.0);
      EXPECT_EQ(h.stiffener_x, (std::vector<double>{0.0, 0.5 * L, L}));
    } else {
      const double a = 0.3 * L;
      EXPECT_CLOSE(m.nodes[node_of(m, "load_point_a")].x(), a, 1e-12, 0.0);
      EXPECT_CLOSE(m.nodes[node_of(m, "load_point_b")].x(), L - a, 1e-12, 0.0);
      EXPECT_EQ(m.nodes[node_of(m, "deflection_a")].z(), -zf);
      // theta = 2 (mean deflection) / a = (d_a + d_b) / a.
      EXPECT_EQ(h.rotation.nodes, (std::vector<int>{node_of(m, "deflection_a"), node_of(m, "deflection_b")}));
      EXPECT_CLOSE(h.rotation.weights.at(0), -1.0 / a, 1e-15, 0.0);
      EXPECT_CLOSE(h.rotation.weights.at(1), -1.0 / a, 1e-15, 0.0);
      EXPECT_EQ(h.stiffener_x.size(), 4u);
    }
  }
}

TEST(HingeZoneMesher, TiesBothEndsForUniformMoment) {
  HingeZoneSpec s = ipe300_spec(HingeSetup::uniform_moment, 2000.0);
  s.axial_load_ratio = 0.1;
  const HingeZoneModel h = build_hinge_zone(s);
  const ShellModel& m = h.model;
  const int a = node_of(m, "end_a"), b = node_of(m, "end_b");
  EXPECT_EQ(m.nodes[a], Eigen::Vector3d(0.0, 0.0, 0.0));
  EXPECT_EQ(m.nodes[b], Eigen::Vector3d(2000.0, 0.0, 0.0));
  ASSERT_EQ(m.rigid_ties.size(), 2u);
  for (Dof d : {Dof::uy, Dof::uz, Dof::rx}) EXPECT_TRUE(fixed(m, "end_a", d) && fixed(m, "end_b", d));
  EXPECT_TRUE(fixed(m, "end_a", Dof::ux));
  EXPECT_FALSE(fixed(m, "end_b", Dof::ux));
  EXPECT_FALSE(fixed(m, "end_a", Dof::ry) || fixed(m, "end_b", Dof::ry) || fixed(m, "end_a", Dof::rz));
  // Sagging: My = +Mp at x = 0 and -Mp at x = L turns the end sections so the top fibres shorten.
  EXPECT_GT(m.loads.at(0).moment.y(), 0.0);
  EXPECT_EQ(h.rotation.nodes, (std::vector<int>{a, b}));
  EXPECT_EQ(h.rotation.dof, Dof::ry);
  EXPECT_EQ(h.rotation.weights, (std::vector<double>{1.0, -1.0}));
  ASSERT_EQ(m.fixed_loads.size(), 1u);
  EXPECT_EQ(m.fixed_loads[0].group, "end_b");
  EXPECT_LT(m.fixed_loads[0].force.x(), 0.0);
  EXPECT_TRUE(h.stiffener_x.empty());
  // The whole member is the hinge region: uniform elements of about h_e.
  const std::vector<double> d = lengths(h);
  EXPECT_CLOSE(*std::max_element(d.begin(), d.end()), *std::min_element(d.begin(), d.end()), 1e-9, 0.0);
  EXPECT_LE(d.front(), h.hinge_element_length);
}

TEST(HingeZoneMesher, RestrainsFlangeCentreLinesLaterally) {
  HingeZoneSpec s = ipe300_spec(HingeSetup::cantilever, 2000.0);
  s.lateral_restraints = {{1000.0, RestrainedFlange::both}, {500.0, RestrainedFlange::top}, {2000.0, RestrainedFlange::both}};
  const HingeZoneModel h = build_hinge_zone(s);
  const ShellModel& m = h.model;
  const double zf = 0.5 * (300.0 - 10.7);
  const auto& both = m.groups.at("restraint_0").nodes;
  ASSERT_EQ(both.size(), 2u);
  for (int n : both) {
    EXPECT_EQ(m.nodes[n].x(), 1000.0);
    EXPECT_EQ(m.nodes[n].y(), 0.0);
    EXPECT_EQ(std::abs(m.nodes[n].z()), zf);
  }
  ASSERT_EQ(m.groups.at("restraint_1").nodes.size(), 1u);
  EXPECT_EQ(m.nodes[m.groups.at("restraint_1").nodes[0]], Eigen::Vector3d(500.0, 0.0, zf));
  EXPECT_TRUE(fixed(m, "restraint_0", Dof::uy) && !fixed(m, "restraint_0", Dof::uz) && !fixed(m, "restraint_0", Dof::ux));
  EXPECT_TRUE(fixed(m, "restraint_1", Dof::uy));
  // At the tied tip the reference node's uy, rx supports already hold both flanges: no Support.
  EXPECT_TRUE(m.groups.count("restraint_2"));
  EXPECT_FALSE(fixed(m, "restraint_2", Dof::uy));
  EXPECT_NO_THROW(validate_topology(m));
}

TEST(HingeZoneMesher, BeamTheoryRotationMatchesReferenceValue) {
  // docs/spec/references.md section 6 (DERIVED, beam theory): IPE 300, S355, L = 1.5 m, Mp = 223.1 kNm,
  // theta_p(chord) = Mp L / (3 E I) = 0.00636 rad (E 210 000, I = 8356 cm^4).
  HingeZoneModel m;
  m.setup = HingeSetup::cantilever;
  m.span = 1500.0;
  m.plastic_moment = 223.1e6;
  m.plate.Iy = 8356e4;
  EXPECT_CLOSE(beam_theory_rotation_at_mp(m, 210000.0), 0.00636, 1e-3, 0.0);
  // Three-point bending of span 2L is two such cantilevers: the same moment turns the two chords
  // by twice the cantilever's chord rotation (docs/spec/references.md section 6, "half of a 3-point span").
  m.setup = HingeSetup::three_point;
  m.span = 3000.0;
  EXPECT_CLOSE(beam_theory_rotation_at_mp(m, 210000.0), 2 * 0.00636, 1e-3, 0.0);
  // Four-point bending with the loads together (a = L/2) is three-point bending.
  m.setup = HingeSetup::four_point;
  m.shear_span = 1500.0;
  EXPECT_CLOSE(beam_theory_rotation_at_mp(m, 210000.0), 2 * 0.00636, 1e-3, 0.0);
}

void expect_rejected(HingeZoneSpec s, const std::function<void(HingeZoneSpec&)>& change, const std::string& key) {
  change(s);
  try {
    build_hinge_zone(s);
    ADD_FAILURE() << "no exception for " << key;
  } catch (const std::invalid_argument& e) {
    EXPECT_NE(std::string(e.what()).find(key), std::string::npos) << e.what();
  }
}

TEST(HingeZoneMesher, RejectsBadSpecsNamingTheKey) {
  const HingeZoneSpec ok = ipe300_spec(HingeSetup::cantilever, 2000.0);
  expect_rejected(ok, [](HingeZoneSpec& s) { s.length = -1.0; }, "member.length");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.lateral_restraints = {{100.0}, {2500.0}}; }, "restraints.lateral[1].x");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.flange_elements = 7; }, "mesh.flange_elements");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.flange_elements = 2; }, "mesh.flange_elements");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.web_elements = 3; }, "mesh.web_elements");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.aspect = 0.0; }, "mesh.aspect");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.tension_coarsening = 0.99; }, "mesh.tension_coarsening");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.tension_coarsening = 3.5; }, "mesh.tension_coarsening");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.tension_coarsening = std::nan(""); }, "mesh.tension_coarsening");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.far_element_length = 0.5; }, "mesh.far_element_length");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.far_growth = 0.6; }, "mesh.far_growth");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.fy = 0.0; }, "steel.fy");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.axial_load_ratio = 1.0; }, "member.axial_load_ratio");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.setup = HingeSetup::three_point; s.axial_load_ratio = 0.2; },
                  "member.axial_load_ratio");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.setup = HingeSetup::four_point; s.load_spacing = 2000.0; },
                  "member.load_spacing");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.load_spacing = 500.0; }, "member.load_spacing");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.stiffener_positions = {-5.0}; }, "member.stiffeners[0]");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.stiffener_thickness = 0.0; }, "member.stiffener_thickness");
  expect_rejected(ok, [](HingeZoneSpec& s) { s.section.tf = 200.0; }, "section.flange_thickness");
  EXPECT_NO_THROW(build_hinge_zone(ok));
}

}  // namespace
}  // namespace rotcap
