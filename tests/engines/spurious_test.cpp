// Specification of the spurious trip rates of groups and SIFs.
#include "sifter/engines/spurious.hpp"

#include <gtest/gtest.h>

#include <cmath>

#include "sifter/analysis/verify.hpp"
#include "sifter/input/load.hpp"
#include "support/tolerance.hpp"

namespace sifter {
namespace {

using sifter::testing::expect_relative;

// Hand-computed values are compared to machine precision, relatively.
constexpr double kExactRelTol = 1e-12;

// A safe failure rate, beta and MTTR typical of a field device (invented).
constexpr double kLs = 2.8e-7;
constexpr double kBeta = 0.05;
constexpr double kMttr = 8.0;

SpuriousGroupData group(int k, int n, double ls = kLs, double beta = kBeta, double mttr = kMttr) {
  SpuriousGroupData g;
  g.vote.k = k;
  g.vote.n = n;
  g.lambda_trip_per_hour = ls;
  g.beta = beta;
  g.mttr = Duration{mttr};
  return g;
}

// Gruhn & Cheddie, Safety Instrumented Systems, 2nd ed., 8.9 (DEVELOPERS.md, Methods M7, from memory).
TEST(SpuriousTrips, OneOutOfOneTripsOnEverySafeFailure) {
  expect_relative(group_spurious_trip_rate_per_hour(group(1, 1)), kLs, kExactRelTol);
}

TEST(SpuriousTrips, OneOutOfTwoTripsOnEitherChannelAndOnCommonCause) {
  expect_relative(group_spurious_trip_rate_per_hour(group(1, 2)), 2 * (1 - kBeta) * kLs + kBeta * kLs, kExactRelTol);
}

TEST(SpuriousTrips, TwoOutOfTwoNeedsTwoOverlappingSafeFailures) {
  expect_relative(group_spurious_trip_rate_per_hour(group(2, 2)), 2 * kLs * kLs * kMttr + kBeta * kLs, kExactRelTol);
}

TEST(SpuriousTrips, TwoOutOfThreeNeedsTwoOfThreeOverlappingSafeFailures) {
  expect_relative(group_spurious_trip_rate_per_hour(group(2, 3)), 6 * kLs * kLs * kMttr + kBeta * kLs, kExactRelTol);
}

TEST(SpuriousTrips, GeneralFormCountsTheWaysToReachKFailedChannels) {
  // Independent channels each failed safe with probability lS MTTR: the rate of entering K
  // failed is C(N, K-1) (lS MTTR)^(K-1) x (N-K+1) lS (our derivation, spurious.hpp).
  const double ls = 1e-5, mttr = 24.0;
  const double p = ls * mttr;
  // 3oo3: one way to have two failed, then the third fails.
  expect_relative(group_spurious_trip_rate_per_hour(group(3, 3, ls, 0.0, mttr)), 3 * p * p * ls, kExactRelTol);
  // 2oo4: four ways to have one failed, then one of the three others.
  expect_relative(group_spurious_trip_rate_per_hour(group(2, 4, ls, 0.0, mttr)), 4 * p * 3 * ls, kExactRelTol);
  // 1oo3 trips on any channel.
  expect_relative(group_spurious_trip_rate_per_hour(group(1, 3, ls, kBeta, mttr)), 3 * (1 - kBeta) * ls + kBeta * ls,
                  kExactRelTol);
}

TEST(SpuriousTrips, MoreVotesToTripMeanFewerSpuriousTrips) {
  const double r1oo2 = group_spurious_trip_rate_per_hour(group(1, 2));
  const double r1oo1 = group_spurious_trip_rate_per_hour(group(1, 1));
  const double r2oo3 = group_spurious_trip_rate_per_hour(group(2, 3));
  EXPECT_GT(r1oo2, r1oo1);
  EXPECT_LT(r2oo3, r1oo1);
}

TEST(SpuriousTrips, DetectedDangerousFailuresCountOnlyWhereTheyTrip) {
  FailureRates r;
  r.lambda_su.per_hour = 1e-7;
  r.lambda_sd.per_hour = 2e-7;
  r.lambda_dd.per_hour = 5e-7;
  r.lambda_du.per_hour = 9e-7;
  expect_relative(channel_trip_rate_per_hour(r, false), 3e-7, kExactRelTol);
  expect_relative(channel_trip_rate_per_hour(r, true), 8e-7, kExactRelTol);
}

TEST(SpuriousTrips, MttfIsTheInverseRateAndAbsentWithoutTrips) {
  EXPECT_DOUBLE_EQ(*mttf_spurious_years(0.04), 25.0);
  EXPECT_FALSE(mttf_spurious_years(0.0));
}

ProjectResult verify_text(const std::string& text) {
  return verify_project(load_project_text(text, "inline.json", std::string(SIFTER_SOURCE_DIR) + "/examples"));
}

TEST(SpuriousTrips, TheSifTripsWhenAnySubsystemDoesAndCheckReportsIt) {
  const auto r = verify_text(R"({
  "format": "sifter-project/1",
  "defaults": { "proof_test_interval": "1 yr", "mttr": "8 h" },
  "components": [
    { "id": "PT-1", "lambda_du": "50 FIT", "lambda_dd": "450 FIT", "lambda_sd": "300 FIT" },
    { "id": "PT-2", "lambda_du": "50 FIT", "lambda_dd": "450 FIT", "lambda_sd": "300 FIT" },
    { "id": "XV-1", "lambda_du": "500 FIT", "lambda_su": "500 FIT" }
  ],
  "sifs": [ { "id": "S1", "target": {"sil": 1}, "subsystems": [
    { "name": "sensors", "role": "sensor", "vote": "1oo2", "channels": ["PT-1", "PT-2"], "beta": "10%",
      "trip_on_detected": true },
    { "name": "logic", "role": "logic", "pfd_avg": 1e-4, "hft": 1, "systematic_capability": 3 },
    { "name": "valve", "role": "final", "vote": "1oo1", "channels": ["XV-1"] } ] } ]
})");
  const auto& s = r.sifs[0];
  // Sensors: lS = 300 + 450 FIT (detected failures trip); 1oo2, beta 10 % (DEVELOPERS.md, Methods M7).
  const double sensors = (2 * 0.9 * 750e-9 + 0.1 * 750e-9) * 8760.0;
  const double valve = 500e-9 * 8760.0;
  expect_relative(s.subsystems[0].spurious_trip_rate_per_yr, sensors, kExactRelTol);
  EXPECT_EQ(s.subsystems[1].spurious_trip_rate_per_yr, 0.0);  // a supplier figure gives no safe rate
  EXPECT_FALSE(s.subsystems[1].mttf_spurious_yr);
  expect_relative(s.subsystems[2].spurious_trip_rate_per_yr, valve, kExactRelTol);
  expect_relative(s.spurious_trip_rate_per_yr, sensors + valve, kExactRelTol);
  expect_relative(*s.mttf_spurious_yr, 1.0 / (sensors + valve), kExactRelTol);
  bool cited = false;
  for (const std::string& a : s.assumptions)
    if (a.find("Gruhn & Cheddie") != std::string::npos) {
      cited = true;
      EXPECT_NE(a.find("lambda_dd where detected failures trip: sensors"), std::string::npos) << a;
      EXPECT_NE(a.find("not counted for the supplier figures: logic"), std::string::npos) << a;
    }
  EXPECT_TRUE(cited);
}

}  // namespace
}  // namespace sifter
