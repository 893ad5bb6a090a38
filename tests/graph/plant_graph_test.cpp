// Specification of the signal-flow graph: how it resolves component ids, what it refuses, and
// what it finds shared.
#include "sifter/graph/plant_graph.hpp"

#include <gtest/gtest.h>

#include <stdexcept>
#include <string>
#include <vector>

namespace sifter {
namespace {

using Ids = std::vector<std::string>;

Component component(const std::string& id) {
  Component c;
  c.id = id;
  return c;
}

// One group of a SIF, its channels written as lists of component ids, the pointers as the
// loader sets them.
Subsystem group(const std::string& pointer, const std::vector<Ids>& channels) {
  Subsystem sub;
  sub.pointer = pointer;
  for (std::size_t c = 0; c < channels.size(); ++c) {
    Channel ch;
    ch.pointer = pointer + "/channels/" + std::to_string(c);
    ch.component_ids = channels[c];
    sub.channels.push_back(ch);
  }
  sub.vote.n = static_cast<int>(channels.size());
  return sub;
}

Project two_sifs() {
  Project p;
  for (const char* id : {"PT-1", "PT-2", "LS-1", "XV-1", "XV-2"}) p.components.push_back(component(id));
  Sif a;
  a.id = "SIF-A";
  a.subsystems = {group("/sifs/0/subsystems/0", {{"PT-1"}, {"PT-2"}}), group("/sifs/0/subsystems/1", {{"XV-1"}})};
  Sif b;
  b.id = "SIF-B";
  b.subsystems = {group("/sifs/1/subsystems/0", {{"LS-1"}}), group("/sifs/1/subsystems/1", {{"XV-2", "XV-1"}})};
  p.sifs = {a, b};
  return p;
}

TEST(PlantGraph, ResolvesEveryChannelsIdsIntoComponentIndices) {
  Project p = two_sifs();
  ASSERT_TRUE(validate_project_graph(p).empty());
  EXPECT_EQ(p.sifs[0].subsystems[0].channels[1].components, (std::vector<std::size_t>{1}));
  EXPECT_EQ(p.sifs[1].subsystems[1].channels[0].components, (std::vector<std::size_t>{4, 3}))
      << "a channel of two elements in series keeps their order";
  EXPECT_EQ(PlantGraph(p).signal_order(1), (std::vector<std::size_t>{0, 1}));
}

TEST(PlantGraph, FindsTheComponentsTwoSifsShare) {
  Project p = two_sifs();
  const PlantGraph g(p);
  const auto shared = g.shared_components();
  ASSERT_EQ(shared.size(), 1u);
  EXPECT_EQ(shared[0].component, "XV-1");
  EXPECT_EQ(shared[0].sifs, (Ids{"SIF-A", "SIF-B"}));
}

// A SIF counts once however often it uses a component (in two groups, or in series in one
// channel of another); the SIFs of a shared component come in project order, the components
// in the order of "components", and an id that is not defined shares nothing. Common practice:
// a component is shared when a failure of it reaches more than one SIF.
TEST(PlantGraph, ASharedComponentNamesEachSifOnceInProjectOrder) {
  Project p = two_sifs();
  Sif c;
  c.id = "SIF-C";
  c.subsystems = {group("/sifs/2/subsystems/0", {{"PT-2"}, {"XV-1", "PT-1"}}),
                  group("/sifs/2/subsystems/1", {{"XV-1"}, {"NO-SUCH"}, {"LS-1"}})};
  p.sifs.insert(p.sifs.begin(), c);  // first in the project, so listed first
  p.sifs[1].subsystems[1] = group("/sifs/1/subsystems/1", {{"XV-1", "XV-2"}, {"PT-2"}});
  const PlantGraph g(p);
  const auto shared = g.shared_components();
  std::vector<std::string> components;
  for (const auto& s : shared) components.push_back(s.component);
  EXPECT_EQ(components, (Ids{"PT-1", "PT-2", "LS-1", "XV-1", "XV-2"})) << "as in \"components\", not by id";
  ASSERT_EQ(shared.size(), 5u);
  EXPECT_EQ(shared[0].sifs, (Ids{"SIF-C", "SIF-A"}));
  EXPECT_EQ(shared[1].sifs, (Ids{"SIF-C", "SIF-A"})) << "SIF-A uses PT-2 in both its groups";
  EXPECT_EQ(shared[2].sifs, (Ids{"SIF-C", "SIF-B"}));
  EXPECT_EQ(shared[3].sifs, (Ids{"SIF-C", "SIF-A", "SIF-B"})) << "SIF-C uses XV-1 in both its groups";
  EXPECT_EQ(shared[4].sifs, (Ids{"SIF-A", "SIF-B"}));
  EXPECT_EQ(g.signal_order(0), (std::vector<std::size_t>{0, 1}));
  EXPECT_EQ(g.problems().size(), 1u) << "the id that is not defined";
}

// A repeat is reported where it is written again, in the order written, each against the
// first use; a channel of several elements names the element.
TEST(PlantGraph, ReportsEachRepeatedComponentWhereItIsWrittenAgain) {
  Project p = two_sifs();
  p.sifs[0].subsystems[0] = group("/sifs/0/subsystems/0", {{"PT-2"}, {"PT-1", "PT-2"}, {"PT-1"}, {"PT-2"}, {"LS-1"}});
  const PlantGraph g(p);
  std::vector<std::string> places, founds;
  for (const auto& problem : g.problems()) {
    places.push_back(problem.pointer);
    founds.push_back(problem.found);
  }
  EXPECT_EQ(places, (Ids{"/sifs/0/subsystems/0/channels/1/1", "/sifs/0/subsystems/0/channels/2",
                         "/sifs/0/subsystems/0/channels/3"}));
  EXPECT_EQ(founds, (Ids{"\"PT-2\" again (first at /sifs/0/subsystems/0/channels/0)",
                         "\"PT-1\" again (first at /sifs/0/subsystems/0/channels/1/0)",
                         "\"PT-2\" again (first at /sifs/0/subsystems/0/channels/0)"}));
  Project refused = p;
  EXPECT_EQ(validate_project_graph(refused).size(), 3u) << "and the ids are left unresolved";
  EXPECT_TRUE(refused.sifs[0].subsystems[0].channels[0].components.empty());
}

// The ids are resolved by position, as the graph met them: a graph of another project is a
// defect of the caller, refused rather than read past its end.
TEST(PlantGraph, AGraphOfAnotherProjectIsNotAdopted) {
  Project built_from = two_sifs();
  Project other = two_sifs();
  other.sifs[1].subsystems[1].channels[0].component_ids.push_back("PT-1");
  EXPECT_THROW(adopt_project_graph(other, plant_findings(built_from)), std::logic_error);
  Project fewer = two_sifs();
  fewer.sifs.pop_back();
  EXPECT_THROW(adopt_project_graph(fewer, plant_findings(built_from)), std::logic_error);
}

TEST(PlantGraph, AnUnknownIdIsAProblemWithTheNearestKnownOne) {
  Project p = two_sifs();
  p.sifs[1].subsystems[0].channels[0].component_ids = {"LS-2"};
  const PlantGraph g(p);
  ASSERT_EQ(g.problems().size(), 1u);
  EXPECT_EQ(g.problems()[0].pointer, "/sifs/1/subsystems/0/channels/0");
  EXPECT_EQ(g.problems()[0].hint, "did you mean \"LS-1\"?");
  const PlantFindings findings = plant_findings(p);
  EXPECT_EQ(findings.problems.size(), 1u);
  EXPECT_TRUE(findings.shared.empty()) << "XV-1 is shared, but nothing is reported of a graph with a problem";
}

}  // namespace
}  // namespace sifter
