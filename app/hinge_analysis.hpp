#pragma once
// The hinge-zone study of a generated case, end to end: imperfections, residual stresses and their
// equilibrium step, an axial load applied first and held, path following of the bending load past
// the peak, and the results folder (curve.csv, summary.json, fields, curve.svg, run.log).
#include "app/hinge_case.hpp"
#include "app/run_checkpoint.hpp"
#include "io/case_input.hpp"

#include <filesystem>

namespace rotcap::app {

/// checkpoint.file empty: no checkpoints. checkpoint.resume_from set: the study continues that
/// checkpoint (the stages before the path are not repeated: the imperfect geometry, the history with
/// its residual stresses and the summary so far come from the checkpoint).
int run_hinge_study(const CaseInput& input, const HingeCase& hinge, const std::filesystem::path& folder,
                    int threads, RunCheckpoint& checkpoint);

}  // namespace rotcap::app
