#include "io/toml_table_reader.hpp"

#include "io/input_text.hpp"

#include <algorithm>
#include <cmath>
#include <limits>

namespace rotcap::detail {

std::string describe_node(const toml::node& node) {
  switch (node.type()) {
    case toml::node_type::string:
      return "a string (" + quote(node.as_string()->get()) + ")";
    case toml::node_type::integer:
      return "an integer (" + std::to_string(node.as_integer()->get()) + ")";
    case toml::node_type::floating_point:
      return "a number (" + format_number(node.as_floating_point()->get()) + ")";
    case toml::node_type::boolean:
      return std::string("a boolean (") + (node.as_boolean()->get() ? "true" : "false") + ")";
    case toml::node_type::array:
      return "an array";
    case toml::node_type::table:
      return "a table";
    case toml::node_type::date:
      return "a date";
    case toml::node_type::time:
      return "a time";
    case toml::node_type::date_time:
      return "a date-time";
    default:
      return "a value of unknown type";
  }
}

int node_line(const toml::node& node) { return static_cast<int>(node.source().begin.line); }

double number_value(const toml::node& node, const std::filesystem::path& file,
                    const std::string& key_path) {
  double v = 0.0;
  if (const auto* i = node.as_integer())
    v = static_cast<double>(i->get());
  else if (const auto* f = node.as_floating_point())
    v = f->get();
  else
    throw InputError(file, node_line(node), key_path, describe_node(node), "a number");
  if (!std::isfinite(v))
    throw InputError(file, node_line(node), key_path, describe_node(node), "a finite number");
  return v;
}

std::string string_value(const toml::node& node, const std::filesystem::path& file,
                         const std::string& key_path) {
  if (const auto* s = node.as_string()) return s->get();
  throw InputError(file, node_line(node), key_path, describe_node(node), "a string");
}

const toml::table& table_value(const toml::node& node, const std::filesystem::path& file,
                               const std::string& key_path) {
  if (const auto* t = node.as_table()) return *t;
  throw InputError(file, node_line(node), key_path, describe_node(node),
                   "a table such as { key = value, ... }");
}

TableReader::TableReader(std::filesystem::path file, const toml::table* table, std::string path,
                         int line)
    : file_(std::move(file)), table_(table), path_(std::move(path)), line_(line) {}

std::string TableReader::key_path(std::string_view key) const {
  return path_.empty() ? std::string(key) : path_ + "." + std::string(key);
}

int TableReader::line_of(std::string_view key) const {
  if (table_ != nullptr)
    if (const toml::node* n = table_->get(key)) return node_line(*n);
  return line_;
}

bool TableReader::has(std::string_view key) { return node(key) != nullptr; }

const toml::node* TableReader::node(std::string_view key) {
  if (std::find(known_.begin(), known_.end(), key) == known_.end()) known_.emplace_back(key);
  return table_ != nullptr ? table_->get(key) : nullptr;
}

void TableReader::fail(std::string_view key, const std::string& found,
                       const std::string& expected) const {
  if (found == "no value") throw_if_misspelt(key);
  throw InputError(file_, line_of(key), key_path(key), found, expected);
}

std::optional<double> TableReader::optional_number(std::string_view key) {
  const toml::node* n = node(key);
  if (n == nullptr) return std::nullopt;
  return number_value(*n, file_, key_path(key));
}

double TableReader::number(std::string_view key, double fallback) {
  return optional_number(key).value_or(fallback);
}

void TableReader::throw_if_misspelt(std::string_view key) const {
  // A misspelt required key shows up as a missing one: name the misspelling instead.
  if (table_ != nullptr) {
    const std::vector<std::string> wanted{std::string(key)};
    for (auto&& [k, v] : *table_) {
      const std::string name(k.str());
      if (std::find(known_.begin(), known_.end(), name) != known_.end()) continue;
      if (nearest_name(name, wanted).empty()) continue;
      const int line = k.source().begin.line > 0 ? static_cast<int>(k.source().begin.line) : node_line(v);
      throw InputError(file_, line, key_path(name), "an unknown key " + quote(name),
                       "a known key (did you mean " + quote(std::string(key)) + "?)");
    }
  }
}

double TableReader::required_number(std::string_view key, std::string_view what) {
  const std::optional<double> v = optional_number(key);
  if (!v) fail(key, "no value", std::string(what));
  return *v;
}

std::optional<int> TableReader::optional_integer(std::string_view key) {
  const toml::node* n = node(key);
  if (n == nullptr) return std::nullopt;
  double v = 0.0;
  if (const auto* i = n->as_integer())
    v = static_cast<double>(i->get());
  else if (const auto* f = n->as_floating_point(); f != nullptr && std::isfinite(f->get()) &&
                                                    f->get() == std::floor(f->get()))
    v = f->get();
  else
    fail(key, describe_node(*n), "an integer");
  if (std::abs(v) > static_cast<double>(std::numeric_limits<int>::max()))
    fail(key, describe_node(*n), "an integer of magnitude below 2^31");
  return static_cast<int>(v);
}

int TableReader::integer(std::string_view key, int fallback) {
  return optional_integer(key).value_or(fallback);
}

std::optional<std::string> TableReader::optional_string(std::string_view key) {
  const toml::node* n = node(key);
  if (n == nullptr) return std::nullopt;
  return string_value(*n, file_, key_path(key));
}

std::string TableReader::string(std::string_view key, std::string fallback) {
  return optional_string(key).value_or(std::move(fallback));
}

std::string TableReader::required_string(std::string_view key, std::string_view what) {
  const std::optional<std::string> s = optional_string(key);
  if (!s) fail(key, "no value", std::string(what));
  return *s;
}

int TableReader::choice(std::string_view key, std::span<const std::string> names, int fallback) {
  const std::optional<std::string> s = optional_string(key);
  if (!s) return fallback;
  const auto it = std::find(names.begin(), names.end(), *s);
  if (it == names.end())
    fail(key, quote(*s), "one of " + quote_list(names) + did_you_mean(*s, names));
  return static_cast<int>(it - names.begin());
}

std::array<double, 3> TableReader::vector3(std::string_view key, std::array<double, 3> fallback) {
  const toml::array* a = optional_array(key);
  if (a == nullptr) return fallback;
  if (a->size() != 3)
    fail(key, "an array of " + std::to_string(a->size()) + " values",
         "an array of 3 numbers [x, y, z]");
  std::array<double, 3> v{};
  for (std::size_t i = 0; i < 3; ++i)
    v[i] = number_value(*a->get(i), file_, key_path(key) + "[" + std::to_string(i) + "]");
  return v;
}

const toml::array* TableReader::optional_array(std::string_view key) {
  const toml::node* n = node(key);
  if (n == nullptr) return nullptr;
  if (const toml::array* a = n->as_array()) return a;
  fail(key, describe_node(*n), "an array [ ... ]");
}

const toml::table* TableReader::optional_table(std::string_view key) {
  const toml::node* n = node(key);
  if (n == nullptr) return nullptr;
  if (const toml::table* t = n->as_table()) return t;
  fail(key, describe_node(*n), "a table ([" + key_path(key) + "] or { key = value, ... })");
}

TableReader TableReader::child(std::string_view key) {
  const toml::table* t = optional_table(key);
  return TableReader(file_, t, key_path(key), t != nullptr ? node_line(*t) : 0);
}

void TableReader::check(std::string_view key, double value, bool ok,
                        std::string_view constraint) const {
  if (!ok) fail(key, format_number(value), std::string(constraint));
}

void TableReader::forbid(std::string_view key, std::string_view expected) {
  if (const toml::node* n = node(key)) fail(key, describe_node(*n), std::string(expected));
}

void TableReader::finish() const {
  if (table_ == nullptr) return;
  for (auto&& [k, v] : *table_) {
    const std::string name(k.str());
    if (std::find(known_.begin(), known_.end(), name) != known_.end()) continue;
    const bool is_table = v.is_table();
    const std::string where = path_.empty() ? "the case file's top level" : "[" + path_ + "]";
    const std::string found = is_table ? "an unknown table [" + key_path(name) + "]"
                                       : "an unknown key " + quote(name);
    const std::string near = nearest_name(name, known_);
    std::string expected;
    if (!near.empty() && is_table)
      expected = "a known table (did you mean [" + key_path(near) + "]?)";
    else if (!near.empty())
      expected = "a known key of " + where + " (did you mean " + quote(near) + "?)";
    else
      expected = "one of the keys of " + where + ": " + quote_list(known_);
    const int line = k.source().begin.line > 0 ? static_cast<int>(k.source().begin.line)
                                               : node_line(v);
    throw InputError(file_, line, key_path(name), found, expected);
  }
}

}  // namespace rotcap::detail
