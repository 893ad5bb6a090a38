#pragma once
/// IEC 61508-6:2010 Annex B simplified equations: PFDavg and PFH of one voting group.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/model.hpp"

namespace sifter {

/// A share of a channel's undetected failures and the interval at which a test reveals it.
/// A perfect proof test is one slice {1.0, T1}; an imperfect test or a partial stroke test
/// splits lambda_du over several slices (the last one often the mission time).
struct TestSlice {
  double share = 1.0;  ///< fraction of lambda_du revealed on this interval
  Duration interval;   ///< hours between the tests that reveal it
};

/// The resolved model of one voting group (built once by group_model.hpp): everything the
/// simplified equations, the Monte Carlo and the what-ifs read about it.
struct GroupData {
  Vote vote;
  FailureRates channel;                ///< rates of one channel (series elements added); the mean where channels differ
  std::vector<FailureRates> channels;  ///< each channel's own rates; empty = N copies of `channel`
  double beta = 0.0;                   ///< effective beta after any Table D.5 scaling
  double beta_d = 0.0;                 ///< effective beta_D after any Table D.5 scaling
  std::vector<TestSlice> tests;        ///< how lambda_du is revealed; shares add to 1
  Duration mttr;
  Duration mrt;
  Duration proof_test_interval;           ///< T1 (the test-duration term divides by it)
  std::optional<Duration> test_duration;  ///< each channel out of service this long per proof test
  bool staggered = false;                 ///< tests spread over the interval (exact engine only)
  /// IEC 61508-6:2010 B.3.3.2: a detected dangerous failure takes the process to its safe state.
  /// False ("on_detected_failure": "alarm_only"): detected failures stay dangerous until restored.
  bool detected_to_safe_state = true;

  /// Whether every channel has the same rates (the Annex B forms assume it).
  [[nodiscard]] bool channels_identical() const;
  /// The rates of channel i (0 <= i < vote.n).
  [[nodiscard]] const FailureRates& rates_of(int i) const {
    return channels.empty() ? channel : channels[static_cast<std::size_t>(i)];
  }
};

/// The PFDavg of a group, split into the terms a reviewer looks at.
struct GroupPfd {
  double pfd_avg = 0.0;
  double independent_undetected = 0.0;  ///< independent failures, share due to undetected ones
  double independent_detected = 0.0;    ///< independent failures, share due to detected ones
  double common_cause = 0.0;            ///< the beta and beta_D terms
  double test_duration = 0.0;           ///< channels out of service while tested (included in pfd_avg)
  std::string equation;                 ///< the published equation used, with its clause
};

/// The PFH of a group and the equation used.
struct GroupPfh {
  double pfh_per_hour = 0.0;
  double common_cause_per_hour = 0.0;
  std::string equation;
};

/// PFDavg of a KooN group (low demand). IEC 61508-6:2010 B.3.2.2 for 1oo1, 1oo2, 2oo2, 2oo3,
/// 1oo3 and 1oo2D; for other votes the same mean-down-time construction generalised to
/// N!/(N-m)! X^m prod t_j + CCF, m = N-K+1, which reproduces every Annex B form exactly.
GroupPfd group_pfd_avg(const GroupData& group);

/// group_pfd_avg(group).pfd_avg without the terms' text: the fast path for Monte Carlo loops.
double group_pfd_avg_value(const GroupData& group);

/// PFH of a KooN group (high demand), IEC 61508-6:2010 B.3.3.2, generalised as above.
GroupPfh group_pfh(const GroupData& group);

/// Mean down time of the j-th failure of a group (j = 1: tCE, 2: tGE, 3: tG2E, ...), in hours:
/// sum over test slices of (lDU share / lD)(T/(j+1) + MRT) + (lDD/lD) MTTR.
double mean_down_time_hours(const GroupData& group, int j);

/// IEC 61508-6:2010 Table D.5 multiplier of the 1oo2 beta for a KooN group (N <= 5);
/// 1.0 for 1oo2 and for NooN groups, which have no common-cause term.
double ccf_multiplier_table_d5(int k, int n);

/// Binomial coefficient C(n, k) as a double.
double binomial(int n, int k);

}  // namespace sifter
