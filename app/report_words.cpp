#include "app/report_words.hpp"

#include "core/text_format.hpp"

#include <map>

namespace rotcap::app {

using nlohmann::json;

std::optional<double> json_number(const json& j, const std::vector<std::string>& path) {
  const json* at = &j;
  for (const std::string& key : path) {
    if (!at->is_object() || !at->contains(key)) return std::nullopt;
    at = &(*at)[key];
  }
  return at->is_number() ? std::optional(at->get<double>()) : std::nullopt;
}

std::string json_string(const json& j, const std::vector<std::string>& path) {
  const json* at = &j;
  for (const std::string& key : path) {
    if (!at->is_object() || !at->contains(key)) return {};
    at = &(*at)[key];
  }
  return at->is_string() ? at->get<std::string>() : std::string();
}

std::string identifier_words(const std::string& id) {
  static const std::map<std::string, std::string> phrases{
      {"none", "none"},
      {"flange_local_buckling", "flange local buckling"},
      {"web_local_buckling", "web local buckling"},
      {"lateral_torsional", "lateral-torsional buckling"},
      {"half_sine", "half-sine waves on the compression flange"},
      {"buckling_mode", "lowest local buckling mode"},
      {"uniform_moment", "uniform moment"},
      {"three_point", "three-point bending"},
      {"four_point", "four-point bending"},
      {"arc_length", "arc length"},
      {"quadlinear", "quad-linear (Yun-Gardner)"},
      {"elastic_plastic", "elastic-perfectly plastic"},
      {"supports_and_loads", "at supports and loads"},
      {"hot_rolled", "hot-rolled"},
      {"elastic_limit", "elastic limit"}};
  if (const auto it = phrases.find(id); it != phrases.end()) return it->second;
  std::string words = id;
  for (char& c : words)
    if (c == '_') c = ' ';
  return words;
}

std::string stop_reason_words(const std::string& reason, const json& input) {
  if (reason == "rotation reached max_rotation") {
    const auto limit = json_number(input, {"analysis", "max_rotation"});
    return "the rotation reached the set limit" + (limit ? " (" + mrad_text(1e3 * *limit) + ")" : std::string());
  }
  if (reason == "moment fell below stop_below x M_max") {
    const auto f = json_number(input, {"analysis", "stop_below"});
    return "the moment fell below " + (f ? format_text("%.2f", *f) + " M_max" : std::string("the set fraction of M_max"));
  }
  if (reason == "completed") return "the load reached its end value";
  if (reason == "max_steps") {
    const auto n = json_number(input, {"analysis", "max_steps"});
    return "the step budget ran out" + (n ? format_text(" (%.0f steps)", *n) : std::string());
  }
  if (reason == "no_convergence") return "no convergence: the step became too small";
  if (reason == "evaluation_failed") return "an element could not be evaluated (e.g. a distorted element)";
  return reason.empty() ? "not recorded" : identifier_words(reason);
}

std::string kNm_text(double kNm) { return format_text("%.1f kNm", kNm); }
std::string mrad_text(double mrad) { return format_text("%.2f mrad", mrad); }
std::string signed_mrad_text(double mrad) { return format_text("%+.2f mrad", mrad); }
std::string mm_text(double mm, int decimals) { return format_text("%.*f mm", decimals, mm); }
std::string ratio_text(double r, int decimals) { return format_text("%.*f", decimals, r); }

std::string date_words(const std::string& iso) {
  // "YYYY-MM-DDTHH:MM:SSZ" (20 characters): date, hours and minutes, UTC.
  if (iso.size() == 20 && iso[10] == 'T' && iso[19] == 'Z') return iso.substr(0, 10) + " " + iso.substr(11, 5) + " UTC";
  return iso;
}

}  // namespace rotcap::app
