#include "app/model_builder.hpp"

#include "core/text_format.hpp"
#include "io/case_file.hpp"
#include "io/general_model.hpp"
#include "io/input_error.hpp"
#include "solver/section_assignment.hpp"
#include "solver/shell_element_set.hpp"

#include <algorithm>
#include <cmath>
#include <stdexcept>

namespace rotcap::app {

namespace {

/// Elements per flange outstand from which the demo's rotations (theta at M_max, theta_u, R)
/// stopped changing in its mesh study (bench/results/demo_mesh_study.txt: 9 per outstand, 18 across
/// the flange, within about 1 % of 12 per outstand). One class 3 section: advice, not a rule.
constexpr int kOutstandElementsForRotations = 9;

/// The scaled counts of --mesh-scale; returns the log line.
std::string scale_mesh(HingeZoneSpec& mesh, double factor) {
  const MeshCounts scaled = scaled_mesh_counts(mesh.flange_elements, mesh.web_elements, factor);
  const int flange = scaled.flange_elements;
  const int web = scaled.web_elements;
  const std::string line = format_text("mesh scaled by %g (--mesh-scale): flange_elements %d -> %d, web_elements %d -> %d",
                                       factor, mesh.flange_elements, flange, mesh.web_elements, web);
  mesh.flange_elements = flange;
  mesh.web_elements = web;
  return line;
}

}  // namespace

MeshCounts scaled_mesh_counts(int flange_elements, int web_elements, double factor) {
  return {std::max(4, 2 * static_cast<int>(std::lround(0.5 * factor * flange_elements))),
          std::max(4, static_cast<int>(std::lround(factor * web_elements)))};
}

BuiltCase build_case(const std::filesystem::path& case_file, std::optional<double> mesh_scale) {
  BuiltCase built;
  built.input = read_case_file(case_file);
  if (mesh_scale && built.input.kind == ModelKind::general)
    throw InputError(case_file, 0, "--mesh-scale", "a general model ([model] mesh = \"" +
                     built.input.model.mesh.string() + "\")",
                     "a generated hinge-zone model ([section], [member]); refine a mesh file in its mesher");
  std::string scaled;
  if (mesh_scale) scaled = scale_mesh(built.input.zone, *mesh_scale);
  if (built.input.kind == ModelKind::general) {
    built.model = build_general_model(built.input);
    try {
      validate_topology(built.model);
    } catch (const std::invalid_argument& e) {
      throw InputError(built.input.model.mesh, 0, "", e.what(), "a mesh in which every node belongs to a shell");
    }
    // The element shapes are the mesh's: a degenerate or badly warped quadrilateral is bad input,
    // found here (as the shell elements are built) rather than as an error inside an analysis.
    try {
      const SectionAssignment probe = SectionAssignment::elastic(built.model, built.input.steel.E, built.input.steel.nu);
      const ShellElementSet elements(built.model, probe);
    } catch (const std::invalid_argument& e) {
      throw InputError(built.input.model.mesh, 0, "$Elements", e.what(),
                       "quadrilaterals the shell element accepts (not degenerate, not strongly warped)");
    }
    built.description.push_back("general model from " + built.input.model.mesh.string());
    return built;
  }
  built.hinge = build_hinge_case(built.input);
  built.model = built.hinge->zone.model;
  built.description = built.hinge->description;
  if (!scaled.empty()) built.description.insert(built.description.begin(), scaled);
  const int per_outstand = built.input.zone.flange_elements / 2;
  if (per_outstand < kOutstandElementsForRotations)
    built.warnings.push_back(
        "mesh: " + std::to_string(per_outstand) + " elements per flange outstand; in the demo's mesh study the "
        "rotations (theta at M_max, theta_u, R) changed by up to 40 % below " +
        std::to_string(kOutstandElementsForRotations) + " per outstand while M_max stayed within 1.5 %: use at "
        "least the default 18 x 23 and check with --mesh-scale 1.5 (README, Known limitations)");
  return built;
}

}  // namespace rotcap::app
