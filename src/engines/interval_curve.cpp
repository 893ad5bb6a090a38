// PFDavg against the proof-test intervals of a SIF, by re-running the verification on a scaled copy.
#include "sifter/engines/interval_curve.hpp"

#include <cmath>

#include "sifter/analysis/verify.hpp"

namespace sifter {
namespace {

// Bisection steps on log2(factor) over the 20 doublings of the search range: 2^-40 of it.
constexpr int kBisectionSteps = 40;

}  // namespace

double pfd_avg_with_intervals_scaled(const Project& project, const Sif& sif, double factor) {
  Sif scaled = sif;
  scaled.demand_mode_stated = DemandMode::kLow;
  for (auto& sub : scaled.subsystems) sub.proof_test_interval.hours *= factor;
  std::vector<Warning> ignored;  // the report shows the warnings of the real run, not of these
  const SifResult r = verify_sif(project, scaled, std::nullopt, VerifyOptions{false, 0, 1, 0, {}}, ignored);
  return r.pfd_avg.value_or(0.0);
}

IntervalSweep interval_sweep(const Project& project, const Sif& sif, double required_pfd, int points_per_doubling) {
  IntervalSweep out;
  out.required_pfd = required_pfd;
  const int steps = points_per_doubling * static_cast<int>(std::lround(std::log2(kSweepMaxFactor)));
  for (int k = -steps; k <= steps; ++k) {
    const double f = std::exp2(static_cast<double>(k) / points_per_doubling);
    out.points.push_back({f, pfd_avg_with_intervals_scaled(project, sif, f)});
  }
  const auto meets = [&](double f) { return pfd_avg_with_intervals_scaled(project, sif, f) <= required_pfd; };
  if (meets(kSearchMaxFactor)) {
    out.meets_beyond_search = true;
  } else if (meets(kSearchMinFactor)) {
    double lo = std::log2(kSearchMinFactor), hi = std::log2(kSearchMaxFactor);
    for (int i = 0; i < kBisectionSteps; ++i) {
      const double mid = 0.5 * (lo + hi);
      (meets(std::exp2(mid)) ? lo : hi) = mid;
    }
    out.longest_factor = std::exp2(lo);
  }
  for (const auto& sub : sif.subsystems) {
    SubsystemInterval si{sub.name, std::nullopt, std::nullopt};
    if (!sub.is_vendor()) {
      si.present = sub.proof_test_interval;
      if (out.longest_factor) si.longest = Duration{sub.proof_test_interval.hours * *out.longest_factor};
    }
    out.subsystems.push_back(std::move(si));
  }
  return out;
}

}  // namespace sifter
