#pragma once
// Test helper: element-independent assembly checks. Synthetic element matrices (seeded random
// symmetric positive definite 24 x 24 blocks, one per element) and a dense reference assembly
// over the full DOFs, restricted to the free ones.

#include "solver/assembler.hpp"
#include "solver/dof_map.hpp"

#include <Eigen/Dense>
#include <random>
#include <vector>

namespace rotcap::testing {

/// Symmetric positive definite element matrices M M^T + 24 I with M uniform in [-1, 1], and
/// element vectors uniform in [-1, 1]; mt19937 seeded with seed.
struct SyntheticElements {
  std::vector<Mat24> k;
  std::vector<Vec24> f;
  SyntheticElements(int count, unsigned seed) {
    std::mt19937 rng(seed);
    std::uniform_real_distribution<double> u(-1.0, 1.0);
    for (int e = 0; e < count; ++e) {
      Mat24 m;
      for (int j = 0; j < 24; ++j)
        for (int i = 0; i < 24; ++i) m(i, j) = u(rng);
      k.push_back(m * m.transpose() + 24.0 * Mat24::Identity());
      Vec24 v;
      for (int i = 0; i < 24; ++i) v[i] = u(rng);
      f.push_back(v);
    }
  }
  ElementKernel kernel() const {
    return [this](int e, Mat24* K, Vec24* F) {
      if (K) *K = k[e];
      if (F) *F = f[e];
      return ElementStatus::Ok;
    };
  }
};

/// Dense K over the free DOFs by direct summation in element order.
inline Eigen::MatrixXd dense_assembly(const std::vector<ElementNodes>& elements, const DofMap& dofs,
                                      const std::vector<Mat24>& k) {
  Eigen::MatrixXd K = Eigen::MatrixXd::Zero(dofs.free_count(), dofs.free_count());
  for (std::size_t e = 0; e < elements.size(); ++e)
    for (int a = 0; a < 24; ++a)
      for (int b = 0; b < 24; ++b) {
        const int p = dofs.equation(kDofsPerNode * elements[e][a / 6] + a % 6);
        const int q = dofs.equation(kDofsPerNode * elements[e][b / 6] + b % 6);
        if (p >= 0 && q >= 0) K(p, q) += k[e](a, b);
      }
  return K;
}

/// Dense symmetric matrix from upper-triangle pattern values.
inline Eigen::MatrixXd to_dense(const SparsePattern& pattern, const std::vector<double>& values) {
  Eigen::MatrixXd A = Eigen::MatrixXd::Zero(pattern.size(), pattern.size());
  for (int q = 0; q < pattern.size(); ++q)
    for (int k = pattern.column_starts()[q]; k < pattern.column_starts()[q + 1]; ++k) {
      const int p = pattern.row_indices()[k];
      A(p, q) = values[k];
      A(q, p) = values[k];
    }
  return A;
}

}  // namespace rotcap::testing
