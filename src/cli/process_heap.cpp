// Sets up glibc's allocator once, before any work: see process_heap.hpp for why.
#include "process_heap.hpp"

#include <algorithm>
#include <climits>
#include <cstdint>
#include <cstdlib>
#include <string_view>

#if defined(__GLIBC__)
#include <malloc.h>
#include <sys/mman.h>
#include <unistd.h>

extern char end;  // the first address past the program's data (end(3))
#endif

namespace sifter::cli {

namespace {

constexpr std::size_t kHugePage = std::size_t{2} << 20;  // x86-64's transparent huge page
/// glibc's largest mmap threshold on 64 bits: every block below it comes from a heap.
constexpr std::size_t kLargestHeapBlock = std::size_t{32} << 20;
/// The size and alignment of the heap glibc maps for a thread's arena (HEAP_MAX_SIZE, 64 bits).
constexpr std::uintptr_t kThreadHeap = std::uintptr_t{64} << 20;

#if defined(__GLIBC__)
/// Grows the main heap by `reserve` bytes of address space and advises them; see the header.
void reserve_main_heap(std::size_t reserve, HeapSetup& setup) {
  // A request larger than all the heap holds free makes the allocator extend the break by the
  // request plus the padding. At the start of main the heap is nearly empty; in a process whose
  // free memory is beyond a heap block, give up.
  const std::size_t probe_size = mallinfo2().fordblks + 4096;
  if (probe_size >= kLargestHeapBlock) return;
  mallopt(M_TOP_PAD, static_cast<int>(reserve));
  const auto before = reinterpret_cast<std::uintptr_t>(sbrk(0));
  void* volatile probe = std::malloc(probe_size);  // volatile: kept, not folded away
  const auto after = reinterpret_cast<std::uintptr_t>(sbrk(0));
  std::free(probe);
  mallopt(M_TOP_PAD, static_cast<int>(kThreadHeap));
  // Advise the whole huge pages of what was added (nothing when the break did not move).
  const std::uintptr_t first = (before + kHugePage - 1) & ~(kHugePage - 1);
  const std::uintptr_t last = after & ~(kHugePage - 1);
  if (last <= first) return;
  setup.reserved_at = first;
  setup.reserved = last - first;
  setup.huge_page_advice = madvise(reinterpret_cast<void*>(first), last - first, MADV_HUGEPAGE) == 0;
}
#endif

}  // namespace

bool plain_heap_requested() {
  const char* plain = std::getenv("SIFTER_PLAIN_HEAP");
  return plain != nullptr && *plain != '\0' && std::string_view(plain) != "0";
}

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
  // Never trim a heap's top nor let a large block live in a mapping of its own: memory freed
  // stays for the next allocation instead of being faulted in again.
  mallopt(M_TRIM_THRESHOLD, INT_MAX);
  mallopt(M_MMAP_THRESHOLD, static_cast<int>(kLargestHeapBlock));
  // A thread's heap is made writable whole when it is created, not a few pages at a time: a huge
  // page can only back 2 MiB that are writable in one piece. The main heap grows by as much.
  mallopt(M_TOP_PAD, static_cast<int>(kThreadHeap));
  reserve = std::min(reserve, static_cast<std::size_t>(INT_MAX) + 1 - kHugePage);
  if (reserve >= 2 * kHugePage) reserve_main_heap(reserve, setup);
#else
  (void)reserve;
#endif
  return setup;
}

bool advise_thread_heap() {
#if defined(__GLIBC__)
  void* volatile block = std::malloc(1);  // volatile: kept, not folded away
  const auto at = reinterpret_cast<std::uintptr_t>(block);
  std::free(block);
  if (at == 0) return false;
  // The main heap lies between the end of the program's data and the break.
  if (at >= reinterpret_cast<std::uintptr_t>(&end) && at < reinterpret_cast<std::uintptr_t>(sbrk(0))) return false;
  return madvise(reinterpret_cast<void*>(at & ~(kThreadHeap - 1)), kThreadHeap, MADV_HUGEPAGE) == 0;
#else
  return false;
#endif
}

}  // namespace sifter::cli
