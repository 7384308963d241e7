#pragma once
// Text helpers for input messages: number formatting, quoting, and the "did you mean" suggestion
// (nearest valid name by edit distance). Used by the case-file and mesh readers.

#include "core/text_format.hpp"  // format_number

#include <span>
#include <string>
#include <string_view>

namespace rotcap {

/// The text in double quotes, with embedded quotes and backslashes escaped.
std::string quote(std::string_view text);

/// "\"a\", \"b\" or \"c\"" (the names quoted, joined for a sentence); "(none)" when empty.
std::string quote_list(std::span<const std::string> names);

/// Levenshtein distance (insertions, deletions, substitutions), ASCII case-insensitive.
int edit_distance(std::string_view a, std::string_view b);

/// The candidate nearest to name when it is close: edit distance <= 2 and smaller than the
/// candidate's length (so a short word is not "near" every other short word); ties go to the
/// first candidate. Empty when none is close.
std::string nearest_name(std::string_view name, std::span<const std::string> candidates);

/// " (did you mean \"x\"?)" for the nearest candidate, or "" when none is close.
std::string did_you_mean(std::string_view name, std::span<const std::string> candidates);

}  // namespace rotcap
