#pragma once
/// The SIFs as a Boost.Graph of signal flow (SIF -> groups -> channels -> components),
/// its validation, and the components that several SIFs share.
#include <boost/graph/adjacency_list.hpp>
#include <string>
#include <unordered_map>
#include <vector>

#include "sifter/model/diagnostics.hpp"
#include "sifter/model/model.hpp"
#include "sifter/results/project.hpp"

namespace sifter {

/// What a vertex of the plant graph stands for.
enum class VertexKind { kSif, kGroup, kChannel, kComponent };

/// A vertex: its kind, a readable label and the index of what it stands for. SIFs and
/// components are labelled by their ids; groups and channels, of which a register holds hundreds
/// of thousands, only by their indices (their names are in the project).
struct PlantVertex {
  VertexKind kind = VertexKind::kComponent;
  std::string label;
  std::size_t sif = 0;        ///< index of the SIF (groups and channels)
  std::size_t subsystem = 0;  ///< index of the subsystem in its SIF (groups and channels)
  std::size_t index = 0;      ///< component index (components), channel index (channels)
};

/// Directed graph: edges follow the signal from the process input to the final elements
/// (SIF -> first group -> next group ...) and from each group down to what it is made of.
/// Out-edges only: what uses a component is found from the channels' edges, never walked back.
using PlantGraphType = boost::adjacency_list<boost::vecS, boost::vecS, boost::directedS, PlantVertex>;

/// The graph of a project's SIFs.
class PlantGraph {
 public:
  /// Builds the graph; channel references that do not resolve are kept as problems.
  explicit PlantGraph(const Project& project);

  /// Every structural problem: unknown ids, a component twice in one group, empty groups,
  /// K > N, a vote whose N differs from the number of channels.
  [[nodiscard]] const std::vector<GraphProblem>& problems() const { return problems_; }
  /// Components used by more than one SIF, in component order.
  [[nodiscard]] std::vector<SharedComponent> shared_components() const;
  /// The groups of a SIF in signal order (sensor -> logic -> final as written).
  [[nodiscard]] std::vector<std::size_t> signal_order(std::size_t sif) const;
  [[nodiscard]] const PlantGraphType& graph() const { return graph_; }
  /// The index in Project::components of every channel's component ids, in the order of the
  /// SIFs, subsystems, channels and ids (meaningful only when problems() is empty).
  [[nodiscard]] const std::vector<std::size_t>& resolved_ids() const { return resolved_; }

 private:
  void add_sif(const Project& project, std::size_t s);
  PlantGraphType::vertex_descriptor place_vertex(PlantVertex vertex);  // the next of the vertices sized at the start
  void check_groups(const Project& project);
  void report_repeated_components(const Subsystem& sub);

  static constexpr std::size_t kUnresolved = static_cast<std::size_t>(-1);

  PlantGraphType graph_;
  std::unordered_map<std::string, std::size_t> component_index_;
  std::vector<PlantGraphType::vertex_descriptor> sif_vertex_;
  std::vector<GraphProblem> problems_;
  std::vector<std::size_t> resolved_;  // see resolved_ids()
  std::size_t next_vertex_ = 0;        // the vertex place_vertex fills next
};

/// What validation keeps of a project's graph, which it then drops: its problems, every
/// channel's component indices (PlantGraph::resolved_ids) and the components several SIFs share
/// (found only when there is no problem).
struct PlantFindings {
  std::vector<GraphProblem> problems;
  std::vector<std::size_t> resolved;
  std::vector<SharedComponent> shared;
};

/// Builds the graph of a project's components and SIFs, keeps its findings and frees it, all on
/// the caller's thread (the loader runs it on another core while it reads the rest).
PlantFindings plant_findings(const Project& project);

/// Validates the SIF structure and resolves every channel's component ids into indices (left
/// unresolved when there is a problem).
std::vector<GraphProblem> validate_project_graph(Project& project);

/// validate_project_graph with the findings of a graph already built from this project's
/// components and SIFs. Findings of another project are a defect of the caller (logic_error).
std::vector<GraphProblem> adopt_project_graph(Project& project, const PlantFindings& findings);

}  // namespace sifter
