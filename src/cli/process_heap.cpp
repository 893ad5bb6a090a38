// Restarts the program under glibc's heap tunables: see process_heap.hpp for why.
#include "process_heap.hpp"

#include <cstdint>
#include <cstdlib>
#include <fstream>
#include <string>
#include <string_view>

#if defined(__GLIBC__)
#include <elf.h>
#include <link.h>
#include <sys/auxv.h>
#include <sys/stat.h>
#include <unistd.h>
#if __GLIBC_PREREQ(2, 35)  // glibc.malloc.hugetlb
#define SIFTER_CAN_RESTART_WITH_TUNABLES 1
#endif
#endif
// A sanitizer brings an allocator of its own.
#if defined(__SANITIZE_ADDRESS__) || defined(__SANITIZE_THREAD__) || defined(__SANITIZE_HWADDRESS__)
#undef SIFTER_CAN_RESTART_WITH_TUNABLES
#elif defined(__has_feature)
#if __has_feature(address_sanitizer) || __has_feature(thread_sanitizer) || __has_feature(memory_sanitizer) || \
    __has_feature(hwaddress_sanitizer)
#undef SIFTER_CAN_RESTART_WITH_TUNABLES
#endif
#endif

namespace sifter::cli {

#if defined(SIFTER_CAN_RESTART_WITH_TUNABLES)
namespace {

bool is_set(const char* name) { return std::getenv(name) != nullptr; }

bool strict_overcommit() {
  std::ifstream mode("/proc/sys/vm/overcommit_memory");
  int value = 0;
  return mode >> value && value == 2;
}

/// Whether the kernel started the loader rather than the program (`ld.so sifter ...`: then
/// /proc/self/exe is the loader): /proc/self/exe is the file the program's PT_INTERP names. The
/// program's headers are found through auxv's AT_PHDR (getauxval(3)), which the loader points at
/// the program in either case. A program without an interpreter (linked statically) counts as
/// started by its loader: no restart.
bool started_by_its_loader() {
  const auto* headers = reinterpret_cast<const ElfW(Phdr)*>(getauxval(AT_PHDR));
  const auto count = getauxval(AT_PHNUM);
  if (headers == nullptr) return true;
  const ElfW(Phdr)* self = nullptr;
  const ElfW(Phdr)* interpreter = nullptr;
  for (unsigned long i = 0; i < count; ++i) {
    if (headers[i].p_type == PT_PHDR) self = &headers[i];
    if (headers[i].p_type == PT_INTERP) interpreter = &headers[i];
  }
  if (interpreter == nullptr) return true;
  // Where the program was loaded: the headers' address less their place in the file's image.
  const auto bias = reinterpret_cast<std::uintptr_t>(headers) - (self != nullptr ? self->p_vaddr : 0);
  const char* interpreter_path = reinterpret_cast<const char*>(bias + interpreter->p_vaddr);
  struct stat exe {};
  struct stat loader {};
  if (stat("/proc/self/exe", &exe) != 0 || stat(interpreter_path, &loader) != 0) return false;
  return exe.st_dev == loader.st_dev && exe.st_ino == loader.st_ino;
}

/// The executable's path, or "" when /proc has none.
std::string own_executable() {
  std::string path(4096, '\0');
  const ssize_t length = readlink("/proc/self/exe", path.data(), path.size());
  if (length <= 0 || static_cast<std::size_t>(length) >= path.size()) return {};
  path.resize(static_cast<std::size_t>(length));
  return path;
}

}  // namespace
#endif

HeapEnvironment current_heap_environment() {
  HeapEnvironment e;
#if defined(SIFTER_CAN_RESTART_WITH_TUNABLES)
  const char* plain = std::getenv("SIFTER_PLAIN_HEAP");
  e.plain_heap_asked = plain != nullptr && std::string_view(plain) == "1";
  e.restarted = is_set(kHeapRestartMarker);
  e.own_tunables = is_set("GLIBC_TUNABLES");
  e.preloaded = is_set("LD_PRELOAD");
  e.secure = getauxval(AT_SECURE) != 0;
  e.strict_overcommit = strict_overcommit();
  e.started_by_its_loader = started_by_its_loader();
#endif
  return e;
}

bool heap_restart_wanted(const HeapEnvironment& e) {
#if defined(SIFTER_CAN_RESTART_WITH_TUNABLES)
  return !e.plain_heap_asked && !e.restarted && !e.own_tunables && !e.preloaded && !e.secure && !e.strict_overcommit &&
         !e.started_by_its_loader;
#else
  (void)e;
  return false;
#endif
}

void restart_with_heap_tunables(char** argv) {
#if defined(SIFTER_CAN_RESTART_WITH_TUNABLES)
  if (argv == nullptr || argv[0] == nullptr || !heap_restart_wanted(current_heap_environment())) return;
  const std::string executable = own_executable();
  if (executable.empty()) return;
  if (setenv(kHeapRestartMarker, "1", 1) != 0 || setenv("GLIBC_TUNABLES", kHeapTunables, 1) != 0) return;
  execv(executable.c_str(), argv);  // returns only on failure
  unsetenv("GLIBC_TUNABLES");
  unsetenv(kHeapRestartMarker);
#else
  (void)argv;
#endif
}

}  // namespace sifter::cli
