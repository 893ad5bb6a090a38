// Keeping probabilities inside [0, 1] before the judge, and saying why where that took more than rounding.
#include "sifter/engines/probability_cap.hpp"

#include <algorithm>
#include <cstdio>
#include <limits>

#include "sifter/engines/sil.hpp"
#include "sifter/model/format.hpp"

namespace sifter {
namespace {

// Rounding leaves a difference near zero (the exact engine's one minus the working states, for
// rates near 1e-160/h) a few units of 1e-16 below zero, never more than this.
constexpr double kRoundingBelowZero = -1e-12;

// A figure below zero is shown as 0 and, when `top` is given, one above it as `top`. The most
// negative value lifted is kept in `lowest`, so that a value no rounding explains is reported.
void cap(std::optional<double>& p, double& lowest, double top = 1.0) {
  if (!p) return;
  if (*p < 0.0) {
    lowest = std::min(lowest, *p);
    p = 0.0;
  } else if (*p > top) {
    p = top;
  }
}

void note_defect(double lowest, CapFindings& found) {
  if (lowest >= kRoundingBelowZero) return;
  found.defect = true;
  found.messages.push_back(
      "a figure of " + figure(lowest) +
      " came out of the engines, below zero, which no probability or rate is and no rounding explains; "
      "shown as 0, the SIF judged to fall short and credited nothing in its scenarios. This is a defect "
      "of sifter: report it with the project file");
}

}  // namespace

CapFindings cap_figures(SifResult& r) {
  CapFindings found;
  // IEC 61508-6:2010 B.2.2 sums the subsystems' PFDavg as a rare-event approximation of
  // 1 - prod(1 - PFD_i); the Annex B terms (lDU T1)^k grow without bound (seen). A sum above 1
  // means the approximation no longer holds: the probability is at most 1. The judged figure
  // (the sum of the subsystems' judged figures, simplified, exact or the supplier's) is checked
  // with the judge's tolerance, so that a 1 written as 1 + 1e-16 is not taken for a sum above 1.
  if (r.pfd_avg && *r.pfd_avg > 1.0 * (1.0 + kEdgeRelTol)) found.judged_above_one = *r.pfd_avg;
  const char* short_whatever = "; the SIF is judged short whatever its target";
  const std::optional<double> simplified = r.pfd_avg_simplified ? r.pfd_avg_simplified : r.pfd_avg;
  if (simplified && *simplified > 1.0)
    found.messages.push_back(
        "the simplified PFDavg sums to " + figure(*simplified) +
        ", outside the validity of the IEC 61508-6 Annex B equations; shown as at most 1 (a probability "
        "is at most 1)" +
        (found.judged_above_one ? std::string(short_whatever)
         : r.pfd_avg_exact
             ? "; the verdict rests on the exact engine, which gives " + figure(std::min(1.0, *r.pfd_avg_exact))
             : std::string()));
  else if (found.judged_above_one)
    found.messages.push_back("the judged PFDavg sums to " + figure(*found.judged_above_one) +
                             " over the subsystems, outside the validity of the rare-event sum of IEC 61508-6:2010 "
                             "B.2.2; shown as 1" +
                             short_whatever);
  constexpr double kNoTop = std::numeric_limits<double>::infinity();  // a PFH is a rate, not a probability
  double lowest = 0.0;
  for (auto* p : {&r.pfd_avg, &r.pfd_avg_simplified, &r.pfd_avg_exact, &r.required_pfd}) cap(*p, lowest);
  for (auto* p : {&r.pfh_per_hour, &r.pfh_simplified_per_hour, &r.pfh_exact_per_hour}) cap(*p, lowest, kNoTop);
  if (r.pfd_avg) r.rrf = *r.pfd_avg > 0.0 ? std::optional<double>(1.0 / *r.pfd_avg) : std::nullopt;
  for (auto& s : r.subsystems) {
    for (auto* p : {&s.pfd_avg, &s.pfd_avg_simplified, &s.pfd_avg_exact}) cap(*p, lowest);
    for (auto* p : {&s.pfh_per_hour, &s.pfh_simplified_per_hour, &s.pfh_exact_per_hour}) cap(*p, lowest, kNoTop);
  }
  note_defect(lowest, found);
  return found;
}

CapFindings cap_uncertainty(SifResult& r) {
  CapFindings found;
  if (!r.uncertainty) return found;
  // Percentiles of a PFD (low demand) or a PFH: never below zero, a PFD at most 1.
  const double top = r.demand_mode == DemandMode::kLow ? 1.0 : std::numeric_limits<double>::max();
  double lowest = 0.0;
  for (double* v : {&r.uncertainty->p50, &r.uncertainty->mean, &r.uncertainty->p05, &r.uncertainty->p95}) {
    lowest = std::min(lowest, *v);
    *v = std::clamp(*v, 0.0, top);
  }
  note_defect(lowest, found);
  return found;
}

void declare_defective(SifResult& r) {
  r.figures_defective = true;
  r.sil_probability = 0;
  r.sil_achieved = 0;
  r.rrf = std::nullopt;
}

void say_findings(const Sif& sif, const CapFindings& found, SifResult& r, std::vector<Warning>& warnings) {
  for (const auto& m : found.messages) {
    r.assumptions.push_back(m);
    warnings.push_back({sif.pointer, m});
  }
}

}  // namespace sifter
