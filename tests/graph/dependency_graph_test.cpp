// Specification of the dependency graph: who relies on which device, and what is shared.
#include "sifter/graph/dependency_graph.hpp"

#include <gtest/gtest.h>

#include <algorithm>
#include <map>
#include <random>
#include <string>

#include "support/lopa_fixtures.hpp"

namespace sifter {
namespace {

using testing::add_sif;
using testing::cause;
using testing::layer;
using testing::sif_layer;

using Tags = std::vector<std::string>;

TEST(DependencyGraph, SifReliesOnItsComponentsAsDevices) {
  Project p;
  add_sif(p, "SIF-1", {"XV-1", "PT-1"});
  DependencyGraph g;
  const auto v = g.add_sif(p, p.sifs[0]);
  EXPECT_EQ(g.kind(v), DependencyKind::kSif);
  EXPECT_EQ(g.devices_of(v), (Tags{"PT-1", "XV-1"}));
  EXPECT_EQ(g.add_sif(p, p.sifs[0]), v) << "a SIF is one vertex however often it is added";
}

// Component ids and device tags are one namespace: a layer listing "PT-1" relies on the same
// device as the SIF whose component is PT-1; a SIF layer relies on the SIF's devices.
TEST(DependencyGraph, LayersAndCausesMeetTheSifOnCommonDevices) {
  Project p;
  add_sif(p, "SIF-1", {"PT-1", "XV-1"});
  Scenario s;
  s.id = "S1";
  s.causes = {cause("C1", 0.1, {"LV-1", "DCS-1"})};
  s.layers = {layer("IPL-1", LayerKind::kOperatorResponse, 0.1, {"DCS-1", "PT-1"}), sif_layer("SIF-1")};
  DependencyGraph g;
  const auto v = g.add_scenario(p, s);
  ASSERT_EQ(v.causes.size(), 1u);
  ASSERT_EQ(v.layers.size(), 2u);
  EXPECT_EQ(g.name(v.causes[0]), "S1/C1");
  EXPECT_EQ(g.common_devices(v.layers[0], v.causes[0]), (Tags{"DCS-1"}));
  EXPECT_EQ(g.common_devices(v.layers[0], v.layers[1]), (Tags{"PT-1"}));
  EXPECT_TRUE(g.common_devices(v.layers[1], v.causes[0]).empty());
}

// A walk that meets more vertices than it keeps inline (32) still meets each once: the set
// grows beyond them and the answers stay those of a plain walk.
TEST(DependencyGraph, AWalkOverManyDevicesFindsEachOnceAndTheCommonOnesByTag) {
  Project p;
  Tags many, listed;
  for (int i = 0; i < 80; ++i) many.push_back("TX-" + std::to_string(100 + i));
  add_sif(p, "SIF-BIG", many);
  for (int i = 0; i < 80; i += 7) listed.push_back(many[static_cast<std::size_t>(i)]);
  listed.push_back("DCS-9");
  listed.push_back(many[0]);  // listed twice: still one device
  Scenario s;
  s.id = "S";
  s.causes = {cause("C1", 0.1, listed)};
  s.layers = {sif_layer("SIF-BIG")};
  DependencyGraph g;
  const auto v = g.add_scenario(p, s);
  Tags sorted_many = many;
  std::sort(sorted_many.begin(), sorted_many.end());
  EXPECT_EQ(g.devices_of(v.layers[0]), sorted_many);
  Tags expected(listed.begin(), listed.end() - 2);
  std::sort(expected.begin(), expected.end());
  EXPECT_EQ(g.common_devices(v.layers[0], v.causes[0]), expected);
  EXPECT_EQ(g.common_devices(v.causes[0], v.layers[0]), expected) << "the same either way round";
}

// Issue 4 item 6: devices on which several SIFs or scenarios rely, naming them. A scenario that
// only credits a SIF does not count as a second user of the SIF's devices.
TEST(DependencyGraph, SharedDevicesNameEverySifAndScenarioRelyingOnThem) {
  Project p;
  add_sif(p, "SIF-1", {"PT-1", "XV-1"});
  add_sif(p, "SIF-2", {"PT-2"});
  p.sifs[1].subsystems[0].channels[0].components.push_back(1);  // SIF-2 shares XV-1
  Scenario s1;
  s1.id = "S1";
  s1.causes = {cause("C1", 0.1, {"DCS-4"})};
  s1.layers = {sif_layer("SIF-1")};
  Scenario s2;
  s2.id = "S2";
  s2.causes = {cause("C1", 0.1, {"P-1"})};
  s2.layers = {layer("BPCS-1", LayerKind::kBpcsFunction, 0.1, {"DCS-4", "PT-2"})};
  p.scenarios = {s1, s2};
  const auto shared = shared_devices(p);
  ASSERT_EQ(shared.size(), 3u);
  EXPECT_EQ(shared[0].tag, "DCS-4");
  EXPECT_EQ(shared[0].users, (Tags{"S1", "S2"}));
  EXPECT_EQ(shared[1].tag, "PT-2");
  EXPECT_EQ(shared[1].users, (Tags{"SIF-2", "S2"}));
  EXPECT_EQ(shared[2].tag, "XV-1");
  EXPECT_EQ(shared[2].users, (Tags{"SIF-1", "SIF-2"}));
}

TEST(DependencyGraph, AScenarioCreditingASifHoldsEveryParty) {
  Project p;
  add_sif(p, "SIF-1", {"PT-1"});
  Scenario s;
  s.id = "S1";
  s.causes = {cause("C1", 0.1, {"PT-1"})};
  s.layers = {sif_layer("SIF-1")};
  p.scenarios = {s};
  DependencyGraph g;
  const auto v = g.add_scenario(p, s);
  // device PT-1, component PT-1, SIF-1, scenario S1, cause, layer
  EXPECT_EQ(g.vertex_count(), 6u);
  EXPECT_EQ(g.common_devices(v.causes[0], v.layers[0]), (Tags{"PT-1"}));
  EXPECT_EQ(shared_devices(p).size(), 1u) << "PT-1: SIF-1 through its component, S1 through its cause";
}

// A SIF id given twice is one party, as one vertex of the graph: the first SIF of that id.
TEST(DependencyGraph, ASifIdGivenTwiceIsOnePartyAsInTheGraph) {
  Project p;
  add_sif(p, "SIF-1", {"PT-1"});
  add_sif(p, "SIF-1", {"XV-1"});
  add_sif(p, "SIF-2", {"XV-1"});
  p.sifs[1].subsystems[0].channels[0].components.push_back(0);  // the second SIF-1 uses PT-1 too
  Scenario s;
  s.id = "S1";
  s.causes = {cause("C1", 0.1, {"PT-1"})};
  p.scenarios = {s};
  const auto shared = shared_devices(p);
  ASSERT_EQ(shared.size(), 1u);
  EXPECT_EQ(shared[0].tag, "PT-1");
  EXPECT_EQ(shared[0].users, (Tags{"SIF-1", "S1"}));
}

// shared_devices counts the reliance without a graph of the whole project. Held here against
// the graph's own walks on generated projects: each SIF's devices as devices_of its vertex, each
// scenario's as devices_of its vertex with its SIF layers' credit removed (a scenario does not
// count the devices of a SIF it credits). Tags are drawn from a small pool so that components,
// causes and layers share them often, and a party lists some tags twice; one project in four
// has a component id given twice (the loader refuses it, a project built in code may not).
TEST(DependencyGraph, SharedDevicesAreThoseTheGraphsWalksReachFromTwoParties) {
  std::mt19937 rng(20261203);
  auto pick = [&rng](int n) { return static_cast<std::size_t>(std::uniform_int_distribution<int>(0, n - 1)(rng)); };
  for (int round = 0; round < 40; ++round) {
    Project p;
    const int pool = 6 + static_cast<int>(pick(20));
    auto tag = [&](std::size_t i) { return "T-" + std::to_string(i); };
    for (int c = 0; c < pool; ++c) {
      Component k;
      k.id = tag(static_cast<std::size_t>(c));
      p.components.push_back(k);
    }
    if (round % 4 == 0) {  // the loader refuses an id given twice; the count must still be right
      Component again;
      again.id = tag(pick(pool));
      p.components.push_back(again);
    }
    const int components = static_cast<int>(p.components.size());
    for (int i = 0, n = 1 + static_cast<int>(pick(8)); i < n; ++i) {
      Sif sif;
      sif.id = "SIF-" + std::to_string(i);
      for (int g = 0, groups = 1 + static_cast<int>(pick(3)); g < groups; ++g) {
        Subsystem sub;
        for (int ch = 0, channels = 1 + static_cast<int>(pick(3)); ch < channels; ++ch) {
          Channel channel;
          for (int e = 0, elements = 1 + static_cast<int>(pick(2)); e < elements; ++e)
            channel.components.push_back(pick(components));
          sub.channels.push_back(channel);
        }
        sif.subsystems.push_back(sub);
      }
      p.sifs.push_back(sif);
    }
    auto tags = [&](int most) {  // tags of components and tags only scenarios list
      Tags out;
      for (int i = 0, n = static_cast<int>(pick(most + 1)); i < n; ++i) out.push_back(tag(pick(pool + 5)));
      return out;
    };
    for (int i = 0, n = static_cast<int>(pick(7)); i < n; ++i) {
      Scenario s;
      s.id = "S-" + std::to_string(i);
      s.causes = {cause("C1", 0.1, tags(3))};
      s.layers = {layer("IPL-1", LayerKind::kBpcsFunction, 0.1, tags(3))};
      if (pick(2) == 0) s.layers.push_back(sif_layer(p.sifs[pick(static_cast<int>(p.sifs.size()))].id));
      p.scenarios.push_back(s);
    }
    std::map<std::string, Tags> expected;  // tag -> users, in party order
    DependencyGraph g;
    for (const auto& sif : p.sifs)
      for (const auto& t : g.devices_of(g.add_sif(p, sif))) expected[t].push_back(sif.id);
    for (auto s : p.scenarios) {
      for (auto& l : s.layers) l.sif.clear();
      for (const auto& t : g.devices_of(g.add_scenario(p, s).scenario)) expected[t].push_back(s.id);
    }
    std::vector<SharedDevice> want;
    for (const auto& [t, users] : expected)
      if (users.size() >= 2) want.push_back({t, users});
    const auto got = shared_devices(p);
    ASSERT_EQ(got.size(), want.size()) << "round " << round;
    for (std::size_t i = 0; i < got.size(); ++i) {
      EXPECT_EQ(got[i].tag, want[i].tag) << "round " << round;
      EXPECT_EQ(got[i].users, want[i].users) << "round " << round << ", device " << want[i].tag;
    }
  }
}

}  // namespace
}  // namespace sifter
