// Counts the heap allocations of the test executable while an AllocationCounter is alive
// (allocation_counter.hpp). Plain builds interpose the C heap allocation functions and forward to
// glibc's own implementations (__libc_malloc etc.); free() is not wrapped. AddressSanitizer
// builds install the sanitizer's malloc hook instead, which sees every allocation of its
// allocator (malloc, calloc, realloc, aligned allocations, operator new).

#include "tests/allocation_counter.hpp"

#include <cerrno>
#include <cstddef>

#if defined(__SANITIZE_ADDRESS__)
#define ROTCAP_ALLOCATIONS_BY_HOOK 1
#elif defined(__has_feature)
#if __has_feature(address_sanitizer)
#define ROTCAP_ALLOCATIONS_BY_HOOK 1
#endif
#endif

namespace {
// Plain globals: the counting functions may run before static initialisation and from any context.
long g_allocations = 0;
int g_active = 0;
inline void count_one() {
  if (g_active > 0) ++g_allocations;
}
}  // namespace

#if defined(ROTCAP_ALLOCATIONS_BY_HOOK)
// The sanitizers' allocator interface (LLVM compiler-rt, sanitizer/allocator_interface.h; GCC's
// libasan exports it without shipping the header).
extern "C" int __sanitizer_install_malloc_and_free_hooks(void (*malloc_hook)(const volatile void*, std::size_t),
                                                         void (*free_hook)(const volatile void*));
namespace {
void on_malloc(const volatile void*, std::size_t) { count_one(); }
void on_free(const volatile void*) {}
const bool g_hooks_installed = __sanitizer_install_malloc_and_free_hooks(on_malloc, on_free) != 0;
}  // namespace
#else
extern "C" {
void* __libc_malloc(std::size_t size);
void* __libc_calloc(std::size_t count, std::size_t size);
void* __libc_realloc(void* pointer, std::size_t size);
void* __libc_memalign(std::size_t alignment, std::size_t size);

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
#endif

namespace rotcap::testing {

AllocationCounter::AllocationCounter() : start_(g_allocations) {
#if defined(ROTCAP_ALLOCATIONS_BY_HOOK)
  (void)g_hooks_installed;
#endif
  ++g_active;
}
AllocationCounter::~AllocationCounter() { --g_active; }
long AllocationCounter::count() const { return g_allocations - start_; }

}  // namespace rotcap::testing
