#include "io/curve_csv.hpp"
#include "core/text_format.hpp"

#include "io/atomic_file.hpp"
#include "io/input_error.hpp"

#include <fstream>

#include <cerrno>
#include <cmath>
#include <cstring>
#include <stdexcept>
#include <utility>

namespace rotcap {

namespace {

std::string csv_name(const std::string& name) {
  if (name.find_first_of(",\"\n\r") == std::string::npos) return name;
  std::string q = "\"";
  for (char c : name) q += (c == '"') ? std::string("\"\"") : std::string(1, c);
  return q + "\"";
}

std::string csv_value(double v) {
  if (std::isnan(v)) return "nan";
  if (std::isinf(v)) return v > 0 ? "inf" : "-inf";
  return format_number(v);
}

}  // namespace

CurveCsv::CurveCsv(std::filesystem::path file, std::vector<std::string> columns)
    : file_(std::move(file)), columns_(std::move(columns)) {
  if (columns_.empty()) throw std::invalid_argument("CurveCsv: no columns");
  stream_ = std::fopen(file_.c_str(), "w");
  if (stream_ == nullptr) throw OutputError(file_, std::strerror(errno));
  std::string header;
  for (std::size_t i = 0; i < columns_.size(); ++i) header += (i ? "," : "") + csv_name(columns_[i]);
  header += "\n";
  if (std::fputs(header.c_str(), stream_) < 0 || std::fflush(stream_) != 0)
    throw OutputError(file_, std::strerror(errno));
}

CurveCsv::CurveCsv(std::filesystem::path file, std::vector<std::string> columns, std::size_t keep_rows)
    : file_(std::move(file)), columns_(std::move(columns)) {
  if (columns_.empty()) throw std::invalid_argument("CurveCsv: no columns");
  std::string header;
  for (std::size_t i = 0; i < columns_.size(); ++i) header += (i ? "," : "") + csv_name(columns_[i]);
  header += "\n";
  std::ifstream in(file_, std::ios::binary);
  if (!in) throw InputError(file_, 0, "", "no file", "the curve.csv of the run to continue");
  std::string kept, line;
  std::getline(in, line);
  if (line + "\n" != header) throw InputError(file_, 1, "", "header \"" + line + "\"", "\"" + header.substr(0, header.size() - 1) + "\"");
  kept = header;
  while (rows_ < keep_rows && std::getline(in, line) && !in.eof()) {  // a last line without its newline is partial
    kept += line + "\n";
    ++rows_;
  }
  if (rows_ < keep_rows)
    throw InputError(file_, 0, "", std::to_string(rows_) + " whole rows",
                     "at least " + std::to_string(keep_rows) + " (the steps of the checkpoint)");
  in.close();
  write_file_atomically(file_, kept);
  stream_ = std::fopen(file_.c_str(), "a");
  if (stream_ == nullptr) throw OutputError(file_, std::strerror(errno));
}

CurveCsv::~CurveCsv() {
  if (stream_ != nullptr) std::fclose(stream_);
}

CurveCsv::CurveCsv(CurveCsv&& other) noexcept
    : file_(std::move(other.file_)),
      columns_(std::move(other.columns_)),
      stream_(std::exchange(other.stream_, nullptr)),
      rows_(other.rows_) {}

CurveCsv& CurveCsv::operator=(CurveCsv&& other) noexcept {
  if (this != &other) {
    if (stream_ != nullptr) std::fclose(stream_);
    file_ = std::move(other.file_);
    columns_ = std::move(other.columns_);
    stream_ = std::exchange(other.stream_, nullptr);
    rows_ = other.rows_;
  }
  return *this;
}

void CurveCsv::write_row(std::span<const double> values) {
  if (values.size() != columns_.size())
    throw std::invalid_argument("CurveCsv::write_row: " + std::to_string(values.size()) +
                                " values for " + std::to_string(columns_.size()) + " columns");
  if (stream_ == nullptr) throw std::logic_error("CurveCsv::write_row after close()");
  std::string line;
  for (std::size_t i = 0; i < values.size(); ++i) line += (i ? "," : "") + csv_value(values[i]);
  line += "\n";
  if (std::fputs(line.c_str(), stream_) < 0 || std::fflush(stream_) != 0)
    throw OutputError(file_, std::strerror(errno));
  ++rows_;
}

void CurveCsv::close() {
  if (stream_ == nullptr) return;
  const int rc = std::fclose(stream_);
  stream_ = nullptr;
  if (rc != 0) throw OutputError(file_, std::strerror(errno));
}

}  // namespace rotcap
