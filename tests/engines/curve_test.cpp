// Specification of the simplified PFD(t) sawtooth the report draws.
#include "sifter/engines/curve.hpp"

#include <gtest/gtest.h>

#include <cmath>

#include "sifter/analysis/verify.hpp"
#include "sifter/engines/cross_check.hpp"
#include "sifter/input/load.hpp"
#include "support/tolerance.hpp"

namespace sifter {
namespace {

using sifter::testing::expect_relative;

constexpr double kOneYear = 8760.0;
// Midpoint-rule means over many steps agree with the closed forms to about 1e-8 here.
constexpr int kMeanSteps = 200000;
constexpr double kMeanRelTol = 1e-6;

GroupData group(int k, int n, double ldu, double ldd, double beta, double beta_d, double mrt_hours) {
  GroupData g;
  g.vote.k = k;
  g.vote.n = n;
  g.channel.lambda_du.per_hour = ldu;
  g.channel.lambda_dd.per_hour = ldd;
  g.beta = beta;
  g.beta_d = beta_d;
  g.tests = {{1.0, Duration{kOneYear}}};
  g.mttr = Duration{8.0};
  g.mrt = Duration{mrt_hours};
  return g;
}

// The time average of group_pfd_at over [0, T], by the midpoint rule.
double mean_over(const GroupData& g, double t_hours) {
  double sum = 0.0;
  for (int i = 0; i < kMeanSteps; ++i) sum += group_pfd_at(g, (i + 0.5) * t_hours / kMeanSteps, false);
  return sum / kMeanSteps;
}

// IEC 61508-6:2010 B.3.2.2.1, 1oo1: PFDavg = lDU (T1/2 + MRT) + lDD MTTR (from memory,
// DEVELOPERS.md, Methods M1), written out here by hand.
TEST(Curve, OneOutOfOneAveragesToTheAnnexBFormOverAProofTestInterval) {
  const GroupData g = group(1, 1, 2e-6, 5e-6, 0.0, 0.0, 16.0);
  const double by_hand = 2e-6 * (kOneYear / 2 + 16.0) + 5e-6 * 8.0;
  expect_relative(mean_over(g, kOneYear), by_hand, kMeanRelTol);
}

// IEC 61508-6:2010 B.3.2.2.2, 1oo2 with undetected failures only and no repair time:
// 2 X^2 tCE tGE + CCF = 2 ((1-b) lDU)^2 (T/2)(T/3) + b lDU T/2 (from memory). The binomial
// sawtooth has the same mean: the mean of q(t)^2 over T is (lDU T)^2 / 3.
TEST(Curve, OneOutOfTwoAveragesToTheAnnexBFormWithCommonCause) {
  const double ldu = 1e-6, beta = 0.05;
  const GroupData g = group(1, 2, ldu, 0.0, beta, 0.0, 0.0);
  const double x = (1.0 - beta) * ldu;
  const double by_hand = 2.0 * x * x * (kOneYear / 2) * (kOneYear / 3) + beta * ldu * kOneYear / 2;
  expect_relative(mean_over(g, kOneYear), by_hand, kMeanRelTol);
  expect_relative(mean_over(g, kOneYear), group_pfd_avg(g).pfd_avg, kMeanRelTol);
}

// 2oo3 fails on two of three: 3 q^2 (1 - q) + q^3 = 3 q^2 - 2 q^3, whose mean is
// (lDU T)^2 - (lDU T)^3 / 2 against the Annex B 6 X^2 tCE tGE = (lDU T)^2 (common practice):
// they differ by the relative amount lDU T / 2.
TEST(Curve, TwoOutOfThreeAgreesWithTheAnnexBFormToFirstOrder) {
  const double ldu = 1e-6;
  const GroupData g = group(2, 3, ldu, 0.0, 0.0, 0.0, 0.0);
  const double lt = ldu * kOneYear;
  expect_relative(mean_over(g, kOneYear), lt * lt - lt * lt * lt / 2, kMeanRelTol);
  expect_relative(mean_over(g, kOneYear), group_pfd_avg(g).pfd_avg, lt);
}

TEST(Curve, AProofTestRenewsTheChannelSoTheCurveDropsAtEachTest) {
  CurveSubsystem s;
  s.group = group(1, 1, 2e-6, 0.0, 0.0, 0.0, 0.0);
  const PfdPlot c = simplified_curve({s}, Duration{5 * kOneYear}, 50);
  int drops = 0;
  for (std::size_t i = 1; i < c.t_hours.size(); ++i) {
    EXPECT_LE(c.t_hours[i - 1], c.t_hours[i]);
    if (c.t_hours[i] == c.t_hours[i - 1]) {
      ++drops;
      EXPECT_GT(c.pfd_sif[i - 1], c.pfd_sif[i]);
      expect_relative(c.pfd_sif[i - 1], 2e-6 * kOneYear, 1e-12);  // just before: lDU T
      EXPECT_EQ(c.pfd_sif[i], 0.0);                               // just after: as new
    }
  }
  EXPECT_EQ(drops, 4);  // tests at 1, 2, 3 and 4 years; the mission ends at 5
  EXPECT_EQ(c.t_hours.front(), 0.0);
  EXPECT_EQ(c.t_hours.back(), 5 * kOneYear);
}

// The time grid is bounded: up to kMaxCurveTestInstants test instants are each kept (twice:
// before and after); a one-minute proof test over 20 years (10.5 million tests) gives the
// uniform samples alone.
TEST(Curve, TheTimeGridKeepsEveryTestOnlyUpToItsStatedMaximum) {
  CurveSubsystem s;
  s.group = group(1, 1, 2e-6, 0.0, 0.0, 0.0, 0.0);
  const auto instants = [&](double interval_hours, double mission_hours) {
    s.group->tests = {{1.0, Duration{interval_hours}}};
    return simplified_curve({s}, Duration{mission_hours}, 100).t_hours.size();
  };
  EXPECT_EQ(instants(kOneYear, 20 * kOneYear), 100u + 2u * 19u);
  const double many = 20 * kOneYear / kMaxCurveTestInstants;  // exactly the maximum, less the end
  EXPECT_EQ(instants(many, 20 * kOneYear), 100u + 2u * (kMaxCurveTestInstants - 1));
  EXPECT_EQ(instants(1.0 / 60.0, 20 * kOneYear), 100u);
}

TEST(Curve, TheSifIsTheSumOfItsSubsystemsAndASupplierFigureIsFlat) {
  CurveSubsystem sensor, vendor;
  sensor.group = group(1, 2, 1e-6, 1e-6, 0.1, 0.05, 8.0);
  vendor.flat_pfd = 5e-5;
  const PfdPlot c = simplified_curve({sensor, vendor}, Duration{2 * kOneYear}, 30);
  ASSERT_EQ(c.pfd_subsystems.size(), 2u);
  for (std::size_t i = 0; i < c.t_hours.size(); ++i) {
    EXPECT_EQ(c.pfd_subsystems[1][i], 5e-5);
    expect_relative(c.pfd_sif[i], c.pfd_subsystems[0][i] + 5e-5, 1e-12);
  }
  EXPECT_FALSE(c.engine.empty());
}

// IEC 61508-6:2010 B.3.2.5 (from memory): failures a proof test misses stay until the end of
// the mission, so the value just after each test grows from test to test.
TEST(Curve, AnImperfectProofTestLeavesAResidueThatGrowsOverTheMission) {
  CurveSubsystem s;
  s.group = group(1, 1, 2e-6, 0.0, 0.0, 0.0, 0.0);
  s.group->tests = {{0.6, Duration{kOneYear}}, {0.4, Duration{10 * kOneYear}}};
  const PfdPlot c = simplified_curve({s}, Duration{10 * kOneYear}, 20);
  std::vector<double> after_tests;
  for (std::size_t i = 1; i < c.t_hours.size(); ++i)
    if (c.t_hours[i] == c.t_hours[i - 1]) after_tests.push_back(c.pfd_sif[i]);
  ASSERT_EQ(after_tests.size(), 9u);
  for (std::size_t k = 1; k < after_tests.size(); ++k) EXPECT_GT(after_tests[k], after_tests[k - 1]);
  // Just after the test at 3 years: 0.4 lDU x 3 yr remain.
  expect_relative(after_tests[2], 0.4 * 2e-6 * 3 * kOneYear, 1e-9);
}

TEST(Curve, ANoOutOfNGroupFailsOnAnyChannelWithoutASeparateCommonCauseTerm) {
  const GroupData g = group(2, 2, 1e-6, 0.0, 0.1, 0.1, 0.0);
  const double q = 1e-6 * 1000.0;
  expect_relative(group_pfd_at(g, 1000.0, false), 1.0 - (1.0 - q) * (1.0 - q), 1e-12);
}

}  // namespace
}  // namespace sifter

namespace sifter {
namespace {

// One curve type for both engines: the exact engine's curve of each SIF of the shipped example
// names its subsystems in the SIF's order, and its mission average is the exact PFDavg that
// `check` reports for that SIF (the same engine, reached through verify).
TEST(CurveOfTheExactEngine, NamesTheSubsystemsAndAveragesToTheExactFigureOfCheck) {
  const LoadedProject loaded = load_project_file(std::string(SIFTER_SOURCE_DIR) + "/examples/unit40.json");
  const ProjectResult checked = verify_project(loaded, VerifyOptions{});
  int compared = 0;
  for (std::size_t i = 0; i < loaded.project.sifs.size(); ++i) {
    const Sif& sif = loaded.project.sifs[i];
    const SifResult& r = checked.sifs[i];
    if (!r.pfd_avg_exact || r.demand_mode != DemandMode::kLow) continue;
    PfdPlot plot;
    try {
      plot = exact_curve(loaded.project, sif, 200);
    } catch (const UsageError&) {
      continue;  // only supplier figures: no curve
    }
    ASSERT_EQ(plot.subsystem_names.size(), sif.subsystems.size());
    for (std::size_t g = 0; g < sif.subsystems.size(); ++g) EXPECT_EQ(plot.subsystem_names[g], sif.subsystems[g].name);
    ASSERT_TRUE(plot.pfd_avg.has_value());
    expect_relative(*plot.pfd_avg, *r.pfd_avg_exact, 1e-6);
    EXPECT_FALSE(plot.engine.empty());
    ++compared;
  }
  EXPECT_GT(compared, 0);
}

}  // namespace
}  // namespace sifter
