#pragma once
// The sections of the hinge report (app/hinge_report_page.hpp), one function each. Every number
// carries its unit and the rounding of app/report_words.hpp; every summary.json key is optional.
#include "app/hinge_case.hpp"
#include "io/final_state.hpp"
#include "io/report_html.hpp"
#include "model/hinge/hinge_curve.hpp"
#include "model/laws/hinge_law_comparison.hpp"

#include <nlohmann/json.hpp>

#include <string>
#include <vector>

namespace rotcap::app {

/// What the sections read (references; the caller keeps them alive).
struct ReportInputs {
  const CaseInput& input;
  const HingeCase& hinge;
  const std::vector<MomentRotationPoint>& points;
  const HingeCurveResult& result;
  const HingeLawSet& laws;
  const DeformedMesh& mesh;
  const nlohmann::json& summary;
};

/// The result box: the answer first (ids mp, m-max, m-max-over-mp, rotation-capacity, failure-mode,
/// demand-verdict on their value cells).
ReportSection result_section(const ReportInputs& in);
ReportSection section_section(const ReportInputs& in);
ReportSection model_section(const ReportInputs& in);
ReportSection imperfection_section(const ReportInputs& in);
ReportSection residual_stress_section(const ReportInputs& in);
/// plot_svg: the curve as an <svg> element (the same as curve.svg).
ReportSection curve_section(const ReportInputs& in, const std::string& plot_svg);
/// The laws (a), (b), (c) against the shell curve at theta(M_max) and theta_u.
ReportSection laws_section(const ReportInputs& in);
ReportSection fitted_law_section(const ReportInputs& in);
/// The deformed hinge zone at true scale, coloured by |uy|, supports and loads marked.
ReportSection deformed_section(const ReportInputs& in);
/// The main case values with units (all of them are in summary.json's "input").
ReportSection inputs_section(const ReportInputs& in);

}  // namespace rotcap::app
