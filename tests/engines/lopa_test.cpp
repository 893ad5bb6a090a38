// Specification of the LOPA arithmetic, the demand mode on the SIF, the SIL 0 and SIL 4
// findings and what several scenarios require of one SIF. Layer rules: lopa_rules_test.cpp.
#include "sifter/engines/lopa.hpp"

#include <gtest/gtest.h>

#include "support/lopa_fixtures.hpp"

namespace sifter {
namespace {

using testing::add_sif;
using testing::cause;
using testing::expect_relative;
using testing::has_assumption_containing;
using testing::layer;
using testing::messages_of;
using testing::project_with_criteria;
using testing::scenario_with_target;
using testing::sif_layer;

// The CCPS worked numbers: IEF 0.1/yr, layers of PFD 0.1 and 0.01, tolerable 1e-5/yr.
Scenario ccps_scenario(double target_per_year) {
  Scenario s = scenario_with_target("S-CCPS", target_per_year);
  s.causes = {cause("C1", 0.1)};
  s.layers = {layer("BPCS-1", LayerKind::kBpcsFunction, 0.1), sif_layer("SIF-1"),
              layer("PSV-1", LayerKind::kReliefDevice, 0.01)};
  return s;
}

// CCPS, Layer of Protection Analysis (2001), the method's arithmetic (from memory):
// 0.1/yr x 0.1 x 0.01 = 1e-4/yr without the SIF; 1e-5 / 1e-4 = required PFD 0.1 (RRF 10).
TEST(LopaArithmetic, CcpsWorkedNumbersNeedAPfdOfOneTenth) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-1", {"PT-1", "XV-1"});
  const auto r = evaluate_scenario(p, ccps_scenario(1e-5), lopa_context_from_project(p));
  ASSERT_TRUE(r.sif.has_value());
  EXPECT_EQ(*r.sif, "SIF-1");
  expect_relative(r.frequency_without_sif_per_yr, 1e-4);
  expect_relative(r.target_frequency_per_yr, 1e-5);
  expect_relative(r.required_pfd, 0.1);
  expect_relative(r.required_rrf, 10.0);
  // RRF of exactly 10 is SIL 0 (IEC 61511-1:2016 Table 5, seen); the edge is taken tolerantly.
  EXPECT_EQ(r.required_sil, 0);
  EXPECT_EQ(messages_of(r, FindingKind::kBpcsCreditCapped).size(), 0u) << "a BPCS layer at 0.1 is not capped";
}

// CCPS (2001) and CCPS, Enabling Conditions and Conditional Modifiers (2013), from memory:
// enabling 0.5 before the layers, modifiers 0.3 x 0.5 after the release.
// 0.1 x 0.5 x 0.1 x 0.01 x 0.3 x 0.5 = 7.5e-6/yr; against 1e-7/yr the RRF is 75 (SIL 1).
TEST(LopaArithmetic, EnablingConditionAndModifiersMultiplyTheFrequency) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-1", {"PT-1"});
  Scenario s = ccps_scenario(1e-7);
  s.causes[0].enabling = {{"in gas service", 0.5}};
  s.modifiers = {{"ignition", 0.3, {}, ""}, {"person present", 0.5, {}, ""}};
  const auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  expect_relative(r.frequency_without_sif_per_yr, 7.5e-6);
  expect_relative(r.required_rrf, 75.0);
  expect_relative(r.required_pfd, 1.0 / 75.0);
  EXPECT_EQ(r.required_sil, 1);
  ASSERT_EQ(r.causes.size(), 1u);
  expect_relative(r.causes[0].enabling_product, 0.5);
  // Modifiers act after the release: they do not reduce the demand on the SIF (CCPS 2013).
  expect_relative(*r.demand_rate_per_yr, 0.1 * 0.5 * 0.1);
}

// The worksheet shows the frequency after every step, in order of action (CCPS 2001 layout).
TEST(LopaWorksheet, RowsCarryTheFrequencyAfterEachStep) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-1", {"PT-1"});
  Scenario s = ccps_scenario(1e-7);
  s.causes[0].enabling = {{"in gas service", 0.5}};
  s.modifiers = {{"ignition", 0.3, {}, ""}, {"person present", 0.5, {}, ""}};
  s.not_credited = {{"second operator round", "not independent of the alarm"}};
  const auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  const std::vector<WorksheetStep> steps = {
      WorksheetStep::kCause,    WorksheetStep::kEnabling,    WorksheetStep::kLayer, WorksheetStep::kSif,
      WorksheetStep::kLayer,    WorksheetStep::kNotCredited, WorksheetStep::kTotal, WorksheetStep::kModifier,
      WorksheetStep::kModifier, WorksheetStep::kTarget};
  const std::vector<double> after = {0.1, 0.05, 0.005, 0.005, 5e-5, -1.0, 5e-5, 1.5e-5, 7.5e-6, 7.5e-6};
  ASSERT_EQ(r.worksheet.size(), steps.size());
  for (std::size_t i = 0; i < steps.size(); ++i) {
    SCOPED_TRACE("row " + std::to_string(i));
    EXPECT_EQ(r.worksheet[i].step, steps[i]);
    if (after[i] < 0)
      EXPECT_FALSE(r.worksheet[i].frequency_per_yr.has_value());
    else
      expect_relative(*r.worksheet[i].frequency_per_yr, after[i]);
  }
  EXPECT_EQ(r.worksheet[5].note, "not independent of the alarm");
  expect_relative(*r.worksheet.back().gap, 75.0);
  expect_relative(*r.worksheet.back().value, 1e-7);
  EXPECT_EQ(r.worksheet.back().note, "required PFD 0.0133, RRF 75, SIL 1");
}

// CCPS (2001), from memory: the frequency of the scenario is the sum over its causes.
// (0.1 + 0.2)/yr x 0.1 = 0.03/yr; against 1e-4/yr the RRF is 300 (SIL 2).
TEST(LopaArithmetic, CausesAreSummed) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-1", {"PT-1"});
  Scenario s = scenario_with_target("S-SUM", 1e-4);
  s.causes = {cause("C1", 0.1), cause("C2", 0.2)};
  s.layers = {layer("CHK-1", LayerKind::kMechanical, 0.1), sif_layer("SIF-1")};
  const auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  expect_relative(r.frequency_without_sif_per_yr, 0.03);
  expect_relative(r.required_rrf, 300.0);
  EXPECT_EQ(r.required_sil, 2);
  expect_relative(*r.demand_rate_per_yr, 0.03);
  ASSERT_EQ(r.causes.size(), 2u);
  expect_relative(r.causes[1].frequency_without_sif_per_yr, 0.02);
}

// Each consequence has its own target and modifiers; the scenario takes the largest RRF (issue 4).
// Base 0.1/yr x 0.01 = 1e-3/yr. Safety 4 (1e-5/yr) with occupancy 0.5: 5e-4/yr, RRF 50.
// Asset 3 (1e-4/yr), occupancy not applying: 1e-3/yr, RRF 10.
TEST(LopaArithmetic, EachConsequenceHasItsOwnTargetAndModifiers) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-1", {"PT-1"});
  Scenario s;
  s.id = "S-CONS";
  s.consequences = {{"asset", "3"}, {"safety", "4"}};
  s.causes = {cause("C1", 0.1)};
  s.modifiers = {{"person present", 0.5, {"safety"}, ""}};
  s.layers = {sif_layer("SIF-1"), layer("PSV-1", LayerKind::kReliefDevice, 0.01)};
  const auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  ASSERT_EQ(r.consequences.size(), 2u);
  expect_relative(r.consequences[0].frequency_without_sif_per_yr, 1e-3);
  expect_relative(r.consequences[0].required_rrf, 10.0);
  EXPECT_EQ(r.consequences[0].required_sil, 0);
  expect_relative(r.consequences[1].frequency_without_sif_per_yr, 5e-4);
  expect_relative(r.consequences[1].required_rrf, 50.0);
  EXPECT_EQ(r.consequences[1].required_sil, 1);
  EXPECT_EQ(r.governing_consequence, 1u);
  expect_relative(r.required_rrf, 50.0);
  expect_relative(r.target_frequency_per_yr, 1e-5);
  EXPECT_EQ(r.required_sil, 1);
}

// A directly given target applies to a scenario without categories: only the modifiers that
// apply to every category are used (a modifier restricted to "safety" has no category to meet).
TEST(LopaArithmetic, DirectTargetUsesOnlyModifiersForAllCategories) {
  Project p = project_with_criteria();
  Scenario s = scenario_with_target("S-DIRECT", 1e-5);
  s.causes = {cause("C1", 0.1)};
  s.modifiers = {{"ignition", 0.5, {}, ""}, {"person present", 0.1, {"safety"}, ""}};
  const auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  expect_relative(r.frequency_without_sif_per_yr, 0.05);
  expect_relative(r.required_rrf, 5000.0);
}

// IEC 61511-1:2016 3.2.39 (from memory): no more than once a year is low demand.
TEST(LopaDemandMode, ExactlyOnceAYearIsLowDemand) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-1", {"PT-1"});
  Scenario s = scenario_with_target("S-ONCE", 1e-4);
  s.causes = {cause("C1", 1.0)};
  s.layers = {sif_layer("SIF-1")};
  auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  expect_relative(*r.demand_rate_per_yr, 1.0);
  EXPECT_EQ(*r.demand_mode, DemandMode::kLow);
  EXPECT_FALSE(r.required_pfh_per_hour.has_value());

  s.causes = {cause("C1", 1.01)};
  r = evaluate_scenario(p, s, lopa_context_from_project(p));
  EXPECT_EQ(*r.demand_mode, DemandMode::kHigh);
}

// Only the layers that act before the SIF reduce the demand on it (DEVELOPERS.md, Methods M6, seen).
TEST(LopaDemandMode, OnlyLayersBeforeTheSifReduceItsDemand) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-1", {"PT-1"});
  Scenario s = scenario_with_target("S-ORDER", 1e-4);
  s.causes = {cause("C1", 2.0)};
  s.layers = {layer("CHK-1", LayerKind::kMechanical, 0.5), sif_layer("SIF-1")};
  auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  expect_relative(*r.demand_rate_per_yr, 1.0);
  EXPECT_EQ(*r.demand_mode, DemandMode::kLow);

  s.layers = {sif_layer("SIF-1"), layer("CHK-1", LayerKind::kMechanical, 0.5)};
  r = evaluate_scenario(p, s, lopa_context_from_project(p));
  expect_relative(*r.demand_rate_per_yr, 2.0);
  EXPECT_EQ(*r.demand_mode, DemandMode::kHigh);
  // The frequency without the SIF is the same either way.
  expect_relative(r.frequency_without_sif_per_yr, 1.0);
}

// Issue 4 item 4 (the project's conservative form): required PFH = target / (8760 h/yr x
// modifiers x PFD after the SIF), enabling conditions ignored. 1e-5/yr / (8760 x 0.1 x 0.01).
TEST(LopaDemandMode, HighDemandRequiredPfhIgnoresEnablingConditions) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-1", {"PT-1"});
  Scenario s = scenario_with_target("S-HIGH", 1e-5);
  s.causes = {cause("C1", 10.0, {}, {{"running", 0.5}})};
  s.modifiers = {{"ignition", 0.1, {}, ""}};
  s.layers = {sif_layer("SIF-1"), layer("PSV-1", LayerKind::kReliefDevice, 0.01)};
  LopaContext ctx = lopa_context_from_project(p);
  ctx.sifs["SIF-1"].pfh = Rate{1e-7};
  const auto r = evaluate_scenario(p, s, ctx);
  expect_relative(*r.demand_rate_per_yr, 5.0);
  EXPECT_EQ(*r.demand_mode, DemandMode::kHigh);
  const double required = 1e-5 / (8760.0 * 0.1 * 0.01);
  expect_relative(*r.required_pfh_per_hour, required);
  EXPECT_EQ(r.required_sil, 1) << "1.14e-6/h lies in the SIL 1 PFH band (IEC 61511-1:2016 Table 5)";
  EXPECT_TRUE(has_assumption_containing(r.assumptions, "enabling conditions are ignored, which is conservative"));
  // Mitigated: 1e-7/h x 8760 h x 0.01 x 0.1 = 8.76e-7/yr, within 1e-5/yr.
  expect_relative(*r.mitigated_frequency_per_yr, 1e-7 * 8760.0 * 0.01 * 0.1);
  EXPECT_TRUE(*r.meets_target);
}

// The mitigated frequency uses the SIF's computed PFDavg (issue 4 item 7).
// 1e-3/yr without the SIF against 1e-5/yr: PFDavg 0.005 gives 5e-6/yr (met), 0.02 gives 2e-5.
TEST(LopaArithmetic, MitigatedFrequencyUsesTheSifsComputedPfd) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-1", {"PT-1"});
  Scenario s = scenario_with_target("S-MIT", 1e-5);
  s.causes = {cause("C1", 0.1)};
  s.layers = {sif_layer("SIF-1"), layer("PSV-1", LayerKind::kReliefDevice, 0.01)};
  LopaContext ctx = lopa_context_from_project(p);
  auto r = evaluate_scenario(p, s, ctx);
  EXPECT_FALSE(r.meets_target.has_value()) << "no computed PFDavg yet";
  ctx.sifs["SIF-1"].pfd_avg = 0.005;
  r = evaluate_scenario(p, s, ctx);
  expect_relative(*r.mitigated_frequency_per_yr, 5e-6);
  EXPECT_TRUE(*r.meets_target);
  ctx.sifs["SIF-1"].pfd_avg = 0.02;
  r = evaluate_scenario(p, s, ctx);
  expect_relative(*r.mitigated_frequency_per_yr, 2e-5);
  EXPECT_FALSE(*r.meets_target);
  EXPECT_EQ(r.worksheet.back().step, WorksheetStep::kWithSif);
  EXPECT_EQ(r.worksheet.back().note, "misses the target by a factor of 2");
}

// A scenario without a SIF layer is still judged: frequency with its layers against the target.
TEST(LopaArithmetic, ScenarioWithoutSifIsJudgedOnItsLayers) {
  Project p = project_with_criteria();
  Scenario s = scenario_with_target("S-NOSIF", 1e-4);
  s.causes = {cause("C1", 0.1)};
  s.layers = {layer("PSV-1", LayerKind::kReliefDevice, 0.01), layer("DIKE-1", LayerKind::kMechanical, 0.01)};
  auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  EXPECT_FALSE(r.sif.has_value());
  EXPECT_FALSE(r.demand_rate_per_yr.has_value());
  expect_relative(*r.mitigated_frequency_per_yr, 1e-5);
  EXPECT_TRUE(*r.meets_target);
  s.layers.pop_back();
  r = evaluate_scenario(p, s, lopa_context_from_project(p));
  EXPECT_FALSE(*r.meets_target);
}

// IEC 61511-1:2016 clause 9 (from memory): a risk reduction of 10 or less needs no SIF.
// 0.1/yr x 0.01 = 1e-3/yr against 2e-4/yr: RRF 5.
TEST(LopaSilFindings, SmallRiskReductionNeedsNoSif) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-1", {"PT-1"});
  Scenario s = scenario_with_target("S-SIL0", 2e-4);
  s.causes = {cause("C1", 0.1)};
  s.layers = {sif_layer("SIF-1"), layer("PSV-1", LayerKind::kReliefDevice, 0.01)};
  const auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  EXPECT_EQ(r.required_sil, 0);
  const auto m = messages_of(r, FindingKind::kNoSifNeeded);
  ASSERT_EQ(m.size(), 1u);
  EXPECT_EQ(m[0],
            "Scenario S-SIL0 needs a risk reduction of 5, no more than 10: no SIF is needed at this risk "
            "level (IEC 61511-1:2016 clause 9).");
}

// IEC 61511-1:2016 clause 9.2 (from memory): above 10 000 the design is re-examined first.
// 0.2/yr x 0.01 against 1e-7/yr: RRF 20 000 (SIL 4); against 1e-9/yr: 2 000 000, beyond SIL 4.
TEST(LopaSilFindings, RiskReductionAboveTenThousandCallsForReview) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-1", {"PT-1"});
  Scenario s = scenario_with_target("S-SIL4", 1e-7);
  s.causes = {cause("C1", 0.2)};
  s.layers = {sif_layer("SIF-1"), layer("PSV-1", LayerKind::kReliefDevice, 0.01)};
  auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  EXPECT_EQ(r.required_sil, 4);
  auto m = messages_of(r, FindingKind::kSil4Review);
  ASSERT_EQ(m.size(), 1u);
  EXPECT_EQ(m[0],
            "Scenario S-SIL4 needs a risk reduction of 20000, above 10000 (SIL 4): re-examine the process "
            "design and the other layers before relying on a SIF (IEC 61511-1:2016 clause 9.2).");
  s.target_frequency = Rate::from_per_year(1e-9);
  r = evaluate_scenario(p, s, lopa_context_from_project(p));
  m = messages_of(r, FindingKind::kSil4Review);
  ASSERT_EQ(m.size(), 1u);
  EXPECT_NE(m[0].find("2e+6, beyond the 100000 that SIL 4 provides"), std::string::npos) << m[0];
}

// IEC 61511-1:2016 3.2.39 (from memory): a SIF stated low demand but demanded 2 times a year.
TEST(LopaDemandMode, StatedModeContradictedByTheRateIsAMismatch) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-7", {"PT-7"});
  p.sifs[0].demand_mode_stated = DemandMode::kLow;
  Scenario s = scenario_with_target("S-MODE", 1e-4);
  s.causes = {cause("C1", 2.0)};
  s.layers = {sif_layer("SIF-7")};
  const auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  // The stricter mode applies (IEC 61511-1:2016 3.2.39, from memory; DEVELOPERS.md Methods):
  // demanded more than once a year, the SIF is judged in high demand whatever is stated.
  EXPECT_EQ(*r.demand_mode, DemandMode::kHigh) << "judged in high demand, the stricter";
  const auto m = messages_of(r, FindingKind::kModeMismatch);
  ASSERT_EQ(m.size(), 1u);
  EXPECT_EQ(m[0],
            "SIF-7 is stated to be in low demand mode, but scenario S-MODE demands it 2 times a year, more "
            "than once a year (high demand, IEC 61511-1:2016 3.2.39); it is judged in high demand (the stricter).");
}

// Issue 4 item 3: a SIF named by several scenarios must satisfy each; the largest RRF governs.
// S-A: 0.1/yr x 0.01 against 1e-5/yr = RRF 100 (SIL 1); S-B: 0.3/yr x 0.01 = RRF 300 (SIL 2).
TEST(LopaSifRequirements, SifFedByTwoScenariosTakesTheLargestRrf) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-1", {"PT-1"});
  add_sif(p, "SIF-2", {"PT-2"});
  auto make = [](const std::string& id, double ief, const std::string& sif) {
    Scenario s = scenario_with_target(id, 1e-5);
    s.causes = {cause("C1", ief)};
    s.layers = {sif_layer(sif), layer("PSV-1", LayerKind::kReliefDevice, 0.01)};
    return s;
  };
  p.scenarios = {make("S-A", 0.1, "SIF-1"), make("S-B", 0.3, "SIF-1"), make("S-C", 0.02, "SIF-2"),
                 scenario_with_target("S-NONE", 1e-3)};
  p.scenarios.back().causes = {cause("C1", 0.1)};
  const auto results = evaluate_scenarios(p, lopa_context_from_project(p));
  ASSERT_EQ(results.size(), 4u);
  const auto reqs = sif_requirements(results);
  ASSERT_EQ(reqs.size(), 2u);
  EXPECT_EQ(reqs[0].sif, "SIF-1");
  EXPECT_EQ(reqs[0].scenarios, (std::vector<std::string>{"S-A", "S-B"}));
  EXPECT_EQ(reqs[0].governing_scenario, "S-B");
  expect_relative(reqs[0].required_rrf, 300.0);
  expect_relative(reqs[0].required_pfd, 1.0 / 300.0);
  EXPECT_EQ(reqs[0].sil_required, 2);
  expect_relative(reqs[0].demand_rate_per_yr, 0.4);
  EXPECT_EQ(reqs[0].demand_mode, DemandMode::kLow);
  EXPECT_EQ(reqs[1].sif, "SIF-2");
  expect_relative(reqs[1].required_rrf, 20.0);
  EXPECT_EQ(reqs[1].sil_required, 1);
}

// Demands on one SIF from several scenarios add up (IEC 61511-1:2016 3.2.39, from memory):
// 0.6 + 0.6 = 1.2 a year is high demand though each scenario alone is low.
TEST(LopaSifRequirements, DemandsOfSeveralScenariosAddUp) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-1", {"PT-1"});
  std::vector<ScenarioResult> results;
  for (const char* id : {"S-A", "S-B"}) {
    Scenario s = scenario_with_target(id, 1e-4);
    s.causes = {cause("C1", 0.6)};
    s.layers = {sif_layer("SIF-1"), layer("PSV-1", LayerKind::kReliefDevice, 0.01)};
    results.push_back(evaluate_scenario(p, s, lopa_context_from_project(p)));
    EXPECT_EQ(*results.back().demand_mode, DemandMode::kLow);
  }
  auto reqs = sif_requirements(results);
  ASSERT_EQ(reqs.size(), 1u);
  expect_relative(reqs[0].demand_rate_per_yr, 1.2);
  EXPECT_EQ(reqs[0].demand_mode, DemandMode::kHigh);
  // Required PFH: 1e-4/yr / (8760 h/yr x 0.01), in the SIL 1 band [1e-6, 1e-5) per hour.
  expect_relative(*reqs[0].required_pfh_per_hour, 1e-4 / (8760.0 * 0.01));
  EXPECT_EQ(reqs[0].sil_required, 1);
  EXPECT_TRUE(reqs[0].findings.empty());

  // Stated low, the sum contradicts it: a mismatch on the SIF, judged in high demand (the
  // stricter applies; IEC 61511-1:2016 3.2.39, from memory; DEVELOPERS.md Methods).
  p.sifs[0].demand_mode_stated = DemandMode::kLow;
  for (auto& r : results) r.demand_mode_stated = DemandMode::kLow;
  reqs = sif_requirements(results);
  EXPECT_EQ(reqs[0].demand_mode, DemandMode::kHigh);
  ASSERT_EQ(reqs[0].findings.size(), 1u);
  EXPECT_EQ(reqs[0].findings[0].kind, FindingKind::kModeMismatch);
  EXPECT_EQ(reqs[0].findings[0].message,
            "SIF-1 is stated to be in low demand mode, but scenarios S-A and S-B together demand it 1.2 times a "
            "year, more than once a year (high demand, IEC 61511-1:2016 3.2.39); it is judged in high demand (the "
            "stricter).");
}

TEST(LopaFormat, NumbersKeepThreeSignificantDigits) {
  EXPECT_EQ(format_number(0.1), "0.1");
  EXPECT_EQ(format_number(1e-5 / (0.1 * 0.1 * 0.01)), "0.1");
  EXPECT_EQ(format_number(20000.0), "20000");
  EXPECT_EQ(format_number(1.0 / 75.0), "0.0133");
  EXPECT_EQ(format_number(2.5e-7), "2.5e-7");
  EXPECT_EQ(format_number(2e6), "2e+6");
  EXPECT_EQ(to_string(FindingKind::kTooManyBpcsLayers), "too_many_bpcs_layers");
}

}  // namespace
}  // namespace sifter
