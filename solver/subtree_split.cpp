#include "solver/subtree_split.hpp"

#include <algorithm>
#include <stdexcept>
#include <string>

namespace rotcap {

double SubtreeSplit::two_thread_ratio() const {
  const double total = work[0] + work[1] + work[2];
  return total > 0.0 ? (std::max(work[0], work[1]) + work[2]) / total : 1.0;
}

SubtreeSplit split_subtrees(const std::vector<int>& parent, const std::vector<double>& work) {
  const int n = static_cast<int>(parent.size());
  if (static_cast<int>(work.size()) != n) throw std::invalid_argument("split_subtrees: parent and work differ in size");
  std::vector<double> subtree(work);
  std::vector<std::vector<int>> children(static_cast<std::size_t>(n));
  std::vector<int> frontier;
  for (int k = 0; k < n; ++k) {
    const int p = parent[k];
    if (p < 0) {
      frontier.push_back(k);
      continue;
    }
    if (p <= k || p >= n)
      throw std::invalid_argument("split_subtrees: supernode " + std::to_string(k) + " has parent " + std::to_string(p));
    subtree[p] += subtree[k];
    children[p].push_back(k);
  }
  double total = 0.0;
  for (int r : frontier) total += subtree[r];

  // Deal the frontier to two groups; returns the group of each frontier entry.
  std::vector<int> order, group;
  auto deal = [&](double& w0, double& w1) {
    order.resize(frontier.size());
    for (std::size_t i = 0; i < order.size(); ++i) order[i] = static_cast<int>(i);
    std::stable_sort(order.begin(), order.end(), [&](int a, int b) { return subtree[frontier[a]] > subtree[frontier[b]]; });
    group.assign(frontier.size(), 0);
    w0 = w1 = 0.0;
    for (int i : order) {
      const bool second = w1 < w0;
      group[i] = second ? 1 : 0;
      (second ? w1 : w0) += subtree[frontier[i]];
    }
  };

  std::vector<int> top, best_top, best_frontier, best_group;
  double top_work = 0.0, best_cost = 2.0 * total + 1.0, best_w[3] = {total, 0.0, 0.0};
  for (int round = 0; round < 4 * n + 1 && !frontier.empty(); ++round) {
    double w0 = 0.0, w1 = 0.0;
    deal(w0, w1);
    const double cost = std::max(w0, w1) + top_work;
    if (cost < best_cost) {
      best_cost = cost;
      best_top = top;
      best_frontier = frontier;
      best_group = group;
      best_w[0] = w0, best_w[1] = w1, best_w[2] = top_work;
    }
    if (std::abs(w0 - w1) <= 0.02 * (w0 + w1) || top_work > 0.5 * total) break;
    // Open the heaviest frontier subtree.
    const auto heaviest = std::max_element(frontier.begin(), frontier.end(),
                                           [&](int a, int b) { return subtree[a] < subtree[b]; });
    const int k = *heaviest;
    frontier.erase(heaviest);
    top.push_back(k);
    top_work += work[k];
    frontier.insert(frontier.end(), children[k].begin(), children[k].end());
  }

  SubtreeSplit split;
  split.owner.assign(static_cast<std::size_t>(n), -1);
  // Each group's subtrees: every descendant of a frontier root takes its group (children > parent
  // never holds, so walk from the top down: descending k reaches parents before children).
  for (std::size_t i = 0; i < best_frontier.size(); ++i) split.owner[best_frontier[i]] = best_group[i];
  for (int k = n - 1; k >= 0; --k)
    if (split.owner[k] < 0 && parent[k] >= 0 && split.owner[parent[k]] >= 0) split.owner[k] = split.owner[parent[k]];
  for (int k : best_top) split.owner[k] = -1;
  for (int g = 0; g < 3; ++g) split.work[g] = best_w[g];
  return split;
}

}  // namespace rotcap
