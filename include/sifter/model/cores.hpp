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

/// Starts `task` on another core when the budget allows two threads; otherwise it runs on the
/// caller's core when its result is asked for. Either way its result (or its exception) comes
/// from the future's get(); a future dropped unasked joins a started task, or never runs it.
template <typename Task>
auto alongside(int threads, Task&& task) {
  return std::async(thread_budget(threads) > 1 ? std::launch::async : std::launch::deferred, std::forward<Task>(task));
}

}  // namespace sifter
