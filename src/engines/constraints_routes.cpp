// Route 1H (IEC 61508-2:2010 Tables 2 and 3), Route 2H and IEC 61511-1:2016 Table 6 applied
// to one subsystem's fault tolerance and elements.
#include <algorithm>
#include <string>

#include "engines/constraints_assessment.hpp"

namespace sifter::detail {
namespace {

const char* type_text(ElementType type) { return type == ElementType::kA ? "Type A" : "Type B"; }

const char* mode_text(DemandMode mode) {
  return mode == DemandMode::kLow ? "low demand mode" : "high demand or continuous mode";
}

std::string table6_source(ConstraintBasis basis) {
  return basis == ConstraintBasis::kRoute2H ? "Route 2H, IEC 61508-2:2010 7.4.4.3" : "IEC 61511-1:2016 Table 6";
}

}  // namespace

void Assessment::fault_tolerance_cap(const std::string& subject) {
  const int hft = *out_.hft;
  const int sil = max_sil_table6(hft, out_.mode);
  cap(CapKind::kArchitecture, CapCause::kFaultTolerance, sil, std::nullopt,
      subject + ", which allows at most SIL " + std::to_string(sil) + " in " + mode_text(out_.mode) + " (" +
          table6_source(out_.basis) + ").");
}

void Assessment::route_1h() {
  const int hft = *out_.hft;
  const std::string in = "In subsystem " + name_ + ", ";
  std::vector<Cap> element_caps;
  bool complete = true;  // every element has a type and an SFF
  for (auto& e : out_.elements) {
    if (!e.type || !e.sff) complete = false;
    if (!e.type) {
      element_caps.push_back(Cap{CapKind::kArchitecture, CapCause::kElementTypeMissing, 0, e.component,
                                 in + e.component +
                                     " has no element type (A or B), so Route 1H cannot be applied and the " +
                                     "subsystem cannot claim a SIL from its architecture."});
      continue;
    }
    if (!e.sff) {
      element_caps.push_back(Cap{CapKind::kArchitecture, CapCause::kSffUnknown, 0, e.component,
                                 in + e.component +
                                     " has neither failure rates nor a declared SFF, so Route 1H cannot be applied " +
                                     "and the subsystem cannot claim a SIL from its architecture."});
      continue;
    }
    const int sil = max_sil_route_1h(*e.type, *e.sff, hft);
    e.sil_route_1h = sil;
    const std::string element = e.component + " (" + type_text(*e.type) + ", " +
                                (e.sff_declared ? "declared SFF " : "SFF ") + format_percent(*e.sff) + ")";
    const std::string source =
        std::string("(Route 1H, IEC 61508-2:2010 ") + (*e.type == ElementType::kA ? "Table 2" : "Table 3") + ").";
    const std::string what =
        sil == 0 ? " is not allowed at HFT " + std::to_string(hft) + " "
                 : " at HFT " + std::to_string(hft) + " allows at most SIL " + std::to_string(sil) + " ";
    element_caps.push_back(
        Cap{CapKind::kArchitecture, CapCause::kRoute1hElement, sil, e.component, in + element + what + source});
  }
  if (complete) {
    if (auto combined = parallel_combination(in, hft)) {
      cap(CapKind::kArchitecture, CapCause::kRoute1hElement, combined->sil, combined->element, combined->reason);
      return;
    }
  }
  for (auto& c : element_caps) out_.caps.push_back(std::move(c));
}

// Parallel channels of different elements (IEC 61508-2:2010 7.4.4.2.4, from memory; DEVELOPERS.md,
// Methods M5): each channel is looked up at HFT 0 (its lowest series element, 7.4.4.2.3), and
// the group takes the best channel's SIL plus the group's HFT, up to SIL 4. A KooN group counts
// on K working channels, so it takes the K-th best channel (the best for 1ooN; our own reading
// for K > 1, the conservative one). Tables 2 and 3 themselves add one SIL per fault tolerated
// (every cell at HFT h is the HFT 0 cell plus h, up to 4), so for channels of equal HFT 0
// results this is the element lookup at the group's HFT: empty then, and the element caps stand.
std::optional<Cap> Assessment::parallel_combination(const std::string& in, int hft) const {
  if (s_.channels.size() < 2) return std::nullopt;
  struct ChannelSil {
    int sil = 4;
    const ElementConstraints* weakest = nullptr;
  };
  std::vector<ChannelSil> channels;
  for (const auto& channel : s_.channels) {
    ChannelSil c;
    for (std::size_t index : channel.components) {
      const auto& id = components_->at(index).id;
      const auto it = std::find_if(out_.elements.begin(), out_.elements.end(),
                                   [&](const ElementConstraints& e) { return e.component == id; });
      if (it == out_.elements.end() || !it->type || !it->sff) return std::nullopt;
      const int sil0 = max_sil_route_1h(*it->type, *it->sff, 0);
      if (!c.weakest || sil0 < c.sil) c = ChannelSil{sil0, &*it};
    }
    if (!c.weakest) return std::nullopt;
    channels.push_back(c);
  }
  const bool equal =
      std::all_of(channels.begin(), channels.end(), [&](const ChannelSil& c) { return c.sil == channels.front().sil; });
  if (equal) return std::nullopt;
  auto ranked = channels;
  std::stable_sort(ranked.begin(), ranked.end(),
                   [](const ChannelSil& a, const ChannelSil& b) { return a.sil > b.sil; });
  const auto k = static_cast<std::size_t>(std::clamp(s_.vote.k, 1, static_cast<int>(ranked.size())));
  const ChannelSil& governing = ranked[k - 1];
  const int sil = std::min(4, governing.sil + hft);
  std::string each;
  for (std::size_t i = 0; i < channels.size(); ++i)
    each += (i == 0 ? "" : ", ") + std::string("channel ") + std::to_string(i + 1) + " SIL " +
            std::to_string(channels[i].sil) + " (" + channels[i].weakest->component + ")";
  const ElementConstraints& e = *governing.weakest;
  const std::string which =
      k == 1 ? "the best channel"
             : "the channel ranked " + std::to_string(k) + " of " + std::to_string(ranked.size()) + " (K of the vote)";
  return Cap{CapKind::kArchitecture, CapCause::kRoute1hElement, sil, e.component,
             in + "the channels are of different elements; at HFT 0 " + each + ". The group takes " + which +
                 ", governed by " + e.component + " (" + type_text(*e.type) + ", " +
                 (e.sff_declared ? "declared SFF " : "SFF ") + format_percent(*e.sff) + ", SIL " +
                 std::to_string(governing.sil) + " at HFT 0), plus its HFT " + std::to_string(hft) + ": at most SIL " +
                 std::to_string(sil) + " (Route 1H, parallel combination, IEC 61508-2:2010 7.4.4.2.4)."};
}

void Assessment::route_2h_elements() {
  const std::string in = "In subsystem " + name_ + ", ";
  const std::string dc_edge = format_edge(kRoute2hMinDiagnosticCoverage);
  const std::string conf_edge = format_edge(kRoute2hMinDataConfidence);
  const std::string source = " (IEC 61508-2:2010 7.4.4.3)";
  const std::string so = ", so the subsystem cannot claim a SIL on Route 2H.";
  for (const auto& e : out_.elements) {
    // Route 2H asks DC >= 60 % of Type B elements; an element of unknown type is held to it.
    if (!e.type || *e.type == ElementType::kB) {
      const std::string who = e.component + (e.type ? " (Type B)" : " (no element type given, taken as Type B)");
      if (!e.dc) {
        cap(CapKind::kArchitecture, CapCause::kDiagnosticCoverage, 0, e.component,
            in + who + " has no dangerous failure rate, so its DC cannot be shown to reach the " + dc_edge +
                " Route 2H requires of Type B elements" + source + so);
      } else if (!at_least(*e.dc, kRoute2hMinDiagnosticCoverage)) {
        cap(CapKind::kArchitecture, CapCause::kDiagnosticCoverage, 0, e.component,
            in + who + " has DC " + format_percent(*e.dc) + ", below the " + dc_edge +
                " Route 2H requires of Type B elements" + source + so);
      } else if (!e.type) {
        note(in + e.component + " has no element type; the Route 2H DC rule was applied as to a Type B element (DC " +
             format_percent(*e.dc) + ").");
      }
    }
    if (!e.data_confidence) {
      cap(CapKind::kArchitecture, CapCause::kDataConfidence, 0, e.component,
          in + "the failure data of " + e.component + " have no declared confidence; Route 2H requires at least " +
              conf_edge + source + so);
    } else if (!at_least(*e.data_confidence, kRoute2hMinDataConfidence)) {
      cap(CapKind::kArchitecture, CapCause::kDataConfidence, 0, e.component,
          in + "the failure data of " + e.component + " are declared at " + format_percent(*e.data_confidence) +
              " confidence, below the " + conf_edge + " Route 2H requires" + source + so);
    }
  }
}

}  // namespace sifter::detail
