#pragma once
/// No probability above 1 leaves the engines: where the simplified equations of IEC 61508-6
/// Annex B (a rare-event sum) give a PFDavg above 1 they are outside their validity.
#include <string>
#include <vector>

#include "sifter/results/sif.hpp"

namespace sifter {

/// Caps the SIF's and its subsystems' PFDavg figures (simplified, exact, uncertainty) at 1,
/// saying so in the SIF's assumptions and in `warnings`; the RRF then is 1. Called after the
/// judge, which compares the uncapped figure (it falls short of any target either way). A figure
/// below zero is shown as 0: silently when it is rounding near zero (above -1e-12); else, as a
/// defect, with a warning, the SIF judged to fall short and credited nothing in LOPA.
void cap_probabilities(const Sif& sif, SifResult& r, std::vector<Warning>& warnings);

}  // namespace sifter
