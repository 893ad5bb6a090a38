// Specification of the what-ifs: longest interval, sweep, compare votes and sensitivity.
#include "sifter/analysis/whatif.hpp"

#include <gtest/gtest.h>

#include <cmath>
#include <fstream>
#include <sstream>

#include "sifter/engines/sil.hpp"
#include "sifter/engines/spurious.hpp"
#include "sifter/input/load.hpp"
#include "support/tolerance.hpp"

namespace sifter {
namespace {

using sifter::testing::expect_relative;

// Closed forms and the solver agree to the solver's tolerance (TOMS 748 to ~1e-12).
constexpr double kSolverRelTol = 1e-9;
// The issue's check: the solution put back into check gives the required PFD within 0.1 %.
constexpr double kPutBackRelTol = 1e-3;
// Hand-computed values are compared to machine precision, relatively.
constexpr double kExactRelTol = 1e-12;

Project load(const std::string& text) { return load_project_text(text, "inline.json", ".").project; }

// One SIF of one group of identical channels; every number written out so tests can recompute.
std::string one_group(const std::string& vote, int channels, const std::string& target, const std::string& rates,
                      const std::string& extra = "") {
  std::string components, ids;
  for (int i = 1; i <= channels; ++i) {
    components += std::string(i > 1 ? ",\n" : "") + R"(    { "id": "XV-)" + std::to_string(i) + R"(", )" + rates +
                  R"(, "element_type": "A", "systematic_capability": 3 })";
    ids += std::string(i > 1 ? ", " : "") + "\"XV-" + std::to_string(i) + "\"";
  }
  return R"({
  "format": "sifter-project/1",
  "defaults": { "proof_test_interval": "1 yr", "mttr": "8 h", "mission_time": "20 yr" },
  "components": [
)" + components +
         R"(
  ],
  "sifs": [ { "id": "S1", "demand_mode": "low", "target": )" +
         target + R"(, "subsystems": [
    { "name": "valves", "role": "final", "vote": ")" +
         vote + R"(", "channels": [)" + ids + R"(],
      "beta": "5%", "beta_d": "2%", "mrt": "24 h")" +
         extra + R"( } ] } ]
})";
}

constexpr const char* kRates = R"("lambda_du": "2e-6/h", "lambda_dd": "5e-7/h", "lambda_su": "1e-6/h")";

// ---- Longest interval -------------------------------------------------------------------

// From DEVELOPERS.md, Methods M1 (IEC 61508-6:2010 B.3.2.2, from memory), 1oo1: PFD = lDU (T1/2 + MRT)
// + lDD MTTR, so the longest T1 with PFD <= PFDreq is 2 (PFDreq - lDD MTTR)/lDU - 2 MRT.
TEST(LongestInterval, OneOutOfOneMatchesTheClosedForm) {
  const double pfd_req = 5e-3, ldu = 2e-6, ldd = 5e-7, mttr = 8.0, mrt = 24.0;
  const WhatIf w(load(one_group("1oo1", 1, R"({"pfd_avg": 0.005})", kRates)));
  const auto r = longest_proof_test_interval(w, 0, std::nullopt, 0.0);
  ASSERT_EQ(r.outcome, IntervalOutcome::kFound);
  const double closed_form = 2 * (pfd_req - ldd * mttr) / ldu - 2 * mrt;
  expect_relative(r.longest.hours, closed_form, kSolverRelTol);
  expect_relative(r.measure_at_longest, pfd_req, kSolverRelTol);
  EXPECT_FALSE(r.requirement.band_edge);
}

TEST(LongestInterval, AMarginKeepsThePfdThatFarBelowTheRequirement) {
  const double pfd_req = 5e-3, ldu = 2e-6, ldd = 5e-7, mttr = 8.0, mrt = 24.0, margin = 0.2;
  const WhatIf w(load(one_group("1oo1", 1, R"({"pfd_avg": 0.005})", kRates)));
  const auto r = longest_proof_test_interval(w, 0, std::nullopt, margin);
  const double closed_form = 2 * (pfd_req * (1 - margin) - ldd * mttr) / ldu - 2 * mrt;
  expect_relative(r.longest.hours, closed_form, kSolverRelTol);
  expect_relative(r.allowed, pfd_req * 0.8, kExactRelTol);
}

TEST(LongestInterval, WholeMonthsAreTheLargestThatStillMeetTheRequirement) {
  const WhatIf w(load(one_group("1oo1", 1, R"({"pfd_avg": 0.005})", kRates)));
  const auto r = longest_proof_test_interval(w, 0, std::nullopt, 0.0);
  // 2 (5e-3 - 4e-6)/2e-6 - 48 = 4948 h = 6.78 months: 6 whole months.
  EXPECT_EQ(r.whole_months, 6);
  ASSERT_TRUE(r.measure_at_whole_months);
  EXPECT_LE(*r.measure_at_whole_months, 5e-3);
}

class LongestIntervalPutBack : public ::testing::TestWithParam<std::pair<const char*, int>> {};

// The issue's check: for redundant groups the solution, written into the project and verified
// by check, gives the required PFD within 0.1 %.
TEST_P(LongestIntervalPutBack, TheSolutionGivesTheRequiredPfdInCheck) {
  const auto [vote, n] = GetParam();
  const double pfd_req = 1e-4;
  const std::string target = R"({"pfd_avg": 0.0001})";
  const WhatIf w(load(one_group(vote, n, target, kRates)));
  const auto r = longest_proof_test_interval(w, 0, std::nullopt, 0.0);
  ASSERT_EQ(r.outcome, IntervalOutcome::kFound);
  char interval[64];
  std::snprintf(interval, sizeof interval, R"(, "proof_test_interval": "%.17g h")", r.longest.hours);
  const LoadedProject back = load_project_text(one_group(vote, n, target, kRates, interval), "back.json", ".");
  const auto result = verify_project(back);
  expect_relative(*result.sifs[0].pfd_avg, pfd_req, kPutBackRelTol);
  EXPECT_EQ(result.sifs[0].meets_target, true);
}

INSTANTIATE_TEST_SUITE_P(Votes, LongestIntervalPutBack,
                         ::testing::Values(std::pair{"1oo2", 2}, std::pair{"2oo3", 3}, std::pair{"1oo3", 3}));

TEST(LongestInterval, NoIntervalMeetsATargetTheDetectedFailuresAloneExceed) {
  // lDD MTTR = 1e-4 x 8 = 8e-4 > 5e-4: no proof-test interval can help (DEVELOPERS.md, Methods M1, 1oo1).
  const WhatIf w(
      load(one_group("1oo1", 1, R"({"pfd_avg": 0.0005})", R"("lambda_du": "1e-7/h", "lambda_dd": "1e-4/h")")));
  const auto r = longest_proof_test_interval(w, 0, std::nullopt, 0.0);
  EXPECT_EQ(r.outcome, IntervalOutcome::kNone);
  expect_relative(r.measure_at_zero, 1e-4 * 8 + 1e-7 * 24, kExactRelTol);
  ASSERT_FALSE(r.notes.empty());
  EXPECT_NE(r.notes[0].find("already exceed"), std::string::npos) << r.notes[0];
}

TEST(LongestInterval, EveryIntervalUpToTheMissionMeetsAnEasyTarget) {
  // lDU = 1e-9: even T1 = 20 yr gives 1e-9 x 87600 = 8.8e-5 < 1e-2.
  const WhatIf w(load(one_group("1oo1", 1, R"({"sil": 1})", R"("lambda_du": "1e-9/h")")));
  const auto r = longest_proof_test_interval(w, 0, std::nullopt, 0.0);
  EXPECT_EQ(r.outcome, IntervalOutcome::kWholeMission);
  EXPECT_DOUBLE_EQ(r.longest.hours, 20 * kHoursPerYear);
  EXPECT_EQ(r.whole_months, 240);
}

TEST(LongestInterval, ASilTargetStopsJustInsideTheHalfOpenBand) {
  // DEVELOPERS.md, Methods M4 [seen]: PFDavg exactly 0.01 is SIL 1, so a SIL 2 answer must stay below it.
  const WhatIf w(load(one_group("1oo1", 1, R"({"sil": 2})", kRates)));
  const auto r = longest_proof_test_interval(w, 0, std::nullopt, 0.0);
  ASSERT_EQ(r.outcome, IntervalOutcome::kFound);
  EXPECT_TRUE(r.requirement.band_edge);
  EXPECT_LT(r.measure_at_longest, 1e-2);
  EXPECT_EQ(sil_from_pfd_avg(r.measure_at_longest), 2);
  expect_relative(r.measure_at_longest, 1e-2, 1e-8);
}

TEST(LongestInterval, TheStricterOfTheTargetAndTheLopaRequirementGoverns) {
  SifResult s;
  s.demand_mode = DemandMode::kLow;
  s.sil_required = 2;
  s.required_pfd = 1.0 / 58.5;  // the LOPA asks less than the SIL 2 band
  auto q = governing_requirement(s);
  ASSERT_TRUE(q);
  EXPECT_TRUE(q->band_edge);
  EXPECT_DOUBLE_EQ(q->value, 1e-2);
  s.required_pfd = 1.0 / 600;  // now the LOPA value is stricter than the band
  q = governing_requirement(s);
  EXPECT_FALSE(q->band_edge);
  EXPECT_DOUBLE_EQ(q->value, 1.0 / 600);
  EXPECT_FALSE(governing_requirement(SifResult{}));
}

// ---- Sweep ------------------------------------------------------------------------------

std::string example_text() {
  std::ifstream in(std::string(SIFTER_SOURCE_DIR) + "/examples/unit40.json");
  std::ostringstream s;
  s << in.rdbuf();
  return s.str();
}

Project example() {
  return load_project_text(example_text(), "examples/unit40.json", std::string(SIFTER_SOURCE_DIR) + "/examples")
      .project;
}

double check_pfd_of_sif401(const std::string& text) {
  const auto loaded = load_project_text(text, "examples/unit40.json", std::string(SIFTER_SOURCE_DIR) + "/examples");
  return *verify_project(loaded).sifs[0].pfd_avg;
}

// Property: a changed copy of one SIF verified against the unchanged project gives, bit for
// bit, what verifying a whole project copy holding that change gives (and so what check gives
// for it): the interval solver relies on it to avoid copying the project per step.
TEST(WhatIfVariant, EqualsVerifyingAProjectCopyThatHoldsTheChange) {
  for (const char* example : {"unit40.json", "unit50_shortfall.json", "unit60_existing_logic_solver.json",
                              "unit70_booster.json", "unit70_requirements.json"}) {
    const LoadedProject loaded = load_project_file(std::string(SIFTER_SOURCE_DIR) + "/examples/" + example);
    const WhatIf what_if(loaded.project);
    for (std::size_t i = 0; i < loaded.project.sifs.size(); ++i) {
      for (double hours : {730.0, 8760.0, 3.0 * 8760.0}) {
        Project copy = loaded.project;
        for (auto& sub : copy.sifs[i].subsystems) sub.proof_test_interval = Duration{hours};
        const SifResult whole = what_if.verify(copy, i);
        const SifResult variant = what_if.verify_variant(copy.sifs[i]);
        const std::string where = std::string(example) + " " + copy.sifs[i].id + " at " + std::to_string(hours) + " h";
        EXPECT_EQ(variant.pfd_avg, whole.pfd_avg) << where;
        EXPECT_EQ(variant.pfh_per_hour, whole.pfh_per_hour) << where;
        EXPECT_EQ(variant.pfd_avg_exact, whole.pfd_avg_exact) << where;
        EXPECT_EQ(variant.sil_achieved, whole.sil_achieved) << where;
        EXPECT_EQ(variant.meets_target, whole.meets_target) << where;
        EXPECT_EQ(variant.assumptions, whole.assumptions) << where;
      }
    }
  }
}

TEST(Sweep, EndpointsEqualCheckAtTheSameValues) {
  const WhatIf w(example());
  SweepRequest q;
  q.sif = 0;
  q.subsystem = 2;  // outlet isolation, 6 mo in the example
  q.parameter = SweepParameter::kProofTestInterval;
  q.from = 6 * kHoursPerMonth;
  q.to = 2 * kHoursPerYear;
  q.steps = 7;
  const auto r = sweep(w, q);
  ASSERT_EQ(r.points.size(), 7u);
  std::string at_two_years = example_text();
  const std::string six_months = R"("proof_test_interval": "6 mo")";
  at_two_years.replace(at_two_years.find(six_months), six_months.size(), R"("proof_test_interval": "2 yr")");
  expect_relative(*r.points.front().result.pfd_avg, check_pfd_of_sif401(example_text()), kExactRelTol);
  expect_relative(*r.points.back().result.pfd_avg, check_pfd_of_sif401(at_two_years), kExactRelTol);
}

TEST(Sweep, BetaEndpointsEqualCheckWithThatBeta) {
  const WhatIf w(example());
  SweepRequest q;
  q.sif = 0;
  q.subsystem = 0;  // level sensing: beta 5 %, beta_D 2 % as stated
  q.parameter = SweepParameter::kBeta;
  q.from = 0.05;
  q.to = 0.10;
  q.steps = 2;
  const auto r = sweep(w, q);
  std::string text = example_text();
  text.replace(text.find(R"("beta": "5%")"), 12, R"("beta": "10%")");
  expect_relative(*r.points.front().result.pfd_avg, check_pfd_of_sif401(example_text()), kExactRelTol);
  expect_relative(*r.points.back().result.pfd_avg, check_pfd_of_sif401(text), kExactRelTol);
}

TEST(Sweep, PfdAvgRisesWithTheProofTestIntervalOnEveryPoint) {
  const WhatIf w(example());
  SweepRequest q;
  q.sif = 1;  // SIF-402: redundant groups and a vendor figure
  q.parameter = SweepParameter::kProofTestInterval;
  q.from = 1 * kHoursPerMonth;
  q.to = 10 * kHoursPerYear;
  q.steps = 25;
  q.log = true;
  const auto r = sweep(w, q);
  EXPECT_EQ(r.varied, (std::vector<std::string>{"pressure sensing", "inlet isolation"}));
  for (std::size_t i = 1; i < r.points.size(); ++i) {
    EXPECT_GT(r.points[i].value, r.points[i - 1].value);
    EXPECT_GT(*r.points[i].result.pfd_avg, *r.points[i - 1].result.pfd_avg) << "at point " << i;
  }
  EXPECT_DOUBLE_EQ(r.points.back().value, 10 * kHoursPerYear);
}

TEST(Sweep, LambdaDuFactorScalesCopiesSoSharedComponentsStayAsTheyAre) {
  Project p = example();
  const std::size_t ls40 = p.sifs[0].subsystems[1].channels[0].components[0];
  const double before = p.components[ls40].rates.lambda_du.per_hour;
  apply_parameter(p, 0, {1}, SweepParameter::kLambdaDuFactor, 3.0);
  EXPECT_DOUBLE_EQ(p.components[ls40].rates.lambda_du.per_hour, before);  // SIF-403 still sees the original
  EXPECT_EQ(p.sifs[2].subsystems[1].channels[0].components[0], ls40);
  const std::size_t copy = p.sifs[0].subsystems[1].channels[0].components[0];
  EXPECT_NE(copy, ls40);
  EXPECT_EQ(p.components[copy].id, "LS-40~2");
  expect_relative(p.components[copy].rates.lambda_du.per_hour, 3 * before, kExactRelTol);
}

TEST(Sweep, ValuesOutsideTheirRangeAreUsageErrors) {
  const WhatIf w(example());
  SweepRequest q;
  q.parameter = SweepParameter::kBeta;
  q.from = 0.01;
  q.to = 1.5;
  EXPECT_THROW(sweep(w, q), UsageError);
  q.to = 0.2;
  q.steps = 1;
  EXPECT_THROW(sweep(w, q), UsageError);
  q.steps = 5;
  q.from = 0.0;
  q.log = true;
  EXPECT_THROW(sweep(w, q), UsageError);
  EXPECT_EQ(parse_sweep_parameter("mrt"), std::nullopt);
  EXPECT_EQ(parse_sweep_parameter("lambda_du_factor"), SweepParameter::kLambdaDuFactor);
}

// ---- Compare votes ----------------------------------------------------------------------

TEST(CompareVotes, ARedundantVoteAddsCopiesOfChannelZeroAndMatchesAHandWrittenGroup) {
  const WhatIf w(load(one_group("1oo1", 1, R"({"sil": 2})", kRates)));
  const auto r = compare_votes(w, 0, 0, {Vote{1, 1}, Vote{1, 2}, Vote{2, 3}}, std::nullopt);
  ASSERT_EQ(r.rows.size(), 3u);
  EXPECT_TRUE(r.rows[0].current);
  EXPECT_EQ(r.rows[2].result.subsystems[0].channels,
            (std::vector<std::vector<std::string>>{{"XV-1"}, {"XV-1~2"}, {"XV-1~3"}}));
  // The same groups written out in a project and verified by check.
  for (const auto& [vote, n, row] : {std::tuple{"1oo2", 2, 1}, std::tuple{"2oo3", 3, 2}}) {
    const auto written = verify_project(load_project_text(one_group(vote, n, R"({"sil": 2})", kRates), "w.json", "."));
    expect_relative(*r.rows[static_cast<std::size_t>(row)].result.pfd_avg, *written.sifs[0].pfd_avg, kExactRelTol);
    expect_relative(r.rows[static_cast<std::size_t>(row)].result.spurious_trip_rate_per_yr,
                    written.sifs[0].spurious_trip_rate_per_yr, kExactRelTol);
    EXPECT_EQ(r.rows[static_cast<std::size_t>(row)].result.subsystems[0].hft, 1);
  }
}

TEST(CompareVotes, ASmallerVoteKeepsTheFirstChannels) {
  const WhatIf w(load(one_group("2oo3", 3, R"({"sil": 2})", kRates)));
  const auto r = compare_votes(w, 0, 0, {Vote{1, 1}}, std::nullopt);
  EXPECT_EQ(r.rows[0].result.subsystems[0].channels, (std::vector<std::vector<std::string>>{{"XV-1"}}));
  EXPECT_EQ(r.rows[0].result.subsystems[0].hft, 0);
}

TEST(CompareVotes, ARedundantVoteWithoutBetaNeedsOneGiven) {
  const std::string text = R"({
  "format": "sifter-project/1",
  "defaults": { "proof_test_interval": "1 yr", "mttr": "8 h" },
  "components": [ { "id": "XV-1", "lambda_du": "2e-6/h", "lambda_su": "1e-6/h" } ],
  "sifs": [ { "id": "S1", "target": {"sil": 1}, "subsystems": [
    { "name": "valve", "role": "final", "vote": "1oo1", "channels": ["XV-1"] } ] } ]
})";
  const WhatIf w(load(text));
  try {
    compare_votes(w, 0, 0, {Vote{1, 1}, Vote{1, 2}}, std::nullopt);
    FAIL() << "expected a UsageError";
  } catch (const UsageError& e) {
    EXPECT_EQ(std::string(e.what()),
              "subsystem 'valve' has no beta, and the redundant vote 1oo2 needs one: give a common-cause fraction "
              "with --beta (for example --beta 5%)");
  }
  const auto r = compare_votes(w, 0, 0, {Vote{1, 2}}, 0.1);
  // 1oo2, lDD = 0, MRT = MTTR = 8 h (DEVELOPERS.md, Methods M1): 2 ((1-b) lDU)^2 tCE tGE + b lDU (T1/2 + MRT).
  const double ldu = 2e-6, t1 = 8760.0, mrt = 8.0, b = 0.1;
  const double expected = 2 * std::pow((1 - b) * ldu, 2) * (t1 / 2 + mrt) * (t1 / 3 + mrt) + b * ldu * (t1 / 2 + mrt);
  expect_relative(*r.rows[0].result.pfd_avg, expected, kExactRelTol);
}

// ---- Sensitivity ------------------------------------------------------------------------

TEST(Sensitivity, AOneChannelFunctionIsLinearInItsRates) {
  // With one 1oo1 subsystem the PFDavg is proportional to the rates (DEVELOPERS.md, Methods M1).
  const WhatIf w(load(one_group("1oo1", 1, R"({"sil": 2})", kRates)));
  const auto r = sensitivity(w, 0, 2.0);
  const SensitivityInput* rates = nullptr;
  for (const auto& in : r.inputs)
    if (in.name == "rates of XV-1") rates = &in;
  ASSERT_NE(rates, nullptr);
  EXPECT_EQ(rates->pointer, "/components/0");
  expect_relative(rates->at_low, r.base / 2, kExactRelTol);
  expect_relative(rates->at_high, r.base * 2, kExactRelTol);
  expect_relative(rates->swing, 1.5 * r.base, kExactRelTol);
}

TEST(Sensitivity, InputsAreRankedByTheirSwingAndFractionsAreClamped) {
  const WhatIf w(example());
  const auto r = sensitivity(w, 0, 2.0);
  ASSERT_GT(r.inputs.size(), 10u);
  for (std::size_t i = 1; i < r.inputs.size(); ++i) EXPECT_GE(r.inputs[i - 1].swing, r.inputs[i].swing);
  bool saw_coverage = false, saw_beta = false;
  for (const auto& in : r.inputs) {
    if (in.pointer == "/sifs/0/subsystems/2/proof_test_coverage") {
      saw_coverage = true;
      EXPECT_TRUE(in.clamped);
      EXPECT_DOUBLE_EQ(in.high_value, 1.0);
      EXPECT_DOUBLE_EQ(in.low_value, 0.5);
    }
    if (in.pointer == "/sifs/0/subsystems/0/beta") {
      saw_beta = true;
      EXPECT_DOUBLE_EQ(in.low_value, 0.025);
      EXPECT_DOUBLE_EQ(in.high_value, 0.1);
      EXPECT_GT(in.at_high, in.at_low);
    }
  }
  EXPECT_TRUE(saw_coverage);
  EXPECT_TRUE(saw_beta);
  EXPECT_THROW(sensitivity(w, 0, 1.0), UsageError);
}

}  // namespace
}  // namespace sifter

namespace sifter {
namespace {

std::string high_demand(const std::string& vote, int n, const std::string& pfh) {
  std::string text = one_group(vote, n, R"({"pfh": ")" + pfh + R"("})", kRates);
  text.replace(text.find(R"("demand_mode": "low")"), 20, R"("demand_mode": "high")");
  return text;
}

TEST(LongestInterval, InHighDemandAOneChannelPfhDoesNotDependOnTheInterval) {
  // IEC 61508-6:2010 B.3.3.2 (DEVELOPERS.md, Methods M3, from memory): 1oo1 PFH = lDU = 2e-6 per hour.
  const auto meets = longest_proof_test_interval(WhatIf(load(high_demand("1oo1", 1, "3e-6/h"))), 0, std::nullopt, 0.0);
  EXPECT_EQ(meets.outcome, IntervalOutcome::kWholeMission);
  expect_relative(meets.measure_at_longest, 2e-6, kExactRelTol);
  const auto fails = longest_proof_test_interval(WhatIf(load(high_demand("1oo1", 1, "1e-6/h"))), 0, std::nullopt, 0.0);
  EXPECT_EQ(fails.outcome, IntervalOutcome::kNone);
}

TEST(LongestInterval, InHighDemandARedundantGroupIsSolvedOnItsPfh) {
  // The common-cause term beta lDU = 1e-7 per hour does not depend on the interval (IEC
  // 61508-6:2010 B.3.3.2, from memory; DEVELOPERS.md Methods: the 2000 edition's beta_D lDD is
  // no longer added, a detected failure takes the system to its safe state).
  const std::string text = high_demand("1oo2", 2, "2e-7/h");
  const auto r = longest_proof_test_interval(WhatIf(load(text)), 0, std::nullopt, 0.0);
  ASSERT_EQ(r.outcome, IntervalOutcome::kFound);
  EXPECT_EQ(r.requirement.mode, DemandMode::kHigh);
  expect_relative(r.measure_at_longest, 2e-7, kSolverRelTol);
  expect_relative(r.measure_at_zero,
                  1e-7 + 2 * (0.98 * 5e-7 + 0.95 * 2e-6) * 0.95 * 2e-6 * (2e-6 * 24 + 5e-7 * 8) / 2.5e-6, kExactRelTol);
}

}  // namespace
}  // namespace sifter
