#pragma once
// Sweep plans (`rotcap sweep PLAN.toml`): a base case and axes over case-file keys, expanded into
// one case file per combination. The plan-file reference (README, "Studies and sweeps"):
//
//   key            type / values                                  default
//   -------------- ---------------------------------------------- -------------------------------
//   title          string                                         ""
//   base           string: the base case file, relative to the plan's folder      required
//   combine        "grid" (every combination, the first axis outermost) | "zip" (the i-th
//                  value of every axis together; all axes of one length)          "grid"
//   [[axis]] key   string: a dotted case-file key ("section.designation", "member.length",
//                  "steel.fy", "imperfection.local_amplitude", ...)               required
//            values  non-empty array of the values the key takes (any TOML value)  required
//
// Every generated case is read by the case reader (io/case_file.hpp) before anything runs: a key
// the case file does not have, an empty axis, or a value that makes one case invalid is an
// InputError naming the plan file, the axis line, the key and the value (exit 2).
#include "io/case_input.hpp"
#include "io/case_overrides.hpp"

#include <filesystem>
#include <string>
#include <vector>

namespace rotcap {

enum class PlanCombine { grid, zip };

struct PlanAxis {
  std::string key;
  std::vector<OverrideValue> values;
  int line = 0;  ///< of the axis's key in the plan
};

struct SweepPlan {
  std::filesystem::path file;       ///< the plan as given
  std::string title;
  std::filesystem::path base_file;  ///< resolved against the plan's folder
  std::string base_text;
  PlanCombine combine = PlanCombine::grid;
  std::vector<PlanAxis> axes;
};

/// One case of an expanded plan.
struct PlannedCase {
  std::string name;                    ///< "003_IPE_200_1500": index from 1, then the values
  std::vector<CaseOverride> overrides; ///< one per axis, in axis order
  std::string case_text;               ///< the base with the overrides, as TOML
  CaseInput input;                     ///< case_text as the case reader read it
};

/// Reads and checks a plan (InputError naming the plan file, line and key on any fault).
SweepPlan read_sweep_plan(const std::filesystem::path& file);

/// Every case of the plan, each validated by the case reader; InputError naming the plan file,
/// the axis key and the value on the first invalid one.
std::vector<PlannedCase> expand_sweep_plan(const SweepPlan& plan);

/// A folder-safe form of a text: letters, digits, '.', '-' kept, everything else '_'.
std::string folder_safe(std::string_view text);

}  // namespace rotcap
