#pragma once
// The variants `rotcap study CASE.toml` runs: the case itself and what its R is sensitive to
// (README's mesh and step studies), each as overrides of the case file (io/case_overrides.hpp):
//   base              the case as written
//   mesh_x1.5         [mesh] flange_elements, web_elements x 1.5 (the --mesh-scale rounding)
//   step_x0.5         [analysis] first_step x 0.5 and max_steps x 2 (the same path length)
//   amplitude_x0.5    [imperfection] local_amplitude x 0.5 ("b/200" -> "b/400"; mm values halved)
//   amplitude_x2      local_amplitude x 2
//   modeK_positive / modeK_negative, K = 1, 2, 3
//                     local = "buckling_mode", mode = K (the K-th local buckling mode), sign = +-1
//   half_sine         local = "half_sine", sign = 1
// The variant equal to the case itself (its own mode and sign, or half_sine) is left out, so a
// case with the default imperfection has 11 variants. Each variant records what it claims (mesh
// counts, first step, local shape, mode, sign, amplitude) for the check against its summary.json.
#include "io/case_input.hpp"
#include "io/case_overrides.hpp"

#include <optional>
#include <string>
#include <vector>

namespace rotcap::app {

struct VariantClaims {
  int flange_elements = 0, web_elements = 0;
  double first_step = 0.0;
  std::string local;             ///< "buckling_mode" | "half_sine"
  std::optional<int> mode;       ///< buckling_mode only
  int sign = 1;
  std::string local_amplitude;   ///< as written in the case file ("b/200", "0.5")
};

struct StudyVariant {
  std::string name;              ///< folder name, e.g. "mode2_negative"
  std::string description;       ///< for people, e.g. "mode 2, negative sign"
  std::vector<CaseOverride> overrides;
  VariantClaims claims;
};

/// The variants of a generated case with a local imperfection; InputError naming the case file
/// and key for a general model or local = "none".
std::vector<StudyVariant> study_variants(const CaseInput& base);

}  // namespace rotcap::app
