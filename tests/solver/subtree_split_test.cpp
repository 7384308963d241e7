// split_subtrees on small trees whose best split is known by hand.
#include "solver/subtree_split.hpp"

#include <gtest/gtest.h>

#include <stdexcept>

namespace rotcap {
namespace {

// Every group member's parent is in its group or the top; the top is closed upwards.
void expect_independent_groups(const std::vector<int>& parent, const SubtreeSplit& s) {
  for (std::size_t k = 0; k < parent.size(); ++k) {
    if (parent[k] < 0) continue;
    if (s.owner[k] < 0) EXPECT_LT(s.owner[parent[k]], 0) << "top node " << k << " under a group node";
    else EXPECT_TRUE(s.owner[parent[k]] == s.owner[k] || s.owner[parent[k]] < 0) << "node " << k;
  }
}

TEST(SubtreeSplit, BalancedBinaryTreeSplitsBelowItsRoot) {
  // 0 1 -> 2, 3 4 -> 5, 2 5 -> 6 (root); unit work each.
  const std::vector<int> parent{2, 2, 6, 5, 5, 6, -1};
  const SubtreeSplit s = split_subtrees(parent, std::vector<double>(7, 1.0));
  expect_independent_groups(parent, s);
  EXPECT_EQ(s.owner[6], -1);
  EXPECT_NE(s.owner[2], s.owner[5]);
  EXPECT_EQ(s.owner[0], s.owner[2]);
  EXPECT_EQ(s.owner[3], s.owner[5]);
  EXPECT_DOUBLE_EQ(s.work[0], 3.0);
  EXPECT_DOUBLE_EQ(s.work[1], 3.0);
  EXPECT_DOUBLE_EQ(s.work[2], 1.0);
  EXPECT_DOUBLE_EQ(s.two_thread_ratio(), 4.0 / 7.0);
}

TEST(SubtreeSplit, ChainHasNothingToShareAndStaysInOneGroup) {
  const std::vector<int> parent{1, 2, 3, -1};
  const SubtreeSplit s = split_subtrees(parent, std::vector<double>(4, 1.0));
  expect_independent_groups(parent, s);
  EXPECT_DOUBLE_EQ(s.two_thread_ratio(), 1.0);
}

TEST(SubtreeSplit, UnevenChildrenAreOpenedUntilTheGroupsBalance) {
  // Root 6 with a heavy child 4 (children 0..3, work 1 each, own work 0) and a light child 5 (work 1):
  // opening 4 gives frontier {0,1,2,3,5}: groups 3 and 2 (or better), top {4, 6}.
  const std::vector<int> parent{4, 4, 4, 4, 6, 6, -1};
  const std::vector<double> work{1, 1, 1, 1, 0, 1, 0};
  const SubtreeSplit s = split_subtrees(parent, work);
  expect_independent_groups(parent, s);
  EXPECT_EQ(s.owner[4], -1);
  EXPECT_EQ(s.owner[6], -1);
  EXPECT_DOUBLE_EQ(s.work[0] + s.work[1], 5.0);
  EXPECT_DOUBLE_EQ(std::max(s.work[0], s.work[1]), 3.0);
}

TEST(SubtreeSplit, ForestRootsAreDealtToTheGroups) {
  const std::vector<int> parent{1, -1, 3, -1};
  const SubtreeSplit s = split_subtrees(parent, std::vector<double>(4, 1.0));
  expect_independent_groups(parent, s);
  EXPECT_NE(s.owner[1], s.owner[3]);
  EXPECT_DOUBLE_EQ(s.work[2], 0.0);
  EXPECT_DOUBLE_EQ(s.two_thread_ratio(), 0.5);
}

TEST(SubtreeSplit, ParentNotAfterItsChildIsRejected) {
  EXPECT_THROW(split_subtrees({-1, 0}, {1.0, 1.0}), std::invalid_argument);
}

}  // namespace
}  // namespace rotcap
