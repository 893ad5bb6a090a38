// Specification of PFDavg against the proof-test intervals and the longest allowed scaling.
#include "sifter/engines/interval_curve.hpp"

#include <gtest/gtest.h>

#include <cmath>

#include "sifter/input/load.hpp"
#include "sifter/analysis/verify.hpp"

namespace sifter {
namespace {

constexpr double kOneYear = 8760.0;
constexpr double kRelTol = 1e-9;
// The bisection stops within 2^-40 of the 20 doublings searched.
constexpr double kBisectionRelTol = 1e-9;

// One valve, 1oo1, lDU = 2e-6/h, lDD = 1e-6/h, T1 = 1 yr, MTTR = MRT = 8 h; and a supplier's
// logic solver of PFDavg 1e-4 that no interval changes.
constexpr const char* kProject = R"({
  "format": "sifter-project/1",
  "defaults": { "proof_test_interval": "1 yr", "mttr": "8 h", "mission_time": "20 yr" },
  "components": [
    { "id": "XV-1", "lambda_du": "2e-6/h", "lambda_dd": "1e-6/h", "element_type": "A", "systematic_capability": 3 }
  ],
  "sifs": [ { "id": "S1", "target": { "pfd_avg": 0.01 }, "subsystems": [
    { "name": "logic", "role": "logic", "pfd_avg": 1e-4, "hft": 0, "systematic_capability": 3 },
    { "name": "valve", "role": "final", "vote": "1oo1", "channels": ["XV-1"], "mrt": "8 h" } ] } ]
})";

LoadedProject loaded() { return load_project_text(kProject, "inline.json", std::string(SIFTER_SOURCE_DIR) + "/examples"); }

// IEC 61508-6:2010 B.3.2.2.1 (from memory): 1oo1 PFDavg = lDU (f T1 / 2 + MRT) + lDD MTTR,
// plus the supplier's 1e-4 in series; written out by hand.
double by_hand(double factor) { return 2e-6 * (factor * kOneYear / 2 + 8.0) + 1e-6 * 8.0 + 1e-4; }

TEST(IntervalCurve, ScalingTheIntervalsReRunsTheVerification) {
  const LoadedProject l = loaded();
  const Sif& sif = l.project.sifs[0];
  EXPECT_NEAR(pfd_avg_with_intervals_scaled(l.project, sif, 1.0), *verify_project(l).sifs[0].pfd_avg,
              by_hand(1.0) * kRelTol);
  for (double f : {0.25, 2.0, 8.0}) EXPECT_NEAR(pfd_avg_with_intervals_scaled(l.project, sif, f), by_hand(f), by_hand(f) * kRelTol);
}

TEST(IntervalCurve, TheSweepRunsGeometricallyAndGrowsWithTheInterval) {
  const LoadedProject l = loaded();
  const IntervalSweep s = interval_sweep(l.project, l.project.sifs[0], 0.01);
  ASSERT_EQ(s.points.size(), 33u);  // 4 points per doubling from 1/16 to 16
  EXPECT_NEAR(s.points.front().factor, kSweepMinFactor, kRelTol);
  EXPECT_NEAR(s.points.back().factor, kSweepMaxFactor, kRelTol);
  for (std::size_t i = 1; i < s.points.size(); ++i) EXPECT_GT(s.points[i].pfd_avg, s.points[i - 1].pfd_avg);
}

// Solving by_hand(f) = 0.01 for f: f = 2 (0.01 - 1e-4 - 2e-6 x 8 - 1e-6 x 8) / (2e-6 x 8760).
TEST(IntervalCurve, TheLongestAllowedScalingMeetsTheRequiredPfdExactly) {
  const LoadedProject l = loaded();
  const IntervalSweep s = interval_sweep(l.project, l.project.sifs[0], 0.01);
  const double expected = 2.0 * (0.01 - 1e-4 - 2e-6 * 8.0 - 1e-6 * 8.0) / (2e-6 * kOneYear);
  ASSERT_TRUE(s.longest_factor.has_value());
  EXPECT_NEAR(*s.longest_factor, expected, expected * kBisectionRelTol);
  ASSERT_EQ(s.subsystems.size(), 2u);
  EXPECT_FALSE(s.subsystems[0].present.has_value());  // the supplier's figure has no interval here
  ASSERT_TRUE(s.subsystems[1].longest.has_value());
  EXPECT_NEAR(s.subsystems[1].longest->hours, expected * kOneYear, expected * kOneYear * kBisectionRelTol);
  EXPECT_FALSE(s.meets_beyond_search);
}

TEST(IntervalCurve, NoScalingMeetsARequirementBelowTheSupplierFigure) {
  const LoadedProject l = loaded();
  const IntervalSweep s = interval_sweep(l.project, l.project.sifs[0], 5e-5);
  EXPECT_FALSE(s.longest_factor.has_value());
  EXPECT_FALSE(s.meets_beyond_search);
}

TEST(IntervalCurve, ASifOfSupplierFiguresMeetsItsRequirementAtEveryScaling) {
  const LoadedProject l = load_project_text(R"({
    "format": "sifter-project/1",
    "sifs": [ { "id": "S1", "target": { "sil": 2 }, "subsystems": [
      { "name": "package", "role": "logic", "pfd_avg": 1e-3, "hft": 1, "systematic_capability": 3 } ] } ]
  })", "inline.json", ".");
  const IntervalSweep s = interval_sweep(l.project, l.project.sifs[0], 0.01);
  EXPECT_FALSE(s.longest_factor.has_value());
  EXPECT_TRUE(s.meets_beyond_search);
}

}  // namespace
}  // namespace sifter
