#pragma once
/// Physical and logical plausibility of a SIF that needs its demand mode: the supplier's figure
/// and the target must be of that mode; the signal path should reach from sensor to final element.
#include <cstddef>
#include <string>
#include <string_view>
#include <unordered_map>
#include <vector>

#include "sifter/model/diagnostics.hpp"
#include "sifter/model/model.hpp"

namespace sifter {

/// The problems of a SIF whose figures or target belong to the other demand mode: a vendor
/// "pfh" where a PFDavg is needed (low demand) or the reverse; an RRF or PFDavg target on a
/// high-demand SIF or a PFH target on a low-demand one (IEC 61511-1:2016 3.2.39, 9.2.4; seen).
/// `basis` says why the mode is what it is ("stated", "low demand assumed", "from scenario S").
std::vector<GraphProblem> demand_mode_mismatches(const Sif& sif, DemandMode mode, const std::string& basis);

/// Warnings for a SIF without a sensor subsystem or without a final-element subsystem; a
/// stated "path_exception" is quoted back in the warning.
std::vector<Warning> signal_path_warnings(const Sif& sif);

/// The SIFs (indices into Project::sifs) that a warning's place names: the SIF's pointer, a
/// place inside it, or its id; each index once, in increasing order.
class SifsByPlace {
 public:
  explicit SifsByPlace(const Project& project);
  [[nodiscard]] std::vector<std::size_t> named_by(const std::string& where) const;

 private:
  std::unordered_map<std::string_view, std::vector<std::size_t>> by_pointer_;
  std::unordered_map<std::string_view, std::vector<std::size_t>> by_id_;
};

/// Copies into each SIF's own `warnings` every warning about it (its pointer, a place inside
/// it, or its id), so that the SIF's block shows what `warnings` lists. Each warning is looked
/// up by its place, so the work grows with the warnings, not with warnings times SIFs.
template <typename SifResults>
void attach_sif_warnings(const Project& project, const std::vector<Warning>& warnings, SifResults& sifs) {
  const SifsByPlace index(project);
  for (const auto& w : warnings)
    for (std::size_t i : index.named_by(w.where))
      if (i < sifs.size()) sifs[i].warnings.push_back(w.message);
}

}  // namespace sifter
