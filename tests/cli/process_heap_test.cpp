// Specification of the program's heap setup (src/cli/process_heap.cpp): the main heap is grown
// once and advised for transparent huge pages, a thread's heap is writable whole and advised
// too, and what is freed stays in the heap for reuse. The settings are glibc's (mallopt(3),
// madvise(2), end(3) of the Linux man-pages); a sanitizer brings an allocator of its own, so
// there is nothing to check under one. Each spec needs a heap as fresh as the program's at
// start: ctest runs each in a process of its own (the runner sifter_heap_tests); by hand, run
// one at a time (--gtest_filter), since the reservation of one leaves the next a heap already
// grown.
#include "cli/process_heap.hpp"

#include <gtest/gtest.h>

#include <cstdint>
#include <cstdlib>
#include <cstring>
#include <fstream>
#include <sstream>
#include <string>
#include <thread>
#include <utility>

#if defined(__GLIBC__)
#include <unistd.h>
#endif

#if defined(__SANITIZE_ADDRESS__)
#define SIFTER_OWN_ALLOCATOR 1
#elif defined(__has_feature)
#if __has_feature(address_sanitizer)
#define SIFTER_OWN_ALLOCATOR 1
#endif
#endif

namespace sifter::cli {
namespace {

constexpr std::size_t kMiB = std::size_t{1} << 20;

/// The mapping of /proc/self/smaps that holds an address: its bounds and its VmFlags line.
struct Mapping {
  std::uintptr_t lo = 0;
  std::uintptr_t hi = 0;
  std::string flags;
};

Mapping mapping_of(std::uintptr_t address) {
  std::ifstream smaps("/proc/self/smaps");
  std::string line;
  Mapping found;
  bool inside = false;
  while (std::getline(smaps, line)) {
    std::uintptr_t lo = 0;
    std::uintptr_t hi = 0;
    char dash = 0;
    std::istringstream head(line);
    if (head >> std::hex >> lo >> dash >> hi && dash == '-') {
      inside = lo <= address && address < hi;
      if (inside) found = {lo, hi, {}};
      continue;
    }
    if (inside && line.rfind("VmFlags:", 0) == 0) found.flags = line;
  }
  return found;
}

TEST(ProcessHeap, TheReservationIsAtMostHalfThePhysicalMemoryAndFitsGlibcsPadding) {
  const std::size_t reserve = default_heap_reserve();
  EXPECT_GT(reserve, 0u);
  EXPECT_LE(reserve, std::size_t{2048} * kMiB) << "M_TOP_PAD is an int";
#if defined(__GLIBC__)
  const auto physical =
      static_cast<std::size_t>(sysconf(_SC_PHYS_PAGES)) * static_cast<std::size_t>(sysconf(_SC_PAGESIZE));
  EXPECT_LE(reserve, physical / 2);
#endif
}

/// Why a spec of the setup cannot run here, or "" when it can.
std::string cannot_run() {
#if !defined(__GLIBC__) || defined(SIFTER_OWN_ALLOCATOR)
  return "glibc's allocator is not the one in use";
#else
  if (!std::ifstream("/sys/kernel/mm/transparent_hugepage/enabled")) return "this kernel has no transparent huge pages";
  std::ifstream overcommit("/proc/sys/vm/overcommit_memory");
  int mode = 0;
  if (overcommit >> mode && mode == 2) return "strict overcommit: the setup reserves nothing";
  return {};
#endif
}

TEST(ProcessHeap, TheMainHeapGrowsOnceByTheReservationAdvisedForHugePagesAndKeepsIt) {
  if (const auto why = cannot_run(); !why.empty()) GTEST_SKIP() << why;
  const HeapSetup setup = prepare_process_heap(64 * kMiB);
  ASSERT_TRUE(setup.glibc);
  // Whole huge pages of what the break moved by: at least the reservation less a huge page at
  // each end for the alignment.
  EXPECT_GE(setup.reserved, 60 * kMiB);
  EXPECT_LE(setup.reserved, 66 * kMiB);
  EXPECT_EQ(setup.reserved_at % (2 * kMiB), 0u);
  // The probe was freed, and the heap was not trimmed back: the break is still beyond it.
  const auto brk_now = reinterpret_cast<std::uintptr_t>(sbrk(0));
  EXPECT_GE(brk_now, setup.reserved_at + setup.reserved);
  const std::string flags = mapping_of(setup.reserved_at).flags;
  EXPECT_NE(flags.find(" hg"), std::string::npos) << "the mapping is not advised: " << flags;
  // The next block of a few MiB comes out of what the break moved by (which begins less than a
  // huge page before the advised part), and freeing it gives nothing back.
  void* block = std::malloc(4 * kMiB);
  ASSERT_NE(block, nullptr);
  std::memset(block, 1, 4 * kMiB);
  const auto at = reinterpret_cast<std::uintptr_t>(block);
  EXPECT_GE(at, setup.reserved_at - 2 * kMiB);
  EXPECT_LE(at + 4 * kMiB, setup.reserved_at + setup.reserved);
  std::free(block);
  EXPECT_EQ(reinterpret_cast<std::uintptr_t>(sbrk(0)), brk_now);
}

/// The mapping that holds a small block a new thread allocates, and whether the thread's
/// advise_thread_heap was taken.
std::pair<Mapping, bool> new_threads_heap() {
  bool advised = false;
  Mapping heap;
  std::thread([&] {
    advised = advise_thread_heap();
    void* block = std::malloc(64);
    heap = mapping_of(reinterpret_cast<std::uintptr_t>(block));
    std::free(block);
  }).join();
  return {heap, advised};
}

TEST(ProcessHeap, AThreadsOwnHeapIsWritableWholeAndAdvisedForHugePagesAndTheMainThreadsIsNot) {
  if (const auto why = cannot_run(); !why.empty()) GTEST_SKIP() << why;
  ASSERT_GT(prepare_process_heap(64 * kMiB).reserved, 0u);
  EXPECT_FALSE(advise_thread_heap()) << "the main thread's heap is the reservation's business";
  const auto [heap, advised] = new_threads_heap();
  EXPECT_TRUE(advised);
  EXPECT_NE(heap.flags.find(" hg"), std::string::npos) << "the thread's heap is not advised: " << heap.flags;
  // The heap is one writable mapping of 64 MiB (glibc's HEAP_MAX_SIZE on 64 bits), made so
  // when the thread's arena was created, rather than a few pages grown at a time.
  EXPECT_EQ(heap.hi - heap.lo, 64 * kMiB);
  EXPECT_NE(heap.flags.find(" wr"), std::string::npos) << heap.flags;
}

TEST(ProcessHeap, WithoutAReservationAThreadsHeapGrowsAsGlibcMakesIt) {
  if (const auto why = cannot_run(); !why.empty()) GTEST_SKIP() << why;
  const HeapSetup setup = prepare_process_heap(0);  // below two huge pages: nothing reserved
  EXPECT_EQ(setup.reserved, 0u);
  const Mapping heap = new_threads_heap().first;
  EXPECT_LT(heap.hi - heap.lo, 64 * kMiB) << "a thread's heap made writable whole for nothing";
}

}  // namespace
}  // namespace sifter::cli
