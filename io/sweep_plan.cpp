#include "io/sweep_plan.hpp"

#include "io/case_file.hpp"
#include "io/input_error.hpp"
#include "io/toml_table_reader.hpp"

#include <toml++/toml.h>

#include <set>
#include <sstream>

namespace rotcap {

namespace {

using detail::TableReader;

OverrideValue value_of(const toml::node& node) {
  if (const auto* s = node.as_string()) return override_string(s->get());
  std::ostringstream toml_text;
  node.visit([&](const auto& v) { toml_text << v; });
  return {toml_text.str(), toml_text.str()};
}

PlanAxis read_axis(const toml::node& node, const std::filesystem::path& file, const std::string& path) {
  const toml::table& t = detail::table_value(node, file, path);
  TableReader r(file, &t, path, detail::node_line(node));
  PlanAxis axis;
  axis.key = r.required_string("key", "a dotted case-file key such as \"member.length\"");
  axis.line = r.line_of("key");
  const toml::array* values = r.optional_array("values");
  if (!values) r.fail("values", "no values", "a non-empty array of the values " + axis.key + " takes");
  if (values->empty()) r.fail("values", "an empty array", "at least one value of " + axis.key);
  for (const toml::node& v : *values) {
    if (v.is_table() || v.is_array_of_tables())
      throw InputError(file, detail::node_line(v), r.key_path("values"), detail::describe_node(v),
                       "plain values (numbers, strings, booleans or arrays of them)");
    axis.values.push_back(value_of(v));
  }
  r.finish();
  return axis;
}

std::string case_name(std::size_t index, std::size_t count, const std::vector<CaseOverride>& overrides) {
  std::string digits = std::to_string(index + 1);
  const std::size_t width = std::max<std::size_t>(3, std::to_string(count).size());
  std::string name = std::string(width - std::min(width, digits.size()), '0') + digits;
  for (const CaseOverride& o : overrides) name += "_" + folder_safe(o.value.display);
  if (name.size() > 80) name.resize(80);
  return name;
}

/// The reader's complaint about one generated case, placed at the plan's axis that sets the key the
/// reader names (or at the first axis when the reader names another key).
[[noreturn]] void throw_invalid_case(const SweepPlan& plan, const PlannedCase& c, const InputError& e) {
  std::size_t culprit = 0;
  for (std::size_t a = 0; a < plan.axes.size(); ++a)
    if (e.key() == plan.axes[a].key || e.key().rfind(plan.axes[a].key + ".", 0) == 0 ||
        e.key().rfind(plan.axes[a].key + "[", 0) == 0)
      culprit = a;
  std::string with;
  for (std::size_t a = 0; a < c.overrides.size(); ++a)
    if (a != culprit) with += (with.empty() ? " with " : ", ") + c.overrides[a].key + " = " + c.overrides[a].value.toml;
  const PlanAxis& axis = plan.axes[culprit];
  throw InputError(plan.file, axis.line, "axis[" + std::to_string(culprit) + "] " + axis.key,
                   c.overrides[culprit].value.toml + " in case " + c.name + with + " (the case reader says: " +
                       (e.key().empty() ? "" : e.key() + ": ") + "found " + e.found() + ")",
                   e.expected());
}

}  // namespace

std::string folder_safe(std::string_view text) {
  std::string out;
  for (char ch : text) {
    const bool keep = (ch >= 'a' && ch <= 'z') || (ch >= 'A' && ch <= 'Z') || (ch >= '0' && ch <= '9') || ch == '.' || ch == '-';
    out += keep ? ch : '_';
  }
  return out;
}

SweepPlan read_sweep_plan(const std::filesystem::path& file) {
  SweepPlan plan;
  plan.file = file;
  const std::string text = read_text_file(file, "a sweep plan (TOML)");
  toml::table table;
  try {
    table = toml::parse(text, file.string());
  } catch (const toml::parse_error& e) {
    throw InputError(file, static_cast<int>(e.source().begin.line), "", "a TOML syntax error: " + std::string(e.description()),
                     "valid TOML (https://toml.io/en/v1.0.0)");
  }
  TableReader root(file, &table, "", 1);
  plan.title = root.string("title", "");
  const std::string base = root.required_string("base", "the base case file, relative to the plan's folder");
  const std::filesystem::path folder = file.has_parent_path() ? file.parent_path() : ".";
  plan.base_file = std::filesystem::path(base).is_absolute() ? std::filesystem::path(base) : folder / base;
  const std::string combine = root.string("combine", "grid");
  if (combine != "grid" && combine != "zip")
    root.fail("combine", "\"" + combine + "\"", "\"grid\" (every combination) or \"zip\" (the i-th values together)");
  plan.combine = combine == "zip" ? PlanCombine::zip : PlanCombine::grid;
  const toml::array* axes = root.optional_array("axis");
  if (!axes || axes->empty()) root.fail("axis", "no [[axis]]", "at least one [[axis]] with key and values");
  std::set<std::string> keys;
  for (std::size_t i = 0; i < axes->size(); ++i) {
    const std::string path = "axis[" + std::to_string(i) + "]";
    PlanAxis axis = read_axis((*axes)[i], file, path);
    if (!keys.insert(axis.key).second)
      throw InputError(file, axis.line, path + ".key", "\"" + axis.key + "\" a second time", "each key on one axis only");
    if (plan.combine == PlanCombine::zip && !plan.axes.empty() && axis.values.size() != plan.axes.front().values.size())
      throw InputError(file, axis.line, path + ".values",
                       std::to_string(axis.values.size()) + " values",
                       std::to_string(plan.axes.front().values.size()) + " values, as many as axis[0] (combine = \"zip\")");
    plan.axes.push_back(std::move(axis));
  }
  root.finish();
  try {
    plan.base_text = read_text_file(plan.base_file, "the base case file named by base");
  } catch (const InputError& e) {
    throw InputError(file, root.line_of("base"), "base", "\"" + base + "\" (" + e.found() + ")", "an existing case file");
  }
  return plan;
}

std::vector<PlannedCase> expand_sweep_plan(const SweepPlan& plan) {
  std::vector<std::vector<std::size_t>> picks;
  if (plan.combine == PlanCombine::zip) {
    for (std::size_t i = 0; i < plan.axes.front().values.size(); ++i)
      picks.push_back(std::vector<std::size_t>(plan.axes.size(), i));
  } else {
    std::size_t total = 1;
    for (const PlanAxis& a : plan.axes) total *= a.values.size();
    for (std::size_t n = 0; n < total; ++n) {
      std::vector<std::size_t> pick(plan.axes.size());
      std::size_t rest = n;
      for (std::size_t a = plan.axes.size(); a-- > 0;) {
        pick[a] = rest % plan.axes[a].values.size();
        rest /= plan.axes[a].values.size();
      }
      picks.push_back(pick);
    }
  }
  std::vector<PlannedCase> cases;
  for (std::size_t n = 0; n < picks.size(); ++n) {
    PlannedCase c;
    for (std::size_t a = 0; a < plan.axes.size(); ++a) c.overrides.push_back({plan.axes[a].key, plan.axes[a].values[picks[n][a]]});
    c.name = case_name(n, picks.size(), c.overrides);
    const std::filesystem::path as_file = plan.base_file.parent_path() / (c.name + ".toml");
    try {
      c.case_text = apply_case_overrides(plan.base_text, plan.base_file, c.overrides);
      c.input = parse_case_text(c.case_text, as_file);
    } catch (const InputError& e) {
      throw_invalid_case(plan, c, e);
    }
    cases.push_back(std::move(c));
  }
  return cases;
}

}  // namespace rotcap
