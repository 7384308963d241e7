#pragma once
// SubtreeSplit: two groups of independent subtrees of a supernodal elimination tree, balanced by
// work, and the top of the tree above them, for a factorisation that runs the two groups at once
// (supernodal_ldlt.hpp). A supernode's factorisation updates only its ancestors, so supernodes of
// disjoint subtrees can be factorised concurrently; the top (every ancestor of a group's subtree
// roots) waits for both groups (subtree-to-thread mapping: Geist & Ng 1989, "Task scheduling for
// parallel sparse Cholesky factorization", Int. J. Parallel Programming 18:291-314).
//
// The split: start from the roots as the frontier; deal the frontier's subtrees to two groups by
// work, largest first, each to the lighter group; while that leaves the groups unbalanced, move the
// heaviest frontier subtree's root to the top and put its children on the frontier. Of the splits
// tried, the one with the least max(group work) + top work is kept.

#include <vector>

namespace rotcap {

struct SubtreeSplit {
  std::vector<int> owner;  ///< per supernode: 0 or 1 (its group), -1 (the top)
  double work[3] = {0.0, 0.0, 0.0};  ///< estimated work of group 0, group 1 and the top
  /// Estimated time on two threads over the time on one: (max(group) + top) / total.
  double two_thread_ratio() const;
};

/// parent[k]: the supernode k's column updates first (> k), or -1 for a root; work[k] >= 0 its
/// factorisation's estimated work (any unit). Throws std::invalid_argument if parent[k] <= k
/// for some k with a parent.
SubtreeSplit split_subtrees(const std::vector<int>& parent, const std::vector<double>& work);

}  // namespace rotcap
