// Specification of the exact engine at SIF level: subsystems in series on a common grid.
#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <stdexcept>

#include "sifter/engines/markov.hpp"
#include "support/markov_reference.hpp"
#include "support/tolerance.hpp"

namespace sifter {
namespace {

using sifter::testing::expect_relative;

// Agreement with the independent quadrature reference. The issue asks for 1e-4; both sides
// are exact up to rounding and quadrature error, so they are held to much less.
constexpr double kReferenceRelTol = 1e-8;
// Results that come from one computation, or from an identity, agree to rounding.
constexpr double kSameModelRelTol = 1e-9;

constexpr double kYear = 8760.0;

// Undetected failures only, instantaneous repairs (the scope of the reference); no common
// cause for 1oo1, beta for redundant groups.
ExactGroupInput du_group(int k, int n, double lambda_du, double beta, double interval_hours, double mission_hours) {
  ExactGroupInput g;
  g.vote = {k, n, false};
  FailureRates r;
  r.lambda_du = Rate{lambda_du};
  g.channels = {r};
  g.beta = beta;
  g.proof_test_interval = Duration{interval_hours};
  g.mission_time = Duration{mission_hours};
  return g;
}

// The reference group for identical channels tested together (or staggered) with the
// engine's rule: the shock at beta lambda_du, the rest independent.
reference::Group reference_of(const ExactGroupInput& g) {
  reference::Group r;
  r.k = g.vote.k;
  r.ptc = g.proof_test_coverage;
  r.interval_hours = g.proof_test_interval.hours;
  const double lambda = g.channels[0].lambda_du.per_hour;
  r.shock_per_hour = g.vote.k < g.vote.n ? g.beta * lambda : 0.0;
  for (int j = 0; j < g.vote.n; ++j) {
    const double first = g.staggered && j > 0 ? j * r.interval_hours / g.vote.n : r.interval_hours;
    r.channels.push_back({lambda - r.shock_per_hour, first});
  }
  return r;
}

// Invented demo data: a 1oo1 transmitter and a 1oo2 pair of valves, both tested every year.
std::vector<ExactGroupInput> coinciding_pair() {
  return {du_group(1, 1, 1e-5, 0.0, kYear, 5.0 * kYear), du_group(1, 2, 2e-5, 0.05, kYear, 5.0 * kYear)};
}

TEST(ExactSif, OneSubsystemIsTheGroupItself) {
  const auto g = du_group(2, 3, 1e-5, 0.05, kYear, 7.5 * kYear);
  const auto sif = sif_exact({g});
  const auto group = group_exact(g);
  EXPECT_EQ(sif.pfd_avg, group.pfd_avg);
  EXPECT_EQ(sif.failure_frequency_per_hour, group.failure_frequency_per_hour);
  EXPECT_EQ(sif.curve.time_hours, group.curve.time_hours);
  ASSERT_EQ(sif.curve.pfd.size(), group.curve.pfd.size());
  for (std::size_t i = 0; i < sif.curve.pfd.size(); ++i)
    EXPECT_NEAR(sif.curve.pfd[i], group.curve.pfd[i], 1e-15);  // 1 - (1 - u) rounds
}

// With coinciding tests the SIF's average is less than the sum of its subsystems' averages
// (by the average of u1 u2), and equals the quadrature of 1 - (1 - u1)(1 - u2) (Boost.Math
// Gauss-Kronrod over the closed forms of the reference).
TEST(ExactSif, CoincidingTestsAverageIsTheIntegralOfTheProductNotTheSum) {
  const auto groups = coinciding_pair();
  const auto sif = sif_exact(groups);
  const double sum = sif.groups[0].pfd_avg + sif.groups[1].pfd_avg;
  EXPECT_LT(sif.pfd_avg, sum);
  const double reference =
      reference::series_pfd_avg({reference_of(groups[0]), reference_of(groups[1])}, groups[0].mission_time.hours);
  expect_relative(sif.pfd_avg, reference, kReferenceRelTol);
  // The difference is a real second-order effect, far above the tolerance.
  EXPECT_GT((sum - reference) / reference, 100.0 * kReferenceRelTol);
  expect_relative(sif.groups[1].pfd_avg, group_exact(groups[1]).pfd_avg, kSameModelRelTol);
}

// Tests that do not coincide (every year and every 18 months, a staggered pair) put every
// instant of both on the common grid.
TEST(ExactSif, TestsThatDoNotCoincideMatchQuadrature) {
  const double mission = 6.0 * kYear;
  auto valves = du_group(1, 2, 3e-5, 0.1, 1.5 * kYear, mission);
  valves.staggered = true;
  const std::vector<ExactGroupInput> groups{du_group(1, 1, 1e-5, 0.0, kYear, mission), valves};
  const double reference = reference::series_pfd_avg({reference_of(groups[0]), reference_of(groups[1])}, mission);
  expect_relative(sif_exact(groups).pfd_avg, reference, kReferenceRelTol);
}

// A subsystem bypassed during its tests (PFD = 1 meanwhile) in series with a 2oo3: the
// reference takes the bypassed channel's piecewise closed form.
TEST(ExactSif, BypassedSubsystemMatchesQuadrature) {
  const double mission = 4.0 * kYear;
  const double lambda = 1e-5;
  const double tau = 72.0;
  auto logic = du_group(1, 1, lambda, 0.0, kYear, mission);
  logic.test_duration = Duration{tau};
  const auto sensors = du_group(2, 3, 2e-5, 0.05, kYear, mission);
  auto bypassed = [&](double t) {
    const double k = std::floor(t / kYear);
    if (k >= 1.0 && t < k * kYear + tau) return 1.0;
    return 1.0 - std::exp(-lambda * (t - (k >= 1.0 ? k * kYear + tau : 0.0)));
  };
  const auto ref_sensors = reference_of(sensors);
  auto breaks = reference::test_instants({ref_sensors}, mission);
  for (int k = 1; k < 4; ++k) breaks.push_back(k * kYear + tau);
  std::sort(breaks.begin(), breaks.end());
  const double reference = reference::average(
      [&](double t) { return 1.0 - (1.0 - bypassed(t)) * (1.0 - reference::pfd(ref_sensors, t)); }, breaks);
  expect_relative(sif_exact({logic, sensors}).pfd_avg, reference, kReferenceRelTol);
}

// Two single channels in series fail at (l1 + l2) whenever both work, so the SIF's failure
// frequency averages to (l1 + l2)(1 - PFDavg) (derived here).
TEST(ExactSif, FailureFrequencyOfTwoChannelsIsTheirRatesTimesAvailability) {
  const std::vector<ExactGroupInput> groups{du_group(1, 1, 1e-5, 0.0, kYear, 5.0 * kYear),
                                            du_group(1, 1, 4e-5, 0.0, 2.0 * kYear, 5.0 * kYear)};
  const auto sif = sif_exact(groups);
  expect_relative(sif.failure_frequency_per_hour, 5e-5 * (1.0 - sif.pfd_avg), kSameModelRelTol);
  EXPECT_LT(sif.failure_frequency_per_hour,
            sif.groups[0].failure_frequency_per_hour + sif.groups[1].failure_frequency_per_hour);
}

// The plot: at least the points asked for, every subsystem on the SIF's times, the SIF value
// the series combination of theirs, and the same exact averages as without the samples.
TEST(ExactSif, CurveForPlottingKeepsTheExactAverages) {
  const auto groups = coinciding_pair();
  const auto plain = sif_exact(groups);
  const auto plot = sif_curve(groups, 101);
  EXPECT_EQ(plot.pfd_avg, plain.pfd_avg);
  EXPECT_EQ(plot.failure_frequency_per_hour, plain.failure_frequency_per_hour);
  const auto& t = plot.curve.time_hours;
  // 101 samples, of which the 4 test instants (at multiples of 5 yr / 100) appear twice.
  EXPECT_EQ(t.size(), 105u);
  EXPECT_EQ(t.front(), 0.0);
  EXPECT_EQ(t.back(), 5.0 * kYear);
  EXPECT_TRUE(std::is_sorted(t.begin(), t.end()));
  for (const auto& g : plot.groups) ASSERT_EQ(g.curve.time_hours, t);
  for (std::size_t i = 0; i < t.size(); ++i) {
    const double series = 1.0 - (1.0 - plot.groups[0].curve.pfd[i]) * (1.0 - plot.groups[1].curve.pfd[i]);
    expect_relative(plot.curve.pfd[i], series, kSameModelRelTol);
  }
}

// A sampled value of a single channel is its closed form 1 - exp(-lDU (t - last test)).
TEST(ExactSif, CurveSamplesAreExactValues) {
  const double lambda = 1e-5;
  const auto plot = sif_curve({du_group(1, 1, lambda, 0.0, kYear, 3.0 * kYear)}, 7);
  const auto& c = plot.groups[0].curve;
  for (std::size_t i = 0; i < c.time_hours.size(); ++i) {
    const double t = c.time_hours[i];
    // The first of a repeated instant is before its test; the mission end has no test.
    const bool before_test = i + 1 == c.time_hours.size() || c.time_hours[i + 1] == t;
    double last_test = std::floor(t / kYear) * kYear;
    if (last_test == t && before_test && t > 0.0) last_test -= kYear;
    const double expected = 1.0 - std::exp(-lambda * (t - last_test));
    EXPECT_NEAR(c.pfd[i], expected, expected * kSameModelRelTol + 1e-15) << "at " << t << " h";
  }
}

TEST(ExactSif, SubsystemsWithDifferentMissionsAreRefused) {
  auto groups = coinciding_pair();
  groups[1].mission_time = Duration{10.0 * kYear};
  EXPECT_THROW(sif_exact(groups), std::invalid_argument);
}

}  // namespace
}  // namespace sifter
