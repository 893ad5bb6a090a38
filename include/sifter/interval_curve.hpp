#pragma once
/// PFDavg of a SIF against its proof-test intervals, all scaled together, and the longest
/// scaling that still meets the required PFD. Pure functions: no I/O.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model.hpp"

namespace sifter {

/// The range of factors the sweep draws (multiples of every present proof-test interval).
inline constexpr double kSweepMinFactor = 1.0 / 16.0;
inline constexpr double kSweepMaxFactor = 16.0;
/// The range in which the longest allowed factor is searched.
inline constexpr double kSearchMinFactor = 1.0 / 1024.0;
inline constexpr double kSearchMaxFactor = 1024.0;

/// One point of the sweep: every proof-test interval of the SIF times `factor`.
struct IntervalPoint {
  double factor = 1.0;
  double pfd_avg = 0.0;  ///< the SIF's PFDavg at that factor (verify_sif, IEC 61508-6:2010 Annex B)
};

/// A subsystem's proof-test interval now and at the longest allowed factor; both empty for a
/// supplier's figure, which has no interval of its own here.
struct SubsystemInterval {
  std::string name;
  std::optional<Duration> present;
  std::optional<Duration> longest;
};

/// PFDavg against the proof-test intervals of one SIF (low demand).
struct IntervalSweep {
  std::vector<IntervalPoint> points;     ///< from kSweepMinFactor to kSweepMaxFactor, geometric
  double required_pfd = 0.0;             ///< the PFDavg the SIF must not exceed
  std::optional<double> longest_factor;  ///< largest factor meeting required_pfd, if in the search range
  bool meets_beyond_search = false;      ///< still meets at kSearchMaxFactor (no finite bound found)
  std::vector<SubsystemInterval> subsystems;  ///< in the SIF's order
};

/// The SIF's PFDavg with every subsystem's proof-test interval multiplied by `factor` (partial
/// stroke intervals and the mission time unchanged), by re-running verify_sif on a copy of the
/// SIF in low demand.
double pfd_avg_with_intervals_scaled(const Project& project, const Sif& sif, double factor);

/// The sweep with `points_per_doubling` points per factor of two, and the longest allowed factor
/// by bisection on log(factor): PFDavg grows with every proof-test interval.
IntervalSweep interval_sweep(const Project& project, const Sif& sif, double required_pfd, int points_per_doubling = 4);

}  // namespace sifter
