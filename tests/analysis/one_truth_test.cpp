// Specification of the seams between engines: one model of each group, one judge, one credit.
// Each test here failed on the code before the judged figure and the credit rule existed.
#include <gtest/gtest.h>

#include <cmath>

#include "sifter/analysis/judge.hpp"
#include "sifter/analysis/sif_uncertainty.hpp"
#include "sifter/analysis/verify.hpp"
#include "sifter/engines/simplified.hpp"
#include "support/lopa_fixtures.hpp"

namespace sifter {
namespace {

using testing::cause;
using testing::project_with_criteria;
using testing::scenario_with_target;
using testing::sif_layer;

constexpr double kRelTol = 1e-9;
constexpr double kMonteCarloRelTol = 0.03;
constexpr double kSmallRateRelTol =
    0.01;  // exact against Annex B where lDU T1 is small  // the issue's bound for error factor 1.01

ProjectResult verify_text(const std::string& text) {
  return verify_project(load_project_text(text, "inline.json", std::string(SIFTER_SOURCE_DIR) + "/examples"));
}

// IEC 61511-1:2016 clause 9 (from memory): a SIF is credited for the SIL it achieves. With
// PFDavg 8.8e-5 but SIL 2 achieved, a scenario needing RRF 1040 is not tolerable.
TEST(OneTruth, AScenarioWhoseSifIsCappedAtSil2IsNotTolerable) {
  Project p = project_with_criteria();
  testing::add_sif(p, "S1", {"TT-1"});
  Scenario s = scenario_with_target("Z1", 1e-4);
  s.causes.push_back(cause("C1", 0.104));
  s.layers.push_back(sif_layer("S1"));
  p.scenarios.push_back(s);
  LopaContext ctx = lopa_context_from_project(p);
  const SifCredit credit = sif_credit(8.8e-5, 2, DemandMode::kLow);
  ctx.sifs["S1"].pfd_avg = 8.8e-5;
  ctx.sifs["S1"].credit = credit.value;
  ctx.sifs["S1"].credit_capped = credit.capped;
  const ScenarioResult r = evaluate_scenario(p, p.scenarios[0], ctx);
  ASSERT_TRUE(r.sif_credit_pfd);
  EXPECT_NEAR(*r.sif_credit_pfd, 1e-3, 1e-3 * kRelTol);
  EXPECT_EQ(r.sif_credit_capped, true);
  EXPECT_EQ(r.meets_target, false);
  EXPECT_NEAR(*r.mitigated_frequency_per_yr, 0.104 * 1e-3, 0.104e-3 * kRelTol);
  ASSERT_TRUE(testing::has_assumption_containing(r.assumptions, "credited only for the SIL it achieves"));
}

std::string valve_project(const std::string& valve_extra, const std::string& top = "") {
  return R"({
  "format": "sifter-project/1", )" +
         top + R"(
  "defaults": { "proof_test_interval": "6 mo", "mttr": "8 h" },
  "components": [
    { "id": "XV-1", "lambda_du": "500 FIT", "lambda_su": "500 FIT", "element_type": "A", "systematic_capability": 3 }
  ],
  "sifs": [ { "id": "S1", "target": {"sil": 1}, "subsystems": [
    { "name": "valve", "role": "final", "vote": "1oo1", "channels": ["XV-1"] )" +
         valve_extra + R"( } ] } ]
})";
}

// Common practice: a 1oo1 left unprotected while tested adds TD/T1 (2 h every 4380 h here).
TEST(OneTruth, TheBypassTermMovesTheJudgedFigure) {
  const auto without = verify_text(valve_project(""));
  const auto with = verify_text(valve_project(R"(, "test_duration": "2 h")"));
  const double added = 2.0 / (0.5 * kHoursPerYear);
  EXPECT_NEAR(*with.sifs[0].pfd_avg_simplified - *without.sifs[0].pfd_avg_simplified, added, added * 1e-6);
  EXPECT_GT(*with.sifs[0].pfd_avg, *without.sifs[0].pfd_avg + 0.9 * added);
}

TEST(OneTruth, TheJudgedFigureIsTheMoreConservativeByDefault) {
  const auto r = verify_text(valve_project(R"(, "test_duration": "2 h")"));
  const auto& s = r.sifs[0];
  ASSERT_TRUE(s.pfd_avg_exact && s.pfd_avg_simplified);
  EXPECT_NEAR(*s.pfd_avg, std::max(*s.pfd_avg_simplified, *s.subsystems[0].pfd_avg_exact), *s.pfd_avg * kRelTol);
}

TEST(OneTruth, JudgeOnExactTakesTheExactFigure) {
  const auto r = verify_text(valve_project("", R"("judge_on": "exact",)"));
  const auto& s = r.sifs[0];
  EXPECT_EQ(s.judged_on, JudgedOn::kExact);
  EXPECT_NEAR(*s.pfd_avg, *s.subsystems[0].pfd_avg_exact, *s.pfd_avg * kRelTol);
  // Independent of the engine: at lDU T1 = 2.2e-3 the exact 1oo1 average lies just below the
  // Annex B line lDU (T1/2 + MRT) = 5e-7 x (2190 + 8) (IEC 61508-6:2010 B.3.2.2, from memory),
  // by about (lDU T1)^2 / 6 relative to it.
  const double annex_b = 5e-7 * (0.25 * kHoursPerYear + 8.0);
  EXPECT_LT(*s.pfd_avg, annex_b);
  EXPECT_NEAR(*s.pfd_avg, annex_b, annex_b * kSmallRateRelTol);
}

// A 1oo2 of two different valves: the Monte Carlo at error factor 1.01 reproduces the judged
// point value (which the exact engine sets, the channels differing) within 3 %.
TEST(OneTruth, MonteCarloOfAMixedGroupReproducesItsPointValue) {
  const std::string text = R"({
  "format": "sifter-project/1",
  "defaults": { "proof_test_interval": "1 yr", "mttr": "8 h" },
  "components": [
    { "id": "XV-1", "lambda_du": "200 FIT", "lambda_su": "500 FIT", "uncertainty": {"error_factor": 1.01} },
    { "id": "XV-2", "lambda_du": "2000 FIT", "lambda_su": "500 FIT", "uncertainty": {"error_factor": 1.01} }
  ],
  "sifs": [ { "id": "S1", "target": {"sil": 2}, "subsystems": [
    { "name": "valves", "role": "final", "vote": "1oo2", "channels": ["XV-1", "XV-2"], "beta": "5%" } ] } ]
})";
  VerifyOptions options;
  options.samples = 4000;
  const auto r = verify_project(load_project_text(text, "inline.json", "."), options);
  const auto& s = r.sifs[0];
  ASSERT_TRUE(s.uncertainty);
  EXPECT_EQ(s.subsystems[0].judged_on, JudgedOn::kExact);
  EXPECT_NEAR(s.uncertainty->p50, *s.pfd_avg, *s.pfd_avg * kMonteCarloRelTol);
  EXPECT_NEAR(s.uncertainty->mean, *s.pfd_avg, *s.pfd_avg * kMonteCarloRelTol);
}

GroupData pfh_group(int k, int n, bool diagnostic, double ldu, double ldd, double beta, double beta_d) {
  GroupData g;
  g.vote = Vote{k, n, diagnostic};
  g.channel.lambda_du.per_hour = ldu;
  g.channel.lambda_dd.per_hour = ldd;
  g.beta = beta;
  g.beta_d = beta_d;
  g.tests = {{1.0, Duration{kHoursPerYear}}};
  g.proof_test_interval = Duration{kHoursPerYear};
  g.mttr = Duration{8.0};
  g.mrt = Duration{8.0};
  return g;
}

// IEC 61508-6:2010 B.3.3.2 (from memory): common cause beta lDU only. Hand-computed forms.
TEST(OneTruth, PfhOfRedundantGroupsFollowsThe2010Forms) {
  const double ldu = 1e-9, ldd = 1e-6, beta = 0.1, beta_d = 0.05, t1 = kHoursPerYear, mrt = 8.0, mttr = 8.0;
  const double ld = ldu + ldd;
  const double t_ce = (ldu / ld) * (t1 / 2 + mrt) + (ldd / ld) * mttr;
  const double t_ge = (ldu / ld) * (t1 / 3 + mrt) + (ldd / ld) * mttr;
  const double x = (1 - beta_d) * ldd + (1 - beta) * ldu;
  const double expect_1oo2 = 2 * x * (1 - beta) * ldu * t_ce + beta * ldu;
  const double expect_2oo3 = 6 * x * (1 - beta) * ldu * t_ce + beta * ldu;
  const double expect_1oo3 = 6 * x * x * (1 - beta) * ldu * t_ce * t_ge + beta * ldu;
  EXPECT_NEAR(group_pfh(pfh_group(1, 2, false, ldu, ldd, beta, beta_d)).pfh_per_hour, expect_1oo2,
              expect_1oo2 * kRelTol);
  EXPECT_NEAR(group_pfh(pfh_group(2, 3, false, ldu, ldd, beta, beta_d)).pfh_per_hour, expect_2oo3,
              expect_2oo3 * kRelTol);
  EXPECT_NEAR(group_pfh(pfh_group(1, 3, false, ldu, ldd, beta, beta_d)).pfh_per_hour, expect_1oo3,
              expect_1oo3 * kRelTol);
  // The review's case: a redundant group is no worse than one channel (lDU = 1e-9/h).
  EXPECT_LT(group_pfh(pfh_group(1, 2, false, ldu, ldd, beta, beta_d)).pfh_per_hour, ldu);
  const double t_ce_d = (ldu * (t1 / 2 + mrt) + ldd * mttr) / ld;  // lSD = 0
  const double expect_1oo2d = 2 * (1 - beta) * ldu * ((1 - beta) * ldu + (1 - beta_d) * ldd) * t_ce_d + beta * ldu;
  EXPECT_NEAR(group_pfh(pfh_group(1, 2, true, ldu, ldd, beta, beta_d)).pfh_per_hour, expect_1oo2d,
              expect_1oo2d * kRelTol);
}

TEST(OneTruth, AlarmOnlyCountsDetectedFailuresInThePfh) {
  GroupData g = pfh_group(1, 1, false, 1e-9, 1e-6, 0.0, 0.0);
  g.detected_to_safe_state = false;
  EXPECT_NEAR(group_pfh(g).pfh_per_hour, 1e-9 + 1e-6, 1e-6 * kRelTol);
}

}  // namespace
}  // namespace sifter
