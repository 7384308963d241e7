#pragma once
// The driver shared by the harnesses: one function, run_one(text, quiet) -> Outcome, is fuzzed.
//
// Built with afl-clang-fast++ (ROTCAP_FUZZ=ON and CXX=afl-clang-fast++, see scripts/fuzz.sh) the
// program runs in AFL++ persistent mode: many inputs per process, read from AFL's shared-memory
// buffer, and an input whose outcome is Outcome::kBug aborts. Built by any other compiler it is a
// replay tool: `harness FILE...` runs every file once, prints "<file>: <outcome>" and exits 0 when
// every file is fine or bad input, 1 when any is a bug (tests/fuzz replays the corpus this way).

#include "fuzz/fuzz_outcome.hpp"

#include <cstdlib>
#include <fstream>
#include <iostream>
#include <sstream>
#include <string>
#include <string_view>

namespace rotcap::fuzz {
Outcome run_one(std::string_view text, bool quiet);
}  // namespace rotcap::fuzz

#ifdef __AFL_FUZZ_TESTCASE_LEN
#include <unistd.h>  // read(), used by AFL's macros

__AFL_FUZZ_INIT();

int main() {
  __AFL_INIT();
  const unsigned char* buffer = __AFL_FUZZ_TESTCASE_BUF;
  while (__AFL_LOOP(10000)) {
    const auto length = static_cast<std::size_t>(__AFL_FUZZ_TESTCASE_LEN);
    const std::string_view text(reinterpret_cast<const char*>(buffer), length);
    if (rotcap::fuzz::run_one(text, true) == rotcap::fuzz::Outcome::kBug) std::abort();
  }
  return 0;
}
#else
int main(int argc, char** argv) {
  if (argc < 2) {
    std::cerr << "usage: " << argv[0] << " FILE...\n";
    return 2;
  }
  int status = 0;
  for (int i = 1; i < argc; ++i) {
    std::ifstream in(argv[i], std::ios::binary);
    if (!in) {
      std::cerr << argv[i] << ": cannot be read\n";
      status = 1;
      continue;
    }
    std::ostringstream text;
    text << in.rdbuf();
    const rotcap::fuzz::Outcome outcome = rotcap::fuzz::run_one(text.str(), false);
    std::cout << argv[i] << ": " << rotcap::fuzz::outcome_name(outcome) << "\n";
    if (outcome == rotcap::fuzz::Outcome::kBug) status = 1;
  }
  return status;
}
#endif
