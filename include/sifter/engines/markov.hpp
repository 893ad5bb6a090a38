#pragma once
/// The exact engine: multi-phase Markov models of voting groups and the SIF's PFD(t).
///
/// Modelling choices (each group):
/// - Every channel is either working or in one of these failed states: undetected and revealed
///   by the partial stroke and the proof test, undetected and revealed by the proof test only,
///   undetected and never revealed within the mission (the share 1 - PTC), detected and being
///   restored (rate 1/MTTR), or in repair after a test found it failed (rate 1/MRT). A channel
///   that has failed does not fail again in another mode, except that the never-revealed
///   failures strike every channel not already hit by one: they are a separate failure mode
///   that no repair touches, so they must stay independent of the others to persist.
/// - Each failed channel is restored on its own (as many repairers as failed channels). The
///   Annex B common-cause term keeps the whole group down for the full MTTR or MRT; here it
///   comes back as soon as enough channels are restored, so that term is lower.
/// - Common cause is a shock: at rate beta lambda_du (beta_d lambda_dd) it fails every working
///   channel at once in the same mode. For channels of different rates the shock rate is beta
///   times the smallest channel rate (a shared cause cannot strike more often than the least
///   failure-prone channel fails) and each channel keeps the rest of its rate as independent
///   failures. A KooN group with K = N has no common-cause term, as in Annex B.
/// - Proof tests and partial stroke tests are instants at which the state jumps: the failures
///   they cover go to repair (or straight back to working when MRT = 0). A partial stroke test
///   covers a share of lambda_du that the proof test also covers; it takes no time.
/// - With a test duration, the channel under test is bypassed (counted unavailable) for that
///   time and its failures are revealed at the end of the test. Without staggering, the
///   channels of a group are tested one after another from each test instant.
/// - Staggered tests: channel j is tested at j T1 / N + k T1.
/// - Identical channels tested together are aggregated by counts; staggered, bypassed or
///   different channels are tracked one by one (N <= 4).
/// - The failure frequency counts random transitions into the failed states; taking a channel
///   out for a test is planned and is not counted as a failure.
/// - 1oo2D is modelled as 1oo2: the switch-over of the diagnostics is not modelled.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/model.hpp"
#include "sifter/model/quantity.hpp"

namespace sifter {

/// Everything the exact engine needs about one voting group; rates per hour, times in hours.
struct ExactGroupInput {
  Vote vote;
  /// Rates of the channels: one entry for N identical channels, or one entry per channel.
  std::vector<FailureRates> channels;
  double beta = 0.0;                            ///< common-cause fraction of lambda_du (effective, after any scaling)
  double beta_d = 0.0;                          ///< common-cause fraction of lambda_dd
  Duration proof_test_interval;                 ///< T1
  Duration mttr;                                ///< restoration of detected failures
  Duration mrt;                                 ///< repair of failures a test has found
  double proof_test_coverage = 1.0;             ///< PTC, share of lambda_du the proof test reveals
  std::optional<PartialStroke> partial_stroke;  ///< extra tests covering a share of lambda_du
  std::optional<Duration> test_duration;        ///< each channel bypassed this long when tested
  bool staggered = false;                       ///< channels' tests spread evenly over T1
  Duration mission_time;                        ///< the averages are taken over [0, mission]
  bool track_each_channel = false;              ///< use the per-channel model even where counts would do
};

/// PFD against time. Where a test acts, the instant appears twice: just before, then after.
struct PfdCurve {
  std::vector<double> time_hours;
  std::vector<double> pfd;
};

/// The exact result of one voting group.
struct ExactGroupResult {
  double pfd_avg = 0.0;  ///< time average of PFD(t) over the mission
  /// Mission average of the rate of entering the failed states: expected group failures per
  /// hour, the exact counterpart of the PFH.
  double failure_frequency_per_hour = 0.0;
  /// The part of it whose last failure is undetected (or a common cause of undetected
  /// failures). IEC 61508-6:2010 B.3.3.2 counts these, assuming a detected failure puts the
  /// process in a safe state (its 1oo1 PFH is lambda_du); it also counts beta_D lambda_dd.
  double undetected_failure_frequency_per_hour = 0.0;
  PfdCurve curve;                  ///< at every instant where the model changes (or on a given grid)
  int states = 0;                  ///< size of the Markov chain
  bool per_channel = false;        ///< channels tracked one by one rather than by counts
  std::vector<std::string> notes;  ///< modelling choices that apply to this group
};

/// Why the exact engine cannot model this group (empty when it can): votes, sizes, ranges.
std::string exact_group_unsupported(const ExactGroupInput& group);

/// The exact PFD(t), PFDavg and failure frequency of one group; multi-phase Markov model,
/// matrix exponential and Van Loan's block form for the integrals (Van Loan, IEEE Trans.
/// Automatic Control 23(3), 1978). Throws std::invalid_argument when unsupported.
ExactGroupResult group_exact(const ExactGroupInput& group);

/// The exact input of a subsystem of the project: each channel's rates are the sums of its
/// components' rates (series), and beta follows the subsystem's Table D.5 scaling.
ExactGroupInput exact_group_input(const Subsystem& subsystem, const std::vector<Component>& components,
                                  Duration mission_time);

/// The exact result of a SIF: its subsystems in series, independent of one another.
struct SifExactResult {
  /// Time average over the mission of PFD_sif(t) = 1 - prod_i (1 - PFD_i(t)).
  double pfd_avg = 0.0;
  /// Mission average of the rate at which the SIF enters failure (expected failures per hour).
  double failure_frequency_per_hour = 0.0;
  /// The part of it whose last failure is undetected.
  double undetected_failure_frequency_per_hour = 0.0;
  PfdCurve curve;  ///< PFD_sif on the common grid
  /// Each subsystem's exact result; its curve is on the same grid as `curve`.
  std::vector<ExactGroupResult> groups;
};

/// The exact SIF result on the grid of every test instant of every group (a group tested more
/// than 20 000 times is composed by whole cycles instead, on a grid of the other groups'
/// instants and 1 000 even samples; README "Limits"). The averages are the
/// exact integrals: each subsystem's by Van Loan's form; the cross terms of the product, which
/// are of the order of PFD squared, by Gauss-Legendre quadrature of exact values, graded
/// towards each test instant. All groups must share one mission time.
SifExactResult sif_exact(const std::vector<ExactGroupInput>& groups);

/// As sif_exact, with the curves also sampled at `points` evenly spaced instants (first and
/// last at 0 and at the mission time) for plotting; the averages do not come from the samples.
SifExactResult sif_curve(const std::vector<ExactGroupInput>& groups, int points);

}  // namespace sifter
