#pragma once
/// Who relies on which device: components, SIFs, scenarios, causes and protection layers as
/// vertices of one Boost.Graph, with an edge from each of them to what it relies on.
///
/// Independence of protection layers (CCPS, Layer of Protection Analysis, 2001: an IPL is
/// independent of the initiating event and of the other credited layers) is checked here as
/// plain graph reachability: two parties share a device when the same device vertex can be
/// reached from both.
#include <boost/container/small_vector.hpp>
#include <boost/graph/adjacency_list.hpp>
#include <cstddef>
#include <map>
#include <string>
#include <unordered_map>
#include <vector>

#include "sifter/model/model.hpp"
#include "sifter/results/project.hpp"

namespace sifter {

/// What a vertex of the dependency graph stands for.
enum class DependencyKind { kDevice, kComponent, kSif, kScenario, kCause, kLayer };

/// The vertices added for one scenario: the scenario itself, its causes and its layers, in the
/// order of Scenario::causes and Scenario::layers.
struct ScenarioVertices {
  std::size_t scenario = 0;
  std::vector<std::size_t> causes;
  std::vector<std::size_t> layers;
};

/// The dependency graph. Edges: component -> the device of the same tag; SIF -> each
/// component of its channels; scenario -> its causes and layers; cause or layer -> each device
/// it lists; a SIF layer -> the SIF it names. Device tags and component ids live in one
/// namespace, so a layer listing "LT-400" shares that device with a SIF using component LT-400.
class DependencyGraph {
 public:
  using Vertex = std::size_t;

  /// An empty graph; add parties with the add_* functions.
  DependencyGraph() = default;

  /// The device vertex of a tag, created on first use.
  Vertex add_device(const std::string& tag);
  /// The component vertex of an id (and its device), created on first use.
  Vertex add_component(const std::string& id);
  /// The SIF vertex with edges to its components (Project::components by channel index);
  /// created on first use, so adding the same SIF again returns the same vertex.
  Vertex add_sif(const Project& project, const Sif& sif);
  /// A scenario with its causes and layers; a SIF layer naming a SIF of the project gets an
  /// edge to it (the SIF is added if needed). A SIF id not in the project adds no edge.
  ScenarioVertices add_scenario(const Project& project, const Scenario& scenario);

  /// Device tags reachable from a vertex, sorted; through SIF vertices too.
  [[nodiscard]] std::vector<std::string> devices_of(Vertex v) const;
  /// Device tags reachable from both vertices, sorted.
  [[nodiscard]] std::vector<std::string> common_devices(Vertex a, Vertex b) const;

  /// What a vertex stands for and its name (tag, id, or "scenario/cause" for causes and layers).
  [[nodiscard]] DependencyKind kind(Vertex v) const { return graph_[v].kind; }
  [[nodiscard]] const std::string& name(Vertex v) const { return graph_[v].name; }
  [[nodiscard]] std::size_t vertex_count() const { return boost::num_vertices(graph_); }

 private:
  struct Node {
    DependencyKind kind = DependencyKind::kDevice;
    std::string name;
  };
  // vecS out-edges: a device listed twice by one party is two edges, which every walk visits
  // once (reach_devices keeps a visited set); a tree per vertex cost more than the walks.
  using Graph = boost::adjacency_list<boost::vecS, boost::vecS, boost::directedS, Node>;

  Vertex add_vertex(DependencyKind kind, const std::string& name);
  // Device vertices reachable from v; through_sifs = false stops at SIF vertices. A walk
  // reaches a handful, so the list is held inline: the LOPA asks for two walks per pair of
  // layers, and lists on the heap were 4 % of the allocations of a run over a register.
  using Reached = boost::container::small_vector<Vertex, 16>;
  [[nodiscard]] Reached reach_devices(Vertex v, bool through_sifs) const;

  Graph graph_;
  std::unordered_map<std::string, Vertex> devices_;
  std::unordered_map<std::string, Vertex> components_;
  std::unordered_map<std::string, Vertex> sifs_;
};

/// Devices on which at least two SIFs or scenarios of a project rely, sorted by tag, each with
/// its users (SIFs in project order, then scenarios). A SIF relies on the devices of its
/// components; a scenario on those its causes and layers list (not on those of a SIF it
/// credits, which would only repeat the SIF's own use). The reliance is the graph's edges one
/// step deep, counted without building the whole project's graph.
std::vector<SharedDevice> shared_devices(const Project& project);

}  // namespace sifter
