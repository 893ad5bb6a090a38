#pragma once
/// PFDavg of a SIF against its proof-test intervals, all scaled together, and the longest
/// scaling that still meets the required PFD. Pure functions: no I/O.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model.hpp"
#include "sifter/whatif.hpp"

namespace sifter {

/// The range of factors the sweep draws (multiples of every present proof-test interval).
inline constexpr double kSweepMinFactor = 1.0 / 16.0;
inline constexpr double kSweepMaxFactor = 16.0;

/// One point of the sweep: every proof-test interval of the SIF times `factor`.
struct IntervalPoint {
  double factor = 1.0;
  double pfd_avg = 0.0;  ///< the SIF's PFDavg at that factor (verify_sif, IEC 61508-6:2010 Annex B)
};

/// A subsystem's proof-test interval now and the longest allowed; both empty for a supplier's
/// figure, which has no interval of its own here.
struct SubsystemInterval {
  std::string name;
  std::optional<Duration> present;
  std::optional<Duration> longest;  ///< the what-if engine's answer, for the subsystems it varied
};

/// PFDavg against the proof-test intervals of one SIF (low demand).
struct IntervalSweep {
  std::vector<IntervalPoint> points;     ///< from kSweepMinFactor to kSweepMaxFactor, geometric
  double required_pfd = 0.0;             ///< the PFDavg the SIF must not exceed
  /// The longest interval, from the what-if engine (longest_proof_test_interval, every tested
  /// subsystem together, no margin): the same answer `sifter interval` gives. Empty when the
  /// SIF has no requirement to solve against.
  std::optional<IntervalResult> longest;
  std::vector<SubsystemInterval> subsystems;  ///< in the SIF's order
};

/// The SIF's PFDavg with every subsystem's proof-test interval multiplied by `factor` (partial
/// stroke intervals and the mission time unchanged), by re-running verify_sif on a copy of the
/// SIF in low demand.
double pfd_avg_with_intervals_scaled(const Project& project, const Sif& sif, double factor);

/// The sweep of SIF `sif` of what_if.project() with `points_per_doubling` points per factor of
/// two, and its longest proof-test interval from the what-if engine (no second search).
IntervalSweep interval_sweep(const WhatIf& what_if, std::size_t sif, double required_pfd, int points_per_doubling = 4);

}  // namespace sifter
