#pragma once
// MshLexer: the whitespace tokenizer of the Gmsh MSH 4.1 ASCII reader (internal to io/). Counts
// lines; every failure (end of file, a token that is not a number) is an InputError naming the
// file, the section being read and the line.

#include "io/input_error.hpp"
#include "io/input_text.hpp"

#include <charconv>
#include <cmath>
#include <filesystem>
#include <string>
#include <string_view>

namespace rotcap::detail {

struct MshToken {
  std::string_view text;
  int line = 0;
};

/// Whitespace tokenizer that counts lines; every failure is an InputError at the current line.
class MshLexer {
 public:
  MshLexer(std::string_view text, const std::filesystem::path& file) : text_(text), file_(file) {}

  bool at_end() {
    skip_space();
    return pos_ >= text_.size();
  }
  MshToken next(std::string_view section, std::string_view expected) {
    if (at_end()) fail(line_, section, "the end of the file", std::string(expected) + " (the file is truncated)");
    const std::size_t start = pos_;
    while (pos_ < text_.size() && !is_space(text_[pos_])) ++pos_;
    return {text_.substr(start, pos_ - start), line_};
  }
  /// The rest of the current line (for quoted names), trimmed.
  MshToken rest_of_line() {
    while (pos_ < text_.size() && (text_[pos_] == ' ' || text_[pos_] == '\t')) ++pos_;
    const std::size_t start = pos_;
    while (pos_ < text_.size() && text_[pos_] != '\n') ++pos_;
    std::string_view s = text_.substr(start, pos_ - start);
    while (!s.empty() && is_space(s.back())) s.remove_suffix(1);
    return {s, line_};
  }
  long long integer(std::string_view section, std::string_view what) {
    const MshToken t = next(section, what);
    long long v = 0;
    const std::string_view digits = without_plus(t.text);
    const auto [end, ec] = std::from_chars(digits.data(), digits.data() + digits.size(), v);
    if (ec != std::errc() || end != digits.data() + digits.size() || digits.empty())
      fail(t.line, section, quote(t.text), "an integer (" + std::string(what) + ")");
    return v;
  }
  /// A count: an integer >= 0.
  std::size_t count(std::string_view section, std::string_view what) {
    const int line = peek_line();
    const long long v = integer(section, what);
    if (v < 0) fail(line, section, std::to_string(v), std::string(what) + " >= 0");
    return static_cast<std::size_t>(v);
  }
  double real(std::string_view section, std::string_view what) {
    const MshToken t = next(section, what);
    double v = 0.0;
    const std::string_view digits = without_plus(t.text);
    const auto [end, ec] = std::from_chars(digits.data(), digits.data() + digits.size(), v);
    if (ec != std::errc() || end != digits.data() + digits.size() || digits.empty() || !std::isfinite(v))
      fail(t.line, section, quote(t.text), "a finite number (" + std::string(what) + ")");
    return v;
  }
  void expect(std::string_view section, std::string_view word, std::string_view hint = "") {
    const MshToken t = next(section, word);
    if (t.text != word)
      fail(t.line, section, quote(t.text), std::string(word) + std::string(hint));
  }
  /// Skips an unknown section up to its $End line.
  void skip_section(std::string_view name) {
    const std::string end = "$End" + std::string(name.substr(1));
    for (;;)
      if (next(name, end).text == end) return;
  }
  [[noreturn]] void fail(int line, std::string_view section, const std::string& found,
                         const std::string& expected) const {
    throw InputError(file_, line, std::string(section), found, expected);
  }
  std::size_t size() const { return text_.size(); }
  /// Line of the next token (skips whitespace first).
  int peek_line() {
    skip_space();
    return line_;
  }

 private:
  /// from_chars does not take a leading '+' (C++17 [charconv.from.chars]); Gmsh never writes
  /// one, hand-written files may.
  static std::string_view without_plus(std::string_view s) {
    return (s.size() > 1 && s[0] == '+') ? s.substr(1) : s;
  }
  static bool is_space(char c) { return c == ' ' || c == '\t' || c == '\r' || c == '\n'; }
  void skip_space() {
    while (pos_ < text_.size() && is_space(text_[pos_])) {
      if (text_[pos_] == '\n') ++line_;
      ++pos_;
    }
  }
  std::string_view text_;
  const std::filesystem::path& file_;
  std::size_t pos_ = 0;
  int line_ = 1;
};

}  // namespace rotcap::detail
