#pragma once
// The report of a hinge-zone run, written into its results folder:
//  - curve.svg (hinge_curve_plot of app/hinge_law_outputs.hpp, with the demand of the summary);
//  - report.html (io/report_html.hpp), for an engineer, in this order: header (title, program and
//    version, run date, case file), the caution, the result box (Mp, M_max and M_max/Mp, theta_p,
//    theta_u, available plastic rotation, R with its basis and R with the beam-theory theta_p, the
//    failure mode in words, the demand verdict with its margin), the section and its class, the
//    model (mesh, steps, stop reason in words), the imperfection used, residual stresses, the curve
//    with the laws, the fitted law, the deformed hinge zone (supports and loads marked), the main
//    inputs with units, the files of the folder; units on every number (app/report_words.hpp);
//  - report.pdf (app/report_pdf.hpp) when chromium is on PATH; otherwise a one-line note in the log.
#include "app/hinge_case.hpp"
#include "io/final_state.hpp"
#include "model/hinge/hinge_curve.hpp"
#include "model/laws/hinge_law_comparison.hpp"

#include <nlohmann/json.hpp>

#include <filesystem>
#include <vector>

namespace rotcap::app {

/// summary: the run's summary.json so far; every key is optional (absent or null: "not available"),
/// so results folders of older versions still render. mesh may be empty (no picture then); its
/// supports and loads may be empty (the picture then has no marks).
void write_hinge_report(const CaseInput& input, const HingeCase& hinge, const std::vector<MomentRotationPoint>& shell,
                        const HingeCurveResult& extraction, const HingeLawSet& set, const DeformedMesh& mesh,
                        const nlohmann::json& summary, const std::filesystem::path& folder);

}  // namespace rotcap::app
