#include "app/model_builder.hpp"

#include "io/case_file.hpp"
#include "io/general_model.hpp"
#include "io/input_error.hpp"

#include <stdexcept>

namespace rotcap::app {

BuiltCase build_case(const std::filesystem::path& case_file) {
  BuiltCase built;
  built.input = read_case_file(case_file);
  if (built.input.kind == ModelKind::general) {
    built.model = build_general_model(built.input);
    try {
      validate_topology(built.model);
    } catch (const std::invalid_argument& e) {
      throw InputError(built.input.model.mesh, 0, "", e.what(), "a mesh in which every node belongs to a shell");
    }
    built.description.push_back("general model from " + built.input.model.mesh.string());
    return built;
  }
  built.hinge = build_hinge_case(built.input);
  built.model = built.hinge->zone.model;
  built.description = built.hinge->description;
  return built;
}

}  // namespace rotcap::app
