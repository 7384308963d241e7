#include "solver/linear_system.hpp"

#include <spdlog/spdlog.h>

#include <chrono>
#include <stdexcept>

namespace rotcap {

namespace {
double seconds_since(std::chrono::steady_clock::time_point start) {
  return std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
}
}  // namespace

void LinearSystemOptions::validate() const {
  if (threads < 0)
    throw std::invalid_argument("LinearSystemOptions::threads = " + std::to_string(threads) + "; need >= 0");
  if (!(mechanism_pivot_ratio > 0.0 && mechanism_pivot_ratio < 1.0))
    throw std::invalid_argument("LinearSystemOptions::mechanism_pivot_ratio = " +
                                fmt::format("{:g}", mechanism_pivot_ratio) + "; need 0 < ratio < 1");
}

LinearShellSystem::LinearShellSystem(const ShellModel& model, const SectionAssignment& sections,
                                     const LinearSystemOptions& options)
    : model_(model),
      options_(options),
      ties_((options.validate(), validate_topology(model), model)),
      dofs_(model.node_count(), ties_.held_dofs(model)) {
  const std::vector<ElementNodes> nodes = ties_.effective_nodes(model);
  pattern_ = std::make_unique<SparsePattern>(nodes, dofs_);
  assembler_ = std::make_unique<Assembler>(*pattern_, nodes);
  elements_ = std::make_unique<ShellElementSet>(model, sections, options.element);
  spdlog::debug("LinearShellSystem: {} nodes, {} elements, {} free of {} DOFs, nnz(K upper) = {}, {} colours",
                model.node_count(), model.element_count(), dofs_.free_count(), dofs_.dof_count(),
                pattern_->nonzeros(), assembler_->colour_count());
}

AssemblySummary LinearShellSystem::assemble_stiffness() {
  const Eigen::VectorXd zero = Eigen::VectorXd::Zero(model_.dof_count());
  const AssemblySummary s =
      assembler_->assemble(tied(elements_->internal_force_kernel(zero)), &k_, nullptr, {options_.threads});
  assembly_seconds_ = s.seconds;
  assembled_ = s.ok;
  return s;
}

FactorStatus LinearShellSystem::factorize_stiffness() {
  if (!assembled_) throw std::logic_error("LinearShellSystem::factorize_stiffness: K is not assembled");
  if (!factor_)
    factor_ = std::make_unique<CholmodFactor>(
        *pattern_, CholmodFactor::Options{CholmodFactor::Method::SupernodalLLT, options_.ordering});
  return factor_->factorize(k_);
}

CholmodFactor& LinearShellSystem::stiffness_factor() {
  if (!factor_) throw std::logic_error("LinearShellSystem::stiffness_factor: K has not been factorised");
  return *factor_;
}

Eigen::VectorXd LinearShellSystem::solve(const Eigen::VectorXd& f_full) {
  if (!factor_ || factor_->status() != FactorStatus::Ok)
    throw std::logic_error("LinearShellSystem::solve: K is not factorised");
  const auto start = std::chrono::steady_clock::now();
  Eigen::VectorXd u = dofs_.scatter(factor_->solve(dofs_.gather(f_full)));
  ties_.complete_linear(model_.nodes, u);
  solve_seconds_ = seconds_since(start);
  return u;
}

LinearShellSystem::Recovery LinearShellSystem::recover(const Eigen::VectorXd& u_full) const {
  Recovery r;
  r.resultants.resize(static_cast<std::size_t>(elements_->size()));
  r.summary = assembler_->assemble(tied(elements_->internal_force_kernel(u_full, &r.resultants)), nullptr,
                                   &r.internal_forces, {options_.threads});
  return r;
}

AssemblySummary LinearShellSystem::assemble_matrix(const ElementKernel& kernel, std::vector<double>& values) const {
  return assembler_->assemble(tied(kernel), &values, nullptr, {options_.threads});
}

Eigen::VectorXd LinearShellSystem::full_vector(const Eigen::VectorXd& x_free) const {
  Eigen::VectorXd u = dofs_.scatter_homogeneous(x_free);
  ties_.complete_linear(model_.nodes, u);
  return u;
}

ElementKernel LinearShellSystem::tied(ElementKernel kernel) const {
  if (ties_.tied_elements().empty()) return kernel;
  return [this, kernel = std::move(kernel)](int e, Mat24* K, Vec24* f) {
    Vec24 local_f;
    const ElementStatus status = kernel(e, K, f ? f : &local_f);
    if (status != ElementStatus::Ok) return status;
    const auto& nodes = model_.elements[e].nodes;
    Eigen::Matrix<double, 3, 4> X;
    for (int a = 0; a < 4; ++a) X.col(a) = model_.nodes[nodes[a]];
    ties_.to_masters(e, nodes, X, [this](int m) { return model_.nodes[m]; }, K, f ? *f : local_f);
    return status;
  };
}

}  // namespace rotcap
