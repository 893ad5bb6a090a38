// Timings of the exact engine: one group over a long mission, and a SIF of three groups.
#include <benchmark/benchmark.h>

#include "sifter/engines/markov.hpp"

namespace {

using sifter::Duration;
using sifter::ExactGroupInput;
using sifter::FailureRates;
using sifter::Rate;

constexpr double kYear = 8760.0;

// Invented demo data: a 2oo3 transmitter group, yearly proof tests, a 20-year mission.
ExactGroupInput transmitters_2oo3() {
  ExactGroupInput g;
  g.vote.k = 2;
  g.vote.n = 3;
  FailureRates r;
  r.lambda_du = Rate{5e-7};
  r.lambda_dd = Rate{2e-6};
  g.channels = {r};
  g.beta = 0.05;
  g.beta_d = 0.025;
  g.proof_test_interval = Duration{kYear};
  g.mttr = Duration{8.0};
  g.mrt = Duration{8.0};
  g.mission_time = Duration{20.0 * kYear};
  return g;
}

void BM_Exact2oo3YearlyTestsTwentyYears(benchmark::State& state) {
  const auto g = transmitters_2oo3();
  for (auto _ : state) benchmark::DoNotOptimize(sifter::group_exact(g).pfd_avg);
}
BENCHMARK(BM_Exact2oo3YearlyTestsTwentyYears)->Unit(benchmark::kMicrosecond);

// The same with MRT != MTTR, so that repair after a test keeps a state of its own (20 states
// instead of 10).
void BM_Exact2oo3YearlyTestsMrtApartFromMttr(benchmark::State& state) {
  auto g = transmitters_2oo3();
  g.mrt = Duration{24.0};
  for (auto _ : state) benchmark::DoNotOptimize(sifter::group_exact(g).pfd_avg);
}
BENCHMARK(BM_Exact2oo3YearlyTestsMrtApartFromMttr)->Unit(benchmark::kMicrosecond);

void BM_Exact2oo3ImperfectTestsAndPartialStroke(benchmark::State& state) {
  auto g = transmitters_2oo3();
  g.proof_test_coverage = 0.9;
  g.partial_stroke = sifter::PartialStroke{Duration{kYear / 4.0}, 0.6};
  for (auto _ : state) benchmark::DoNotOptimize(sifter::group_exact(g).pfd_avg);
}
BENCHMARK(BM_Exact2oo3ImperfectTestsAndPartialStroke)->Unit(benchmark::kMicrosecond);

// Invented demo data: 2oo3 transmitters, a 1oo1 logic solver, 1oo2 valves with partial strokes.
void BM_ExactSifOfThreeSubsystems(benchmark::State& state) {
  auto sensors = transmitters_2oo3();
  ExactGroupInput logic = sensors;
  logic.vote = {1, 1, false};
  logic.channels[0].lambda_du = Rate{1e-8};
  logic.channels[0].lambda_dd = Rate{5e-7};
  ExactGroupInput valves = sensors;
  valves.vote = {1, 2, false};
  valves.channels[0].lambda_du = Rate{2e-6};
  valves.channels[0].lambda_dd = Rate{0.0};
  valves.proof_test_interval = Duration{2.0 * kYear};
  valves.partial_stroke = sifter::PartialStroke{Duration{kYear / 4.0}, 0.6};
  const std::vector<ExactGroupInput> sif{sensors, logic, valves};
  for (auto _ : state) benchmark::DoNotOptimize(sifter::sif_exact(sif).pfd_avg);
}
BENCHMARK(BM_ExactSifOfThreeSubsystems)->Unit(benchmark::kMicrosecond);

}  // namespace

BENCHMARK_MAIN();
