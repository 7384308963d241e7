#include "solver/factor_size.hpp"

#include "solver/cholmod_factor.hpp"
#include "solver/dof_map.hpp"
#include "solver/rigid_ties.hpp"
#include "solver/sparse_pattern.hpp"

namespace rotcap {

FactorSize estimate_factor_size(const ShellModel& model) {
  const RigidTieSet ties(model);
  const DofMap dofs(model.node_count(), ties.held_dofs(model));
  const SparsePattern pattern(ties.effective_nodes(model), dofs);
  const CholmodFactor analysis(pattern, CholmodFactor::Method::SupernodalLLT);
  FactorSize size;
  size.free_dofs = dofs.free_count();
  size.matrix_nonzeros = static_cast<double>(pattern.nonzeros());
  size.factor_nonzeros = analysis.factor_nonzeros();
  return size;
}

}  // namespace rotcap
