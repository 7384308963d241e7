#pragma once
// ShellProblem: a ShellModel as an EquilibriumProblem for the path-following drivers, with the
// corotational four-node shell (CorotationalShellQ4), any ShellSection (elastic or layered plastic),
// the pattern and element colouring built once, and CHOLMOD factorisations reusing their analyses.
//
// Rigid sections (ShellModel::rigid_ties) are imposed by elimination (rigid_ties.hpp).
// State: nodal translations u_i (additive) and rotation matrices R_i (multiplicative update
// R_i <- exp(skew(dw_i)) R_i, never adding angles), plus the section history of every element.
// The committed state is the last converged step; evaluate() works on the trial state and writes
// trial history from the committed one (return mapping from the last converged state).
//
// Tangent: the consistent corotational tangent K = K_sym + K_skew. Its skew part is block-diagonal,
// -1/2 skew(m_i) on the rotations of node i, m_i the node's assembled internal moment (measured,
// and checked by a finite-difference test of the element). K_sym is assembled and factorised; at
// equilibrium m_i vanishes except where external moments act, so K_skew is kept only at nodes whose
// free rotations carry an applied moment, through the Woodbury identity on the K_sym factor:
//   (K + E S E^T)^-1 b = y - Z (I + S E^T Z)^-1 S E^T y,  y = K^-1 b, Z = K^-1 E.
// Without it Newton converges only linearly there (Felippa & Haugen 2005 note that the skew part
// vanishes at equilibrium only under conservative loads without such moments).
// Factorisation: with two or more threads (ShellProblemOptions::threads, 0: the OpenMP default) the
// supernodal LDL^T of supernodal_ldlt.hpp for every tangent (inertia: negative_pivots()); it shares
// its work between two threads and was faster there than CHOLMOD's LL^T, which runs on one. With one
// thread: supernodal LL^T while the tangent is positive definite; on NotPositiveDefinite the
// LDL^T, kept while the tangent stays indefinite and retried as LL^T once it had no negative pivot.

#include "elements/corotational/corotational_shell_q4.hpp"
#include "model/shell_model.hpp"
#include "solver/assembler.hpp"
#include "solver/cholmod_factor.hpp"
#include "solver/dof_map.hpp"
#include "solver/path/equilibrium_problem.hpp"
#include "solver/rigid_ties.hpp"
#include "solver/section_assignment.hpp"
#include "solver/sparse_pattern.hpp"

#include <Eigen/Dense>
#include <functional>
#include <memory>
#include <string>
#include <vector>

namespace rotcap {

struct ShellProblemOptions {
  CorotationalShellQ4::Options element;   ///< kinematics (corotational or linear) and core options
  int threads = 0;                         ///< assembly threads (0: OpenMP default)
};

/// The committed state of a ShellProblem in plain arrays: enough to continue a path bit for bit
/// (checkpoints, see ShellProblem::restore). History entries hold 8 numbers per layer point, in the
/// order of LayerState: plastic strain (3), equivalent plastic strain, initial stress (3) [MPa],
/// dissipation [N mm / mm^3].
struct ShellProblemState {
  std::vector<double> translations;      ///< u, 3 per node [mm]
  std::vector<double> rotations;         ///< R, 9 per node (column-major)
  std::vector<double> history;           ///< of the committed state
  std::vector<double> history_previous;  ///< of the state committed before it
  std::vector<double> modes;             ///< incompatible-mode amplitudes, 4 per element
  std::vector<double> modes_previous;
  /// The configuration of the last factorised tangent (the path follower's predictor tangent): u and
  /// R as above. Its history was history_previous: the tangent is that of the committed step's
  /// increment at the corrector iterate before the converged one.
  std::vector<double> factored_translations, factored_rotations;
  bool indefinite_before_last_evaluation = false;  ///< picks LL^T or LDL^T as the last evaluation did
  bool indefinite = false;                         ///< picks LL^T or LDL^T for the next evaluation
  /// factorisations, indefinite factorisations, factorisation s, assembly s, indefinite factorisation s
  std::vector<double> statistics;
};

/// Per-element output at the trial (= committed after commit()) state.
struct ElementSnapshot {
  ShellFrame frame;                        ///< current element frame
  ShellQ4Resultants resultants;            ///< local frame
  std::array<SurfaceStresses, 4> surfaces; ///< per Gauss point
};

class ShellProblem final : public EquilibriumProblem {
 public:
  /// model and sections must outlive the problem. f_ref is the model's reference load; the fixed
  /// load starts at zero (set_fixed_load).
  ShellProblem(const ShellModel& model, const SectionAssignment& sections,
               const ShellProblemOptions& options = {});
  ~ShellProblem() override;

  int size() const override { return dofs_.free_count(); }
  const Eigen::VectorXd& reference_load() const override { return f_ref_; }
  const Eigen::VectorXd& fixed_load() const override { return f_fixed_; }
  const Eigen::VectorXd& arc_length_weights() const override { return weights_; }
  EvaluationStatus evaluate(Eigen::VectorXd& internal_force, bool factorise_tangent) override;
  EvaluationStatus evaluate_deferred(Eigen::VectorXd& internal_force) override;
  EvaluationStatus factorise_assembled() override;
  void solve(const Eigen::VectorXd& rhs, Eigen::VectorXd& x) override;
  int negative_pivots() const override { return negative_pivots_; }
  void update(const Eigen::VectorXd& du) override;
  void commit() override;
  void revert() override;
  std::string last_message() const override { return message_; }

  /// Full-size (6 per node) load vectors replace the reference / fixed load (free entries used).
  void set_reference_load(const Eigen::VectorXd& full);
  void set_fixed_load(const Eigen::VectorXd& full);

  /// Sets LayerState::initial_stress [MPa, local element axes] of every layer point of the committed
  /// and trial history from stress(element, gauss_point, layer) (residual stresses). Elements with a
  /// stateless section are skipped. Call before the analysis, then equilibrate (see equilibrate.hpp).
  void set_initial_stress(const std::function<Eigen::Vector3d(int element, int gauss_point, int layer)>& stress);

  /// The committed state (after commit(); see ShellProblemState).
  ShellProblemState state() const;
  /// Makes `state` the committed state of this problem (same model and sections) and factorises the
  /// tangent the path follower had factorised there: the evaluation at the state's factored
  /// configuration from the previous history; then evaluates the residual at the state's
  /// configuration from the previous history, whose history must equal the stored one bit for bit; otherwise (another build, thread count or BLAS) it returns the largest
  /// relative difference found, and the problem holds the stored state with the re-evaluated
  /// tangent. Returns 0 on an exact reproduction. Throws std::invalid_argument on sizes that do not
  /// fit the model, std::runtime_error when the evaluation fails.
  /// reevaluate = false: only the committed state is set (no tangent), for a state taken before
  /// any path step (the path follower then factorises at the committed state itself); returns 0.
  double restore(const ShellProblemState& state, bool reevaluate = true);

  const DofMap& dofs() const { return dofs_; }
  /// Committed nodal displacements, full vector: translations, and rotations as rotation vectors
  /// log(R_i) (for output; the state itself keeps the matrices).
  Eigen::VectorXd displacements() const;
  /// Committed internal forces at every DOF (reactions at held DOFs), full vector; valid after an
  /// evaluate() at the committed state.
  const Eigen::VectorXd& full_internal_force() const { return f_full_; }
  /// Largest equivalent plastic strain over all committed layer points.
  double max_plastic_strain() const;
  /// Snapshot of every element at the committed state (evaluates the elements once).
  std::vector<ElementSnapshot> snapshot() const;
  const CholmodFactor& factor() const;
  /// The last assembled tangent (K_sym, upper triangle in pattern() order) and its pattern, read
  /// only (benchmarks time bare factorisations of it).
  const std::vector<double>& tangent_values() const { return values_; }
  const SparsePattern& pattern() const { return *pattern_; }
  /// Numeric factorisations and their total wall time, for the solver statistics.
  int factorisations() const { return factorisations_; }
  double factorisation_seconds() const { return factor_seconds_; }
  /// Of those, the LDL^T factorisations (after a failed LL^T or while the tangent is indefinite).
  int indefinite_factorisations() const { return indefinite_factorisations_; }
  double indefinite_factorisation_seconds() const { return indefinite_seconds_; }
  double assembly_seconds() const { return assembly_seconds_; }

 private:
  ElementKernel kernel(std::vector<ShellQ4Resultants>* out) const;
  void gather(int e, NodalCoordinates& x, NodalRotations& R) const;

  const ShellModel& model_;
  const SectionAssignment& sections_;
  ShellProblemOptions options_;
  RigidTieSet ties_;
  DofMap dofs_;
  std::vector<ElementNodes> element_nodes_;
  std::unique_ptr<SparsePattern> pattern_;
  std::unique_ptr<Assembler> assembler_;
  std::vector<CorotationalShellQ4> elements_;
  std::unique_ptr<CholmodFactor> llt_, ldlt_;  // llt_ only on one thread (see the constructor)
  std::unique_ptr<CholmodFactor> make_ldlt() const;
  CholmodFactor* active_ = nullptr;
  bool indefinite_ = false;
  bool indefinite_before_last_ = false;  // indefinite_ when the last factorisation began
  bool assembled_unfactorised_ = false;  // evaluate_deferred() left values_ for factorise_assembled()
  // Assembles f_int (and the tangent into values_), trial history from the committed one.
  EvaluationStatus assemble(Eigen::VectorXd& internal_force, bool with_tangent);
  EvaluationStatus factorise_values();   // factorises values_ (LL^T or LDL^T), sets the factored configuration
  int negative_pivots_ = 0;
  std::string message_;
  // State: trial and committed.
  std::vector<Eigen::Vector3d> u_, u_committed_;
  std::vector<Eigen::Matrix3d> R_, R_committed_;
  std::vector<Eigen::Vector3d> u_factored_;  // the configuration of the last factorised tangent
  std::vector<Eigen::Matrix3d> R_factored_;
  std::vector<std::size_t> history_offset_;
  std::vector<LayerState> history_committed_, history_previous_;
  mutable std::vector<LayerState> history_trial_;
  std::vector<Eigen::Vector4d> alpha_committed_, alpha_previous_;  // incompatible-mode amplitudes per element
  mutable std::vector<Eigen::Vector4d> alpha_trial_;
  Eigen::VectorXd f_ref_, f_fixed_, weights_, f_full_;
  // Skew part of the tangent at moment-loaded nodes (Woodbury correction, see the file comment).
  void find_moment_nodes();
  void prepare_skew_correction();
  std::vector<int> moment_nodes_;
  std::vector<int> skew_equations_;        // free rotation equations of the moment nodes
  Eigen::MatrixXd skew_S_, skew_Z_;        // S (k x k), Z = K^-1 E (n x k)
  Eigen::PartialPivLU<Eigen::MatrixXd> skew_lu_;  // I + S E^T Z
  bool skew_active_ = false;
  std::vector<double> values_;
  int factorisations_ = 0, indefinite_factorisations_ = 0;
  double factor_seconds_ = 0.0, assembly_seconds_ = 0.0, indefinite_seconds_ = 0.0;
};

}  // namespace rotcap
