#pragma once
// The simple hinge laws beside a finished hinge-zone run (model/laws/hinge_laws.hpp,
// model/laws/moment_curvature.hpp, model/laws/fitted_hinge_law.hpp) and the outputs they feed:
//  - curve.svg: the shell curve (M/Mp against theta/theta_p) with the laws (a) elastic-perfectly
//    plastic, (b) linear strain-hardening hinge, (c) moment-curvature integration, and the fitted
//    multilinear law overlaid and labelled; the law curves are drawn up to 1.1 x the shell's last
//    rotation;
//  - summary.json keys "laws" (per law: its moment at the shell's theta at M_max and at theta_u,
//    the relative error (M_shell - M_law) / M_law there, the first rotation at which the shell
//    falls more than 5 % below the law (compared from 2 theta_p for (a), (b), whose knee is sharp,
//    from theta_p for (c)), and for (c) the largest
//    |M_shell - M_law| / Mp up to 5 theta_p) and "fitted_law" (its points, the largest deviation,
//    the 3 % bound and whether it holds);
//  - hinge_law.csv: the fitted law, columns point, kind, theta_plastic_mrad, moment_kNm,
//    theta_plastic_over_theta_p, m_over_mp (elastic branch: slope k_el = Mp / theta_p before the
//    first point);
//  - report.html (io/report_html.hpp): inputs, classification, results, the curve with the laws,
//    the fitted law, the deformed hinge zone at the end, the caution;
//  - final_state.json (written by the run only): the deformed mesh needed to redraw the picture
//    without re-running: {"nodes": [[x, y, z] mm], "quads": [[n0..n3]], "displacement":
//    [[ux, uy, uz] mm]} over the nodes used by shell elements (renumbered from 0).
// `rotcap report DIR` (app/command_report.cpp) calls report_hinge_laws with the curve read from
// curve.csv, the mesh from final_state.json and the summary from summary.json.
#include "app/hinge_case.hpp"
#include "app/hinge_stages.hpp"
#include "model/hinge/hinge_curve.hpp"

#include <array>
#include <filesystem>
#include <vector>

namespace rotcap::app {

struct DeformedMesh {
  std::vector<std::array<double, 3>> nodes;
  std::vector<std::array<int, 4>> quads;
  std::vector<std::array<double, 3>> displacement;
};

/// The shell elements of model with the translations of u (full DOF vector, 6 per node).
DeformedMesh deformed_mesh(const ShellModel& model, const Eigen::VectorXd& u);
void write_final_state(const DeformedMesh& mesh, const std::filesystem::path& file);
/// Throws InputError for a missing or malformed file.
DeformedMesh read_final_state(const std::filesystem::path& file);

/// Everything listed in the header comment except final_state.json. `summary`: the results known
/// so far (the keys of report_hinge_results, and of the full summary.json when re-made); mesh
/// may be empty (no picture then). Returns the log lines and {"laws": ..., "fitted_law": ...}.
StageReport report_hinge_laws(const CaseInput& input, const HingeCase& hinge, const std::vector<HingePoint>& curve,
                              const DeformedMesh& mesh, const nlohmann::json& summary,
                              const std::filesystem::path& folder);

}  // namespace rotcap::app
