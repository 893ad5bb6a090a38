// PFDavg against the proof-test intervals of a SIF, by re-running the verification on a scaled copy.
#include "sifter/analysis/interval_curve.hpp"

#include <algorithm>
#include <cmath>

#include "sifter/analysis/verify.hpp"

namespace sifter {
double pfd_avg_with_intervals_scaled(const Project& project, const Sif& sif, double factor) {
  Sif scaled = sif;
  scaled.demand_mode_stated = DemandMode::kLow;
  for (auto& sub : scaled.subsystems) sub.proof_test_interval.hours *= factor;
  std::vector<Warning> ignored;  // the report shows the warnings of the real run, not of these
  VerifyOptions simplified_only;
  simplified_only.exact = false;
  const SifResult r = verify_sif(project, scaled, std::nullopt, simplified_only, ignored);
  return r.pfd_avg.value_or(0.0);
}

IntervalSweep interval_sweep(const WhatIf& what_if, std::size_t sif_index, double required_pfd,
                             int points_per_doubling) {
  const Project& project = what_if.project();
  const Sif& sif = project.sifs.at(sif_index);
  IntervalSweep out;
  out.required_pfd = required_pfd;
  const int steps = points_per_doubling * static_cast<int>(std::lround(std::log2(kSweepMaxFactor)));
  for (int k = -steps; k <= steps; ++k) {
    const double f = std::exp2(static_cast<double>(k) / points_per_doubling);
    out.points.push_back({f, pfd_avg_with_intervals_scaled(project, sif, f)});
  }
  try {
    out.longest = longest_proof_test_interval(what_if, sif_index, std::nullopt, 0.0);
  } catch (const UsageError&) {
    // No target and no scenario: nothing to solve against; the table says so.
  }
  for (const auto& sub : sif.subsystems) {
    SubsystemInterval si{sub.name, std::nullopt, std::nullopt};
    if (!sub.is_vendor()) {
      si.present = sub.proof_test_interval;
      if (out.longest && out.longest->outcome != IntervalOutcome::kNone &&
          std::find(out.longest->varied.begin(), out.longest->varied.end(), sub.name) != out.longest->varied.end())
        si.longest = out.longest->longest;
    }
    out.subsystems.push_back(std::move(si));
  }
  return out;
}

}  // namespace sifter
