// Gmsh MSH 4.1 reader: a file written by Gmsh 4.8 (tests/data/io_two_region_plate.geo) and a
// hand-written file with parametric nodes, a skipped section and an unnamed physical group. The
// expected values are the geometry of the .geo file (format: Gmsh reference manual, "MSH file
// format", version 4.1).
#include "io/gmsh_reader.hpp"
#include "tests/io/io_test_support.hpp"

#include <Eigen/Geometry>
#include <algorithm>

namespace rotcap {
namespace {

using testing::data_file;

int node_with_tag(const GmshMesh& m, long long tag) {
  const auto it = std::find(m.node_tags.begin(), m.node_tags.end(), tag);
  return it == m.node_tags.end() ? -1 : static_cast<int>(it - m.node_tags.begin());
}

TEST(GmshReader, ReadsNodesQuadsAndRegionsOfAGmshFile) {
  const GmshMesh m = read_gmsh(data_file("io_two_region_plate.msh"));
  ASSERT_EQ(m.nodes.size(), 15u);
  ASSERT_EQ(m.quads.size(), 8u);
  ASSERT_EQ(m.region_names, (std::vector<std::string>{"thin", "thick"}));
  // Node 4 is the corner (100, 50, 0); node 9 the tip mid-point (100, 25, 0) up to Gmsh's rounding.
  EXPECT_EQ(m.nodes[node_with_tag(m, 4)], Eigen::Vector3d(100.0, 50.0, 0.0));
  EXPECT_NEAR(m.nodes[node_with_tag(m, 9)].y(), 25.0, 1e-9);
  for (std::size_t e = 0; e < m.quads.size(); ++e) {
    Eigen::Vector3d centroid = Eigen::Vector3d::Zero();
    for (int n : m.quads[e]) centroid += 0.25 * m.nodes[n];
    EXPECT_EQ(m.quad_region[e], centroid.x() < 50.0 ? 0 : 1) << "quad " << m.quad_tags[e];
    // Gmsh orders the nodes counter-clockwise about +z for these plane surfaces.
    const Eigen::Vector3d d1 = m.nodes[m.quads[e][2]] - m.nodes[m.quads[e][0]];
    const Eigen::Vector3d d2 = m.nodes[m.quads[e][3]] - m.nodes[m.quads[e][1]];
    EXPECT_GT(d1.cross(d2).z(), 0.0);
  }
  // Element 6 of the file: nodes 1 7 14 12, kept in the file's order.
  const auto q = std::find(m.quad_tags.begin(), m.quad_tags.end(), 6) - m.quad_tags.begin();
  EXPECT_EQ(m.quads[q], (std::array<int, 4>{node_with_tag(m, 1), node_with_tag(m, 7),
                                            node_with_tag(m, 14), node_with_tag(m, 12)}));
}

TEST(GmshReader, ResolvesPhysicalGroupsThroughTheirElements) {
  const GmshMesh m = read_gmsh(data_file("io_two_region_plate.msh"));
  ASSERT_EQ(m.groups.size(), 5u);
  // The clamped edge x = 0: curve 6 owns only node 12; its line elements add the end points 1
  // and 6, which Gmsh classifies on geometric points.
  const NodeGroup& clamped = m.groups.at("clamped");
  EXPECT_EQ(clamped.dimension, 1);
  ASSERT_EQ(clamped.nodes.size(), 3u);
  for (int n : clamped.nodes) EXPECT_EQ(m.nodes[n].x(), 0.0);
  EXPECT_EQ(clamped.cells.size(), 2u);
  for (const auto& cell : clamped.cells) EXPECT_EQ(cell.size(), 2u);
  EXPECT_TRUE(std::is_sorted(clamped.nodes.begin(), clamped.nodes.end()));
  const NodeGroup& tip = m.groups.at("tip");
  ASSERT_EQ(tip.nodes.size(), 3u);
  for (int n : tip.nodes) EXPECT_EQ(m.nodes[n].x(), 100.0);
  const NodeGroup& corner = m.groups.at("corner");
  EXPECT_EQ(corner.dimension, 0);
  EXPECT_EQ(corner.nodes, std::vector<int>{node_with_tag(m, 4)});
  const NodeGroup& thin = m.groups.at("thin");
  EXPECT_EQ(thin.dimension, 2);
  EXPECT_EQ(thin.nodes.size(), 9u);
  EXPECT_EQ(thin.cells.size(), 4u);
  EXPECT_EQ(m.group_quads.at("thick").size(), 4u);
}

// One quad on an unnamed surface, an unnamed physical curve (tag 7), parametric surface nodes
// (x y z u v) and a $Comments section to skip.
const char* kHandWritten = R"($MeshFormat
4.1 0 8
$EndMeshFormat
$Comments
written by hand; $Nodes inside a comment is skipped
$EndComments
$Entities
2 1 1 0
1 0 0 0 0
2 1 0 0 0
1 0 0 0 1 0 0 1 7 2 1 -2
1 0 0 0 1 1 0 0 0
$EndEntities
$Nodes
3 4 1 4
0 1 0 1
1
0 0 0
0 2 0 1
2
1 0 0
2 1 1 2
3
4
1 1 0 0.5 0.5
0 1 0 0.25 0.75
$EndNodes
$Elements
2 2 1 2
1 1 1 1
1 1 2
2 1 3 1
2 1 2 3 4
$EndElements
)";

TEST(GmshReader, SkipsParametricCoordinatesAndUnknownSectionsAndNamesUnnamedGroups) {
  const GmshMesh m = parse_gmsh_text(kHandWritten, "hand.msh");
  ASSERT_EQ(m.nodes.size(), 4u);
  EXPECT_EQ(m.nodes[2], Eigen::Vector3d(1.0, 1.0, 0.0));
  EXPECT_EQ(m.nodes[3], Eigen::Vector3d(0.0, 1.0, 0.0));
  ASSERT_EQ(m.quads.size(), 1u);
  EXPECT_EQ(m.quads[0], (std::array<int, 4>{0, 1, 2, 3}));
  EXPECT_EQ(m.region_names, std::vector<std::string>{"unassigned"});
  EXPECT_EQ(m.quad_region[0], 0);
  ASSERT_EQ(m.groups.count("Physical Curve 7"), 1u);
  EXPECT_EQ(m.groups.at("Physical Curve 7").nodes, (std::vector<int>{0, 1}));
}

}  // namespace
}  // namespace rotcap
