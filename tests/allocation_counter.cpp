// Interposes the C heap allocation functions for the test executable and counts the calls while an
// AllocationCounter is alive (allocation_counter.hpp). glibc exports its own implementations as
// __libc_malloc etc., which the wrappers forward to; free() is not wrapped.

#include "tests/corotational/allocation_counter.hpp"

#include <cerrno>
#include <cstddef>

extern "C" {
void* __libc_malloc(std::size_t size);
void* __libc_calloc(std::size_t count, std::size_t size);
void* __libc_realloc(void* pointer, std::size_t size);
void* __libc_memalign(std::size_t alignment, std::size_t size);
}

namespace {
// Plain globals: the wrappers may run before static initialisation and from any context.
long g_allocations = 0;
int g_active = 0;
inline void count_one() {
  if (g_active > 0) ++g_allocations;
}
}  // namespace

extern "C" {
void* malloc(std::size_t size) {
  count_one();
  return __libc_malloc(size);
}
void* calloc(std::size_t count, std::size_t size) {
  count_one();
  return __libc_calloc(count, size);
}
void* realloc(void* pointer, std::size_t size) {
  count_one();
  return __libc_realloc(pointer, size);
}
void* aligned_alloc(std::size_t alignment, std::size_t size) {
  count_one();
  return __libc_memalign(alignment, size);
}
void* memalign(std::size_t alignment, std::size_t size) {
  count_one();
  return __libc_memalign(alignment, size);
}
int posix_memalign(void** out, std::size_t alignment, std::size_t size) {
  count_one();
  void* p = __libc_memalign(alignment, size);
  if (p == nullptr) return ENOMEM;
  *out = p;
  return 0;
}
}

namespace rotcap::testing {

AllocationCounter::AllocationCounter() : start_(g_allocations) { ++g_active; }
AllocationCounter::~AllocationCounter() { --g_active; }
long AllocationCounter::count() const { return g_allocations - start_; }

}  // namespace rotcap::testing
