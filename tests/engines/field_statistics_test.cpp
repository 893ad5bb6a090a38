// Rates from service counts: chi-squared limits, the gamma-Poisson update, Poisson tails.
#include "sifter/engines/field_statistics.hpp"

#include <gtest/gtest.h>

#include <boost/math/distributions/gamma.hpp>
#include <boost/math/distributions/poisson.hpp>
#include <cmath>

namespace sifter {
namespace {

constexpr double kTableDigits = 5e-4;  // printed tables give four significant figures
constexpr double kExactRelTol = 1e-10;

void expect_rel(double actual, double expected, double tol) {
  EXPECT_NEAR(actual, expected, tol * std::fabs(expected)) << "expected " << expected;
}

// Standard statistics tables of the chi-squared distribution (from memory).
TEST(FieldStatistics, ChiSquaredQuantilesMatchPrintedTables) {
  expect_rel(chi_squared_quantile(0.95, 2), 5.991, kTableDigits);
  expect_rel(chi_squared_quantile(0.95, 4), 9.488, kTableDigits);
  expect_rel(chi_squared_quantile(0.70, 6), 7.231, kTableDigits);
  expect_rel(chi_squared_quantile(0.90, 8), 13.362, kTableDigits);
}

// With 2 degrees of freedom chi-squared is exponential with mean 2: quantile -2 ln(1 - p).
TEST(FieldStatistics, ChiSquaredWithTwoDegreesIsAnExponential) {
  for (double p : {0.05, 0.3, 0.7, 0.9, 0.95})
    expect_rel(chi_squared_quantile(p, 2), -2.0 * std::log(1.0 - p), kExactRelTol);
}

TEST(FieldStatistics, ZeroFailuresGiveTheOneSidedUpperBoundOnly) {
  const RateInterval ci = rate_interval_90(0, 1.0e5);
  EXPECT_FALSE(ci.low);
  expect_rel(ci.high, std::log(10.0) / 1.0e5, kExactRelTol);  // -ln(1 - 0.9) / T
}

TEST(FieldStatistics, OneFailureGivesTheTwoSidedNinetyPercentInterval) {
  const double t = 1.0e5;
  const RateInterval ci = rate_interval_90(1, t);
  ASSERT_TRUE(ci.low);
  expect_rel(*ci.low, -std::log(0.95) / t, kExactRelTol);  // chi2(0.05; 2) / 2T = -ln(0.95) / T
  expect_rel(ci.high, 9.488 / (2.0 * t), kTableDigits);    // chi2(0.95; 4) / 2T, table value
}

// Conjugate gamma-Poisson update (textbook Bayesian statistics, from memory): Gamma(a + n, b + T).
TEST(FieldStatistics, PosteriorMeanIsShapePlusFailuresOverRatePlusHours) {
  // Hand-worked: design 1e-6/h with the weight of 1e6 h is Gamma(1, 1e6); 3 failures in 2e6 h
  // give Gamma(4, 3e6), mean 4 / 3e6 = 1.3333e-6/h.
  const RateEstimate e = estimate_rate(3, 2.0e6, 1.0e-6, 1.0e6);
  EXPECT_DOUBLE_EQ(e.posterior.shape, 4.0);
  EXPECT_DOUBLE_EQ(e.posterior.rate_hours, 3.0e6);
  expect_rel(e.posterior_mean_per_hour, 4.0 / 3.0e6, kExactRelTol);
  // Integer shape k: the gamma quantile is chi2(p; 2k) / 2b; chi2(0.90; 8) = 13.362 in tables.
  expect_rel(e.posterior_upper90_per_hour, 13.362 / 6.0e6, kTableDigits);
  expect_rel(e.posterior_upper90_per_hour, chi_squared_quantile(0.90, 8) / 6.0e6, kExactRelTol);
}

TEST(FieldStatistics, WithoutServiceTimeThePosteriorIsThePrior) {
  const RateEstimate e = estimate_rate(0, 0.0, 2.5e-7, 1.0e6);
  EXPECT_DOUBLE_EQ(e.posterior.shape, 0.25);
  EXPECT_DOUBLE_EQ(e.posterior.rate_hours, 1.0e6);
  expect_rel(e.posterior_mean_per_hour, 2.5e-7, kExactRelTol);
  EXPECT_FALSE(e.observed_per_hour);
  EXPECT_FALSE(e.ci90_high_per_hour);
  EXPECT_FALSE(e.exceeds_design_at_70);
}

// A gamma of shape far below one (a design rate of 5e-9/h weighed as 1e6 h is worth 0.005
// failures) has its 90 % quantile below its mean: right, and said, since a reviewer reads it
// as an error. Shape 4 (the hand-worked case above) is the ordinary case.
TEST(FieldStatistics, AnUpperBoundBelowTheMeanIsFlaggedForTheWriters) {
  const RateEstimate tiny = estimate_rate(0, 8.76e4, 5.0e-9, 1.0e6);
  EXPECT_LT(tiny.posterior.shape, 0.01);
  EXPECT_LT(tiny.posterior_upper90_per_hour, tiny.posterior_mean_per_hour);
  EXPECT_TRUE(tiny.posterior_bound_below_mean());
  // Boost.Math's gamma quantile agrees that 90 % of the weight lies below the bound.
  expect_rel(
      boost::math::cdf(boost::math::gamma_distribution<double>(tiny.posterior.shape, 1.0 / tiny.posterior.rate_hours),
                       tiny.posterior_upper90_per_hour),
      0.90, 1e-9);
  EXPECT_FALSE(estimate_rate(3, 2.0e6, 1.0e-6, 1.0e6).posterior_bound_below_mean());
  EXPECT_FALSE(estimate_rate(0, 0.0, 2.5e-7, 1.0e6).posterior_bound_below_mean())
      << "shape 0.25 still has its bound above";
}

// Shape 1 is the exponential: P(rate > design) = exp(-b x design) = exp(-1) for the prior alone.
TEST(FieldStatistics, ProbabilityAboveDesignOfAnExponentialPrior) {
  const RateEstimate e = estimate_rate(0, 0.0, 1.0e-6, 1.0e6);
  expect_rel(e.probability_above_design, std::exp(-1.0), kExactRelTol);
}

TEST(FieldStatistics, PoissonTailsAgreeWithBoostAndAHandCase) {
  // Hand case: P(N >= 2 | 0.25) = 1 - e^-0.25 (1 + 0.25) = 0.0264990...
  expect_rel(poisson_at_least(2, 0.25), 1.0 - std::exp(-0.25) * 1.25, kExactRelTol);
  expect_rel(poisson_at_least(1, 0.7), 1.0 - std::exp(-0.7), kExactRelTol);
  EXPECT_DOUBLE_EQ(poisson_at_least(0, 3.0), 1.0);
  for (double m : {0.01, 0.3, 1.0, 4.5, 20.0})
    for (int k : {1, 2, 3, 5, 10}) {
      const double boost_tail =
          boost::math::cdf(boost::math::complement(boost::math::poisson_distribution<double>(m), k - 1));
      expect_rel(poisson_at_least(k, m), boost_tail, 1e-9);
    }
}

// The classical lower bound exceeds the design rate exactly when so many failures would be
// unlikely at the design rate: chi2(1 - c; 2n)/2T > l0  <=>  P(N >= n | l0 T) < 1 - c.
TEST(FieldStatistics, ExceedingAtAConfidenceIsThePoissonTestAtTheDesignRate) {
  const double t = 1.0e5;
  for (int n = 1; n <= 8; ++n)
    for (double design : {1e-6, 5e-6, 1e-5, 3e-5, 6e-5}) {
      const RateEstimate e = estimate_rate(n, t, design, 1.0e6);
      EXPECT_EQ(e.exceeds_design_at_70, poisson_at_least(n, design * t) < 0.30) << n << " " << design;
      EXPECT_EQ(e.exceeds_design_at_90, poisson_at_least(n, design * t) < 0.10) << n << " " << design;
    }
}

}  // namespace
}  // namespace sifter
