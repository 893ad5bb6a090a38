// Uncertainty of failure data: chi-squared field-data rates, lognormal factors, Monte Carlo.
#include "sifter/engines/uncertainty.hpp"

#include <algorithm>
#include <atomic>
#include <cassert>
#include <chrono>
#include <cmath>
#include <condition_variable>
#include <exception>
#include <map>
#include <mutex>
#include <numbers>
#include <set>
#include <sstream>
#include <thread>
#include <utility>

#include "sifter/engines/sil.hpp"
#include "sifter/model/cores.hpp"

namespace sifter {

double lognormal_sigma(double error_factor) {
  assert(error_factor >= 1.0);
  return std::log(error_factor) / kZ95;
}

LognormalParameters lognormal_from_mean(double mean, double error_factor) {
  assert(mean > 0.0);
  const double sigma = lognormal_sigma(error_factor);
  // E[X] = exp(mu + sigma^2 / 2): the stated rate is the mean, so the median lies below it.
  return {std::log(mean) - 0.5 * sigma * sigma, sigma};
}

double lognormal_factor(double sigma, double standard_normal) {
  return std::exp(sigma * standard_normal - 0.5 * sigma * sigma);
}

// ---- Sampling plan --------------------------------------------------------------------------

namespace {

std::string format_error_factor(double error_factor) {
  std::ostringstream out;
  out.precision(6);
  out << error_factor;
  return out.str();
}

}  // namespace

UncertaintyPlan plan_uncertainty(std::span<const Component> components) {
  // Error factors seen per model, to name a model's sources unambiguously.
  std::map<std::string, std::set<double>> factors_of_model;
  for (const auto& c : components)
    if (c.uncertainty && !c.model.empty()) factors_of_model[c.model].insert(c.uncertainty->error_factor);

  UncertaintyPlan plan;
  plan.source_of_component.assign(components.size(), kNoSource);
  std::map<std::pair<std::string, double>, std::size_t> shared;  // (model, EF) -> source
  for (std::size_t i = 0; i < components.size(); ++i) {
    const Component& c = components[i];
    if (!c.uncertainty) continue;
    const double ef = c.uncertainty->error_factor;
    std::size_t source = kNoSource;
    if (!c.model.empty()) {
      const auto [it, inserted] = shared.try_emplace({c.model, ef}, plan.sources.size());
      source = it->second;
      if (inserted) {
        std::string id = "model:" + c.model;
        if (factors_of_model[c.model].size() > 1) id += " EF " + format_error_factor(ef);
        plan.sources.push_back({std::move(id), ef, {}});
      }
    } else {
      source = plan.sources.size();
      plan.sources.push_back({"component:" + c.id, ef, {}});
    }
    plan.sources[source].components.push_back(c.id);
    plan.source_of_component[i] = source;
  }
  return plan;
}

double component_factor(const UncertaintyPlan& plan, std::span<const double> factors, std::size_t component) {
  assert(component < plan.source_of_component.size());
  const std::size_t source = plan.source_of_component[component];
  return source == kNoSource ? 1.0 : factors[source];
}

// ---- Random numbers -------------------------------------------------------------------------

namespace {

// SplitMix64 (Steele, Lea and Flood, "Fast splittable pseudorandom number generators", 2014;
// constants as published, from memory): a 64-bit Weyl sequence through a bijective mixer.
constexpr std::uint64_t kGolden = 0x9E3779B97F4A7C15ULL;

constexpr std::uint64_t mix64(std::uint64_t z) {
  z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9ULL;
  z = (z ^ (z >> 27)) * 0x94D049BB133111EBULL;
  return z ^ (z >> 31);
}

class SampleStream {
 public:
  // The stream of one pair of sources in one sample starts at a hash of (seed, sample index,
  // pair); each stream gives two draws, so streams do not overlap in practice. Keying by the
  // pair lets a SIF draw only the sources it uses and still get the plan's values.
  SampleStream(std::uint64_t seed, std::uint64_t sample_index, std::uint64_t pair)
      : state_(mix64(mix64(mix64(seed + kGolden) + sample_index) + pair * kGolden)) {}

  // Uniform on [0, 1) with 53 random bits.
  double uniform() {
    state_ += kGolden;
    return static_cast<double>(mix64(state_) >> 11) * 0x1.0p-53;
  }

 private:
  std::uint64_t state_;
};

}  // namespace

FactorSampler::FactorSampler(const UncertaintyPlan& plan) {
  sigmas_.reserve(plan.sources.size());
  for (const auto& s : plan.sources) sigmas_.push_back(lognormal_sigma(s.error_factor));
}

void FactorSampler::sample_pair(std::uint64_t seed, std::uint64_t sample_index, std::size_t pair,
                                std::span<double> factors) const {
  SampleStream stream(seed, sample_index, pair);
  // Box-Muller: two uniforms give two independent standard normals, for sources 2p and 2p+1.
  // Written out rather than std::normal_distribution, whose algorithm differs between
  // standard libraries.
  const std::size_t i = 2 * pair;
  const double u1 = 1.0 - stream.uniform();  // (0, 1]: the logarithm stays finite
  const double angle = 2.0 * std::numbers::pi * stream.uniform();
  const double radius = std::sqrt(-2.0 * std::log(u1));
  factors[i] = lognormal_factor(sigmas_[i], radius * std::cos(angle));
  if (i + 1 < sigmas_.size()) factors[i + 1] = lognormal_factor(sigmas_[i + 1], radius * std::sin(angle));
}

void FactorSampler::sample(std::uint64_t seed, std::uint64_t sample_index, std::span<double> factors) const {
  assert(factors.size() == sigmas_.size());
  for (std::size_t pair = 0; 2 * pair < sigmas_.size(); ++pair) sample_pair(seed, sample_index, pair, factors);
}

void FactorSampler::sample_pairs(std::uint64_t seed, std::uint64_t sample_index, std::span<const std::size_t> pairs,
                                 std::span<double> factors) const {
  assert(factors.size() == sigmas_.size());
  for (auto pair : pairs) sample_pair(seed, sample_index, pair, factors);
}

std::vector<double> draw_factor_table(const UncertaintyPlan& plan, int samples, std::uint64_t seed) {
  const FactorSampler sampler(plan);
  const std::size_t width = sampler.size();
  if (samples <= 0 || width == 0 || static_cast<std::size_t>(samples) * width > kMaxFactorTableBytes / sizeof(double))
    return {};
  std::vector<double> table(static_cast<std::size_t>(samples) * width);
  for (std::size_t i = 0; i < static_cast<std::size_t>(samples); ++i)
    sampler.sample(seed, i, std::span<double>(table).subspan(i * width, width));
  return table;
}

std::vector<double> sample_factors(const UncertaintyPlan& plan, std::uint64_t sample_index, std::uint64_t seed) {
  const FactorSampler sampler(plan);
  std::vector<double> factors(sampler.size());
  sampler.sample(seed, sample_index, factors);
  return factors;
}

// ---- Statistics -----------------------------------------------------------------------------

double percentile(std::vector<double>& values, double p) {
  assert(!values.empty() && p >= 0.0 && p <= 1.0);
  const double h = static_cast<double>(values.size() - 1) * p;
  const auto lo = static_cast<std::size_t>(std::floor(h));
  const auto lo_it = values.begin() + static_cast<std::ptrdiff_t>(lo);
  std::nth_element(values.begin(), lo_it, values.end());
  const double x_lo = *lo_it;
  const double frac = h - static_cast<double>(lo);
  if (frac == 0.0 || lo + 1 >= values.size()) return x_lo;
  // After nth_element every element past lo is >= x_lo: the next order statistic is their minimum.
  const double x_hi = *std::min_element(lo_it + 1, values.end());
  return x_lo + frac * (x_hi - x_lo);
}

UncertaintySummary summarize_samples(std::vector<double>& values, double required_value) {
  return summarize_samples(values, [required_value](double v) { return at_most(v, required_value); });
}

UncertaintySummary summarize_samples(std::vector<double>& values, const SampleJudge& meets) {
  assert(!values.empty());
  UncertaintySummary out;
  out.samples = static_cast<int>(values.size());
  // Sums run in sample-index order, before the percentiles reorder the values, so that the
  // summary does not depend on how the samples were shared among threads.
  double sum = 0.0;
  int meeting = 0;
  for (const double v : values) {
    assert(std::isfinite(v));
    sum += v;
    if (meets(v)) ++meeting;
  }
  const double n = static_cast<double>(values.size());
  out.mean = sum / n;
  double squares = 0.0;
  for (const double v : values) squares += (v - out.mean) * (v - out.mean);
  out.standard_deviation = values.size() > 1 ? std::sqrt(squares / (n - 1.0)) : 0.0;
  out.probability_meets_target = meeting / n;
  // Three O(n) selections; narrowing the outer two to either side of the median was tried and
  // gained nothing measurable (about 20 ms per million values either way).
  out.p05 = percentile(values, 0.05);
  out.p50 = percentile(values, 0.50);
  out.p95 = percentile(values, 0.95);
  return out;
}

// ---- Monte Carlo driver ---------------------------------------------------------------------

namespace {

// Samples handed to a worker at a time: large enough to keep the shared counter quiet, small
// enough to balance two cores and to move a progress bar.
constexpr int kChunkSamples = 4096;
constexpr auto kProgressPeriod = std::chrono::milliseconds(100);

int worker_count(int requested, int chunks) {
  return std::clamp(static_cast<int>(thread_budget(requested)), 1, std::max(chunks, 1));
}

// Where each sample's factors come from: the plan's table when it was drawn for this seed and
// sample count, else drawn here, only for the pairs of sources the evaluator reads (the others
// keep factor 1).
struct FactorSource {
  const FactorSampler& sampler;
  std::span<const double> drawn;   // empty: draw here
  std::vector<std::size_t> pairs;  // empty: every pair
  std::uint64_t seed = 0;
};

FactorSource factor_source(const FactorSampler& sampler, const UncertaintyPlan& plan,
                           const MonteCarloOptions& options) {
  const bool use_drawn = !plan.drawn.factors.empty() && plan.drawn.seed == options.seed &&
                         plan.drawn.samples == options.samples &&
                         plan.drawn.factors.size() == static_cast<std::size_t>(options.samples) * sampler.size();
  FactorSource source{
      sampler, use_drawn ? std::span<const double>(plan.drawn.factors) : std::span<const double>(), {}, options.seed};
  for (auto s : options.sources) source.pairs.push_back(s / 2);
  std::sort(source.pairs.begin(), source.pairs.end());
  source.pairs.erase(std::unique(source.pairs.begin(), source.pairs.end()), source.pairs.end());
  return source;
}

// The values of samples [begin, end); `factors` is the worker's scratch row.
void evaluate_samples(const FactorSource& source, const SampleEvaluator& evaluate, int begin, int end,
                      std::vector<double>& factors, std::vector<double>& values) {
  for (int i = begin; i < end; ++i) {
    if (!source.drawn.empty()) {
      const auto row = static_cast<std::size_t>(i) * factors.size();
      values[static_cast<std::size_t>(i)] = evaluate(source.drawn.subspan(row, factors.size()));
      continue;
    }
    if (source.pairs.empty())
      source.sampler.sample(source.seed, static_cast<std::uint64_t>(i), factors);
    else
      source.sampler.sample_pairs(source.seed, static_cast<std::uint64_t>(i), source.pairs, factors);
    values[static_cast<std::size_t>(i)] = evaluate(factors);
  }
}

// The samples in chunks, shared out to the workers, and how far they have got.
struct ChunkedRun {
  ChunkedRun(int sample_count, int threads)
      : samples(sample_count), running(threads), errors(static_cast<std::size_t>(threads)) {}

  int samples;
  int chunks = (samples + kChunkSamples - 1) / kChunkSamples;
  std::atomic<int> next_chunk{0};
  std::atomic<int> completed{0};
  std::mutex mutex;
  std::condition_variable done_signal;
  int running;
  std::vector<std::exception_ptr> errors;  // one per worker
};

// One worker: takes chunks until none is left; an exception stops every worker early.
void work(ChunkedRun& run, std::size_t worker, const FactorSource& source, const SampleEvaluator& evaluate,
          std::vector<double>& values) {
  try {
    std::vector<double> factors(source.sampler.size(), 1.0);
    for (int chunk = run.next_chunk++; chunk < run.chunks; chunk = run.next_chunk++) {
      const int begin = chunk * kChunkSamples;
      const int end = std::min(begin + kChunkSamples, run.samples);
      evaluate_samples(source, evaluate, begin, end, factors, values);
      run.completed += end - begin;
    }
  } catch (...) {
    run.errors[worker] = std::current_exception();
    run.next_chunk = run.chunks;  // let the other workers stop early
  }
  const std::lock_guard lock(run.mutex);
  if (--run.running == 0) run.done_signal.notify_all();
}

// Blocks until every worker is done. The calling thread only reports progress, so the
// callback never runs concurrently.
void wait_reporting_progress(ChunkedRun& run, const ProgressCallback& progress) {
  std::unique_lock lock(run.mutex);
  while (!run.done_signal.wait_for(lock, kProgressPeriod, [&] { return run.running == 0; }))
    if (progress) {
      lock.unlock();
      progress(run.completed.load());
      lock.lock();
    }
}

void rethrow_first(const std::vector<std::exception_ptr>& errors) {
  for (const auto& e : errors)
    if (e) std::rethrow_exception(e);
}

}  // namespace

UncertaintySummary run_monte_carlo(const UncertaintyPlan& plan, const MonteCarloOptions& options,
                                   const SampleEvaluator& evaluate, double required_value) {
  return run_monte_carlo(plan, options, evaluate, [required_value](double v) { return at_most(v, required_value); });
}

UncertaintySummary run_monte_carlo(const UncertaintyPlan& plan, const MonteCarloOptions& options,
                                   const SampleEvaluator& evaluate, const SampleJudge& meets) {
  assert(options.samples >= 1);
  const FactorSampler sampler(plan);
  const FactorSource source = factor_source(sampler, plan, options);
  std::vector<double> values(static_cast<std::size_t>(options.samples));
  const int threads = worker_count(options.threads, (options.samples + kChunkSamples - 1) / kChunkSamples);
  ChunkedRun run(options.samples, threads);
  if (threads == 1 && !options.progress) {  // one worker: run it here, start no thread
    work(run, 0, source, evaluate, values);
    rethrow_first(run.errors);
    return summarize_samples(values, meets);
  }
  std::vector<std::thread> workers;
  workers.reserve(static_cast<std::size_t>(threads));
  for (int t = 0; t < threads; ++t)
    workers.emplace_back([&, t] { work(run, static_cast<std::size_t>(t), source, evaluate, values); });
  wait_reporting_progress(run, options.progress);
  for (auto& w : workers) w.join();
  rethrow_first(run.errors);
  if (options.progress) options.progress(run.completed.load());
  return summarize_samples(values, meets);
}

}  // namespace sifter
