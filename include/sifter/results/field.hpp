#pragma once
/// Field statistics of failure rates, as results: intervals and gamma posteriors.
/// Plain data of the results contract: the standard library and the model only.
#include <optional>

namespace sifter {

/// A classical confidence interval of a Poisson rate, per hour; `low` is empty for zero failures.
struct RateInterval {
  std::optional<double> low;
  double high = 0.0;
};

/// A gamma distribution of a rate: shape a, rate b (per hour: b is in hours); mean a / b.
struct GammaRate {
  double shape = 0.0;
  double rate_hours = 0.0;
  [[nodiscard]] double mean() const { return rate_hours > 0.0 ? shape / rate_hours : 0.0; }
};

/// The default strength of the prior: as much evidence as 1e6 device-hours (about 114
/// device-years) of service at exactly the design rate.
inline constexpr double kDefaultPriorHours = 1.0e6;

/// Everything said of one rate from its failures and service time.
struct RateEstimate {
  int failures = 0;
  double service_hours = 0.0;
  double design_per_hour = 0.0;
  std::optional<double> observed_per_hour;   ///< n / T; empty without service time
  std::optional<double> ci90_low_per_hour;   ///< empty for zero failures or no service time
  std::optional<double> ci90_high_per_hour;  ///< empty without service time
  GammaRate posterior;
  double posterior_mean_per_hour = 0.0;
  double posterior_upper90_per_hour = 0.0;
  double probability_above_design = 0.0;  ///< P(rate > design | data) under the posterior
  /// The posterior's 90 % bound lies below its mean: a gamma whose shape (prior and records
  /// together, counted in failures) is far below one puts most of its weight near zero and a
  /// long tail above, so the bound, right as it is, says little; the writers say so.
  [[nodiscard]] bool posterior_bound_below_mean() const { return posterior_upper90_per_hour < posterior_mean_per_hour; }
  /// The classical one-sided lower bound at 70 % (90 %) confidence lies above the design rate;
  /// the same as P(N >= n | design rate) <= 30 % (10 %).
  bool exceeds_design_at_70 = false;
  bool exceeds_design_at_90 = false;
};

}  // namespace sifter
