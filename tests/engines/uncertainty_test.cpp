// Specification of the uncertainty engine: field-data rates, lognormal factors, Monte Carlo.
#include "sifter/engines/uncertainty.hpp"

#include <gtest/gtest.h>

#include <algorithm>
#include <boost/math/distributions/chi_squared.hpp>
#include <boost/math/distributions/lognormal.hpp>
#include <boost/math/distributions/normal.hpp>
#include <cmath>
#include <ostream>
#include <stdexcept>
#include <string>
#include <tuple>
#include <utility>
#include <vector>

#include "sifter/engines/simplified.hpp"
#include "support/tolerance.hpp"

namespace sifter {
namespace {

using sifter::testing::expect_relative;

// Printed chi-squared tables carry three decimals: half a unit of the last digit, relative to
// the smallest value checked (4.605).
constexpr double kTableRelTol = 1.5e-4;
// Values computed two ways in double precision.
constexpr double kExactRelTol = 1e-12;
// Monte Carlo estimates are accepted within this many standard errors.
constexpr double kStandardErrors = 4.0;
// About four standard errors of a sample standard deviation at EF 3 and 200 000 samples:
// sqrt((excess kurtosis + 2) / n) / 2 = sqrt(16.9 / 2e5) / 2 = 0.0046 (lognormal moments).
constexpr double kSpreadRelTol = 0.02;

constexpr double kOneYear = 8760.0;

// ---- Field data ---------------------------------------------------------------------------

struct ChiSquaredCell {
  double confidence;
  int degrees_of_freedom;
  double printed_value;
};

void PrintTo(const ChiSquaredCell& c, std::ostream* os) {
  *os << "chi2(" << c.confidence << "; " << c.degrees_of_freedom << ") = " << c.printed_value;
}

class ChiSquaredTable : public ::testing::TestWithParam<ChiSquaredCell> {};

// Upper-tail chi-squared table values as printed in statistics and reliability handbooks, from
// memory. With T = 0.5 h the rate chi2(c; 2n + 2) / (2 T) is the table value itself.
TEST_P(ChiSquaredTable, FieldDataRateReproducesThePrintedQuantile) {
  const auto& cell = GetParam();
  const FieldData data{cell.degrees_of_freedom / 2 - 1, Duration{0.5}, cell.confidence};
  expect_relative(lambda_du_from_field_data(data).per_hour, cell.printed_value, kTableRelTol);
}

INSTANTIATE_TEST_SUITE_P(HandbookTable, ChiSquaredTable,
                         ::testing::Values(ChiSquaredCell{0.7, 6, 7.231}, ChiSquaredCell{0.9, 2, 4.605},
                                           ChiSquaredCell{0.95, 4, 9.488}, ChiSquaredCell{0.95, 2, 5.991},
                                           ChiSquaredCell{0.9, 4, 7.779}, ChiSquaredCell{0.99, 2, 9.210}));

// Two failures in 3.5e6 device-hours at 70 % (the example): chi2(0.7; 6) = 7.231 from the
// handbook table (from memory), so lambda_du = 7.231 / 7e6 per hour.
TEST(FieldData, TwoFailuresInThreePointFiveMillionHoursAtSeventyPercent) {
  const FieldData data{2, Duration{3.5e6}, 0.7};
  expect_relative(lambda_du_from_field_data(data).per_hour, 7.231 / 7.0e6, kTableRelTol);
}

// With no failure, chi-squared with 2 degrees of freedom is exponential with mean 2, so the
// bound is exactly -ln(1 - c) / T (closed form, computed here; ln 10 / T at 90 %).
TEST(FieldData, ZeroFailuresGiveMinusLogOfOneMinusConfidenceOverTime) {
  for (const double c : {0.6, 0.7, 0.9, 0.95, 0.99}) {
    const FieldData data{0, Duration{1.0e7}, c};
    expect_relative(lambda_du_from_field_data(data).per_hour, -std::log(1.0 - c) / 1.0e7, 1e-10);
  }
}

// The rate takes 2n + 2 degrees of freedom and divides by 2T, against Boost.Math directly.
TEST(FieldData, RateIsChiSquaredQuantileWithTwoNPlusTwoDegreesOverTwiceTheTime) {
  for (int n = 0; n <= 6; ++n) {
    const FieldData data{n, Duration{2.0e6}, 0.7};
    const double chi2 = boost::math::quantile(boost::math::chi_squared(2.0 * n + 2.0), 0.7);
    expect_relative(lambda_du_from_field_data(data).per_hour, chi2 / 4.0e6, kExactRelTol);
  }
}

TEST(FieldData, HigherConfidenceGivesAHigherRate) {
  const FieldData low{3, Duration{1.0e6}, 0.7};
  const FieldData high{3, Duration{1.0e6}, 0.9};
  EXPECT_GT(lambda_du_from_field_data(high).per_hour, lambda_du_from_field_data(low).per_hour);
}

// ---- Lognormal error factors ----------------------------------------------------------------

// EF = p95 / p50 and the stated value is the mean (common practice in PSA data handbooks):
// checked against Boost.Math's lognormal distribution.
TEST(Lognormal, ParametersFromMeanAndErrorFactorReproduceBoth) {
  for (const double ef : {1.5, 3.0, 10.0}) {
    const auto p = lognormal_from_mean(2.0e-7, ef);
    const boost::math::lognormal dist(p.mu, p.sigma);
    expect_relative(boost::math::mean(dist), 2.0e-7, kExactRelTol);
    expect_relative(boost::math::quantile(dist, 0.95) / boost::math::median(dist), ef, 1e-9);
  }
}

TEST(Lognormal, SigmaIsLogOfErrorFactorOverZ95) {
  // z95 = 1.6449 (standard normal table, from memory).
  expect_relative(lognormal_sigma(3.0), std::log(3.0) / 1.6449, 1e-4);
  EXPECT_EQ(lognormal_sigma(1.0), 0.0);
  expect_relative(kZ95, boost::math::quantile(boost::math::normal(), 0.95), kExactRelTol);
}

TEST(Lognormal, FactorOfAZeroVariateIsTheMedianOverTheMean) {
  const auto p = lognormal_from_mean(1.0, 3.0);
  expect_relative(lognormal_factor(p.sigma, 0.0), std::exp(p.mu), kExactRelTol);
  expect_relative(lognormal_factor(p.sigma, kZ95), 3.0 * std::exp(p.mu), kExactRelTol);
}

// ---- Percentiles ----------------------------------------------------------------------------

// Linear interpolation between order statistics, h = (n - 1) p (Hyndman and Fan definition 7,
// from memory); values hand-computed for 1..5.
TEST(Percentile, InterpolatesBetweenOrderStatistics) {
  std::vector<double> v{5.0, 1.0, 4.0, 2.0, 3.0};
  EXPECT_DOUBLE_EQ(percentile(v, 0.5), 3.0);
  EXPECT_DOUBLE_EQ(percentile(v, 0.05), 1.2);
  EXPECT_DOUBLE_EQ(percentile(v, 0.95), 4.8);
  EXPECT_DOUBLE_EQ(percentile(v, 0.0), 1.0);
  EXPECT_DOUBLE_EQ(percentile(v, 1.0), 5.0);
  std::vector<double> one{7.0};
  EXPECT_DOUBLE_EQ(percentile(one, 0.95), 7.0);
}

// ---- Sampling plan --------------------------------------------------------------------------

Component uncertain(const std::string& id, const std::string& model, double error_factor) {
  Component c;
  c.id = id;
  c.model = model;
  c.uncertainty = RateUncertainty{error_factor};
  return c;
}

std::vector<Component> demo_components() {
  // Invented demo data: two transmitters of one library model, two valves with data of their own,
  // and a logic solver taken as certain.
  Component logic;
  logic.id = "ls";
  return {uncertain("pt_a", "TX-DEMO", 3.0), uncertain("pt_b", "TX-DEMO", 3.0), logic, uncertain("xv_a", "", 3.0),
          uncertain("xv_b", "", 3.0)};
}

TEST(Plan, ComponentsOfOneLibraryModelShareOneSource) {
  const auto components = demo_components();
  const auto plan = plan_uncertainty(components);
  ASSERT_EQ(plan.sources.size(), 3U);
  EXPECT_EQ(plan.sources[0].id, "model:TX-DEMO");
  EXPECT_EQ(plan.sources[0].components, (std::vector<std::string>{"pt_a", "pt_b"}));
  EXPECT_EQ(plan.sources[1].id, "component:xv_a");
  EXPECT_EQ(plan.sources[2].id, "component:xv_b");
  EXPECT_EQ(plan.source_of_component, (std::vector<std::size_t>{0, 0, kNoSource, 1, 2}));
}

TEST(Plan, DifferentErrorFactorsOfOneModelGetSourcesOfTheirOwn) {
  const std::vector<Component> components{uncertain("a", "M", 3.0), uncertain("b", "M", 5.0), uncertain("c", "M", 3.0)};
  const auto plan = plan_uncertainty(components);
  ASSERT_EQ(plan.sources.size(), 2U);
  EXPECT_EQ(plan.sources[0].id, "model:M EF 3");
  EXPECT_EQ(plan.sources[1].id, "model:M EF 5");
  EXPECT_EQ(plan.source_of_component, (std::vector<std::size_t>{0, 1, 0}));
}

// Sample correlation of two series.
double correlation(const std::vector<double>& x, const std::vector<double>& y) {
  const double n = static_cast<double>(x.size());
  double sx = 0.0, sy = 0.0, sxx = 0.0, syy = 0.0, sxy = 0.0;
  for (std::size_t i = 0; i < x.size(); ++i) {
    sx += x[i], sy += y[i], sxx += x[i] * x[i], syy += y[i] * y[i], sxy += x[i] * y[i];
  }
  return (sxy - sx * sy / n) / std::sqrt((sxx - sx * sx / n) * (syy - sy * sy / n));
}

// State-of-knowledge dependence: the two transmitters move together in every sample (their ratio
// is exactly 1); the two valves, and a valve and the transmitters, move independently
// (correlation of the log factors near zero).
TEST(Plan, SharedModelIsFullyCorrelatedAndSeparateComponentsAreNot) {
  const auto components = demo_components();
  const auto plan = plan_uncertainty(components);
  const FactorSampler sampler(plan);
  constexpr int kSamples = 20000;
  std::vector<double> factors(sampler.size());
  std::vector<double> pt_a, xv_a, xv_b;
  for (int i = 0; i < kSamples; ++i) {
    sampler.sample(7, static_cast<std::uint64_t>(i), factors);
    ASSERT_EQ(component_factor(plan, factors, 0) / component_factor(plan, factors, 1), 1.0);
    ASSERT_EQ(component_factor(plan, factors, 2), 1.0);
    pt_a.push_back(std::log(component_factor(plan, factors, 0)));
    xv_a.push_back(std::log(component_factor(plan, factors, 3)));
    xv_b.push_back(std::log(component_factor(plan, factors, 4)));
  }
  // The sample correlation of independent normals has a standard error of about 1 / sqrt(n).
  const double bound = kStandardErrors / std::sqrt(double{kSamples});
  EXPECT_LT(std::fabs(correlation(xv_a, xv_b)), bound);
  EXPECT_LT(std::fabs(correlation(pt_a, xv_a)), bound);
  EXPECT_LT(std::fabs(correlation(pt_a, xv_b)), bound);
}

TEST(Sampling, SameSeedAndIndexGiveTheSameFactorsAndOtherSeedsDiffer) {
  const auto plan = plan_uncertainty(demo_components());
  EXPECT_EQ(sample_factors(plan, 12, 99), sample_factors(plan, 12, 99));
  EXPECT_NE(sample_factors(plan, 12, 99), sample_factors(plan, 12, 100));
  EXPECT_NE(sample_factors(plan, 12, 99), sample_factors(plan, 13, 99));
}

// ---- Monte Carlo on a 1oo1 function ---------------------------------------------------------

// 1oo1, undetected failures only, perfect yearly test, MRT = 0 (invented demo data): PFDavg =
// lDU T1 / 2 (IEC 61508-6:2010 B.3.2.2, from memory), linear in lDU.
constexpr double kLambdaDu = 2.0e-7;
constexpr double kErrorFactor = 3.0;

GroupData one_oo_one() {
  GroupData g;
  g.channel.lambda_du.per_hour = kLambdaDu;
  g.tests = {{1.0, Duration{kOneYear}}};
  return g;
}

UncertaintyPlan one_source(double error_factor) {
  UncertaintyPlan plan;
  plan.sources.push_back({"component:xv", error_factor, {"xv"}});
  return plan;
}

// The evaluator of the tests: the simplified 1oo1 PFDavg with lambda_du scaled by the factor.
double one_oo_one_pfd(std::span<const double> factors) {
  GroupData g = one_oo_one();
  g.channel.lambda_du.per_hour *= factors[0];
  return group_pfd_avg_value(g);
}

// The standard error of the sample p-quantile of a lognormal, relative: in log space it is
// sigma sqrt(p (1 - p) / n) / phi(z_p) (asymptotic normality of sample quantiles, from memory).
double relative_quantile_error(double sigma, double p, int samples) {
  const boost::math::normal standard;
  const double z = boost::math::quantile(standard, p);
  return sigma * std::sqrt(p * (1.0 - p) / samples) / boost::math::pdf(standard, z);
}

class OneOoOneMonteCarlo : public ::testing::Test {
 protected:
  static constexpr int kSamples = 200000;
  static void SetUpTestSuite() {
    const double simplified = kLambdaDu * kOneYear / 2.0;
    summary_ = run_monte_carlo(one_source(kErrorFactor), {kSamples, 2024, 2, {}, {}}, one_oo_one_pfd, simplified);
  }
  static UncertaintySummary summary_;
};
UncertaintySummary OneOoOneMonteCarlo::summary_;

TEST_F(OneOoOneMonteCarlo, MeanEqualsTheSimplifiedValueWithinThreeStandardErrors) {
  const double simplified = group_pfd_avg(one_oo_one()).pfd_avg;
  expect_relative(simplified, kLambdaDu * kOneYear / 2.0, kExactRelTol);
  EXPECT_EQ(summary_.samples, kSamples);
  EXPECT_NEAR(summary_.mean, simplified, 3.0 * summary_.standard_deviation / std::sqrt(kSamples));
}

// The percentiles of a linear function of one lognormal are the lognormal's quantiles x T1/2.
TEST_F(OneOoOneMonteCarlo, PercentilesEqualTheLognormalQuantilesTimesHalfTheInterval) {
  const auto p = lognormal_from_mean(kLambdaDu, kErrorFactor);
  const boost::math::lognormal dist(p.mu, p.sigma);
  const double half_interval = kOneYear / 2.0;
  for (const auto& [q, value] : {std::pair{0.05, summary_.p05}, {0.50, summary_.p50}, {0.95, summary_.p95}}) {
    const double tol = kStandardErrors * relative_quantile_error(p.sigma, q, kSamples);
    expect_relative(value, boost::math::quantile(dist, q) * half_interval, tol);
  }
  // The spread of a lognormal of mean m: m sqrt(exp(sigma^2) - 1) (closed form).
  expect_relative(summary_.standard_deviation, kLambdaDu * half_interval * std::sqrt(std::expm1(p.sigma * p.sigma)),
                  kSpreadRelTol);
}

// The target is the mean; a lognormal's mean lies at its Phi(sigma / 2) quantile (closed form).
TEST_F(OneOoOneMonteCarlo, ProbabilityOfMeetingTheMeanIsPhiOfHalfSigma) {
  const double sigma = lognormal_sigma(kErrorFactor);
  const double expected = boost::math::cdf(boost::math::normal(), sigma / 2.0);
  EXPECT_NEAR(summary_.probability_meets_target, expected,
              kStandardErrors * std::sqrt(expected * (1.0 - expected) / kSamples));
}

// ---- Reproducibility ------------------------------------------------------------------------

void expect_identical(const UncertaintySummary& a, const UncertaintySummary& b) {
  EXPECT_EQ(a.mean, b.mean);
  EXPECT_EQ(a.standard_deviation, b.standard_deviation);
  EXPECT_EQ(a.p05, b.p05);
  EXPECT_EQ(a.p50, b.p50);
  EXPECT_EQ(a.p95, b.p95);
  EXPECT_EQ(a.probability_meets_target, b.probability_meets_target);
  EXPECT_EQ(a.samples, b.samples);
}

// 30 000 samples span several work chunks, so two threads really share them.
TEST(MonteCarlo, SameSeedGivesIdenticalResultsOnOneTwoAndThreeThreads) {
  const auto plan = one_source(kErrorFactor);
  const double required = 1.0e-3;
  const auto one = run_monte_carlo(plan, {30000, 5, 1, {}, {}}, one_oo_one_pfd, required);
  expect_identical(one, run_monte_carlo(plan, {30000, 5, 2, {}, {}}, one_oo_one_pfd, required));
  expect_identical(one, run_monte_carlo(plan, {30000, 5, 3, {}, {}}, one_oo_one_pfd, required));
}

TEST(MonteCarlo, DifferentSeedsGiveDifferentResults) {
  const auto plan = one_source(kErrorFactor);
  const auto a = run_monte_carlo(plan, {5000, 1, 2, {}, {}}, one_oo_one_pfd, 1.0e-3);
  const auto b = run_monte_carlo(plan, {5000, 2, 2, {}, {}}, one_oo_one_pfd, 1.0e-3);
  EXPECT_NE(a.mean, b.mean);
  EXPECT_NE(a.p95, b.p95);
}

TEST(MonteCarlo, ErrorFactorOneGivesZeroSpread) {
  const auto s = run_monte_carlo(one_source(1.0), {5000, 3, 2, {}, {}}, one_oo_one_pfd, 1.0e-3);
  const double simplified = kLambdaDu * kOneYear / 2.0;
  expect_relative(s.mean, simplified, kExactRelTol);
  EXPECT_EQ(s.p05, s.p95);
  expect_relative(s.p50, simplified, kExactRelTol);
  EXPECT_LT(s.standard_deviation, simplified * kExactRelTol);
  EXPECT_EQ(s.probability_meets_target, 1.0);
}

TEST(MonteCarlo, ProgressIsReportedOnTheCallingThreadUpToTheSampleCount) {
  std::vector<int> reported;
  MonteCarloOptions options{10000, 4, 2, [&](int completed) { reported.push_back(completed); }, {}};
  run_monte_carlo(one_source(kErrorFactor), options, one_oo_one_pfd, 1.0e-3);
  ASSERT_FALSE(reported.empty());
  EXPECT_EQ(reported.back(), 10000);
  EXPECT_TRUE(std::is_sorted(reported.begin(), reported.end()));
}

TEST(MonteCarlo, AnEvaluatorErrorReachesTheCaller) {
  const SampleEvaluator failing = [](std::span<const double> f) -> double {
    if (f[0] > 5.0) throw std::runtime_error("evaluator failed");
    return f[0];
  };
  EXPECT_THROW(run_monte_carlo(one_source(10.0), {20000, 1, 2, {}, {}}, failing, 1.0), std::runtime_error);
}

// ---- The fast path of the simplified equations ----------------------------------------------

// group_pfd_avg_value is the number group_pfd_avg reports, for every Annex B form (invented
// demo data with detected failures, beta and MRT so that every term is exercised).
TEST(FastPath, GroupPfdValueEqualsTheFullResultForEveryVote) {
  for (const auto& [k, n, diagnostic] : {std::tuple{1, 1, false},
                                         {1, 2, false},
                                         {2, 2, false},
                                         {2, 3, false},
                                         {1, 3, false},
                                         {1, 2, true},
                                         {2, 4, false}}) {
    GroupData g;
    g.vote = Vote{k, n, diagnostic};
    g.channel.lambda_du.per_hour = 3e-7;
    g.channel.lambda_dd.per_hour = 1e-6;
    g.channel.lambda_sd.per_hour = 2e-6;
    g.beta = 0.05;
    g.beta_d = 0.02;
    g.tests = {{0.9, Duration{kOneYear}}, {0.1, Duration{10 * kOneYear}}};
    g.mttr = Duration{8.0};
    g.mrt = Duration{24.0};
    EXPECT_EQ(group_pfd_avg_value(g), group_pfd_avg(g).pfd_avg) << g.vote.text();
  }
}

}  // namespace
}  // namespace sifter

namespace sifter {
namespace {

TEST(FactorSampling, DrawingOnlySomeSourcesGivesTheSameValuesAsDrawingAll) {
  UncertaintyPlan plan;
  for (int i = 0; i < 7; ++i) plan.sources.push_back({"s" + std::to_string(i), 2.0 + i, {}});
  const FactorSampler sampler(plan);
  std::vector<double> all(7), some(7, 1.0);
  const std::vector<std::size_t> pairs{1, 3};  // sources 2, 3 and 6
  for (std::uint64_t i = 0; i < 50; ++i) {
    sampler.sample(11, i, all);
    sampler.sample_pairs(11, i, pairs, some);
    EXPECT_EQ(some[2], all[2]);
    EXPECT_EQ(some[3], all[3]);
    EXPECT_EQ(some[6], all[6]);
  }
}

}  // namespace
}  // namespace sifter

namespace sifter {
namespace {

// The factor table shared by the SIFs of a run holds exactly what each run would draw, so a
// Monte Carlo reading it gives the same summary as one drawing its own.
TEST(SharedFactorTable, RowsEqualTheFactorsOfEachSample) {
  UncertaintyPlan plan;
  for (int s = 0; s < 5; ++s) plan.sources.push_back({"model:m" + std::to_string(s), 2.0 + s, {}});
  const int samples = 300;
  const auto table = draw_factor_table(plan, samples, 42);
  ASSERT_EQ(table.size(), static_cast<std::size_t>(samples) * plan.sources.size());
  for (int i = 0; i < samples; i += 37) {
    const auto own = sample_factors(plan, static_cast<std::uint64_t>(i), 42);
    for (std::size_t k = 0; k < own.size(); ++k) EXPECT_EQ(table[static_cast<std::size_t>(i) * own.size() + k], own[k]);
  }
  auto evaluate = [](std::span<const double> f) { return 1e-3 * f[1] * f[3]; };
  MonteCarloOptions drawing;
  drawing.samples = samples;
  drawing.seed = 42;
  drawing.threads = 2;
  drawing.sources = {1, 3};
  MonteCarloOptions reading = drawing;
  reading.threads = 1;
  UncertaintyPlan with_table = plan;
  with_table.drawn = {42, samples, table};
  const auto a = run_monte_carlo(plan, drawing, evaluate, 1e-3);
  const auto b = run_monte_carlo(with_table, reading, evaluate, 1e-3);
  EXPECT_EQ(a.mean, b.mean);
  EXPECT_EQ(a.p95, b.p95);
  EXPECT_EQ(a.probability_meets_target, b.probability_meets_target);
}

}  // namespace
}  // namespace sifter
