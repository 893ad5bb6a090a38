#pragma once
/// Statistics of failure counts over service time: the classical chi-squared interval of a
/// Poisson rate, the gamma prior and its conjugate update, and Poisson tail probabilities.
/// Pure functions on numbers (Boost.Math); the methods are listed in DEVELOPERS.md.
#include <optional>

#include "sifter/results/field.hpp"

namespace sifter {

/// The p-quantile of the chi-squared distribution with `dof` degrees of freedom (Boost.Math).
double chi_squared_quantile(double p, double dof);

/// n failures in T hours (T > 0): the two-sided 90 % interval [chi2(0.05; 2n) / 2T,
/// chi2(0.95; 2n + 2) / 2T]; for n = 0 only the one-sided 90 % upper bound chi2(0.90; 2) / 2T
/// = ln(10) / T (textbook Poisson rate limits).
RateInterval rate_interval_90(int failures, double hours);

/// The one-sided lower confidence bound of the rate at `confidence`: chi2(1 - c; 2n) / 2T,
/// zero for n = 0.
double rate_lower_bound(int failures, double hours, double confidence);

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

/// The estimate from n failures in T hours against the design rate, with a prior of
/// `prior_hours` strength.
RateEstimate estimate_rate(int failures, double hours, double design_per_hour, double prior_hours);

}  // namespace sifter
