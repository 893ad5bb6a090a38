#pragma once
/// Statistics of failure counts over service time: the classical chi-squared interval of a
/// Poisson rate, the gamma prior and its conjugate update, and Poisson tail probabilities.
/// Pure functions on numbers (Boost.Math); the methods are listed in DEVELOPERS.md.
#include <optional>

namespace sifter {

/// The default strength of the prior: as much evidence as 1e6 device-hours (about 114
/// device-years) of service at exactly the design rate.
inline constexpr double kDefaultPriorHours = 1.0e6;

/// The p-quantile of the chi-squared distribution with `dof` degrees of freedom (Boost.Math).
double chi_squared_quantile(double p, double dof);

/// A classical confidence interval of a Poisson rate, per hour; `low` is empty for zero failures.
struct RateInterval {
  std::optional<double> low;
  double high = 0.0;
};

/// n failures in T hours (T > 0): the two-sided 90 % interval [chi2(0.05; 2n) / 2T,
/// chi2(0.95; 2n + 2) / 2T]; for n = 0 only the one-sided 90 % upper bound chi2(0.90; 2) / 2T
/// = ln(10) / T (textbook Poisson rate limits).
RateInterval rate_interval_90(int failures, double hours);

/// The one-sided lower confidence bound of the rate at `confidence`: chi2(1 - c; 2n) / 2T,
/// zero for n = 0.
double rate_lower_bound(int failures, double hours, double confidence);

/// A gamma distribution of a rate: shape a, rate b (per hour: b is in hours); mean a / b.
struct GammaRate {
  double shape = 0.0;
  double rate_hours = 0.0;
  [[nodiscard]] double mean() const { return rate_hours > 0.0 ? shape / rate_hours : 0.0; }
};

/// The prior centred on the design rate with the strength of `hours` of service:
/// Gamma(design x hours, hours).
GammaRate prior_centred_on(double design_per_hour, double hours);
/// The conjugate update by n failures in T hours: Gamma(a + n, b + T).
GammaRate update(const GammaRate& prior, int failures, double hours);
/// The p-quantile of the gamma distribution; 0 when its shape is 0 (all mass at zero).
double gamma_quantile(const GammaRate& g, double p);
/// P(rate > value) under the gamma distribution.
double gamma_probability_above(const GammaRate& g, double value);

/// P(N >= k) for N Poisson with mean m: 1 - CDF(k - 1; m), which equals the regularised lower
/// incomplete gamma function P(k, m); 1 for k <= 0.
double poisson_at_least(int k, double mean);

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
  /// The classical one-sided lower bound at 70 % (90 %) confidence lies above the design rate;
  /// the same as P(N >= n | design rate) <= 30 % (10 %).
  bool exceeds_design_at_70 = false;
  bool exceeds_design_at_90 = false;
};

/// The estimate from n failures in T hours against the design rate, with a prior of
/// `prior_hours` strength.
RateEstimate estimate_rate(int failures, double hours, double design_per_hour, double prior_hours);

}  // namespace sifter
