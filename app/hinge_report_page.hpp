#pragma once
// report.html of a hinge-zone run (io/report_html.hpp): the inputs, the section and its
// classification, the reported numbers, the curve with the simple hinge laws and their comparison,
// the fitted law, the deformed hinge zone at the end, the caution.
#include "app/hinge_case.hpp"
#include "io/final_state.hpp"
#include "model/hinge/hinge_curve.hpp"
#include "model/laws/hinge_law_comparison.hpp"

#include <nlohmann/json.hpp>

#include <filesystem>
#include <vector>

namespace rotcap::app {

/// summary: the run's summary.json so far (its "input" echo, failure_mode and stop_reason are shown);
/// mesh may be empty (no picture then).
void write_hinge_report(const CaseInput& input, const HingeCase& hinge, const std::vector<MomentRotationPoint>& shell,
                        const HingeCurveResult& extraction, const HingeLawSet& set, const DeformedMesh& mesh,
                        const nlohmann::json& summary, const std::filesystem::path& folder);

}  // namespace rotcap::app
