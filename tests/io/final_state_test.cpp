// final_state.json (io/final_state.hpp): supports and loads at their deformed positions, written
// and read back; files written before those keys existed still read.
#include "io/final_state.hpp"
#include "tests/io/io_test_support.hpp"
#include "tests/test_support.hpp"

namespace rotcap {
namespace {

/// One square shell element, node 0 supported in ux uy uz, a force on the node group {2, 3}.
ShellModel square() {
  ShellModel m;
  m.nodes = {{0, 0, 0}, {100, 0, 0}, {100, 100, 0}, {0, 100, 0}};
  m.elements.push_back({{0, 1, 2, 3}, 5.0, 0});
  m.region_names = {"plate"};
  m.groups["corner"] = {0, {0}, {{0}}};
  m.groups["edge"] = {0, {2, 3}, {{2}, {3}}};
  Support s{"corner", {}};
  s.fixed[0] = s.fixed[1] = s.fixed[2] = true;
  m.supports.push_back(s);
  m.loads.push_back({"edge", Eigen::Vector3d(0, 0, -500), Eigen::Vector3d::Zero()});
  return m;
}

TEST(FinalState, RecordsSupportsAndLoadsAtTheirDeformedPositions) {
  const ShellModel m = square();
  Eigen::VectorXd u = Eigen::VectorXd::Zero(m.dof_count());
  u[6 * 2 + 2] = 4.0;  // node 2 moves 4 mm in z, node 3 does not: the edge's mean rises 2 mm
  const DeformedMesh d = deformed_mesh(m, u);
  ASSERT_EQ(d.supports.size(), 1u);
  EXPECT_EQ(d.supports[0].group, "corner");
  EXPECT_EQ(d.supports[0].fixed, (std::vector<std::string>{"ux", "uy", "uz"}));
  ASSERT_EQ(d.supports[0].points.size(), 1u);
  ASSERT_EQ(d.loads.size(), 1u);
  EXPECT_CLOSE(d.loads[0].point[0], 50.0, 0.0, 1e-12);
  EXPECT_CLOSE(d.loads[0].point[1], 100.0, 0.0, 1e-12);
  EXPECT_CLOSE(d.loads[0].point[2], 2.0, 0.0, 1e-12);
  EXPECT_EQ(d.loads[0].force[2], -500.0);
  testing::ScratchFolder dir;
  write_final_state(d, dir.path() / "final_state.json");
  const DeformedMesh back = read_final_state(dir.path() / "final_state.json");
  ASSERT_EQ(back.loads.size(), 1u);
  EXPECT_EQ(back.loads[0].point, d.loads[0].point);
  EXPECT_EQ(back.supports[0].fixed, d.supports[0].fixed);
}

TEST(FinalState, ReadsFilesWrittenBeforeSupportsAndLoads) {
  testing::ScratchFolder dir;
  testing::write_text(dir.path() / "final_state.json",
                      R"({"nodes": [[0,0,0],[1,0,0],[1,1,0],[0,1,0]], "quads": [[0,1,2,3]],
                          "displacement": [[0,0,0],[0,0,0],[0,0,1],[0,0,0]], "units": "mm"})");
  const DeformedMesh d = read_final_state(dir.path() / "final_state.json");
  EXPECT_EQ(d.quads.size(), 1u);
  EXPECT_TRUE(d.supports.empty());
  EXPECT_TRUE(d.loads.empty());
}

}  // namespace
}  // namespace rotcap
