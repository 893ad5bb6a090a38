// Architectural constraints and systematic capability (DEVELOPERS.md, Methods M5).
#include "sifter/engines/constraints.hpp"

#include <algorithm>
#include <array>
#include <cassert>
#include <cstdio>
#include <cstdlib>

#include "sifter/engines/sil.hpp"

namespace sifter {

namespace detail {

bool at_least(double value, double edge) { return value >= edge * (1.0 - kEdgeRelTol); }

std::string format_percent(double fraction) {
  // Two decimals suffice nearly always; more only where rounding would carry a value across a
  // rule's edge (0.599951 must not print as "60.00 %").
  constexpr std::array<double, 4> kEdges{0.6, 0.7, 0.9, 0.99};
  std::array<char, 48> buf{};
  for (int decimals = 2; decimals <= 8; ++decimals) {
    std::snprintf(buf.data(), buf.size(), "%.*f %%", decimals, fraction * 100.0);
    const double shown = std::strtod(buf.data(), nullptr) / 100.0;
    const bool same_side = std::all_of(kEdges.begin(), kEdges.end(),
                                       [&](double e) { return at_least(shown, e) == at_least(fraction, e); });
    if (same_side) break;
  }
  return buf.data();
}

std::string format_edge(double fraction) {
  std::array<char, 16> buf{};
  std::snprintf(buf.data(), buf.size(), "%.0f %%", fraction * 100.0);
  return buf.data();
}

std::string quoted(const std::string& name) { return "'" + name + "'"; }

}  // namespace detail

using detail::at_least;
using detail::format_edge;
using detail::format_percent;
using detail::quoted;

// ---- Element measures ------------------------------------------------------------------

int hardware_fault_tolerance(const Vote& vote) {
  // N - K channel faults still leave K working; 1oo2D is K = 1, N = 2, so HFT 1 as well.
  assert(vote.k >= 1 && vote.k <= vote.n);
  return vote.n - vote.k;
}

std::optional<double> safe_failure_fraction(const FailureRates& rates) {
  const double safe_or_detected = rates.lambda_s() + rates.lambda_dd.per_hour;
  const double total = safe_or_detected + rates.lambda_du.per_hour;
  if (!(total > 0.0)) return std::nullopt;
  return safe_or_detected / total;
}

std::optional<double> diagnostic_coverage(const FailureRates& rates) {
  const double ld = rates.lambda_d();
  if (!(ld > 0.0)) return std::nullopt;
  return rates.lambda_dd.per_hour / ld;
}

ElementSff element_sff(const Component& component) {
  if (component.sff_declared) return {component.sff_declared, true};
  return {safe_failure_fraction(component.rates), false};
}

SffBand sff_band(double sff) {
  if (at_least(sff, 0.99)) return SffBand::kAtLeast99;
  if (at_least(sff, 0.90)) return SffBand::kFrom90To99;
  if (at_least(sff, 0.60)) return SffBand::kFrom60To90;
  return SffBand::kBelow60;
}

double sff_band_lower_edge(SffBand band) {
  switch (band) {
    case SffBand::kBelow60:
      return 0.0;
    case SffBand::kFrom60To90:
      return 0.6;
    case SffBand::kFrom90To99:
      return 0.9;
    case SffBand::kAtLeast99:
      return 0.99;
  }
  return 0.0;
}

// ---- The three rule tables -------------------------------------------------------------

int min_hft_table6(int sil, DemandMode mode) {
  assert(sil >= 0 && sil <= 4);
  // IEC 61511-1:2016 Table 6.
  switch (sil) {
    case 0:
    case 1:
      return 0;
    case 2:
      return mode == DemandMode::kLow ? 0 : 1;
    case 3:
      return 1;
    default:
      return 2;
  }
}

int max_sil_table6(int hft, DemandMode mode) {
  int sil = 0;
  while (sil < 4 && min_hft_table6(sil + 1, mode) <= hft) ++sil;
  return sil;
}

namespace {

// IEC 61508-2:2010 Table 2 (Type A) and Table 3 (Type B): rows by SFF band, columns HFT 0, 1,
// 2. The 0 is the "not allowed" cell.
constexpr std::array<std::array<int, 3>, 4> kTable2TypeA{{{1, 2, 3}, {2, 3, 4}, {3, 4, 4}, {3, 4, 4}}};
constexpr std::array<std::array<int, 3>, 4> kTable3TypeB{{{0, 1, 2}, {1, 2, 3}, {2, 3, 4}, {3, 4, 4}}};

constexpr std::array<SffBand, 4> kBands{SffBand::kBelow60, SffBand::kFrom60To90, SffBand::kFrom90To99,
                                        SffBand::kAtLeast99};

int route_1h_cell(ElementType type, SffBand band, int hft) {
  assert(hft >= 0);
  const auto& table = type == ElementType::kA ? kTable2TypeA : kTable3TypeB;
  const auto& row = table[static_cast<std::size_t>(band)];
  if (hft <= 2) return row[static_cast<std::size_t>(hft)];
  // The tables stop at HFT 2; every further fault tolerated adds one SIL, as the parallel
  // combination rule of 7.4.4.2.4 does, up to SIL 4.
  return std::min(4, row[2] + (hft - 2));
}

}  // namespace

int max_sil_route_1h(ElementType type, double sff, int hft) { return route_1h_cell(type, sff_band(sff), hft); }

std::optional<double> min_sff_route_1h(ElementType type, int hft, int sil) {
  for (SffBand band : kBands)
    if (route_1h_cell(type, band, hft) >= sil) return sff_band_lower_edge(band);
  return std::nullopt;
}

int min_hft_route_1h(ElementType type, double sff, int sil) {
  // Every row reaches SIL 4 by HFT 4 at the latest, so the loop ends.
  int hft = 0;
  while (max_sil_route_1h(type, sff, hft) < sil) ++hft;
  return hft;
}

ConstraintBasis constraint_basis(const Sif& sif, std::optional<ConstraintBasis> project_basis) {
  if (sif.constraints) return *sif.constraints;
  return project_basis.value_or(ConstraintBasis::kIec61511);
}

// ---- Subsystem and SIF results ---------------------------------------------------------

namespace {

constexpr const char* kScSource = "IEC 61508-2:2010 7.4.3";

const char* type_text(ElementType type) { return type == ElementType::kA ? "Type A" : "Type B"; }

const char* mode_text(DemandMode mode) {
  return mode == DemandMode::kLow ? "low demand mode" : "high demand or continuous mode";
}

std::string table6_source(ConstraintBasis basis) {
  return basis == ConstraintBasis::kRoute2H ? "Route 2H, IEC 61508-2:2010 7.4.4.3" : "IEC 61511-1:2016 Table 6";
}

// Collects the caps and notes of one subsystem while its rules are applied.
class Assessment {
 public:
  Assessment(const Subsystem& subsystem, SubsystemConstraints& out)
      : s_(subsystem), out_(out), name_(quoted(subsystem.name)) {}

  void cap(CapKind kind, CapCause cause, int sil, std::optional<std::string> element, std::string reason) {
    out_.caps.push_back(Cap{kind, cause, sil, std::move(element), std::move(reason)});
  }
  void note(std::string text) { notes_.push_back(std::move(text)); }

  void vendor();
  void group(const std::vector<Component>& components);
  void certificate();
  void finish();

 private:
  void collect_elements(const std::vector<Component>& components);
  void fault_tolerance_cap(const std::string& subject);
  void route_1h();
  std::optional<Cap> parallel_combination(const std::string& in, int hft) const;
  void route_2h_elements();
  void systematic();

  const Subsystem& s_;
  SubsystemConstraints& out_;
  std::string name_;  // quoted subsystem name
  std::vector<std::string> notes_;
  const std::vector<Component>* components_ = nullptr;
};

void Assessment::fault_tolerance_cap(const std::string& subject) {
  const int hft = *out_.hft;
  const int sil = max_sil_table6(hft, out_.mode);
  cap(CapKind::kArchitecture, CapCause::kFaultTolerance, sil, std::nullopt,
      subject + ", which allows at most SIL " + std::to_string(sil) + " in " + mode_text(out_.mode) + " (" +
          table6_source(out_.basis) + ").");
}

void Assessment::vendor() {
  out_.hft = s_.hft_declared;
  const std::string subject = "Subsystem " + name_ + " is a vendor figure";
  if (out_.basis == ConstraintBasis::kRoute1H) {
    // A vendor figure has no elements to look up; its certificate's SIL capability is its
    // Route 1H result (applied by certificate()).
    if (s_.sil_capability)
      note("On Route 1H the declared SIL capability of vendor subsystem " + name_ +
           " stands for its IEC 61508-2:2010 Tables 2 and 3 result.");
    else
      cap(CapKind::kArchitecture, CapCause::kVendorRoute1h, 0, std::nullopt,
          subject +
              " without element type, SFF or a declared SIL capability, so Route 1H cannot be applied "
              "and it cannot claim a SIL from its architecture.");
  } else if (out_.hft) {
    fault_tolerance_cap("Subsystem " + name_ + " declares HFT " + std::to_string(*out_.hft));
    if (out_.basis == ConstraintBasis::kRoute2H)
      note("Route 2H's DC and data-confidence requirements for vendor subsystem " + name_ +
           " rest on its certificate.");
  } else {
    cap(CapKind::kArchitecture, CapCause::kHftNotDeclared, 0, std::nullopt,
        subject + " without a declared HFT, so it cannot claim a SIL from its architecture.");
  }
  if (s_.sc_declared) {
    const int sc = std::clamp(*s_.sc_declared, 0, 4);
    cap(CapKind::kSystematic, CapCause::kVendorSc, sc, std::nullopt,
        "Subsystem " + name_ + " declares SC " + std::to_string(sc) + ", which allows at most SIL " +
            std::to_string(sc) + " (" + kScSource + ").");
  } else {
    cap(CapKind::kSystematic, CapCause::kScNotDeclared, 0, std::nullopt,
        subject + " without a declared systematic capability, so it cannot claim a SIL from it.");
  }
  if (s_.diverse)
    note("Vendor subsystem " + name_ + " uses its declared SC as it stands; no diversity credit is added.");
}

void Assessment::collect_elements(const std::vector<Component>& components) {
  std::vector<std::size_t> seen;
  for (const auto& channel : s_.channels) {
    for (std::size_t index : channel.components) {
      assert(index < components.size());
      if (std::find(seen.begin(), seen.end(), index) != seen.end()) continue;
      seen.push_back(index);
      const Component& c = components[index];
      ElementConstraints e;
      e.component = c.id;
      e.type = c.element_type;
      const ElementSff sff = element_sff(c);
      e.sff = sff.value;
      e.sff_declared = sff.declared;
      e.dc = diagnostic_coverage(c.rates);
      e.data_confidence = c.data_confidence;
      e.systematic_capability = c.systematic_capability;
      e.prior_use = c.prior_use;
      if (e.sff_declared)
        note("The SFF of " + c.id + " (" + format_percent(*e.sff) +
             ") is taken from its safety manual, not computed from its rates.");
      if (e.sff && (!out_.sff || *e.sff < *out_.sff)) {
        out_.sff = e.sff;
        out_.sff_element = c.id;
      }
      out_.elements.push_back(std::move(e));
    }
  }
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

void Assessment::systematic() {
  const int hft = *out_.hft;
  bool credit = false;
  if (s_.diverse) {
    if (hft < 1)
      note("Subsystem " + name_ + " is marked diverse, but with HFT 0 (" + s_.vote.text() +
           ") one systematic fault in any channel fails it, so no SC credit is taken for diversity.");
    else if (s_.diversity_note.empty())
      note("Subsystem " + name_ +
           " is marked diverse without a diversity note, so no SC credit is taken for "
           "diversity.");
    else
      credit = true;
  }
  if (credit && !out_.elements.empty()) {
    out_.diversity_credit = true;
    note("Subsystem " + name_ + " takes one SC above its lowest element for its diverse channels (SC N+1, " +
         kScSource + "): " + s_.diversity_note);
  }
  const std::string in = "In subsystem " + name_ + ", ";
  for (const auto& e : out_.elements) {
    if (!e.systematic_capability && !e.prior_use) {
      cap(CapKind::kSystematic, CapCause::kScMissing, 0, e.component,
          in + e.component + " has neither a declared systematic capability nor a prior-use claim, so the " +
              "subsystem cannot claim a SIL from it.");
      continue;
    }
    // The higher of the SC and the prior-use claim (IEC 61511-1:2016 11.5.3, from memory: an
    // element may be selected on prior use instead of IEC 61508 compliance).
    const int declared = std::clamp(e.systematic_capability.value_or(0), 0, 4);
    const bool by_prior_use = e.prior_use && e.prior_use->sil > declared;
    const int sc = by_prior_use ? std::clamp(e.prior_use->sil, 0, 4) : declared;
    const int sil = credit ? std::min(4, sc + 1) : sc;
    if (by_prior_use) {
      const std::string claimed = in + e.component + " is claimed for SIL " + std::to_string(sc) +
                                  " on prior use (IEC 61511-1:2016 11.5.3), evidence: \"" + e.prior_use->evidence +
                                  "\"";
      note(claimed + ".");
      cap(CapKind::kSystematic, CapCause::kPriorUse, sil, e.component,
          claimed + "; it allows at most SIL " + std::to_string(sil) +
              (credit ? " with the diverse group's N+1." : "."));
      continue;
    }
    const std::string has = in + e.component + " has SC " + std::to_string(sc);
    cap(CapKind::kSystematic, CapCause::kElementSc, sil, e.component,
        credit ? has + "; as the group's channels are diverse, it allows at most SIL " + std::to_string(sil) +
                     " (SC N+1, " + kScSource + ")."
               : has + ", which allows at most SIL " + std::to_string(sil) + " (" + kScSource + ").");
  }
}

void Assessment::group(const std::vector<Component>& components) {
  components_ = &components;
  out_.hft = hardware_fault_tolerance(s_.vote);
  if (s_.hft_declared && *s_.hft_declared != *out_.hft)
    note("Subsystem " + name_ + " declares HFT " + std::to_string(*s_.hft_declared) + ", but its vote " +
         s_.vote.text() + " gives HFT " + std::to_string(*out_.hft) + "; the vote is used.");
  collect_elements(components);
  if (out_.elements.empty()) {
    const std::string reason = "Subsystem " + name_ + " has no components, so it cannot claim a SIL.";
    cap(CapKind::kArchitecture, CapCause::kNoElements, 0, std::nullopt, reason);
    cap(CapKind::kSystematic, CapCause::kNoElements, 0, std::nullopt, reason);
    return;
  }
  if (out_.basis == ConstraintBasis::kRoute1H) {
    route_1h();
  } else {
    fault_tolerance_cap("Subsystem " + name_ + " has HFT " + std::to_string(*out_.hft) + " (" + s_.vote.text() + ")");
    if (out_.basis == ConstraintBasis::kRoute2H) route_2h_elements();
  }
  systematic();
}

void Assessment::certificate() {
  if (!s_.sil_capability) return;
  const int sil = std::clamp(*s_.sil_capability, 0, 4);
  const std::string reason = "Subsystem " + name_ + " has a declared SIL capability of SIL " + std::to_string(sil) +
                             " (its certificate), which caps its architecture and its SC.";
  cap(CapKind::kArchitecture, CapCause::kCertificate, sil, std::nullopt, reason);
  cap(CapKind::kSystematic, CapCause::kCertificate, sil, std::nullopt, reason);
}

void Assessment::finish() {
  out_.sil_architecture = 4;
  out_.systematic_capability = 4;
  for (const auto& c : out_.caps) {
    int& result = c.kind == CapKind::kArchitecture ? out_.sil_architecture : out_.systematic_capability;
    result = std::min(result, c.sil);
  }
  out_.findings = std::move(notes_);
  for (const auto& c : out_.caps) {
    if (c.sil >= 4) continue;
    if (std::find(out_.findings.begin(), out_.findings.end(), c.reason) == out_.findings.end())
      out_.findings.push_back(c.reason);
  }
}

}  // namespace

SubsystemConstraints subsystem_constraints(const Subsystem& subsystem, const std::vector<Component>& components,
                                           ConstraintBasis basis, DemandMode mode) {
  SubsystemConstraints out;
  out.subsystem = subsystem.name;
  out.basis = basis;
  out.mode = mode;
  out.vendor = subsystem.is_vendor();
  out.vote = subsystem.vote;
  Assessment assessment(subsystem, out);
  if (out.vendor)
    assessment.vendor();
  else
    assessment.group(components);
  assessment.certificate();
  assessment.finish();
  return out;
}

SifConstraints sif_constraints(const Sif& sif, const std::vector<Component>& components, ConstraintBasis basis) {
  return sif_constraints(sif, components, basis, sif.demand_mode());
}

SifConstraints sif_constraints(const Sif& sif, const std::vector<Component>& components, ConstraintBasis basis,
                               DemandMode mode) {
  SifConstraints out;
  out.basis = basis;
  for (const auto& s : sif.subsystems) out.subsystems.push_back(subsystem_constraints(s, components, basis, mode));
  if (out.subsystems.empty()) return out;
  // Subsystems act in series: the lowest result governs (IEC 61508-2:2010 7.4.4.2.3, 7.4.3).
  out.sil_architecture = 4;
  out.sil_systematic = 4;
  for (const auto& s : out.subsystems) {
    out.sil_architecture = std::min(out.sil_architecture, s.sil_architecture);
    out.sil_systematic = std::min(out.sil_systematic, s.systematic_capability);
  }
  return out;
}

}  // namespace sifter
