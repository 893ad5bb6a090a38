// The Markov chain of one voting group and its timeline of tests (exact engine).
#include "engines/markov_chain.hpp"

#include <algorithm>
#include <cassert>
#include <cmath>
#include <deque>

namespace sifter::detail {
namespace {

bool same_rates(const FailureRates& a, const FailureRates& b) {
  return a.lambda_du.per_hour == b.lambda_du.per_hour && a.lambda_dd.per_hour == b.lambda_dd.per_hour;
}

const FailureRates& channel_rates(const ExactGroupInput& in, int j) {
  return in.channels.size() == 1 ? in.channels[0] : in.channels[static_cast<std::size_t>(j)];
}

bool identical_channels(const ExactGroupInput& in) {
  return std::all_of(in.channels.begin(), in.channels.end(),
                     [&](const FailureRates& r) { return same_rates(r, in.channels[0]); });
}

constexpr double kSameInstant = kSameInstantShare;

}  // namespace

bool tracks_each_channel(const ExactGroupInput& in) {
  const bool bypass = in.test_duration && in.test_duration->hours > 0.0;
  return in.track_each_channel || !identical_channels(in) || in.staggered || bypass;
}

GroupChain::GroupChain(const ExactGroupInput& in) : k_(in.vote.k), n_(in.vote.n) {
  assert(n_ >= 1 && n_ <= kMaxChannels && k_ >= 1 && k_ <= n_);
  per_channel_ = tracks_each_channel(in);
  assert(!per_channel_ || n_ <= kMaxChannelsTracked);

  // How lambda_du splits over the tests that reveal it; the proof test covers at least what
  // the partial stroke covers.
  const bool pst = in.partial_stroke && in.partial_stroke->interval.hours > 0.0 && in.partial_stroke->coverage > 0.0;
  share_pst_ = pst ? in.partial_stroke->coverage : 0.0;
  const double proof_cover = std::max(in.proof_test_coverage, share_pst_);
  const double share_proof = proof_cover - share_pst_;
  const double share_never = 1.0 - proof_cover;

  restore_per_hour_ = in.mttr.hours > 0.0 ? 1.0 / in.mttr.hours : 0.0;
  repair_per_hour_ = in.mrt.hours > 0.0 ? 1.0 / in.mrt.hours : 0.0;
  // A channel in repair after a test and one being restored after a detected failure behave
  // alike when MRT = MTTR: they share one state, which halves the chain of a 2oo3 (exact).
  revealed_to_ = repair_per_hour_ <= 0.0 ? kWorking : repair_per_hour_ == restore_per_hour_ ? kDetected : kRepair;

  // Common cause: a shock at beta times the smallest channel rate; none when K = N.
  const bool redundant = k_ < n_;
  double min_du = channel_rates(in, 0).lambda_du.per_hour;
  double min_dd = channel_rates(in, 0).lambda_dd.per_hour;
  for (int j = 1; j < n_; ++j) {
    min_du = std::min(min_du, channel_rates(in, j).lambda_du.per_hour);
    min_dd = std::min(min_dd, channel_rates(in, j).lambda_dd.per_hour);
  }
  const double shock_du = redundant ? in.beta * min_du : 0.0;
  const double shock_dd = redundant && restore_per_hour_ > 0.0 ? in.beta_d * min_dd : 0.0;
  shock_ = {shock_du * share_pst_, shock_du * share_proof, shock_du * share_never, shock_dd};

  const int distinct = per_channel_ ? n_ : 1;
  for (int j = 0; j < distinct; ++j) {
    const auto& r = channel_rates(in, j);
    const double du = r.lambda_du.per_hour - shock_du;
    // With MTTR = 0 a detected failure is restored at once and never counts.
    const double dd = restore_per_hour_ > 0.0 ? r.lambda_dd.per_hour - shock_dd : 0.0;
    rates_.push_back({du * share_pst_, du * share_proof, du * share_never, dd});
  }
  build();
}

// With counts, a configuration is kept sorted: channels are interchangeable. (Insertion
// sort: at most 8 entries, and std::sort trips GCC 12's -Warray-bounds on a short array.)
void GroupChain::canonical(Config& c) const {
  if (per_channel_) return;
  for (int i = 1; i < width(); ++i)
    for (int j = i; j > 0 && c[static_cast<std::size_t>(j - 1)] > c[static_cast<std::size_t>(j)]; --j)
      std::swap(c[static_cast<std::size_t>(j - 1)], c[static_cast<std::size_t>(j)]);
}

std::uint32_t GroupChain::key(Config c) const {
  std::uint32_t k = 0;
  for (int j = 0; j < width(); ++j) k = k * 8u + c[static_cast<std::size_t>(j)];
  return k;
}

int GroupChain::index_of(Config c) const {
  const std::uint32_t k = key(c);
  if (!flat_index_.empty()) return flat_index_[k];
  const auto it = index_.find(k);
  assert(it != index_.end());
  return it->second;
}

GroupChain::Config GroupChain::reveal(Config c, ChannelMask tested, bool pst_only) const {
  for (int j = 0; j < width(); ++j) {
    if (per_channel_ && !(tested & (1u << j))) continue;
    auto& s = c[static_cast<std::size_t>(j)];
    if (s == kHiddenPst || (!pst_only && s == kHiddenProof)) s = revealed_to_;
  }
  canonical(c);
  return c;
}

// Calls visit(target, rate, undetected) for every transition out of configuration c, flagging
// the failures that are not detected. With counts, the loop over equal channels adds up their
// rates, which is the aggregation.
template <typename Visit>
void GroupChain::for_each_transition(const Config& c, Visit&& visit) const {
  auto emit = [&](Config t, double rate, bool undetected) {
    if (rate <= 0.0) return;
    canonical(t);
    visit(t, rate, undetected);
  };
  for (int j = 0; j < width(); ++j) {
    const auto uj = static_cast<std::size_t>(j);
    const auto& r = rates_[per_channel_ ? uj : 0];
    auto moved = [&](std::uint8_t to) {
      Config t = c;
      t[uj] = to;
      return t;
    };
    const std::uint8_t s = c[uj];
    if (s == kWorking) {
      emit(moved(kHiddenPst), r.to_pst, true);
      emit(moved(kHiddenProof), r.to_proof, true);
      emit(moved(kDetected), r.to_detected, false);
    }
    // Failures never revealed are a mode of their own: they strike failed channels too.
    if (s != kHiddenNever) emit(moved(kHiddenNever), r.to_never, true);
    if (s == kDetected) emit(moved(kWorking), restore_per_hour_, false);
    if (s == kRepair) emit(moved(kWorking), repair_per_hour_, false);
  }
  auto shock = [&](std::uint8_t to, double rate) {
    if (rate <= 0.0) return;
    Config t = c;
    for (int j = 0; j < width(); ++j) {
      auto& s = t[static_cast<std::size_t>(j)];
      if (to == kHiddenNever ? s != kHiddenNever : s == kWorking) s = to;
    }
    if (t != c) emit(t, rate, to != kDetected);
  };
  shock(kHiddenPst, shock_.to_pst);
  shock(kHiddenProof, shock_.to_proof);
  shock(kHiddenNever, shock_.to_never);
  shock(kDetected, shock_.to_detected);
}

// Breadth-first from "all working" over the transitions and the test jumps, so that only
// reachable states are kept; the generator is filled on the way.
void GroupChain::build() {
  std::vector<Transition> entries;
  std::deque<int> queue;
  // Up to four channels a flat table of all 8^N keys is faster than hashing.
  if (n_ <= kMaxChannelsTracked) flat_index_.assign(std::size_t{1} << (3 * n_), -1);
  auto add = [&](const Config& c) {
    const std::uint32_t k = key(c);
    int at = static_cast<int>(states_.size());
    if (!flat_index_.empty()) {
      if (flat_index_[k] >= 0) return flat_index_[k];
      flat_index_[k] = at;
    } else {
      const auto [it, inserted] = index_.emplace(k, at);
      if (!inserted) return it->second;
    }
    states_.push_back(c);
    queue.push_back(at);
    return at;
  };
  add(Config{});
  while (!queue.empty()) {
    const int i = queue.front();
    queue.pop_front();
    const Config c = states_[static_cast<std::size_t>(i)];
    for_each_transition(c, [&](const Config& t, double rate, bool undetected) {
      const int to = add(t);
      entries.push_back({i, to, rate});
      if (undetected) undetected_.push_back({i, to, rate});
    });
    if (per_channel_) {
      for (int j = 0; j < width(); ++j) add(reveal(c, 1u << j, false));
    } else {
      add(reveal(c, all_channels(n_), false));
    }
    if (share_pst_ > 0.0) add(reveal(c, all_channels(n_), true));
  }
  const int n = size();
  q_ = Eigen::MatrixXd::Zero(n, n);
  for (const auto& e : entries) {
    q_(e.from, e.to) += e.rate;
    q_(e.from, e.from) -= e.rate;
  }
}

Eigen::VectorXd GroupChain::failed(ChannelMask bypassed) const {
  assert(per_channel_ || bypassed == 0);
  Eigen::VectorXd f(size());
  for (int i = 0; i < size(); ++i) {
    const auto& c = states_[static_cast<std::size_t>(i)];
    int available = 0;
    for (int j = 0; j < width(); ++j)
      available += c[static_cast<std::size_t>(j)] == kWorking && !(bypassed & (1u << j));
    f(i) = available < k_ ? 1.0 : 0.0;
  }
  return f;
}

Eigen::VectorXd GroupChain::entering(ChannelMask bypassed) const {
  const Eigen::VectorXd f = failed(bypassed);
  return ((q_ * f).array() * (1.0 - f.array())).matrix();
}

Eigen::VectorXd GroupChain::entering_undetected(ChannelMask bypassed) const {
  const Eigen::VectorXd f = failed(bypassed);
  Eigen::VectorXd g = Eigen::VectorXd::Zero(size());
  for (const auto& t : undetected_)
    if (f(t.from) == 0.0 && f(t.to) == 1.0) g(t.from) += t.rate;
  return g;
}

Jump GroupChain::proof_test(ChannelMask tested) const {
  Jump jump(states_.size());
  for (int i = 0; i < size(); ++i)
    jump[static_cast<std::size_t>(i)] = index_of(reveal(states_[static_cast<std::size_t>(i)], tested, false));
  return jump;
}

Jump GroupChain::partial_stroke() const {
  Jump jump(states_.size());
  for (int i = 0; i < size(); ++i)
    jump[static_cast<std::size_t>(i)] = index_of(reveal(states_[static_cast<std::size_t>(i)], all_channels(n_), true));
  return jump;
}

double GroupChain::fastest_rate_per_hour() const { return 2.0 * (-q_.diagonal()).maxCoeff(); }

std::vector<TimedAction> group_timeline(const ExactGroupInput& in, const GroupChain& chain) {
  const double mission = in.mission_time.hours;
  const double t1 = in.proof_test_interval.hours;
  const double tau = in.test_duration ? in.test_duration->hours : 0.0;
  const int n = chain.channels();
  std::vector<TimedAction> out;
  auto within = [&](double t) { return t > 0.0 && t < mission * (1.0 - kSameInstant); };
  if (chain.per_channel()) {
    for (int j = 0; j < n; ++j) {
      const ChannelMask bit = 1u << j;
      // Staggered: channel j at j T1/N + k T1; otherwise one after another from each k T1.
      const double offset = in.staggered ? j * t1 / n : j * tau;
      for (int k = in.staggered ? 0 : 1;; ++k) {
        const double s = offset + k * t1;
        if (s >= mission) break;
        if (!within(s)) continue;
        if (tau > 0.0) {
          out.push_back({s, {Action::kBypassStart, bit}});
          if (within(s + tau)) out.push_back({s + tau, {Action::kBypassEnd, bit}});
        } else {
          out.push_back({s, {Action::kProofTest, bit}});
        }
      }
    }
  } else {
    for (int k = 1; k * t1 < mission; ++k)
      if (within(k * t1)) out.push_back({k * t1, {Action::kProofTest, GroupChain::all_channels(n)}});
  }
  if (chain.has_partial_stroke()) {
    const double tp = in.partial_stroke->interval.hours;
    for (int k = 1; k * tp < mission; ++k)
      if (within(k * tp)) out.push_back({k * tp, {Action::kPartialStroke, GroupChain::all_channels(n)}});
  }
  std::stable_sort(out.begin(), out.end(),
                   [](const TimedAction& a, const TimedAction& b) { return a.time_hours < b.time_hours; });
  return out;
}

CyclePattern cycle_pattern(const ExactGroupInput& in, const GroupChain& chain) {
  CyclePattern out;
  const double t1 = in.proof_test_interval.hours;
  double period = t1;
  if (chain.has_partial_stroke()) {
    const double tp = in.partial_stroke->interval.hours;
    auto whole = [](double x) { return x >= 1.0 - 1e-9 && std::fabs(x - std::round(x)) <= 1e-9 * x; };
    if (whole(tp / t1))
      period = tp;
    else if (!whole(t1 / tp))
      return out;
  }
  // The timeline of three periods: cycle 0, then cycle 1 as the pattern of every later one.
  ExactGroupInput three = in;
  three.mission_time = Duration{3.0 * period};
  const double tol = kSameInstant * period;
  for (const auto& ta : group_timeline(three, chain)) {
    if (ta.time_hours < period - tol) {
      out.head.push_back(ta);
    } else if (ta.time_hours < 2.0 * period - tol) {
      TimedAction shifted = ta;
      shifted.time_hours = std::max(0.0, ta.time_hours - period);
      out.cycle.push_back(shifted);
    }
  }
  auto closed = [](const std::vector<TimedAction>& part) {
    ChannelMask bypassed = 0;
    for (const auto& ta : part) {
      if (ta.action.kind == Action::kBypassStart) bypassed |= ta.action.channels;
      if (ta.action.kind == Action::kBypassEnd) bypassed &= ~ta.action.channels;
    }
    return bypassed == 0;
  };
  if (!closed(out.head) || !closed(out.cycle)) return out;
  out.period_hours = period;
  out.valid = true;
  return out;
}

double timeline_instants(const ExactGroupInput& in, const GroupChain& chain) {
  const double mission = in.mission_time.hours;
  const double t1 = in.proof_test_interval.hours;
  const bool bypass = in.test_duration && in.test_duration->hours > 0.0;
  const double per_test = chain.per_channel() ? chain.channels() * (bypass ? 2.0 : 1.0) : 1.0;
  double count = mission / t1 * per_test;
  if (chain.has_partial_stroke()) count += mission / in.partial_stroke->interval.hours;
  return count;
}

std::vector<double> merge_grid(std::vector<double> times, double mission_hours) {
  const double tol = kSameInstant * mission_hours;
  times.push_back(0.0);
  times.push_back(mission_hours);
  std::sort(times.begin(), times.end());
  std::vector<double> grid;
  for (double t : times) {
    if (t < 0.0 || t > mission_hours) continue;
    if (!grid.empty() && t - grid.back() <= tol) continue;
    grid.push_back(t);
  }
  // The mission end is kept exactly, even where a nearby time came first.
  if (mission_hours - grid.back() <= tol) grid.back() = mission_hours;
  return grid;
}

std::vector<std::vector<Action>> actions_on_grid(const std::vector<TimedAction>& timeline,
                                                 const std::vector<double>& grid) {
  const double tol = kSameInstant * grid.back();
  std::vector<std::vector<Action>> out(grid.size());
  for (const auto& ta : timeline) {
    const auto it = std::lower_bound(grid.begin(), grid.end(), ta.time_hours - tol);
    assert(it != grid.end() && std::fabs(*it - ta.time_hours) <= tol);
    out[static_cast<std::size_t>(it - grid.begin())].push_back(ta.action);
  }
  return out;
}

}  // namespace sifter::detail
