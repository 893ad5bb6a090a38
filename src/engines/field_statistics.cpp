// Poisson rates from service counts: chi-squared limits, gamma-Poisson update, tail probabilities.
#include "sifter/engines/field_statistics.hpp"

#include <boost/math/distributions/chi_squared.hpp>
#include <boost/math/distributions/gamma.hpp>
#include <boost/math/special_functions/gamma.hpp>
#include <cmath>

namespace sifter {

double chi_squared_quantile(double p, double dof) {
  return boost::math::quantile(boost::math::chi_squared_distribution<double>(dof), p);
}

// Poisson rate limits from the chi-squared distribution (DEVELOPERS.md, M12; textbook, the exact limits for
// a Poisson mean, from memory): lower chi2(alpha/2; 2n)/2T, upper chi2(1 - alpha/2; 2n + 2)/2T.
RateInterval rate_interval_90(int failures, double hours) {
  RateInterval out;
  if (failures == 0) {
    out.high = chi_squared_quantile(0.90, 2.0) / (2.0 * hours);
    return out;
  }
  out.low = chi_squared_quantile(0.05, 2.0 * failures) / (2.0 * hours);
  out.high = chi_squared_quantile(0.95, 2.0 * failures + 2.0) / (2.0 * hours);
  return out;
}

double rate_lower_bound(int failures, double hours, double confidence) {
  if (failures == 0) return 0.0;
  return chi_squared_quantile(1.0 - confidence, 2.0 * failures) / (2.0 * hours);
}

GammaRate prior_centred_on(double design_per_hour, double hours) { return {design_per_hour * hours, hours}; }

// Gamma prior, Poisson likelihood of n events in exposure T: the posterior is Gamma(a + n, b + T)
// (DEVELOPERS.md, M12; textbook Bayesian statistics, conjugate families; from memory).
GammaRate update(const GammaRate& prior, int failures, double hours) {
  return {prior.shape + failures, prior.rate_hours + hours};
}

double gamma_quantile(const GammaRate& g, double p) {
  if (g.shape <= 0.0 || g.rate_hours <= 0.0) return 0.0;
  return boost::math::quantile(boost::math::gamma_distribution<double>(g.shape, 1.0 / g.rate_hours), p);
}

double gamma_probability_above(const GammaRate& g, double value) {
  if (g.shape <= 0.0 || g.rate_hours <= 0.0) return 0.0;
  if (value <= 0.0) return 1.0;
  return boost::math::gamma_q(g.shape, g.rate_hours * value);
}

// P(N >= k | m) = P(k, m), the regularised lower incomplete gamma function (the Poisson-gamma
// relation; from memory, checked in tests against Boost.Math's Poisson distribution).
double poisson_at_least(int k, double mean) {
  if (k <= 0) return 1.0;
  if (mean <= 0.0) return 0.0;
  return boost::math::gamma_p(static_cast<double>(k), mean);
}

RateEstimate estimate_rate(int failures, double hours, double design_per_hour, double prior_hours) {
  RateEstimate e;
  e.failures = failures;
  e.service_hours = hours;
  e.design_per_hour = design_per_hour;
  if (hours > 0.0) {
    e.observed_per_hour = failures / hours;
    const RateInterval ci = rate_interval_90(failures, hours);
    e.ci90_low_per_hour = ci.low;
    e.ci90_high_per_hour = ci.high;
    e.exceeds_design_at_70 = rate_lower_bound(failures, hours, 0.70) > design_per_hour;
    e.exceeds_design_at_90 = rate_lower_bound(failures, hours, 0.90) > design_per_hour;
  }
  e.posterior = update(prior_centred_on(design_per_hour, prior_hours), failures, hours);
  e.posterior_mean_per_hour = e.posterior.mean();
  e.posterior_upper90_per_hour = gamma_quantile(e.posterior, 0.90);
  e.probability_above_design = gamma_probability_above(e.posterior, design_per_hour);
  return e;
}

}  // namespace sifter
