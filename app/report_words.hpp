#pragma once
// Words and numbers for the hinge report (report.html, curve.svg): the program's identifiers as
// words, values with their units at the precision an engineer reads, and optional summary.json
// values (absent or null means "not available", so results folders of older versions still render).
//
// Rounding (what the numbers can support, not what the solver prints):
//   moments 1 decimal in kNm, M/Mp 3 decimals, rotations 2 decimals in mrad, R 2 decimals,
//   lengths 1 decimal in mm (amplitudes 2), stresses 0 decimals in MPa.
#include <nlohmann/json.hpp>

#include <optional>
#include <string>
#include <vector>

namespace rotcap::app {

/// The number at a path of object keys, or nothing when a key is missing or the value not a number.
std::optional<double> json_number(const nlohmann::json& j, const std::vector<std::string>& path);
/// The string at a path, or "" when missing or not a string.
std::string json_string(const nlohmann::json& j, const std::vector<std::string>& path);

/// An identifier as words: "flange_local_buckling" -> "flange local buckling"; known ones get
/// their own phrase (failure modes, stop reasons, imperfection kinds, residual-stress patterns, setups).
std::string identifier_words(const std::string& id);
/// The stop reason of a run as a sentence fragment; limits quoted from the case input when known.
std::string stop_reason_words(const std::string& reason, const nlohmann::json& input);

std::string kNm_text(double kNm);           ///< "282.8 kNm"
std::string mrad_text(double mrad);         ///< "15.40 mrad"
std::string signed_mrad_text(double mrad);  ///< "+5.30 mrad"
std::string mm_text(double mm, int decimals = 1);  ///< "1200.0 mm"
std::string ratio_text(double r, int decimals = 3);  ///< "0.914"

/// "2026-12-03T08:00:00Z" -> "2026-12-03 08:00 UTC"; other text unchanged.
std::string date_words(const std::string& iso);

}  // namespace rotcap::app
