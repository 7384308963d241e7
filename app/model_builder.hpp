#pragma once
// build_case: the case file read, validated and turned into the ShellModel to analyse, with the
// lines `rotcap check` prints about it. General models come from their mesh file; generated models
// from the hinge-zone generator.
#include "app/hinge_case.hpp"
#include "io/case_input.hpp"
#include "model/shell_model.hpp"

#include <filesystem>
#include <optional>
#include <string>
#include <vector>

namespace rotcap::app {

struct BuiltCase {
  CaseInput input;
  ShellModel model;                      ///< the (perfect) model to analyse
  std::optional<HingeCase> hinge;        ///< generated models: the hinge zone and its data
  std::vector<std::string> description;  ///< derived data for `check` and the log
  std::vector<std::string> warnings;     ///< advice `check` and `run` print as warnings
};

/// The counts --mesh-scale F makes of [mesh] flange_elements and web_elements: flange F x n rounded
/// to the nearest even count, web F x n rounded, both at least 4 (also what `rotcap study`'s mesh
/// variant writes into its case file).
struct MeshCounts {
  int flange_elements = 0;
  int web_elements = 0;
};
MeshCounts scaled_mesh_counts(int flange_elements, int web_elements, double factor);

/// mesh_scale (the --mesh-scale option): [mesh] flange_elements and web_elements of a generated
/// model times the factor, rounded to the nearest even / integer count and at least 4, recorded in
/// the description (and so in run.log); InputError for a general model, whose mesh is its own.
BuiltCase build_case(const std::filesystem::path& case_file, std::optional<double> mesh_scale = std::nullopt);

}  // namespace rotcap::app
