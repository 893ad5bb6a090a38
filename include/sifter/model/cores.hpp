#pragma once
/// How sifter spreads its work over the machine's cores. Every place that runs work on more
/// than one thread asks here, so that a requested thread count (`--threads`; 0 for every core)
/// means the same everywhere: with 1, the whole verification stays on the caller's core.
#include <cstddef>
#include <functional>
#include <future>
#include <utility>

namespace sifter {

/// The threads a request allows: `requested` when above 0, else every core; never below 1.
unsigned thread_budget(int requested);

/// Runs body(i) for every i in [0, n) on up to `threads` threads (0: every core) and returns
/// when all are done. When body throws, the exception of the smallest i is re-raised here,
/// whatever the order the threads ran in.
void parallel_for(std::size_t n, int threads, const std::function<void(std::size_t)>& body);

/// What every thread sifter starts does first: nothing, unless the program sets a function
/// here, once, before any thread starts (the sifter program sets up the thread's heap with it;
/// the library leaves the allocator alone). Setting it while threads run is no data race (it
/// is atomic), but a thread already started keeps what it saw.
using ThreadStart = void (*)();
void set_thread_start(ThreadStart start);
/// Runs the function set by set_thread_start, if any; every thread sifter starts calls it first.
void on_thread_start();

/// Starts `task` on another core when the budget allows two threads; otherwise it runs on the
/// caller's core when its result is asked for. Either way its result (or its exception) comes
/// from the future's get(); a future dropped unasked joins a started task, or never runs it.
template <typename Task>
auto alongside(int threads, Task&& task) {
  if (thread_budget(threads) > 1)
    return std::async(std::launch::async, [task = std::forward<Task>(task)]() mutable -> decltype(auto) {
      on_thread_start();
      return task();
    });
  return std::async(std::launch::deferred,
                    [task = std::forward<Task>(task)]() mutable -> decltype(auto) { return task(); });
}

}  // namespace sifter
