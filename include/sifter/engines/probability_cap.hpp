#pragma once
/// No probability outside [0, 1] reaches the judge: where the simplified equations of
/// IEC 61508-6 Annex B (a rare-event sum) give a PFDavg above 1 they are outside their validity,
/// and a figure below zero that no rounding explains is a defect of sifter.
#include <optional>
#include <string>
#include <vector>

#include "sifter/results/sif.hpp"

namespace sifter {

/// What a cap found: the texts to say in the SIF's block, and whether a figure was below zero
/// beyond rounding (a defect).
struct CapFindings {
  std::vector<std::string> messages;
  bool defect = false;
  /// The judged PFDavg as summed over the subsystems, where it was above 1 (beyond rounding):
  /// outside the validity of the rare-event sum.
  std::optional<double> judged_above_one;
};

/// Caps the SIF's and its subsystems' PFDavg figures (judged, simplified, exact, required) at 1
/// and lifts every figure below zero, PFH included, to 0; the RRF then follows the capped PFDavg.
/// verify_sif calls it before the judge, so the judge, the SIL and the credit see the capped
/// figures. A figure below zero is lifted silently when it is rounding near zero (above -1e-12).
CapFindings cap_figures(SifResult& r);

/// The same for the Monte Carlo percentiles, after the sampling: never below zero, a PFD at most 1.
CapFindings cap_uncertainty(SifResult& r);

/// A SIF whose figures only a defect explains: marked, its SIL from probability 0 and no RRF.
/// The judge then finds it short (VerdictBasis::figures_sound) and apply_credit credits it
/// nothing in its scenarios (a credit PFD of 1).
void declare_defective(SifResult& r);

/// Says the findings in the SIF's assumptions and, at the SIF's place, in `warnings`.
void say_findings(const Sif& sif, const CapFindings& found, SifResult& r, std::vector<Warning>& warnings);

}  // namespace sifter
