#pragma once
// Helpers for tests/io: paths of tests/data files, a scratch folder per test, and a check that a
// call throws InputError whose message contains given parts.
#include "io/input_error.hpp"

#include <gtest/gtest.h>

#include <filesystem>
#include <fstream>
#include <initializer_list>
#include <sstream>
#include <string>
#include <unistd.h>

namespace rotcap::testing {

inline std::filesystem::path data_file(const std::string& name) {
  return std::filesystem::path(ROTCAP_TEST_DATA_DIR) / name;
}

inline std::string read_text(const std::filesystem::path& file) {
  std::ifstream in(file, std::ios::binary);
  std::ostringstream s;
  s << in.rdbuf();
  return s.str();
}

inline void write_text(const std::filesystem::path& file, const std::string& text) {
  std::ofstream(file, std::ios::binary) << text;
}

/// A fresh, empty folder named after the running test, removed with everything in it when the
/// object goes out of scope.
class ScratchFolder {
 public:
  ScratchFolder() {
    const auto* info = ::testing::UnitTest::GetInstance()->current_test_info();
    path_ = std::filesystem::temp_directory_path() /
            ("rotcap_io_" + std::string(info->test_suite_name()) + "_" + info->name() + "_" +
             std::to_string(::getpid()));
    std::filesystem::remove_all(path_);
    std::filesystem::create_directories(path_);
  }
  ~ScratchFolder() {
    std::error_code ec;
    std::filesystem::remove_all(path_, ec);
  }
  ScratchFolder(const ScratchFolder&) = delete;
  ScratchFolder& operator=(const ScratchFolder&) = delete;
  const std::filesystem::path& path() const { return path_; }
  std::filesystem::path operator/(const std::string& name) const { return path_ / name; }

 private:
  std::filesystem::path path_;
};

/// Runs f and checks it throws InputError (not any other exception) whose what() contains every
/// one of parts. Returns the message for further checks ("" when nothing matching was thrown).
template <class F>
std::string expect_input_error(F&& f, std::initializer_list<std::string> parts) {
  try {
    f();
  } catch (const InputError& e) {
    const std::string m = e.what();
    for (const std::string& p : parts) EXPECT_NE(m.find(p), std::string::npos) << "'" << p << "' not in: " << m;
    return m;
  } catch (const std::exception& e) {
    ADD_FAILURE() << "expected InputError, got another exception: " << e.what();
    return "";
  }
  ADD_FAILURE() << "expected InputError, nothing was thrown";
  return "";
}

}  // namespace rotcap::testing
