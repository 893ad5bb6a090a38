// The one requirement of a SIF and the one judge (IEC 61511-1:2016 Tables 4/5; clause 9).
#include "sifter/analysis/judge.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>

#include "sifter/engines/sil.hpp"
#include "sifter/model/format.hpp"

namespace sifter {
namespace {

std::string describe_target(const Target& t, DemandMode mode) {
  switch (t.kind) {
    case Target::Kind::kSil:
      return "SIL " + sifter::figure(t.value) + (mode == DemandMode::kLow ? " (PFDavg < " : " (PFH < ") +
             sifter::figure(sil_upper_limit(static_cast<int>(t.value), mode)) + ")";
    case Target::Kind::kRrf:
      return "RRF " + sifter::figure(t.value) + " (PFDavg <= " + sifter::figure(1.0 / t.value) + ")";
    case Target::Kind::kPfdAvg:
      return "PFDavg <= " + sifter::figure(t.value);
    case Target::Kind::kPfh:
      return "PFH <= " + sifter::figure(t.value) + "/h";
  }
  return {};
}

// The stated target alone.
void apply_stated(const Target& t, SifTarget& out) {
  out.text = describe_target(t, out.mode);
  switch (t.kind) {
    case Target::Kind::kSil:
      out.sil = static_cast<int>(t.value);
      break;
    case Target::Kind::kRrf:
      out.required_pfd = 1.0 / t.value;
      out.required_rrf = t.value;
      out.sil = sil_required_from_rrf(t.value);
      break;
    case Target::Kind::kPfdAvg:
      out.required_pfd = t.value;
      out.required_rrf = 1.0 / t.value;
      out.sil = sil_required_from_rrf(1.0 / t.value);
      break;
    case Target::Kind::kPfh:
      out.required_pfh_per_hour = t.value;
      out.sil = sil_required_from_pfh(t.value);
      break;
  }
}

}  // namespace

std::optional<double> SifTarget::limit() const {
  const bool low = mode == DemandMode::kLow;
  std::optional<double> value = low ? required_pfd : required_pfh_per_hour;
  if (sil && *sil > 0) {
    const double edge = sil_upper_limit(*sil, mode);
    if (!value || edge < *value) value = edge;
  }
  return value;
}

std::string demand_basis(const SifRequirement& requirement) {
  char buf[64];
  std::snprintf(buf, sizeof buf, "%.3g", requirement.demand_rate_per_yr);
  std::string out =
      std::string("demand rate ") + buf + "/yr from scenario" + (requirement.scenarios.size() > 1 ? "s " : " ");
  for (std::size_t i = 0; i < requirement.scenarios.size(); ++i) out += (i ? ", " : "") + requirement.scenarios[i];
  out += requirement.demand_mode == DemandMode::kLow ? "; at most once a year is low demand (IEC 61511-1:2016 3.2.39)"
                                                     : "; above once a year is high demand (IEC 61511-1:2016 3.2.39)";
  return out;
}

SifTarget sif_target(const Sif& sif, DemandMode mode, const std::optional<SifRequirement>& lopa,
                     std::vector<Warning>& warnings) {
  SifTarget out;
  out.mode = mode;
  const bool low = mode == DemandMode::kLow;
  if (sif.target) apply_stated(*sif.target, out);
  if (lopa) {
    const int lopa_sil = low || !lopa->required_pfh_per_hour ? sil_required_from_rrf(lopa->required_rrf)
                                                             : sil_required_from_pfh(*lopa->required_pfh_per_hour);
    if (out.sil && *out.sil != lopa_sil)
      warnings.push_back({sif.pointer + "/target", "the stated target (" + out.text + ") differs from the SIL " +
                                                       std::to_string(lopa_sil) +
                                                       " the LOPA requires; the stricter applies"});
    // A required RRF at or below 1 asks for no reduction at all: the required PFD is capped at 1
    // (a probability), and the text says that no SIF is needed.
    const bool none_needed = !(lopa->required_rrf > 1.0);
    const double lopa_pfd = none_needed ? 1.0 : 1.0 / lopa->required_rrf;
    if (!out.required_pfd || lopa_pfd < *out.required_pfd) {
      out.required_pfd = lopa_pfd;
      out.required_rrf = lopa->required_rrf;
    }
    if (lopa->required_pfh_per_hour &&
        (!out.required_pfh_per_hour || *lopa->required_pfh_per_hour < *out.required_pfh_per_hour))
      out.required_pfh_per_hour = lopa->required_pfh_per_hour;
    out.sil = std::max(out.sil.value_or(0), lopa_sil);
    out.text =
        (out.text.empty() ? "" : out.text + "; ") + "LOPA: " +
        (low ? (none_needed ? "no SIF needed (required RRF " + sifter::figure(lopa->required_rrf) + ", PFD capped at 1)"
                            : "RRF " + sifter::figure(lopa->required_rrf))
             : "PFH <= " + sifter::figure(out.required_pfh_per_hour.value_or(0.0)) + "/h");
  }
  if (low)
    out.required_pfh_per_hour.reset();
  else
    out.required_pfd.reset();
  return out;
}

std::optional<bool> sif_verdict(const SifTarget& target, std::optional<double> figure, const VerdictBasis& basis) {
  std::optional<bool> verdict = figure ? judge(target, *figure) : std::nullopt;
  if (verdict && target.sil)
    verdict = *verdict && basis.sil_architecture >= *target.sil && basis.sil_systematic >= *target.sil;
  if (verdict && basis.route_2h_confidence) verdict = *verdict && *basis.route_2h_confidence >= kRoute2hMinConfidence;
  if (!basis.stated_requirements_met) verdict = false;  // a stated requirement not met: short, target or not
  if (!basis.figures_sound) verdict = false;            // no verdict rests on a defective figure
  if (!basis.judged_within_validity) verdict = false;   // nor on a sum outside the equations' validity
  return verdict;
}

std::optional<bool> judge(const SifTarget& target, double figure) {
  if (!target.sil) return std::nullopt;
  const bool low = target.mode == DemandMode::kLow;
  const int sil = low ? sil_from_pfd_avg(figure) : sil_from_pfh(figure);
  bool met = sil >= *target.sil;
  if (low && target.required_pfd) met = met && at_most(figure, *target.required_pfd);
  if (!low && target.required_pfh_per_hour) met = met && at_most(figure, *target.required_pfh_per_hour);
  return met;
}

double sil_band_lower_edge(int sil, DemandMode mode) {
  // SIL n low demand: PFDavg >= 10^-(n+1); high demand: PFH >= 10^-(n+5) per hour.
  return sil_upper_limit(std::clamp(sil, 0, 4) + 1, mode);
}

SifCredit sif_credit(double judged, int sil_achieved, DemandMode mode) {
  const double edge = sil_band_lower_edge(sil_achieved, mode);
  SifCredit c;
  c.capped = judged < edge * (1.0 - kEdgeRelTol);
  // A credit is a probability: never above 1, whatever a figure outside the equations' validity says.
  c.value = std::min(1.0, c.capped ? edge : judged);
  return c;
}

}  // namespace sifter
