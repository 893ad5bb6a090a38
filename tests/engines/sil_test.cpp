// Specification of the SIL bands, IEC 61508-1:2010 Tables 2/3 and IEC 61511-1:2016 Tables 4/5
// (DEVELOPERS.md, Methods M4, seen).
#include "sifter/engines/sil.hpp"

#include <gtest/gtest.h>

namespace sifter {
namespace {

TEST(SilBands, LowDemandBandsAreHalfOpenAtTheUpperEdge) {
  EXPECT_EQ(sil_from_pfd_avg(0.5), 0);
  EXPECT_EQ(sil_from_pfd_avg(0.1), 0);
  EXPECT_EQ(sil_from_pfd_avg(0.099), 1);
  EXPECT_EQ(sil_from_pfd_avg(1e-2), 1);  // exactly 0.01 is SIL 1
  EXPECT_EQ(sil_from_pfd_avg(9.9e-3), 2);
  EXPECT_EQ(sil_from_pfd_avg(1e-3), 2);
  EXPECT_EQ(sil_from_pfd_avg(5e-4), 3);
  EXPECT_EQ(sil_from_pfd_avg(1e-4), 3);
  EXPECT_EQ(sil_from_pfd_avg(5e-5), 4);
  EXPECT_EQ(sil_from_pfd_avg(1e-7), 4);  // no SIL above 4
}

TEST(SilBands, ProductsOfDecimalFactorsAreReadAtTheEdge) {
  // 1e-5 / (0.1 x 0.1 x 0.01) is 0.09999999999999999 in binary floating point (DEVELOPERS.md, Methods M4).
  const double required = 1e-5 / (0.1 * 0.1 * 0.01);
  ASSERT_NE(required, 0.1);
  EXPECT_EQ(sil_from_pfd_avg(required), 0);
  EXPECT_EQ(sil_required_from_rrf(1.0 / required), 0);
  EXPECT_EQ(sil_from_pfd_avg(0.1 * 0.1), 1);
}

TEST(SilBands, HighDemandBandsFollowThePfhTable) {
  EXPECT_EQ(sil_from_pfh(1e-5), 0);
  EXPECT_EQ(sil_from_pfh(1e-6), 1);
  EXPECT_EQ(sil_from_pfh(5e-7), 2);
  EXPECT_EQ(sil_from_pfh(1e-7), 2);
  EXPECT_EQ(sil_from_pfh(5e-8), 3);
  EXPECT_EQ(sil_from_pfh(5e-9), 4);
}

TEST(SilBands, RequiredSilFollowsTheRiskReductionBands) {
  EXPECT_EQ(sil_required_from_rrf(10.0), 0);
  EXPECT_EQ(sil_required_from_rrf(10.5), 1);
  EXPECT_EQ(sil_required_from_rrf(100.0), 1);  // RRF in (10, 100] is SIL 1
  EXPECT_EQ(sil_required_from_rrf(101.0), 2);
  EXPECT_EQ(sil_required_from_rrf(1000.0), 2);
  EXPECT_EQ(sil_required_from_rrf(10000.0), 3);
  EXPECT_EQ(sil_required_from_rrf(20000.0), 4);
}

TEST(SilBands, UpperLimitsAreTheBandEdges) {
  EXPECT_DOUBLE_EQ(sil_upper_limit(2, DemandMode::kLow), 1e-2);
  EXPECT_DOUBLE_EQ(sil_upper_limit(3, DemandMode::kHigh), 1e-7);
}

TEST(SilBands, AtMostToleratesRoundingButNotRealExcess) {
  EXPECT_TRUE(at_most(0.1 * (1 + 1e-12), 0.1));
  EXPECT_FALSE(at_most(0.1 * (1 + 1e-6), 0.1));
}

}  // namespace
}  // namespace sifter
