// Sets up glibc's allocator once, before any work: see process_heap.hpp for why.
#include "process_heap.hpp"

#include <algorithm>
#include <climits>
#include <cstdint>
#include <cstdlib>
#include <fstream>
#include <string_view>

#if defined(__GLIBC__)
#include <malloc.h>
#include <sys/mman.h>
#include <unistd.h>
#if __GLIBC_PREREQ(2, 33)  // mallinfo2
#define SIFTER_GLIBC_HEAP 1
extern char end;  // the first address past the program's data (end(3))
#endif
#endif

namespace sifter::cli {

#if defined(SIFTER_GLIBC_HEAP)
namespace {

constexpr std::size_t kHugePage = std::size_t{2} << 20;  // x86-64's transparent huge page
/// glibc's largest mmap threshold on 64 bits: every block below it comes from a heap.
constexpr std::size_t kLargestHeapBlock = std::size_t{32} << 20;
/// The size and alignment of the heap glibc maps for a thread's arena (HEAP_MAX_SIZE, 64 bits).
constexpr std::uintptr_t kThreadHeap = std::uintptr_t{64} << 20;
constexpr int kDefaultTopPad = 128 << 10;  // glibc's M_TOP_PAD when nobody sets it

/// Under strict overcommit (mode 2) address space made writable is charged at once: a
/// reservation of gigabytes would take the commit limit from everything else.
bool strict_overcommit() {
  std::ifstream mode("/proc/sys/vm/overcommit_memory");
  int value = 0;
  return mode >> value && value == 2;
}

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
  // Advise the whole huge pages of what was added (nothing when the break did not move: another
  // allocator, or a break that could not grow).
  const std::uintptr_t first = (before + kHugePage - 1) & ~(kHugePage - 1);
  const std::uintptr_t last = after & ~(kHugePage - 1);
  if (last > first && madvise(reinterpret_cast<void*>(first), last - first, MADV_HUGEPAGE) == 0) {
    setup.reserved_at = first;
    setup.reserved = last - first;
  }
  // A thread's heap made writable whole only pays where advise_thread_heap advises it, which
  // the program does only when the main heap was reserved.
  mallopt(M_TOP_PAD, setup.reserved > 0 ? static_cast<int>(kThreadHeap) : kDefaultTopPad);
}

}  // namespace
#endif

bool plain_heap_requested() {
  const char* plain = std::getenv("SIFTER_PLAIN_HEAP");
  return plain != nullptr && std::string_view(plain) == "1";
}

std::size_t default_heap_reserve() {
  std::size_t reserve = static_cast<std::size_t>(INT_MAX) + 1 - (std::size_t{2} << 20);
#if defined(SIFTER_GLIBC_HEAP)
  const long pages = sysconf(_SC_PHYS_PAGES);
  const long page = sysconf(_SC_PAGESIZE);
  if (pages > 0 && page > 0)
    reserve = std::min(reserve, static_cast<std::size_t>(pages) * static_cast<std::size_t>(page) / 2);
#endif
  return reserve;
}

HeapSetup prepare_process_heap(std::size_t reserve) {
  HeapSetup setup;
#if defined(SIFTER_GLIBC_HEAP)
  setup.glibc = true;
  if (strict_overcommit()) return setup;
  // Never trim a heap's top nor let a large block live in a mapping of its own: memory freed
  // stays for the next allocation instead of being faulted in again.
  mallopt(M_TRIM_THRESHOLD, INT_MAX);
  mallopt(M_MMAP_THRESHOLD, static_cast<int>(kLargestHeapBlock));
  reserve = std::min(reserve, static_cast<std::size_t>(INT_MAX) + 1 - kHugePage);
  if (reserve >= 2 * kHugePage) reserve_main_heap(reserve, setup);
#else
  (void)reserve;
#endif
  return setup;
}

bool advise_thread_heap() {
#if defined(SIFTER_GLIBC_HEAP)
  void* volatile block = std::malloc(1);  // volatile: kept, not folded away
  const auto at = reinterpret_cast<std::uintptr_t>(block);
  std::free(block);
  if (at == 0) return false;
  // The main heap lies between the end of the program's data and the break.
  if (at >= reinterpret_cast<std::uintptr_t>(&::end) && at < reinterpret_cast<std::uintptr_t>(sbrk(0))) return false;
  return madvise(reinterpret_cast<void*>(at & ~(kThreadHeap - 1)), kThreadHeap, MADV_HUGEPAGE) == 0;
#else
  return false;
#endif
}

}  // namespace sifter::cli
