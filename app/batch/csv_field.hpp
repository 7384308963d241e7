#pragma once
// One field of the batch's CSV files (status.csv, results.csv, study.csv), RFC 4180: quoted when
// it holds a comma, a quote or a newline (quotes doubled, newlines as spaces).
#include <string>

namespace rotcap::app {

inline std::string csv_field(const std::string& text) {
  if (text.find_first_of(",\"\n") == std::string::npos) return text;
  std::string q = "\"";
  for (char c : text) q += c == '"' ? std::string("\"\"") : std::string(1, c == '\n' ? ' ' : c);
  return q + "\"";
}

}  // namespace rotcap::app
