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
};

BuiltCase build_case(const std::filesystem::path& case_file);

}  // namespace rotcap::app
