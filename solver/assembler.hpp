#pragma once
// Assembler: parallel, bit-reproducible assembly of element matrices and vectors into a
// SparsePattern's value array and a full global vector.
//
// The assembler knows nothing of element internals. It calls an ElementKernel for each element:
//   status = kernel(e, K, f)
// where K (24 x 24, or nullptr when no matrix is wanted) and f (24, or nullptr) are to be filled
// in GLOBAL DOFs of the element's four nodes, node by node, each node in Dof order (ux..rz).
// The kernel must be safe to call concurrently for different elements.
//
// Matrix: only the symmetric part 1/2 (K + K^T) is assembled (upper-triangle storage for
// CHOLMOD, stype = 1). Entries coupling a held DOF are dropped. An element may list a node more
// than once (nodes collapsed onto a master); its DOFs' contributions are then summed correctly. Vector: f is added into a FULL
// vector (size 6 nodes, entry 6 node + dof), held DOFs included, so internal forces give the
// reactions directly.
//
// Parallelism and reproducibility: elements are coloured greedily so that no two elements of a
// colour share a node; colours are processed one after another, each colour's elements in
// parallel (OpenMP, static schedule). Two elements writing the same entry are then always in
// different colours, so every entry receives its contributions in the fixed order (colour, then
// element index) with no atomics: the result is identical to the last bit for ANY thread count.
//
// Failure: the first failing kernel sets an atomic flag; remaining elements are skipped and the
// summary names the failed element with the lowest index among those that were evaluated. The
// outputs are then incomplete and must not be used. An exception thrown by the kernel (a
// programming error, e.g. a bad argument) stops the assembly the same way and is rethrown to the
// caller after the parallel region.

#include "elements/shell_q4.hpp"
#include "solver/sparse_pattern.hpp"

#include <Eigen/Core>
#include <functional>
#include <string>
#include <vector>

namespace rotcap {

using ElementKernel = std::function<ElementStatus(int element, Mat24* K, Vec24* f)>;

const char* element_status_name(ElementStatus status);

struct AssemblyOptions {
  int threads = 0;  ///< OpenMP threads, >= 0; 0 = the OpenMP default (OMP_NUM_THREADS / cores)
};

struct AssemblySummary {
  bool ok = true;
  int failed_element = -1;                    ///< lowest failed element index, -1 if ok
  ElementStatus element_status = ElementStatus::Ok;
  double seconds = 0.0;                       ///< wall time of the call
  std::string message;                        ///< e.g. "element 17 failed: NegativeJacobian"
};

class Assembler {
 public:
  /// pattern must outlive the assembler; elements are the same node lists the pattern was
  /// built from (same order).
  Assembler(const SparsePattern& pattern, const std::vector<ElementNodes>& elements);

  int colour_count() const { return static_cast<int>(colours_.size()); }
  /// Element indices of each colour, ascending within a colour.
  const std::vector<std::vector<int>>& colours() const { return colours_; }
  const SparsePattern& pattern() const { return pattern_; }

  /// Overwrites *values (resized to pattern().nonzeros()) if values != nullptr and *full_vector
  /// (resized to 6 nodes) if full_vector != nullptr with the sums of the element contributions.
  AssemblySummary assemble(const ElementKernel& kernel, std::vector<double>* values,
                           Eigen::VectorXd* full_vector, const AssemblyOptions& options = {}) const;

 private:
  const SparsePattern& pattern_;
  std::vector<ElementNodes> elements_;
  std::vector<std::vector<int>> colours_;
  int node_count_ = 0;
};

}  // namespace rotcap
