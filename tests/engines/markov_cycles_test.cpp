// The exact engine's work is bounded: whole test cycles are composed by repeated squaring, so a
// one-minute (or one-second) proof test over 20 years answers at once, and agrees with stepping
// through every test where both can run.
#include <gtest/gtest.h>

#include <chrono>
#include <cmath>

#include "engines/markov_chain.hpp"
#include "sifter/engines/markov.hpp"
#include "sifter/model/quantity.hpp"

namespace sifter {
namespace {

#if defined(__SANITIZE_ADDRESS__) || defined(__SANITIZE_THREAD__)
constexpr double kSlowdown = 20.0;  // sanitizers slow everything down
#else
constexpr double kSlowdown = 1.0;
#endif

constexpr double kYear = 8760.0;

ExactGroupInput one_channel(double lambda_du, double interval_hours, double mission_hours) {
  ExactGroupInput in;
  in.vote = Vote{1, 1, false};
  FailureRates r;
  r.lambda_du = Rate{lambda_du};
  in.channels = {r};
  in.proof_test_interval = Duration{interval_hours};
  in.mission_time = Duration{mission_hours};
  return in;
}

// Closed form, one channel with undetected failures only and perfect instant tests
// (DEVELOPERS.md, M8): PFDavg = 1 - (1 - exp(-x)) / x with x = lambda_du T1; its series
// x/2 - x^2/6 + x^3/24 - ... is used at small x, where the closed form cancels.
double closed_form_1oo1(double x) {
  return x < 1e-3 ? x / 2 - x * x / 6 + x * x * x / 24 : 1.0 - (-std::expm1(-x)) / x;
}

TEST(ExactCycles, AOneMinuteProofTestOverTwentyYearsAnswersInUnderASecondAndEqualsTheClosedForm) {
  const double t1 = 1.0 / 60.0;
  const auto in = one_channel(2e-6, t1, 20 * kYear);
  const auto start = std::chrono::steady_clock::now();
  const ExactGroupResult r = group_exact(in);
  const double seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
  EXPECT_LT(seconds, 1.0 * kSlowdown);
  // Every cycle is the same and the mission holds a whole number of them: the mission average
  // is the one-cycle average. Tolerance 1e-9 relative (rounding over 2^24 composed cycles).
  const double expected = closed_form_1oo1(2e-6 * t1);
  EXPECT_NEAR(r.pfd_avg, expected, 1e-9 * expected);
  // And the simplified figure lambda_du T1 / 2 (M1): they differ by the share lambda T1 / 3 =
  // 1.1e-8 at this lambda T1; tolerance 2e-8 relative. The failure frequency is lambda_du
  // times the time working, 1 - lambda T1 / 2: tolerance 2e-8 relative.
  EXPECT_NEAR(r.pfd_avg, 2e-6 * t1 / 2, 2e-8 * (2e-6 * t1 / 2));
  EXPECT_NEAR(r.failure_frequency_per_hour, 2e-6, 2e-8 * 2e-6);
}

TEST(ExactCycles, AOneSecondProofTestOfARedundantGroupIsNeitherRefusedNorACrash) {
  auto in = one_channel(5e-6, 1.0 / 3600.0, 20 * kYear);
  in.vote = Vote{1, 2, false};
  in.beta = 0.05;
  in.mttr = Duration{8};
  in.channels[0].lambda_dd = Rate{1e-5};
  const auto start = std::chrono::steady_clock::now();
  const ExactGroupResult r = group_exact(in);
  const double seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
  EXPECT_LT(seconds, 1.0 * kSlowdown);
  ASSERT_TRUE(std::isfinite(r.pfd_avg));
  // Dominated by the detected failures being restored: about 2 (lDD MTTR)^2 + beta_D... here
  // beta_D = 0, so the independent double failures and the common cause of lambda_du (whose
  // share of one second is negligible); bounded by the simplified 1oo2 figure of M1.
  const double x = 1e-5 * 8.0;
  EXPECT_GT(r.pfd_avg, 0.5 * x * x);
  EXPECT_LT(r.pfd_avg, 2.0 * x * x);
  EXPECT_LE(r.curve.time_hours.size(), static_cast<std::size_t>(4 * detail::kCompressedSamples));
}

// The integrals and the final state by stepping through every instant and by composing whole
// cycles (on a coarse grid of a few instants) agree to 1e-12 relative.
TEST(ExactCycles, ComposingWholeCyclesAgreesWithSteppingThroughEveryTestToOnePartInATrillion) {
  ExactGroupInput in;
  in.vote = Vote{2, 3, false};
  FailureRates r;
  r.lambda_du = Rate{3e-6};
  r.lambda_dd = Rate{2e-6};
  in.channels = {r};
  in.beta = 0.1;
  in.beta_d = 0.05;
  in.mttr = Duration{8};
  in.mrt = Duration{24};
  in.proof_test_coverage = 0.9;
  in.partial_stroke = PartialStroke{Duration{kYear / 4}, 0.6};
  in.test_duration = Duration{4};
  in.staggered = true;
  in.proof_test_interval = Duration{kYear};
  in.mission_time = Duration{30 * kYear};
  const detail::GroupChain chain(in);
  const auto timeline = detail::group_timeline(in, chain);
  std::vector<double> times;
  for (const auto& ta : timeline) times.push_back(ta.time_hours);
  const auto grid = detail::merge_grid(times, in.mission_time.hours);
  const auto stepped = detail::propagate(chain, grid, detail::actions_on_grid(timeline, grid), true);

  const auto pattern = detail::cycle_pattern(in, chain);
  ASSERT_TRUE(pattern.valid);
  const std::vector<double> coarse{0.0, 0.37 * kYear, 5.5 * kYear, 17.25 * kYear, in.mission_time.hours};
  std::vector<std::vector<detail::Action>> acted;
  const auto cycles = detail::propagate_cycles(chain, pattern, in.mission_time.hours, coarse, true, acted);

  auto near = [](double a, double b) { return std::fabs(a - b) <= 1e-12 * std::max(std::fabs(a), std::fabs(b)); };
  EXPECT_TRUE(near(cycles.pfd_integral_hours, stepped.pfd_integral_hours))
      << cycles.pfd_integral_hours << " vs " << stepped.pfd_integral_hours;
  EXPECT_TRUE(near(cycles.expected_failures, stepped.expected_failures));
  EXPECT_TRUE(near(cycles.expected_undetected_failures, stepped.expected_undetected_failures));
  const Eigen::VectorXd& a = cycles.state_after.back();
  const Eigen::VectorXd& b = stepped.state_after.back();
  EXPECT_LE((a - b).cwiseAbs().maxCoeff(), 1e-12);
  EXPECT_TRUE(near(cycles.pfd_after.back(), stepped.pfd_after.back()));
  double segments = 0.0;
  for (const auto& s : cycles.segment_integrals) segments += s(0);
  EXPECT_TRUE(near(segments, stepped.pfd_integral_hours));
}

TEST(ExactCycles, TheCurveOfAOneMinuteIntervalIsSampledNotOnePointPerTest) {
  auto sensor = one_channel(1e-6, kYear, 20 * kYear);
  auto valve = one_channel(2e-6, 1.0 / 60.0, 20 * kYear);
  const auto start = std::chrono::steady_clock::now();
  const SifExactResult r = sif_curve({sensor, valve}, 200);
  const double seconds = std::chrono::duration<double>(std::chrono::steady_clock::now() - start).count();
  EXPECT_LT(seconds, 1.0 * kSlowdown);
  // 10.5 million tests, yet at most the samples, the plot points and the sensor's 19 tests,
  // each twice.
  EXPECT_LE(r.curve.time_hours.size(), static_cast<std::size_t>(2 * (detail::kCompressedSamples + 200 + 19)));
  for (double p : r.curve.pfd) EXPECT_TRUE(p >= 0.0 && p <= 1.0);
  // The SIF figure is the two groups' figures less their (second order) cross term.
  const double sum = r.groups[0].pfd_avg + r.groups[1].pfd_avg;
  EXPECT_LE(r.pfd_avg, sum);
  EXPECT_GT(r.pfd_avg, sum * (1.0 - 1e-4));
}

}  // namespace
}  // namespace sifter
