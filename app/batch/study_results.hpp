#pragma once
// What a study found: per variant the results of its own summary.json and what it echoes (mesh
// counts, first step, local shape, mode, sign, amplitude); over the variants the band (min..max)
// of M_max, theta at M_max, theta_u and R, the lowest R and its variant; and two verdicts:
//   mesh converged  base against mesh_x1.5: |dM_max| / M_max <= 1 % and |dR| / R <= 5 %
//   step converged  base against step_x0.5, the same limits
// (our acceptance limits for a study, the ones issue 13 asked for; not from a standard). A verdict
// is "not shown" when either run failed or has no R.
#include "app/batch/case_folder.hpp"
#include "app/batch/study_variants.hpp"

#include <nlohmann/json.hpp>

#include <filesystem>
#include <optional>
#include <string>
#include <vector>

namespace rotcap::app {

inline constexpr double kConvergedMmaxChange = 0.01;
inline constexpr double kConvergedRChange = 0.05;

struct VariantResult {
  StudyVariant variant;
  std::filesystem::path folder;
  CaseOutcome outcome;
  std::optional<nlohmann::json> summary;
  std::optional<double> m_max_kNm, m_max_over_mp, theta_at_m_max_mrad, theta_u_mrad, r;
  bool r_is_lower_bound = false;
};

struct Band {
  std::optional<double> min, max;
  int count = 0;  ///< variants with a value
};

struct ConvergenceVerdict {
  std::optional<bool> converged;                     ///< nothing: not shown
  std::optional<double> m_max_change, r_change;      ///< relative, variant - base over base
  std::string text;                                  ///< "mesh converged (M_max -0.07 %, R -4.0 %)"
};

struct StudyResult {
  std::vector<VariantResult> variants;  ///< variants[0] is the base
  Band m_max_kNm, theta_at_m_max_mrad, theta_u_mrad, r;
  std::optional<std::size_t> lowest_r;  ///< index of the variant with the lowest R
  ConvergenceVerdict mesh, step;
  std::string r_statement;              ///< "R = 2.64, 2.31..2.80 over 11 variants; lowest: mode 2, negative sign"
};

/// Reads every variant's summary (folders[i] of variants[i]) and computes the band and verdicts.
StudyResult evaluate_study(const std::vector<StudyVariant>& variants, const std::vector<std::filesystem::path>& folders,
                           const std::vector<CaseOutcome>& outcomes);

/// study.json: the variants (name, description, claims, state, results), band, lowest R, verdicts.
nlohmann::json study_json(const StudyResult& study);

/// study.csv: one row per variant (echoed inputs read from its summary.json, results, state).
std::string study_csv(const StudyResult& study);

}  // namespace rotcap::app
