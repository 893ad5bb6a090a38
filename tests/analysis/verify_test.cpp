// Specification of the per-SIF verdict: the three SILs, the limits and what would lift them.
#include "sifter/analysis/verify.hpp"

#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <filesystem>

#include "sifter/input/load.hpp"
#include "sifter/report/json_results.hpp"

namespace sifter {
namespace {

constexpr double kRelTol = 1e-12;

ProjectResult verify_text(const std::string& text) {
  return verify_project(load_project_text(text, "inline.json", std::string(SIFTER_SOURCE_DIR) + "/examples"));
}

// A SIF of three 1oo1 subsystems; the caller fills in the target and the final element.
std::string project(const std::string& sif_extra, const std::string& final_vote, const std::string& final_channels,
                    const std::string& logic = R"("vote": "1oo1", "channels": ["LS-1"])") {
  return R"({
  "format": "sifter-project/1",
  "defaults": { "proof_test_interval": "1 yr", "mttr": "8 h" },
  "components": [
    { "id": "PT-1", "lambda_du": "50 FIT", "lambda_dd": "450 FIT", "lambda_sd": "300 FIT", "element_type": "B", "systematic_capability": 3 },
    { "id": "LS-1", "lambda_du": "5 FIT", "lambda_dd": "1000 FIT", "lambda_sd": "1000 FIT", "element_type": "B", "systematic_capability": 3 },
    { "id": "XV-1", "lambda_du": "500 FIT", "lambda_su": "500 FIT", "element_type": "A", "systematic_capability": 3 },
    { "id": "XV-2", "lambda_du": "500 FIT", "lambda_su": "500 FIT", "element_type": "A", "systematic_capability": 3 }
  ],
  "sifs": [ { "id": "S1", )" +
         sif_extra + R"(, "subsystems": [
    { "name": "sensor", "role": "sensor", "vote": "1oo1", "channels": ["PT-1"] },
    { "name": "logic", "role": "logic", )" +
         logic + R"( },
    { "name": "valves", "role": "final", "vote": ")" +
         final_vote + R"(", "channels": )" + final_channels + R"(, "beta": "10%" } ] } ]
})";
}

TEST(Verify, ASifMeetingEverythingHasNoLimits) {
  const auto r = verify_text(project(R"("target": {"sil": 1})", "1oo1", R"(["XV-1"])"));
  const auto& s = r.sifs[0];
  EXPECT_EQ(s.sil_probability, 2);
  EXPECT_EQ(s.sil_achieved, 2);  // IEC 61511-1:2016 Table 6 [seen]: SIL 2 needs no HFT in low demand
  EXPECT_EQ(s.meets_target, true);
  EXPECT_TRUE(s.limits.empty());
}

TEST(Verify, TheSifPfdIsTheSumOfItsSubsystems) {
  const auto r = verify_text(project(R"("target": {"sil": 1})", "1oo1", R"(["XV-1"])"));
  const auto& s = r.sifs[0];
  double sum = 0.0;
  for (const auto& sub : s.subsystems) sum += *sub.pfd_avg;
  EXPECT_NEAR(*s.pfd_avg, sum, sum * kRelTol);
  // The valve alone: lDU (T1/2 + MRT) = 5e-7 x (4380 + 8) h (DEVELOPERS.md, Methods M1, 1oo1).
  EXPECT_NEAR(*s.subsystems[2].pfd_avg, 5e-7 * 4388.0, 5e-7 * 4388.0 * kRelTol);
}

// A register's SIFs state a few dozen distinct assumptions between them (the method, the
// defaults taken): each is held once per run, in the words verify_sif gives each SIF alone.
TEST(Verify, TheSifsOfAProjectShareEachAssumptionTheyStateWordForWord) {
  std::string text = project(R"("target": {"sil": 1})", "1oo1", R"(["XV-1"])");
  const std::string first = R"({ "id": "S1", )";
  const auto sif_start = text.find(first);
  const auto sif_end = text.rfind("] } ]");
  ASSERT_NE(sif_start, std::string::npos);
  ASSERT_NE(sif_end, std::string::npos);
  std::string second = text.substr(sif_start, sif_end + 3 - sif_start);  // the SIF object, "}" included
  second.replace(0, first.size(), R"({ "id": "S2", )");
  text.insert(sif_end + 3, ", " + second);
  const auto r = verify_text(text);
  ASSERT_EQ(r.sifs.size(), 2u);
  const auto& a = r.sifs[0].assumptions;
  const auto& b = r.sifs[1].assumptions;
  ASSERT_EQ(a.size(), b.size());
  ASSERT_FALSE(a.empty());
  for (std::size_t i = 0; i < a.size(); ++i) {
    EXPECT_EQ(a[i], b[i]);
    EXPECT_TRUE(a[i].shares_with(b[i])) << "held twice: " << a[i];
  }
  const auto loaded = load_project_text(text, "inline.json", std::string(SIFTER_SOURCE_DIR) + "/examples");
  std::vector<Warning> warnings;
  const SifResult alone = verify_sif(loaded.project, loaded.project.sifs[0], std::nullopt, VerifyOptions{}, warnings);
  ASSERT_EQ(alone.assumptions.size(), a.size());
  for (std::size_t i = 0; i < a.size(); ++i) EXPECT_EQ(alone.assumptions[i], a[i]);
}

// `check` builds the LOPA worksheet rows only when something it writes prints them, and keeps
// no response-time budget (only the SRS and the report print one). Leaving them out must change
// nothing else: every figure, credit, finding, check and assumption of the results file stays
// word for word (common practice: a presentation is derived from the figures, never the other
// way round).
TEST(Verify, LeavingOutTheWorksheetRowsAndTheResponseBudgetsChangesNothingElse) {
  int scenarios = 0, budgets = 0;
  for (const auto& e : std::filesystem::directory_iterator(std::filesystem::path(SIFTER_SOURCE_DIR) / "examples")) {
    if (e.path().extension() != ".json") continue;
    const LoadedProject loaded = load_project_file(e.path().string());
    const ProjectResult kept = verify_project(loaded, VerifyOptions{});
    VerifyOptions lean;
    lean.worksheet_rows = false;
    lean.response_budgets = false;
    const ProjectResult left_out = verify_project(loaded, lean);
    SCOPED_TRACE(e.path().filename().string());
    EXPECT_EQ(report::results_json(kept).dump(), report::results_json(left_out).dump());
    ASSERT_EQ(kept.scenarios.size(), left_out.scenarios.size());
    for (std::size_t i = 0; i < kept.scenarios.size(); ++i) {
      EXPECT_FALSE(kept.scenarios[i].worksheet.empty()) << kept.scenarios[i].id;
      EXPECT_TRUE(left_out.scenarios[i].worksheet.empty()) << kept.scenarios[i].id;
      ++scenarios;
    }
    ASSERT_EQ(kept.sifs.size(), left_out.sifs.size());
    for (std::size_t i = 0; i < kept.sifs.size(); ++i) {
      EXPECT_EQ(kept.sifs[i].response_budget.size(), loaded.project.sifs[i].subsystems.size()) << kept.sifs[i].id;
      EXPECT_TRUE(left_out.sifs[i].response_budget.empty()) << kept.sifs[i].id;
      EXPECT_EQ(kept.sifs[i].response_time_s, left_out.sifs[i].response_time_s) << kept.sifs[i].id;
      if (kept.sifs[i].response_time_s) ++budgets;
    }
  }
  EXPECT_GE(scenarios, 5);
  EXPECT_GE(budgets, 2) << "SIFs whose response time is summed from their budget";
}

TEST(TextPool, EqualWordsBuiltApartShareOneStringAndKeepTheirOrder) {
  std::vector<SharedText> one{std::string("MTTR 8 h from the project defaults: sensing"), std::string("beta 10%")};
  std::vector<SharedText> two{std::string("beta 10%"), std::string("MTTR 8 h from the project defaults: sensing"),
                              std::string("MRT taken equal to MTTR")};
  EXPECT_FALSE(one[0].shares_with(two[1]));
  TextPool pool;
  pool.share(one);
  pool.share(two);
  EXPECT_EQ(pool.size(), 3u);
  EXPECT_TRUE(one[0].shares_with(two[1]));
  EXPECT_TRUE(one[1].shares_with(two[0]));
  EXPECT_EQ(two[0], "beta 10%");
  EXPECT_EQ(two[1], "MTTR 8 h from the project defaults: sensing");
  EXPECT_EQ(two[2], std::string("MRT taken equal to MTTR"));
  EXPECT_FALSE(two[2].shares_with(one[0]));
}

// IEC 61511-1:2016 Table 6 [seen]: SIL 3 needs HFT 1, so a 1oo1 valve caps the SIF at SIL 2.
TEST(Verify, TooLittleFaultToleranceLimitsTheArchitecture) {
  const auto r = verify_text(project(R"("target": {"sil": 3})", "1oo1", R"(["XV-1"])"));
  const auto& s = r.sifs[0];
  EXPECT_EQ(s.sil_architecture, 2);
  EXPECT_EQ(s.meets_target, false);
  bool found = false;
  for (const auto& l : s.limits)
    if (l.kind == "architecture" && l.subsystem == "valves") {
      found = true;
      EXPECT_EQ(l.sil, 2);
      EXPECT_NE(l.message.find("1oo2"), std::string::npos) << l.message;
    }
  EXPECT_TRUE(found);
}

TEST(Verify, ALogicSolverOfSystematicCapabilityTwoCapsASilThreeFunction) {
  const auto r = verify_text(project(R"("target": {"sil": 3})", "1oo2", R"(["XV-1", "XV-2"])",
                                     R"("pfd_avg": 1e-5, "hft": 1, "systematic_capability": 2)"));
  const auto& s = r.sifs[0];
  EXPECT_EQ(s.sil_systematic, 2);
  EXPECT_EQ(s.sil_achieved, 2);
  EXPECT_EQ(s.meets_target, false);
  ASSERT_FALSE(s.limits.empty());
  bool found = false;
  for (const auto& l : s.limits)
    if (l.kind == "systematic") {
      found = true;
      EXPECT_EQ(l.subsystem, "logic");
      EXPECT_EQ(l.sil, 2);
    }
  EXPECT_TRUE(found);
}

TEST(Verify, APfdAboveTheRequiredValueFallsShortEvenInsideTheSameBand) {
  // DEVELOPERS.md, Methods M4: a target by RRF is met only when PFDavg <= 1/RRF, not by the band.
  const auto r = verify_text(project(R"("target": {"rrf": 500})", "1oo1", R"(["XV-1"])"));
  const auto& s = r.sifs[0];
  EXPECT_EQ(s.sil_probability, 2);
  EXPECT_EQ(s.sil_required, 2);
  EXPECT_GT(*s.pfd_avg, 1.0 / 500);
  EXPECT_EQ(s.meets_target, false);
  ASSERT_FALSE(s.limits.empty());
  EXPECT_EQ(s.limits[0].kind, "probability");
}

TEST(Verify, Route1HUsesTheSafeFailureFractionTables) {
  // PT-1: SFF = (300 + 450) / 800 = 93.75 %, Type B, HFT 0 -> SIL 2 (IEC 61508-2:2010 Table 3, seen).
  const auto r = verify_text(project(R"("target": {"sil": 1}, "constraints": "route_1h")", "1oo1", R"(["XV-1"])"));
  const auto& s = r.sifs[0];
  EXPECT_EQ(s.constraints, ConstraintBasis::kRoute1H);
  EXPECT_EQ(s.subsystems[0].sil_architecture, 2);
  EXPECT_NEAR(*s.subsystems[0].sff, 0.9375, 1e-12);
}

TEST(Verify, HighDemandSifsAreVerifiedOnPfh) {
  const auto r =
      verify_text(project(R"("demand_mode": "high", "target": {"pfh": "1e-6/h"})", "1oo2", R"(["XV-1", "XV-2"])"));
  const auto& s = r.sifs[0];
  EXPECT_FALSE(s.pfd_avg);
  ASSERT_TRUE(s.pfh_per_hour);
  // 1oo1 sensor: PFH = lDU = 5e-8 per hour (IEC 61508-6:2010 B.3.3.2, from memory).
  EXPECT_NEAR(*s.subsystems[0].pfh_per_hour, 5e-8, 5e-8 * kRelTol);
  EXPECT_EQ(s.meets_target, true);
}

TEST(Verify, ASifWithoutTargetIsComputedButNotJudged) {
  const auto r = verify_text(project(R"("title": "no target")", "1oo1", R"(["XV-1"])"));
  EXPECT_FALSE(r.sifs[0].meets_target);
  EXPECT_TRUE(r.all_met());
  // Other warnings (failure data without a source) may stand beside it; this one must be there.
  bool said = false;
  for (const auto& w : r.warnings)
    said = said || w.message == "no target and no scenario names this SIF; it is computed but not judged";
  EXPECT_TRUE(said);
}

// Where the Annex B equations stop being accurate: for one channel, lDU T1 / 2 overstates the
// exact 1 - (1 - exp(-x)) / x by about 3.4 % at x = lDU T1 = 0.1 (DEVELOPERS.md, Methods M8, computed).
std::string one_channel(const std::string& lambda_du, const std::string& interval) {
  return R"({"format": "sifter-project/1", "defaults": {"proof_test_interval": ")" + interval + R"(", "mttr": "8 h"},
    "components": [{"id": "XV-1", "lambda_du": ")" +
         lambda_du + R"(", "element_type": "A", "systematic_capability": 3}],
    "sifs": [{"id": "S1", "target": {"sil": 1}, "subsystems": [
      {"name": "valve", "role": "final", "vote": "1oo1", "channels": ["XV-1"]}]}]})";
}

bool warns_of_accuracy(const ProjectResult& r) {
  for (const auto& w : r.warnings)
    if (w.message.find("the simplified equations lose accuracy above lDU·T1 = 0.1") != std::string::npos) return true;
  return false;
}

TEST(Verify, AChannelBeyondLambdaTimesIntervalOfOneTenthIsWarnedAbout) {
  // 2e-5/h x 8760 h = 0.1752
  const auto r = verify_text(one_channel("2e-5/h", "1 yr"));
  ASSERT_TRUE(warns_of_accuracy(r));
  const auto& w = *std::find_if(r.warnings.begin(), r.warnings.end(),
                                [](const Warning& x) { return x.message.find("lose accuracy") != std::string::npos; });
  EXPECT_EQ(w.where, "/sifs/0/subsystems/0");
  EXPECT_EQ(w.message,
            "lDU·T1 = 0.1752 for a channel of valve: the simplified equations lose accuracy above "
            "lDU·T1 = 0.1; see the exact cross-check");
  // The reason, recomputed: at x = 0.1752 the simplified x / 2 overstates the exact average by more than 5 %.
  const double x = 2e-5 * 8760.0;
  EXPECT_GT((x / 2) / (1.0 - (1.0 - std::exp(-x)) / x), 1.05);
}

TEST(Verify, AChannelWithinLambdaTimesIntervalOfOneTenthIsNotWarnedAbout) {
  // 1e-5/h x 8760 h = 0.0876; and the same rate tested every 2 yr crosses the limit.
  EXPECT_FALSE(warns_of_accuracy(verify_text(one_channel("1e-5/h", "1 yr"))));
  EXPECT_TRUE(warns_of_accuracy(verify_text(one_channel("1e-5/h", "2 yr"))));
}

}  // namespace
}  // namespace sifter

namespace sifter {
namespace {

TEST(VerifyExact, EverySifGetsAnExactValueCloseToTheSimplifiedOneForSmallRates) {
  const auto r = verify_text(project(R"("target": {"sil": 1})", "1oo2", R"(["XV-1", "XV-2"])"));
  const auto& s = r.sifs[0];
  ASSERT_TRUE(s.pfd_avg_exact);
  ASSERT_TRUE(s.simplified_over_exact);
  // lDU T1 <= 4.4e-3 here: Annex B and the exact average agree within 1 % (the exact-engine
  // tests check the same limit group by group).
  EXPECT_NEAR(*s.simplified_over_exact, 1.0, 0.01);
  for (const auto& sub : s.subsystems) EXPECT_TRUE(sub.pfd_avg_exact);
}

// Hand forms for the 1oo2 of XV-1 (lDU 5e-7/h) and PT-1 (lDU 5e-8/h, lDD 4.5e-7/h, MTTR 8 h),
// beta 10 %, T1 = 8760 h, MRT = MTTR = 8 h. They drop second-order terms (MRT against T1,
// products of detected and undetected unavailabilities), worth well under this share.
constexpr double kMixedHandRelTol = 0.03;

// The pfd_avg of a group of different channels used to be compared with pfd_avg_exact, i.e. two
// copies of one figure. Now the judged figure is checked against a hand computation: the
// exact engine's rule (DEVELOPERS.md Methods) puts the common cause at beta times the smaller
// channel rate, beta lDU_min (T1/2 + MRT) = 0.1 x 5e-8 x 4388 = 2.194e-5, and the independent
// rest fails both channels with about lDU1' lDU2' T1^2/3 + lDU1' T1/2 x lDD2 MTTR
// = 4.95e-7 x 4.5e-8 x 8760^2 / 3 + 4.95e-7 x 4380 x 3.6e-6 = 5.70e-7 + 7.8e-9: 2.252e-5 in all.
TEST(VerifyExact, DifferentChannelsAreJudgedOnTheExactFigureThatAHandComputationGives) {
  const auto r = verify_text(project(R"("target": {"sil": 1})", "1oo2", R"(["XV-1", "PT-1"])"));
  const auto& valves = r.sifs[0].subsystems[2];
  ASSERT_TRUE(valves.pfd_avg);
  const double ccf = 0.1 * 5e-8 * (8760.0 / 2 + 8.0);
  const double independent = 4.95e-7 * 4.5e-8 * 8760.0 * 8760.0 / 3 + 4.95e-7 * 4380.0 * 4.5e-7 * 8.0;
  EXPECT_NEAR(*valves.pfd_avg, ccf + independent, (ccf + independent) * kMixedHandRelTol);
  EXPECT_EQ(valves.judged_on, JudgedOn::kExact);
  EXPECT_NE(valves.equation.find("judged on the exact multi-phase Markov model (channels differ)"), std::string::npos)
      << valves.equation;
  // The simplified figure is kept beside it and is not what the verdict rests on here.
  ASSERT_TRUE(valves.pfd_avg_simplified);
  EXPECT_GT(*valves.pfd_avg_simplified, *valves.pfd_avg * 2);
}

// Without the exact engine, a group of different channels is judged on the per-channel
// simplified figure (no longer on the largest rates of its channels): the common cause on the
// channels' mean lDU, 0.1 x 2.75e-7 x 4388 = 1.2067e-4, plus about 0.81 x 5e-7 x 5e-8 x
// 8760^2 / 3 = 5.2e-7 independent (IEC 61508-6:2010 B.3.2.2 with per-channel rates, from
// memory; DEVELOPERS.md Methods). The 1oo2 of two XV-1 valves would give 2.2e-4.
TEST(VerifyExact, WithoutTheExactEngineDifferentChannelsUseTheirOwnRates) {
  VerifyOptions no_exact;
  no_exact.exact = false;
  const auto mixed = verify_project(
      load_project_text(project(R"("target": {"sil": 1})", "1oo2", R"(["PT-1", "XV-1"])"), "inline.json", "."),
      no_exact);
  const double expected = 0.1 * 2.75e-7 * (8760.0 / 2 + 8.0) + 0.81 * 5e-7 * 5e-8 * 8760.0 * 8760.0 / 3;
  EXPECT_NEAR(*mixed.sifs[0].subsystems[2].pfd_avg, expected, expected * kMixedHandRelTol);
  EXPECT_FALSE(mixed.sifs[0].pfd_avg_exact);
}

TEST(VerifyExact, AStretchedIntervalWarnsThatTheSimplifiedEquationsLoseAccuracy) {
  std::string text = project(R"("target": {"sil": 1})", "1oo1", R"(["XV-1"])");
  text.replace(text.find("\"1 yr\""), 6, "\"30 yr\"");  // lDU T1 = 5e-7 x 262800 h = 0.13
  const auto r = verify_text(text);
  bool warned = false;
  for (const auto& w : r.warnings) warned = warned || w.message.find("lose accuracy above") != std::string::npos;
  EXPECT_TRUE(warned);
}

}  // namespace
}  // namespace sifter
