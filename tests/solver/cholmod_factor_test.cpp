// CholmodFactor against Eigen's dense factorisations on assembled synthetic matrices.
#include "solver/cholmod_factor.hpp"

#include "solver/assembler.hpp"
#include "tests/solver/assembly_fixture.hpp"
#include "tests/solver/plate_mesh.hpp"
#include "tests/test_support.hpp"

#include <Eigen/Eigenvalues>

#include <cmath>

namespace rotcap {
namespace {

using testing::rectangular_plate;
using testing::support;

// A 5 x 4 plate (180 free DOFs) with one clamped edge and synthetic SPD element matrices.
struct System {
  ShellModel model = rectangular_plate(5.0, 4.0, 5, 4, 0.1);
  std::unique_ptr<DofMap> dofs;
  std::unique_ptr<SparsePattern> pattern;
  std::vector<double> values;
  Eigen::MatrixXd dense;
  System() {
    model.supports.push_back(support("x0", {"ux", "uy", "uz", "rx", "ry", "rz"}));
    dofs = std::make_unique<DofMap>(model);
    const std::vector<ElementNodes> elements = element_nodes(model);
    pattern = std::make_unique<SparsePattern>(elements, *dofs);
    const Assembler assembler(*pattern, elements);
    const testing::SyntheticElements synthetic(model.element_count(), 21u);
    EXPECT_TRUE(assembler.assemble(synthetic.kernel(), &values, nullptr).ok);
    dense = testing::to_dense(*pattern, values);
  }
  // Values of A - sigma I on the pattern (the diagonal is always stored).
  std::vector<double> shifted(double sigma) const {
    std::vector<double> v = values;
    for (int q = 0; q < pattern->size(); ++q) v[pattern->column_starts()[q + 1] - 1] -= sigma;
    return v;
  }
};

TEST(CholmodFactor, SupernodalSolveMatchesDenseSolve) {
  const System s;
  CholmodFactor factor(*s.pattern, CholmodFactor::Method::SupernodalLLT);
  ASSERT_EQ(factor.factorize(s.values), FactorStatus::Ok) << factor.message();
  EXPECT_EQ(factor.negative_pivots(), 0);
  EXPECT_GE(factor.factor_nonzeros(), static_cast<double>(s.pattern->nonzeros()));
  const Eigen::VectorXd b = Eigen::VectorXd::LinSpaced(s.pattern->size(), 1.0, -3.0);
  const Eigen::VectorXd x_ref = s.dense.llt().solve(b);
  const Eigen::VectorXd x = factor.solve(b);
  EXPECT_LT((x - x_ref).norm(), 1e-12 * x_ref.norm());
}

TEST(CholmodFactor, SimplicialLdltSolveMatchesDenseSolve) {
  const System s;
  CholmodFactor factor(*s.pattern, CholmodFactor::Method::SimplicialLDLT);
  ASSERT_EQ(factor.factorize(s.values), FactorStatus::Ok) << factor.message();
  EXPECT_EQ(factor.negative_pivots(), 0);
  const Eigen::VectorXd b = Eigen::VectorXd::LinSpaced(s.pattern->size(), 2.0, 1.0);
  const Eigen::VectorXd x_ref = s.dense.llt().solve(b);
  EXPECT_LT((factor.solve(b) - x_ref).norm(), 1e-12 * x_ref.norm());
}

TEST(CholmodFactor, ReportsNotPositiveDefiniteOnIndefiniteMatrix) {
  const System s;
  const Eigen::VectorXd eig = Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd>(s.dense).eigenvalues();
  const double sigma = 0.5 * (eig[3] + eig[4]);  // A - sigma I has exactly 4 negative eigenvalues
  CholmodFactor factor(*s.pattern, CholmodFactor::Method::SupernodalLLT);
  EXPECT_EQ(factor.factorize(s.shifted(sigma)), FactorStatus::NotPositiveDefinite);
  EXPECT_EQ(factor.negative_pivots(), -1);
  EXPECT_NE(factor.message().find("not positive definite"), std::string::npos) << factor.message();
  EXPECT_THROW(factor.solve(Eigen::VectorXd::Ones(s.pattern->size())), std::logic_error);
  // The same object refactorises a positive-definite matrix afterwards.
  ASSERT_EQ(factor.factorize(s.values), FactorStatus::Ok) << factor.message();
  const Eigen::VectorXd b = Eigen::VectorXd::Ones(s.pattern->size());
  EXPECT_LT((factor.solve(b) - s.dense.llt().solve(b)).norm(), 1e-12 * s.dense.llt().solve(b).norm());
}

TEST(CholmodFactor, LdltInertiaEqualsNegativeEigenvalueCount) {
  const System s;
  const Eigen::VectorXd eig = Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd>(s.dense).eigenvalues();
  CholmodFactor factor(*s.pattern, CholmodFactor::Method::SimplicialLDLT);
  for (int k : {1, 7, 30}) {
    const double sigma = 0.5 * (eig[k - 1] + eig[k]);  // exactly k eigenvalues below sigma
    ASSERT_EQ(factor.factorize(s.shifted(sigma)), FactorStatus::Ok) << factor.message();
    EXPECT_EQ(factor.negative_pivots(), k);
    // The indefinite solve is still accurate (well away from singular).
    const Eigen::MatrixXd a = s.dense - sigma * Eigen::MatrixXd::Identity(s.pattern->size(), s.pattern->size());
    const Eigen::VectorXd b = Eigen::VectorXd::LinSpaced(s.pattern->size(), -1.0, 1.0);
    const Eigen::VectorXd x = factor.solve(b);
    EXPECT_LT((a * x - b).norm(), 1e-10 * b.norm());
  }
}

TEST(CholmodFactor, ReportsZeroPivotOfSingularMatrix) {
  const System s;
  // Zero row and column 10: an exactly zero pivot whatever the ordering.
  std::vector<double> v = s.values;
  for (int q = 0; q < s.pattern->size(); ++q)
    for (int k = s.pattern->column_starts()[q]; k < s.pattern->column_starts()[q + 1]; ++k)
      if (q == 10 || s.pattern->row_indices()[k] == 10) v[k] = 0.0;
  CholmodFactor ldlt(*s.pattern, CholmodFactor::Method::SimplicialLDLT);
  EXPECT_EQ(ldlt.factorize(v), FactorStatus::ZeroPivot);
  CholmodFactor llt(*s.pattern, CholmodFactor::Method::SupernodalLLT);
  EXPECT_EQ(llt.factorize(v), FactorStatus::NotPositiveDefinite);
}

TEST(CholmodFactor, ReusesSymbolicAnalysisForEveryFactorisation) {
  const System s;
  for (auto method : {CholmodFactor::Method::SupernodalLLT, CholmodFactor::Method::SimplicialLDLT}) {
    CholmodFactor factor(*s.pattern, method);
    EXPECT_EQ(factor.analysis_count(), 1);
    EXPECT_EQ(factor.factorization_count(), 0);
    for (double sigma : {0.0, 1.0, 2.0}) ASSERT_EQ(factor.factorize(s.shifted(sigma)), FactorStatus::Ok);
    EXPECT_EQ(factor.analysis_count(), 1);
    EXPECT_EQ(factor.factorization_count(), 3);
    // The last factor is of A - 2 I.
    const Eigen::VectorXd b = Eigen::VectorXd::Ones(s.pattern->size());
    const Eigen::MatrixXd a = s.dense - 2.0 * Eigen::MatrixXd::Identity(s.pattern->size(), s.pattern->size());
    EXPECT_LT((a * factor.solve(b) - b).norm(), 1e-12 * b.norm());
  }
}

TEST(CholmodFactor, MinPivotRatioAgreesBetweenSupernodalAndSimplicialLayouts) {
  // The pivots are read from two different factor layouts (dense supernode blocks, simplicial
  // columns); with the same AMD ordering they are the same numbers. For a positive-definite
  // matrix every Schur-complement pivot satisfies 0 < d_j <= a_jj, so the ratio lies in (0, 1].
  const System s;
  CholmodFactor llt(*s.pattern, {CholmodFactor::Method::SupernodalLLT, CholmodFactor::Ordering::Amd});
  CholmodFactor ldlt(*s.pattern, {CholmodFactor::Method::SimplicialLDLT, CholmodFactor::Ordering::Amd});
  EXPECT_TRUE(std::isnan(llt.min_pivot_ratio()));
  ASSERT_EQ(llt.factorize(s.values), FactorStatus::Ok);
  ASSERT_EQ(ldlt.factorize(s.values), FactorStatus::Ok);
  EXPECT_GT(llt.min_pivot_ratio(), 0.0);
  EXPECT_LE(llt.min_pivot_ratio(), 1.0);
  EXPECT_CLOSE(llt.min_pivot_ratio(), ldlt.min_pivot_ratio(), 1e-12, 0.0);
  EXPECT_EQ(llt.min_pivot_equation(), ldlt.min_pivot_equation());
}

TEST(CholmodFactor, OrderingsGiveTheSameSolution) {
  const System s;
  const Eigen::VectorXd b = Eigen::VectorXd::LinSpaced(s.pattern->size(), 1.0, 2.0);
  const Eigen::VectorXd x_ref = s.dense.llt().solve(b);
  for (auto ordering : {CholmodFactor::Ordering::Automatic, CholmodFactor::Ordering::Amd,
                        CholmodFactor::Ordering::NestedDissection}) {
    CholmodFactor factor(*s.pattern, {CholmodFactor::Method::SupernodalLLT, ordering});
    ASSERT_EQ(factor.factorize(s.values), FactorStatus::Ok);
    EXPECT_LT((factor.solve(b) - x_ref).norm(), 1e-12 * x_ref.norm());
  }
}

}  // namespace
}  // namespace rotcap
