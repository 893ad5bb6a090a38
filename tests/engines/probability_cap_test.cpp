// Specification of the last step every engine's figures pass: no probability outside [0, 1]
// leaves it, and a figure that only a defect explains is said in the SIF's own block.
#include "sifter/engines/probability_cap.hpp"

#include <gtest/gtest.h>

namespace sifter {
namespace {

Sif a_sif() {
  Sif s;
  s.id = "SIF-X";
  s.pointer = "/sifs/0";
  return s;
}

SifResult a_result(double pfd) {
  SifResult r;
  r.pfd_avg = pfd;
  r.pfd_avg_exact = pfd;
  r.subsystems.emplace_back().pfd_avg = pfd;
  return r;
}

TEST(ProbabilityCap, RoundingJustBelowZeroIsShownAsZeroWithoutAWord) {
  SifResult r = a_result(-1.5e-16);  // the fuzzer's finding: one minus the working states, rates 1e-160/h
  std::vector<Warning> warnings;
  cap_probabilities(a_sif(), r, warnings);
  EXPECT_EQ(*r.pfd_avg, 0.0);
  EXPECT_EQ(*r.pfd_avg_exact, 0.0);
  EXPECT_EQ(*r.subsystems[0].pfd_avg, 0.0);
  EXPECT_FALSE(r.rrf) << "no reduction factor from a PFDavg of 0";
  EXPECT_TRUE(warnings.empty());
  EXPECT_TRUE(r.assumptions.empty());
}

TEST(ProbabilityCap, AFigureFarBelowZeroIsADefectWarnedInTheSifsBlockAndNeverAPass) {
  SifResult r = a_result(1e-3);
  r.meets_target = true;  // as the judge saw the figures before the cap
  r.sil_probability = 2;
  r.credit_pfd = 1e-3;
  r.subsystems[0].pfd_avg_exact = -2e-4;  // no rounding gives this: a defect somewhere upstream
  std::vector<Warning> warnings;
  cap_probabilities(a_sif(), r, warnings);
  EXPECT_EQ(*r.subsystems[0].pfd_avg_exact, 0.0);
  EXPECT_EQ(r.meets_target, false) << "no verdict rests on a defective figure";
  EXPECT_EQ(r.sil_probability, 0);
  EXPECT_EQ(*r.credit_pfd, 1.0) << "its scenarios credit it nothing";
  ASSERT_EQ(warnings.size(), 1u);
  EXPECT_EQ(warnings[0].where, "/sifs/0");
  EXPECT_NE(warnings[0].message.find("below zero"), std::string::npos) << warnings[0].message;
  EXPECT_NE(warnings[0].message.find("-0.0002"), std::string::npos) << warnings[0].message;
  ASSERT_EQ(r.assumptions.size(), 1u);
  EXPECT_EQ(r.assumptions[0], warnings[0].message);
}

TEST(ProbabilityCap, ASumAboveOneIsShownAsOneWithItsReason) {
  SifResult r = a_result(1.7);
  std::vector<Warning> warnings;
  cap_probabilities(a_sif(), r, warnings);
  EXPECT_EQ(*r.pfd_avg, 1.0);
  EXPECT_EQ(*r.rrf, 1.0);
  ASSERT_EQ(warnings.size(), 1u);
  EXPECT_NE(warnings[0].message.find("outside the validity"), std::string::npos);
}

TEST(ProbabilityCap, RoundingLeavesAPassingVerdictAlone) {
  SifResult r = a_result(-1.5e-16);
  r.meets_target = true;
  std::vector<Warning> warnings;
  cap_probabilities(a_sif(), r, warnings);
  EXPECT_EQ(r.meets_target, true);
}

TEST(ProbabilityCap, APfhPercentileBelowZeroIsLiftedAndAboveOneKept) {
  SifResult r = a_result(0.0);
  r.pfd_avg.reset();
  r.demand_mode = DemandMode::kHigh;
  r.uncertainty.emplace();
  r.uncertainty->p05 = -1e-20;
  r.uncertainty->p95 = 3.0;  // a rate per hour, not a probability
  std::vector<Warning> warnings;
  cap_probabilities(a_sif(), r, warnings);
  EXPECT_EQ(r.uncertainty->p05, 0.0);
  EXPECT_EQ(r.uncertainty->p95, 3.0);
  EXPECT_TRUE(warnings.empty());
}

TEST(ProbabilityCap, UncertaintyPercentilesStayInsideZeroToOne) {
  SifResult r = a_result(0.5);
  r.uncertainty.emplace();
  r.uncertainty->p05 = -1e-17;
  r.uncertainty->p95 = 1.2;
  std::vector<Warning> warnings;
  cap_probabilities(a_sif(), r, warnings);
  EXPECT_EQ(r.uncertainty->p05, 0.0);
  EXPECT_EQ(r.uncertainty->p95, 1.0);
}

}  // namespace
}  // namespace sifter
