// Specification of the stated requirements: response time against the process safety time,
// spurious trips against their limit, the proof-test interval against the required one, and
// prior use as the basis of an element's systematic result.
#include "sifter/engines/requirements.hpp"

#include <gtest/gtest.h>

#include "sifter/analysis/verify.hpp"
#include "sifter/report/json_results.hpp"

namespace sifter {
namespace {

constexpr double kRelTol = 1e-12;

ProjectResult verify_text(const std::string& text) {
  return verify_project(load_project_text(text, "inline.json", std::string(SIFTER_SOURCE_DIR) + "/examples"));
}

// The worked example of our own: sensor 1 s, logic 0.5 s, and a final element of a 2 s solenoid
// in series with a valve of 8 s stroke: 1 + 0.5 + (2 + 8) = 11.5 s. All devices SC 3, so only
// the requirements decide the verdict.
std::string timed_project(const std::string& requirements, const std::string& sensor_vote = "1oo1",
                          const std::string& sensor_channels = R"(["PT-1"])", const std::string& extra = "") {
  return R"({
  "format": "sifter-project/1",
  "defaults": { "proof_test_interval": "1 yr", "mttr": "8 h" },
  "components": [
    { "id": "PT-1", "lambda_du": "50 FIT", "lambda_dd": "450 FIT", "lambda_sd": "300 FIT", "element_type": "B",
      "systematic_capability": 3, "response_time": "1 s", "data_source": "test data" },
    { "id": "PT-2", "lambda_du": "50 FIT", "lambda_dd": "450 FIT", "lambda_sd": "300 FIT", "element_type": "B",
      "systematic_capability": 3, "response_time": "3 s", "data_source": "test data" },
    { "id": "LS-1", "lambda_du": "5 FIT", "lambda_dd": "1000 FIT", "lambda_sd": "1000 FIT", "element_type": "B",
      "systematic_capability": 3, "response_time": "0.5 s", "data_source": "test data" },
    { "id": "SOV-1", "lambda_du": "100 FIT", "lambda_su": "2000 FIT", "element_type": "A",
      "systematic_capability": 3, "response_time": "2 s", "data_source": "test data" },
    { "id": "XV-1", "lambda_du": "400 FIT", "lambda_su": "500 FIT", "element_type": "A",
      "systematic_capability": 3, "response_time": "8 s", "data_source": "test data" })" +
         extra + R"(
  ],
  "sifs": [ { "id": "S1", "target": {"sil": 1}, "requirements": )" +
         requirements + R"(, "subsystems": [
    { "name": "sensor", "role": "sensor", "vote": ")" +
         sensor_vote + R"(", "channels": )" + sensor_channels + R"(, "beta": "5%" },
    { "name": "logic", "role": "logic", "vote": "1oo1", "channels": ["LS-1"] },
    { "name": "valve", "role": "final", "vote": "1oo1", "channels": [["SOV-1", "XV-1"]] } ] } ]
})";
}

const RequirementCheck* find_check(const SifResult& s, const std::string& name) {
  for (const auto& c : s.requirement_checks)
    if (c.check == name) return &c;
  return nullptr;
}

TEST(ResponseTime, ElevenAndAHalfSecondsAgainstTenFallsShortNamingTheValve) {
  const auto r = verify_text(timed_project(R"({"process_safety_time": "20 s"})"));
  const SifResult& s = r.sifs[0];
  ASSERT_TRUE(s.response_time_s);
  EXPECT_NEAR(*s.response_time_s, 11.5, 11.5 * kRelTol);
  ASSERT_TRUE(s.response_time_limit_s);
  EXPECT_NEAR(*s.response_time_limit_s, 10.0, 10.0 * kRelTol);  // half of 20 s, common practice
  const RequirementCheck* c = find_check(s, "response_time_s");
  ASSERT_NE(c, nullptr);
  EXPECT_FALSE(c->ok);
  EXPECT_EQ(s.meets_target, false);
  ASSERT_FALSE(s.limits.empty());
  EXPECT_EQ(s.limits.back().kind, "response time");
  EXPECT_EQ(s.limits.back().element, "XV-1");
  EXPECT_EQ(s.limits.back().subsystem, "valve");
  EXPECT_EQ(c->message,
            "response time 11.5 s exceeds the allowed 10 s (50% of the process safety time 20 s, the common-practice "
            "share when none is stated); the slowest element is XV-1 in 'valve'");
}

TEST(ResponseTime, TheSameSifMeetsWithThirtySeconds) {
  const auto r = verify_text(timed_project(R"({"process_safety_time": "30 s"})"));
  const SifResult& s = r.sifs[0];
  EXPECT_NEAR(*s.response_time_limit_s, 15.0, 15.0 * kRelTol);
  ASSERT_NE(find_check(s, "response_time_s"), nullptr);
  EXPECT_TRUE(find_check(s, "response_time_s")->ok);
  EXPECT_EQ(s.meets_target, true);
  EXPECT_TRUE(s.limits.empty());
}

TEST(ResponseTime, AStatedFractionReplacesTheHalf) {
  const auto r = verify_text(timed_project(R"({"process_safety_time": "20 s", "response_time_fraction": "60%"})"));
  EXPECT_NEAR(*r.sifs[0].response_time_limit_s, 12.0, 12.0 * kRelTol);
  EXPECT_EQ(r.sifs[0].meets_target, true);
}

TEST(ResponseTime, AVotingGroupTakesItsSlowestChannel) {
  const auto r = verify_text(timed_project(R"({"process_safety_time": "1 min"})", "1oo2", R"(["PT-1", "PT-2"])"));
  // 3 s (the slower transmitter) + 0.5 s + 10 s.
  EXPECT_NEAR(*r.sifs[0].response_time_s, 13.5, 13.5 * kRelTol);
  EXPECT_EQ(r.sifs[0].response_budget[0].path, std::vector<std::string>{"PT-2"});
}

TEST(ResponseTime, WithoutAProcessSafetyTimeTheTimeIsShownButNotJudged) {
  const auto r = verify_text(timed_project(R"({"safe_state": "valve closed"})"));
  EXPECT_NEAR(*r.sifs[0].response_time_s, 11.5, 11.5 * kRelTol);
  EXPECT_FALSE(r.sifs[0].response_time_limit_s);
  EXPECT_TRUE(r.sifs[0].requirement_checks.empty());
  EXPECT_EQ(r.sifs[0].meets_target, true);
}

TEST(SpuriousTrips, ARateAboveTheLimitFallsShortNamingTheLargestContributor) {
  // The solenoid's 2000 FIT of safe failures: about 0.022/yr from the valve subsystem.
  const auto r = verify_text(timed_project(R"({"max_spurious_trip_rate": "0.01/yr"})"));
  const SifResult& s = r.sifs[0];
  const RequirementCheck* c = find_check(s, "spurious_trip_rate_per_yr");
  ASSERT_NE(c, nullptr);
  EXPECT_FALSE(c->ok);
  EXPECT_NEAR(c->value, s.spurious_trip_rate_per_yr, s.spurious_trip_rate_per_yr * kRelTol);
  EXPECT_NEAR(c->limit, 0.01, 0.01 * kRelTol);
  EXPECT_EQ(s.meets_target, false);
  EXPECT_EQ(s.limits.back().kind, "spurious trips");
  EXPECT_EQ(s.limits.back().subsystem, "valve");
  EXPECT_EQ(s.limits.back().element, "SOV-1");
}

TEST(ProofTest, AnIntervalLongerThanTheRequiredOneFallsShort) {
  const auto r = verify_text(timed_project(R"({"proof_test_interval": "6 mo"})"));
  const RequirementCheck* c = find_check(r.sifs[0], "proof_test_interval_h");
  ASSERT_NE(c, nullptr);
  EXPECT_FALSE(c->ok);
  EXPECT_NEAR(c->value, 8760.0, 8760.0 * kRelTol);
  EXPECT_EQ(r.sifs[0].meets_target, false);
  EXPECT_EQ(r.sifs[0].limits.back().kind, "proof-test interval");
}

TEST(RequirementsJson, EverySifCarriesTheResponseTimeAndTheChecks) {
  const auto r = verify_text(timed_project(R"({"process_safety_time": "20 s"})"));
  const auto j = report::results_json(r);
  const auto& s = j["sifs"][0];
  EXPECT_DOUBLE_EQ(s["response_time_s"].get<double>(), *r.sifs[0].response_time_s);
  EXPECT_DOUBLE_EQ(s["response_time_limit_s"].get<double>(), 10.0);
  ASSERT_EQ(s["requirement_checks"].size(), 1u);
  EXPECT_EQ(s["requirement_checks"][0]["check"], "response_time_s");
  EXPECT_EQ(s["requirement_checks"][0]["ok"], false);
}

// ---- Prior use (IEC 61511-1:2016 11.5.3, from memory) --------------------------------------

std::string prior_use_project(const std::string& valve_fields) {
  return R"({
  "format": "sifter-project/1",
  "defaults": { "proof_test_interval": "1 yr", "mttr": "8 h" },
  "components": [
    { "id": "PT-1", "lambda_du": "50 FIT", "lambda_dd": "450 FIT", "lambda_sd": "300 FIT", "element_type": "B",
      "prior_use": {"sil": 2, "evidence": "400 transmitters, 2e6 h in similar service"}, "data_source": "site records" },
    { "id": "LS-1", "lambda_du": "5 FIT", "lambda_dd": "1000 FIT", "lambda_sd": "1000 FIT", "element_type": "B",
      "systematic_capability": 3, "data_source": "certificate" },
    { "id": "XV-1", "lambda_du": "200 FIT", "lambda_su": "500 FIT", "element_type": "A", )" +
         valve_fields + R"( }
  ],
  "sifs": [ { "id": "S1", "target": {"sil": 2}, "subsystems": [
    { "name": "sensor", "role": "sensor", "vote": "1oo1", "channels": ["PT-1"] },
    { "name": "logic", "role": "logic", "vote": "1oo1", "channels": ["LS-1"] },
    { "name": "valve", "role": "final", "vote": "1oo1", "channels": ["XV-1"] } ] } ]
})";
}

TEST(PriorUse, ASifOfPriorUseDevicesReachesTheClaimedSil) {
  const auto r = verify_text(prior_use_project(
      R"("prior_use": {"sil": 2, "evidence": "60 valves, stroke tests logged"}, "data_source": "x")"));
  const SifResult& s = r.sifs[0];
  EXPECT_EQ(s.sil_systematic, 2);
  EXPECT_EQ(s.sil_achieved, 2);
  EXPECT_EQ(s.meets_target, true);
  ASSERT_EQ(s.subsystems[0].systematic_basis.size(), 1u);
  EXPECT_EQ(s.subsystems[0].systematic_basis[0].basis, SystematicGround::kPriorUse);
  EXPECT_EQ(s.subsystems[0].systematic_basis[0].sil, 2);
  EXPECT_EQ(s.subsystems[0].systematic_basis[0].evidence, "400 transmitters, 2e6 h in similar service");
  EXPECT_EQ(s.subsystems[1].systematic_basis[0].basis, SystematicGround::kSystematicCapability);
  bool quoted = false;
  for (const auto& a : s.assumptions)
    quoted = quoted || a == "PT-1 ('sensor'): systematic result SIL 2 on prior use (IEC 61511-1:2016 11.5.3), "
                            "evidence: \"400 transmitters, 2e6 h in similar service\"";
  EXPECT_TRUE(quoted);
  const auto j = report::results_json(r);
  EXPECT_EQ(j["sifs"][0]["subsystems"][0]["systematic_basis"][0]["basis"], "prior use");
  EXPECT_EQ(j["sifs"][0]["subsystems"][0]["systematic_basis"][0]["evidence"],
            "400 transmitters, 2e6 h in similar service");
}

TEST(PriorUse, TheHigherOfTheScAndTheClaimCounts) {
  const auto r = verify_text(
      prior_use_project(R"("systematic_capability": 1, "prior_use": {"sil": 2, "evidence": "e"}, "data_source": "x")"));
  EXPECT_EQ(r.sifs[0].sil_systematic, 2);
  const auto lower = verify_text(
      prior_use_project(R"("systematic_capability": 3, "prior_use": {"sil": 1, "evidence": "e"}, "data_source": "x")"));
  EXPECT_EQ(lower.sifs[0].subsystems[2].systematic_basis[0].basis, SystematicGround::kSystematicCapability);
  EXPECT_EQ(lower.sifs[0].subsystems[2].systematic_capability, 3);
}

// The results file names each ground in words (sifter-results/1, "systematic_basis"/"basis").
TEST(PriorUse, EachSystematicGroundIsWrittenInTheResultsFilesWords) {
  EXPECT_EQ(to_string(SystematicGround::kSystematicCapability), "systematic capability");
  EXPECT_EQ(to_string(SystematicGround::kPriorUse), "prior use");
  EXPECT_EQ(to_string(SystematicGround::kNone), "none");
  const auto j = report::results_json(verify_text(prior_use_project(
      R"("systematic_capability": 3, "prior_use": {"sil": 1, "evidence": "e"}, "data_source": "x")")));
  EXPECT_EQ(j["sifs"][0]["subsystems"][2]["systematic_basis"][0]["basis"], "systematic capability");
}

TEST(PriorUse, AnElementWithNeitherIsRefusedWithBothWaysToStateIt) {
  const auto r = verify_text(prior_use_project(R"("data_source": "x")"));
  const SifResult& s = r.sifs[0];
  EXPECT_EQ(s.sil_systematic, 0);
  EXPECT_EQ(s.meets_target, false);
  ASSERT_FALSE(s.limits.empty());
  EXPECT_EQ(s.limits.back().message,
            "In subsystem 'valve', XV-1 has neither a declared systematic capability nor a prior-use claim, so the "
            "subsystem cannot claim a SIL from it. SIL 2 is required. To lift it: declare the SC of XV-1 from its "
            "certificate or safety manual (SC 2 or higher is needed), or its prior use with the evidence, "
            "\"prior_use\": {\"sil\": 2, \"evidence\": \"...\"} (IEC 61511-1:2016 11.5.3).");
}

TEST(PriorUse, AClaimWithoutEvidenceIsRefused) {
  EXPECT_THROW(verify_text(prior_use_project(R"("prior_use": {"sil": 2, "evidence": " "})")), InputError);
  EXPECT_THROW(verify_text(prior_use_project(R"("prior_use": {"sil": 2})")), InputError);
  EXPECT_THROW(verify_text(prior_use_project(R"("prior_use": {"sil": 5, "evidence": "e"})")), InputError);
}

TEST(DataSource, AComponentWithoutASourceIsWarnedByItsSif) {
  const auto r = verify_text(prior_use_project(R"("systematic_capability": 3)"));
  bool warned = false;
  for (const auto& w : r.warnings)
    warned = warned || (w.where == "S1" && w.message.find("XV-1") != std::string::npos &&
                        w.message.find("data_source") != std::string::npos);
  EXPECT_TRUE(warned);
}

TEST(DataSource, AnObjectSourceReadsAsOneLine) {
  const auto loaded = load_project_text(prior_use_project(R"("systematic_capability": 3, "data_source":
      {"kind": "fmeda", "document": "F-77", "revision": "1.2", "date": "2023-02-01"})"),
                                        "inline.json", ".");
  EXPECT_EQ(loaded.project.components[2].data_source_line(), "FMEDA: F-77 rev 1.2, 2023-02-01");
  EXPECT_EQ(loaded.project.components[2].source->kind, "fmeda");
  EXPECT_THROW(
      load_project_text(prior_use_project(R"("data_source": {"kind": "rumour", "document": "x"})"), "inline.json", "."),
      InputError);
}

TEST(FormatSeconds, ShortTimesReadInSecondsLongerInMinutes) {
  EXPECT_EQ(format_seconds(11.5), "11.5 s");
  EXPECT_EQ(format_seconds(300.0), "5 min");
}

}  // namespace
}  // namespace sifter
