#include "solver/assembler.hpp"

#include <omp.h>

#include <algorithm>
#include <atomic>
#include <chrono>
#include <exception>
#include <stdexcept>

namespace rotcap {

const char* element_status_name(ElementStatus status) {
  switch (status) {
    case ElementStatus::Ok: return "Ok";
    case ElementStatus::NegativeJacobian: return "NegativeJacobian";
    case ElementStatus::LocalIterationFailed: return "LocalIterationFailed";
    case ElementStatus::NotFinite: return "NotFinite";
  }
  return "Unknown";
}

Assembler::Assembler(const SparsePattern& pattern, const std::vector<ElementNodes>& elements)
    : pattern_(pattern), elements_(elements), node_count_(pattern.node_count()) {
  if (static_cast<int>(elements.size()) != pattern.element_count())
    throw std::invalid_argument("Assembler: " + std::to_string(elements.size()) +
                                " elements given; the pattern was built from " +
                                std::to_string(pattern.element_count()));
  for (std::size_t e = 0; e < elements.size(); ++e)
    for (int v : elements[e])
      if (v < 0 || v >= node_count_)
        throw std::invalid_argument("Assembler: element " + std::to_string(e) + " refers to node " +
                                    std::to_string(v) + "; need 0 <= node < " + std::to_string(node_count_));

  // Greedy colouring in element order (first fit): an element takes the lowest colour not used
  // by an already coloured element sharing one of its nodes. A structured quad mesh needs 4.
  std::vector<std::vector<int>> node_colours(static_cast<std::size_t>(node_count_));
  std::vector<char> taken;
  for (int e = 0; e < static_cast<int>(elements.size()); ++e) {
    taken.assign(colours_.size() + 1, 0);
    for (int v : elements[e])
      for (int c : node_colours[v]) taken[c] = 1;
    const int c = static_cast<int>(std::find(taken.begin(), taken.end(), 0) - taken.begin());
    if (c == static_cast<int>(colours_.size())) colours_.emplace_back();
    colours_[c].push_back(e);
    for (int v : elements[e]) node_colours[v].push_back(c);
  }
}

AssemblySummary Assembler::assemble(const ElementKernel& kernel, std::vector<double>* values,
                                    Eigen::VectorXd* full_vector, const AssemblyOptions& options) const {
  if (options.threads < 0)
    throw std::invalid_argument("AssemblyOptions::threads = " + std::to_string(options.threads) +
                                "; need threads >= 0");
  const auto start = std::chrono::steady_clock::now();
  if (values) values->assign(static_cast<std::size_t>(pattern_.nonzeros()), 0.0);
  if (full_vector) full_vector->setZero(kDofsPerNode * node_count_);
  const int threads = options.threads > 0 ? options.threads : omp_get_max_threads();

  std::atomic<bool> failed{false};
  std::exception_ptr thrown;
  int failed_element = -1;
  ElementStatus failed_status = ElementStatus::Ok;
  double* vals = values ? values->data() : nullptr;
  double* vec = full_vector ? full_vector->data() : nullptr;

#pragma omp parallel num_threads(threads)
  {
    // Per-thread scratch, allocated once per call on the thread's stack.
    Mat24 k, ks;
    Vec24 f;
    for (const std::vector<int>& colour : colours_) {
      const int count = static_cast<int>(colour.size());
#pragma omp for schedule(dynamic, 8)
      for (int idx = 0; idx < count; ++idx) {
        if (failed.load(std::memory_order_relaxed)) continue;
        const int e = colour[idx];
        ElementStatus status = ElementStatus::Ok;
        try {
          status = kernel(e, vals ? &k : nullptr, vec ? &f : nullptr);
        } catch (...) {
          // An exception must not leave the parallel region; keep the first and rethrow below.
          failed.store(true, std::memory_order_relaxed);
#pragma omp critical(rotcap_assembly_failure)
          if (!thrown) thrown = std::current_exception();
          continue;
        }
        if (status != ElementStatus::Ok) {
          failed.store(true, std::memory_order_relaxed);
#pragma omp critical(rotcap_assembly_failure)
          if (failed_element < 0 || e < failed_element) {
            failed_element = e;
            failed_status = status;
          }
          continue;
        }
        if (vals) {
          // The symmetric part 1/2 (K + K^T), formed once (vectorised), is read column by column.
          // Distinct equations: the pair (i, j) is the only contribution to its upper entry. The
          // same equation twice (an element with a repeated node, e.g. collapsed onto a master)
          // lands on the diagonal, which then receives both k_ij and k_ji = 2 ks_ij (exact).
          ks.noalias() = 0.5 * (k + k.transpose());
          const int* map = pattern_.element_map(e).data();
          const int* eq = pattern_.element_equations(e).data();
          for (int j = 0; j < SparsePattern::kElementDofs; ++j) {
            const int* column_map = map + SparsePattern::pair_index(0, j);
            const double* column = ks.col(j).data();
            const int eq_j = eq[j];
            for (int i = 0; i < j; ++i) {
              const int at = column_map[i];
              if (at >= 0) vals[at] += eq[i] == eq_j ? 2.0 * column[i] : column[i];
            }
            const int at = column_map[j];
            if (at >= 0) vals[at] += k(j, j);
          }
        }
        if (vec) {
          const ElementNodes& en = elements_[e];
          for (int a = 0; a < 4; ++a)
            for (int d = 0; d < kDofsPerNode; ++d) vec[kDofsPerNode * en[a] + d] += f[kDofsPerNode * a + d];
        }
      }  // implicit barrier: the next colour starts after this one is complete
    }
  }

  if (thrown) std::rethrow_exception(thrown);
  AssemblySummary summary;
  summary.seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
  if (failed_element >= 0) {
    summary.ok = false;
    summary.failed_element = failed_element;
    summary.element_status = failed_status;
    summary.message = "element " + std::to_string(failed_element) + " failed: " +
                      element_status_name(failed_status);
  }
  return summary;
}

}  // namespace rotcap
