#pragma once
// equilibrate: Newton iterations at a fixed load (the problem's fixed load, load factor 0) until the
// out-of-balance force vanishes, then commit. Used after residual stresses are set as initial
// stresses (they are self-equilibrated over the section, but not element by element once the plate
// model is discretised), before any load is applied.
#include "solver/path/equilibrium_problem.hpp"

#include <string>
#include <vector>

namespace rotcap {

struct EquilibrateOptions {
  double force_tolerance = 1e-8;  ///< |r| <= tol * scale, scale = the caller's force scale (> 0)
  int max_iterations = 25;
};

struct EquilibrateResult {
  bool converged = false;
  int iterations = 0;
  std::vector<double> residual_norms;  ///< |r| before each correction and at the end
  double displacement_norm = 0.0;      ///< largest translation component moved [mm]
  std::string message;
};

/// force_scale: what |r| is compared with (e.g. |f_ref|, or fy times a plate area).
EquilibrateResult equilibrate(EquilibriumProblem& problem, double force_scale, const EquilibrateOptions& options = {});

}  // namespace rotcap
