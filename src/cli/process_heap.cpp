// Sets up glibc's allocator once, before any work: see process_heap.hpp for why.
#include "process_heap.hpp"

#include <algorithm>
#include <climits>
#include <cstdint>
#include <cstdlib>

#if defined(__GLIBC__)
#include <malloc.h>
#include <sys/mman.h>
#include <unistd.h>
#endif

namespace sifter::cli {

namespace {

constexpr std::size_t kHugePage = std::size_t{2} << 20;  // x86-64's transparent huge page
/// glibc's largest mmap threshold on 64 bits: every block below it comes from the heap.
constexpr std::size_t kLargestHeapBlock = std::size_t{32} << 20;

}  // namespace

std::size_t default_heap_reserve() {
  std::size_t reserve = static_cast<std::size_t>(INT_MAX) + 1 - kHugePage;
#if defined(__GLIBC__)
  const long pages = sysconf(_SC_PHYS_PAGES);
  const long page = sysconf(_SC_PAGESIZE);
  if (pages > 0 && page > 0)
    reserve = std::min(reserve, static_cast<std::size_t>(pages) * static_cast<std::size_t>(page) / 2);
#endif
  return reserve;
}

HeapSetup prepare_process_heap(std::size_t reserve) {
  HeapSetup setup;
#if defined(__GLIBC__)
  setup.glibc = true;
  reserve = std::min(reserve, static_cast<std::size_t>(INT_MAX) + 1 - kHugePage);
  // Never trim the heap's top nor let a large block live in a mapping of its own: memory freed
  // stays for the next allocation instead of being faulted in again.
  mallopt(M_TRIM_THRESHOLD, INT_MAX);
  mallopt(M_MMAP_THRESHOLD, static_cast<int>(kLargestHeapBlock));
  if (reserve < 2 * kHugePage) return setup;
  // Grow the main heap once by the reservation: a request larger than all the heap holds free
  // makes the allocator extend the break by the request plus the padding. At the start of main
  // the heap is nearly empty; in a process whose free memory is beyond a heap block, give up.
  const std::size_t probe_size = mallinfo2().fordblks + 4096;
  if (probe_size >= kLargestHeapBlock) return setup;
  mallopt(M_TOP_PAD, static_cast<int>(reserve));
  const auto before = reinterpret_cast<std::uintptr_t>(sbrk(0));
  void* volatile probe = std::malloc(probe_size);  // volatile: kept, not folded away
  const auto after = reinterpret_cast<std::uintptr_t>(sbrk(0));
  std::free(probe);
  mallopt(M_TOP_PAD, 128 << 10);  // glibc's default again for later growth
  // Advise the whole huge pages of what was added (nothing when the break did not move).
  const std::uintptr_t first = (before + kHugePage - 1) & ~(kHugePage - 1);
  const std::uintptr_t last = after & ~(kHugePage - 1);
  if (last > first) {
    setup.reserved_at = first;
    setup.reserved = last - first;
    setup.huge_page_advice = madvise(reinterpret_cast<void*>(first), last - first, MADV_HUGEPAGE) == 0;
  }
#else
  (void)reserve;
#endif
  return setup;
}

}  // namespace sifter::cli
