// Specification of the subsystem and SIF rules: architecture on each basis and SC.
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
constexpr auto kLow = DemandMode::kLow;
constexpr auto kHigh = DemandMode::kHigh;

bool has_cap(const SubsystemConstraints& r, CapCause cause, const std::optional<std::string>& element) {
  return std::any_of(r.caps.begin(), r.caps.end(),
                     [&](const Cap& c) { return c.cause == cause && c.element == element; });
}

bool has_finding(const SubsystemConstraints& r, const std::string& text) {
  return std::find(r.findings.begin(), r.findings.end(), text) != r.findings.end();
}

// N identical channels of one Type B transmitter (SFF 92 %, SC 3) each.
std::vector<Component> transmitters(int n) {
  std::vector<Component> comps;
  for (int i = 0; i < n; ++i) comps.push_back(element("PT-" + std::to_string(i + 1), kB, 0.92, 3));
  return comps;
}

Subsystem voted(Vote v) {
  std::vector<std::vector<std::size_t>> channels;
  for (int i = 0; i < v.n; ++i) channels.push_back({static_cast<std::size_t>(i)});
  return group("sensors", v, channels);
}

// ---- IEC 61511 basis across architectures ----------------------------------------------

struct ArchitectureCase {
  Vote vote;
  DemandMode mode;
  int sil_architecture;
};
class Iec61511Basis : public ::testing::TestWithParam<ArchitectureCase> {};

// IEC 61511-1:2016 Table 6 [seen] applied to the HFT of each vote (N - K).
TEST_P(Iec61511Basis, GroupTakesTheHighestSilItsHftAllows) {
  const auto& c = GetParam();
  const auto r = subsystem_constraints(voted(c.vote), transmitters(c.vote.n), ConstraintBasis::kIec61511, c.mode);
  EXPECT_EQ(r.hft, hardware_fault_tolerance(c.vote));
  EXPECT_EQ(r.sil_architecture, c.sil_architecture) << c.vote.text();
  EXPECT_EQ(r.systematic_capability, 3);
}
INSTANTIATE_TEST_SUITE_P(Iec61511Part1, Iec61511Basis,
                         ::testing::Values(ArchitectureCase{vote(1, 1), kLow, 2},
                                           ArchitectureCase{vote(1, 1), kHigh, 1},
                                           ArchitectureCase{vote(2, 2), kLow, 2}, ArchitectureCase{vote(1, 2), kLow, 3},
                                           ArchitectureCase{vote(1, 2), kHigh, 3},
                                           ArchitectureCase{vote(1, 2, true), kHigh, 3},
                                           ArchitectureCase{vote(2, 3), kLow, 3}, ArchitectureCase{vote(1, 3), kLow, 4},
                                           ArchitectureCase{vote(2, 4), kHigh, 4}));

// ---- Route 1H: series and parallel ------------------------------------------------------

// A channel of a Type A element (SFF 95 %) and a Type B element (SFF 75 %) in series.
std::vector<Component> series_pair() {
  return {element("TE-1", kA, 0.95, 3), element("TT-1", kB, 0.75, 3), element("TE-2", kA, 0.95, 3),
          element("TT-2", kB, 0.75, 3)};
}

// Series elements in a channel: the lowest governs (IEC 61508-2:2010 7.4.4.2.3, from memory);
// cells from Tables 2 and 3 [seen]: Type A 90-99 % HFT 0 is SIL 3, Type B 60-90 % HFT 0 is 1.
TEST(Route1hSeries, ChannelTakesItsLowestElement) {
  const auto r =
      subsystem_constraints(group("temperature", vote(1, 1), {{0, 1}}), series_pair(), ConstraintBasis::kRoute1H, kLow);
  ASSERT_EQ(r.elements.size(), 2u);
  EXPECT_EQ(r.elements[0].sil_route_1h, 3);
  EXPECT_EQ(r.elements[1].sil_route_1h, 1);
  EXPECT_EQ(r.sil_architecture, 1);
  EXPECT_EQ(r.sff_element, "TT-1");
  const auto reversed =
      subsystem_constraints(group("temperature", vote(1, 1), {{1, 0}}), series_pair(), ConstraintBasis::kRoute1H, kLow);
  EXPECT_EQ(reversed.sil_architecture, 1);
}

// A group of HFT 1 looks each element up in the HFT 1 column (issue 3; IEC 61508-2:2010
// 7.4.4.2.4, from memory): Type A 90-99 % is SIL 4, Type B 60-90 % is SIL 2 [seen].
TEST(Route1hParallel, GroupLooksItsElementsUpAtItsHft) {
  const auto r = subsystem_constraints(group("temperature", vote(1, 2), {{0, 1}, {2, 3}}), series_pair(),
                                       ConstraintBasis::kRoute1H, kLow);
  EXPECT_EQ(r.hft, 1);
  EXPECT_EQ(r.elements.size(), 4u);
  EXPECT_EQ(r.elements[0].sil_route_1h, 4);
  EXPECT_EQ(r.elements[1].sil_route_1h, 2);
  EXPECT_EQ(r.sil_architecture, 2);
}

// Parallel channels of different elements (issue 11; IEC 61508-2:2010 7.4.4.2.4, from memory):
// the group takes the best channel's SIL at HFT 0 plus its HFT. Cells from memory, Tables 2 and
// 3 of IEC 61508-2:2010: Type A, SFF 55 % (< 60 %), HFT 0 is SIL 1; Type B, SFF 91 % (90-99 %),
// HFT 0 is SIL 2. The best channel gives SIL 2, plus HFT 1: SIL 3. Looking each element up at
// HFT 1 and taking the lowest (the old rule) gives Type A < 60 % at HFT 1 = SIL 2.
TEST(Route1hParallelOfDifferentElements, OneOoTwoOfTypeA55AndTypeB91ReachesSil3) {
  const std::vector<Component> comps{element("LS-1", kA, 0.55, 3), element("LT-2", kB, 0.91, 3)};
  const auto r = subsystem_constraints(group("level", vote(1, 2), {{0}, {1}}), comps, ConstraintBasis::kRoute1H, kLow);
  EXPECT_EQ(r.sil_architecture, 3);
  EXPECT_TRUE(has_cap(r, CapCause::kRoute1hElement, "LT-2"));
  EXPECT_TRUE(has_finding(r,
                          "In subsystem 'level', the channels are of different elements; at HFT 0 channel 1 "
                          "SIL 1 (LS-1), channel 2 SIL 2 (LT-2). The group takes the best channel, governed by "
                          "LT-2 (Type B, SFF 91.00 %, SIL 2 at HFT 0), plus its HFT 1: at most SIL 3 (Route 1H, "
                          "parallel combination, IEC 61508-2:2010 7.4.4.2.4)."));
  // The order the channels are listed in does not matter.
  const auto swapped =
      subsystem_constraints(group("level", vote(1, 2), {{1}, {0}}), comps, ConstraintBasis::kRoute1H, kLow);
  EXPECT_EQ(swapped.sil_architecture, 3);
}

// In series the lowest still governs (IEC 61508-2:2010 7.4.4.2.3, from memory): the mixed 1oo2
// above (SIL 3) followed by a 1oo1 Type A SFF 55 % (Table 2, HFT 0: SIL 1) gives the SIF SIL 1.
TEST(Route1hParallelOfDifferentElements, InSeriesTheLowestSubsystemGovernsTheSif) {
  Sif sif;
  sif.id = "S";
  sif.subsystems = {group("level", vote(1, 2), {{0}, {1}}), group("valve", vote(1, 1), {{2}})};
  sif.subsystems[1].role = Role::kFinal;
  const std::vector<Component> comps{element("LS-1", kA, 0.55, 3), element("LT-2", kB, 0.91, 3),
                                     element("XV-1", kA, 0.55, 3)};
  const auto c = sif_constraints(sif, comps, ConstraintBasis::kRoute1H, kLow);
  ASSERT_EQ(c.subsystems.size(), 2u);
  EXPECT_EQ(c.subsystems[0].sil_architecture, 3);
  EXPECT_EQ(c.subsystems[1].sil_architecture, 1);
  EXPECT_EQ(c.sil_architecture, 1);
}

// A 2oo3 counts on two working channels: the second best channel governs (our reading of
// 7.4.4.2.4 for K > 1, the conservative one). Type B 91 % (SIL 2), Type B 91 % (SIL 2), Type A
// 55 % (SIL 1) at HFT 0, from memory: the second best is SIL 2, plus HFT 1: SIL 3; with two Type A
// 55 % channels the second best is SIL 1, plus 1: SIL 2.
TEST(Route1hParallelOfDifferentElements, TwoOoThreeTakesTheSecondBestChannel) {
  const std::vector<Component> comps{element("A-1", kB, 0.91, 3), element("A-2", kB, 0.91, 3),
                                     element("A-3", kA, 0.55, 3), element("A-4", kA, 0.55, 3)};
  EXPECT_EQ(subsystem_constraints(group("g", vote(2, 3), {{0}, {1}, {2}}), comps, ConstraintBasis::kRoute1H, kLow)
                .sil_architecture,
            3);
  EXPECT_EQ(subsystem_constraints(group("g", vote(2, 3), {{0}, {2}, {3}}), comps, ConstraintBasis::kRoute1H, kLow)
                .sil_architecture,
            2);
}

// Table 3 [seen]: Type B, SFF < 60 %, HFT 0 is not allowed.
TEST(Route1hNotAllowed, TypeBBelowSixtyPercentAtHftZeroCannotClaimASil) {
  const auto r = subsystem_constraints(group("level", vote(1, 1), {{0}}), {element("LT-1", kB, 0.5, 3)},
                                       ConstraintBasis::kRoute1H, kLow);
  EXPECT_EQ(r.sil_architecture, 0);
  EXPECT_TRUE(has_finding(r,
                          "In subsystem 'level', LT-1 (Type B, SFF 50.00 %) is not allowed at HFT 0 "
                          "(Route 1H, IEC 61508-2:2010 Table 3)."));
}

// Route 1H cannot look an element up without its type (issue 3): cannot claim, element named.
TEST(Route1hMissingType, ElementWithoutTypeCannotClaimASil) {
  const auto r = subsystem_constraints(group("flow", vote(1, 2), {{0}, {1}}),
                                       {element("FT-1", kA, 0.7, 3), element("FT-2", std::nullopt, 0.7, 3)},
                                       ConstraintBasis::kRoute1H, kLow);
  EXPECT_EQ(r.sil_architecture, 0);
  EXPECT_TRUE(has_cap(r, CapCause::kElementTypeMissing, "FT-2"));
  EXPECT_FALSE(has_cap(r, CapCause::kElementTypeMissing, "FT-1"));
}

// ---- Route 2H ---------------------------------------------------------------------------

Component route_2h_element(std::string id, std::optional<ElementType> type, FailureRates rates,
                           std::optional<double> confidence) {
  Component c;
  c.id = std::move(id);
  c.element_type = type;
  c.rates = rates;
  c.data_confidence = confidence;
  c.systematic_capability = 3;
  return c;
}

SubsystemConstraints route_2h_1oo2(const Component& a) {
  Component b = a;
  b.id = a.id + "B";
  return subsystem_constraints(group("sensors", vote(1, 2), {{0}, {1}}), {a, b}, ConstraintBasis::kRoute2H, kLow);
}

// Route 2H, IEC 61508-2:2010 7.4.4.3 [seen]: the HFT of IEC 61511 Table 6, and DC >= 60 % for
// Type B elements. DC = lDD / lD at the edge: 60 FIT of 100 is 60 %; 59.99 FIT is below.
TEST(Route2h, TypeBElementNeedsSixtyPercentDiagnosticCoverage) {
  const auto at_edge = route_2h_1oo2(route_2h_element("PT-1", kB, fit(40, 60, 0, 0), 0.9));
  EXPECT_EQ(at_edge.sil_architecture, 3);
  const auto below = route_2h_1oo2(route_2h_element("PT-1", kB, fit(40.01, 59.99, 0, 0), 0.9));
  EXPECT_EQ(below.sil_architecture, 0);
  EXPECT_TRUE(has_cap(below, CapCause::kDiagnosticCoverage, "PT-1"));
  EXPECT_TRUE(has_finding(below,
                          "In subsystem 'sensors', PT-1 (Type B) has DC 59.99 %, below the 60 % Route 2H "
                          "requires of Type B elements (IEC 61508-2:2010 7.4.4.3), so the subsystem cannot "
                          "claim a SIL on Route 2H."));
}

// Route 2H sets no DC rule for Type A elements (IEC 61508-2:2010 7.4.4.3 [seen]); an element
// of unknown type is held to the Type B rule (our decision, conservative).
TEST(Route2h, TypeAElementHasNoDiagnosticCoverageRuleAndUnknownTypeIsHeldToIt) {
  EXPECT_EQ(route_2h_1oo2(route_2h_element("PT-1", kA, fit(100, 0, 0, 0), 0.9)).sil_architecture, 3);
  EXPECT_EQ(route_2h_1oo2(route_2h_element("PT-1", std::nullopt, fit(100, 0, 0, 0), 0.9)).sil_architecture, 0);
}

struct ConfidenceCase {
  std::optional<double> confidence;
  int sil_architecture;
};
class Route2hDataConfidence : public ::testing::TestWithParam<ConfidenceCase> {};

// Route 2H asks failure data at >= 70 % confidence (IEC 61508-2:2010 7.4.4.3, figure from
// memory); missing or lower: the subsystem cannot claim a SIL on Route 2H (our decision).
TEST_P(Route2hDataConfidence, FailureDataBelowSeventyPercentOrUndeclaredCannotClaim) {
  const auto r = route_2h_1oo2(route_2h_element("PT-1", kB, fit(10, 90, 0, 0), GetParam().confidence));
  EXPECT_EQ(r.sil_architecture, GetParam().sil_architecture);
  EXPECT_EQ(has_cap(r, CapCause::kDataConfidence, "PT-1"), GetParam().sil_architecture == 0);
}
INSTANTIATE_TEST_SUITE_P(Iec61508Part2, Route2hDataConfidence,
                         ::testing::Values(ConfidenceCase{std::nullopt, 0}, ConfidenceCase{0.69, 0},
                                           ConfidenceCase{0.7, 3}, ConfidenceCase{0.95, 3}));

// ---- Systematic capability --------------------------------------------------------------

int sc_of(const Subsystem& s, const std::vector<Component>& comps) {
  return subsystem_constraints(s, comps, ConstraintBasis::kIec61511, kLow).systematic_capability;
}

// In series the lowest SC governs; a group takes the lowest of its channels (IEC 61508-2:2010
// 7.4.3, from memory).
TEST(SystematicCapability, ChannelAndGroupTakeTheirLowestElement) {
  const std::vector<Component> comps{element("A", kA, 0.7, 3), element("B", kA, 0.7, 2), element("C", kA, 0.7, 3)};
  EXPECT_EQ(sc_of(group("g", vote(1, 1), {{0, 1}}), comps), 2);
  EXPECT_EQ(sc_of(group("g", vote(1, 1), {{1, 0}}), comps), 2);
  EXPECT_EQ(sc_of(group("g", vote(1, 2), {{1}, {0}}), comps), 2);
  EXPECT_EQ(sc_of(group("g", vote(1, 2), {{0}, {1}}), comps), 2);
  EXPECT_EQ(sc_of(group("g", vote(1, 2), {{0}, {2}}), comps), 3);
}

Subsystem diverse(Vote v, std::vector<std::vector<std::size_t>> channels, std::string note) {
  Subsystem s = group("g", v, std::move(channels));
  s.diverse = true;
  s.diversity_note = std::move(note);
  return s;
}

// Two elements of SC N with sufficient independence may be treated as SC N + 1, never above 4
// (IEC 61508-2:2010 7.4.3, N+1 rule seen quoted).
TEST(SystematicCapability, JustifiedDiverseRedundantGroupTakesOneMoreUpToFour) {
  const std::vector<Component> comps{element("A", kA, 0.7, 2), element("B", kA, 0.7, 2), element("C", kA, 0.7, 3),
                                     element("D", kA, 0.7, 4), element("E", kA, 0.7, 4)};
  const std::string note = "radar and differential-pressure transmitters of two makers";
  const auto r = subsystem_constraints(diverse(vote(1, 2), {{0}, {1}}, note), comps, ConstraintBasis::kIec61511, kLow);
  EXPECT_EQ(r.systematic_capability, 3);
  EXPECT_TRUE(r.diversity_credit);
  EXPECT_EQ(sc_of(diverse(vote(1, 2), {{0}, {2}}, note), comps), 3);  // lowest (2) + 1
  const auto sc4 =
      subsystem_constraints(diverse(vote(1, 2), {{3}, {4}}, note), comps, ConstraintBasis::kIec61511, kLow);
  EXPECT_EQ(sc4.systematic_capability, 4);
  for (const auto& cap : sc4.caps) EXPECT_LE(cap.sil, 4) << cap.reason;
  EXPECT_EQ(sc_of(diverse(vote(2, 3), {{0}, {1}, {2}}, note), comps), 3);
}

// Diversity protects only where one channel's systematic fault does not fail the group: no
// credit at HFT 0 (2oo2), and none without the justification the issue asks for.
TEST(SystematicCapability, DiversityWithoutRedundancyOrWithoutANoteEarnsNoCredit) {
  const std::vector<Component> comps{element("A", kA, 0.7, 2), element("B", kA, 0.7, 2)};
  const auto two_of_two =
      subsystem_constraints(diverse(vote(2, 2), {{0}, {1}}, "two makers"), comps, ConstraintBasis::kIec61511, kLow);
  EXPECT_EQ(two_of_two.systematic_capability, 2);
  EXPECT_FALSE(two_of_two.diversity_credit);
  EXPECT_EQ(sc_of(diverse(vote(1, 2), {{0}, {1}}, ""), comps), 2);
}

// A component without SC cannot be claimed (issue 3); the element is named.
TEST(SystematicCapability, ElementWithoutScCannotClaimASil) {
  const auto r = subsystem_constraints(group("final", vote(1, 2), {{0}, {1}}),
                                       {element("XV-1", kA, 0.7, 3), element("XV-2", kA, 0.7, std::nullopt)},
                                       ConstraintBasis::kIec61511, kLow);
  EXPECT_EQ(r.systematic_capability, 0);
  EXPECT_TRUE(has_cap(r, CapCause::kScMissing, "XV-2"));
}

// ---- Vendor subsystems and certificates -------------------------------------------------

// A vendor subsystem uses its declared HFT (Table 6 [seen]) and SC; without them it cannot claim.
TEST(VendorSubsystem, UsesDeclaredHftAndScAndCannotClaimWithoutThem) {
  const auto declared = subsystem_constraints(vendor("logic", 1, 3), {}, ConstraintBasis::kIec61511, kLow);
  EXPECT_EQ(declared.hft, 1);
  EXPECT_EQ(declared.sff, std::nullopt);
  EXPECT_EQ(declared.sil_architecture, 3);
  EXPECT_EQ(declared.systematic_capability, 3);

  const auto missing =
      subsystem_constraints(vendor("logic", std::nullopt, std::nullopt), {}, ConstraintBasis::kIec61511, kLow);
  EXPECT_EQ(missing.hft, std::nullopt);
  EXPECT_EQ(missing.sil_architecture, 0);
  EXPECT_EQ(missing.systematic_capability, 0);
  EXPECT_TRUE(has_finding(missing,
                          "Subsystem 'logic' is a vendor figure without a declared HFT, so it cannot "
                          "claim a SIL from its architecture."));
  EXPECT_TRUE(has_finding(missing,
                          "Subsystem 'logic' is a vendor figure without a declared systematic capability, "
                          "so it cannot claim a SIL from it."));
}

// On Route 1H a vendor figure has no elements: its certificate's SIL capability stands in.
TEST(VendorSubsystem, OnRoute1hTakesItsSilCapabilityOrCannotClaim) {
  Subsystem certified = vendor("logic", 0, 3);
  certified.sil_capability = 3;
  EXPECT_EQ(subsystem_constraints(certified, {}, ConstraintBasis::kRoute1H, kLow).sil_architecture, 3);
  const auto bare = subsystem_constraints(vendor("logic", 0, 3), {}, ConstraintBasis::kRoute1H, kLow);
  EXPECT_EQ(bare.sil_architecture, 0);
  EXPECT_TRUE(has_cap(bare, CapCause::kVendorRoute1h, std::nullopt));
}

// A declared SIL capability caps both the architecture and the SC (issue 3).
TEST(SilCapability, CapsArchitectureAndSystematicCapability) {
  Subsystem s = voted(vote(1, 3));
  s.sil_capability = 2;
  const auto r = subsystem_constraints(s, transmitters(3), ConstraintBasis::kIec61511, kLow);
  EXPECT_EQ(r.sil_architecture, 2);
  EXPECT_EQ(r.systematic_capability, 2);
}

// ---- The SIF ----------------------------------------------------------------------------

// Subsystems act in series: the SIF takes the lowest architecture and the lowest SC
// (IEC 61508-2:2010 7.4.4.2.3 and 7.4.3, from memory).
TEST(SifConstraints, TakesTheLowestOfItsSubsystems) {
  std::vector<Component> comps = transmitters(2);
  comps.push_back(element("XV-1", kA, 0.7, 3));
  Sif sif;
  sif.subsystems = {group("sensors", vote(1, 2), {{0}, {1}}), vendor("logic", 1, 2), group("final", vote(1, 1), {{2}})};
  const auto r = sif_constraints(sif, comps, ConstraintBasis::kIec61511);
  ASSERT_EQ(r.subsystems.size(), 3u);
  EXPECT_EQ(r.subsystems[0].sil_architecture, 3);
  EXPECT_EQ(r.subsystems[2].sil_architecture, 2);  // HFT 0, low demand, Table 6 [seen]
  EXPECT_EQ(r.sil_architecture, 2);
  EXPECT_EQ(r.sil_systematic, 2);  // the logic solver's SC 2
}

TEST(SifConstraints, SifWithoutSubsystemsCannotClaimASil) {
  const auto r = sif_constraints(Sif{}, {}, ConstraintBasis::kIec61511);
  EXPECT_EQ(r.sil_architecture, 0);
  EXPECT_EQ(r.sil_systematic, 0);
}

// The SIF's own basis wins over the project's; IEC 61511 is the default (issue 3).
TEST(ConstraintBasisChoice, SifOverridesProjectWhichOverridesTheDefault) {
  Sif sif;
  EXPECT_EQ(constraint_basis(sif, std::nullopt), ConstraintBasis::kIec61511);
  EXPECT_EQ(constraint_basis(sif, ConstraintBasis::kRoute2H), ConstraintBasis::kRoute2H);
  sif.constraints = ConstraintBasis::kRoute1H;
  EXPECT_EQ(constraint_basis(sif, ConstraintBasis::kRoute2H), ConstraintBasis::kRoute1H);
}

}  // namespace
}  // namespace sifter
