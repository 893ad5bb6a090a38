#pragma once
/// Monte Carlo on a SIF's failure data: the distribution of its PFDavg (or PFH).
#include "sifter/engines/uncertainty.hpp"
#include "sifter/results/sif.hpp"

namespace sifter {

/// Runs the Monte Carlo of one SIF: every sample scales each component's rates by its
/// source's lognormal factor (components of one library model share a factor) and evaluates
/// the SIF on the IEC 61508-6 Annex B simplified equations, against the required PFDavg (or
/// PFH) already decided in `verified`. Vendor figures are taken as certain.
UncertaintyResult sif_uncertainty(const Project& project, const Sif& sif, const SifResult& verified,
                                  const UncertaintyPlan& plan, const MonteCarloOptions& options);

}  // namespace sifter
