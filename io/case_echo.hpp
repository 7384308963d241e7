#pragma once
// The inputs of a case as JSON, for summary.json: the case file's tables with every default
// filled in, in the case file's key names and units (mm, N, MPa, rad). Enumerations are their
// case-file strings; amplitudes are a number [mm] or their ratio string ("b/200"); an optional
// value that was not given is null. Only the tables of the case's kind appear (generated:
// section, member, restraints, residual_stress; general: model, thickness, support, load).

#include "io/case_input.hpp"

#include <nlohmann/json.hpp>

namespace rotcap {

nlohmann::json to_json(const CaseInput& c);

}  // namespace rotcap
