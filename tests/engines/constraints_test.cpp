// Specification of the architectural constraints and systematic capability.
#include "sifter/engines/constraints.hpp"

#include <gtest/gtest.h>

#include <algorithm>
#include <cmath>
#include <string>
#include <vector>

#include "support/constraints_fixtures.hpp"

namespace sifter {
namespace {

// Ratios of rates are exact to a few ulps; compare them relatively.
constexpr double kExactRelTol = 1e-12;

using namespace testing_fixtures;

// ---- Hardware fault tolerance -----------------------------------------------------------

struct VoteHft {
  Vote vote;
  int hft;
};
class HardwareFaultTolerance : public ::testing::TestWithParam<VoteHft> {};

// HFT N: N + 1 faults can cause the loss of the function, so a KooN group tolerates N - K
// (IEC 61508-2:2010 7.4.4.1.1, from memory); 1oo2D tolerates one (common practice).
TEST_P(HardwareFaultTolerance, IsChannelsMinusChannelsNeeded) {
  EXPECT_EQ(hardware_fault_tolerance(GetParam().vote), GetParam().hft) << GetParam().vote.text();
}
INSTANTIATE_TEST_SUITE_P(Votes, HardwareFaultTolerance,
                         ::testing::Values(VoteHft{vote(1, 1), 0}, VoteHft{vote(1, 2), 1}, VoteHft{vote(2, 2), 0},
                                           VoteHft{vote(2, 3), 1}, VoteHft{vote(1, 3), 2}, VoteHft{vote(3, 3), 0},
                                           VoteHft{vote(1, 2, true), 1}, VoteHft{vote(2, 4), 2}));

// ---- IEC 61511-1:2016 Table 6 -----------------------------------------------------------

struct Table6Cell {
  int sil;
  DemandMode mode;
  int min_hft;
};
class Table6 : public ::testing::TestWithParam<Table6Cell> {};

// IEC 61511-1:2016 11.4 Table 6 [seen, DEVELOPERS.md, Methods M5]: SIL 1: 0; SIL 2 low demand: 0;
// SIL 2 high demand or continuous: 1; SIL 3: 1; SIL 4: 2.
TEST_P(Table6, MinimumHftMatchesTheTable) {
  const auto& c = GetParam();
  EXPECT_EQ(min_hft_table6(c.sil, c.mode), c.min_hft);
  // The highest SIL the table allows at that HFT is at least this SIL.
  EXPECT_GE(max_sil_table6(c.min_hft, c.mode), c.sil);
  if (c.min_hft > 0) {
    EXPECT_LT(max_sil_table6(c.min_hft - 1, c.mode), c.sil);
  }
}
INSTANTIATE_TEST_SUITE_P(Iec61511Part1, Table6,
                         ::testing::Values(Table6Cell{1, DemandMode::kLow, 0}, Table6Cell{1, DemandMode::kHigh, 0},
                                           Table6Cell{2, DemandMode::kLow, 0}, Table6Cell{2, DemandMode::kHigh, 1},
                                           Table6Cell{3, DemandMode::kLow, 1}, Table6Cell{3, DemandMode::kHigh, 1},
                                           Table6Cell{4, DemandMode::kLow, 2}, Table6Cell{4, DemandMode::kHigh, 2}));

// IEC 61511-1:2016 Table 6 [seen] read the other way: what a group of HFT h may claim.
TEST(Table6Inverse, HighestSilByHftAndMode) {
  EXPECT_EQ(max_sil_table6(0, DemandMode::kLow), 2);
  EXPECT_EQ(max_sil_table6(0, DemandMode::kHigh), 1);
  EXPECT_EQ(max_sil_table6(1, DemandMode::kLow), 3);
  EXPECT_EQ(max_sil_table6(1, DemandMode::kHigh), 3);
  EXPECT_EQ(max_sil_table6(2, DemandMode::kLow), 4);
  EXPECT_EQ(max_sil_table6(3, DemandMode::kHigh), 4);
}

// ---- IEC 61508-2:2010 Tables 2 and 3 ----------------------------------------------------

struct Route1hCell {
  ElementType type;
  double sff;
  int hft;
  int max_sil;
};
class Route1hTables : public ::testing::TestWithParam<Route1hCell> {};

// IEC 61508-2:2010 Table 2 (Type A) and Table 3 (Type B) [seen, DEVELOPERS.md, Methods M5]; one SFF
// inside each band; 0 is the "not allowed" cell.
TEST_P(Route1hTables, CellMatchesTheTable) {
  const auto& c = GetParam();
  EXPECT_EQ(max_sil_route_1h(c.type, c.sff, c.hft), c.max_sil);
}
constexpr auto kA = ElementType::kA;
constexpr auto kB = ElementType::kB;
INSTANTIATE_TEST_SUITE_P(Iec61508Part2, Route1hTables,
                         ::testing::Values(
                             // Type A: < 60 %: 1/2/3; 60-90 %: 2/3/4; 90-99 %: 3/4/4; >= 99 %: 3/4/4.
                             Route1hCell{kA, 0.30, 0, 1}, Route1hCell{kA, 0.30, 1, 2}, Route1hCell{kA, 0.30, 2, 3},
                             Route1hCell{kA, 0.75, 0, 2}, Route1hCell{kA, 0.75, 1, 3}, Route1hCell{kA, 0.75, 2, 4},
                             Route1hCell{kA, 0.95, 0, 3}, Route1hCell{kA, 0.95, 1, 4}, Route1hCell{kA, 0.95, 2, 4},
                             Route1hCell{kA, 0.995, 0, 3}, Route1hCell{kA, 0.995, 1, 4}, Route1hCell{kA, 0.995, 2, 4},
                             // Type B: < 60 %: not allowed/1/2; 60-90 %: 1/2/3; 90-99 %: 2/3/4; >= 99 %: 3/4/4.
                             Route1hCell{kB, 0.30, 0, 0}, Route1hCell{kB, 0.30, 1, 1}, Route1hCell{kB, 0.30, 2, 2},
                             Route1hCell{kB, 0.75, 0, 1}, Route1hCell{kB, 0.75, 1, 2}, Route1hCell{kB, 0.75, 2, 3},
                             Route1hCell{kB, 0.95, 0, 2}, Route1hCell{kB, 0.95, 1, 3}, Route1hCell{kB, 0.95, 2, 4},
                             Route1hCell{kB, 0.995, 0, 3}, Route1hCell{kB, 0.995, 1, 4}, Route1hCell{kB, 0.995, 2, 4}));

// Beyond HFT 2 the tables stop; each further fault tolerated adds one SIL, as the parallel
// rule of IEC 61508-2:2010 7.4.4.2.4 does (from memory), never above SIL 4.
TEST(Route1hBeyondTheTables, EachFurtherFaultToleratedAddsOneSilUpToFour) {
  EXPECT_EQ(max_sil_route_1h(kB, 0.30, 3), 3);
  EXPECT_EQ(max_sil_route_1h(kB, 0.30, 4), 4);
  EXPECT_EQ(max_sil_route_1h(kA, 0.30, 3), 4);
  EXPECT_EQ(max_sil_route_1h(kB, 0.95, 5), 4);
}

// Read from the same tables [seen]: the SFF and the HFT that reach a SIL.
TEST(Route1hInverse, LowestSffAndHftThatReachASil) {
  EXPECT_EQ(min_sff_route_1h(kB, 0, 2), 0.9);
  EXPECT_EQ(min_sff_route_1h(kB, 1, 2), 0.6);
  EXPECT_EQ(min_sff_route_1h(kA, 0, 1), 0.0);
  EXPECT_EQ(min_sff_route_1h(kB, 0, 4), std::nullopt);  // Type B at HFT 0 never reaches SIL 4
  EXPECT_EQ(min_hft_route_1h(kB, 0.75, 3), 2);
  EXPECT_EQ(min_hft_route_1h(kB, 0.30, 1), 1);
  EXPECT_EQ(min_hft_route_1h(kA, 0.95, 3), 0);
}

// ---- SFF and DC from the rates ----------------------------------------------------------

// IEC 61508-2:2010 Annex C, Edition 2 [seen]: SFF = (lS + lDD) / (lS + lDD + lDU), without
// no-effect failures; DC = lDD / (lDD + lDU). Hand computed: (6 + 3) / 10 and 3 / 4.
TEST(SafeFailureFraction, IsSafeAndDetectedOverAllFailures) {
  FailureRates r;
  r.lambda_du.per_hour = 100 * kFit;
  r.lambda_dd.per_hour = 300 * kFit;
  r.lambda_su.per_hour = 200 * kFit;
  r.lambda_sd.per_hour = 400 * kFit;
  EXPECT_NEAR(*safe_failure_fraction(r), 0.9, 0.9 * kExactRelTol);
  EXPECT_NEAR(*diagnostic_coverage(r), 0.75, 0.75 * kExactRelTol);
}

TEST(SafeFailureFraction, IsUnknownForAnElementWithoutRates) {
  EXPECT_EQ(safe_failure_fraction(FailureRates{}), std::nullopt);
  EXPECT_EQ(diagnostic_coverage(FailureRates{}), std::nullopt);
}

struct SffEdge {
  const char* name;
  FailureRates rates;  // lDU, lDD, lSU, lSD
  double nominal;
  SffBand band;
  int type_b_hft0;  // IEC 61508-2:2010 Table 3, HFT 0
};
class SffAtBandEdges : public ::testing::TestWithParam<SffEdge> {};

// Rates chosen so that the exact SFF is 59.99 %, 60 %, 90 % and 99 %; the last three come out
// of binary arithmetic one ulp below the edge (0.5999999999999999), and must still read as the
// edge (sil.hpp kEdgeRelTol). Bands and cells: IEC 61508-2:2010 Table 3 [seen].
TEST_P(SffAtBandEdges, SffFromRatesFallsInTheRightBand) {
  const auto& c = GetParam();
  const double sff = *safe_failure_fraction(c.rates);
  EXPECT_NEAR(sff, c.nominal, c.nominal * kExactRelTol);
  EXPECT_EQ(sff_band(sff), c.band);
  EXPECT_EQ(max_sil_route_1h(kB, sff, 0), c.type_b_hft0);
}
INSTANTIATE_TEST_SUITE_P(Iec61508Part2, SffAtBandEdges,
                         ::testing::Values(SffEdge{"Below60", fit(40.01, 0, 29.995, 29.995), 0.5999, SffBand::kBelow60,
                                                   0},
                                           SffEdge{"At60", fit(12, 1, 8.5, 8.5), 0.6, SffBand::kFrom60To90, 1},
                                           SffEdge{"At90", fit(4, 2, 17, 17), 0.9, SffBand::kFrom90To99, 2},
                                           SffEdge{"At99", fit(25, 0, 1237.5, 1237.5), 0.99, SffBand::kAtLeast99, 3}),
                         [](const ::testing::TestParamInfo<SffEdge>& edge) { return std::string(edge.param.name); });

// The edge cases above are only worth having if the arithmetic really misses the edge.
TEST(SffEdgeRates, ReallyComeOutOneUlpBelowTheEdge) {
  EXPECT_LT(*safe_failure_fraction(fit(12, 1, 8.5, 8.5)), 0.6);
  EXPECT_LT(*safe_failure_fraction(fit(4, 2, 17, 17)), 0.9);
  EXPECT_LT(*safe_failure_fraction(fit(25, 0, 1237.5, 1237.5)), 0.99);
}

// A safety manual's SFF is used instead of the rates, and the result says so (issue 3).
TEST(DeclaredSff, IsUsedInsteadOfTheRatesAndReported) {
  std::vector<Component> comps{element("FT-1", kB, 0.5, 3)};
  comps[0].sff_declared = 0.92;
  const ElementSff sff = element_sff(comps[0]);
  ASSERT_TRUE(sff.value);
  EXPECT_EQ(*sff.value, 0.92);
  EXPECT_TRUE(sff.declared);

  const auto r =
      subsystem_constraints(group("sensors", vote(1, 1), {{0}}), comps, ConstraintBasis::kRoute1H, DemandMode::kLow);
  EXPECT_EQ(r.sil_architecture, 2);  // Table 3: Type B, 90-99 %, HFT 0 [seen]
  EXPECT_EQ(r.sff, 0.92);
  EXPECT_TRUE(r.elements[0].sff_declared);
  EXPECT_EQ(r.findings.front(),
            "The SFF of FT-1 (92.00 %) is taken from its safety manual, not computed from its rates.");
}

}  // namespace
}  // namespace sifter
