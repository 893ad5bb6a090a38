// SIL bands and tolerant comparisons (DEVELOPERS.md, Methods M4, IEC 61508-1:2010 Tables 2/3, seen).
#include "sifter/engines/sil.hpp"

#include <algorithm>
#include <cmath>

namespace sifter {

double snap_to_decade(double value) {
  if (!(value > 0.0) || !std::isfinite(value)) return value;
  const double decade = std::pow(10.0, std::round(std::log10(value)));
  return std::fabs(value - decade) <= kEdgeRelTol * decade ? decade : value;
}

bool at_most(double value, double limit) { return value <= limit * (1.0 + kEdgeRelTol); }

namespace {
// Which band a value falls in, counted in decades below the SIL 1 upper edge; decades are
// compared in log space after snapping, so that 1e-6 is exactly six decades down.
int decades_below(double value, double sil1_upper) {
  const double v = snap_to_decade(value);
  if (!(v > 0.0)) return 4;
  const double e = std::log10(sil1_upper) - std::log10(v);
  return static_cast<int>(std::clamp(std::ceil(e), 0.0, 4.0));
}
}  // namespace

int sil_from_pfd_avg(double pfd_avg) { return decades_below(pfd_avg, 1e-1); }
int sil_from_pfh(double pfh_per_hour) { return decades_below(pfh_per_hour, 1e-5); }

int sil_required_from_rrf(double rrf) {
  // RRF in (10^n, 10^(n+1)] needs SIL n; an RRF of exactly 100 is SIL 1.
  if (!(rrf > 0.0)) return 0;
  return decades_below(1.0 / snap_to_decade(rrf), 1e-1);
}

int sil_required_from_pfh(double required_pfh_per_hour) {
  // A required PFH r is met by the SIL whose band lies wholly below it: the SIL of r itself.
  return sil_from_pfh(required_pfh_per_hour);
}

double sil_upper_limit(int sil, DemandMode mode) {
  // SIL n: PFDavg below 10^-n (low demand); PFH below 10^-(n+4) per hour (high demand).
  const double top = mode == DemandMode::kLow ? 1.0 : 1e-4;
  return top * std::pow(10.0, -sil);
}

}  // namespace sifter
