// One subsystem's constraints assessed: a vendor figure or a group's elements, its systematic
// capability, its certificate, and the caps gathered into its results.
#include "engines/constraints_assessment.hpp"

#include <algorithm>
#include <cassert>
#include <string>

namespace sifter::detail {
namespace {

constexpr const char* kScSource = "IEC 61508-2:2010 7.4.3";

}  // namespace

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

}  // namespace sifter::detail
