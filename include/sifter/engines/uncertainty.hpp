#pragma once
/// Uncertainty of failure data: chi-squared rates from field experience, lognormal
/// state-of-knowledge factors, sampling plans and a reproducible multi-threaded Monte Carlo.
#include <cstddef>
#include <cstdint>
#include <functional>
#include <limits>
#include <span>
#include <string>
#include <vector>

#include "sifter/model/model.hpp"

namespace sifter {

// ---- Lognormal error factors ----------------------------------------------------------------

/// z of the 95th percentile of the standard normal distribution.
inline constexpr double kZ95 = 1.6448536269514722;

/// Parameters of ln X ~ Normal(mu, sigma) for a lognormal X.
struct LognormalParameters {
  double mu = 0.0;     ///< mean of ln X (ln of the unit of X, here ln per hour)
  double sigma = 0.0;  ///< standard deviation of ln X
};

/// sigma of ln X for an error factor EF = p95 / p50: ln(EF) / z95 (common practice in PSA
/// data handbooks). EF >= 1; EF = 1 gives sigma = 0 (no uncertainty).
double lognormal_sigma(double error_factor);

/// The lognormal whose MEAN is `mean` and whose error factor is `error_factor`:
/// sigma = ln(EF) / z95, mu = ln(mean) - sigma^2 / 2. mean > 0.
LognormalParameters lognormal_from_mean(double mean, double error_factor);

/// The multiplicative factor sample / mean of that lognormal for a standard normal variate z:
/// exp(sigma z - sigma^2 / 2). Its mean is exactly 1, so the stated rates stay the means.
double lognormal_factor(double sigma, double standard_normal);

// ---- Sampling plan --------------------------------------------------------------------------

/// One uncertain quantity that receives one factor per sample. Components that take their data
/// from the same library model share a source: the uncertainty lies in the knowledge of the
/// data, not in the devices (state-of-knowledge dependence; common practice in probabilistic
/// safety assessment).
struct UncertainSource {
  std::string id;                       ///< "model:<name>" or "component:<id>"
  double error_factor = 1.0;            ///< p95 / p50 of the lognormal factor
  std::vector<std::string> components;  ///< ids of the components scaled by this source
};

/// Marks a component with no uncertain source (its rates are taken as certain).
inline constexpr std::size_t kNoSource = std::numeric_limits<std::size_t>::max();

/// The uncertain sources of a project and which source scales each component.
struct UncertaintyPlan {
  std::vector<UncertainSource> sources;
  /// Per component (same order as the components given to plan_uncertainty): the index of
  /// its source in `sources`, or kNoSource. May be empty for a plan built by hand.
  std::vector<std::size_t> source_of_component;
  /// Factors already drawn for one seed and sample count (see draw_factor_table), shared by
  /// every Monte Carlo run on this plan with that seed and count: row i holds every source's
  /// factor of sample i, the values a run would draw itself. Empty: each run draws.
  struct Drawn {
    std::uint64_t seed = 0;
    int samples = 0;
    std::vector<double> factors;
  } drawn;
};

/// Builds the plan for a project's components. Components with `uncertainty` and the same
/// `model` and error factor share one source, "model:<model>" (or "model:<model> EF <x>" when
/// components of that model carry different error factors); a component with `uncertainty` and
/// no model has its own, "component:<id>". Components without `uncertainty` have none.
/// Sources are listed in order of first appearance.
UncertaintyPlan plan_uncertainty(std::span<const Component> components);

/// Draws the factors of every source of a plan for one sample, reproducibly: the stream of
/// sample i depends only on (seed, i), never on which thread draws it or in what order.
class FactorSampler {
 public:
  /// Precomputes each source's sigma.
  explicit FactorSampler(const UncertaintyPlan& plan);

  /// Writes one factor per source (sample / mean, see lognormal_factor) into `factors`, whose
  /// size must equal the number of sources. Normal variates by the Box-Muller transform on
  /// uniforms from a SplitMix64 stream keyed by a hash of (seed, sample_index) (Steele, Lea and
  /// Flood, 2014, from memory): a counter-based scheme, identical on every thread count.
  void sample(std::uint64_t seed, std::uint64_t sample_index, std::span<double> factors) const;
  /// The same for the given pairs of sources only (pair p holds sources 2p and 2p+1): each
  /// pair has its own stream keyed by (seed, sample, pair), so the values equal sample()'s.
  void sample_pairs(std::uint64_t seed, std::uint64_t sample_index, std::span<const std::size_t> pairs,
                    std::span<double> factors) const;

  /// Number of sources (and of factors per sample).
  [[nodiscard]] std::size_t size() const { return sigmas_.size(); }

 private:
  void sample_pair(std::uint64_t seed, std::uint64_t sample_index, std::size_t pair, std::span<double> factors) const;
  std::vector<double> sigmas_;
};

/// The factors of sample `sample_index` for `seed`, one per source of the plan.
std::vector<double> sample_factors(const UncertaintyPlan& plan, std::uint64_t sample_index, std::uint64_t seed);

/// The factor that scales component `component` in one sample: factors[source], or 1 for a
/// component with no source.
double component_factor(const UncertaintyPlan& plan, std::span<const double> factors, std::size_t component);

// ---- Monte Carlo ----------------------------------------------------------------------------

/// The distribution of a result (PFDavg, or PFH per hour) over the samples.
struct UncertaintySummary {
  double mean = 0.0;
  double standard_deviation = 0.0;        ///< sample standard deviation (n - 1 in the denominator)
  double p05 = 0.0;                       ///< 5th percentile, see percentile()
  double p50 = 0.0;                       ///< median
  double p95 = 0.0;                       ///< 95th percentile
  double probability_meets_target = 0.0;  ///< share of samples with value at_most(required)
  int samples = 0;
};

/// One evaluation of the result for one sample's factors (one per source). It is called
/// concurrently from several threads: it must not modify shared state.
using SampleEvaluator = std::function<double(std::span<const double> factors)>;

/// Called on the calling thread with the number of samples completed so far, about every
/// 100 ms and once at the end; for a progress bar.
using ProgressCallback = std::function<void(int completed)>;

/// How to run a Monte Carlo.
struct MonteCarloOptions {
  int samples = 10000;        ///< number of samples, >= 1
  std::uint64_t seed = 1;     ///< the same seed gives the same results on any number of threads
  int threads = 0;            ///< worker threads; 0 = std::thread::hardware_concurrency()
  ProgressCallback progress;  ///< optional
  /// The sources the evaluator reads (indices into the plan); empty = all. Only these are
  /// drawn, with the same values a full draw would give; the others stay at factor 1.
  std::vector<std::size_t> sources;
};

/// The factors of samples [0, samples) for `seed`, one row of plan.sources.size() per sample,
/// drawn with FactorSampler (so equal to what run_monte_carlo would draw). Empty when the
/// table would exceed kMaxFactorTableBytes: callers then draw per run.
std::vector<double> draw_factor_table(const UncertaintyPlan& plan, int samples, std::uint64_t seed);

/// Above this size the shared factor table is not built (memory stays bounded).
inline constexpr std::size_t kMaxFactorTableBytes = std::size_t{256} << 20;

/// Runs `options.samples` evaluations with the plan's factors and summarises them against
/// `required_value` (the required PFD, or PFH per hour; at_most of sil.hpp decides each
/// sample). Work is split by sample index over std::thread workers; value i depends only on
/// (seed, i) and every statistic is computed from the values in index order, so the summary
/// is bit-identical for any thread count.
UncertaintySummary run_monte_carlo(const UncertaintyPlan& plan, const MonteCarloOptions& options,
                                   const SampleEvaluator& evaluate, double required_value);

/// Whether one sample's value meets the requirement (the one judge of judge.hpp, bound to a SIF).
using SampleJudge = std::function<bool(double value)>;

/// The same, each sample judged by `meets` (so that a sample is counted by the rule the verdict uses).
UncertaintySummary run_monte_carlo(const UncertaintyPlan& plan, const MonteCarloOptions& options,
                                   const SampleEvaluator& evaluate, const SampleJudge& meets);

/// Summarises values already computed (reorders `values`), each judged by `meets`.
UncertaintySummary summarize_samples(std::vector<double>& values, const SampleJudge& meets);

/// Summarises values already computed (reorders `values`).
UncertaintySummary summarize_samples(std::vector<double>& values, double required_value);

/// The p-quantile (0 <= p <= 1) of `values` by linear interpolation between order statistics,
/// x[h] with h = (n - 1) p (Hyndman and Fan 1996, definition 7; the default of R and NumPy,
/// from memory). Uses std::nth_element, so `values` is reordered. values non-empty.
double percentile(std::vector<double>& values, double p);

}  // namespace sifter
