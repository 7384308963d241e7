// General models from a case file and a Gmsh mesh: nodes, elements with per-region thickness,
// groups, supports and the reference load shared by tributary length. A uniform line load q on
// 2-node linear edges gives each end node half an interior node's share: the consistent nodal
// load of a linear shape function over an edge of length l is the integral of N_i q = q l / 2
// (derived here; the standard result of e.g. Zienkiewicz, Taylor & Zhu, The Finite Element
// Method: Its Basis and Fundamentals, 7th ed., 2013).
#include "io/case_file.hpp"
#include "io/general_model.hpp"
#include "tests/io/io_test_support.hpp"
#include "tests/test_support.hpp"

namespace rotcap {
namespace {

using testing::data_file;

int node_at(const ShellModel& m, double x, double y) {
  for (int i = 0; i < m.node_count(); ++i)
    if (std::abs(m.nodes[i].x() - x) < 1e-6 && std::abs(m.nodes[i].y() - y) < 1e-6) return i;
  return -1;
}

TEST(GeneralModel, BuildsElementsWithRegionThicknessAndTheMeshGroups) {
  const ShellModel m = build_general_model(read_case_file(data_file("io_two_region_plate.toml")));
  EXPECT_EQ(m.node_count(), 15);
  ASSERT_EQ(m.element_count(), 8);
  EXPECT_EQ(m.dof_count(), 90);
  EXPECT_EQ(m.region_names, (std::vector<std::string>{"thin", "thick"}));
  for (const ShellElement& e : m.elements) {
    double cx = 0.0;
    for (int n : e.nodes) cx += 0.25 * m.nodes[n].x();
    EXPECT_EQ(e.thickness, cx < 50.0 ? 5.0 : 10.0);
    EXPECT_EQ(e.region, cx < 50.0 ? 0 : 1);
  }
  EXPECT_EQ(m.groups.size(), 5u);
  EXPECT_EQ(m.groups.at("clamped").nodes.size(), 3u);
  ASSERT_EQ(m.supports.size(), 1u);
  EXPECT_EQ(m.supports[0].group, "clamped");
  for (bool fixed : m.supports[0].fixed) EXPECT_TRUE(fixed);
  EXPECT_NO_THROW(validate_topology(m));
}

TEST(GeneralModel, SharesALineLoadByTributaryLengthAndAPointMomentFully) {
  const ShellModel m = build_general_model(read_case_file(data_file("io_two_region_plate.toml")));
  ASSERT_EQ(m.loads.size(), 2u);
  const Eigen::VectorXd f = reference_load_vector(m);
  const int bottom = node_at(m, 100.0, 0.0), middle = node_at(m, 100.0, 25.0), top = node_at(m, 100.0, 50.0);
  ASSERT_GE(std::min({bottom, middle, top}), 0);
  // Total -1000 N over two 25 mm edges: ends 1/4 each, the middle node 1/2.
  EXPECT_CLOSE(f[6 * bottom + 2], -250.0, 1e-9, 0.0);
  EXPECT_CLOSE(f[6 * middle + 2], -500.0, 1e-9, 0.0);
  EXPECT_CLOSE(f[6 * top + 2], -250.0, 1e-9, 0.0);
  EXPECT_CLOSE(f[6 * top + 4], 5.0e4, 1e-12, 0.0);  // the corner point's moment, whole
  EXPECT_CLOSE(f.sum(), -1000.0 + 5.0e4, 1e-12, 0.0);
}

TEST(GeneralModel, DefaultThicknessFillsWhatNoGroupCovers) {
  CaseInput c = read_case_file(data_file("io_two_region_plate.toml"));
  c.thickness.pop_back();  // drop "thick": its quads take [model] thickness
  c.model.thickness = 7.5;
  const ShellModel m = build_general_model(c);
  int thin = 0, fallback = 0;
  for (const ShellElement& e : m.elements) {
    if (e.thickness == 5.0) ++thin;
    if (e.thickness == 7.5) ++fallback;
  }
  EXPECT_EQ(thin, 4);
  EXPECT_EQ(fallback, 4);
  // A conflicting second entry for the same surface is an error naming both.
  c.thickness.push_back({"thin", 6.0, 20});
  testing::expect_input_error([&] { build_general_model(c); },
                              {":20: thickness[1].group: found \"thin\" with thickness 6, overlapping thickness[0] (5)"});
}

}  // namespace
}  // namespace rotcap
