// Specification of the IEC 61508-6 Annex B simplified equations.
#include "sifter/engines/simplified.hpp"

#include <gtest/gtest.h>

#include <cmath>
#include <string>

#include "support/tolerance.hpp"

namespace sifter {
namespace {

using sifter::testing::expect_relative;

// The printed cells of Table B.3 carry two significant digits.
constexpr double kTableDigits = 0.05;
// Hand-computed values are compared to machine precision, relatively.
constexpr double kExactRelTol = 1e-12;

constexpr double kOneYear = 8760.0;

// Table B.3 conventions (IEC 61508-6:2010 B.3.2.2): T1 = 1 yr, MTTR = MRT = 8 h, the channel's
// total failure rate lambda splits evenly into safe and dangerous (lD = lambda/2), beta_D = beta/2.
GroupData table_b3_group(const std::string& vote, double lambda, double beta, double dc) {
  GroupData g;
  g.vote.k = vote[0] - '0';
  g.vote.n = vote[3] - '0';
  const double ld = lambda / 2.0;
  g.channel.lambda_dd.per_hour = dc * ld;
  g.channel.lambda_du.per_hour = (1.0 - dc) * ld;
  g.beta = beta;
  g.beta_d = beta / 2.0;
  g.tests = {{1.0, Duration{kOneYear}}};
  g.mttr = Duration{8.0};
  g.mrt = Duration{8.0};
  return g;
}

struct TableB3Cell {
  const char* vote;
  double lambda_per_hour;
  double beta;
  double dc;
  double printed_pfd;
};

class TableB3 : public ::testing::TestWithParam<TableB3Cell> {};

// IEC 61508-6:2010 Table B.3 (T1 = 1 yr, MTTR = MRT = 8 h); cells from memory of the printed
// table, as collected in DEVELOPERS.md, Methods M8.
TEST_P(TableB3, CellMatchesPrintedTwoDigits) {
  const auto& c = GetParam();
  const auto r = group_pfd_avg(table_b3_group(c.vote, c.lambda_per_hour, c.beta, c.dc));
  expect_relative(r.pfd_avg, c.printed_pfd, kTableDigits);
}

INSTANTIATE_TEST_SUITE_P(
    Iec61508Part6, TableB3,
    ::testing::Values(TableB3Cell{"1oo1", 1e-7, 0.0, 0.0, 2.2e-4}, TableB3Cell{"1oo1", 1e-7, 0.0, 0.6, 8.8e-5},
                      TableB3Cell{"1oo1", 1e-7, 0.0, 0.9, 2.2e-5}, TableB3Cell{"1oo1", 1e-7, 0.0, 0.99, 2.6e-6},
                      TableB3Cell{"1oo1", 1e-6, 0.0, 0.0, 2.2e-3}, TableB3Cell{"1oo1", 1e-6, 0.0, 0.6, 8.8e-4},
                      TableB3Cell{"1oo1", 1e-6, 0.0, 0.9, 2.2e-4}, TableB3Cell{"1oo1", 1e-6, 0.0, 0.99, 2.6e-5},
                      TableB3Cell{"1oo2", 1e-7, 0.02, 0.0, 4.4e-6}, TableB3Cell{"1oo2", 1e-7, 0.02, 0.6, 1.8e-6},
                      TableB3Cell{"1oo2", 1e-7, 0.02, 0.9, 4.4e-7}, TableB3Cell{"1oo2", 1e-7, 0.02, 0.99, 4.8e-8},
                      TableB3Cell{"1oo2", 1e-7, 0.10, 0.0, 2.2e-5}, TableB3Cell{"1oo2", 1e-7, 0.10, 0.6, 8.8e-6},
                      TableB3Cell{"1oo2", 1e-7, 0.10, 0.9, 2.2e-6}, TableB3Cell{"1oo2", 1e-7, 0.10, 0.99, 2.4e-7},
                      TableB3Cell{"2oo3", 1e-7, 0.02, 0.0, 4.6e-6}, TableB3Cell{"2oo3", 1e-7, 0.02, 0.6, 1.8e-6},
                      TableB3Cell{"2oo3", 1e-7, 0.02, 0.9, 4.4e-7}, TableB3Cell{"2oo3", 1e-7, 0.02, 0.99, 4.8e-8}));

}  // namespace
}  // namespace sifter

namespace sifter {
namespace {

GroupData hand_group(int k, int n, double ldu, double ldd, double beta, double beta_d, double t1, double mttr,
                     double mrt) {
  GroupData g;
  g.vote.k = k;
  g.vote.n = n;
  g.channel.lambda_du.per_hour = ldu;
  g.channel.lambda_dd.per_hour = ldd;
  g.beta = beta;
  g.beta_d = beta_d;
  g.tests = {{1.0, Duration{t1}}};
  g.mttr = Duration{mttr};
  g.mrt = Duration{mrt};
  return g;
}

// The Annex B forms written out by hand (IEC 61508-6:2010 B.3.2.2, DEVELOPERS.md, Methods M1, from
// memory), evaluated independently of the general construction in simplified.cpp.
struct HandForms {
  double ldu, ldd, beta, beta_d, t1, mttr, mrt;
  [[nodiscard]] double ld() const { return ldu + ldd; }
  [[nodiscard]] double t(double divisor) const { return ldu / ld() * (t1 / divisor + mrt) + ldd / ld() * mttr; }
  [[nodiscard]] double x() const { return (1 - beta_d) * ldd + (1 - beta) * ldu; }
  [[nodiscard]] double ccf() const { return beta_d * ldd * mttr + beta * ldu * (t1 / 2 + mrt); }
};

constexpr HandForms kHand{2e-6, 8e-6, 0.05, 0.02, 8760.0, 8.0, 24.0};

TEST(AnnexB, TwoOutOfTwoIsTwiceTheSingleChannel) {
  const auto& h = kHand;
  const auto r = group_pfd_avg(hand_group(2, 2, h.ldu, h.ldd, h.beta, h.beta_d, h.t1, h.mttr, h.mrt));
  expect_relative(r.pfd_avg, 2 * h.ld() * h.t(2), kExactRelTol);
}

TEST(AnnexB, OneOutOfThreeMatchesTheHandComputedForm) {
  const auto& h = kHand;
  const auto r = group_pfd_avg(hand_group(1, 3, h.ldu, h.ldd, h.beta, h.beta_d, h.t1, h.mttr, h.mrt));
  expect_relative(r.pfd_avg, 6 * std::pow(h.x(), 3) * h.t(2) * h.t(3) * h.t(4) + h.ccf(), kExactRelTol);
}

TEST(AnnexB, OneOutOfTwoAndTwoOutOfThreeMatchTheHandComputedForms) {
  const auto& h = kHand;
  const auto r12 = group_pfd_avg(hand_group(1, 2, h.ldu, h.ldd, h.beta, h.beta_d, h.t1, h.mttr, h.mrt));
  expect_relative(r12.pfd_avg, 2 * h.x() * h.x() * h.t(2) * h.t(3) + h.ccf(), kExactRelTol);
  const auto r23 = group_pfd_avg(hand_group(2, 3, h.ldu, h.ldd, h.beta, h.beta_d, h.t1, h.mttr, h.mrt));
  expect_relative(r23.pfd_avg, 6 * h.x() * h.x() * h.t(2) * h.t(3) + h.ccf(), kExactRelTol);
  EXPECT_NEAR(r23.common_cause, h.ccf(), h.ccf() * kExactRelTol);
}

TEST(AnnexB, OneOutOfTwoDMatchesTheHandComputedForm) {
  // IEC 61508-6:2010 B.3.2.2.5 (DEVELOPERS.md, Methods M1, from memory).
  const double ldu = 2e-6, ldd = 8e-6, lsd = 5e-6, beta = 0.05, beta_d = 0.02, t1 = 8760, mttr = 8, mrt = 24;
  auto g = hand_group(1, 2, ldu, ldd, beta, beta_d, t1, mttr, mrt);
  g.vote.diagnostic = true;
  g.channel.lambda_sd.per_hour = lsd;
  const double t_ce = (ldu * (t1 / 2 + mrt) + (ldd + lsd) * mttr) / (ldu + ldd + lsd);
  const double t_ge = t1 / 3 + mrt;
  const double expected = 2 * (1 - beta) * ldu * ((1 - beta) * ldu + (1 - beta_d) * ldd + lsd) * t_ce * t_ge +
                          beta_d * ldd * mttr + beta * ldu * (t1 / 2 + mrt);
  expect_relative(group_pfd_avg(g).pfd_avg, expected, kExactRelTol);
}

class GeneralKooN : public ::testing::TestWithParam<std::pair<int, int>> {};

// With beta = DC = MRT = 0 the Annex B construction reduces to the undetected-only KooN
// form C(N, N-K+1) (lDU T1)^(N-K+1) / (N-K+2) (Rausand 2014; DEVELOPERS.md, Methods M1, from memory).
TEST_P(GeneralKooN, EqualsTheUndetectedOnlyFormWithoutCommonCauseOrRepair) {
  const auto [k, n] = GetParam();
  const double ldu = 3e-6, t1 = 8760.0;
  const auto r = group_pfd_avg(hand_group(k, n, ldu, 0.0, 0.0, 0.0, t1, 0.0, 0.0));
  const int m = n - k + 1;
  expect_relative(r.pfd_avg, binomial(n, m) * std::pow(ldu * t1, m) / (m + 1), kExactRelTol);
}

INSTANTIATE_TEST_SUITE_P(Votes, GeneralKooN,
                         ::testing::Values(std::pair{1, 1}, std::pair{1, 2}, std::pair{2, 2}, std::pair{2, 3},
                                           std::pair{1, 3}, std::pair{3, 3}, std::pair{2, 4}, std::pair{3, 5},
                                           std::pair{1, 4}, std::pair{4, 8}));

TEST(AnnexBPfh, SingleAndSeriesChannelsAreTheirUndetectedRate) {
  // IEC 61508-6:2010 B.3.3.2 (DEVELOPERS.md, Methods M3, from memory): 1oo1 PFH = lDU, 2oo2 = 2 lDU.
  expect_relative(group_pfh(hand_group(1, 1, 2e-7, 5e-7, 0, 0, 8760, 8, 8)).pfh_per_hour, 2e-7, kExactRelTol);
  expect_relative(group_pfh(hand_group(2, 2, 2e-7, 5e-7, 0, 0, 8760, 8, 8)).pfh_per_hour, 4e-7, kExactRelTol);
}

TEST(AnnexBPfh, RedundantGroupsMatchTheHandComputedForms) {
  const auto& h = kHand;
  // IEC 61508-6:2010 B.3.3.2 (from memory; DEVELOPERS.md Methods): a detected failure takes the
  // system to its safe state, so the common-cause term is beta lDU alone. The 2000 edition
  // also added beta_D lDD, which made every redundant vote worse than one channel.
  const double ccf = h.beta * h.ldu;
  const auto g12 = hand_group(1, 2, h.ldu, h.ldd, h.beta, h.beta_d, h.t1, h.mttr, h.mrt);
  expect_relative(group_pfh(g12).pfh_per_hour, 2 * h.x() * (1 - h.beta) * h.ldu * h.t(2) + ccf, kExactRelTol);
  const auto g23 = hand_group(2, 3, h.ldu, h.ldd, h.beta, h.beta_d, h.t1, h.mttr, h.mrt);
  expect_relative(group_pfh(g23).pfh_per_hour, 6 * h.x() * (1 - h.beta) * h.ldu * h.t(2) + ccf, kExactRelTol);
  const auto g13 = hand_group(1, 3, h.ldu, h.ldd, h.beta, h.beta_d, h.t1, h.mttr, h.mrt);
  expect_relative(group_pfh(g13).pfh_per_hour, 6 * h.x() * h.x() * (1 - h.beta) * h.ldu * h.t(2) * h.t(3) + ccf,
                  kExactRelTol);
}

TEST(AnnexBPfh, PfhCheckValueForOneOutOfTwoAtTwoPercentBeta) {
  // Hand check: lDU = 5e-7, lDD = 0, beta = 2%, T1 = 1 yr, MRT = 8 h: tCE = 4388 h;
  // PFH = 2 (0.98 x 5e-7)^2 x 4388 + 0.02 x 5e-7 = 2.1076e-9 + 1e-8 = 1.2108e-8 per hour.
  const auto r = group_pfh(hand_group(1, 2, 5e-7, 0.0, 0.02, 0.02, 8760.0, 8.0, 8.0));
  expect_relative(r.pfh_per_hour, 1.21076e-8, 1e-4);
}

TEST(TableD5, MultipliersOfTheOneOutOfTwoBeta) {
  // IEC 61508-6:2010 Table D.5 (DEVELOPERS.md, Methods M1, from memory).
  EXPECT_DOUBLE_EQ(ccf_multiplier_table_d5(1, 2), 1.0);
  EXPECT_DOUBLE_EQ(ccf_multiplier_table_d5(1, 3), 0.5);
  EXPECT_DOUBLE_EQ(ccf_multiplier_table_d5(2, 3), 1.5);
  EXPECT_DOUBLE_EQ(ccf_multiplier_table_d5(1, 4), 0.3);
  EXPECT_DOUBLE_EQ(ccf_multiplier_table_d5(2, 4), 0.6);
  EXPECT_DOUBLE_EQ(ccf_multiplier_table_d5(3, 4), 1.75);
  EXPECT_DOUBLE_EQ(ccf_multiplier_table_d5(1, 5), 0.2);
  EXPECT_DOUBLE_EQ(ccf_multiplier_table_d5(2, 5), 0.4);
  EXPECT_DOUBLE_EQ(ccf_multiplier_table_d5(3, 5), 0.8);
  EXPECT_DOUBLE_EQ(ccf_multiplier_table_d5(4, 5), 2.0);
  EXPECT_FALSE(table_d5_covers(2, 6));
}

TEST(ImperfectProofTest, OneOutOfOneMatchesClauseB325) {
  // IEC 61508-6:2010 B.3.2.5 (DEVELOPERS.md, Methods M2, from memory, low confidence):
  // PFD = PTC lDU (T1/2 + MRT) + (1 - PTC) lDU (T2/2 + MRT) + lDD MTTR.
  const double ldu = 1e-6, ldd = 2e-6, ptc = 0.9, t1 = 8760, t2 = 20 * 8760.0, mttr = 8, mrt = 16;
  auto g = hand_group(1, 1, ldu, ldd, 0, 0, t1, mttr, mrt);
  g.tests = {{ptc, Duration{t1}}, {1 - ptc, Duration{t2}}};
  const double expected = ptc * ldu * (t1 / 2 + mrt) + (1 - ptc) * ldu * (t2 / 2 + mrt) + ldd * mttr;
  expect_relative(group_pfd_avg(g).pfd_avg, expected, kExactRelTol);
}

TEST(PartialStrokeTest, OneOutOfOneMatchesTheWeightedForm) {
  // Partial stroke (DEVELOPERS.md, Methods M2, from memory): C lDU T_PST/2 + (1 - C) lDU T_FT/2 with MRT = 0.
  const double ldu = 2e-6, c = 0.6, t_pst = 730, t_ft = 8760;
  auto g = hand_group(1, 1, ldu, 0, 0, 0, t_ft, 0, 0);
  g.tests = {{c, Duration{t_pst}}, {1 - c, Duration{t_ft}}};
  expect_relative(group_pfd_avg(g).pfd_avg, c * ldu * t_pst / 2 + (1 - c) * ldu * t_ft / 2, kExactRelTol);
}

TEST(AnnexB, TermsAddUpToThePfdAvg) {
  const auto& h = kHand;
  const auto r = group_pfd_avg(hand_group(2, 3, h.ldu, h.ldd, h.beta, h.beta_d, h.t1, h.mttr, h.mrt));
  expect_relative(r.independent_undetected + r.independent_detected + r.common_cause, r.pfd_avg, kExactRelTol);
  EXPECT_GT(r.independent_detected, 0.0);
}

}  // namespace
}  // namespace sifter

// ---- Imperfect and partial tests as the project file states them -----------------------

#include "sifter/analysis/verify.hpp"
#include "sifter/input/load.hpp"

namespace sifter {
namespace {

// One subsystem of three identical channels voted as given, with extra keys.
Project one_group_project(const std::string& vote, const std::string& extra) {
  const std::string text = R"({
  "format": "sifter-project/1",
  "defaults": { "proof_test_interval": "1 yr", "mttr": "8 h", "mission_time": "15 yr" },
  "components": [
    { "id": "XV-1", "lambda_du": "2e-6/h", "lambda_dd": "5e-7/h", "lambda_su": "1e-6/h" },
    { "id": "XV-2", "lambda_du": "2e-6/h", "lambda_dd": "5e-7/h", "lambda_su": "1e-6/h" },
    { "id": "XV-3", "lambda_du": "2e-6/h", "lambda_dd": "5e-7/h", "lambda_su": "1e-6/h" }
  ],
  "sifs": [ { "id": "S1", "subsystems": [
    { "name": "valves", "role": "final", "vote": ")" +
                           vote + R"(", "channels": )" +
                           std::string(vote.back() == '1'   ? R"(["XV-1"])"
                                       : vote.back() == '2' ? R"(["XV-1", "XV-2"])"
                                                            : R"(["XV-1", "XV-2", "XV-3"])") +
                           R"(, "beta": "5%", "mrt": "16 h")" + extra + R"( } ] } ]
})";
  return load_project_text(text, "inline.json", ".").project;
}

double pfd_of(const Project& p) { return group_pfd_avg(group_data_for(p, p.sifs[0].subsystems[0])).pfd_avg; }

class TestSlicesPerVote : public ::testing::TestWithParam<const char*> {};

// DEVELOPERS.md, Methods M2 (IEC 61508-6:2010 B.3.2.5, from memory): with PTC = 1 the imperfect-test
// form is the plain B.3.2.2 equation; our generalisation to every vote keeps that property.
TEST_P(TestSlicesPerVote, ProofTestCoverageOneGivesBackThePlainEquations) {
  const std::string vote = GetParam();
  const double plain = pfd_of(one_group_project(vote, ""));
  expect_relative(pfd_of(one_group_project(vote, R"(, "proof_test_coverage": 1)")), plain, kExactRelTol);
  EXPECT_GT(pfd_of(one_group_project(vote, R"(, "proof_test_coverage": 0.9)")), plain);
}

// DEVELOPERS.md, Methods M2 (partial stroke, from memory): a partial stroke test that reveals nothing
// leaves the full-test result.
TEST_P(TestSlicesPerVote, PartialStrokeCoverageZeroGivesBackTheFullTestResult) {
  const std::string vote = GetParam();
  const double full = pfd_of(one_group_project(vote, ""));
  const auto p = one_group_project(vote, R"(, "partial_stroke": {"interval": "1 mo", "coverage": 0})");
  expect_relative(pfd_of(p), full, kExactRelTol);
  EXPECT_LT(pfd_of(one_group_project(vote, R"(, "partial_stroke": {"interval": "1 mo", "coverage": 0.6})")), full);
}

INSTANTIATE_TEST_SUITE_P(Votes, TestSlicesPerVote, ::testing::Values("1oo1", "1oo2", "2oo2", "2oo3", "1oo3"));

TEST(TestSlices, ImperfectProofTestOfOneChannelFollowsClauseB325FromTheProjectFile) {
  // IEC 61508-6:2010 B.3.2.5 (DEVELOPERS.md, Methods M2, from memory): T2 is the mission time (15 yr).
  const auto p = one_group_project("1oo1", R"(, "proof_test_coverage": "80%")");
  const double ldu = 2e-6, ldd = 5e-7, t1 = 8760.0, t2 = 15 * 8760.0, mrt = 16.0, mttr = 8.0;
  expect_relative(pfd_of(p), 0.8 * ldu * (t1 / 2 + mrt) + 0.2 * ldu * (t2 / 2 + mrt) + ldd * mttr, kExactRelTol);
}

TEST(TestSlices, PartialStrokeAndImperfectProofTestShareTheUndetectedRate) {
  // The partial stroke reveals its share at its own interval; the proof test reveals PTC of the
  // rest, and what both miss stays to the end of the mission (DEVELOPERS.md, Methods M2, generalised).
  const auto p = one_group_project(
      "1oo1", R"(, "proof_test_coverage": 0.9, "partial_stroke": {"interval": "1 mo", "coverage": 0.6})");
  const double ldu = 2e-6, ldd = 5e-7, t_pst = 730.0, t1 = 8760.0, t2 = 15 * 8760.0, mrt = 16.0, mttr = 8.0;
  const double expected =
      0.6 * ldu * (t_pst / 2 + mrt) + 0.4 * 0.9 * ldu * (t1 / 2 + mrt) + 0.4 * 0.1 * ldu * (t2 / 2 + mrt) + ldd * mttr;
  expect_relative(pfd_of(p), expected, kExactRelTol);
}

}  // namespace
}  // namespace sifter
