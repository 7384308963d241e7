// SparsePattern and Assembler with synthetic element matrices: pattern = dense nonzero pattern,
// values = dense reference assembly, colouring valid, thread count does not change a single bit,
// a failing element stops the assembly with its index in the message.
#include "solver/assembler.hpp"

#include "tests/solver/assembly_fixture.hpp"
#include "tests/solver/plate_mesh.hpp"
#include "tests/test_support.hpp"

#include <cstring>
#include <stdexcept>
#include <set>

namespace rotcap {
namespace {

using testing::rectangular_plate;
using testing::support;

struct Mesh {
  ShellModel model;
  std::vector<ElementNodes> elements;
  Mesh(int nx, int ny) : model(rectangular_plate(3.0, 2.0, nx, ny, 0.1)) {
    // Clamped edge plus a single held DOF elsewhere, so the free set is irregular.
    model.supports.push_back(support("x0", {"ux", "uy", "uz", "rx", "ry", "rz"}));
    model.supports.push_back(support("yb", {"uz"}));
    elements = element_nodes(model);
  }
};

TEST(SparsePattern, EqualsNonzeroPatternOfDenseAssembly) {
  const Mesh mesh(4, 3);
  const DofMap dofs(mesh.model);
  const SparsePattern pattern(mesh.elements, dofs);
  const testing::SyntheticElements synthetic(static_cast<int>(mesh.elements.size()), 7u);
  const Eigen::MatrixXd dense = testing::dense_assembly(mesh.elements, dofs, synthetic.k);
  ASSERT_EQ(pattern.size(), dofs.free_count());
  int dense_upper_nonzeros = 0;
  for (int q = 0; q < pattern.size(); ++q)
    for (int p = 0; p <= q; ++p) {
      const bool structural = dense(p, q) != 0.0;  // random entries never cancel exactly
      dense_upper_nonzeros += structural ? 1 : 0;
      EXPECT_EQ(pattern.find(p, q) >= 0, structural) << "entry (" << p << ", " << q << ")";
    }
  EXPECT_EQ(pattern.nonzeros(), dense_upper_nonzeros);
  // Columns sorted, upper triangle, diagonal present.
  for (int q = 0; q < pattern.size(); ++q) {
    const int begin = pattern.column_starts()[q], end = pattern.column_starts()[q + 1];
    for (int k = begin + 1; k < end; ++k) EXPECT_LT(pattern.row_indices()[k - 1], pattern.row_indices()[k]);
    EXPECT_EQ(pattern.row_indices()[end - 1], q);
  }
}

TEST(Assembler, ColoursPartitionElementsWithoutSharedNodes) {
  const Mesh mesh(6, 5);
  const DofMap dofs(mesh.model);
  const SparsePattern pattern(mesh.elements, dofs);
  const Assembler assembler(pattern, mesh.elements);
  EXPECT_EQ(assembler.colour_count(), 4);  // a structured quad mesh needs exactly 4
  std::vector<int> seen(mesh.elements.size(), 0);
  for (const auto& colour : assembler.colours()) {
    std::set<int> nodes;
    for (int e : colour) {
      ++seen[e];
      for (int v : mesh.elements[e]) EXPECT_TRUE(nodes.insert(v).second) << "node " << v << " shared";
    }
  }
  for (int s : seen) EXPECT_EQ(s, 1);
}

TEST(Assembler, MatrixAndVectorEqualDenseReference) {
  const Mesh mesh(4, 3);
  const DofMap dofs(mesh.model);
  const SparsePattern pattern(mesh.elements, dofs);
  const Assembler assembler(pattern, mesh.elements);
  const testing::SyntheticElements synthetic(static_cast<int>(mesh.elements.size()), 11u);
  std::vector<double> values;
  Eigen::VectorXd f;
  const AssemblySummary s = assembler.assemble(synthetic.kernel(), &values, &f);
  ASSERT_TRUE(s.ok) << s.message;
  const Eigen::MatrixXd dense = testing::dense_assembly(mesh.elements, dofs, synthetic.k);
  const Eigen::MatrixXd sparse = testing::to_dense(pattern, values);
  // Same sums in a different order: equal to round-off (entries are O(10-100)).
  EXPECT_LT((sparse - dense).cwiseAbs().maxCoeff(), 1e-12 * dense.cwiseAbs().maxCoeff());
  Eigen::VectorXd f_ref = Eigen::VectorXd::Zero(mesh.model.dof_count());
  for (std::size_t e = 0; e < mesh.elements.size(); ++e)
    for (int a = 0; a < 24; ++a) f_ref[6 * mesh.elements[e][a / 6] + a % 6] += synthetic.f[e][a];
  EXPECT_LT((f - f_ref).cwiseAbs().maxCoeff(), 1e-13);
  // The symmetric product equals the dense product.
  Eigen::VectorXd x = Eigen::VectorXd::LinSpaced(pattern.size(), -1.0, 2.0), y(pattern.size());
  pattern.multiply(values, x.data(), y.data());
  EXPECT_LT((y - dense * x).cwiseAbs().maxCoeff(), 1e-11 * (dense * x).cwiseAbs().maxCoeff());
}

TEST(Assembler, ElementWithRepeatedNodeSumsIntoTheDiagonal) {
  // Element 4 of the mesh collapsed: its third node replaced by its second (as when nodes are
  // merged onto a master). The dense reference sums every k(a, b) into (q_a, q_b), so repeated
  // equations get k_ij + k_ji on the diagonal.
  Mesh mesh(4, 3);
  mesh.elements[4][2] = mesh.elements[4][1];
  const DofMap dofs(mesh.model);
  const SparsePattern pattern(mesh.elements, dofs);
  const Assembler assembler(pattern, mesh.elements);
  const testing::SyntheticElements synthetic(static_cast<int>(mesh.elements.size()), 5u);
  std::vector<double> values;
  ASSERT_TRUE(assembler.assemble(synthetic.kernel(), &values, nullptr).ok);
  const Eigen::MatrixXd dense = testing::dense_assembly(mesh.elements, dofs, synthetic.k);
  EXPECT_LT((testing::to_dense(pattern, values) - dense).cwiseAbs().maxCoeff(), 1e-12 * dense.cwiseAbs().maxCoeff());
}

TEST(Assembler, OneAndTwoThreadsGiveBitIdenticalResults) {
  const Mesh mesh(12, 9);
  const DofMap dofs(mesh.model);
  const SparsePattern pattern(mesh.elements, dofs);
  const Assembler assembler(pattern, mesh.elements);
  const testing::SyntheticElements synthetic(static_cast<int>(mesh.elements.size()), 3u);
  std::vector<double> v1, v2;
  Eigen::VectorXd f1, f2;
  ASSERT_TRUE(assembler.assemble(synthetic.kernel(), &v1, &f1, {1}).ok);
  ASSERT_TRUE(assembler.assemble(synthetic.kernel(), &v2, &f2, {2}).ok);
  ASSERT_EQ(v1.size(), v2.size());
  EXPECT_EQ(std::memcmp(v1.data(), v2.data(), sizeof(double) * v1.size()), 0);
  EXPECT_EQ(std::memcmp(f1.data(), f2.data(), sizeof(double) * static_cast<std::size_t>(f1.size())), 0);
}

TEST(Assembler, FailedElementStopsAssemblyAndIsNamed) {
  const Mesh mesh(4, 3);
  const DofMap dofs(mesh.model);
  const SparsePattern pattern(mesh.elements, dofs);
  const Assembler assembler(pattern, mesh.elements);
  const ElementKernel failing = [](int e, Mat24* K, Vec24*) {
    if (e == 5) return ElementStatus::NegativeJacobian;
    K->setIdentity();
    return ElementStatus::Ok;
  };
  std::vector<double> values;
  for (int threads : {1, 2}) {
    const AssemblySummary s = assembler.assemble(failing, &values, nullptr, {threads});
    EXPECT_FALSE(s.ok);
    EXPECT_EQ(s.failed_element, 5);
    EXPECT_EQ(s.element_status, ElementStatus::NegativeJacobian);
    EXPECT_EQ(s.message, "element 5 failed: NegativeJacobian");
  }
}

TEST(Assembler, KernelExceptionIsRethrownToTheCaller) {
  const Mesh mesh(4, 3);
  const DofMap dofs(mesh.model);
  const SparsePattern pattern(mesh.elements, dofs);
  const Assembler assembler(pattern, mesh.elements);
  const ElementKernel throwing = [](int e, Mat24* K, Vec24*) {
    if (e == 7) throw std::invalid_argument("bad element 7");
    K->setIdentity();
    return ElementStatus::Ok;
  };
  std::vector<double> values;
  for (int threads : {1, 2}) EXPECT_THROW(assembler.assemble(throwing, &values, nullptr, {threads}), std::invalid_argument);
}

}  // namespace
}  // namespace rotcap
