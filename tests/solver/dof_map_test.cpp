// DofMap: equation numbering with supports, scatter / gather between full and free vectors.
#include "solver/dof_map.hpp"

#include "tests/solver/plate_mesh.hpp"
#include "tests/test_support.hpp"

#include <stdexcept>

namespace rotcap {
namespace {

using testing::rectangular_plate;
using testing::support;

TEST(DofMap, NumbersFreeDofsNodeByNodeSkippingSupports) {
  // 2 x 1 plate: nodes 0 1 2 (y = 0) and 3 4 5 (y = b). Clamp the edge x = 0 (nodes 0, 3) and
  // hold uz at the edge x = a (nodes 2, 5).
  ShellModel m = rectangular_plate(2.0, 1.0, 2, 1, 0.1);
  m.supports.push_back(support("x0", {"ux", "uy", "uz", "rx", "ry", "rz"}));
  m.supports.push_back(support("xa", {"uz"}));
  const DofMap map(m);
  EXPECT_EQ(map.node_count(), 6);
  EXPECT_EQ(map.dof_count(), 36);
  EXPECT_EQ(map.free_count(), 36 - 12 - 2);
  for (int d = 0; d < 6; ++d) {
    EXPECT_EQ(map.equation(0, static_cast<Dof>(d)), -1);
    EXPECT_EQ(map.equation(3, static_cast<Dof>(d)), -1);
    EXPECT_EQ(map.equation(1, static_cast<Dof>(d)), d);  // node 1 is the first free node
  }
  EXPECT_EQ(map.equation(2, Dof::ux), 6);
  EXPECT_EQ(map.equation(2, Dof::uy), 7);
  EXPECT_EQ(map.equation(2, Dof::uz), -1);
  EXPECT_EQ(map.equation(2, Dof::rx), 8);
  EXPECT_EQ(map.equation(5, Dof::rz), map.free_count() - 1);
  // equation <-> full index are inverse maps
  for (int q = 0; q < map.free_count(); ++q) EXPECT_EQ(map.equation(map.dof_of_equation(q)), q);
}

TEST(DofMap, ScatterAndGatherAreInverseOnFreeDofsAndKeepPrescribedValues) {
  ShellModel m = rectangular_plate(1.0, 1.0, 1, 1, 0.1);
  m.supports.push_back(support("x0", {"ux", "uz"}));
  DofMap map(m);
  ASSERT_EQ(map.free_count(), 24 - 4);
  Eigen::VectorXd x(map.free_count());
  for (int q = 0; q < x.size(); ++q) x[q] = 1.0 + q;
  map.set_prescribed(6 * 0 + 2, 0.25);  // uz of node 0 is held: prescribe 0.25
  const Eigen::VectorXd full = map.scatter(x);
  EXPECT_EQ(full[2], 0.25);
  EXPECT_EQ(full[0], 0.0);
  EXPECT_EQ(map.scatter_homogeneous(x)[2], 0.0);
  EXPECT_EQ(map.gather(full), x);
  EXPECT_THROW(map.set_prescribed(1, 1.0), std::invalid_argument);  // uy of node 0 is free
}

TEST(DofMap, RejectsSupportOnMissingGroup) {
  ShellModel m = rectangular_plate(1.0, 1.0, 1, 1, 0.1);
  m.supports.push_back(support("nowhere", {"ux"}));
  EXPECT_THROW(DofMap map(m), std::invalid_argument);
}

TEST(DofCombination, GroupMeanAndItsFreeDofWeights) {
  // A 2 x 1 plate: group "tip" holds two nodes; one of them has uz held by a support.
  ShellModel m = rectangular_plate(100.0, 50.0, 2, 1, 5.0);
  m.groups["tip"].nodes = {1, 2};
  m.groups["pin"].nodes = {2};
  m.supports.push_back(support("pin", {"uz"}));
  const DofCombination mean = group_mean(m, "tip", Dof::uz);
  Eigen::VectorXd u = Eigen::VectorXd::Zero(m.dof_count());
  u[kDofsPerNode * 1 + 2] = 3.0;
  u[kDofsPerNode * 2 + 2] = 1.0;
  EXPECT_EQ(mean.value(u), 2.0);
  const DofMap dofs(m);
  int held = -1;
  const Eigen::VectorXd c = free_dof_weights(mean, dofs, &held);
  EXPECT_EQ(held, 1);
  EXPECT_EQ(c.sum(), 0.5);
  EXPECT_EQ(c[dofs.equation(1, Dof::uz)], 0.5);
}

}  // namespace
}  // namespace rotcap
