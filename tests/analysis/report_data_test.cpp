// Specification of what the report draws besides the results: curves, sweeps, the required line.
#include "sifter/analysis/report_data.hpp"

#include <gtest/gtest.h>

#include <cmath>

#include "sifter/analysis/whatif.hpp"
#include "sifter/input/load.hpp"

namespace sifter {
namespace {

constexpr double kRelTol = 1e-12;

struct Computed {
  LoadedProject loaded;
  ProjectResult result;
  ReportData data;
};

Computed compute(const LoadedProject& loaded) {
  Computed c{loaded, verify_project(loaded), {}};
  c.data = build_report_data(c.loaded.project, c.result, ReportOptions{"2025-01-31", true, 50});
  return c;
}

Computed example() { return compute(load_project_file(std::string(SIFTER_SOURCE_DIR) + "/examples/unit40.json")); }

// SIF-401 must reach SIL 2 (PFDavg below 1e-2, IEC 61511-1:2016 Table 4) and the LOPA asks RRF
// 58.5 (PFD 1/58.5 = 1.71e-2): verify requires both, so the line is the band's 1e-2. SIF-402's
// LOPA asks RRF 600: 1/600 is stricter than its SIL 2 band.
TEST(ReportData, TheRequiredLineIsTheStricterOfTheSilBandAndTheRequiredPfd) {
  const Computed c = example();
  ASSERT_EQ(c.data.sifs.size(), 3u);
  EXPECT_NEAR(*c.result.sifs[0].required_pfd, 1.0 / 58.5, kRelTol);
  EXPECT_NEAR(*c.data.sifs[0].required_pfd, 1e-2, 1e-2 * kRelTol);
  EXPECT_NEAR(*c.data.sifs[1].required_pfd, 1.0 / 600.0, kRelTol);
  EXPECT_NEAR(c.data.sifs[0].interval_sweep->required_pfd, 1e-2, 1e-2 * kRelTol);
}

TEST(ReportData, EachLowDemandSifGetsItsExactCurveSweepAndSensitivityRanking) {
  const Computed c = example();
  for (std::size_t i = 0; i < c.data.sifs.size(); ++i) {
    const auto& d = c.data.sifs[i];
    ASSERT_TRUE(d.pfd_curve.has_value());
    EXPECT_EQ(d.pfd_curve->pfd_subsystems.size(), c.result.sifs[i].subsystems.size());
    EXPECT_TRUE(d.interval_sweep.has_value());
    EXPECT_EQ(d.pfd_curve->engine.rfind("exact multi-phase Markov model", 0), 0u);
    ASSERT_FALSE(d.sensitivity.empty());
    for (std::size_t k = 1; k < d.sensitivity.size(); ++k)  // widest swing first
      EXPECT_GE(std::abs(d.sensitivity[k - 1].high_pfd - d.sensitivity[k - 1].low_pfd),
                std::abs(d.sensitivity[k].high_pfd - d.sensitivity[k].low_pfd));
  }
  EXPECT_EQ(c.data.date, "2025-01-31");
  EXPECT_EQ(c.data.tool_version, SIFTER_VERSION);
}

// The report's longest interval is the what-if engine's answer, the one `sifter interval`
// prints (no second search; issue 11): equal to the last bit on every SIF of the example.
TEST(ReportData, TheLongestIntervalOfEachSifIsTheAnswerOfTheIntervalCommand) {
  const Computed c = example();
  const WhatIf what_if(c.loaded.project);
  int compared = 0;
  for (std::size_t i = 0; i < c.data.sifs.size(); ++i) {
    const auto& sweep = c.data.sifs[i].interval_sweep;
    if (!sweep) continue;
    ASSERT_TRUE(sweep->longest.has_value()) << c.result.sifs[i].id;
    const IntervalResult direct = longest_proof_test_interval(what_if, i, std::nullopt, 0.0);
    EXPECT_EQ(sweep->longest->outcome, direct.outcome) << c.result.sifs[i].id;
    EXPECT_EQ(sweep->longest->longest.hours, direct.longest.hours) << c.result.sifs[i].id;
    EXPECT_EQ(sweep->longest->whole_months, direct.whole_months) << c.result.sifs[i].id;
    for (const auto& sub : sweep->subsystems) {
      if (sub.longest) {
        EXPECT_EQ(sub.longest->hours, direct.longest.hours) << sub.name;
      }
    }
    ++compared;
  }
  EXPECT_EQ(compared, 3);
}

// SIF-403: probability SIL 3, architecture SIL 2 (1oo1 final element), systematic SIL 2
// (SC 2 transmitters): the achieved SIL 2 comes from the last two.
TEST(ReportData, NamesTheResultsThatGiveTheAchievedSil) {
  const Computed c = example();
  EXPECT_EQ(c.data.sifs[2].limiting, (std::vector<std::string>{"architecture", "systematic"}));
}

TEST(ReportData, AHighDemandSifHasNoPfdCurve) {
  const Computed c = compute(load_project_text(R"({
    "format": "sifter-project/1",
    "components": [ { "id": "XV-1", "lambda_du": "1e-7/h", "element_type": "A", "systematic_capability": 3 } ],
    "sifs": [ { "id": "S1", "demand_mode": "high", "target": { "sil": 1 }, "subsystems": [
      { "name": "valve", "role": "final", "vote": "1oo1", "channels": ["XV-1"], "proof_test_interval": "1 yr", "mttr": "8 h" } ] } ]
  })",
                                               "inline.json", "."));
  ASSERT_EQ(c.data.sifs.size(), 1u);
  EXPECT_FALSE(c.data.sifs[0].pfd_curve.has_value());
  EXPECT_FALSE(c.data.sifs[0].interval_sweep.has_value());
  EXPECT_FALSE(c.data.sifs[0].required_pfd.has_value());
}

}  // namespace
}  // namespace sifter
