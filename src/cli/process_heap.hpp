#pragma once
// How the program has glibc set up its heap before any work (the library leaves the allocator
// alone).
#include <string_view>

namespace sifter::cli {

/// The glibc tunables the program runs under (glibc manual, "Memory Allocation Tunables"):
/// - `glibc.malloc.hugetlb=1` (glibc 2.35 and later): every heap glibc grows or maps is advised
///   for transparent huge pages, so that a first touch maps 2 MiB rather than 4 KiB;
/// - `glibc.malloc.top_pad=67108864`: a heap grows by 64 MiB at a time, so that the advice
///   covers whole huge pages and a thread's heap is not grown a few pages at a time.
///
/// Why: on the virtualised 2-core machine of the benchmarks, the first touch of a page costs
/// about 5 microseconds, and a run over a 10,000-SIF register touched 65,000 pages of 4 KiB;
/// perf put a fifth of its CPU samples in the page-fault path (tests/bench/RESULTS.md).
inline constexpr std::string_view kHeapTunables = "glibc.malloc.hugetlb=1:glibc.malloc.top_pad=67108864";

/// Whether the program should restart itself under kHeapTunables, given the environment's
/// SIFTER_PLAIN_HEAP and GLIBC_TUNABLES (nullptr when unset). Not when SIFTER_PLAIN_HEAP is 1
/// (for comparing, for valgrind's tools, or for ruling the setup out), nor when GLIBC_TUNABLES
/// is set already (the user's own settings stand; after the restart, they are these), nor where
/// glibc's allocator is not the one in use or lacks the tunables (a sanitizer's build, another
/// C library, glibc before 2.35).
bool heap_restart_wanted(const char* plain_heap, const char* glibc_tunables);

/// Restarts the program with GLIBC_TUNABLES set to kHeapTunables when heap_restart_wanted says
/// so: the same executable (/proc/self/exe) with the same arguments, standard streams and
/// environment. glibc reads its tunables only when a process starts, so main calls this first,
/// before it reads or writes anything. Returns only when it did not restart: not wanted, or the
/// exec failed (no /proc, say); the run then goes on under glibc's defaults, only slower.
/// Nothing here changes a result.
void restart_with_heap_tunables(char** argv);

}  // namespace sifter::cli
