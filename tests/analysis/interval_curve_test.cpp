// Specification of PFDavg against the proof-test intervals and the longest allowed scaling.
#include "sifter/analysis/interval_curve.hpp"
// Specification of PFDavg against the proof-test intervals and the longest allowed interval.

#include <gtest/gtest.h>

#include <cmath>

#include "sifter/analysis/verify.hpp"
#include "sifter/analysis/whatif.hpp"
#include "sifter/input/load.hpp"

namespace sifter {
namespace {

constexpr double kOneYear = 8760.0;
constexpr double kRelTol = 1e-9;
// The what-if solver stops 2 x kEdgeRelTol (1e-9) inside an exclusive band edge, to 1e-12.
constexpr double kSolverRelTol = 1e-8;

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

LoadedProject loaded() {
  return load_project_text(kProject, "inline.json", std::string(SIFTER_SOURCE_DIR) + "/examples");
}

// IEC 61508-6:2010 B.3.2.2.1 (from memory): 1oo1 PFDavg = lDU (f T1 / 2 + MRT) + lDD MTTR,
// plus the supplier's 1e-4 in series; written out by hand.
double by_hand(double factor) { return 2e-6 * (factor * kOneYear / 2 + 8.0) + 1e-6 * 8.0 + 1e-4; }

TEST(IntervalCurve, ScalingTheIntervalsReRunsTheVerification) {
  const LoadedProject l = loaded();
  const Sif& sif = l.project.sifs[0];
  EXPECT_NEAR(pfd_avg_with_intervals_scaled(l.project, sif, 1.0), *verify_project(l).sifs[0].pfd_avg,
              by_hand(1.0) * kRelTol);
  for (double f : {0.25, 2.0, 8.0})
    EXPECT_NEAR(pfd_avg_with_intervals_scaled(l.project, sif, f), by_hand(f), by_hand(f) * kRelTol);
}

TEST(IntervalCurve, TheSweepRunsGeometricallyAndGrowsWithTheInterval) {
  const WhatIf what_if(loaded().project);
  const IntervalSweep s = interval_sweep(what_if, 0, 0.01);
  ASSERT_EQ(s.points.size(), 33u);  // 4 points per doubling from 1/16 to 16
  EXPECT_NEAR(s.points.front().factor, kSweepMinFactor, kRelTol);
  EXPECT_NEAR(s.points.back().factor, kSweepMaxFactor, kRelTol);
  for (std::size_t i = 1; i < s.points.size(); ++i) EXPECT_GT(s.points[i].pfd_avg, s.points[i - 1].pfd_avg);
}

// Solving by_hand = 0.01 for the valve's interval T: T = 2 (0.01 - 1e-4 - 2e-6 x 8 - 1e-6 x 8) /
// 2e-6 h = 9876 h. The report's longest interval is the what-if engine's answer, the one
// `sifter interval` prints, not a search of its own (issue 11).
TEST(IntervalCurve, TheLongestIntervalIsTheWhatIfEnginesAnswer) {
  const WhatIf what_if(loaded().project);
  const IntervalSweep s = interval_sweep(what_if, 0, 0.01);
  const double expected = 2.0 * (0.01 - 1e-4 - 2e-6 * 8.0 - 1e-6 * 8.0) / 2e-6;
  ASSERT_TRUE(s.longest.has_value());
  EXPECT_EQ(s.longest->outcome, IntervalOutcome::kFound);
  EXPECT_NEAR(s.longest->longest.hours, expected, expected * kSolverRelTol);
  const IntervalResult direct = longest_proof_test_interval(what_if, 0, std::nullopt, 0.0);
  EXPECT_EQ(s.longest->longest.hours, direct.longest.hours);
  ASSERT_EQ(s.subsystems.size(), 2u);
  EXPECT_FALSE(s.subsystems[0].present.has_value());  // the supplier's figure has no interval here
  ASSERT_TRUE(s.subsystems[1].longest.has_value());
  EXPECT_EQ(s.subsystems[1].longest->hours, direct.longest.hours);
}

TEST(IntervalCurve, NoIntervalMeetsARequirementBelowTheSupplierFigure) {
  std::string text = kProject;
  const std::string target = "\"target\": { \"pfd_avg\": 0.01 }";
  text.replace(text.find(target), target.size(), "\"target\": { \"pfd_avg\": 5e-5 }");
  const WhatIf what_if(load_project_text(text, "inline.json", ".").project);
  const IntervalSweep s = interval_sweep(what_if, 0, 5e-5);
  ASSERT_TRUE(s.longest.has_value());
  EXPECT_EQ(s.longest->outcome, IntervalOutcome::kNone);
  EXPECT_FALSE(s.subsystems[1].longest.has_value());
}

TEST(IntervalCurve, ASifOfSupplierFiguresHasNoIntervalToSolveFor) {
  const LoadedProject l = load_project_text(R"({
    "format": "sifter-project/1",
    "sifs": [ { "id": "S1", "target": { "sil": 2 }, "subsystems": [
      { "name": "package", "role": "logic", "pfd_avg": 1e-3, "hft": 1, "systematic_capability": 3 } ] } ]
  })",
                                            "inline.json", ".");
  const IntervalSweep s = interval_sweep(WhatIf(l.project), 0, 0.01);
  EXPECT_FALSE(s.longest.has_value());
  ASSERT_EQ(s.subsystems.size(), 1u);
  EXPECT_FALSE(s.subsystems[0].longest.has_value());
}

}  // namespace
}  // namespace sifter
