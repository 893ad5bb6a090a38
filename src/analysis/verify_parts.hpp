#pragma once
// Helpers shared by the verify sources (src/analysis/verify*.cpp); not part of the public API.
#include <string>
#include <vector>

#include "sifter/model/model.hpp"
#include "sifter/results/sif.hpp"

namespace sifter::detail {

/// Defaults applied, gathered per kind so that the output names each once with its subsystems.
struct DefaultsApplied {
  std::vector<std::string> interval, mttr, mrt_equals_mttr, beta_d_equals_beta;
};

/// One subsystem's simplified figure (IEC 61508-6:2010 Annex B) or its supplier's figure, with
/// the assumptions behind it; the defaults it took are gathered in `defaults`.
SubsystemResult evaluate_subsystem(const Project& project, const Subsystem& sub, DemandMode mode,
                                   Assumptions& assumptions, DefaultsApplied& defaults);

/// One assumption per kind of default applied, naming the subsystems that took it.
void describe_defaults(const Project& project, const DefaultsApplied& defaults, Assumptions& assumptions);

}  // namespace sifter::detail
