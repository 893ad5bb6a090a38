// Monte Carlo throughput: a three-subsystem SIF (2oo3 sensors, 1oo1 logic, 1oo2 final elements)
// evaluated on the simplified equations with its rates scaled by the sampled factors.
#include <benchmark/benchmark.h>

#include <array>
#include <cstddef>
#include <span>
#include <utility>
#include <vector>

#include "sifter/engines/simplified.hpp"
#include "sifter/engines/uncertainty.hpp"

namespace sifter {
namespace {

constexpr double kOneYear = 8760.0;

// One series element of a channel: its rates and the uncertain source that scales them.
struct Element {
  FailureRates rates;
  std::size_t source = 0;
};

struct DemoSubsystem {
  GroupData group;               // channel rates are overwritten per sample
  std::vector<Element> channel;  // series elements of one channel
};

// Invented demo data, not from any data book.
struct DemoSif {
  std::array<DemoSubsystem, 3> subsystems;
  UncertaintyPlan plan;

  DemoSif() {
    auto group = [](int k, int n, double beta, double beta_d) {
      GroupData g;
      g.vote = Vote{k, n, false};
      g.beta = beta;
      g.beta_d = beta_d;
      g.tests = {{1.0, Duration{kOneYear}}};
      g.mttr = Duration{8.0};
      g.mrt = Duration{8.0};
      return g;
    };
    auto rates = [](double du, double dd) { return FailureRates{Rate{du}, Rate{dd}, Rate{}, Rate{}}; };
    // Sources: 0 transmitter model, 1 logic solver, 2 solenoid model, 3 valve model.
    plan.sources = {{"model:TX-DEMO", 3.0, {"pt_a", "pt_b", "pt_c"}},
                    {"component:ls", 2.0, {"ls"}},
                    {"model:SOV-DEMO", 3.0, {"sov_a", "sov_b"}},
                    {"model:XV-DEMO", 5.0, {"xv_a", "xv_b"}}};
    subsystems[0] = {group(2, 3, 0.05, 0.02), {{rates(3e-8, 3e-7), 0}}};
    subsystems[1] = {group(1, 1, 0.0, 0.0), {{rates(5e-9, 5e-7), 1}}};
    subsystems[2] = {group(1, 2, 0.10, 0.05), {{rates(8e-8, 0.0), 2}, {rates(2e-7, 0.0), 3}}};
  }
};

const DemoSif& demo_sif() {
  static const DemoSif sif;
  return sif;
}

// The channel rates of one subsystem in one sample: each element scaled by its source's factor.
FailureRates scaled_channel(const DemoSubsystem& s, std::span<const double> factors) {
  FailureRates channel;
  for (const auto& e : s.channel) {
    const double f = factors[e.source];
    channel += FailureRates{Rate{e.rates.lambda_du.per_hour * f}, Rate{e.rates.lambda_dd.per_hour * f},
                            Rate{e.rates.lambda_su.per_hour * f}, Rate{e.rates.lambda_sd.per_hour * f}};
  }
  return channel;
}

// Fast path: one scratch copy of the groups per thread, only the rates change per sample, and
// group_pfd_avg_value builds no equation text.
double evaluate_fast(std::span<const double> factors) {
  const DemoSif& sif = demo_sif();
  thread_local std::array<GroupData, 3> scratch{sif.subsystems[0].group, sif.subsystems[1].group,
                                                sif.subsystems[2].group};
  double pfd = 0.0;
  for (std::size_t i = 0; i < scratch.size(); ++i) {
    scratch[i].channel = scaled_channel(sif.subsystems[i], factors);
    pfd += group_pfd_avg_value(scratch[i]);
  }
  return pfd;
}

// Naive path: a fresh GroupData per subsystem and sample, and the full result with its text.
double evaluate_full(std::span<const double> factors) {
  const DemoSif& sif = demo_sif();
  double pfd = 0.0;
  for (const auto& s : sif.subsystems) {
    GroupData g = s.group;
    g.channel = scaled_channel(s, factors);
    pfd += group_pfd_avg(g).pfd_avg;
  }
  return pfd;
}

constexpr int kSamples = 1 << 20;

void run(benchmark::State& state, const SampleEvaluator& evaluate) {
  const int threads = static_cast<int>(state.range(0));
  const MonteCarloOptions options{kSamples, 42, threads, {}, {}};
  for (auto _ : state) {
    const auto summary = run_monte_carlo(demo_sif().plan, options, evaluate, 1e-3);
    benchmark::DoNotOptimize(summary.mean);
  }
  // items_per_second is the number of SIF evaluations (samples) per second of wall time.
  state.SetItemsProcessed(state.iterations() * kSamples);
}

void BM_MonteCarloSifFastPath(benchmark::State& state) { run(state, evaluate_fast); }
void BM_MonteCarloSifFullResult(benchmark::State& state) { run(state, evaluate_full); }

// The parts of one sample on one thread: drawing the four factors, then evaluating the SIF.
void BM_SampleFactors(benchmark::State& state) {
  const FactorSampler sampler(demo_sif().plan);
  std::array<double, 4> factors{};
  std::uint64_t i = 0;
  for (auto _ : state) {
    sampler.sample(42, i++, factors);
    benchmark::DoNotOptimize(factors.data());
  }
  state.SetItemsProcessed(state.iterations());
}

void BM_EvaluateSifFastPath(benchmark::State& state) {
  std::array<double, 4> factors{1.1, 0.9, 1.2, 0.8};
  for (auto _ : state) {
    benchmark::DoNotOptimize(factors.data());
    benchmark::DoNotOptimize(evaluate_fast(factors));
  }
  state.SetItemsProcessed(state.iterations());
}

// The serial part of a run: mean, spread and three percentiles of one run's values.
void BM_SummarizeSamples(benchmark::State& state) {
  std::vector<double> values(kSamples);
  const FactorSampler sampler(demo_sif().plan);
  std::array<double, 4> factors{};
  for (std::size_t i = 0; i < values.size(); ++i) {
    sampler.sample(42, i, factors);
    values[i] = evaluate_fast(factors);
  }
  for (auto _ : state) {
    state.PauseTiming();
    std::vector<double> copy = values;
    state.ResumeTiming();
    benchmark::DoNotOptimize(summarize_samples(copy, 1e-3).p95);
  }
  state.SetItemsProcessed(state.iterations() * kSamples);
}

BENCHMARK(BM_MonteCarloSifFastPath)->Arg(1)->Arg(2)->UseRealTime()->Unit(benchmark::kMillisecond);
BENCHMARK(BM_MonteCarloSifFullResult)->Arg(1)->Arg(2)->UseRealTime()->Unit(benchmark::kMillisecond);
BENCHMARK(BM_SampleFactors);
BENCHMARK(BM_EvaluateSifFastPath);
BENCHMARK(BM_SummarizeSamples)->Unit(benchmark::kMillisecond);

}  // namespace
}  // namespace sifter

BENCHMARK_MAIN();
