// Specification of the limits: every result below the required SIL, named, with its lift.
#include <gtest/gtest.h>

#include <algorithm>
#include <string>
#include <vector>

#include "sifter/engines/constraints.hpp"
#include "support/constraints_fixtures.hpp"

namespace sifter {
namespace {

using namespace testing_fixtures;

constexpr auto kA = ElementType::kA;
constexpr auto kB = ElementType::kB;

// A probability result that never limits: well inside SIL 4, low demand.
ProbabilityCheck comfortable() { return ProbabilityCheck{DemandMode::kLow, 4, 5e-5, 1e-3}; }

std::vector<Limit> limits_of(const Sif& sif, const std::vector<Component>& comps, ConstraintBasis basis, int required,
                             ProbabilityCheck p = comfortable()) {
  return limits_for(p, sif_constraints(sif, comps, basis), required);
}

Sif one_subsystem(Subsystem s, DemandMode mode = DemandMode::kLow) {
  Sif sif;
  sif.demand_mode_stated = mode;
  sif.subsystems.push_back(std::move(s));
  return sif;
}

// ---- The existing logic solver of SC 2 under a SIL 3 function ----------------------------

// Invented demo plant: two pressure transmitters 1oo2 (Type B, SFF 92 %, SC 3), an existing
// logic solver LS-1 (Type B, SFF 99.5 %, SC 2), two shutdown valves 1oo2 (Type A, SFF 65 %, SC 3).
struct ExistingLogicSolver : ::testing::Test {
  std::vector<Component> comps{element("PT-1A", kB, 0.92, 3), element("PT-1B", kB, 0.92, 3),
                               element("LS-1", kB, 0.995, 2), element("XV-1A", kA, 0.65, 3),
                               element("XV-1B", kA, 0.65, 3)};
  Sif sif;
  void SetUp() override {
    sif.subsystems = {group("sensors", vote(1, 2), {{0}, {1}}), group("logic", vote(1, 1), {{2}}),
                      group("final", vote(1, 2), {{3}, {4}})};
  }
};

// Route 1H, IEC 61508-2:2010 Tables 2 and 3 [seen]: every subsystem reaches SIL 3 on its
// architecture; the SC rule (7.4.3, from memory) leaves the function at SIL 2, and the only
// limit names LS-1 and both ways out.
TEST_F(ExistingLogicSolver, CapsASil3FunctionAtSil2AndNamesTheLogicSolver) {
  const auto c = sif_constraints(sif, comps, ConstraintBasis::kRoute1H);
  EXPECT_EQ(c.sil_architecture, 3);
  EXPECT_EQ(c.sil_systematic, 2);
  const auto limits = limits_for(ProbabilityCheck{DemandMode::kLow, 3, 4.2e-4, 1e-3}, c, 3);
  ASSERT_EQ(limits.size(), 1u);
  EXPECT_EQ(limits[0].kind, "systematic");
  EXPECT_EQ(limits[0].subsystem, "logic");
  EXPECT_EQ(limits[0].element, "LS-1");
  EXPECT_EQ(limits[0].sil, 2);
  EXPECT_EQ(limits[0].message,
            "In subsystem 'logic', LS-1 has SC 2, which allows at most SIL 2 (IEC 61508-2:2010 7.4.3). "
            "SIL 3 is required. To lift it: use an element of SC 3 or higher in place of LS-1, or add a diverse "
            "redundant one whose independence is justified (SC N+1, IEC 61508-2:2010 7.4.3).");
}

// The same logic solver entered as a vendor figure (HFT 1 and SC 2 from its certificate).
TEST_F(ExistingLogicSolver, AsAVendorFigureItIsNamedByItsSubsystem) {
  sif.subsystems[1] = vendor("logic", 1, 2);
  const auto limits = limits_of(sif, comps, ConstraintBasis::kIec61511, 3);
  ASSERT_EQ(limits.size(), 1u);
  EXPECT_EQ(limits[0].element, std::nullopt);
  EXPECT_EQ(limits[0].message,
            "Subsystem 'logic' declares SC 2, which allows at most SIL 2 (IEC 61508-2:2010 7.4.3). SIL 3 is "
            "required. To lift it: use equipment of SC 3 or higher, or add a diverse redundant one whose "
            "independence is justified (SC N+1, IEC 61508-2:2010 7.4.3).");
}

// SC 2 + 1 for diverse redundancy reaches SIL 3 (IEC 61508-2:2010 7.4.3): the limit goes away.
TEST_F(ExistingLogicSolver, ADiverseRedundantSecondLogicSolverLiftsIt) {
  comps.push_back(element("LS-2", kB, 0.995, 2));
  Subsystem logic = group("logic", vote(1, 2), {{2}, {5}});
  logic.diverse = true;
  logic.diversity_note = "second logic solver of another maker, own programming team";
  sif.subsystems[1] = logic;
  EXPECT_TRUE(limits_of(sif, comps, ConstraintBasis::kRoute1H, 3).empty());
}

// ---- Hardware fault tolerance ------------------------------------------------------------

struct RevoteCase {
  Vote vote;
  DemandMode mode;
  int required;
  const char* message;
};
class Revote : public ::testing::TestWithParam<RevoteCase> {};

// IEC 61511-1:2016 Table 6 [seen]; the lift is the smallest vote with the same K, or 1ooN.
TEST_P(Revote, HftLimitNamesTheSmallestVoteThatLiftsIt) {
  const auto& c = GetParam();
  std::vector<Component> comps;
  std::vector<std::vector<std::size_t>> channels;
  for (int i = 0; i < c.vote.n; ++i) {
    comps.push_back(element("PT-" + std::to_string(i + 1), kB, 0.92, 4));
    channels.push_back({static_cast<std::size_t>(i)});
  }
  const auto limits = limits_of(one_subsystem(group("sensors", c.vote, channels), c.mode), comps,
                                ConstraintBasis::kIec61511, c.required);
  ASSERT_EQ(limits.size(), 1u);
  EXPECT_EQ(limits[0].kind, "architecture");
  EXPECT_EQ(limits[0].element, std::nullopt);
  EXPECT_EQ(limits[0].message, c.message);
}
INSTANTIATE_TEST_SUITE_P(
    Iec61511Part1, Revote,
    ::testing::Values(
        RevoteCase{vote(1, 1), DemandMode::kLow, 3,
                   "Subsystem 'sensors' has HFT 0 (1oo1), which allows at most SIL 2 in low demand mode (IEC "
                   "61511-1:2016 Table 6). SIL 3 is required. To lift it: re-vote as 1oo2 (HFT 1)."},
        RevoteCase{vote(2, 2), DemandMode::kLow, 3,
                   "Subsystem 'sensors' has HFT 0 (2oo2), which allows at most SIL 2 in low demand mode (IEC "
                   "61511-1:2016 Table 6). SIL 3 is required. To lift it: re-vote as 1oo2 or 2oo3 (HFT 1)."},
        RevoteCase{vote(1, 1), DemandMode::kHigh, 2,
                   "Subsystem 'sensors' has HFT 0 (1oo1), which allows at most SIL 1 in high demand or continuous "
                   "mode (IEC 61511-1:2016 Table 6). SIL 2 is required. To lift it: re-vote as 1oo2 (HFT 1)."},
        RevoteCase{vote(2, 3), DemandMode::kLow, 4,
                   "Subsystem 'sensors' has HFT 1 (2oo3), which allows at most SIL 3 in low demand mode (IEC "
                   "61511-1:2016 Table 6). SIL 4 is required. To lift it: re-vote as 1oo3 or 2oo4 (HFT 2)."}));

// ---- Route 1H ----------------------------------------------------------------------------

// IEC 61508-2:2010 Table 3 [seen]: Type B at 72.5 % and HFT 0 is SIL 1; SIL 2 needs HFT 1
// or an SFF of 90 %.
TEST(Route1hLimit, NamesTheElementTheVoteAndTheSffThatLiftIt) {
  const auto limits = limits_of(one_subsystem(group("flow", vote(1, 1), {{0}})), {element("FT-1", kB, 0.725, 4)},
                                ConstraintBasis::kRoute1H, 2);
  ASSERT_EQ(limits.size(), 1u);
  EXPECT_EQ(limits[0].element, "FT-1");
  EXPECT_EQ(limits[0].sil, 1);
  EXPECT_EQ(limits[0].message,
            "In subsystem 'flow', FT-1 (Type B, SFF 72.50 %) at HFT 0 allows at most SIL 1 (Route 1H, IEC "
            "61508-2:2010 Table 3). SIL 2 is required. To lift it: re-vote as 1oo2 (HFT 1), or use an element "
            "with SFF of at least 90 % in place of FT-1.");
}

// Table 3 [seen]: no Type B element reaches SIL 4 at HFT 0, whatever its SFF.
TEST(Route1hLimit, SaysWhenNoSffIsEnough) {
  const auto limits = limits_of(one_subsystem(group("flow", vote(1, 1), {{0}})), {element("FT-1", kB, 0.995, 4)},
                                ConstraintBasis::kRoute1H, 4);
  ASSERT_EQ(limits.size(), 1u);
  EXPECT_EQ(limits[0].message,
            "In subsystem 'flow', FT-1 (Type B, SFF 99.50 %) at HFT 0 allows at most SIL 3 (Route 1H, IEC "
            "61508-2:2010 Table 3). SIL 4 is required. To lift it: re-vote as 1oo2 (HFT 1); at HFT 0 no Type B "
            "element reaches SIL 4.");
}

// ---- Systematic capability: missing data ---------------------------------------------------

TEST(ScLimit, MissingScNamesTheElementAndTheScNeeded) {
  const auto limits =
      limits_of(one_subsystem(group("final", vote(1, 2), {{0}, {1}})),
                {element("XV-1", kA, 0.7, 3), element("XV-2", kA, 0.7, std::nullopt)}, ConstraintBasis::kIec61511, 2);
  ASSERT_EQ(limits.size(), 1u);
  EXPECT_EQ(limits[0].kind, "systematic");
  EXPECT_EQ(limits[0].element, "XV-2");
  EXPECT_EQ(limits[0].sil, 0);
  EXPECT_EQ(limits[0].message,
            "In subsystem 'final', XV-2 has neither a declared systematic capability nor a prior-use claim, so the "
            "subsystem cannot claim a SIL from it. SIL 2 is required. To lift it: declare the SC of XV-2 from its "
            "certificate or safety manual (SC 2 or higher is needed), or its prior use with the evidence, "
            "\"prior_use\": {\"sil\": 2, \"evidence\": \"...\"} (IEC 61511-1:2016 11.5.3).");
}

// ---- Probability -------------------------------------------------------------------------

// SIL bands, IEC 61508-1:2010 Tables 2/3 [seen]: half open, so the SIL 3 edge 1e-3 is exclusive.
TEST(ProbabilityLimit, BelowTheBandSaysWhatPfdAvgTheFunctionMustReach) {
  const auto limits = limits_for(ProbabilityCheck{DemandMode::kLow, 2, 2.3e-3, 1e-3}, SifConstraints{}, 3);
  ASSERT_FALSE(limits.empty());
  EXPECT_EQ(limits[0].kind, "probability");
  EXPECT_EQ(limits[0].sil, 2);
  EXPECT_EQ(limits[0].message,
            "The PFDavg of 2.30e-03 allows only SIL 2; SIL 3 is required. To lift it: bring the PFDavg below "
            "1.00e-03.");
}

// A required PFD from the risk analysis is met when the PFDavg is no more than it
// (DEVELOPERS.md, Methods M4), not merely when it falls in the same band.
TEST(ProbabilityLimit, InTheBandButAboveTheRequiredValueIsStillALimit) {
  const auto limits = limits_for(ProbabilityCheck{DemandMode::kLow, 3, 5e-4, 3.3e-4}, SifConstraints{}, 3);
  ASSERT_FALSE(limits.empty());
  EXPECT_EQ(limits[0].message,
            "The PFDavg of 5.00e-04 lies in the SIL 3 band but above the required 3.30e-04. To lift it: bring the "
            "PFDavg to 3.30e-04 or less.");
  EXPECT_TRUE(limits_for(ProbabilityCheck{DemandMode::kLow, 3, 3.3e-4, 3.3e-4}, SifConstraints{}, 3).empty());
}

// High demand: PFH bands, IEC 61508-1:2010 Table 3 [seen]; SIL 3 is below 1e-7 per hour.
TEST(ProbabilityLimit, HighDemandSpeaksOfPfh) {
  const auto limits = limits_for(ProbabilityCheck{DemandMode::kHigh, 2, 3e-7, 1e-7}, SifConstraints{}, 3);
  ASSERT_FALSE(limits.empty());
  EXPECT_EQ(limits[0].message,
            "The PFH of 3.00e-07/h allows only SIL 2; SIL 3 is required. To lift it: bring the PFH below "
            "1.00e-07/h.");
}

// ---- Completeness ------------------------------------------------------------------------

TEST(Limits, NoneWhenEveryResultReachesTheRequiredSilOrNoneIsRequired) {
  const std::vector<Component> comps{element("PT-1", kB, 0.92, 3), element("PT-2", kB, 0.92, 3)};
  const Sif sif = one_subsystem(group("sensors", vote(1, 2), {{0}, {1}}));
  EXPECT_TRUE(limits_of(sif, comps, ConstraintBasis::kIec61511, 3).empty());
  EXPECT_TRUE(limits_of(sif, comps, ConstraintBasis::kIec61511, 0, ProbabilityCheck{}).empty());
}

// Issue 3: every result below the required SIL is an entry, on every basis, and a SIL
// capability caps both kinds.
class EveryShortfallIsListed : public ::testing::TestWithParam<ConstraintBasis> {};
TEST_P(EveryShortfallIsListed, OnEachBasis) {
  std::vector<Component> comps{element("PT-1", kB, 0.5, 2), element("LS-1", kB, 0.995, 3),
                               element("XV-1", std::nullopt, 0.7, std::nullopt)};
  Sif sif;
  Subsystem logic = group("logic", vote(1, 1), {{1}});
  logic.sil_capability = 1;
  sif.subsystems = {group("sensors", vote(1, 1), {{0}}), logic, group("final", vote(1, 1), {{2}})};
  const auto c = sif_constraints(sif, comps, GetParam());
  const int required = 3;
  ASSERT_LT(c.sil_architecture, required);
  ASSERT_LT(c.sil_systematic, required);
  const auto limits = limits_for(comfortable(), c, required);
  for (const auto& s : c.subsystems) {
    for (const char* kind : {"architecture", "systematic"}) {
      const int sil = std::string(kind) == "architecture" ? s.sil_architecture : s.systematic_capability;
      const bool listed = std::any_of(limits.begin(), limits.end(), [&](const Limit& l) {
        return l.kind == kind && l.subsystem == s.subsystem && l.sil == sil;
      });
      EXPECT_EQ(listed, sil < required) << s.subsystem << " " << kind;
    }
  }
  for (const auto& l : limits) {
    EXPECT_LT(l.sil, required);
    EXPECT_NE(l.message.find("To lift it: "), std::string::npos) << l.message;
  }
}
INSTANTIATE_TEST_SUITE_P(Bases, EveryShortfallIsListed,
                         ::testing::Values(ConstraintBasis::kIec61511, ConstraintBasis::kRoute1H,
                                           ConstraintBasis::kRoute2H));

}  // namespace
}  // namespace sifter
