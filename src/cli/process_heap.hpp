#pragma once
// How the program sets up its heap before any work (the library leaves the allocator alone).
#include <cstddef>
#include <cstdint>

namespace sifter::cli {

/// What prepare_process_heap did, for tests and for the curious.
struct HeapSetup {
  bool glibc = false;              ///< built against glibc (2.33 or later), whose allocator the settings are for
  std::uintptr_t reserved_at = 0;  ///< where the reserved, advised part of the main heap begins
  std::size_t reserved = 0;        ///< its bytes; 0 when nothing was reserved (then set no thread start)
};

/// Sets up glibc's allocator for a run over a large register, once, at the start of main.
///
/// Why: on the virtualised 2-core machine of the benchmarks, the first touch of a page costs
/// about 5 microseconds (a fault into the kernel), and a run over a 10,000-SIF register touched
/// 65,000 pages of 4 KiB; perf put a fifth of its CPU samples in the page-fault path
/// (tests/bench/RESULTS.md).
///
/// What:
/// - memory the program frees is kept for reuse rather than handed back and faulted in again
///   (no trim of a heap's top; blocks up to 32 MiB come from a heap);
/// - the main heap is grown once, by `reserve` bytes of address space (no memory is backed until
///   touched), which is advised for transparent huge pages, so that a first touch maps 2 MiB
///   rather than 4 KiB;
/// - once that worked, the heap glibc makes for a thread is made writable whole (64 MiB of
///   address space) when it is created, so that advise_thread_heap can give it huge pages too.
///
/// Nothing is reserved under strict overcommit (vm.overcommit_memory = 2, where address space
/// made writable is charged at once), with another allocator (a sanitizer's or a preloaded one:
/// the break does not move, and glibc's settings reach nobody), or where the kernel refuses the
/// advice; the run is then only slower. Nothing here changes a result.
HeapSetup prepare_process_heap(std::size_t reserve);

/// Advises the heap of the calling thread for transparent huge pages, when it has one of its own.
/// Only for a program whose prepare_process_heap reserved the main heap (glibc's allocator is
/// the one in use).
///
/// glibc gives a thread other than the main one a heap of its own: a mapping of 64 MiB aligned
/// on 64 MiB (its HEAP_MAX_SIZE on 64 bits), with further such mappings when it is full. The
/// mapping that holds a small block this thread allocates is advised whole; a later one is not.
/// Returns whether the kernel took the advice; false on the main thread, whose heap is below the
/// program break. The advice only changes the size of pages, never what memory holds.
bool advise_thread_heap();

/// Whether the environment asks to leave glibc's allocator as it is: SIFTER_PLAIN_HEAP=1. For
/// comparing the two, for profilers that run the program on an allocator of their own
/// (valgrind's tools), or for ruling the setup out when hunting a problem.
bool plain_heap_requested();

/// The reservation main asks for: 2 GiB less 2 MiB (glibc's padding setting is an int), or half
/// the physical memory when that is less.
std::size_t default_heap_reserve();

}  // namespace sifter::cli
