#pragma once
// Internals of the exact engine shared by markov.cpp and markov_sif.cpp: the chain of one
// group, its timeline of tests, and the propagation of its state along a time grid.
#include <Eigen/Dense>
#include <array>
#include <cstdint>
#include <unordered_map>
#include <vector>

#include "sifter/engines/markov.hpp"

namespace sifter::detail {

/// The state of one channel.
enum Local : std::uint8_t {
  kWorking = 0,
  kHiddenPst = 1,    // undetected, revealed by the partial stroke and the proof test
  kHiddenProof = 2,  // undetected, revealed by the proof test only
  kHiddenNever = 3,  // undetected, not revealed within the mission
  kDetected = 4,     // detected, being restored at 1/MTTR
  kRepair = 5,       // found by a test, in repair at 1/MRT (when MRT differs from MTTR)
};
inline constexpr int kMaxChannelsTracked = 4;

/// Bit j set: channel j (per-channel model); a set of channels under test or bypassed.
using ChannelMask = unsigned;

/// A jump of the state at an instant: state i moves to state target[i].
using Jump = std::vector<int>;

/// Times closer than this share of the mission (of the cycle, in a compressed trace) are one instant.
inline constexpr double kSameInstantShare = 1e-9;

/// Whether the group needs the per-channel model: different, staggered or bypassed channels.
bool tracks_each_channel(const ExactGroupInput& in);

/// The Markov chain of one group: states, generator, and the jumps of the tests.
class GroupChain {
 public:
  explicit GroupChain(const ExactGroupInput& in);

  [[nodiscard]] int size() const { return static_cast<int>(states_.size()); }
  [[nodiscard]] bool per_channel() const { return per_channel_; }
  [[nodiscard]] int channels() const { return n_; }
  /// Whether a share of lambda_du is revealed by partial stroke tests.
  [[nodiscard]] bool has_partial_stroke() const { return share_pst_ > 0.0; }
  /// Row-stochastic generator: p(t) = p(0) exp(Q t), p a row vector.
  [[nodiscard]] const Eigen::MatrixXd& generator() const { return q_; }
  /// 1 where the group has failed, the channels in `bypassed` counted unavailable.
  [[nodiscard]] Eigen::VectorXd failed(ChannelMask bypassed) const;
  /// Rate of entering the failed states from each state that has not failed.
  [[nodiscard]] Eigen::VectorXd entering(ChannelMask bypassed) const;
  /// The part of it due to undetected failures (independent or common cause).
  [[nodiscard]] Eigen::VectorXd entering_undetected(ChannelMask bypassed) const;
  /// The proof test of the channels in `tested` (the per-channel model), or of all channels.
  [[nodiscard]] Jump proof_test(ChannelMask tested) const;
  /// The partial stroke test of all channels.
  [[nodiscard]] Jump partial_stroke() const;
  /// An upper bound on the magnitude of the generator's eigenvalues (Gershgorin), per hour.
  [[nodiscard]] double fastest_rate_per_hour() const;
  [[nodiscard]] static ChannelMask all_channels(int n) { return (1u << n) - 1u; }

 private:
  using Config = std::array<std::uint8_t, kMaxChannels>;
  struct ChannelRates {
    double to_pst = 0.0, to_proof = 0.0, to_never = 0.0, to_detected = 0.0;
  };
  // n_ bounded for the compiler's sake (n_ <= kMaxChannels always holds).
  [[nodiscard]] int width() const { return n_ < kMaxChannels ? n_ : kMaxChannels; }
  void canonical(Config& c) const;
  [[nodiscard]] std::uint32_t key(Config c) const;
  [[nodiscard]] int index_of(Config c) const;
  [[nodiscard]] Config reveal(Config c, ChannelMask tested, bool pst_only) const;
  template <typename Visit>
  void for_each_transition(const Config& c, Visit&& visit) const;
  void build();

  int k_ = 1;
  int n_ = 1;
  bool per_channel_ = false;
  std::vector<ChannelRates> rates_;  // independent failures, per channel (one entry if counts)
  ChannelRates shock_;               // common-cause shocks
  double share_pst_ = 0.0;           // share of lambda_du the partial stroke reveals
  double restore_per_hour_ = 0.0;    // 1/MTTR, 0 when detected failures are not modelled
  double repair_per_hour_ = 0.0;     // 1/MRT, 0 when revealed failures return at once
  struct Transition {
    int from, to;
    double rate;
  };
  std::vector<Config> states_;
  std::vector<Transition> undetected_;            // the transitions that are undetected failures
  std::uint8_t revealed_to_ = kWorking;           // where a failure found by a test goes
  std::unordered_map<std::uint32_t, int> index_;  // key -> state, for more than 4 channels
  std::vector<int> flat_index_;                   // key -> state, up to 4 channels
  Eigen::MatrixXd q_;
};

/// What happens at an instant of a group's timeline.
struct Action {
  enum Kind { kProofTest, kPartialStroke, kBypassStart, kBypassEnd } kind = kProofTest;
  ChannelMask channels = 0;
};

/// A timed action.
struct TimedAction {
  double time_hours = 0.0;
  Action action;
};

/// Every test and bypass of a group within (0, mission), in time order.
std::vector<TimedAction> group_timeline(const ExactGroupInput& in, const GroupChain& chain);

/// Sorted, merged instants: 0, the times given, and the mission time; nearly equal times merge.
std::vector<double> merge_grid(std::vector<double> times, double mission_hours);

/// The actions of a timeline placed on the instants of a grid that contains their times.
std::vector<std::vector<Action>> actions_on_grid(const std::vector<TimedAction>& timeline,
                                                 const std::vector<double>& grid);

/// A group's state along a grid: PFD before and after each instant, the state after it, and
/// the exact integrals over the mission.
struct GroupTrace {
  std::vector<double> pfd_before;             // PFD just before each instant (at 0: the initial PFD)
  std::vector<double> pfd_after;              // PFD just after each instant's actions
  std::vector<Eigen::VectorXd> state_after;   // kept only when asked for
  std::vector<ChannelMask> bypassed;          // bypass in force on the segment after instant i
  double pfd_integral_hours = 0.0;            // integral of PFD(t) dt
  double expected_failures = 0.0;             // integral of the failure frequency dt
  double expected_undetected_failures = 0.0;  // the part due to undetected failures
  /// Compressed traces only: the integrals [PFD, failures, undetected failures] over each
  /// segment of the grid (the cross terms take such a group at its average over a segment).
  std::vector<Eigen::RowVector3d> segment_integrals;
  bool averaged = false;
};

/// Propagates the chain along the grid with Van Loan's block exponential per distinct segment.
GroupTrace propagate(const GroupChain& chain, const std::vector<double>& grid,
                     const std::vector<std::vector<Action>>& actions, bool keep_states);

/// A group's timeline as one pattern repeated: cycle 0 (the instants in (0, P)) and the
/// instants of every later cycle c at c P + offset (offsets in [0, P)). Bypasses never cross a
/// cycle's end (a channel's test ends before the next channel's begins). `valid` is false when
/// the timeline has no such period (a partial stroke interval that neither divides the proof
/// test interval nor is a whole multiple of it).
struct CyclePattern {
  bool valid = false;
  double period_hours = 0.0;
  std::vector<TimedAction> head;   // absolute times in (0, P)
  std::vector<TimedAction> cycle;  // offsets in [0, P)
};

CyclePattern cycle_pattern(const ExactGroupInput& in, const GroupChain& chain);

/// How many test and bypass instants a group's timeline has over the mission (estimated from
/// its pattern without listing them; exact up to the instants near the mission's end).
double timeline_instants(const ExactGroupInput& in, const GroupChain& chain);

/// Above this many instants a group's timeline is not stepped instant by instant: whole cycles
/// are composed by repeated squaring (README "Limits").
inline constexpr double kMaxSteppedInstants = 20000.0;

/// Evenly spaced instants at which a compressed SIF is sampled (its cross terms and curves).
inline constexpr int kCompressedSamples = 1000;

/// The state of a group along a grid, whole cycles composed by repeated squaring: the work
/// grows with the grid and log(cycles), not with the number of tests. The PFD before and after
/// each instant are exact, as are the integrals over each segment (kept in
/// `segment_integrals`, and `averaged` set); `actions` receives what acted at each instant.
GroupTrace propagate_cycles(const GroupChain& chain, const CyclePattern& pattern, double mission_hours,
                            const std::vector<double>& grid, bool keep_states,
                            std::vector<std::vector<Action>>& actions);

/// The points of a curve: one per instant, two (before, after) where something acts.
PfdCurve curve_on_grid(const std::vector<double>& grid, const std::vector<bool>& acts,
                       const std::vector<double>& before, const std::vector<double>& after);

/// Modelling notes that apply to a group.
std::vector<std::string> group_notes(const ExactGroupInput& in, const GroupChain& chain);

}  // namespace sifter::detail
