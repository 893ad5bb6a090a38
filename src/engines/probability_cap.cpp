// Capping probabilities at 1 where the rare-event sums of the simplified equations exceed it.
#include "sifter/engines/probability_cap.hpp"

#include <algorithm>
#include <cstdio>

#include "sifter/model/format.hpp"

namespace sifter {
namespace {

// Returns true when it capped. Below zero a probability can only be the rounding of a
// difference near zero (the exact engine's one minus the working states, for rates near
// 1e-160/h): it is 0.
bool cap(std::optional<double>& p) {
  if (p && *p < 0.0) {
    p = 0.0;
    return true;
  }
  if (!p || !(*p > 1.0)) return false;
  p = 1.0;
  return true;
}

}  // namespace

void cap_probabilities(const Sif& sif, SifResult& r, std::vector<Warning>& warnings) {
  // IEC 61508-6:2010 B.2.2 sums the subsystems' PFDavg as a rare-event approximation of
  // 1 - prod(1 - PFD_i); the Annex B terms (lDU T1)^k grow without bound (seen). A sum above 1
  // means the approximation no longer holds: the probability is at most 1.
  const std::optional<double> simplified = r.pfd_avg_simplified ? r.pfd_avg_simplified : r.pfd_avg;
  if (simplified && *simplified > 1.0) {
    const std::string m =
        "the simplified PFDavg sums to " + figure(*simplified) +
        ", outside the validity of the IEC 61508-6 Annex B equations; shown as at most 1 (a probability "
        "is at most 1)" +
        (r.pfd_avg_exact
             ? "; the verdict rests on the exact engine, which gives " + figure(std::min(1.0, *r.pfd_avg_exact))
             : "");
    r.assumptions.push_back(m);
    warnings.push_back({sif.pointer, m});
  }
  cap(r.pfd_avg);
  cap(r.pfd_avg_simplified);
  cap(r.credit_pfd);
  cap(r.pfd_avg_exact);
  cap(r.required_pfd);
  if (r.pfd_avg) r.rrf = *r.pfd_avg > 0.0 ? std::optional<double>(1.0 / *r.pfd_avg) : std::nullopt;
  for (auto& s : r.subsystems) {
    cap(s.pfd_avg);
    cap(s.pfd_avg_simplified);
    cap(s.pfd_avg_exact);
  }
  if (r.uncertainty && r.demand_mode == DemandMode::kLow) {
    r.uncertainty->p50 = std::min(1.0, r.uncertainty->p50);
    r.uncertainty->mean = std::min(1.0, r.uncertainty->mean);
    r.uncertainty->p05 = std::min(1.0, r.uncertainty->p05);
    r.uncertainty->p95 = std::min(1.0, r.uncertainty->p95);
  }
}

}  // namespace sifter
