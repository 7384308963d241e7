#pragma once
// Always-on checks of the program's own contracts (a caller passed what a function's contract
// forbids, an index out of range, sizes that do not match). A failed check is a programming error,
// never bad input: it throws InternalError naming the source file and line, and the command line
// reports it as "internal error" with exit code 1. Bad input is reported by OptionError
// (core/option_error.hpp) and io's InputError instead.
#include <stdexcept>
#include <string>

namespace rotcap {

class InternalError : public std::logic_error {
 public:
  using std::logic_error::logic_error;
};

namespace detail {
[[noreturn]] inline void fail_check(const char* condition, const std::string& message, const char* file, int line) {
  throw InternalError(std::string(file) + ":" + std::to_string(line) + ": check failed: " + condition +
                      (message.empty() ? std::string() : ": " + message));
}
}  // namespace detail

}  // namespace rotcap

/// ROTCAP_CHECK(condition, message): InternalError with file, line, the condition and the message
/// (a std::string expression, evaluated only on failure) when the condition is false. Kept in
/// Release builds.
#define ROTCAP_CHECK(condition, message)                                                \
  do {                                                                                  \
    if (!(condition)) ::rotcap::detail::fail_check(#condition, (message), __FILE__, __LINE__); \
  } while (false)
