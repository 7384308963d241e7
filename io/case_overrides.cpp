#include "io/case_overrides.hpp"

#include "io/input_error.hpp"

#include <toml++/toml.h>

#include <charconv>
#include <cstdio>
#include <fstream>
#include <sstream>

namespace rotcap {

namespace {

std::string quote(std::string_view s) { return "\"" + std::string(s) + "\""; }

/// The value of "v = <text>" parsed by toml++.
toml::node_view<const toml::node> parse_value(const toml::table& holder) { return holder["v"]; }

void make_mesh_path_absolute(toml::table& root, const std::filesystem::path& base_file) {
  toml::table* model = root["model"].as_table();
  if (!model) return;
  toml::value<std::string>* mesh = (*model)["mesh"].as_string();
  if (!mesh) return;
  const std::filesystem::path p(mesh->get());
  if (p.is_absolute()) return;
  const std::filesystem::path folder = base_file.has_parent_path() ? base_file.parent_path() : ".";
  *mesh = std::filesystem::absolute(folder / p).lexically_normal().string();
}

}  // namespace

OverrideValue override_number(double value) {
  char buf[64];
  const auto r = std::to_chars(buf, buf + sizeof buf, value);
  std::string text(buf, r.ptr);
  if (text.find_first_of(".eE") == std::string::npos && text.find("inf") == std::string::npos &&
      text.find("nan") == std::string::npos)
    text += ".0";
  return {text, text};
}

OverrideValue override_integer(long long value) { return {std::to_string(value), std::to_string(value)}; }

OverrideValue override_string(std::string_view value) {
  // A TOML basic string: backslash, quote and control characters escaped.
  std::string t = "\"";
  for (const char c : value) {
    if (c == '"' || c == '\\') t += std::string("\\") + c;
    else if (static_cast<unsigned char>(c) < 0x20) {
      char buf[8];
      std::snprintf(buf, sizeof buf, "\\u%04x", static_cast<unsigned>(c));
      t += buf;
    } else t += c;
  }
  return {t + "\"", std::string(value)};
}

std::string apply_case_overrides(std::string_view base_text, const std::filesystem::path& base_file,
                                 std::span<const CaseOverride> overrides) {
  toml::table root;
  try {
    root = toml::parse(base_text, base_file.string());
  } catch (const toml::parse_error& e) {
    throw InputError(base_file, static_cast<int>(e.source().begin.line), "",
                     "a TOML syntax error: " + std::string(e.description()), "a valid case file");
  }
  make_mesh_path_absolute(root, base_file);
  std::string header = "# Written by rotcap from " + base_file.string() + "\n";
  for (const CaseOverride& o : overrides) {
    toml::table holder;
    try {
      holder = toml::parse("v = " + (o.value.toml.empty() ? std::string("0") : o.value.toml));
    } catch (const toml::parse_error& e) {
      throw InputError(base_file, 0, o.key, "the value " + o.value.toml, "a TOML value (" + std::string(e.description()) + ")");
    }
    if (o.key.empty() || o.key.front() == '.' || o.key.back() == '.' || o.key.find("..") != std::string::npos)
      throw InputError(base_file, 0, o.key, quote(o.key), "a dotted case-file key such as \"member.length\"");
    toml::table* table = &root;
    std::size_t start = 0;
    std::string walked;
    for (;;) {
      const std::size_t dot = o.key.find('.', start);
      const std::string part = o.key.substr(start, dot == std::string::npos ? std::string::npos : dot - start);
      if (dot == std::string::npos) {
        if (o.value.toml.empty()) table->erase(part);
        else table->insert_or_assign(part, *parse_value(holder).node());
        break;
      }
      walked += (walked.empty() ? "" : ".") + part;
      toml::node* next = table->get(part);
      if (!next) {
        table->insert(part, toml::table{});
        next = table->get(part);
      }
      table = next->as_table();
      if (!table)
        throw InputError(base_file, 0, o.key, walked + " is a value, not a table",
                         "a key path whose leading parts are tables of the case file");
      start = dot + 1;
    }
    header += "#   " + o.key + (o.value.toml.empty() ? std::string(" removed") : " = " + o.value.toml) + "\n";
  }
  std::ostringstream os;
  os << header << "\n" << root << "\n";
  return os.str();
}

std::string read_text_file(const std::filesystem::path& file, std::string_view what) {
  std::error_code ec;
  if (!std::filesystem::is_regular_file(file, ec))
    throw InputError(file, 0, "", std::filesystem::exists(file, ec) ? "a folder or special file" : "no such file",
                     std::string(what));
  std::ifstream in(file, std::ios::binary);
  std::ostringstream text;
  text << in.rdbuf();
  if (!in && !in.eof()) throw InputError(file, 0, "", "a file that cannot be read", std::string(what));
  return text.str();
}

}  // namespace rotcap
