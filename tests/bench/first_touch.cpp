// What fresh memory costs on the machine at hand: the time to touch N MiB of newly mapped
// memory once (the kernel zeroes every page on its first touch), with 4 KiB pages and with
// transparent huge pages, against a second pass over the same memory. A run of sifter touches
// about its peak memory fresh, so this gives the floor that peak memory sets on its wall time.
// Usage: sifter_first_touch [MiB] (default 1024). Plain program: one figure per line.
#include <sys/mman.h>

#include <chrono>
#include <cstddef>
#include <cstdio>
#include <cstdlib>
#include <cstring>

namespace {

using Clock = std::chrono::steady_clock;

double seconds_since(Clock::time_point t0) { return std::chrono::duration<double>(Clock::now() - t0).count(); }

// Maps `bytes`, touches one byte per 4 KiB page, then writes all of it again; prints both times.
bool measure(std::size_t bytes, bool huge_pages) {
  void* map = mmap(nullptr, bytes, PROT_READ | PROT_WRITE, MAP_PRIVATE | MAP_ANONYMOUS, -1, 0);
  if (map == MAP_FAILED) return false;
  auto* p = static_cast<volatile char*>(map);
  if (huge_pages) madvise(map, bytes, MADV_HUGEPAGE);  // a hint: the kernel may decline it
  const auto t0 = Clock::now();
  for (std::size_t i = 0; i < bytes; i += 4096) p[i] = 1;
  const double first = seconds_since(t0);
  const auto t1 = Clock::now();
  std::memset(map, 2, bytes);
  const double second = seconds_since(t1);
  std::printf("%-22s %zu MiB: first touch %.3f s (%.2f s per GiB), second pass %.3f s\n",
              huge_pages ? "transparent huge pages" : "4 KiB pages", bytes >> 20, first,
              first * static_cast<double>(std::size_t{1} << 30) / static_cast<double>(bytes), second);
  munmap(map, bytes);
  return true;
}

}  // namespace

int main(int argc, char** argv) {
  const long mib = argc > 1 ? std::strtol(argv[1], nullptr, 10) : 1024;
  if (mib <= 0 || mib > (1L << 20)) {
    std::fprintf(stderr, "sifter_first_touch: expected a size in MiB from 1 to 1048576, found \"%s\"\n", argv[1]);
    return 2;
  }
  const std::size_t bytes = static_cast<std::size_t>(mib) << 20;
  for (int round = 0; round < 3; ++round)
    if (!measure(bytes, false) || !measure(bytes, true)) {
      std::fprintf(stderr, "sifter_first_touch: could not map %ld MiB\n", mib);
      return 1;
    }
  return 0;
}
