// libFuzzer target: the loader and the whole check path (load, verify, JSON, terminal, CSV).
#include <cstddef>
#include <cstdint>
#include <cstdio>
#include <cstdlib>
#include <exception>

#include "check_path.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string_view text(reinterpret_cast<const char*>(data), size);
  try {
    sifter::fuzzing::run_check_path(text, SIFTER_FUZZ_BASE_DIR);
  } catch (const std::exception& e) {
    // Anything but a refused input is a finding: report it and let libFuzzer keep the input.
    std::fprintf(stderr, "fuzz_check: escaped exception: %s\n", e.what());
    std::abort();
  }
  return 0;
}
