// Specification of the program's heap setup (src/cli/process_heap.cpp): the program restarts
// itself once under glibc's heap tunables, which glibc then applies (glibc manual, "Memory
// Allocation Tunables"; /proc/self/smaps of proc(5), whose VmFlags "hg" marks a mapping advised
// for huge pages). The restart spec restarts this runner itself, so the runner has a main of
// its own that keeps the arguments; ctest runs each spec in a process of its own.
#include "cli/process_heap.hpp"

#include <gtest/gtest.h>

#include <cstdint>
#include <cstdlib>
#include <fstream>
#include <sstream>
#include <string>
#include <string_view>
#include <thread>
#include <utility>
#include <vector>

namespace {

std::vector<char*> runner_argv;  // this runner's arguments as given (gtest takes its own out of argv)

}  // namespace

namespace sifter::cli {
namespace {

constexpr std::size_t kMiB = std::size_t{1} << 20;

/// Whether this build can restart under the tunables at all (glibc 2.35 or later, no sanitizer).
bool can_restart() { return heap_restart_wanted(HeapEnvironment{}); }

TEST(ProcessHeap, TheProgramRestartsOnlyWhenNothingSpeaksAgainstIt) {
  if (!can_restart()) GTEST_SKIP() << "glibc's allocator (2.35 or later) is not the one in use";
  const std::pair<const char*, bool HeapEnvironment::*> against[] = {
      {"SIFTER_PLAIN_HEAP=1", &HeapEnvironment::plain_heap_asked},
      {"already restarted: never twice", &HeapEnvironment::restarted},
      {"the user's own GLIBC_TUNABLES stand", &HeapEnvironment::own_tunables},
      {"LD_PRELOAD: another allocator or valgrind", &HeapEnvironment::preloaded},
      {"secure mode: glibc drops GLIBC_TUNABLES", &HeapEnvironment::secure},
      {"strict overcommit", &HeapEnvironment::strict_overcommit},
      {"started by its loader, whose /proc/self/exe is the loader", &HeapEnvironment::started_by_its_loader},
  };
  for (const auto& [why, reason] : against) {
    HeapEnvironment e;
    e.*reason = true;
    EXPECT_FALSE(heap_restart_wanted(e)) << why;
  }
}

TEST(ProcessHeap, ThisRunnerStartedNormallyFindsItsInterpreterAndNoSecureMode) {
  if (!can_restart()) GTEST_SKIP() << "glibc's allocator (2.35 or later) is not the one in use";
  const HeapEnvironment e = current_heap_environment();
  EXPECT_FALSE(e.started_by_its_loader) << "a dynamically linked runner started by the kernel has PT_INTERP";
  EXPECT_FALSE(e.secure);
}

/// The mapping of /proc/self/smaps that holds an address: its bounds and its VmFlags line.
struct Mapping {
  std::uintptr_t lo = 0;
  std::uintptr_t hi = 0;
  std::string flags;
};

Mapping mapping_of(const void* block) {
  const auto address = reinterpret_cast<std::uintptr_t>(block);
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

/// The kernel's mode of transparent huge pages: "always", "madvise", "never", or "" without.
std::string huge_page_mode() {
  std::ifstream enabled("/sys/kernel/mm/transparent_hugepage/enabled");
  std::string word;
  while (enabled >> word)
    if (word.size() > 2 && word.front() == '[') return word.substr(1, word.size() - 2);
  return {};
}

// The first run of this spec restarts the runner (the same arguments: ctest's filter runs this
// spec alone again); the restarted run checks what glibc made of the tunables. An exec that
// failed would leave the first run here without the marker. Run by hand, select this spec alone
// (--gtest_filter): a restart runs every selected spec again.
TEST(ProcessHeap, TheRestartedProgramRunsUnderGlibcsTunablesWithItsHeapsAdvisedForHugePages) {
  if (!can_restart()) GTEST_SKIP() << "glibc's allocator (2.35 or later) is not the one in use";
  if (::testing::UnitTest::GetInstance()->test_to_run_count() != 1)
    GTEST_SKIP() << "select this spec alone: the restart runs every selected spec again";
  ASSERT_FALSE(runner_argv.empty());
  const HeapEnvironment before = current_heap_environment();
  if (!before.restarted && !heap_restart_wanted(before))
    GTEST_SKIP() << "this process asks for no restart (SIFTER_PLAIN_HEAP, GLIBC_TUNABLES, LD_PRELOAD, overcommit)";
  restart_with_heap_tunables(runner_argv.data());
  ASSERT_NE(std::getenv(kHeapRestartMarker), nullptr) << "no restart";
  const char* tunables = std::getenv("GLIBC_TUNABLES");
  ASSERT_NE(tunables, nullptr);
  EXPECT_EQ(std::string_view(tunables), kHeapTunables);
  void* block = std::malloc(64 << 10);  // a heap block (below the mmap threshold)
  ASSERT_NE(block, nullptr);
  const Mapping main_heap = mapping_of(block);
  std::free(block);
  EXPECT_GE(main_heap.hi - main_heap.lo, 64 * kMiB) << "the heap grew by less than the padding";
  // A thread's heap: writable by the padding at once rather than a page at a time.
  Mapping thread_heap;
  std::thread([&thread_heap] {
    void* small = std::malloc(64);
    thread_heap = mapping_of(small);
    std::free(small);
  }).join();
  EXPECT_NE(thread_heap.flags.find(" wr"), std::string::npos) << thread_heap.flags;
  EXPECT_GE(thread_heap.hi - thread_heap.lo, 32 * kMiB);
  // glibc advises what it maps only when the kernel gives huge pages on advice alone.
  if (huge_page_mode() != "madvise") GTEST_SKIP() << "transparent huge pages not in madvise mode: advice not checked";
  EXPECT_NE(main_heap.flags.find(" hg"), std::string::npos) << "the main heap is not advised: " << main_heap.flags;
  EXPECT_NE(thread_heap.flags.find(" hg"), std::string::npos)
      << "a thread's heap is not advised: " << thread_heap.flags;
}

}  // namespace
}  // namespace sifter::cli

int main(int argc, char** argv) {
  runner_argv.assign(argv, argv + argc + 1);  // with the null that ends it
  ::testing::InitGoogleTest(&argc, argv);
  return RUN_ALL_TESTS();
}
