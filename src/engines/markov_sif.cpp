// Exact engine, SIF level: subsystems in series on a common grid of every test instant.
#include <algorithm>
#include <array>
#include <boost/math/quadrature/gauss.hpp>
#include <cmath>
#include <deque>
#include <memory>
#include <stdexcept>
#include <unsupported/Eigen/MatrixFunctions>
#include <vector>

#include "engines/exact_memo.hpp"
#include "engines/markov_chain.hpp"
#include "sifter/engines/markov.hpp"

namespace sifter {
namespace {

using detail::ChannelMask;
using detail::GroupChain;
using detail::GroupTrace;

// Gauss-Legendre points per graded sub-interval.
constexpr unsigned kGaussPoints = 8;

// Offsets and weights of a composite Gauss-Legendre rule on [0, L], graded towards 0: the
// sub-intervals [L/2^(i+1), L/2^i] for i = 0..K-1 and [0, L/2^K], with L/2^K no longer than
// the fastest time constant. Within a segment every PFD_i(t) is a sum of decaying exponentials
// that all start at or before its beginning, so this resolves the repairs after a test as
// well as the slow growth. Nodes run from the innermost sub-interval outwards, and each
// sub-interval's nodes are twice those of the one inside it, so that exponentials square.
struct GradedRule {
  double length_hours = 0.0;
  int levels = 0;                  // K
  std::vector<double> unit_nodes;  // Gauss-Legendre nodes on [0, 1]
  std::vector<double> offsets_hours;
  std::vector<double> weights_hours;
};

GradedRule graded_rule(double length, double fastest_per_hour) {
  using Gauss = boost::math::quadrature::gauss<double, kGaussPoints>;
  GradedRule r;
  r.length_hours = length;
  const double span = length * fastest_per_hour;
  r.levels = span > 1.0 ? std::min(60, static_cast<int>(std::ceil(std::log2(span)))) : 0;
  std::vector<double> unit_weights;
  for (std::size_t i = 0; i < Gauss::abscissa().size(); ++i) {
    const double a = Gauss::abscissa()[i];
    const double w = Gauss::weights()[i];
    for (double x : {-a, a}) {
      if (a == 0.0 && x < 0.0) continue;
      r.unit_nodes.push_back((1.0 + x) / 2.0);
      unit_weights.push_back(w / 2.0);
    }
  }
  const double inner = std::ldexp(length, -r.levels);
  for (std::size_t q = 0; q < r.unit_nodes.size(); ++q) {
    r.offsets_hours.push_back(inner * r.unit_nodes[q]);
    r.weights_hours.push_back(inner * unit_weights[q]);
  }
  for (int level = r.levels - 1; level >= 0; --level) {
    const double h = std::ldexp(length, -(level + 1));  // sub-interval [h, 2h]
    for (std::size_t q = 0; q < r.unit_nodes.size(); ++q) {
      r.offsets_hours.push_back(h * (1.0 + r.unit_nodes[q]));
      r.weights_hours.push_back(h * unit_weights[q]);
    }
  }
  return r;
}

// exp(Q s) [f, g, g_u] at every node of a rule: the PFD, the failure frequency and its
// undetected part at the node, as functions of the state at the start of the segment.
struct NodeColumns {
  ChannelMask bypassed = 0;
  double length_hours = 0.0;
  std::array<Eigen::MatrixXd, 3> of;  // each (states x nodes)
};

NodeColumns node_columns(const GroupChain& chain, ChannelMask bypassed, const GradedRule& rule) {
  const Eigen::MatrixXd& q = chain.generator();
  const std::array<Eigen::VectorXd, 3> v{chain.failed(bypassed), chain.entering(bypassed),
                                         chain.entering_undetected(bypassed)};
  const auto nodes = static_cast<Eigen::Index>(rule.offsets_hours.size());
  const auto m = static_cast<std::size_t>(rule.unit_nodes.size());
  NodeColumns c{bypassed, rule.length_hours, {}};
  for (auto& x : c.of) x.resize(q.rows(), nodes);
  auto store = [&](std::size_t node, const Eigen::MatrixXd& e) {
    for (std::size_t w = 0; w < 3; ++w) c.of[w].col(static_cast<Eigen::Index>(node)) = e * v[w];
  };
  for (std::size_t j = 0; j < m; ++j) store(j, (q * rule.offsets_hours[j]).exp());
  if (rule.levels == 0) return c;
  std::vector<Eigen::MatrixXd> e(m);
  for (std::size_t j = 0; j < m; ++j) {
    e[j] = (q * rule.offsets_hours[m + j]).exp();
    store(m + j, e[j]);
  }
  for (int level = 1; level < rule.levels; ++level)
    for (std::size_t j = 0; j < m; ++j) {
      e[j] = e[j] * e[j];
      store(m * static_cast<std::size_t>(level + 1) + j, e[j]);
    }
  return c;
}

// node_columns once per distinct (generator, bypass, rule) in the run: the keys are the bytes
// of everything it reads, so equal keys give equal columns whichever SIF asks.
std::shared_ptr<const NodeColumns> shared_node_columns(const GroupChain& chain, ChannelMask bypassed,
                                                       const GradedRule& rule) {
  static detail::MemoTable<NodeColumns> table;
  detail::MemoKey key;
  key.add(chain.generator()).add(chain.failed(bypassed)).add(chain.entering(bypassed));
  key.add(chain.entering_undetected(bypassed)).add(bypassed).add(rule.offsets_hours).add(rule.length_hours);
  return table.get(
      key.take(), [&] { return node_columns(chain, bypassed, rule); },
      [](const NodeColumns& c) { return 3 * static_cast<std::size_t>(c.of[0].size()) * sizeof(double); });
}

// What the SIF loses against the sum of its subsystems, integrated over the mission:
// sum u_i - PFD_sif for the PFD, and sum w_i (1 - prod_{l != i}(1 - u_l)) for the failure
// frequency (a subsystem failing while another is already down does not fail the SIF again).
struct CrossTerms {
  double pfd = 0.0;
  double frequency = 0.0;
  double undetected_frequency = 0.0;
};

CrossTerms cross_terms(const std::vector<GroupChain>& chains, const std::vector<GroupTrace>& traces,
                       const std::vector<double>& grid) {
  double fastest = 0.0;
  for (const auto& c : chains) fastest = std::max(fastest, c.fastest_rate_per_hour());
  std::deque<GradedRule> rules;
  // The node columns met so far, per group: shared with the run's memo, not copied.
  std::vector<std::vector<std::shared_ptr<const NodeColumns>>> columns(chains.size());
  CrossTerms out;
  const std::size_t groups = chains.size();
  const auto cols = static_cast<Eigen::Index>(groups);
  std::array<Eigen::MatrixXd, 3> at;  // u, w, w_u per node and group; sized once per rule length
  std::vector<double> prefix(groups + 1);
  std::vector<double> suffix(groups + 1);
  for (std::size_t k = 0; k + 1 < grid.size(); ++k) {
    const double length = grid[k + 1] - grid[k];
    auto same = [&](double l) { return std::fabs(l - length) <= 1e-10 * length; };
    auto rule_it = std::find_if(rules.begin(), rules.end(), [&](const GradedRule& r) { return same(r.length_hours); });
    if (rule_it == rules.end()) rule_it = rules.insert(rules.end(), graded_rule(length, fastest));
    const GradedRule& rule = *rule_it;
    const auto nodes = static_cast<Eigen::Index>(rule.offsets_hours.size());
    for (auto& m : at) m.resize(nodes, cols);  // no allocation when the size is unchanged
    for (std::size_t i = 0; i < groups; ++i) {
      if (traces[i].averaged) {  // a group tested too often to resolve: its average over the segment
        for (std::size_t w = 0; w < 3; ++w)
          at[w]
              .col(static_cast<Eigen::Index>(i))
              .setConstant(traces[i].segment_integrals[k](static_cast<Eigen::Index>(w)) / length);
        continue;
      }
      const ChannelMask m = traces[i].bypassed[k];
      auto& cache = columns[i];
      auto it = std::find_if(cache.begin(), cache.end(), [&](const std::shared_ptr<const NodeColumns>& c) {
        return c->bypassed == m && same(c->length_hours);
      });
      if (it == cache.end()) it = cache.insert(cache.end(), shared_node_columns(chains[i], m, rule));
      const Eigen::VectorXd& p = traces[i].state_after[k];
      for (std::size_t w = 0; w < 3; ++w)
        at[w].col(static_cast<Eigen::Index>(i)).noalias() = (*it)->of[w].transpose() * p;
    }
    for (Eigen::Index j = 0; j < nodes; ++j) {
      // prod_{l != i}(1 - u_l) from prefix and suffix products, without dividing.
      prefix[0] = suffix[groups] = 1.0;
      for (std::size_t i = 0; i < groups; ++i)
        prefix[i + 1] = prefix[i] * (1.0 - at[0](j, static_cast<Eigen::Index>(i)));
      for (std::size_t i = groups; i-- > 0;) suffix[i] = suffix[i + 1] * (1.0 - at[0](j, static_cast<Eigen::Index>(i)));
      const double weight = rule.weights_hours[static_cast<std::size_t>(j)];
      out.pfd += weight * (at[0].row(j).sum() - (1.0 - prefix[groups]));
      for (std::size_t i = 0; i < groups; ++i) {
        const double others_down = 1.0 - prefix[i] * suffix[i + 1];
        out.frequency += weight * at[1](j, static_cast<Eigen::Index>(i)) * others_down;
        out.undetected_frequency += weight * at[2](j, static_cast<Eigen::Index>(i)) * others_down;
      }
    }
  }
  return out;
}

std::vector<double> pfd_sif(const std::vector<const std::vector<double>*>& group_values) {
  std::vector<double> out(group_values.front()->size());
  for (std::size_t p = 0; p < out.size(); ++p) {
    double works = 1.0;
    for (const auto* v : group_values) works *= 1.0 - (*v)[p];
    out[p] = 1.0 - works;
  }
  return out;
}

// The curves of every group and of the SIF on one grid; `acts` marks instants where any acts.
void fill_curves(SifExactResult& r, const std::vector<double>& grid, const std::vector<GroupTrace>& traces,
                 const std::vector<std::vector<std::vector<detail::Action>>>& actions) {
  std::vector<bool> acts(grid.size(), false);
  for (const auto& a : actions)
    for (std::size_t i = 0; i < grid.size(); ++i) acts[i] = acts[i] || !a[i].empty();
  std::vector<const std::vector<double>*> before;
  std::vector<const std::vector<double>*> after;
  for (std::size_t i = 0; i < traces.size(); ++i) {
    r.groups[i].curve = detail::curve_on_grid(grid, acts, traces[i].pfd_before, traces[i].pfd_after);
    before.push_back(&traces[i].pfd_before);
    after.push_back(&traces[i].pfd_after);
  }
  r.curve = detail::curve_on_grid(grid, acts, pfd_sif(before), pfd_sif(after));
}

// The mission every subsystem shares; refuses a group the exact engine cannot model.
double shared_mission(const std::vector<ExactGroupInput>& groups) {
  if (groups.empty()) throw std::invalid_argument("exact engine: a SIF needs at least one subsystem");
  const double mission = groups.front().mission_time.hours;
  for (std::size_t i = 0; i < groups.size(); ++i) {
    if (auto why = exact_group_unsupported(groups[i]); !why.empty())
      throw std::invalid_argument("subsystem " + std::to_string(i) + ": " + why);
    if (std::fabs(groups[i].mission_time.hours - mission) > 1e-9 * mission)
      throw std::invalid_argument("exact engine: the subsystems of a SIF must share one mission time");
  }
  return mission;
}

// The groups' chains and how each is tested: stepped through its timeline, or composed by whole
// test cycles when it is tested more than kMaxSteppedInstants times.
struct SifModel {
  double mission = 0.0;
  std::vector<GroupChain> chains;
  std::vector<std::vector<detail::TimedAction>> timelines;  // empty for the groups composed by cycles
  std::vector<detail::CyclePattern> patterns;               // valid only for the groups composed by cycles
  std::vector<double> times;                                // the instants the common grid must hold
};

SifModel sif_model(const std::vector<ExactGroupInput>& groups) {
  SifModel model;
  model.mission = shared_mission(groups);
  bool compressed = false;
  for (const auto& g : groups) {
    model.chains.emplace_back(g);
    model.patterns.emplace_back();
    if (detail::timeline_instants(g, model.chains.back()) > detail::kMaxSteppedInstants) {
      model.patterns.back() = detail::cycle_pattern(g, model.chains.back());
      if (!model.patterns.back().valid)
        throw std::invalid_argument(
            "exact engine: a partial stroke interval that neither divides the proof-test "
            "interval nor is a whole multiple of it allows at most 20000 tests");
      compressed = true;
      model.timelines.emplace_back();
      continue;
    }
    model.timelines.push_back(detail::group_timeline(g, model.chains.back()));
    for (const auto& ta : model.timelines.back()) model.times.push_back(ta.time_hours);
  }
  // Groups tested more than kMaxSteppedInstants times are composed by whole cycles on a grid of
  // the other groups' instants and kCompressedSamples even samples (README "Limits").
  if (compressed)
    for (int j = 0; j < detail::kCompressedSamples; ++j)
      model.times.push_back(model.mission * j / (detail::kCompressedSamples - 1));
  return model;
}

using GridActions = std::vector<std::vector<std::vector<detail::Action>>>;

// Every group propagated over the grid; `actions` gets each group's actions at each grid point.
std::vector<GroupTrace> run_on_grid(const SifModel& model, const std::vector<double>& grid, bool keep_states,
                                    GridActions& actions) {
  std::vector<GroupTrace> traces;
  for (std::size_t i = 0; i < model.chains.size(); ++i) {
    if (model.patterns[i].valid) {
      actions.emplace_back();
      traces.push_back(detail::propagate_cycles(model.chains[i], model.patterns[i], model.mission, grid, keep_states,
                                                actions.back()));
      continue;
    }
    actions.push_back(detail::actions_on_grid(model.timelines[i], grid));
    traces.push_back(detail::propagate(model.chains[i], grid, actions.back(), keep_states));
  }
  return traces;
}

// One group's averages over the mission, and the notes on how it was modelled.
ExactGroupResult group_result(const ExactGroupInput& group, const SifModel& model, std::size_t i,
                              const GroupTrace& trace, bool several) {
  const double mission = model.mission;
  ExactGroupResult g;
  g.pfd_avg = trace.pfd_integral_hours / mission;
  g.failure_frequency_per_hour = trace.expected_failures / mission;
  g.undetected_failure_frequency_per_hour = trace.expected_undetected_failures / mission;
  g.states = model.chains[i].size();
  g.per_channel = model.chains[i].per_channel();
  g.notes = detail::group_notes(group, model.chains[i]);
  if (model.patterns[i].valid)
    g.notes.push_back(
        "tested about " + std::to_string(std::llround(detail::timeline_instants(group, model.chains[i]))) +
        " times over the mission: whole test cycles composed by repeated squaring; its curve "
        "sampled at " +
        std::to_string(detail::kCompressedSamples) + " instants" +
        (several ? ", and its terms with the other subsystems taken at its average between them" : std::string()));
  return g;
}

// The SIF's averages: the groups' sums less the terms of two or more groups failed together.
SifExactResult sif_averages(const std::vector<ExactGroupInput>& groups, const SifModel& model,
                            const std::vector<GroupTrace>& traces, const std::vector<double>& grid) {
  SifExactResult r;
  for (std::size_t i = 0; i < groups.size(); ++i) {
    ExactGroupResult g = group_result(groups[i], model, i, traces[i], groups.size() > 1);
    r.pfd_avg += g.pfd_avg;
    r.failure_frequency_per_hour += g.failure_frequency_per_hour;
    r.undetected_failure_frequency_per_hour += g.undetected_failure_frequency_per_hour;
    r.groups.push_back(std::move(g));
  }
  if (groups.size() > 1) {
    const auto cross = cross_terms(model.chains, traces, grid);
    r.pfd_avg -= cross.pfd / model.mission;
    r.failure_frequency_per_hour -= cross.frequency / model.mission;
    r.undetected_failure_frequency_per_hour -= cross.undetected_frequency / model.mission;
  }
  return r;
}

SifExactResult evaluate(const std::vector<ExactGroupInput>& groups, int points) {
  SifModel model = sif_model(groups);
  const auto grid = detail::merge_grid(model.times, model.mission);
  GridActions actions;
  const auto traces = run_on_grid(model, grid, groups.size() > 1, actions);
  SifExactResult r = sif_averages(groups, model, traces, grid);
  if (points <= 0) {
    fill_curves(r, grid, traces, actions);
    return r;
  }
  // The curve on a finer grid: `points` even samples added to the test instants.
  points = std::max(points, 2);
  for (int j = 0; j < points; ++j) model.times.push_back(model.mission * j / (points - 1));
  const auto plot_grid = detail::merge_grid(std::move(model.times), model.mission);
  GridActions plot_actions;
  fill_curves(r, plot_grid, run_on_grid(model, plot_grid, false, plot_actions), plot_actions);
  return r;
}

}  // namespace

SifExactResult sif_exact(const std::vector<ExactGroupInput>& groups) { return evaluate(groups, 0); }

SifExactResult sif_curve(const std::vector<ExactGroupInput>& groups, int points) { return evaluate(groups, points); }

}  // namespace sifter
