// Exact engine, one group: propagation by matrix exponentials, Van Loan's integrals, the API.
#include "sifter/engines/markov.hpp"

#include <algorithm>
#include <cmath>
#include <deque>
#include <limits>
#include <stdexcept>
#include <unsupported/Eigen/MatrixFunctions>

#include "engines/exact_memo.hpp"
#include "engines/markov_chain.hpp"
#include "sifter/engines/simplified.hpp"

namespace sifter {
namespace detail {
namespace {

constexpr int kColumns = 3;

// Segments whose lengths differ by less than this share reuse one exponential.
constexpr double kSameLength = 1e-10;

// exp([[Q, F], [0, 0]] L) = [[exp(Q L), int_0^L exp(Q s) ds F], [0, I]] (Van Loan 1978), with
// F = [f, g, g_u]: one exponential gives the step and every integral of the segment.
struct Segment {
  ChannelMask bypassed = 0;
  double length_hours = 0.0;
  Eigen::MatrixXd step_transposed;  // exp(Q L)^T, to step a column state
  Eigen::MatrixXd integrals;        // int_0^L exp(Q s) ds [f, g, g_u]
};

class Stepper {
 public:
  explicit Stepper(const GroupChain& chain) : chain_(chain) {}

  double pfd(ChannelMask m, const Eigen::VectorXd& p) { return p.dot(indicators(m).col(0)); }

  const Segment& segment(ChannelMask m, double length) {
    for (const auto& s : segments_)
      if (s.bypassed == m && std::fabs(s.length_hours - length) <= kSameLength * length) return s;
    const int n = chain_.size();
    const auto& f = indicators(m);
    // The integral columns are scaled down by a power of two so that they do not raise the
    // norm, and with it the number of squarings; the scale is undone exactly afterwards.
    const double scale = std::ldexp(1.0, -std::ilogb(length * n) - 1);
    Eigen::MatrixXd block = Eigen::MatrixXd::Zero(n + kColumns, n + kColumns);
    block.topLeftCorner(n, n) = chain_.generator() * length;
    block.topRightCorner(n, kColumns) = f * (length * scale);
    const auto shared = memo_exp(block);  // the same segment recurs across the SIFs of a register
    const Eigen::MatrixXd& e = *shared;
    segments_.push_back({m, length, e.topLeftCorner(n, n).transpose(), e.topRightCorner(n, kColumns) / scale});
    return segments_.back();
  }

  const Jump& jump(const Action& a) {
    for (const auto& [key, j] : jumps_)
      if (key.kind == a.kind && key.channels == a.channels) return j;
    jumps_.emplace_back(a, a.kind == Action::kPartialStroke ? chain_.partial_stroke() : chain_.proof_test(a.channels));
    return jumps_.back().second;
  }

 private:
  // [f, g, g_u]: failed states, rate of entering them, the part due to undetected failures.
  const Eigen::Matrix<double, Eigen::Dynamic, kColumns>& indicators(ChannelMask m) {
    for (const auto& [mask, fg] : indicators_)
      if (mask == m) return fg;
    Eigen::Matrix<double, Eigen::Dynamic, kColumns> fg(chain_.size(), kColumns);
    fg << chain_.failed(m), chain_.entering(m), chain_.entering_undetected(m);
    indicators_.emplace_back(m, std::move(fg));
    return indicators_.back().second;
  }

  const GroupChain& chain_;
  std::deque<Segment> segments_;  // deque: references stay valid as it grows
  std::deque<std::pair<Action, Jump>> jumps_;
  std::deque<std::pair<ChannelMask, Eigen::Matrix<double, Eigen::Dynamic, kColumns>>> indicators_;
};

void apply(const Jump& jump, Eigen::VectorXd& p, Eigen::VectorXd& scratch) {
  scratch.setZero(p.size());
  for (Eigen::Index i = 0; i < p.size(); ++i) scratch(jump[static_cast<std::size_t>(i)]) += p(i);
  p.swap(scratch);
}

}  // namespace

GroupTrace propagate(const GroupChain& chain, const std::vector<double>& grid,
                     const std::vector<std::vector<Action>>& actions, bool keep_states) {
  Stepper stepper(chain);
  GroupTrace trace;
  const std::size_t count = grid.size();
  trace.pfd_before.resize(count);
  trace.pfd_after.resize(count);
  trace.bypassed.resize(count);
  if (keep_states) trace.state_after.resize(count);
  Eigen::VectorXd p = Eigen::VectorXd::Zero(chain.size());
  p(0) = 1.0;  // state 0: every channel working
  Eigen::VectorXd scratch;
  ChannelMask bypassed = 0;
  for (std::size_t i = 0; i < count; ++i) {
    trace.pfd_before[i] = stepper.pfd(bypassed, p);
    for (const auto& a : actions[i]) {
      if (a.kind == Action::kBypassStart) {
        bypassed |= a.channels;
        continue;
      }
      apply(stepper.jump(a), p, scratch);
      if (a.kind == Action::kBypassEnd) bypassed &= ~a.channels;
    }
    trace.pfd_after[i] = stepper.pfd(bypassed, p);
    trace.bypassed[i] = bypassed;
    if (keep_states) trace.state_after[i] = p;
    if (i + 1 == count) break;
    const auto& s = stepper.segment(bypassed, grid[i + 1] - grid[i]);
    const Eigen::RowVector3d integrals = p.transpose() * s.integrals;
    trace.pfd_integral_hours += integrals(0);
    trace.expected_failures += integrals(1);
    trace.expected_undetected_failures += integrals(2);
    scratch.noalias() = s.step_transposed * p;
    p.swap(scratch);
  }
  return trace;
}

namespace {

// The instants of a cycle: offsets (or times) with every action there, nearly equal ones merged.
struct Instant {
  double time_hours = 0.0;
  std::vector<Action> actions;
};

std::vector<Instant> instants_of(const std::vector<TimedAction>& timed, double tol) {
  std::vector<Instant> out;
  for (const auto& ta : timed) {
    if (out.empty() || ta.time_hours - out.back().time_hours > tol) out.push_back({ta.time_hours, {}});
    out.back().actions.push_back(ta.action);
  }
  return out;
}

// One cycle [c P, (c+1) P) as a linear map of the row state p at c P (before the actions
// there): p -> p M, and the integrals over the cycle p J. Over r cycles the augmented matrix
// A = [[M, J], [0, I]] gives A^r = [[M^r, (sum_{j<r} M^j) J], [0, I]]: the state after r
// cycles and the integrals over all of them, by repeated squaring of A.
class CycleOperator {
 public:
  CycleOperator(Stepper& stepper, int states, const std::vector<Instant>& cycle, double period) : n_(states) {
    Eigen::MatrixXd x = Eigen::MatrixXd::Identity(n_, n_);  // row i: the distribution from state i
    Eigen::MatrixXd j = Eigen::MatrixXd::Zero(n_, kColumns);
    Eigen::MatrixXd scratch;
    ChannelMask bypassed = 0;
    double t = 0.0;
    auto advance = [&](double to) {
      if (to <= t) return;
      const auto& s = stepper.segment(bypassed, to - t);
      j.noalias() += x * s.integrals;
      scratch.noalias() = x * s.step_transposed.transpose();
      x.swap(scratch);
      t = to;
    };
    for (const auto& instant : cycle) {
      advance(instant.time_hours);
      for (const auto& a : instant.actions) {
        if (a.kind == Action::kBypassStart) {
          bypassed |= a.channels;
          continue;
        }
        const Jump& jump = stepper.jump(a);
        scratch.setZero(n_, n_);
        for (int i = 0; i < n_; ++i) scratch.col(jump[static_cast<std::size_t>(i)]) += x.col(i);
        x.swap(scratch);
        if (a.kind == Action::kBypassEnd) bypassed &= ~a.channels;
      }
    }
    advance(period);
    Eigen::MatrixXd a = Eigen::MatrixXd::Identity(n_ + kColumns, n_ + kColumns);
    a.topLeftCorner(n_, n_) = x;
    a.topRightCorner(n_, kColumns) = j;
    squares_.push_back(std::move(a));
  }

  // [p, integrals] after r more cycles: one vector-matrix product per bit of r.
  void apply(long long r, Eigen::RowVectorXd& row) {
    Eigen::RowVectorXd scratch;
    for (std::size_t bit = 0; r > 0; ++bit, r >>= 1) {
      while (squares_.size() <= bit) squares_.push_back(squares_.back() * squares_.back());
      if (r & 1) {
        scratch.noalias() = row * squares_[bit];
        row.swap(scratch);
      }
    }
  }

 private:
  int n_;
  std::vector<Eigen::MatrixXd> squares_;  // A^(2^i)
};

// The test instants of a group in time order: the head's, then those of cycle c at c P plus
// their offset; none from `last` on (no test at the mission's end).
class TestSchedule {
 public:
  TestSchedule(const CyclePattern& pattern, double tol, double last)
      : period_(pattern.period_hours),
        last_(last),
        head_(instants_of(pattern.head, tol)),
        cycle_(instants_of(pattern.cycle, tol)) {
    settle();
  }

  const std::vector<Instant>& cycle() const { return cycle_; }
  double cycle_start() const { return static_cast<double>(c_) * period_; }

  // The time of the next instant not yet applied (infinity when none is left).
  double next_time() const {
    if (c_ == 0 && index_ < head_.size())
      return head_[index_].time_hours < last_ ? head_[index_].time_hours : std::numeric_limits<double>::infinity();
    if (c_ == 0 || cycle_.empty()) return std::numeric_limits<double>::infinity();
    const double t = cycle_start() + cycle_[index_].time_hours;
    return t < last_ ? t : std::numeric_limits<double>::infinity();
  }

  const std::vector<Action>& next_actions() const { return c_ == 0 ? head_[index_].actions : cycle_[index_].actions; }

  void advance() {
    ++index_;
    settle();
  }

  // How many whole cycles c .. c+r-1 end at or before `limit`, when the schedule stands at
  // the start of cycle c and the state has not passed it (0 or less otherwise).
  long long whole_cycles_before(double limit, double now) const {
    if (c_ < 1 || index_ != 0 || now > cycle_start()) return 0;
    long long r = static_cast<long long>(std::floor(limit / period_)) - c_;
    while (r > 0 && static_cast<double>(c_ + r) * period_ > limit) --r;
    return r;
  }

  void skip_cycles(long long r) { c_ += r; }

 private:
  // Moves past a finished head or cycle to the next cycle's first instant.
  void settle() {
    while (c_ == 0 ? index_ >= head_.size() : index_ >= cycle_.size()) {
      ++c_;
      index_ = 0;
      if (cycle_.empty()) break;
    }
  }

  double period_;
  double last_;
  std::vector<Instant> head_;
  std::vector<Instant> cycle_;
  long long c_ = 0;        // the cycle of the next instant (0: the head)
  std::size_t index_ = 0;  // the next instant within it
};

// The group's state as a row [p, integrals since the last grid point], stepped through time.
class RowPropagation {
 public:
  RowPropagation(Stepper& stepper, int states)
      : stepper_(stepper), n_(states), row_(Eigen::RowVectorXd::Zero(states + kColumns)) {
    row_(0) = 1.0;  // state 0: every channel working
  }

  double now() const { return now_; }
  ChannelMask bypassed() const { return bypassed_; }
  Eigen::VectorXd state() const { return row_.head(n_).transpose(); }
  double pfd() { return stepper_.pfd(bypassed_, state()); }

  void step_to(double to) {
    if (to <= now_) return;
    const auto& s = stepper_.segment(bypassed_, to - now_);
    p_ = row_.head(n_).transpose();
    row_.tail(kColumns) += p_.transpose() * s.integrals;
    row_.head(n_) = (s.step_transposed * p_).transpose();
    now_ = to;
  }

  // The actions of one instant, each recorded in `record` when given.
  void act(const std::vector<Action>& list, std::vector<Action>* record) {
    p_ = row_.head(n_).transpose();
    for (const auto& a : list) {
      if (record) record->push_back(a);
      if (a.kind == Action::kBypassStart) {
        bypassed_ |= a.channels;
        continue;
      }
      apply(stepper_.jump(a), p_, scratch_);
      if (a.kind == Action::kBypassEnd) bypassed_ &= ~a.channels;
    }
    row_.head(n_) = p_.transpose();
  }

  // r whole cycles at once, ending at `end`.
  void run_cycles(CycleOperator& cycles, long long r, double end) {
    cycles.apply(r, row_);
    now_ = end;
  }

  // The integrals [PFD, failures, undetected failures] since the last call, then zero.
  Eigen::RowVector3d take_integrals() {
    const Eigen::RowVector3d integrals = row_.tail(kColumns);
    row_.tail(kColumns).setZero();
    return integrals;
  }

 private:
  Stepper& stepper_;
  int n_;
  Eigen::RowVectorXd row_;
  Eigen::VectorXd p_;
  Eigen::VectorXd scratch_;
  ChannelMask bypassed_ = 0;
  double now_ = 0.0;
};

// Applies every test instant before `until` less the tolerance, whole cycles at once where they fit.
void apply_instants_before(double until, double tol, TestSchedule& schedule, CycleOperator& cycles,
                           RowPropagation& state) {
  for (;;) {
    const double t = schedule.next_time();
    if (t >= until - tol) return;
    if (const long long r = schedule.whole_cycles_before(until - tol, state.now()); r > 0) {
      state.step_to(schedule.cycle_start());
      schedule.skip_cycles(r);
      state.run_cycles(cycles, r, schedule.cycle_start());
      continue;
    }
    state.step_to(t);
    state.act(schedule.next_actions(), nullptr);
    schedule.advance();
  }
}

GroupTrace averaged_trace(std::size_t count, bool keep_states) {
  GroupTrace trace;
  trace.averaged = true;
  trace.pfd_before.resize(count);
  trace.pfd_after.resize(count);
  trace.bypassed.resize(count);
  trace.segment_integrals.assign(count > 0 ? count - 1 : 0, Eigen::RowVector3d::Zero());
  if (keep_states) trace.state_after.resize(count);
  return trace;
}

void add_segment(GroupTrace& trace, std::size_t segment, const Eigen::RowVector3d& integrals) {
  trace.segment_integrals[segment] = integrals;
  trace.pfd_integral_hours += integrals(0);
  trace.expected_failures += integrals(1);
  trace.expected_undetected_failures += integrals(2);
}

}  // namespace

GroupTrace propagate_cycles(const GroupChain& chain, const CyclePattern& pattern, double mission_hours,
                            const std::vector<double>& grid, bool keep_states,
                            std::vector<std::vector<Action>>& actions) {
  const double period = pattern.period_hours;
  const double tol = kSameInstantShare * period;
  TestSchedule schedule(pattern, tol, mission_hours * (1.0 - kSameInstantShare));
  Stepper stepper(chain);
  CycleOperator cycles(stepper, chain.size(), schedule.cycle(), period);
  RowPropagation state(stepper, chain.size());
  GroupTrace trace = averaged_trace(grid.size(), keep_states);
  actions.assign(grid.size(), {});
  for (std::size_t i = 0; i < grid.size(); ++i) {
    const double b = grid[i];
    apply_instants_before(b, tol, schedule, cycles, state);
    state.step_to(b);
    if (i > 0) add_segment(trace, i - 1, state.take_integrals());
    trace.pfd_before[i] = state.pfd();
    while (std::fabs(schedule.next_time() - b) <= tol) {
      state.act(schedule.next_actions(), &actions[i]);
      schedule.advance();
    }
    trace.pfd_after[i] = state.pfd();
    trace.bypassed[i] = state.bypassed();
    if (keep_states) trace.state_after[i] = state.state();
  }
  return trace;
}

PfdCurve curve_on_grid(const std::vector<double>& grid, const std::vector<bool>& acts,
                       const std::vector<double>& before, const std::vector<double>& after) {
  PfdCurve c;
  for (std::size_t i = 0; i < grid.size(); ++i) {
    if (acts[i]) {
      c.time_hours.push_back(grid[i]);
      c.pfd.push_back(before[i]);
    }
    c.time_hours.push_back(grid[i]);
    c.pfd.push_back(after[i]);
  }
  return c;
}

std::vector<std::string> group_notes(const ExactGroupInput& in, const GroupChain& chain) {
  std::vector<std::string> notes;
  if (in.vote.diagnostic)
    notes.emplace_back("1oo2D modelled as 1oo2: the switch-over of the diagnostics is not modelled");
  if (in.vote.k == in.vote.n && (in.beta > 0.0 || in.beta_d > 0.0))
    notes.emplace_back("no common cause for a " + in.vote.text() + " vote, as in IEC 61508-6 Annex B");
  if (chain.per_channel() && in.channels.size() > 1 && in.beta > 0.0)
    notes.emplace_back("common cause at beta times the smallest channel rate");
  if (in.mttr.hours <= 0.0) notes.emplace_back("MTTR = 0: detected failures are restored at once");
  if (in.partial_stroke && in.partial_stroke->coverage > in.proof_test_coverage)
    notes.emplace_back("the proof test is taken to reveal all the partial stroke test reveals");
  if (chain.per_channel())
    notes.emplace_back("channels tracked one by one (" + std::to_string(chain.size()) + " states)");
  return notes;
}

}  // namespace detail

std::string exact_group_unsupported(const ExactGroupInput& g) {
  const int k = g.vote.k;
  const int n = g.vote.n;
  const std::string where = "exact engine, " + g.vote.text() + ": ";
  if (k < 1 || k > n) return where + "the vote needs 1 <= K <= N";
  if (n > kMaxChannels) return where + "at most 8 channels";
  if (g.channels.size() != 1 && g.channels.size() != static_cast<std::size_t>(n))
    return where + "give the rates of one channel or of each of the " + std::to_string(n) + " channels";
  const bool tracked = detail::tracks_each_channel(g);
  if (tracked && n > detail::kMaxChannelsTracked)
    return where + "channels that are different, staggered or bypassed are tracked one by one, at most 4";
  for (const auto& r : g.channels)
    if (!(r.lambda_du.per_hour >= 0.0) || !(r.lambda_dd.per_hour >= 0.0)) return where + "rates must be >= 0";
  auto fraction = [](double x) { return x >= 0.0 && x <= 1.0; };
  if (!fraction(g.beta) || !fraction(g.beta_d)) return where + "beta and beta_D must lie in [0, 1]";
  if (!fraction(g.proof_test_coverage)) return where + "the proof test coverage must lie in [0, 1]";
  if (!(g.mission_time.hours > 0.0)) return where + "the mission time must be > 0";
  const double t1 = g.proof_test_interval.hours;
  if (!(t1 > 0.0)) return where + "the proof test interval must be > 0";
  if (!(g.mttr.hours >= 0.0) || !(g.mrt.hours >= 0.0)) return where + "MTTR and MRT must be >= 0";
  if (g.partial_stroke) {
    if (!fraction(g.partial_stroke->coverage)) return where + "the partial stroke coverage must lie in [0, 1]";
    if (!(g.partial_stroke->interval.hours > 0.0)) return where + "the partial stroke interval must be > 0";
  }
  if (g.test_duration) {
    const double tau = g.test_duration->hours;
    if (!(tau >= 0.0) || tau >= t1 / n)
      return where + "each channel's test must end before the next channel's begins (test duration < T1 / N)";
  }
  return {};
}

ExactGroupResult group_exact(const ExactGroupInput& group) {
  if (auto why = exact_group_unsupported(group); !why.empty()) throw std::invalid_argument(why);
  const detail::GroupChain chain(group);
  if (detail::timeline_instants(group, chain) > detail::kMaxSteppedInstants) {
    // Too many tests to step one by one: whole cycles composed by repeated squaring.
    auto sif = sif_exact({group});
    ExactGroupResult r = std::move(sif.groups.front());
    r.curve = std::move(sif.curve);
    return r;
  }
  const auto timeline = detail::group_timeline(group, chain);
  std::vector<double> times;
  for (const auto& ta : timeline) times.push_back(ta.time_hours);
  const auto grid = detail::merge_grid(std::move(times), group.mission_time.hours);
  const auto actions = detail::actions_on_grid(timeline, grid);
  const auto trace = detail::propagate(chain, grid, actions, false);
  ExactGroupResult r;
  r.pfd_avg = trace.pfd_integral_hours / group.mission_time.hours;
  r.failure_frequency_per_hour = trace.expected_failures / group.mission_time.hours;
  r.undetected_failure_frequency_per_hour = trace.expected_undetected_failures / group.mission_time.hours;
  std::vector<bool> acts(grid.size());
  for (std::size_t i = 0; i < grid.size(); ++i) acts[i] = !actions[i].empty();
  r.curve = detail::curve_on_grid(grid, acts, trace.pfd_before, trace.pfd_after);
  r.states = chain.size();
  r.per_channel = chain.per_channel();
  r.notes = detail::group_notes(group, chain);
  return r;
}

ExactGroupInput exact_group_input(const Subsystem& s, const std::vector<Component>& components, Duration mission_time) {
  if (s.is_vendor() || s.channels.empty())
    throw std::invalid_argument("exact engine: subsystem '" + s.name + "' has no channels to model");
  ExactGroupInput in;
  in.vote = s.vote;
  for (const auto& ch : s.channels) {
    FailureRates sum;
    for (std::size_t c : ch.components) sum += components.at(c).rates;
    in.channels.push_back(sum);
  }
  const bool scaled = s.ccf_scaling == CcfScaling::kIec61508TableD5 && table_d5_covers(s.vote.k, s.vote.n);
  const double multiplier = scaled ? ccf_multiplier_table_d5(s.vote.k, s.vote.n) : 1.0;
  in.beta = s.beta * multiplier;
  in.beta_d = s.beta_d * multiplier;
  in.proof_test_interval = s.proof_test_interval;
  in.mttr = s.mttr;
  in.mrt = s.mrt;
  in.proof_test_coverage = s.proof_test_coverage;
  in.partial_stroke = s.partial_stroke;
  in.test_duration = s.test_duration;
  in.staggered = s.staggered;
  in.mission_time = mission_time;
  return in;
}

}  // namespace sifter
