// Cross-section plausibility decided once in loading: the demand mode of a SIF's figures and
// target, and its signal path (see plausibility.hpp).
#include <set>

#include "input/load_parts.hpp"
#include "sifter/engines/plausibility.hpp"

namespace sifter::detail {

void check_project_plausibility(LoadContext& ctx, const Project& project) {
  // A SIF that no scenario credits keeps its stated (or the default low) mode; one that a
  // scenario credits without a stated mode takes it from the LOPA, and is checked there.
  std::set<std::string> credited;
  for (const auto& s : project.scenarios)
    for (const auto& l : s.layers)
      if (!l.sif.empty()) credited.insert(l.sif);
  for (const auto& sif : project.sifs) {
    for (auto& w : signal_path_warnings(sif)) ctx.warn(w.where, std::move(w.message));
    if (!sif.demand_mode_stated && credited.count(sif.id)) continue;
    const std::string basis = sif.demand_mode_stated ? "stated" : "not stated; low demand assumed";
    for (const auto& p : demand_mode_mismatches(sif, sif.demand_mode(), basis))
      ctx.error(0, p.pointer, p.expected, p.found, p.hint);
  }
}

}  // namespace sifter::detail
