// Restarts the program under glibc's heap tunables: see process_heap.hpp for why.
#include "process_heap.hpp"

#include <cstdlib>
#include <string>

#if defined(__GLIBC__)
#include <unistd.h>
#if __GLIBC_PREREQ(2, 35)  // glibc.malloc.hugetlb
#define SIFTER_GLIBC_TUNABLES 1
#endif
#endif
#if defined(__SANITIZE_ADDRESS__)  // a sanitizer brings an allocator of its own
#undef SIFTER_GLIBC_TUNABLES
#elif defined(__has_feature)
#if __has_feature(address_sanitizer)
#undef SIFTER_GLIBC_TUNABLES
#endif
#endif

namespace sifter::cli {

bool heap_restart_wanted(const char* plain_heap, const char* glibc_tunables) {
#if defined(SIFTER_GLIBC_TUNABLES)
  const bool plain = plain_heap != nullptr && std::string_view(plain_heap) == "1";
  return !plain && glibc_tunables == nullptr;
#else
  (void)plain_heap;
  (void)glibc_tunables;
  return false;
#endif
}

void restart_with_heap_tunables(char** argv) {
  if (!heap_restart_wanted(std::getenv("SIFTER_PLAIN_HEAP"), std::getenv("GLIBC_TUNABLES"))) return;
#if defined(SIFTER_GLIBC_TUNABLES)
  const std::string tunables(kHeapTunables);
  if (setenv("GLIBC_TUNABLES", tunables.c_str(), 0) != 0) return;
  execv("/proc/self/exe", argv);  // returns only on failure
  unsetenv("GLIBC_TUNABLES");
#else
  (void)argv;
#endif
}

}  // namespace sifter::cli
