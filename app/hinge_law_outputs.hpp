#pragma once
// The outputs of the hinge-law comparison (model/hinge_law_comparison.hpp) beside a finished
// hinge-zone run:
//  - summary.json keys "laws" (per law: its moment at the shell's theta at M_max and at theta_u, the
//    relative error (M_shell - M_law) / M_law there, the first rotation at which the shell falls more
//    than 5 % below the law, and the largest |M_shell - M_law| / Mp up to 5 theta_p; (b) its slope,
//    (c) its section's first-yield and peak moments) and "fitted_law" (its points, the largest
//    deviation, the 3 % bound and whether it holds);
//  - hinge_law.csv: the fitted law, columns point (0, 1, ...), kind (the point's role: "elastic_limit",
//    "peak", "corner" or "end", model/fitted_hinge_law.hpp), theta_plastic_mrad, moment_kNm,
//    theta_plastic_over_theta_p, m_over_mp (elastic branch: slope k_el = Mp / theta_p before the
//    first point);
//  - curve.svg's plot (hinge_curve_plot; the file is written with report.html by
//    app/hinge_report_page.hpp, once summary.json holds the demand): the shell curve (M/Mp against
//    theta/theta_p, computed theta_p) with the laws (a), (b), (c) and the fitted law overlaid and
//    labelled, drawn up to 1.1 x the shell's last rotation; top axis theta [mrad], right axis
//    M [kNm]; y zoomed to where the answer is (see hinge_curve_plot); the demand as a vertical line.
#include "app/hinge_case.hpp"
#include "app/hinge_stages.hpp"
#include "io/svg_plot.hpp"
#include "model/hinge/hinge_curve.hpp"
#include "model/laws/hinge_law_comparison.hpp"

#include <filesystem>
#include <string>
#include <vector>

namespace rotcap::app {

/// {"laws": ..., "fitted_law": ...} of summary.json.
nlohmann::json hinge_laws_json(const HingeLawSet& set, double mp);

/// curve.svg's plot: the shell points with the laws, the Mp line, the peak and theta_u marked.
/// summary: summary.json (optional keys read: demand.required_theta_u_mrad and demand.verdict,
/// drawn as a vertical line at that theta when present; an empty object draws no demand).
/// y range: from min(0.5, lowest shell M/Mp after the peak - 0.05) rounded down to 0.1, to the
/// highest drawn M/Mp + 0.05 (at least 1.05) rounded up to 0.05; x from 0.
LinePlot hinge_curve_plot(const std::string& title, const std::vector<MomentRotationPoint>& shell,
                          const HingeCurveResult& extraction, const HingeLawSet& set, double mp,
                          const nlohmann::json& summary = nlohmann::json::object());

/// Writes hinge_law.csv into folder; returns the log lines and hinge_laws_json.
StageReport write_hinge_law_outputs(const std::string& title, const std::vector<MomentRotationPoint>& shell,
                                    const HingeCurveResult& extraction, const HingeLawSet& set, double mp,
                                    const std::filesystem::path& folder);

}  // namespace rotcap::app
