// SIL bands and tolerant comparisons (REFERENCES.md §4, IEC 61508-1:2010 Tables 2/3, seen).
#include "sifter/sil.hpp"

#include <cmath>

namespace sifter {

double snap_to_decade(double value) {
  if (!(value > 0.0) || !std::isfinite(value)) return value;
  const double decade = std::pow(10.0, std::round(std::log10(value)));
  return std::fabs(value - decade) <= kEdgeRelTol * decade ? decade : value;
}

bool at_most(double value, double limit) { return value <= limit * (1.0 + kEdgeRelTol); }

namespace {
// Low demand bands start at 1e-1 (SIL 1 upper edge, exclusive); high demand at 1e-5 per hour.
int band(double value, double sil1_upper) {
  const double v = snap_to_decade(value);
  int sil = 0;
  double upper = sil1_upper;
  while (sil < 4 && v < upper) {
    ++sil;
    upper /= 10.0;
  }
  return sil;
}
}  // namespace

int sil_from_pfd_avg(double pfd_avg) { return band(pfd_avg, 1e-1); }
int sil_from_pfh(double pfh_per_hour) { return band(pfh_per_hour, 1e-5); }

int sil_required_from_rrf(double rrf) {
  // RRF in (10^n, 10^(n+1)] needs SIL n; an RRF of exactly 100 is SIL 1.
  const double v = snap_to_decade(rrf);
  int sil = 0;
  double lower = 10.0;
  while (sil < 4 && v > lower) {
    ++sil;
    lower *= 10.0;
  }
  return sil;
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
