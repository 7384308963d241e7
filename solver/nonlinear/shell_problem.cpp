#include "solver/nonlinear/shell_problem.hpp"

#include "elements/corotational/rotation.hpp"

#include <omp.h>

#include <chrono>
#include <stdexcept>

namespace rotcap {

namespace {
double seconds_since(std::chrono::steady_clock::time_point t0) {
  return std::chrono::duration<double>(std::chrono::steady_clock::now() - t0).count();
}
}  // namespace

ShellProblem::ShellProblem(const ShellModel& model, const SectionAssignment& sections,
                           const ShellProblemOptions& options)
    : model_(model),
      sections_(sections),
      options_(options),
      ties_((validate_topology(model), model)),
      dofs_(model.node_count(), ties_.held_dofs(model)) {
  sections_.check(model_);
  element_nodes_ = ties_.effective_nodes(model_);
  pattern_ = std::make_unique<SparsePattern>(element_nodes_, dofs_);
  assembler_ = std::make_unique<Assembler>(*pattern_, element_nodes_);
  elements_.reserve(model_.elements.size());
  history_offset_.assign(model_.elements.size() + 1, 0);
  for (int e = 0; e < model_.element_count(); ++e) {
    NodalCoordinates X;
    for (int a = 0; a < 4; ++a) X.col(a) = model_.nodes[model_.elements[e].nodes[a]];
    try {
      elements_.emplace_back(X, options_.element);
    } catch (const std::invalid_argument& err) {
      throw std::invalid_argument("element " + std::to_string(e) + ": " + err.what());
    }
    history_offset_[e + 1] = history_offset_[e] + ShellQ4::kGaussPoints * sections_.of(e).layers();
  }
  history_committed_.assign(history_offset_.back(), LayerState{});
  history_trial_ = history_committed_;
  history_previous_ = history_committed_;
  alpha_committed_.assign(model_.elements.size(), Eigen::Vector4d::Zero());
  alpha_trial_ = alpha_committed_;
  alpha_previous_ = alpha_committed_;
  const int n = model_.node_count();
  u_.assign(n, Eigen::Vector3d::Zero());
  u_committed_ = u_;
  R_.assign(n, Eigen::Matrix3d::Identity());
  R_committed_ = R_;
  u_factored_ = u_;
  R_factored_ = R_;
  f_ref_ = dofs_.gather(reference_load_vector(model_));
  f_fixed_ = Eigen::VectorXd::Zero(dofs_.free_count());
  find_moment_nodes();
  weights_ = Eigen::VectorXd::Zero(dofs_.free_count());
  for (int q = 0; q < dofs_.free_count(); ++q) weights_[q] = (dofs_.dof_of_equation(q) % kDofsPerNode) < 3 ? 1.0 : 0.0;
  f_full_ = Eigen::VectorXd::Zero(model_.dof_count());
  // Two threads: every tangent goes to the supernodal LDL^T, which shares its work between them
  // (solver/supernodal_ldlt.hpp); one thread: LL^T while the tangent is positive definite.
  const int threads = options_.threads > 0 ? options_.threads : omp_get_max_threads();
  if (threads >= 2) ldlt_ = make_ldlt();
  else llt_ = std::make_unique<CholmodFactor>(*pattern_, CholmodFactor::Method::SupernodalLLT);
}

std::unique_ptr<CholmodFactor> ShellProblem::make_ldlt() const {
  return std::make_unique<CholmodFactor>(
      *pattern_, CholmodFactor::Options{CholmodFactor::Method::SupernodalLDLT, CholmodFactor::Ordering::Automatic,
                                        options_.threads});
}

ShellProblem::~ShellProblem() = default;

void ShellProblem::set_reference_load(const Eigen::VectorXd& full) {
  f_ref_ = dofs_.gather(full);
  find_moment_nodes();
}
void ShellProblem::set_fixed_load(const Eigen::VectorXd& full) {
  f_fixed_ = dofs_.gather(full);
  find_moment_nodes();
}

void ShellProblem::find_moment_nodes() {
  moment_nodes_.clear();
  skew_equations_.clear();
  if (options_.element.kinematics != CorotationalShellQ4::Kinematics::Corotational) return;
  for (int node = 0; node < model_.node_count(); ++node) {
    bool loaded = false;
    std::vector<int> eqs;
    for (int k = 0; k < 3; ++k) {
      const int q = dofs_.equation(node, static_cast<Dof>(3 + k));
      if (q < 0) continue;
      eqs.push_back(q);
      if (f_ref_[q] != 0.0 || f_fixed_[q] != 0.0) loaded = true;
    }
    if (loaded) {
      moment_nodes_.push_back(node);
      skew_equations_.insert(skew_equations_.end(), eqs.begin(), eqs.end());
    }
  }
}

void ShellProblem::prepare_skew_correction() {
  skew_active_ = false;
  const int k = static_cast<int>(skew_equations_.size());
  if (k == 0) return;
  // S = E^T K_skew E: -1/2 skew(m) of each moment node, on its free rotation equations.
  skew_S_ = Eigen::MatrixXd::Zero(k, k);
  int offset = 0;
  for (int node : moment_nodes_) {
    const Eigen::Vector3d m = f_full_.segment<3>(kDofsPerNode * node + 3);
    Eigen::Matrix3d w;
    w << 0.0, -m.z(), m.y(), m.z(), 0.0, -m.x(), -m.y(), m.x(), 0.0;
    std::vector<int> local;
    for (int c = 0; c < 3; ++c)
      if (dofs_.equation(node, static_cast<Dof>(3 + c)) >= 0) local.push_back(c);
    for (std::size_t a = 0; a < local.size(); ++a)
      for (std::size_t b = 0; b < local.size(); ++b) skew_S_(offset + a, offset + b) = -0.5 * w(local[a], local[b]);
    offset += static_cast<int>(local.size());
  }
  skew_Z_.resize(size(), k);
  Eigen::VectorXd e = Eigen::VectorXd::Zero(size()), z(size());
  for (int c = 0; c < k; ++c) {
    e.setZero();
    e[skew_equations_[c]] = 1.0;
    active_->solve(e.data(), z.data());
    skew_Z_.col(c) = z;
  }
  Eigen::MatrixXd ez(k, k);
  for (int r = 0; r < k; ++r) ez.row(r) = skew_Z_.row(skew_equations_[r]);
  skew_lu_.compute(Eigen::MatrixXd::Identity(k, k) + skew_S_ * ez);
  skew_active_ = true;
}

void ShellProblem::set_initial_stress(
    const std::function<Eigen::Vector3d(int element, int gauss_point, int layer)>& stress) {
  for (int e = 0; e < model_.element_count(); ++e) {
    const int layers = sections_.of(e).layers();
    for (int gp = 0; gp < ShellQ4::kGaussPoints; ++gp)
      for (int k = 0; k < layers; ++k) {
        const std::size_t i = history_offset_[e] + static_cast<std::size_t>(gp * layers + k);
        history_committed_[i].initial_stress = stress(e, gp, k);
        history_trial_[i].initial_stress = history_committed_[i].initial_stress;
        history_previous_[i].initial_stress = history_committed_[i].initial_stress;
      }
  }
}

void ShellProblem::gather(int e, NodalCoordinates& x, NodalRotations& R) const {
  const auto& nodes = model_.elements[e].nodes;
  for (int a = 0; a < 4; ++a) {
    x.col(a) = model_.nodes[nodes[a]] + u_[nodes[a]];
    R[a] = R_[nodes[a]];
  }
}

ElementKernel ShellProblem::kernel(std::vector<ShellQ4Resultants>* out) const {
  return [this, out](int e, Mat24* K, Vec24* f) {
    NodalCoordinates x;
    NodalRotations R;
    gather(e, x, R);
    const std::size_t begin = history_offset_[e];
    const std::size_t count = history_offset_[e + 1] - begin;
    Vec24 fe;
    const ElementStatus status = elements_[e].compute(
        x, R, sections_.of(e), std::span<const LayerState>(history_committed_.data() + begin, count),
        std::span<LayerState>(history_trial_.data() + begin, count), fe, K,
        out ? &(*out)[e] : nullptr, &alpha_committed_[e], &alpha_trial_[e]);
    if (status == ElementStatus::Ok)
      ties_.to_masters(e, model_.elements[e].nodes, x, [this](int m) { return Eigen::Vector3d(model_.nodes[m] + u_[m]); },
                       K, fe);
    if (f) *f = fe;
    return status;
  };
}

EvaluationStatus ShellProblem::evaluate(Eigen::VectorXd& internal_force, bool factorise_tangent) {
  const EvaluationStatus s = assemble(internal_force, factorise_tangent);
  return s == EvaluationStatus::Ok && factorise_tangent ? factorise_assembled() : s;
}

EvaluationStatus ShellProblem::evaluate_deferred(Eigen::VectorXd& internal_force) {
  return assemble(internal_force, true);
}

EvaluationStatus ShellProblem::assemble(Eigen::VectorXd& internal_force, bool with_tangent) {
  assembled_unfactorised_ = false;
  const auto t0 = std::chrono::steady_clock::now();
  const AssemblySummary a =
      assembler_->assemble(kernel(nullptr), with_tangent ? &values_ : nullptr, &f_full_, {options_.threads});
  if (!a.ok) {
    message_ = a.message;
    return EvaluationStatus::ElementFailed;
  }
  assembly_seconds_ += seconds_since(t0);
  internal_force = dofs_.gather(f_full_);
  if (!internal_force.allFinite()) {
    message_ = "internal force is not finite";
    return EvaluationStatus::NotFinite;
  }
  assembled_unfactorised_ = with_tangent;
  return EvaluationStatus::Ok;
}

EvaluationStatus ShellProblem::factorise_assembled() {
  if (!assembled_unfactorised_) throw std::logic_error("ShellProblem::factorise_assembled without an assembled tangent");
  assembled_unfactorised_ = false;
  return factorise_values();
}

EvaluationStatus ShellProblem::factorise_values() {
  const auto t1 = std::chrono::steady_clock::now();
  indefinite_before_last_ = indefinite_;
  FactorStatus s = FactorStatus::NotPositiveDefinite;
  if (!indefinite_ && llt_) {
    s = llt_->factorize(values_);
    ++factorisations_;
    active_ = llt_.get();
    negative_pivots_ = 0;
  }
  if (s == FactorStatus::NotPositiveDefinite) {
    if (!ldlt_) ldlt_ = make_ldlt();
    const auto t2 = std::chrono::steady_clock::now();
    s = ldlt_->factorize(values_);
    indefinite_seconds_ += seconds_since(t2);
    ++factorisations_;
    ++indefinite_factorisations_;
    active_ = ldlt_.get();
    negative_pivots_ = ldlt_->negative_pivots();
    indefinite_ = s == FactorStatus::Ok && negative_pivots_ > 0;
  }
  if (s != FactorStatus::Ok) {
    factor_seconds_ += seconds_since(t1);
    message_ = std::string("factorisation failed: ") + active_->message();
    return EvaluationStatus::FactorisationFailed;
  }
  prepare_skew_correction();
  u_factored_ = u_;
  R_factored_ = R_;
  factor_seconds_ += seconds_since(t1);
  return EvaluationStatus::Ok;
}

void ShellProblem::solve(const Eigen::VectorXd& rhs, Eigen::VectorXd& x) {
  if (!active_) throw std::logic_error("ShellProblem::solve before a factorisation");
  x.resize(rhs.size());
  active_->solve(rhs.data(), x.data());
  if (!skew_active_) return;
  const int k = static_cast<int>(skew_equations_.size());
  Eigen::VectorXd ey(k);
  for (int r = 0; r < k; ++r) ey[r] = x[skew_equations_[r]];
  x -= skew_Z_ * skew_lu_.solve(skew_S_ * ey);
}

void ShellProblem::update(const Eigen::VectorXd& du) {
  for (int q = 0; q < dofs_.free_count(); ++q) {
    const int i = dofs_.dof_of_equation(q);
    if (i % kDofsPerNode < 3) u_[i / kDofsPerNode][i % kDofsPerNode] += du[q];
  }
  // Rotations: compose the incremental spatial rotation of each node (all three components at once).
  for (int node = 0; node < model_.node_count(); ++node) {
    Eigen::Vector3d w = Eigen::Vector3d::Zero();
    bool any = false;
    for (int k = 0; k < 3; ++k) {
      const int q = dofs_.equation(node, static_cast<Dof>(3 + k));
      if (q >= 0) {
        w[k] = du[q];
        any = true;
      }
    }
    if (any) R_[node] = rotation_exp(w) * R_[node];
  }
  ties_.place_slaves(model_.nodes, u_, R_);
}

void ShellProblem::commit() {
  u_committed_ = u_;
  R_committed_ = R_;
  std::swap(history_previous_, history_committed_);
  history_committed_ = history_trial_;
  std::swap(alpha_previous_, alpha_committed_);
  alpha_committed_ = alpha_trial_;
}

void ShellProblem::revert() {
  u_ = u_committed_;
  R_ = R_committed_;
  history_trial_ = history_committed_;
  alpha_trial_ = alpha_committed_;
}

Eigen::VectorXd ShellProblem::displacements() const {
  Eigen::VectorXd d(model_.dof_count());
  for (int node = 0; node < model_.node_count(); ++node) {
    d.segment<3>(kDofsPerNode * node) = u_committed_[node];
    d.segment<3>(kDofsPerNode * node + 3) = rotation_log(R_committed_[node]);
  }
  return d;
}

double ShellProblem::max_plastic_strain() const {
  double m = 0.0;
  for (const LayerState& s : history_committed_) m = std::max(m, s.equivalent_plastic_strain);
  return m;
}

std::vector<ElementSnapshot> ShellProblem::snapshot() const {
  std::vector<ElementSnapshot> out(elements_.size());
  std::vector<LayerState> scratch(history_committed_.size());
  for (int e = 0; e < model_.element_count(); ++e) {
    NodalCoordinates x;
    NodalRotations R;
    const auto& nodes = model_.elements[e].nodes;
    for (int a = 0; a < 4; ++a) {
      x.col(a) = model_.nodes[nodes[a]] + u_committed_[nodes[a]];
      R[a] = R_committed_[nodes[a]];
    }
    const std::size_t begin = history_offset_[e];
    const std::size_t count = history_offset_[e + 1] - begin;
    const std::span<const LayerState> committed(history_committed_.data() + begin, count);
    const std::span<LayerState> trial(scratch.data() + begin, count);
    Vec24 f;
    Eigen::Vector4d alpha;
    elements_[e].compute(x, R, sections_.of(e), committed, trial, f, nullptr, &out[e].resultants,
                         &alpha_committed_[e], &alpha);
    out[e].frame = elements_[e].current_frame(x);
    const int layers = sections_.of(e).layers();
    for (int gp = 0; gp < ShellQ4::kGaussPoints; ++gp)
      out[e].surfaces[gp] = sections_.of(e).surfaces(
          out[e].resultants.g[gp], std::span<const LayerState>(scratch.data() + begin + gp * layers, layers));
  }
  return out;
}

const CholmodFactor& ShellProblem::factor() const {
  if (!active_) throw std::logic_error("ShellProblem::factor before a factorisation");
  return *active_;
}

}  // namespace rotcap
