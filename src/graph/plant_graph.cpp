// The signal-flow graph of the SIFs: construction, validation and shared components.
#include "sifter/graph/plant_graph.hpp"

#include <algorithm>
#include <stdexcept>
#include <string_view>
#include <tuple>
#include <unordered_map>
#include <utility>

#include "sifter/model/diagnostics.hpp"

namespace sifter {

namespace {

// The vertices of a project's graph: a component, a SIF, a group and a channel each.
std::size_t vertex_count(const Project& project) {
  std::size_t vertices = project.components.size();
  for (const auto& sif : project.sifs) {
    ++vertices;
    for (const auto& sub : sif.subsystems) vertices += 1 + sub.channels.size();
  }
  return vertices;
}

}  // namespace

// Every vertex is known before any edge: the graph is sized once, and the vertices are laid out
// as they would be added one by one (the components, then each SIF with its groups and their
// channels).
PlantGraph::PlantGraph(const Project& project) : graph_(vertex_count(project)) {
  std::size_t ids = 0;
  for (const auto& sif : project.sifs)
    for (const auto& sub : sif.subsystems)
      for (const auto& ch : sub.channels) ids += ch.component_ids.size();
  resolved_.reserve(ids);
  component_index_.reserve(project.components.size());
  for (std::size_t c = 0; c < project.components.size(); ++c) {
    component_index_.emplace(project.components[c].id, c);
    graph_[c] = PlantVertex{VertexKind::kComponent, project.components[c].id, 0, 0, c};
  }
  next_vertex_ = project.components.size();
  sif_vertex_.reserve(project.sifs.size());
  for (std::size_t s = 0; s < project.sifs.size(); ++s) add_sif(project, s);
  if (next_vertex_ != boost::num_vertices(graph_))
    throw std::logic_error("PlantGraph: fewer vertices than vertex_count counted");
  check_groups(project);
}

PlantGraphType::vertex_descriptor PlantGraph::place_vertex(PlantVertex vertex) {
  if (next_vertex_ >= boost::num_vertices(graph_))
    throw std::logic_error("PlantGraph: more vertices than vertex_count counted");
  graph_[next_vertex_] = std::move(vertex);
  return next_vertex_++;
}

void PlantGraph::add_sif(const Project& project, std::size_t s) {
  const auto& by_id = component_index_;
  std::vector<std::string> ids;
  const Sif& sif = project.sifs[s];
  const auto sv = place_vertex(PlantVertex{VertexKind::kSif, sif.id, s, 0, s});
  sif_vertex_.push_back(sv);
  auto previous = sv;
  for (std::size_t g = 0; g < sif.subsystems.size(); ++g) {
    const Subsystem& sub = sif.subsystems[g];
    const auto gv = place_vertex(PlantVertex{VertexKind::kGroup, {}, s, g, g});
    boost::add_edge(previous, gv, graph_);  // the signal passes from one subsystem to the next
    previous = gv;
    for (std::size_t c = 0; c < sub.channels.size(); ++c) {
      const auto cv = place_vertex(PlantVertex{VertexKind::kChannel, {}, s, g, c});
      boost::add_edge(gv, cv, graph_);
      const Channel& ch = sub.channels[c];
      for (std::size_t e = 0; e < ch.component_ids.size(); ++e) {
        auto it = by_id.find(ch.component_ids[e]);
        resolved_.push_back(it == by_id.end() ? kUnresolved : it->second);
        if (it == by_id.end()) {
          if (ids.empty())
            for (const auto& comp : project.components) ids.push_back(comp.id);
          const auto near = nearest(ch.component_ids[e], ids);
          problems_.push_back({ch.component_ids.size() > 1 ? ch.pointer + "/" + std::to_string(e) : ch.pointer,
                               "the id of a component", "\"" + ch.component_ids[e] + "\", which is not defined",
                               near.empty() ? "add it to \"components\"" : "did you mean \"" + near + "\"?"});
          continue;
        }
        boost::add_edge(cv, it->second, graph_);  // component c is vertex c
      }
    }
  }
}

void PlantGraph::check_groups(const Project& project) {
  for (auto v : boost::make_iterator_range(boost::vertices(graph_))) {
    const PlantVertex& pv = graph_[v];
    if (pv.kind != VertexKind::kGroup) continue;
    const Subsystem& sub = project.sifs[pv.sif].subsystems[pv.subsystem];
    if (sub.is_vendor()) continue;
    int n_channels = 0;
    for (auto e : boost::make_iterator_range(boost::out_edges(v, graph_)))
      if (graph_[boost::target(e, graph_)].kind == VertexKind::kChannel) ++n_channels;
    if (n_channels == 0) {
      problems_.push_back({sub.pointer, "a subsystem with channels, or a vendor \"pfd_avg\" or \"pfh\"", "no channels",
                           "list the component ids under \"channels\""});
      continue;
    }
    if (sub.vote.k > sub.vote.n)
      problems_.push_back({sub.pointer + "/vote", "a vote with K no more than N", sub.vote.text(),
                           "K is the number of channels that must work"});
    if (sub.vote.n != n_channels)
      problems_.push_back({sub.pointer + "/channels",
                           std::to_string(sub.vote.n) + " channels for vote " + sub.vote.text(),
                           std::to_string(n_channels) + " channels", "make the vote's N equal to the channel count"});
    report_repeated_components(sub);
  }
}

void PlantGraph::report_repeated_components(const Subsystem& sub) {
  // A component used twice in the group is reported where it is written the second time, in
  // the order written. The ids are sorted (stably, so the first use of each leads its run) and
  // places are written out only for a repeat.
  struct Use {
    std::string_view id;
    std::size_t channel;
    std::size_t element;
  };
  std::vector<Use> uses;
  for (std::size_t c = 0; c < sub.channels.size(); ++c)
    for (std::size_t e = 0; e < sub.channels[c].component_ids.size(); ++e)
      uses.push_back({sub.channels[c].component_ids[e], c, e});
  std::stable_sort(uses.begin(), uses.end(), [](const Use& a, const Use& b) { return a.id < b.id; });
  std::vector<std::pair<Use, Use>> repeats;  // (repeat, first use)
  for (std::size_t i = 1, first = 0; i < uses.size(); ++i) {
    if (uses[i].id != uses[first].id) {
      first = i;
      continue;
    }
    repeats.emplace_back(uses[i], uses[first]);
  }
  std::sort(repeats.begin(), repeats.end(), [](const auto& a, const auto& b) {
    return std::tie(a.first.channel, a.first.element) < std::tie(b.first.channel, b.first.element);
  });
  auto place = [&sub](const Use& u) {
    const Channel& ch = sub.channels[u.channel];
    return ch.component_ids.size() > 1 ? ch.pointer + "/" + std::to_string(u.element) : ch.pointer;
  };
  for (const auto& [repeat, first] : repeats)
    problems_.push_back({place(repeat), "each component once in a group",
                         "\"" + std::string(repeat.id) + "\" again (first at " + place(first) + ")",
                         "redundant channels need their own devices"});
}

std::vector<SharedComponent> PlantGraph::shared_components() const {
  // Each (component, SIF) pair once, from the channels' edges to their components: sorted by
  // component, then SIF, they give each component's SIFs in order.
  std::vector<std::pair<std::size_t, std::size_t>> uses;
  for (auto v : boost::make_iterator_range(boost::vertices(graph_))) {
    if (graph_[v].kind != VertexKind::kChannel) continue;
    for (auto e : boost::make_iterator_range(boost::out_edges(v, graph_)))
      uses.emplace_back(graph_[boost::target(e, graph_)].index, graph_[v].sif);
  }
  std::sort(uses.begin(), uses.end());
  uses.erase(std::unique(uses.begin(), uses.end()), uses.end());
  std::vector<SharedComponent> out;
  for (std::size_t i = 0; i < uses.size();) {
    std::size_t end = i;
    while (end < uses.size() && uses[end].first == uses[i].first) ++end;
    if (end - i >= 2) {
      SharedComponent shared{graph_[uses[i].first].label, {}};
      for (std::size_t j = i; j < end; ++j) shared.sifs.push_back(graph_[sif_vertex_[uses[j].second]].label);
      out.push_back(std::move(shared));
    }
    i = end;
  }
  return out;
}

std::vector<std::size_t> PlantGraph::signal_order(std::size_t sif) const {
  std::vector<std::size_t> order;
  auto v = sif_vertex_.at(sif);
  while (true) {
    bool moved = false;
    for (auto e : boost::make_iterator_range(boost::out_edges(v, graph_))) {
      auto t = boost::target(e, graph_);
      if (graph_[t].kind == VertexKind::kGroup) {
        order.push_back(graph_[t].subsystem);
        v = t;
        moved = true;
        break;
      }
    }
    if (!moved) return order;
  }
}

PlantFindings plant_findings(const Project& project) {
  const PlantGraph graph(project);
  PlantFindings out{graph.problems(), graph.resolved_ids(), {}};
  if (out.problems.empty()) out.shared = graph.shared_components();
  return out;
}

std::vector<GraphProblem> validate_project_graph(Project& project) {
  return adopt_project_graph(project, plant_findings(project));
}

std::vector<GraphProblem> adopt_project_graph(Project& project, const PlantFindings& findings) {
  if (!findings.problems.empty()) return findings.problems;
  // Resolve ids into indices now that every one is known: the graph resolved them as it was
  // built, in this order. A graph of another project is a defect of the caller.
  const auto& resolved = findings.resolved;
  std::size_t next = 0;
  for (auto& sif : project.sifs)
    for (auto& sub : sif.subsystems)
      for (auto& ch : sub.channels) {
        if (next + ch.component_ids.size() > resolved.size())
          throw std::logic_error("adopt_project_graph: a graph built from another project");
        ch.components.assign(resolved.begin() + static_cast<std::ptrdiff_t>(next),
                             resolved.begin() + static_cast<std::ptrdiff_t>(next + ch.component_ids.size()));
        next += ch.component_ids.size();
      }
  if (next != resolved.size()) throw std::logic_error("adopt_project_graph: a graph built from another project");
  return {};
}

}  // namespace sifter
