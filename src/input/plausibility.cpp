// Demand-mode consistency and the signal path of a SIF (see plausibility.hpp).
#include "sifter/input/plausibility.hpp"

#include <algorithm>

namespace sifter {

std::vector<GraphProblem> demand_mode_mismatches(const Sif& sif, DemandMode mode, const std::string& basis) {
  std::vector<GraphProblem> out;
  const bool low = mode == DemandMode::kLow;
  for (const auto& sub : sif.subsystems) {
    if (!sub.is_vendor()) continue;
    if (low && !sub.vendor_pfd_avg)
      out.push_back({sub.pointer + "/pfh", "the supplier's \"pfd_avg\" for this low-demand SIF (" + basis + ")",
                     "only \"pfh\"; the PFDavg is missing",
                     "take the PFDavg from the safety manual, or state \"demand_mode\": \"high\" if the SIF is "
                     "demanded more than once a year"});
    if (!low && !sub.vendor_pfh)
      out.push_back({sub.pointer + "/pfd_avg", "the supplier's \"pfh\" for this high-demand SIF (" + basis + ")",
                     "only \"pfd_avg\"; the PFH is missing",
                     "take the PFH from the safety manual; a PFDavg does not bound a dangerous failure rate"});
  }
  if (sif.target) {
    const auto kind = sif.target->kind;
    if (low && kind == Target::Kind::kPfh)
      out.push_back({sif.pointer + "/target/pfh",
                     "a low-demand target (\"sil\", \"rrf\" or \"pfd_avg\") (" + basis + ")", "a PFH target",
                     "a PFH target is for a high-demand SIF: state \"demand_mode\": \"high\", or give the target as "
                     "a SIL, RRF or PFDavg"});
    if (!low && (kind == Target::Kind::kRrf || kind == Target::Kind::kPfdAvg))
      out.push_back({sif.pointer + (kind == Target::Kind::kRrf ? "/target/rrf" : "/target/pfd_avg"),
                     "a high-demand target (\"sil\" or \"pfh\") (" + basis + ")",
                     kind == Target::Kind::kRrf ? "an RRF target" : "a PFDavg target",
                     "an RRF or PFDavg target is for a low-demand SIF; give the target as a SIL or a PFH, or state "
                     "\"demand_mode\": \"low\""});
  }
  return out;
}

std::vector<Warning> signal_path_warnings(const Sif& sif) {
  bool sensor = false, final_element = false;
  for (const auto& sub : sif.subsystems) {
    sensor = sensor || sub.role == Role::kSensor;
    final_element = final_element || sub.role == Role::kFinal;
  }
  // IEC 61511-1:2016 3.2.66: a SIF comprises sensor(s), logic solver(s) and final element(s)
  // (from memory). A SIF missing one is either incomplete or a stated exception.
  std::vector<Warning> out;
  auto add = [&](const std::string& missing) {
    std::string m = "the SIF has no " + missing + " subsystem; ";
    m += sif.path_exception.empty()
             ? "its figure leaves that part out (state why under \"path_exception\" if this is intended)"
             : "stated exception: \"" + sif.path_exception + "\"";
    out.push_back({sif.pointer, m});
  };
  if (!sensor) add("sensor");
  if (!final_element) add("final-element");
  return out;
}

}  // namespace sifter

namespace sifter {

SifsByPlace::SifsByPlace(const Project& project) {
  by_pointer_.reserve(project.sifs.size());
  by_id_.reserve(project.sifs.size());
  for (std::size_t i = 0; i < project.sifs.size(); ++i) {
    by_pointer_[project.sifs[i].pointer].push_back(i);
    by_id_[project.sifs[i].id].push_back(i);
  }
}

std::vector<std::size_t> SifsByPlace::named_by(const std::string& where) const {
  std::vector<std::size_t> out;
  auto add = [&](const auto& map, std::string_view key) {
    auto found = map.find(key);
    if (found != map.end()) out.insert(out.end(), found->second.begin(), found->second.end());
  };
  add(by_id_, where);
  add(by_pointer_, where);
  // A place inside a SIF: every proper prefix of `where` that ends before a '/'.
  for (std::size_t slash = where.find('/'); slash != std::string::npos; slash = where.find('/', slash + 1))
    add(by_pointer_, std::string_view(where).substr(0, slash));
  std::sort(out.begin(), out.end());
  out.erase(std::unique(out.begin(), out.end()), out.end());
  return out;
}

}  // namespace sifter
