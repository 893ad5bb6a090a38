// The one place where sifter decides how many threads a piece of work gets.
#include "sifter/model/cores.hpp"

#include <algorithm>
#include <atomic>
#include <exception>
#include <mutex>
#include <thread>
#include <vector>

namespace sifter {

unsigned thread_budget(int requested) {
  if (requested > 0) return static_cast<unsigned>(requested);
  return std::max(1u, std::thread::hardware_concurrency());
}

void parallel_for(std::size_t n, int threads, const std::function<void(std::size_t)>& body) {
  const std::size_t workers = std::min<std::size_t>(n, thread_budget(threads));
  if (workers <= 1) {
    for (std::size_t i = 0; i < n; ++i) body(i);
    return;
  }
  std::atomic<std::size_t> next{0};
  std::exception_ptr failure;
  std::size_t failure_index = n;  // the failure of the first item in order, whatever the threads did
  std::mutex failure_mutex;
  auto work = [&] {
    for (std::size_t i = next++; i < n; i = next++) {
      try {
        body(i);
      } catch (...) {
        std::lock_guard<std::mutex> lock(failure_mutex);
        if (i < failure_index) {
          failure = std::current_exception();
          failure_index = i;
        }
      }
    }
  };
  std::vector<std::thread> pool;
  for (std::size_t w = 1; w < workers; ++w) pool.emplace_back(work);
  work();
  for (auto& t : pool) t.join();
  if (failure) std::rethrow_exception(failure);
}

}  // namespace sifter
