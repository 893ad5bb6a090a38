#pragma once
/// SIL bands of IEC 61508-1:2010 Tables 2/3 and IEC 61511-1:2016 Tables 4/5, with tolerant edges.
#include <optional>

#include "sifter/model/model.hpp"

namespace sifter {

/// Relative tolerance at band edges: products of decimal factors are not exact in binary
/// floating point (1e-5 / (0.1 x 0.1 x 0.01) = 0.09999999999999999 must read as 0.1).
inline constexpr double kEdgeRelTol = 1e-9;

/// The SIL a PFDavg falls in (low demand); 0 below SIL 1, at most 4. Bands are half open:
/// [1e-2, 1e-1) is SIL 1, so exactly 0.01 is SIL 1.
int sil_from_pfd_avg(double pfd_avg);

/// The SIL a PFH per hour falls in (high demand); 0 below SIL 1, at most 4.
int sil_from_pfh(double pfh_per_hour);

/// The SIL needed for a risk reduction factor: (10, 100] is SIL 1; 10 or less is 0; above
/// 10 000 is 4 (and above 100 000 still 4: the caller flags it).
int sil_required_from_rrf(double rrf);

/// The SIL needed for a required PFH per hour: PFH must be below 10^-(n+4) for SIL n.
int sil_required_from_pfh(double required_pfh_per_hour);

/// The largest PFDavg (low demand) or PFH per hour (high demand) a SIF of this SIL may have.
double sil_upper_limit(int sil, DemandMode mode);

/// Whether a value is no more than its limit, with the edge tolerance.
bool at_most(double value, double limit);

/// Snaps a value within kEdgeRelTol of a power of ten onto it.
double snap_to_decade(double value);

}  // namespace sifter
