// Overpressure screening on a graph of sources, connections and equipment.
#include "sifter/engines/pressure.hpp"

#include <algorithm>
#include <boost/graph/adjacency_list.hpp>
#include <boost/graph/depth_first_search.hpp>
#include <cmath>
#include <map>

#include "sifter/engines/lopa.hpp"

namespace sifter {
namespace {

// Vertices are the sources then the equipment items, in project order.
using FlowGraph = boost::adjacency_list<boost::vecS, boost::vecS, boost::directedS>;
using Vertex = FlowGraph::vertex_descriptor;

std::vector<std::string> ids_of(const PressureSection& section) {
  std::vector<std::string> ids;
  for (const auto& s : section.sources) ids.push_back(s.id);
  for (const auto& e : section.equipment) ids.push_back(e.id);
  return ids;
}

// Built in place and never copied (a copy of an adjacency_list trips a false
// maybe-uninitialized warning in GCC 12).
struct Built {
  explicit Built(const PressureSection& section)
      : ids(ids_of(section)), sources(section.sources.size()), graph(ids.size()) {
    std::map<std::string, Vertex> index;
    for (std::size_t i = 0; i < ids.size(); ++i) index.emplace(ids[i], i);
    for (const auto& c : section.connections) {
      auto f = index.find(c.from), t = index.find(c.to);
      if (f != index.end() && t != index.end()) boost::add_edge(f->second, t->second, graph);
    }
  }
  std::vector<std::string> ids;
  std::size_t sources = 0;
  FlowGraph graph;
};

// Records the first back edge the depth-first search meets.
struct CycleFinder : boost::default_dfs_visitor {
  std::vector<Vertex>* parent;
  std::vector<Vertex>* cycle;
  void tree_edge(FlowGraph::edge_descriptor e, const FlowGraph& g) const {
    (*parent)[boost::target(e, g)] = boost::source(e, g);
  }
  void back_edge(FlowGraph::edge_descriptor e, const FlowGraph& g) const {
    if (!cycle->empty()) return;
    const Vertex from = boost::source(e, g), to = boost::target(e, g);
    for (Vertex v = from; v != to; v = (*parent)[v]) cycle->push_back(v);
    cycle->push_back(to);
    std::reverse(cycle->begin(), cycle->end());
  }
};

void reach_from(const Built& b, Vertex start, std::vector<Vertex>& parent) {
  const std::size_t n = boost::num_vertices(b.graph);
  parent.assign(n, n);
  parent[start] = start;
  std::vector<Vertex> queue{start};
  for (std::size_t q = 0; q < queue.size(); ++q) {
    const Vertex u = queue[q];
    if (u != start && u < b.sources) continue;  // another source: its suction covers what is upstream
    for (auto [e, end] = boost::out_edges(u, b.graph); e != end; ++e) {
      const Vertex v = boost::target(*e, b.graph);
      if (parent[v] != n) continue;
      parent[v] = u;
      queue.push_back(v);
    }
  }
}

std::string percent(double fraction) { return format_number(100.0 * fraction) + " %"; }

std::vector<std::string> source_estimates(const PressureSource& s) {
  std::vector<std::string> out;
  if (s.shutoff_estimated() && s.rated_differential)
    out.push_back("shutoff head of " + s.id + " estimated as rated differential " +
                  format_number(s.rated_differential->metres) + " m + " + percent(s.shutoff_margin));
  if (s.status == DataStatus::kEstimate) out.push_back("source " + s.id + " (status estimate)");
  return out;
}

}  // namespace

std::string to_string(OverpressureCategory category) {
  switch (category) {
    case OverpressureCategory::kNone:
      return "none";
    case OverpressureCategory::kMinor:
      return "minor";
    case OverpressureCategory::kLeakPossible:
      return "leak_possible";
    case OverpressureCategory::kRupturePossible:
      return "rupture_possible";
  }
  return "none";
}

OverpressureCategory category_for_ratio(double ratio, double accumulation, double test_ratio) {
  if (ratio <= 1.0) return OverpressureCategory::kNone;
  if (ratio <= 1.0 + accumulation) return OverpressureCategory::kMinor;
  if (ratio <= test_ratio) return OverpressureCategory::kLeakPossible;
  return OverpressureCategory::kRupturePossible;
}

std::optional<double> curve_head_m(const std::vector<CurvePoint>& curve, double flow) {
  if (curve.empty() || flow < curve.front().flow.m3_per_hour) return std::nullopt;
  for (std::size_t i = 1; i < curve.size(); ++i) {
    const auto& a = curve[i - 1];
    const auto& b = curve[i];
    if (flow <= b.flow.m3_per_hour) {
      const double t = (flow - a.flow.m3_per_hour) / (b.flow.m3_per_hour - a.flow.m3_per_hour);
      return a.head.metres + t * (b.head.metres - a.head.metres);
    }
  }
  if (flow == curve.back().flow.m3_per_hour) return curve.back().head.metres;
  return std::nullopt;
}

std::optional<double> curve_flow_m3_per_hour(const std::vector<CurvePoint>& curve, double head) {
  if (curve.empty()) return std::nullopt;
  if (head >= curve.front().head.metres) return curve.front().flow.m3_per_hour;
  for (std::size_t i = 1; i < curve.size(); ++i) {
    const auto& a = curve[i - 1];
    const auto& b = curve[i];
    if (head >= b.head.metres) {
      if (a.head.metres == b.head.metres) return a.flow.m3_per_hour;
      const double t = (a.head.metres - head) / (a.head.metres - b.head.metres);
      return a.flow.m3_per_hour + t * (b.flow.m3_per_hour - a.flow.m3_per_hour);
    }
  }
  return std::nullopt;
}

double shutoff_head_m(const PressureSource& source) {
  if (!source.curve.empty()) return source.curve.front().head.metres;
  return source.rated_differential.value_or(Length{}).metres * (1.0 + source.shutoff_margin);
}

double source_max_pressure_barg(const PressureSource& source) {
  if (source.kind == PressureSource::Kind::kFixed) return source.pressure.bar_gauge;
  // Affinity laws (textbook pump hydraulics): head scales with the square of the speed.
  const double head = shutoff_head_m(source) * source.speed_max_ratio * source.speed_max_ratio;
  return source.suction_max.bar_gauge + static_head_bar(source.density_max.value_or(Density{}), Length{head});
}

std::vector<std::string> connection_cycle(const PressureSection& section) {
  const Built b(section);
  const std::size_t n = boost::num_vertices(b.graph);
  std::vector<Vertex> parent(n, n), cycle;
  std::vector<boost::default_color_type> colour(n);
  CycleFinder finder;
  finder.parent = &parent;
  finder.cycle = &cycle;
  boost::depth_first_search(
      b.graph, finder, boost::make_iterator_property_map(colour.begin(), boost::get(boost::vertex_index, b.graph)));
  std::vector<std::string> out;
  for (Vertex v : cycle) out.push_back(b.ids[v]);
  if (!out.empty()) out.push_back(out.front());
  return out;
}

namespace {

// The highest pressure found so far at one equipment item, and how it gets there.
struct WorstCase {
  bool reached = false;
  double pressure = 0.0;
  std::size_t source = 0;
  double head = 0.0;
  std::vector<std::string> path;
  std::vector<std::string> estimates;
};

// The ids from the search's start to v, following the parents the search recorded.
std::vector<std::string> path_to(const Built& b, const std::vector<Vertex>& parent, Vertex v) {
  std::vector<std::string> path;
  for (Vertex u = v;; u = parent[u]) {
    path.push_back(b.ids[u]);
    if (u == parent[u]) break;
  }
  std::reverse(path.begin(), path.end());
  return path;
}

// Raises each item's worst case with the pressure source s can put on it.
void raise_by_source(const PressureSection& section, const Built& b, std::size_t s, std::vector<WorstCase>& worst) {
  const std::size_t n = boost::num_vertices(b.graph);
  std::vector<Vertex> parent;
  const PressureSource& src = section.sources[s];
  reach_from(b, s, parent);
  const double at_source = source_max_pressure_barg(src);
  const auto estimates = source_estimates(src);
  for (std::size_t e = 0; e < section.equipment.size(); ++e) {
    const Vertex v = b.sources + e;
    if (parent[v] == n) continue;
    const auto& item = section.equipment[e];
    // Liquid service: the column between the source and the item adds (or, above the
    // source, subtracts) rho g dz; a fixed source without a density is taken as gas (no head).
    const double head =
        src.density_max ? static_head_bar(*src.density_max, Length{src.elevation.metres - item.elevation.metres}) : 0.0;
    const double p = at_source + head;
    WorstCase& cur = worst[e];
    for (const auto& est : estimates)
      if (std::find(cur.estimates.begin(), cur.estimates.end(), est) == cur.estimates.end())
        cur.estimates.push_back(est);
    if (cur.reached && p <= cur.pressure) continue;
    cur.reached = true;
    cur.pressure = p;
    cur.source = s;
    cur.head = head;
    cur.path = path_to(b, parent, v);
  }
}

EquipmentScreening screening_of(const PressureSection& section, const PressureEquipment& item, const WorstCase& worst,
                                double accumulation) {
  EquipmentScreening r;
  r.id = item.id;
  r.title = item.title;
  r.max_pressure_barg = worst.pressure;
  r.mawp_barg = item.mawp.bar_gauge;
  r.test_pressure_barg = item.test_pressure.bar_gauge;
  r.ratio = r.max_pressure_barg / r.mawp_barg;
  r.category = category_for_ratio(r.ratio, accumulation, r.test_pressure_barg / r.mawp_barg);
  r.source = section.sources[worst.source].id;
  r.path = worst.path;
  r.static_head_bar = worst.head;
  r.estimates = worst.estimates;
  if (item.status == DataStatus::kEstimate) r.estimates.push_back("rating of " + item.id + " (status estimate)");
  return r;
}

// The item's relief devices and the SIFs named on it, as the scenario's layers.
void add_item_layers(const PressureEquipment& item, Scenario& s) {
  for (std::size_t k = 0; k < item.relief_devices.size(); ++k) {
    const auto& rd = item.relief_devices[k];
    Layer l;
    l.id = rd.id;
    l.title = rd.title;
    l.kind = LayerKind::kReliefDevice;
    l.pfd = rd.pfd;
    l.pointer = item.pointer + "/relief_devices/" + std::to_string(k);
    s.layers.push_back(std::move(l));
  }
  for (std::size_t k = 0; k < item.sifs.size(); ++k) {
    Layer l;
    l.id = item.sifs[k];
    l.sif = item.sifs[k];
    l.kind = LayerKind::kSif;
    l.pointer = item.pointer + "/sifs/" + std::to_string(k);
    s.layers.push_back(std::move(l));
  }
}

}  // namespace

PressureScreening screen_pressure(const PressureSection& section) {
  const Built b(section);
  std::vector<WorstCase> worst(section.equipment.size());
  for (std::size_t s = 0; s < section.sources.size(); ++s) raise_by_source(section, b, s, worst);
  PressureScreening out;
  const double accumulation = section.bands ? section.bands->accumulation : 0.10;
  for (std::size_t e = 0; e < section.equipment.size(); ++e) {
    const auto& item = section.equipment[e];
    if (!worst[e].reached) {
      out.not_reached.push_back(item.id);
      continue;
    }
    out.equipment.push_back(screening_of(section, item, worst[e], accumulation));
  }
  return out;
}

std::string overpressure_scenario_id(const std::string& item, const std::string& source) {
  return "OP-" + item + "-by-" + source;
}

std::vector<Scenario> overpressure_scenarios(const PressureSection& section, PressureScreening& screening) {
  std::vector<Scenario> out;
  const bool any_over =
      std::any_of(screening.equipment.begin(), screening.equipment.end(),
                  [](const EquipmentScreening& e) { return e.category != OverpressureCategory::kNone; });
  if (!any_over) return out;
  if (!section.bands) screening.missing.push_back("pressure.consequence_bands");
  if (!section.blocked_outlet) screening.missing.push_back("pressure.blocked_outlet_frequency");
  if (!screening.missing.empty()) return out;
  std::map<std::string, const PressureEquipment*> items;
  for (const auto& e : section.equipment) items[e.id] = &e;
  for (std::size_t i = 0; i < screening.equipment.size(); ++i) {
    const auto& r = screening.equipment[i];
    if (r.category == OverpressureCategory::kNone) continue;
    const PressureEquipment& item = *items.at(r.id);
    const BandConsequence& band = r.category == OverpressureCategory::kMinor          ? section.bands->minor
                                  : r.category == OverpressureCategory::kLeakPossible ? section.bands->leak
                                                                                      : section.bands->rupture;
    Scenario s;
    s.id = overpressure_scenario_id(r.id, r.source);
    s.title = "Overpressure of " + (item.title.empty() ? item.id : item.title + " (" + item.id + ")") + " by " +
              r.source + " on a blocked outlet: " + format_pressure(r.max_pressure_barg) + " against MAWP " +
              format_pressure(r.mawp_barg) + " (" + to_string(r.category) + ")";
    s.generated = true;
    s.pointer = item.pointer;
    s.consequences.push_back({band.category, band.severity});
    Cause cause;
    cause.id = "blocked-outlet-" + r.id;
    cause.title = "Outlet of " + r.id + " blocked while " + r.source + " runs (" + section.blocked_outlet->source + ")";
    cause.frequency = section.blocked_outlet->frequency;
    cause.status = section.blocked_outlet->status;
    cause.pointer = "/pressure/blocked_outlet_frequency";
    s.causes.push_back(std::move(cause));
    add_item_layers(item, s);
    s.estimates = r.estimates;
    if (section.blocked_outlet->status == DataStatus::kEstimate)
      s.estimates.push_back("blocked-outlet frequency (status estimate)");
    screening.generated.push_back(s.id);
    out.push_back(std::move(s));
  }
  return out;
}

}  // namespace sifter
