#pragma once
// The outcome of one fuzz input, shared by the harnesses of this folder (see fuzz/CMakeLists.txt).
//
// Contract of the readers under test: bad input ends in InputError (or a component's OptionError,
// which the command line also maps to exit 2); anything else that escapes (another exception
// type, a crash, an abort, a hang) is a bug. classify_input runs one reader call and returns
// kFine or kBadInput; on any other exception it prints the type and message to stderr and
// returns kBug, and the harness then aborts so that the fuzzer records the input as a crash.

#include "core/option_error.hpp"
#include "io/input_error.hpp"

#include <cstdio>
#include <exception>
#include <typeinfo>

namespace rotcap::fuzz {

enum class Outcome { kFine, kBadInput, kBug };

inline const char* outcome_name(Outcome outcome) {
  switch (outcome) {
    case Outcome::kFine: return "fine";
    case Outcome::kBadInput: return "input error";
    case Outcome::kBug: return "bug";
  }
  return "?";
}

template <class Call>
Outcome classify_input(Call&& call, bool quiet) {
  try {
    call();
    return Outcome::kFine;
  } catch (const InputError& e) {
    if (!quiet) std::fprintf(stderr, "input error: %s\n", e.what());
    return Outcome::kBadInput;
  } catch (const OptionError& e) {
    if (!quiet) std::fprintf(stderr, "option error: %s\n", e.what());
    return Outcome::kBadInput;
  } catch (const std::exception& e) {
    std::fprintf(stderr, "escaped %s: %s\n", typeid(e).name(), e.what());
    return Outcome::kBug;
  } catch (...) {
    std::fprintf(stderr, "escaped an exception of unknown type\n");
    return Outcome::kBug;
  }
}

}  // namespace rotcap::fuzz
