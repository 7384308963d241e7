#pragma once
// Analyses of general models (a Gmsh mesh with supports and loads by group): one linear solve, or
// path following under load, displacement or arc-length control (corotational shells, the case's
// steel model). Results go to the folder as described in the README.
#include "app/run_checkpoint.hpp"
#include "io/case_input.hpp"
#include "model/shell_model.hpp"

#include <filesystem>

namespace rotcap::app {

int run_general_linear(const CaseInput& input, const ShellModel& model, const std::filesystem::path& folder,
                       int threads);
/// checkpoint: as for run_hinge_study (app/hinge_analysis.hpp).
int run_general_path(const CaseInput& input, const ShellModel& model, const std::filesystem::path& folder,
                     int threads, RunCheckpoint& checkpoint);

}  // namespace rotcap::app
