#pragma once
/// Spurious trips: how often a voting group, and a SIF, shuts the process down without a demand
/// (Gruhn & Cheddie, Safety Instrumented Systems, 2nd ed., 8.9; DEVELOPERS.md, Methods M7,
/// from memory). Pure functions: no I/O.
#include <optional>
#include <string>

#include "sifter/model/model.hpp"
#include "sifter/results/sif.hpp"

namespace sifter {

/// Everything the spurious-trip forms need about one group of identical channels.
struct SpuriousGroupData {
  Vote vote;
  double lambda_trip_per_hour = 0.0;  ///< rate at which one channel sends a false trip, per hour
  double beta = 0.0;                  ///< common-cause fraction of those failures
  Duration mttr;                      ///< a channel that failed safe is restored in this time
};

/// The rate at which one channel sends a trip without a demand, per hour: its safe failures
/// lambda_su + lambda_sd, plus lambda_dd where a detected dangerous failure trips the process
/// (`"trip_on_detected": true`).
double channel_trip_rate_per_hour(const FailureRates& channel, bool trip_on_detected);

/// Spurious trip rate of a KooN group, per hour. The group trips when K of its channels send a
/// trip (K votes to trip, so K safe failures must overlap). DEVELOPERS.md, Methods M7 forms for
/// 1oo1 (lS), 1oo2 (2 (1-beta) lS + beta lS), 2oo2 (2 lS^2 MTTR + beta lS) and
/// 2oo3 (6 lS^2 MTTR + beta lS); for other votes the same construction generalised:
///   STR = K C(N, K) lS_i^K MTTR^(K-1) + beta lS   (N >= 2; beta term absent for N = 1)
/// with lS_i = (1 - beta) lS when K = 1 and lS_i = lS when K >= 2, as §7 writes them (the
/// (1 - beta) factor of a second-order term is dropped, which can only overstate the rate).
/// K C(N, K) lS^K MTTR^(K-1) is the rate of entering the state with K channels failed safe
/// when each channel is independently failed with probability lS MTTR: C(N, K-1) (lS MTTR)^(K-1)
/// times (N - K + 1) lS. A 1oo2D group is taken as 1oo2 (conservative).
double group_spurious_trip_rate_per_hour(const SpuriousGroupData& group);

/// The equation a group's rate comes from, for the results.
std::string spurious_trip_equation(const Vote& vote);

/// What the spurious-trip forms see of one subsystem: one channel's rates (series elements
/// added), the beta as entered (the 1oo2 value, not scaled by Table D.5) and the MTTR.
SpuriousGroupData spurious_data_for(const Project& project, const Subsystem& sub);

/// Mean time to a spurious trip in years, 1 / rate; empty when the rate is zero.
std::optional<double> mttf_spurious_years(double rate_per_year);

/// Fills spurious_trip_rate_per_yr and mttf_spurious_yr of each subsystem of `result` (in
/// the order of `sif.subsystems`) and of the SIF, which trips when any of its subsystems does
/// (sum of the rates, series in the trip direction), and records the source in the assumptions.
/// Vendor subsystems carry no safe failure rates: they count as zero and the assumptions say so.
void add_spurious_trips(const Project& project, const Sif& sif, SifResult& result);

}  // namespace sifter
