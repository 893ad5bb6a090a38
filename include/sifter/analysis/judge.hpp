#pragma once
/// The one requirement of a SIF and the one judge of a figure against it: verify, the
/// what-ifs, every Monte Carlo sample, the LOPA credit and the writers all ask here.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/diagnostics.hpp"
#include "sifter/model/model.hpp"
#include "sifter/results/lopa.hpp"

namespace sifter {

/// Why the SIF's demand mode is what its scenarios make it, in words: the summed demand rate,
/// the scenarios it comes from and the once-a-year boundary (IEC 61511-1:2016 3.2.39).
std::string demand_basis(const SifRequirement& requirement);

/// What one SIF must reach: the stricter of its stated target and its scenarios' requirement.
/// A figure meets it when its SIL band reaches `sil` (IEC 61511-1:2016 Tables 4/5, half-open
/// edges) and, where a value is required, it is at_most that value.
struct SifTarget {
  DemandMode mode = DemandMode::kLow;
  std::optional<int> sil;                       ///< the required SIL; none = the SIF is not judged
  std::optional<double> required_pfd;           ///< low demand: the required PFDavg, if a value is set
  std::optional<double> required_pfh_per_hour;  ///< high demand: the required PFH, if set
  std::optional<double> required_rrf;           ///< low demand: 1 / required_pfd where stated so
  std::string text;                             ///< the target as a reviewer reads it
  /// The value a figure must not exceed: the required value or the band's upper edge, the smaller.
  [[nodiscard]] std::optional<double> limit() const;
};

/// Builds the one requirement of a SIF in `mode`; a stated target that differs from what the
/// LOPA asks is reported in `warnings` (the stricter applies).
SifTarget sif_target(const Sif& sif, DemandMode mode, const std::optional<SifRequirement>& lopa,
                     std::vector<Warning>& warnings);

/// The one judge: whether `figure` (PFDavg, or PFH per hour, as target.mode says) meets the
/// target. No SIL required: std::nullopt.
std::optional<bool> judge(const SifTarget& target, double figure);

/// Everything a SIF's verdict rests on besides its figure: the SIL its architecture and its
/// systematic capability allow, whether every stated requirement (response time, spurious trip
/// limit, required proof-test interval; requirements.hpp) holds, and on Route 2H the Monte
/// Carlo's confidence that the figure meets the target.
struct VerdictBasis {
  int sil_architecture = 4;
  int sil_systematic = 4;
  bool stated_requirements_met = true;
  std::optional<double> route_2h_confidence;  ///< P(figure meets target), Route 2H with a Monte Carlo only
  bool figures_sound = true;           ///< false: a figure only a defect explains (probability_cap.hpp); never a pass
  bool judged_within_validity = true;  ///< false: a judged sum above 1, shown as 1; never a pass
};

/// Route 2H asks at least this confidence that the target failure measure is met
/// (IEC 61508-2:2010 7.4.4.3.1, from memory).
inline constexpr double kRoute2hMinConfidence = 0.9;

/// The one verdict of a SIF: the judge of its figure against its target, the architecture and
/// SC reaching the required SIL, every stated requirement met and, on Route 2H, the confidence.
/// A stated requirement not met makes the SIF fall short even without a target; without a
/// target and with every stated requirement met, it is not judged (std::nullopt). A SIF whose
/// figures are not sound falls short, target or not, and so does one whose judged PFDavg was a
/// sum above 1 over its subsystems (shown as 1, which would otherwise meet a required PFD of 1). verify, every
/// what-if (through verify_sif), each Monte Carlo sample and the writers take this verdict.
std::optional<bool> sif_verdict(const SifTarget& target, std::optional<double> figure, const VerdictBasis& basis);

/// The lower edge of the band of a SIL: the best figure a SIF of that SIL may be credited with
/// (IEC 61511-1:2016 Tables 4/5; SIL 0 is the band above SIL 1: 0.1 low demand, 1e-5/h high).
double sil_band_lower_edge(int sil, DemandMode mode);

/// The PFD a SIF is credited with in its scenarios: the judged PFD, but no better than the
/// lower edge of the band of the SIL it achieves (IEC 61511-1:2016 clause 9, from memory).
struct SifCredit {
  double value = 1.0;
  bool capped = false;  ///< the band edge, not the judged figure, sets the credit
};
SifCredit sif_credit(double judged, int sil_achieved, DemandMode mode);

}  // namespace sifter
