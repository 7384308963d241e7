// CholmodFactor against Eigen's dense factorisations on assembled synthetic matrices.
#include "solver/cholmod_factor.hpp"

#include "solver/assembler.hpp"
#include "tests/solver/assembly_fixture.hpp"
#include "tests/solver/plate_mesh.hpp"
#include "tests/test_support.hpp"

#include <Eigen/Eigenvalues>

#include <cmath>
#include <omp.h>
#include <limits>

namespace rotcap {
namespace {

using testing::rectangular_plate;
using testing::support;

// A plate (5 x 4 elements: 180 free DOFs) with one clamped edge and synthetic SPD element matrices.
struct System {
  explicit System(int nx = 5, int ny = 4) : model(rectangular_plate(nx, ny, nx, ny, 0.1)) { build(); }
  ShellModel model;
  std::unique_ptr<DofMap> dofs;
  std::unique_ptr<SparsePattern> pattern;
  std::vector<double> values;
  Eigen::MatrixXd dense;
  void build() {
    model.supports.push_back(support("x0", {"ux", "uy", "uz", "rx", "ry", "rz"}));
    dofs = std::make_unique<DofMap>(model);
    const std::vector<ElementNodes> elements = element_nodes(model);
    pattern = std::make_unique<SparsePattern>(elements, *dofs);
    const Assembler assembler(*pattern, elements);
    const testing::SyntheticElements synthetic(model.element_count(), 21u);
    EXPECT_TRUE(assembler.assemble(synthetic.kernel(), &values, nullptr).ok);
    if (pattern->size() <= 2000) dense = testing::to_dense(*pattern, values);
  }
  // Values of A with row and column q zeroed: an exactly zero pivot whatever the ordering.
  std::vector<double> without_equation(int q_zero) const {
    std::vector<double> v = values;
    for (int q = 0; q < pattern->size(); ++q)
      for (int k = pattern->column_starts()[q]; k < pattern->column_starts()[q + 1]; ++k)
        if (q == q_zero || pattern->row_indices()[k] == q_zero) v[k] = 0.0;
    return v;
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
  const std::vector<double> v = s.without_equation(10);
  CholmodFactor ldlt(*s.pattern, CholmodFactor::Method::SimplicialLDLT);
  EXPECT_EQ(ldlt.factorize(v), FactorStatus::ZeroPivot);
  CholmodFactor llt(*s.pattern, CholmodFactor::Method::SupernodalLLT);
  EXPECT_EQ(llt.factorize(v), FactorStatus::NotPositiveDefinite);
}

TEST(CholmodFactor, ReusesSymbolicAnalysisForEveryFactorisation) {
  const System s;
  for (auto method : {CholmodFactor::Method::SupernodalLLT, CholmodFactor::Method::SimplicialLDLT,
                      CholmodFactor::Method::SupernodalLDLT}) {
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

// SupernodalLDLT (our supernodal numeric factorisation on CHOLMOD's analysis) has the contract of
// SimplicialLDLT: exact inertia, accurate indefinite solves, zero pivots reported.
TEST(CholmodFactor, SupernodalLdltInertiaAndSolveMatchDenseEigenvalues) {
  const System s;
  const Eigen::VectorXd eig = Eigen::SelfAdjointEigenSolver<Eigen::MatrixXd>(s.dense).eigenvalues();
  CholmodFactor factor(*s.pattern, CholmodFactor::Method::SupernodalLDLT);
  for (int k : {0, 1, 7, 30}) {
    const double sigma = k == 0 ? 0.0 : 0.5 * (eig[k - 1] + eig[k]);  // exactly k eigenvalues below sigma
    ASSERT_EQ(factor.factorize(s.shifted(sigma)), FactorStatus::Ok) << factor.message();
    EXPECT_EQ(factor.negative_pivots(), k);
    const Eigen::MatrixXd a = s.dense - sigma * Eigen::MatrixXd::Identity(s.pattern->size(), s.pattern->size());
    const Eigen::VectorXd b = Eigen::VectorXd::LinSpaced(s.pattern->size(), -1.0, 1.0);
    Eigen::VectorXd x(b.size());
    factor.solve(b.data(), x.data());
    EXPECT_LT((a * x - b).norm(), 1e-10 * b.norm());
  }
}

TEST(CholmodFactor, SupernodalLdltAgreesWithSimplicialLdltOnLargeSupernodes) {
  // 40 x 32 elements, 7,920 free DOFs: the separators give supernodes of hundreds of columns, so the
  // dense kernels, the extend-add and multi-level updates are all exercised. Both use AMD, so the
  // pivots are the same numbers and so are the inertia and the smallest pivot ratio.
  const System s(40, 32);
  // Shift by 1.5 times the smallest diagonal entry: A - sigma I is then indefinite (its Rayleigh
  // quotient at that unit vector is negative); the count of negative eigenvalues is left to the two
  // factorisations to agree on.
  double sigma = std::numeric_limits<double>::infinity();
  for (int q = 0; q < s.pattern->size(); ++q) sigma = std::min(sigma, s.values[s.pattern->column_starts()[q + 1] - 1]);
  std::vector<double> v = s.shifted(1.5 * sigma);
  CholmodFactor simplicial(*s.pattern, {CholmodFactor::Method::SimplicialLDLT, CholmodFactor::Ordering::Amd});
  CholmodFactor supernodal(*s.pattern, {CholmodFactor::Method::SupernodalLDLT, CholmodFactor::Ordering::Amd});
  ASSERT_EQ(simplicial.factorize(v), FactorStatus::Ok) << simplicial.message();
  ASSERT_EQ(supernodal.factorize(v), FactorStatus::Ok) << supernodal.message();
  EXPECT_GT(simplicial.negative_pivots(), 0);
  EXPECT_EQ(supernodal.negative_pivots(), simplicial.negative_pivots());
  EXPECT_CLOSE(supernodal.min_pivot_ratio(), simplicial.min_pivot_ratio(), 1e-8, 0.0);
  EXPECT_EQ(supernodal.min_pivot_equation(), simplicial.min_pivot_equation());
  const int n = s.pattern->size();
  const Eigen::VectorXd b = Eigen::VectorXd::LinSpaced(n, 1.0, -2.0);
  const Eigen::VectorXd x_ref = simplicial.solve(b);
  const Eigen::VectorXd x = supernodal.solve(b);
  EXPECT_LT((x - x_ref).norm(), 1e-8 * x_ref.norm());
  // Residual with the upper-triangle values: A x = b.
  Eigen::VectorXd ax = Eigen::VectorXd::Zero(n);
  for (int q = 0; q < n; ++q)
    for (int k = s.pattern->column_starts()[q]; k < s.pattern->column_starts()[q + 1]; ++k) {
      const int r = s.pattern->row_indices()[k];
      ax[r] += v[k] * x[q];
      if (r != q) ax[q] += v[k] * x[r];
    }
  EXPECT_LT((ax - b).norm(), 1e-9 * b.norm());
}

TEST(CholmodFactor, SupernodalLdltGivesTheSameBitsOnOneThreadAndOnTwo) {
  // The subtree groups and the top's dense kernels split their work the same way whatever the
  // thread count (supernodal_ldlt.hpp), so the factor, the inertia and a solve are bit-identical.
  const System s(40, 32);
  const std::vector<double> v = s.shifted(0.0);
  const Eigen::VectorXd b = Eigen::VectorXd::LinSpaced(s.pattern->size(), 1.0, -2.0);
  Eigen::VectorXd x[2];
  int negative[2] = {0, 0};
  const int saved = omp_get_max_threads();
  for (int threads : {1, 2}) {
    omp_set_num_threads(threads);
    CholmodFactor f(*s.pattern, {CholmodFactor::Method::SupernodalLDLT, CholmodFactor::Ordering::Amd});
    ASSERT_EQ(f.factorize(v), FactorStatus::Ok) << f.message();
    negative[threads - 1] = f.negative_pivots();
    x[threads - 1] = f.solve(b);
  }
  omp_set_num_threads(saved);
  EXPECT_EQ(negative[0], negative[1]);
  EXPECT_TRUE(x[0] == x[1]) << "largest difference " << (x[0] - x[1]).cwiseAbs().maxCoeff();
}

TEST(CholmodFactor, SupernodalLdltReportsZeroPivot) {
  const System s;
  CholmodFactor ldlt(*s.pattern, CholmodFactor::Method::SupernodalLDLT);
  EXPECT_EQ(ldlt.factorize(s.without_equation(10)), FactorStatus::ZeroPivot);
  EXPECT_NE(ldlt.message().find("zero pivot"), std::string::npos) << ldlt.message();
  EXPECT_THROW(ldlt.solve(Eigen::VectorXd::Ones(s.pattern->size())), std::logic_error);
  ASSERT_EQ(ldlt.factorize(s.values), FactorStatus::Ok);  // and recovers on the next matrix
}

}  // namespace
}  // namespace rotcap
