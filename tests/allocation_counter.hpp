#pragma once
// AllocationCounter: counts heap allocations (malloc, calloc, realloc, aligned allocations, and so
// operator new and Eigen's aligned_malloc, which all end in them) made while it is alive. Used to
// check the rule "no heap allocation inside element loops" (docs/spec/style.md, habit 13) by the
// element and corotational tests. Implemented in allocation_counter.cpp: in a plain build by
// interposing the C allocation functions of the test executable (glibc: forwarding to
// __libc_malloc and friends); in an AddressSanitizer build by the sanitizer's allocation hook
// (ASan owns malloc there: an interposed malloc bypasses it and ASan aborts at start-up).
// Single-threaded use only.

namespace rotcap::testing {

class AllocationCounter {
 public:
  AllocationCounter();
  ~AllocationCounter();
  AllocationCounter(const AllocationCounter&) = delete;
  AllocationCounter& operator=(const AllocationCounter&) = delete;
  /// Allocations since construction.
  long count() const;

 private:
  long start_;
};

}  // namespace rotcap::testing
