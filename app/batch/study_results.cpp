#include "app/batch/study_results.hpp"

#include "app/batch/csv_field.hpp"
#include "core/text_format.hpp"

#include <algorithm>
#include <cmath>

namespace rotcap::app {

namespace {

using nlohmann::json;

std::optional<double> number_at(const std::optional<json>& s, const char* key) {
  if (!s || !s->contains(key) || !(*s)[key].is_number()) return std::nullopt;
  return (*s)[key].get<double>();
}

void widen(Band& b, const std::optional<double>& v) {
  if (!v) return;
  b.min = b.min ? std::min(*b.min, *v) : *v;
  b.max = b.max ? std::max(*b.max, *v) : *v;
  ++b.count;
}

const VariantResult* find(const StudyResult& s, const std::string& name) {
  for (const VariantResult& v : s.variants)
    if (v.variant.name == name) return &v;
  return nullptr;
}

ConvergenceVerdict verdict(const StudyResult& s, const std::string& variant, const std::string& what) {
  ConvergenceVerdict v;
  const VariantResult* base = find(s, "base");
  const VariantResult* other = find(s, variant);
  if (!base || !other || !base->m_max_kNm || !other->m_max_kNm || !base->r || !other->r || *base->r == 0.0) {
    v.text = what + " convergence not shown (" + variant + " or base has no M_max or R)";
    return v;
  }
  v.m_max_change = (*other->m_max_kNm - *base->m_max_kNm) / *base->m_max_kNm;
  v.r_change = (*other->r - *base->r) / *base->r;
  v.converged = std::abs(*v.m_max_change) <= kConvergedMmaxChange && std::abs(*v.r_change) <= kConvergedRChange;
  v.text = what + (*v.converged ? " converged" : " not converged") +
           format_text(" (%s: M_max %+.2f %%, R %+.1f %%; limits 1 %% and 5 %%)", variant.c_str(), 100.0 * *v.m_max_change,
                       100.0 * *v.r_change);
  return v;
}

json band_json(const Band& b) {
  return {{"min", b.min ? json(*b.min) : json(nullptr)}, {"max", b.max ? json(*b.max) : json(nullptr)}, {"variants", b.count}};
}

json verdict_json(const ConvergenceVerdict& v) {
  const auto opt = [](const std::optional<double>& x) { return x ? json(*x) : json(nullptr); };
  return {{"converged", v.converged ? json(*v.converged) : json(nullptr)},
          {"m_max_change", opt(v.m_max_change)}, {"r_change", opt(v.r_change)}, {"text", v.text}};
}

std::string json_field(const json& j, std::initializer_list<const char*> path) {
  const json* at = &j;
  for (const char* k : path) {
    if (!at->is_object() || !at->contains(k)) return "";
    at = &(*at)[k];
  }
  if (at->is_string()) return at->get<std::string>();
  if (at->is_boolean()) return at->get<bool>() ? "true" : "false";
  if (at->is_number_integer()) return std::to_string(at->get<long long>());
  if (at->is_number()) return format_text("%.6g", at->get<double>());
  return "";
}

}  // namespace

StudyResult evaluate_study(const std::vector<StudyVariant>& variants, const std::vector<std::filesystem::path>& folders,
                           const std::vector<CaseOutcome>& outcomes) {
  StudyResult s;
  for (std::size_t i = 0; i < variants.size(); ++i) {
    VariantResult v{variants[i], folders[i], outcomes[i], std::nullopt, {}, {}, {}, {}, {}, false};
    if (outcomes[i].state == CaseState::done || outcomes[i].state == CaseState::failed) v.summary = read_summary(folders[i]);
    v.m_max_kNm = number_at(v.summary, "m_max_kNm");
    v.m_max_over_mp = number_at(v.summary, "m_max_over_mp");
    v.theta_at_m_max_mrad = number_at(v.summary, "theta_at_m_max_mrad");
    v.theta_u_mrad = number_at(v.summary, "theta_u_mrad");
    v.r = number_at(v.summary, "rotation_capacity");
    v.r_is_lower_bound = v.summary && v.summary->value("rotation_capacity_is_lower_bound", false);
    widen(s.m_max_kNm, v.m_max_kNm);
    widen(s.theta_at_m_max_mrad, v.theta_at_m_max_mrad);
    widen(s.theta_u_mrad, v.theta_u_mrad);
    widen(s.r, v.r);
    if (v.r && (!s.lowest_r || *v.r < *s.variants[*s.lowest_r].r)) s.lowest_r = s.variants.size();
    s.variants.push_back(std::move(v));
  }
  s.mesh = verdict(s, "mesh_x1.5", "mesh");
  s.step = verdict(s, "step_x0.5", "step");
  const VariantResult& base = s.variants.front();
  int bounds = 0;
  for (const VariantResult& v : s.variants) bounds += v.r && v.r_is_lower_bound;
  s.r_statement = (base.r ? format_text("R = %.2f", *base.r) : std::string("R of the case as written: none")) +
                  (s.r.count > 0 ? format_text(", %.2f..%.2f over %d variants", *s.r.min, *s.r.max, s.r.count)
                                 : std::string(", no variant reached an R")) +
                  (s.lowest_r ? "; lowest: " + s.variants[*s.lowest_r].variant.description : std::string()) +
                  (bounds > 0 ? format_text(" (%d of them lower bounds: the run stopped above Mp)", bounds) : std::string());
  return s;
}

json study_json(const StudyResult& s) {
  json variants = json::array();
  for (const VariantResult& v : s.variants) {
    const VariantClaims& c = v.variant.claims;
    const auto opt = [](const std::optional<double>& x) { return x ? json(x.value()) : json(nullptr); };
    json claims = {{"flange_elements", c.flange_elements}, {"web_elements", c.web_elements}, {"first_step", c.first_step},
                   {"local", c.local}, {"mode", c.mode ? json(*c.mode) : json(nullptr)}, {"sign", c.sign},
                   {"local_amplitude", c.local_amplitude}};
    variants.push_back({{"name", v.variant.name}, {"description", v.variant.description}, {"claims", claims},
                        {"folder", "cases/" + v.folder.filename().string()}, {"state", case_state_name(v.outcome.state)},
                        {"reason", v.outcome.reason}, {"m_max_kNm", opt(v.m_max_kNm)}, {"m_max_over_mp", opt(v.m_max_over_mp)},
                        {"theta_at_m_max_mrad", opt(v.theta_at_m_max_mrad)}, {"theta_u_mrad", opt(v.theta_u_mrad)},
                        {"rotation_capacity", opt(v.r)}, {"rotation_capacity_is_lower_bound", v.r_is_lower_bound}});
  }
  return {{"variants", variants},
          {"band", {{"m_max_kNm", band_json(s.m_max_kNm)}, {"theta_at_m_max_mrad", band_json(s.theta_at_m_max_mrad)},
                    {"theta_u_mrad", band_json(s.theta_u_mrad)}, {"rotation_capacity", band_json(s.r)}}},
          {"lowest_r", s.lowest_r ? json{{"variant", s.variants[*s.lowest_r].variant.name},
                                         {"description", s.variants[*s.lowest_r].variant.description},
                                         {"rotation_capacity", *s.variants[*s.lowest_r].r}}
                                  : json(nullptr)},
          {"mesh", verdict_json(s.mesh)}, {"step", verdict_json(s.step)}, {"r_statement", s.r_statement},
          {"limits", {{"m_max_change", kConvergedMmaxChange}, {"r_change", kConvergedRChange}}}};
}

std::string study_csv(const StudyResult& s) {
  std::string t = "variant,description,state,flange_elements,web_elements,first_step,local,mode,sign,local_amplitude,"
                  "local_amplitude_mm,m_max_kNm,m_max_over_mp,theta_at_m_max_mrad,theta_p_mrad,theta_u_mrad,rotation_capacity,"
                  "rotation_capacity_is_lower_bound,failure_mode,stop_reason,reason,wall_s\n";
  for (const VariantResult& v : s.variants) {
    const json j = v.summary ? *v.summary : json::object();
    t += csv_field(v.variant.name) + "," + csv_field(v.variant.description) + "," + case_state_name(v.outcome.state);
    // What the run echoes, read from its summary.json (not from the variant's claims).
    t += "," + json_field(j, {"mesh", "flange_elements"}) + "," + json_field(j, {"mesh", "web_elements"});
    t += "," + json_field(j, {"input", "analysis", "first_step"}) + "," + json_field(j, {"imperfection", "local"});
    t += "," + json_field(j, {"imperfection", "local_mode"}) + "," + json_field(j, {"imperfection", "sign"});
    t += "," + csv_field(json_field(j, {"input", "imperfection", "local_amplitude"})) + "," +
         json_field(j, {"imperfection", "local_amplitude_mm"});
    for (const char* k : {"m_max_kNm", "m_max_over_mp", "theta_at_m_max_mrad", "theta_p_mrad", "theta_u_mrad", "rotation_capacity",
                          "rotation_capacity_is_lower_bound", "failure_mode", "stop_reason"})
      t += "," + csv_field(json_field(j, {k}));
    t += "," + csv_field(v.outcome.reason) + "," + format_text("%.2f", v.outcome.wall_s) + "\n";
  }
  return t;
}

}  // namespace rotcap::app
