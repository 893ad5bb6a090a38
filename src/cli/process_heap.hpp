#pragma once
// How the program sets up its heap before any work (the library leaves the allocator alone).
#include <cstddef>
#include <cstdint>

namespace sifter::cli {

/// What prepare_process_heap did, for tests and for the curious.
struct HeapSetup {
  bool glibc = false;              ///< built against glibc, whose allocator the settings are for
  std::uintptr_t reserved_at = 0;  ///< where the reserved part of the main heap begins
  std::size_t reserved = 0;        ///< bytes of the main heap reserved and advised for huge pages
  bool huge_page_advice = false;   ///< the kernel took the advice (madvise returned 0)
};

/// Sets up glibc's allocator for a run over a large register, once, at the start of main.
///
/// Why: on the virtualised 2-core machine of the benchmarks, the first touch of a page costs
/// about 5 microseconds (a fault into the kernel), and a run over a 10,000-SIF register touched
/// 65,000 pages of 4 KiB: about a quarter of its wall time (tests/bench/RESULTS.md).
///
/// What:
/// - memory the program frees is kept for reuse rather than handed back and faulted in again;
/// - the main heap is grown once, by `reserve` bytes of address space (no memory is backed until
///   touched), which is advised for transparent huge pages, so that a first touch maps 2 MiB
///   rather than 4 KiB;
/// - the heap glibc makes for a thread is made writable whole (64 MiB of address space) when
///   it is created, so that advise_thread_heap can give it huge pages too.
///
/// Every step is optional: with another allocator (a sanitizer's), a kernel that refuses the
/// advice or a heap that cannot grow, the allocator is left working as before and the run is
/// only slower. Nothing here changes a result.
HeapSetup prepare_process_heap(std::size_t reserve);

/// Advises the heap of the calling thread for transparent huge pages, when it has one of its own.
///
/// glibc gives a thread other than the main one a heap of its own: a mapping of 64 MiB aligned
/// on 64 MiB (its HEAP_MAX_SIZE on 64 bits), grown in place, with further such mappings when it
/// is full. The mapping that holds a block this thread allocates is advised whole; a later one
/// is not. Returns whether the kernel took the advice: false on the main thread (whose heap is
/// below the program break and set up by prepare_process_heap), with another allocator, or
/// where the 64 MiB around the block are not one mapping (madvise refuses unmapped parts).
/// An advice on memory that is not a heap only changes the size of its pages.
bool advise_thread_heap();

/// Whether the environment asks to leave glibc's allocator as it is: SIFTER_PLAIN_HEAP set to
/// anything but "" or "0". For comparing the two, or ruling the setup out when hunting a problem.
bool plain_heap_requested();

/// The reservation main asks for: 2 GiB less 2 MiB (glibc's padding setting is an int), or half
/// the physical memory when that is less, so that the kernel's overcommit check never refuses it.
std::size_t default_heap_reserve();

}  // namespace sifter::cli
