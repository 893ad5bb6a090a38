#pragma once
/// PFDavg of a SIF against its proof-test intervals, all scaled together, and its longest
/// proof-test interval from the what-if engine. Pure functions: no I/O.
#include <optional>
#include <string>
#include <vector>

#include "sifter/analysis/whatif.hpp"
#include "sifter/model/model.hpp"
#include "sifter/results/report.hpp"

namespace sifter {

/// The SIF's PFDavg with every subsystem's proof-test interval multiplied by `factor` (partial
/// stroke intervals and the mission time unchanged), by re-running verify_sif on a copy of the
/// SIF in low demand.
double pfd_avg_with_intervals_scaled(const Project& project, const Sif& sif, double factor);

/// The sweep of SIF `sif` of what_if.project() with `points_per_doubling` points per factor of
/// two, and its longest proof-test interval from the what-if engine (no second search).
IntervalSweep interval_sweep(const WhatIf& what_if, std::size_t sif, double required_pfd, int points_per_doubling = 4);

}  // namespace sifter
