// The limits that keep a SIF below its required SIL, each with what would lift it.
#include <algorithm>
#include <array>
#include <cmath>
#include <cstdio>

#include "sifter/engines/constraints.hpp"
#include "sifter/engines/sil.hpp"
#include "sifter/model/format.hpp"
#include "sifter/model/vocabulary.hpp"

namespace sifter {
namespace {

using detail::format_edge;
using detail::quoted;

std::string sc_text(int sc) { return "SC " + std::to_string(sc); }

// The smallest votes with this HFT: 1ooN, and KooN with the vote's own K where K > 1.
std::string revote(const Vote& vote, int hft) {
  std::string votes = "1oo" + std::to_string(hft + 1);
  if (vote.k > 1) votes += " or " + std::to_string(vote.k) + "oo" + std::to_string(vote.k + hft);
  return "re-vote as " + votes + " (HFT " + std::to_string(hft) + ")";
}

const ElementConstraints* find_element(const SubsystemConstraints& s, const std::optional<std::string>& id) {
  if (!id) return nullptr;
  const auto it = std::find_if(s.elements.begin(), s.elements.end(),
                               [&](const ElementConstraints& e) { return e.component == *id; });
  return it == s.elements.end() ? nullptr : &*it;
}

std::string lift_fault_tolerance(const SubsystemConstraints& s, int required) {
  const int hft = min_hft_table6(required, s.mode);
  if (s.vendor) return "use an arrangement with HFT " + std::to_string(hft) + " or more";
  return revote(s.vote, hft);
}

std::string lift_route_1h(const SubsystemConstraints& s, const ElementConstraints& e, int required) {
  // The vote must lift every element of the group, not only this one.
  int hft = 0;
  for (const auto& other : s.elements)
    if (other.type && other.sff) hft = std::max(hft, min_hft_route_1h(*other.type, *other.sff, required));
  std::string lift = revote(s.vote, hft);
  const int now = s.hft.value_or(0);
  const char* type = *e.type == ElementType::kA ? "Type A" : "Type B";
  if (const auto sff = min_sff_route_1h(*e.type, now, required))
    lift += ", or use an element with SFF of at least " + format_edge(*sff) + " in place of " + e.component;
  else
    lift += "; at HFT " + std::to_string(now) + " no " + type + " element reaches " + sil_words(required);
  return lift;
}

std::string lift_element_sc(const SubsystemConstraints& s, const ElementConstraints& e, int required) {
  const std::string replace = " in place of " + e.component;
  if (s.diversity_credit)
    return "use an element of " + sc_text(required - 1) + " or higher" + replace + " (the diverse group adds one)";
  const int sc = e.systematic_capability.value_or(0);
  const std::string higher = "use an element of " + sc_text(required) + " or higher" + replace;
  if (sc + 1 < required) return higher + " (diversity adds only one level)";
  if (s.hft.value_or(0) >= 1)
    return higher + ", or show that the channels of " + quoted(s.subsystem) +
           " are diverse and independent and mark the group diverse with a note (SC N+1, IEC 61508-2:2010 7.4.3)";
  return higher + ", or add a diverse redundant one whose independence is justified (SC N+1, IEC 61508-2:2010 7.4.3)";
}

std::string lift_vendor_sc(const Cap& cap, int required) {
  const std::string higher = "use equipment of " + sc_text(required) + " or higher";
  if (cap.sil + 1 < required) return higher;
  return higher + ", or add a diverse redundant one whose independence is justified (SC N+1, IEC 61508-2:2010 7.4.3)";
}

std::string lift(const Cap& cap, const SubsystemConstraints& s, int required) {
  const ElementConstraints* e = find_element(s, cap.element);
  const std::string id = cap.element.value_or(s.subsystem);
  const std::string route_2h_or = ", or assess the SIF on Route 1H or under IEC 61511";
  switch (cap.cause) {
    case CapCause::kFaultTolerance:
      return lift_fault_tolerance(s, required);
    case CapCause::kRoute1hElement:
      return e ? lift_route_1h(s, *e, required) : "";
    case CapCause::kElementTypeMissing:
      return "declare the element type of " + id + " (A or B) from its safety manual";
    case CapCause::kSffUnknown:
      return "give the failure rates of " + id + " or the SFF from its safety manual";
    case CapCause::kDiagnosticCoverage:
      return (e && !e->type ? "declare the element type of " + id + " (Route 2H sets no DC rule for Type A), " : "") +
             "use an element with DC of at least " + format_edge(kRoute2hMinDiagnosticCoverage) + " in place of " + id +
             route_2h_or;
    case CapCause::kDataConfidence:
      return "give failure data for " + id + " at " + format_edge(kRoute2hMinDataConfidence) + " confidence or more" +
             route_2h_or;
    case CapCause::kHftNotDeclared:
      return "declare the HFT of the vendor subsystem from its safety manual (" + sil_words(required) + " needs HFT " +
             std::to_string(min_hft_table6(required, s.mode)) + ")";
    case CapCause::kVendorRoute1h:
      return "declare the SIL capability from the vendor's certificate, or assess the SIF under IEC 61511 or on "
             "Route 2H";
    case CapCause::kElementSc:
      return e ? lift_element_sc(s, *e, required) : "";
    case CapCause::kScMissing: {
      const int needed = s.diversity_credit ? required - 1 : required;
      return "declare the SC of " + id + " from its certificate or safety manual (" + sc_text(needed) +
             " or higher is needed), or its prior use with the evidence, \"prior_use\": {\"sil\": " +
             std::to_string(needed) + ", \"evidence\": \"...\"} (IEC 61511-1:2016 11.5.3)";
    }
    case CapCause::kVendorSc:
      return lift_vendor_sc(cap, required);
    case CapCause::kScNotDeclared:
      return "declare the SC of the vendor subsystem from its certificate (" + sc_text(required) +
             " or higher is needed)";
    case CapCause::kNoElements:
      return "give the subsystem its channels and components";
    case CapCause::kCertificate:
      return "use equipment whose certificate allows " + sil_words(required) + " or higher";
    case CapCause::kPriorUse:
      return "show prior use of " + id + " for " + sil_words(required) + " or higher, or use an element of " +
             sc_text(required) + " or higher in place of it";
  }
  return "";
}

std::string format_measure(double value, DemandMode mode) {
  if (mode == DemandMode::kHigh) return format_rate(Rate{value});
  return sifter::probability(value);
}

std::optional<Limit> probability_limit(const ProbabilityCheck& p, int required_sil) {
  const double band_edge = sil_upper_limit(required_sil, p.mode);
  const double required = p.required > 0.0 ? p.required : band_edge;
  // A required value on the band's edge is exclusive (IEC 61508-1:2010 Tables 2/3, half open).
  const bool exclusive = std::fabs(required - band_edge) <= kEdgeRelTol * band_edge;
  const bool below_band = p.sil < required_sil;
  const bool above_required =
      exclusive ? !(p.achieved < required * (1.0 - kEdgeRelTol)) : !at_most(p.achieved, required);
  if (!below_band && !above_required) return std::nullopt;
  const std::string name = p.mode == DemandMode::kLow ? "PFDavg" : "PFH";
  std::string message = "The " + name + " of " + format_measure(p.achieved, p.mode);
  if (below_band)
    message += (p.sil > 0 ? " allows only " + sil_words(p.sil) : std::string(" reaches no SIL")) + "; " +
               sil_words(required_sil) + " is required.";
  else
    message +=
        " lies in the " + sil_words(p.sil) + " band but above the required " + format_measure(required, p.mode) + ".";
  message += " To lift it: bring the " + name + (exclusive ? " below " : " to ") + format_measure(required, p.mode) +
             (exclusive ? "." : " or less.");
  return Limit{"probability", std::nullopt, std::nullopt, p.sil, message};
}

}  // namespace

std::vector<Limit> limits_for(const ProbabilityCheck& probability, const SifConstraints& constraints,
                              int sil_required) {
  std::vector<Limit> out;
  if (sil_required <= 0) return out;
  if (auto limit = probability_limit(probability, sil_required)) out.push_back(std::move(*limit));
  for (const CapKind kind : {CapKind::kArchitecture, CapKind::kSystematic}) {
    for (const auto& s : constraints.subsystems) {
      for (const auto& cap : s.caps) {
        if (cap.kind != kind || cap.sil >= sil_required) continue;
        std::string message = cap.reason + " " + sil_words(sil_required) +
                              " is required. To lift it: " + lift(cap, s, sil_required) + ".";
        out.push_back(Limit{kind == CapKind::kArchitecture ? "architecture" : "systematic", s.subsystem, cap.element,
                            cap.sil, std::move(message)});
      }
    }
  }
  return out;
}

}  // namespace sifter
