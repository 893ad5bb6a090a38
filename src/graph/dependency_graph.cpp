// The project's dependency graph: who relies on which device.
#include "sifter/graph/dependency_graph.hpp"

#include <algorithm>
#include <array>
#include <iterator>
#include <string_view>
#include <unordered_map>
#include <unordered_set>
#include <utility>

namespace sifter {

DependencyGraph::Vertex DependencyGraph::add_vertex(DependencyKind kind, const std::string& name) {
  return boost::add_vertex(Node{kind, name}, graph_);
}

DependencyGraph::Vertex DependencyGraph::add_device(const std::string& tag) {
  auto [it, inserted] = devices_.try_emplace(tag, 0);
  if (inserted) it->second = add_vertex(DependencyKind::kDevice, tag);
  return it->second;
}

DependencyGraph::Vertex DependencyGraph::add_component(const std::string& id) {
  auto found = components_.find(id);
  if (found != components_.end()) return found->second;
  const Vertex v = add_vertex(DependencyKind::kComponent, id);
  components_.emplace(id, v);
  boost::add_edge(v, add_device(id), graph_);
  return v;
}

DependencyGraph::Vertex DependencyGraph::add_sif(const Project& project, const Sif& sif) {
  auto found = sifs_.find(sif.id);
  if (found != sifs_.end()) return found->second;
  const Vertex v = add_vertex(DependencyKind::kSif, sif.id);
  sifs_.emplace(sif.id, v);
  for (const auto& sub : sif.subsystems)
    for (const auto& channel : sub.channels)
      for (std::size_t index : channel.components)
        if (index < project.components.size()) boost::add_edge(v, add_component(project.components[index].id), graph_);
  return v;
}

ScenarioVertices DependencyGraph::add_scenario(const Project& project, const Scenario& scenario) {
  ScenarioVertices out;
  out.scenario = add_vertex(DependencyKind::kScenario, scenario.id);
  for (const auto& cause : scenario.causes) {
    const Vertex c = add_vertex(DependencyKind::kCause, scenario.id + "/" + cause.id);
    boost::add_edge(out.scenario, c, graph_);
    for (const auto& tag : cause.devices) boost::add_edge(c, add_device(tag), graph_);
    out.causes.push_back(c);
  }
  for (const auto& layer : scenario.layers) {
    const std::string label = layer.id.empty() ? layer.sif : layer.id;
    const Vertex l = add_vertex(DependencyKind::kLayer, scenario.id + "/" + label);
    boost::add_edge(out.scenario, l, graph_);
    for (const auto& tag : layer.devices) boost::add_edge(l, add_device(tag), graph_);
    if (!layer.sif.empty()) {
      auto known = sifs_.find(layer.sif);
      if (known != sifs_.end()) {
        boost::add_edge(l, known->second, graph_);
      } else {
        auto sif =
            std::find_if(project.sifs.begin(), project.sifs.end(), [&](const Sif& s) { return s.id == layer.sif; });
        if (sif != project.sifs.end()) boost::add_edge(l, add_sif(project, *sif), graph_);
      }
    }
    out.layers.push_back(l);
  }
  return out;
}

namespace {

// The vertices one walk has met: kept inline while they are few (a SIF, a cause or a layer
// reaches a handful), in a hash set beyond, so that a walk over a large part of the graph
// still costs what it reaches.
class Visited {
 public:
  using Vertex = DependencyGraph::Vertex;

  // True when v is met for the first time.
  bool insert(Vertex v) {
    if (!many_.empty()) return many_.insert(v).second;
    if (std::find(few_.begin(), few_.begin() + static_cast<std::ptrdiff_t>(count_), v) !=
        few_.begin() + static_cast<std::ptrdiff_t>(count_))
      return false;
    if (count_ < few_.size()) {
      few_[count_++] = v;
      return true;
    }
    many_.insert(few_.begin(), few_.end());
    return many_.insert(v).second;
  }

 private:
  std::array<Vertex, 32> few_{};
  std::size_t count_ = 0;
  std::unordered_set<Vertex> many_;
};

}  // namespace

DependencyGraph::Reached DependencyGraph::reach_devices(Vertex v, bool through_sifs) const {
  // A depth-first walk over out-edges. The visited set is local to the walk, so a query costs
  // what it reaches, not the size of the whole project's graph.
  Reached devices;
  Visited seen;
  seen.insert(v);
  Reached stack{v};
  while (!stack.empty()) {
    const Vertex u = stack.back();
    stack.pop_back();
    if (graph_[u].kind == DependencyKind::kDevice) devices.push_back(u);
    if (!through_sifs && u != v && graph_[u].kind == DependencyKind::kSif) continue;
    for (auto [e, end] = boost::out_edges(u, graph_); e != end; ++e) {
      const Vertex w = boost::target(*e, graph_);
      if (seen.insert(w)) stack.push_back(w);
    }
  }
  return devices;
}

std::vector<std::string> DependencyGraph::devices_of(Vertex v) const {
  std::vector<std::string> tags;
  for (Vertex d : reach_devices(v, true)) tags.push_back(graph_[d].name);
  std::sort(tags.begin(), tags.end());
  return tags;
}

std::vector<std::string> DependencyGraph::common_devices(Vertex a, Vertex b) const {
  // One vertex per tag (add_device): the vertices are compared, and only the tags in common
  // (most often none) are copied.
  auto da = reach_devices(a, true);
  auto db = reach_devices(b, true);
  std::sort(da.begin(), da.end());
  std::sort(db.begin(), db.end());
  Reached both;
  std::set_intersection(da.begin(), da.end(), db.begin(), db.end(), std::back_inserter(both));
  std::vector<std::string> common;
  common.reserve(both.size());
  for (Vertex d : both) common.push_back(graph_[d].name);
  std::sort(common.begin(), common.end());
  return common;
}

namespace {

// The devices of a project by number, one per tag: a component's device is the one of its id,
// and a tag no component has is numbered on first use.
class DeviceNumbers {
 public:
  explicit DeviceNumbers(const Project& project) {
    index_.reserve(project.components.size() * 2);
    of_component_.reserve(project.components.size());
    for (const auto& c : project.components) of_component_.push_back(number(c.id));
  }
  std::size_t number(std::string_view tag) {
    auto [it, inserted] = index_.try_emplace(tag, tags_.size());
    if (inserted) tags_.push_back(tag);
    return it->second;
  }
  // The device of Project::components[c]; components with the same id share one.
  [[nodiscard]] std::size_t of_component(std::size_t c) const { return of_component_[c]; }
  [[nodiscard]] std::string_view tag(std::size_t d) const { return tags_[d]; }
  [[nodiscard]] std::size_t size() const { return tags_.size(); }

 private:
  std::unordered_map<std::string_view, std::size_t> index_;
  std::vector<std::string_view> tags_;
  std::vector<std::size_t> of_component_;
};

}  // namespace

// Each party's devices are one step away (a SIF's through its components, a scenario's as its
// causes and layers list them; a scenario does not count the devices of a SIF it credits), so
// no walk is needed: every (device, party) pair is listed once, in party order, and counted.
// The same reliance as the graph's edges above, without building a graph of the whole project.
std::vector<SharedDevice> shared_devices(const Project& project) {
  DeviceNumbers devices(project);
  std::vector<std::pair<std::size_t, std::size_t>> uses;  // (device, party), parties in order
  std::vector<std::size_t> last_party;                    // per device: 1 + the last party listed
  std::size_t party = 0;
  auto use = [&](std::size_t d) {
    if (d >= last_party.size()) last_party.resize(devices.size(), 0);
    if (last_party[d] == party + 1) return;  // listed twice by one party: one use
    last_party[d] = party + 1;
    uses.emplace_back(d, party);
  };
  const std::size_t n_components = project.components.size();
  std::unordered_set<std::string_view> sif_ids;  // a SIF id given twice is one party, as in the graph
  for (const auto& sif : project.sifs) {
    if (sif_ids.insert(sif.id).second)
      for (const auto& sub : sif.subsystems)
        for (const auto& channel : sub.channels)
          for (std::size_t index : channel.components)
            if (index < n_components) use(devices.of_component(index));
    ++party;
  }
  for (const auto& scenario : project.scenarios) {
    for (const auto& cause : scenario.causes)
      for (const auto& tag : cause.devices) use(devices.number(tag));
    for (const auto& layer : scenario.layers)
      for (const auto& tag : layer.devices) use(devices.number(tag));
    ++party;
  }
  std::vector<std::size_t> count(devices.size(), 0);
  for (const auto& [d, p] : uses) ++count[d];
  std::vector<std::size_t> slot(devices.size(), 0);
  std::vector<SharedDevice> shared;
  for (std::size_t d = 0; d < devices.size(); ++d) {
    if (count[d] < 2) continue;
    slot[d] = shared.size();
    shared.push_back({std::string(devices.tag(d)), {}});
    shared.back().users.reserve(count[d]);
  }
  auto party_name = [&](std::size_t p) -> const std::string& {
    return p < project.sifs.size() ? project.sifs[p].id : project.scenarios[p - project.sifs.size()].id;
  };
  for (const auto& [d, p] : uses)
    if (count[d] >= 2) shared[slot[d]].users.push_back(party_name(p));
  std::sort(shared.begin(), shared.end(), [](const SharedDevice& a, const SharedDevice& b) { return a.tag < b.tag; });
  return shared;
}

}  // namespace sifter
