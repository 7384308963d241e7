#pragma once
// The inputs of a case as JSON, for summary.json: the case file's tables with every default
// filled in, in the case file's key names and units (mm, N, MPa, rad). Enumerations are their
// case-file strings; amplitudes are a number [mm] or their ratio string ("b/200"); an optional
// value that was not given is null. Only the tables of the case's kind appear (generated:
// section, member, restraints, residual_stress; general: model, thickness, support, load).

#include "io/case_input.hpp"

#include <nlohmann/json.hpp>

#include <filesystem>

namespace rotcap {

nlohmann::json to_json(const CaseInput& c);

/// The case back from its echo (summary.json's "input"), read by the case-file reader itself: the
/// echo's keys are the case file's, so the same schema and checks apply. "file" and "kind" are
/// the echo's own; nulls are defaults; a section with a designation keeps only the designation.
/// Messages name `source` (the summary.json); InputError for an echo the reader rejects.
CaseInput case_from_echo(const nlohmann::json& echo, const std::filesystem::path& source);

}  // namespace rotcap
