#pragma once
// CurveCsv: curve.csv written one converged step at a time. The header (column names) is fixed
// at construction and written at once; each write_row() formats the values with %.10g (NaN as
// "nan", infinities as "inf" / "-inf") and flushes the row to the operating system, so a run that
// fails or is killed keeps every row written before. Names containing a comma, a quote or a
// newline are quoted as in RFC 4180.
// Errors: a row of the wrong length -> std::invalid_argument (a caller's bug); a file that cannot
// be created or written -> OutputError (io/input_error.hpp).

#include <cstdio>
#include <filesystem>
#include <span>
#include <string>
#include <vector>

namespace rotcap {

class CurveCsv {
 public:
  /// Creates (truncates) file and writes the header line. columns must not be empty.
  CurveCsv(std::filesystem::path file, std::vector<std::string> columns);
  /// Continues an existing file (a resumed run): keeps its header, which must name these columns,
  /// and its first keep_rows rows, drops what follows (rows of steps past the run's last checkpoint,
  /// a partial last line) and appends after them. Throws InputError when the file is missing, has
  /// another header or fewer rows.
  CurveCsv(std::filesystem::path file, std::vector<std::string> columns, std::size_t keep_rows);
  ~CurveCsv();
  CurveCsv(const CurveCsv&) = delete;
  CurveCsv& operator=(const CurveCsv&) = delete;
  CurveCsv(CurveCsv&& other) noexcept;
  CurveCsv& operator=(CurveCsv&& other) noexcept;

  /// One row: values.size() == columns().size().
  void write_row(std::span<const double> values);
  /// Closes the file (also done by the destructor); write_row() afterwards is an error.
  void close();

  const std::filesystem::path& file() const { return file_; }
  const std::vector<std::string>& columns() const { return columns_; }
  std::size_t rows() const { return rows_; }

 private:
  std::filesystem::path file_;
  std::vector<std::string> columns_;
  std::FILE* stream_ = nullptr;
  std::size_t rows_ = 0;
};

}  // namespace rotcap
