// Specification of the LOPA layer rules: the BPCS cap and count, independence through shared
// devices, the independence note and the operator-time rule, each a finding and applied.
#include <gtest/gtest.h>

#include "sifter/engines/lopa.hpp"
#include "support/lopa_fixtures.hpp"

namespace sifter {
namespace {

using testing::add_sif;
using testing::cause;
using testing::expect_relative;
using testing::has_assumption_containing;
using testing::layer;
using testing::messages_of;
using testing::operator_layer;
using testing::project_with_criteria;
using testing::scenario_with_target;
using testing::sif_layer;

const WorksheetRow* row_of(const ScenarioResult& r, const std::string& item, const std::string& cause_id = "C1") {
  for (const auto& row : r.worksheet)
    if (row.item == item && row.cause == cause_id &&
        (row.step == WorksheetStep::kLayer || row.step == WorksheetStep::kSif))
      return &row;
  return nullptr;
}

// IEC 61511-1:2016 clause 9.3 (from memory): a BPCS layer claims a risk reduction of 10 at most.
TEST(LopaLayerRules, BpcsFunctionClaimingBelowOneTenthIsCappedAtOneTenth) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-1", {"PT-1"});
  Scenario s = scenario_with_target("S-CAP", 1e-5);
  s.causes = {cause("C1", 0.1)};
  s.layers = {layer("BPCS-1", LayerKind::kBpcsFunction, 0.01, {"TIC-1"}), sif_layer("SIF-1")};
  const auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  expect_relative(r.frequency_without_sif_per_yr, 0.01);  // 0.1/yr x 0.1, not x 0.01
  const auto m = messages_of(r, FindingKind::kBpcsCreditCapped);
  ASSERT_EQ(m.size(), 1u);
  EXPECT_EQ(m[0],
            "Layer BPCS-1 (BPCS function) claims PFD 0.01; a BPCS function or operator response is credited "
            "with a PFD no lower than 0.1 (risk reduction 10 at most, IEC 61511-1:2016 clause 9.3), so 0.1 "
            "is used.");
  const auto* row = row_of(r, "BPCS-1");
  ASSERT_NE(row, nullptr);
  expect_relative(*row->value, 0.1);
  EXPECT_EQ(row->note, "capped at 0.1 (claims 0.01)");
}

// The same cap on an operator response (CCPS 2001 Table 6.x: 1e-1 for an alarm with >= 10 min,
// seen as a range in a reproduction).
TEST(LopaLayerRules, OperatorResponseClaimIsCappedToo) {
  Project p = project_with_criteria();
  Scenario s = scenario_with_target("S-OPCAP", 1e-5);
  s.causes = {cause("C1", 0.1)};
  s.layers = {operator_layer("OP-1", 0.05, 5, 30, {"TAH-1"})};
  const auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  expect_relative(r.frequency_without_sif_per_yr, 0.01);
  EXPECT_EQ(messages_of(r, FindingKind::kBpcsCreditCapped).size(), 1u);
}

// CCPS (2001), from memory: no more than two BPCS layers in one scenario.
TEST(LopaLayerRules, OnlyTwoBpcsLayersAreCredited) {
  Project p = project_with_criteria();
  Scenario s = scenario_with_target("S-BPCS", 1e-5);
  s.causes = {cause("C1", 0.1)};
  s.layers = {layer("BPCS-1", LayerKind::kBpcsFunction, 0.1, {"TIC-1"}),
              layer("BPCS-2", LayerKind::kBpcsFunction, 0.1, {"PIC-2"}),
              layer("BPCS-3", LayerKind::kBpcsFunction, 0.1, {"FIC-3"})};
  const auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  expect_relative(r.frequency_without_sif_per_yr, 0.1 * 0.1 * 0.1);
  const auto m = messages_of(r, FindingKind::kTooManyBpcsLayers);
  ASSERT_EQ(m.size(), 1u);
  EXPECT_EQ(m[0],
            "Layer BPCS-3 is the third BPCS-based layer in scenario S-BPCS; no more than two are credited in "
            "one scenario (BPCS-1 and BPCS-2), so BPCS-3 gets no credit.");
  EXPECT_FALSE(row_of(r, "BPCS-3")->credited);
}

// The project's rule (issue 4, decided here): an operator response that shares a device with a
// BPCS function or with a cause runs on the BPCS and counts towards the two; one that shares
// nothing does not.
TEST(LopaLayerRules, OperatorResponseOnTheBpcsCountsAsBpcsBased) {
  Project p = project_with_criteria();
  Scenario s = scenario_with_target("S-BPCS-OP", 1e-5);
  s.causes = {cause("C1", 0.1, {"P-101"})};
  Layer on_dcs = operator_layer("OP-1", 0.1, 5, 30, {"TAH-1", "DCS-1"});
  on_dcs.independence_note = "separate alarm card";
  s.layers = {layer("BPCS-1", LayerKind::kBpcsFunction, 0.1, {"TIC-1", "DCS-1"}),
              layer("BPCS-2", LayerKind::kBpcsFunction, 0.1, {"PIC-2", "DCS-2"}), on_dcs,
              operator_layer("OP-2", 0.1, 5, 30, {"TAH-9"})};
  const auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  const auto m = messages_of(r, FindingKind::kTooManyBpcsLayers);
  ASSERT_EQ(m.size(), 1u);
  EXPECT_EQ(m[0],
            "Layer OP-1 is the third BPCS-based layer in scenario S-BPCS-OP; no more than two are credited in "
            "one scenario (BPCS-1 and BPCS-2), so OP-1 gets no credit.");
  expect_relative(r.frequency_without_sif_per_yr, 0.1 * 0.1 * 0.1 * 0.1);  // BPCS-1, BPCS-2 and OP-2
  EXPECT_TRUE(has_assumption_containing(r.assumptions, "at most two are credited per scenario"));
}

// CCPS (2001), from memory: an IPL is independent of the initiating event. The scenario of
// issue 4 (invented numbers): the alarm runs on DCS-4, the controller whose valve fails open.
// Without IPL-1: 0.1/yr x 0.9 x 0.01 x 0.5 = 4.5e-4/yr against 1e-5/yr (safety 4), RRF 45.
TEST(LopaLayerRules, LayerSharingADeviceWithTheCauseGetsNoCredit) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-401", {"PT-401A", "XV-401"});
  Scenario s;
  s.id = "LOPA-401-1";
  s.consequences = {{"safety", "4"}, {"asset", "3"}};
  s.causes = {cause("C1", 0.1, {"LV-400", "DCS-4"}, {{"separator in gas service", 0.9}})};
  s.modifiers = {{"person present near the LP drum", 0.5, {"safety"}, ""}};
  s.layers = {operator_layer("IPL-1", 0.1, 10, 30, {"LT-400", "DCS-4"}), sif_layer("SIF-401"),
              layer("IPL-3", LayerKind::kReliefDevice, 0.01)};
  const auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  const auto m = messages_of(r, FindingKind::kNotIndependent);
  ASSERT_EQ(m.size(), 1u);
  EXPECT_EQ(m[0],
            "Layer IPL-1 shares device DCS-4 with initiating cause C1, so IPL-1 is not independent of that "
            "cause and gets no credit against it.");
  expect_relative(r.consequences[0].frequency_without_sif_per_yr, 4.5e-4);
  expect_relative(r.required_rrf, 45.0);
  expect_relative(r.consequences[1].required_rrf, 9.0);  // asset 3: 9e-4/yr against 1e-4/yr
  const auto* row = row_of(r, "IPL-1");
  ASSERT_NE(row, nullptr);
  EXPECT_FALSE(row->credited);
  EXPECT_EQ(row->note, "no credit against C1: shares DCS-4");
}

// The independence note restores the credit, and the finding reports it (issue 4 item 5).
TEST(LopaLayerRules, IndependenceNoteKeepsTheCreditAndIsReported) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-401", {"PT-401A", "XV-401"});
  Scenario s = scenario_with_target("S-NOTE", 1e-5);
  s.causes = {cause("C1", 0.1, {"LV-400", "DCS-4"}, {{"separator in gas service", 0.9}})};
  s.modifiers = {{"person present", 0.5, {}, ""}};
  Layer alarm = operator_layer("IPL-1", 0.1, 10, 30, {"LT-400", "DCS-4"});
  alarm.independence_note = "alarm on a separate I/O card of DCS-4";
  s.layers = {alarm, sif_layer("SIF-401"), layer("IPL-3", LayerKind::kReliefDevice, 0.01)};
  const auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  const auto m = messages_of(r, FindingKind::kNotIndependent);
  ASSERT_EQ(m.size(), 1u);
  EXPECT_EQ(m[0],
            "Layer IPL-1 shares device DCS-4 with initiating cause C1; IPL-1 is credited on its independence "
            "note \"alarm on a separate I/O card of DCS-4\".");
  expect_relative(r.frequency_without_sif_per_yr, 4.5e-5);
}

// Independence is judged per cause (decided here; CCPS 2001 pairs each IPL with an initiating
// event): credit against C2 remains. 0.1/yr (no credit) + 0.2/yr x 0.1 = 0.12/yr.
TEST(LopaLayerRules, SharingWithOneCauseKeepsTheCreditAgainstTheOthers) {
  Project p = project_with_criteria();
  Scenario s = scenario_with_target("S-PER-CAUSE", 1e-4);
  s.causes = {cause("C1", 0.1, {"DCS-4"}), cause("C2", 0.2, {"P-101"})};
  s.layers = {layer("BPCS-1", LayerKind::kBpcsFunction, 0.1, {"TIC-1", "DCS-4"})};
  const auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  expect_relative(r.frequency_without_sif_per_yr, 0.12);
  EXPECT_FALSE(row_of(r, "BPCS-1", "C1")->credited);
  EXPECT_TRUE(row_of(r, "BPCS-1", "C2")->credited);
  EXPECT_TRUE(has_assumption_containing(r.assumptions, "no credit against that cause only"));
}

// CCPS (2001), from memory: an IPL is independent of the other credited layers. The later
// layer loses its credit, and only against a layer that is itself credited.
TEST(LopaLayerRules, LayerSharingWithAnEarlierCreditedLayerGetsNoCredit) {
  Project p = project_with_criteria();
  Scenario s = scenario_with_target("S-LAYERS", 1e-5);
  s.causes = {cause("C1", 0.1, {"P-101"})};
  s.layers = {layer("BPCS-1", LayerKind::kBpcsFunction, 0.1, {"LT-1", "DCS-1"}),
              operator_layer("OP-2", 0.1, 5, 30, {"LT-1", "DCS-2"})};
  auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  auto m = messages_of(r, FindingKind::kNotIndependent);
  ASSERT_EQ(m.size(), 1u);
  EXPECT_EQ(m[0],
            "Layer OP-2 shares device LT-1 with layer BPCS-1, credited before it, so OP-2 is not independent "
            "and gets no credit.");
  expect_relative(r.frequency_without_sif_per_yr, 0.01);

  s.causes[0].devices = {"DCS-1"};  // now BPCS-1 is not independent of the cause: OP-2 keeps its credit
  r = evaluate_scenario(p, s, lopa_context_from_project(p));
  m = messages_of(r, FindingKind::kNotIndependent);
  ASSERT_EQ(m.size(), 1u);
  EXPECT_NE(m[0].find("Layer BPCS-1 shares device DCS-1 with initiating cause C1"), std::string::npos) << m[0];
  expect_relative(r.frequency_without_sif_per_yr, 0.01);
  EXPECT_TRUE(row_of(r, "OP-2")->credited);
}

// A layer that relies on a component of the SIF under assessment is not independent of it;
// component ids are device tags (issue 4 item 6).
TEST(LopaLayerRules, LayerSharingAComponentWithTheSifGetsNoCredit) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-401", {"PT-401A", "XV-401"});
  Scenario s = scenario_with_target("S-SIF", 1e-5);
  s.causes = {cause("C1", 0.1)};
  s.layers = {sif_layer("SIF-401"), layer("IPL-2", LayerKind::kOther, 0.1, {"PT-401A", "PAH-1"}),
              layer("IPL-3", LayerKind::kReliefDevice, 0.01)};
  const auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  const auto m = messages_of(r, FindingKind::kNotIndependent);
  ASSERT_EQ(m.size(), 1u);
  EXPECT_EQ(m[0],
            "Layer IPL-2 shares device PT-401A with SIF-401, the SIF under assessment, so IPL-2 is not "
            "independent and gets no credit.");
  expect_relative(r.frequency_without_sif_per_yr, 1e-3);
}

// A SIF sharing a device with the cause gets no credit against it in the mitigated frequency.
TEST(LopaLayerRules, SifSharingADeviceWithTheCauseIsNotCreditedAgainstIt) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-401", {"PT-401A", "XV-401"});
  Scenario s = scenario_with_target("S-SIF-CAUSE", 1e-5);
  s.causes = {cause("C1", 0.1, {"XV-401", "DCS-4"})};
  s.layers = {sif_layer("SIF-401"), layer("IPL-3", LayerKind::kReliefDevice, 0.01)};
  LopaContext ctx = lopa_context_from_project(p);
  ctx.sifs["SIF-401"].pfd_avg = 1e-3;
  const auto r = evaluate_scenario(p, s, ctx);
  const auto m = messages_of(r, FindingKind::kNotIndependent);
  ASSERT_EQ(m.size(), 1u);
  EXPECT_EQ(m[0],
            "SIF-401, the SIF under assessment, shares device XV-401 with initiating cause C1, so SIF-401 is "
            "not independent of that cause and gets no credit against it.");
  expect_relative(*r.mitigated_frequency_per_yr, 1e-3);  // the SIF's 1e-3 is not applied
  EXPECT_FALSE(*r.meets_target);
}

// A second SIF in the scenario is an ordinary layer, credited with its computed PFDavg, and
// not independent of the SIF under assessment when they share a component.
TEST(LopaLayerRules, AnotherSifIsCreditedWithItsComputedPfd) {
  Project p = project_with_criteria();
  add_sif(p, "SIF-1", {"PT-1", "XV-1"});
  add_sif(p, "SIF-2", {"PT-2", "XV-2"});
  Scenario s = scenario_with_target("S-TWO-SIFS", 1e-6);
  s.causes = {cause("C1", 0.1)};
  s.layers = {sif_layer("SIF-1"), sif_layer("SIF-2")};
  LopaContext ctx = lopa_context_from_project(p);
  ctx.sifs["SIF-2"].pfd_avg = 0.01;
  auto r = evaluate_scenario(p, s, ctx);
  EXPECT_EQ(*r.sif, "SIF-1");
  expect_relative(r.frequency_without_sif_per_yr, 1e-3);

  p.sifs[1].subsystems[0].channels[0].components.push_back(1);  // SIF-2 also uses XV-1
  r = evaluate_scenario(p, s, ctx);
  expect_relative(r.frequency_without_sif_per_yr, 0.1);
  EXPECT_EQ(messages_of(r, FindingKind::kNotIndependent).size(), 1u);
}

// Common practice (stated in the output): an operator needs at least 10 min to be credited.
TEST(LopaLayerRules, OperatorResponseNeedsTenMinutesAvailable) {
  Project p = project_with_criteria();
  Scenario s = scenario_with_target("S-OP10", 1e-5);
  s.causes = {cause("C1", 0.1)};
  s.layers = {operator_layer("OP-1", 0.1, 2, 8)};
  auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  auto m = messages_of(r, FindingKind::kResponseTime);
  ASSERT_EQ(m.size(), 1u);
  EXPECT_EQ(m[0],
            "Operator response OP-1 has 8 min available, less than the 10 min an operator response needs for "
            "credit, so OP-1 gets no credit.");
  expect_relative(r.frequency_without_sif_per_yr, 0.1);
  EXPECT_TRUE(has_assumption_containing(r.assumptions,
                                        "at least 10 min available and at least 2 times its "
                                        "response time (common practice)"));

  s.layers = {operator_layer("OP-1", 0.1, 5, 10)};  // exactly 10 min, twice the response time
  r = evaluate_scenario(p, s, lopa_context_from_project(p));
  EXPECT_TRUE(messages_of(r, FindingKind::kResponseTime).empty());
  expect_relative(r.frequency_without_sif_per_yr, 0.01);
}

// Common practice: the time available is at least twice the response time (project-set multiple).
TEST(LopaLayerRules, OperatorResponseNeedsAMultipleOfItsResponseTime) {
  Project p = project_with_criteria();
  Scenario s = scenario_with_target("S-OPX", 1e-5);
  s.causes = {cause("C1", 0.1)};
  s.layers = {operator_layer("OP-1", 0.1, 10, 15)};
  auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  auto m = messages_of(r, FindingKind::kResponseTime);
  ASSERT_EQ(m.size(), 1u);
  EXPECT_EQ(m[0],
            "Operator response OP-1 has 15 min available, less than 2 times its response time of 10 min "
            "(20 min), so OP-1 gets no credit.");

  s.layers = {operator_layer("OP-1", 0.1, 10, 20)};
  r = evaluate_scenario(p, s, lopa_context_from_project(p));
  EXPECT_TRUE(messages_of(r, FindingKind::kResponseTime).empty());

  p.operator_time_multiple = 3.0;
  r = evaluate_scenario(p, s, lopa_context_from_project(p));
  m = messages_of(r, FindingKind::kResponseTime);
  ASSERT_EQ(m.size(), 1u);
  EXPECT_NE(m[0].find("less than 3 times its response time of 10 min (30 min)"), std::string::npos) << m[0];
}

// Without a stated time available the operator-time rule cannot be met: no credit.
TEST(LopaLayerRules, OperatorResponseWithoutTimeAvailableGetsNoCredit) {
  Project p = project_with_criteria();
  Scenario s = scenario_with_target("S-OPNONE", 1e-5);
  s.causes = {cause("C1", 0.1)};
  s.layers = {layer("OP-1", LayerKind::kOperatorResponse, 0.1)};
  const auto r = evaluate_scenario(p, s, lopa_context_from_project(p));
  const auto m = messages_of(r, FindingKind::kResponseTime);
  ASSERT_EQ(m.size(), 1u);
  EXPECT_EQ(m[0],
            "Operator response OP-1 states no time available; an operator response is credited only with at "
            "least 10 min available and at least 2 times its response time, so OP-1 gets no credit.");
  expect_relative(r.frequency_without_sif_per_yr, 0.1);
}

}  // namespace
}  // namespace sifter
