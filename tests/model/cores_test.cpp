// Specification of how work is spread over cores: what a thread count means, that every item
// is done once, which failure is reported, and where a task alongside runs.
#include "sifter/model/cores.hpp"

#include <gtest/gtest.h>

#include <atomic>
#include <set>
#include <stdexcept>
#include <string>
#include <thread>
#include <vector>

namespace sifter {
namespace {

TEST(Cores, AThreadCountAboveZeroIsTakenAsAskedAndZeroMeansEveryCore) {
  EXPECT_EQ(thread_budget(1), 1u);
  EXPECT_EQ(thread_budget(3), 3u);
  EXPECT_GE(thread_budget(0), 1u);
  EXPECT_EQ(thread_budget(-2), thread_budget(0)) << "a count below zero is no request";
}

TEST(Cores, EveryItemIsDoneOnceWhateverTheThreads) {
  for (int threads : {1, 2, 4}) {
    std::vector<std::atomic<int>> done(1000);
    parallel_for(done.size(), threads, [&](std::size_t i) { ++done[i]; });
    for (std::size_t i = 0; i < done.size(); ++i)
      ASSERT_EQ(done[i].load(), 1) << "item " << i << ", threads " << threads;
  }
}

TEST(Cores, OneThreadKeepsTheWorkOnTheCallersCore) {
  const auto caller = std::this_thread::get_id();
  std::set<std::thread::id> seen;
  parallel_for(50, 1, [&](std::size_t) { seen.insert(std::this_thread::get_id()); });
  EXPECT_EQ(seen, (std::set<std::thread::id>{caller}));
  auto later = alongside(1, [] { return std::this_thread::get_id(); });
  EXPECT_EQ(later.get(), caller) << "a task alongside runs on the caller's core when one thread is allowed";
  auto beside = alongside(2, [] { return std::this_thread::get_id(); });
  EXPECT_NE(beside.get(), caller) << "and on another when two are";
}

// The failure reported is that of the first item in order, as one thread going through the
// items would have met it, not the first a thread happened to meet.
TEST(Cores, TheFailureOfTheFirstFailingItemIsTheOneReported) {
  for (int threads : {1, 2, 4}) {
    try {
      parallel_for(400, threads, [](std::size_t i) {
        if (i % 97 == 13) throw std::runtime_error("item " + std::to_string(i));
      });
      ADD_FAILURE() << "no exception with " << threads << " threads";
    } catch (const std::runtime_error& e) {
      EXPECT_EQ(std::string(e.what()), "item 13") << threads << " threads";
    }
  }
}

TEST(Cores, AnExceptionOfATaskAlongsideComesFromItsResult) {
  for (int threads : {1, 2}) {
    auto task = alongside(threads, []() -> int { throw std::logic_error("late"); });
    EXPECT_THROW(task.get(), std::logic_error) << threads << " threads";
  }
}

TEST(Cores, ATaskAlongsideThatReturnsAReferenceGivesThatReference) {
  int value = 1;
  for (int threads : {1, 2}) {
    auto task = alongside(threads, [&value]() -> int& { return value; });
    int& got = task.get();
    EXPECT_EQ(&got, &value) << "threads " << threads;
  }
}

}  // namespace
}  // namespace sifter
