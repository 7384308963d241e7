#pragma once
// The size of a model's linear systems before any numeric work, for `rotcap check`: the same DOF
// numbering (supports held, rigid ties eliminated) and sparsity pattern the analyses build, and
// CHOLMOD's symbolic analysis of the supernodal LL^T factor.
#include "model/shell_model.hpp"

namespace rotcap {

struct FactorSize {
  int free_dofs = 0;
  double matrix_nonzeros = 0.0;  ///< of the upper triangle of the tangent
  double factor_nonzeros = 0.0;  ///< of the LL^T factor (symbolic analysis)
  /// A rough memory need [MB]: two factors (the indefinite route keeps an LDL^T beside the LL^T),
  /// the tangent at 12 bytes a nonzero, and about 1 kB of element history per element.
  double memory_mb(int elements) const {
    return 2.0 * 8.0 * factor_nonzeros / 1.0e6 + 12.0 * matrix_nonzeros / 1.0e6 + 1.0e-3 * elements;
  }
};

FactorSize estimate_factor_size(const ShellModel& model);

}  // namespace rotcap
