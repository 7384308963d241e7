#pragma once
// The hinge-zone study of a generated case, end to end: imperfections, residual stresses and their
// equilibrium step, an axial load applied first and held, path following of the bending load past
// the peak, and the results folder (curve.csv, summary.json, fields, curve.svg, run.log).
#include "app/hinge_case.hpp"
#include "io/case_input.hpp"

#include <filesystem>

namespace rotcap::app {

int run_hinge_study(const CaseInput& input, const HingeCase& hinge, const std::filesystem::path& folder,
                    int threads);

}  // namespace rotcap::app
