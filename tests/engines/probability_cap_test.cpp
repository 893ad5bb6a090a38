// Specification of the last step every engine's figures pass: no probability outside [0, 1]
// leaves it, and a figure that only a defect explains is said in the SIF's own block.
#include "sifter/engines/probability_cap.hpp"

#include <gtest/gtest.h>

#include "sifter/analysis/judge.hpp"
#include "sifter/analysis/verify.hpp"

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

// The steps verify_sif takes: cap, then the defect's consequences, then the one judge.
SifResult capped_and_judged(SifResult r, std::vector<Warning>& warnings) {
  const CapFindings found = cap_figures(r);
  if (found.defect) declare_defective(r);
  apply_credit(r);
  SifTarget target;
  target.mode = r.demand_mode;
  target.sil = 2;
  VerdictBasis basis;
  basis.figures_sound = !r.figures_defective;
  r.meets_target = sif_verdict(target, r.pfd_avg, basis);
  say_findings(a_sif(), found, r, warnings);
  return r;
}

TEST(ProbabilityCap, RoundingJustBelowZeroIsShownAsZeroWithoutAWord) {
  SifResult r = a_result(-1.5e-16);  // the fuzzer's finding: one minus the working states, rates 1e-160/h
  std::vector<Warning> warnings;
  const CapFindings found = cap_figures(r);
  say_findings(a_sif(), found, r, warnings);
  EXPECT_FALSE(found.defect);
  EXPECT_EQ(*r.pfd_avg, 0.0);
  EXPECT_EQ(*r.pfd_avg_exact, 0.0);
  EXPECT_EQ(*r.subsystems[0].pfd_avg, 0.0);
  EXPECT_FALSE(r.rrf) << "no reduction factor from a PFDavg of 0";
  EXPECT_TRUE(warnings.empty());
  EXPECT_TRUE(r.assumptions.empty());
}

TEST(ProbabilityCap, AFigureFarBelowZeroIsADefectWarnedInTheSifsBlockAndNeverAPass) {
  SifResult r = a_result(1e-3);  // SIL 2 on its own figure
  r.sil_probability = 2;
  r.credit_pfd = 1e-3;
  r.subsystems[0].pfd_avg_exact = -2e-4;  // no rounding gives this: a defect somewhere upstream
  std::vector<Warning> warnings;
  r = capped_and_judged(r, warnings);
  EXPECT_EQ(*r.subsystems[0].pfd_avg_exact, 0.0);
  EXPECT_TRUE(r.figures_defective);
  EXPECT_EQ(r.meets_target, false) << "no verdict rests on a defective figure";
  EXPECT_EQ(r.sil_probability, 0);
  EXPECT_EQ(r.sil_achieved, 0);
  EXPECT_FALSE(r.rrf);
  EXPECT_EQ(*r.credit_pfd, 1.0) << "its scenarios credit it nothing";
  ASSERT_EQ(warnings.size(), 1u);
  EXPECT_EQ(warnings[0].where, "/sifs/0");
  EXPECT_NE(warnings[0].message.find("below zero"), std::string::npos) << warnings[0].message;
  EXPECT_NE(warnings[0].message.find("-0.0002"), std::string::npos) << warnings[0].message;
  ASSERT_EQ(r.assumptions.size(), 1u);
  EXPECT_EQ(r.assumptions[0], warnings[0].message);
}

TEST(ProbabilityCap, ARateFarBelowZeroIsADefectToo) {
  SifResult r;
  r.demand_mode = DemandMode::kHigh;
  r.pfh_per_hour = 1e-8;
  r.subsystems.emplace_back().pfh_exact_per_hour = -3e-9;  // a failure rate is never below zero
  const CapFindings found = cap_figures(r);
  EXPECT_TRUE(found.defect);
  EXPECT_EQ(*r.subsystems[0].pfh_exact_per_hour, 0.0);
  EXPECT_EQ(*r.pfh_per_hour, 1e-8) << "a PFH is a rate: not capped at 1, and this one is left as it is";
}

TEST(ProbabilityCap, TheJudgeNeverPassesUnsoundFiguresWhateverTheFigure) {
  SifTarget target;
  target.sil = 1;
  VerdictBasis basis;
  EXPECT_EQ(sif_verdict(target, 1e-3, basis), true);
  basis.figures_sound = false;
  EXPECT_EQ(sif_verdict(target, 1e-3, basis), false);
  EXPECT_EQ(sif_verdict(SifTarget{}, 1e-3, basis), false) << "short even without a target";
}

TEST(ProbabilityCap, ASumAboveOneIsShownAsOneWithItsReasonAndFallsShort) {
  SifResult r = a_result(1.7);
  std::vector<Warning> warnings;
  r = capped_and_judged(r, warnings);
  EXPECT_EQ(*r.pfd_avg, 1.0);
  EXPECT_EQ(*r.rrf, 1.0);
  EXPECT_EQ(r.meets_target, false);
  EXPECT_FALSE(r.figures_defective) << "outside the equations' validity, not a defect";
  ASSERT_EQ(warnings.size(), 1u);
  EXPECT_NE(warnings[0].message.find("outside the validity"), std::string::npos);
}

TEST(ProbabilityCap, RoundingLeavesAPassingVerdictAlone) {
  SifResult r = a_result(-1.5e-16);
  std::vector<Warning> warnings;
  r = capped_and_judged(r, warnings);
  EXPECT_EQ(r.meets_target, true);
  EXPECT_FALSE(r.figures_defective);
}

TEST(ProbabilityCap, APfhPercentileBelowZeroIsLiftedAndAboveOneKept) {
  SifResult r = a_result(0.0);
  r.pfd_avg.reset();
  r.demand_mode = DemandMode::kHigh;
  r.uncertainty.emplace();
  r.uncertainty->p05 = -1e-20;
  r.uncertainty->p95 = 3.0;  // a rate per hour, not a probability
  const CapFindings found = cap_uncertainty(r);
  EXPECT_EQ(r.uncertainty->p05, 0.0);
  EXPECT_EQ(r.uncertainty->p95, 3.0);
  EXPECT_TRUE(found.messages.empty());
}

TEST(ProbabilityCap, UncertaintyPercentilesStayInsideZeroToOne) {
  SifResult r = a_result(0.5);
  r.uncertainty.emplace();
  r.uncertainty->p05 = -1e-17;
  r.uncertainty->p95 = 1.2;
  const CapFindings found = cap_uncertainty(r);
  EXPECT_FALSE(found.defect);
  EXPECT_EQ(r.uncertainty->p05, 0.0);
  EXPECT_EQ(r.uncertainty->p95, 1.0);
}

TEST(ProbabilityCap, APercentileFarBelowZeroIsADefect) {
  SifResult r = a_result(1e-3);
  r.uncertainty.emplace();
  r.uncertainty->p05 = -1e-3;
  EXPECT_TRUE(cap_uncertainty(r).defect);
}

}  // namespace
}  // namespace sifter
