#pragma once
// Imperfection amplitudes as written in case files: a number of millimetres, or a ratio string
// "S/n" of a named length S ("b/200": the local plate amplitude of EN 1993-1-5 Annex C;
// "L/1000": member bow). Spaces around the slash are allowed; n is a positive finite number.

#include "io/case_input.hpp"

#include <optional>
#include <span>
#include <string>
#include <string_view>

namespace rotcap {

/// The base symbols a ratio may use: "b", "h", "L" (see Amplitude::base).
std::span<const std::string> amplitude_bases();

/// Parses "S/n"; nullopt when the text is not of that form, the symbol is not one of
/// amplitude_bases(), or n is not a positive finite number.
std::optional<Amplitude> parse_amplitude(std::string_view text);

/// An amplitude of a fixed length [mm], >= 0.
Amplitude amplitude_mm(double millimetres);

}  // namespace rotcap
