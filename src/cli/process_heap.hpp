#pragma once
// How the program has glibc set up its heap before any work (the library leaves the allocator
// alone).

namespace sifter::cli {

/// The glibc tunables the program runs under (glibc manual, "Memory Allocation Tunables"):
/// - `glibc.malloc.hugetlb=1` (glibc 2.35 and later): glibc advises the heaps it maps and grows
///   for transparent huge pages (`madvise(MADV_HUGEPAGE)`, madvise(2)), so that a first touch
///   maps 2 MiB rather than 4 KiB. From memory of glibc's source: it does so only when the
///   kernel's mode is "madvise" (in mode "always" the kernel does it unasked), and it advises a
///   thread's heap once, when it creates it;
/// - `glibc.malloc.top_pad=67108864`: a heap grows by 64 MiB at a time, so that a thread's heap
///   is writable and advised whole (64 MiB, glibc's size for it on 64 bits, from memory) when it
///   is created. Setting it also fixes glibc's mmap threshold at 128 KiB (mallopt(3),
///   M_TOP_PAD); keeping blocks up to 32 MiB in a heap as well measured no better.
///
/// Why: on the virtualised 2-core machine of the benchmarks, the first touch of a page costs
/// about 5 microseconds, and a run over a 10,000-SIF register touched 65,000 pages of 4 KiB;
/// perf put a fifth of its CPU samples in the page-fault path (tests/bench/RESULTS.md).
inline constexpr char kHeapTunables[] = "glibc.malloc.hugetlb=1:glibc.malloc.top_pad=67108864";

/// The marker the program sets for its restarted self: never a second restart, whatever glibc
/// does with GLIBC_TUNABLES (a secure-mode process has it removed).
inline constexpr char kHeapRestartMarker[] = "SIFTER_HEAP_RESTARTED";

/// What decides the restart, read from the process (current_heap_environment) or set by a test.
struct HeapEnvironment {
  bool plain_heap_asked = false;       ///< SIFTER_PLAIN_HEAP=1: glibc's heap as it comes
  bool restarted = false;              ///< kHeapRestartMarker is set: this is the restarted program
  bool own_tunables = false;           ///< GLIBC_TUNABLES is set: the user's settings stand
  bool preloaded = false;              ///< LD_PRELOAD is set: another allocator, or valgrind's tools
  bool secure = false;                 ///< a setuid or file-capability start (getauxval(3), AT_SECURE)
  bool strict_overcommit = false;      ///< vm.overcommit_memory = 2: each 64 MiB heap charged at once
  bool started_by_its_loader = false;  ///< /proc/self/exe is the program's interpreter (run as
                                       ///< `ld.so sifter ...`), or it has none (linked statically)
};

/// The environment of this process.
HeapEnvironment current_heap_environment();

/// Whether the program should restart itself under kHeapTunables: only where glibc's allocator
/// is the one in use and has the tunables (not in a sanitizer's build, another C library, glibc
/// before 2.35), and none of HeapEnvironment's reasons against holds.
bool heap_restart_wanted(const HeapEnvironment& environment);

/// Restarts the program under kHeapTunables when heap_restart_wanted says so: the same
/// executable (the path /proc/self/exe links to, so that the process keeps its name), the same
/// arguments, standard streams and environment, plus GLIBC_TUNABLES and kHeapRestartMarker.
/// glibc reads its tunables only when a process starts, so main calls this before anything
/// else. Returns only when it did not restart: not wanted, or the exec failed; the run then goes
/// on under glibc's defaults, only slower. Nothing here changes a result.
void restart_with_heap_tunables(char** argv);

}  // namespace sifter::cli
