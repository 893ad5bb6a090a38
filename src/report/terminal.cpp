// The terminal summary: one block per SIF, then warnings, shared devices and the caution.
#include "sifter/report/terminal.hpp"

#include "sifter/report/pressure_text.hpp"
#include "sifter/report/format.hpp"
#include "sifter/report/text_table.hpp"
#include "sifter/report/worksheet.hpp"
#include "sifter/sil.hpp"

namespace sifter::report {
namespace {

std::string verdict_words(const std::optional<bool>& meets) {
  if (!meets) return "NOT JUDGED (no target)";
  return *meets ? "MEETS TARGET" : "FALLS SHORT";
}

std::string sil_text(int sil) { return sil == 0 ? "below SIL 1" : "SIL " + std::to_string(sil); }

// The spurious trips in one line: the SIF's rate and MTTF, then each subsystem's rate.
std::string spurious_line(const SifResult& s) {
  std::string text = "spurious trips " + sci(s.spurious_trip_rate_per_yr) + "/yr";
  if (s.mttf_spurious_yr) text += ", MTTF spurious " + plain(*s.mttf_spurious_yr) + " yr";
  std::string parts;
  for (const auto& sub : s.subsystems) {
    // A supplier's figure carries no safe failure rates (spurious.hpp counts it as zero).
    const bool vendor = sub.vote.rfind("vendor", 0) == 0;
    parts += (parts.empty() ? "" : ", ") + sub.name + " " + (vendor ? "not given" : sci(sub.spurious_trip_rate_per_yr));
  }
  if (!parts.empty()) text += " (" + parts + ")";
  return wrap(text, 92, "  ");
}

}  // namespace

std::string wrapped_caution(std::size_t width) { return wrap(std::string("CAUTION: ") + kCaution, width, ""); }

std::string render_sif(const SifResult& s) {
  const bool low = s.demand_mode == DemandMode::kLow;
  std::string out = s.id + (s.title.empty() ? "" : "  " + s.title) + "\n";
  out += "  demand mode  " + to_string(s.demand_mode) + " (" + s.demand_mode_basis + ")\n";
  out += "  target       " + (s.target_text.empty() ? std::string("none") : s.target_text) + "\n\n";

  TextTable t({"subsystem", "role", "vote", low ? "PFDavg" : "PFH [1/h]", "exact", "share", "HFT", "SIL arch", "SC"},
              {false, false, false, true, true, true, true, true, true});
  for (const auto& sub : s.subsystems) {
    t.add_row({sub.name, to_string(sub.role), sub.vote, sci_or_dash(low ? sub.pfd_avg : sub.pfh_per_hour),
               sci_or_dash(low ? sub.pfd_avg_exact : sub.pfh_exact_per_hour), percent(sub.share),
               sub.hft ? std::to_string(*sub.hft) : "-", std::to_string(sub.sil_architecture),
               sub.systematic_capability ? std::to_string(*sub.systematic_capability) : "-"});
  }
  t.add_rule();
  t.add_row({"SIF", "", "", sci_or_dash(low ? s.pfd_avg : s.pfh_per_hour),
             sci_or_dash(low ? s.pfd_avg_exact : s.pfh_exact_per_hour), percent(1.0), "", "", ""});
  out += t.render("  ");
  out += "\n";
  if (low) {
    out += "  RRF " + (s.rrf ? plain(*s.rrf) : std::string("-"));
    if (s.required_rrf) out += "   required RRF " + plain(*s.required_rrf);
  } else {
    out += "  PFH " + sci_or_dash(s.pfh_per_hour) + "/h";
    if (s.required_pfh_per_hour) out += "   required PFH <= " + sci(*s.required_pfh_per_hour) + "/h";
  }
  out += "\n";
  out += "  SIL  probability " + sil_text(s.sil_probability) + " | architecture " + sil_text(s.sil_architecture) +
         " | systematic " + sil_text(s.sil_systematic) + "  ->  achieved " + sil_text(s.sil_achieved);
  out += s.sil_required ? ", required " + sil_text(*s.sil_required) + "\n" : "\n";
  if (s.simplified_over_exact)
    out += "  exact cross-check  simplified/exact = " + plain(*s.simplified_over_exact) +
           " (multi-phase Markov over the mission)\n";
  if (s.uncertainty)
    out += "  uncertainty  mean " + sci(s.uncertainty->mean) + ", 5%-95% " + sci(s.uncertainty->p05) + " to " +
           sci(s.uncertainty->p95) + ", P(meets target) " + percent(s.uncertainty->probability_meets_target) + " (" +
           std::to_string(s.uncertainty->samples) + " samples)\n";
  out += "  verdict  " + verdict_words(s.meets_target) + "\n";
  out += spurious_line(s);
  if (!s.limits.empty()) {
    out += "  limited by\n";
    for (const auto& l : s.limits) out += wrap("[" + l.kind + "] " + l.message, 92, "    ");
  }
  if (!s.assumptions.empty()) {
    out += "  assumptions\n";
    for (const auto& a : s.assumptions) out += wrap("- " + a, 92, "    ");
  }
  return out;
}

std::string render_terminal(const ProjectResult& r) {
  std::string out = "sifter " SIFTER_VERSION " check: " + r.file + "\n";
  if (!r.title.empty()) out += r.title + "\n";
  out += "\n";
  for (const auto& s : r.scenarios) out += render_worksheet(s) + "\n";
  for (const auto& s : r.sifs) out += render_sif(s) + "\n";
  out += render_pressure_text(r);
  if (!r.shared_components.empty()) {
    out += "Components shared between SIFs (check their independence)\n";
    for (const auto& c : r.shared_components) {
      std::string users;
      for (const auto& s : c.sifs) users += (users.empty() ? "" : ", ") + s;
      out += "  " + c.component + ": " + users + "\n";
    }
    out += "\n";
  }
  if (!r.shared_devices.empty()) {
    out += "Devices several SIFs or scenarios rely on\n";
    for (const auto& d : r.shared_devices) {
      std::string users;
      for (const auto& u : d.users) users += (users.empty() ? "" : ", ") + u;
      out += "  " + d.tag + ": " + users + "\n";
    }
    out += "\n";
  }
  if (!r.warnings.empty()) {
    out += "Warnings\n";
    for (const auto& w : r.warnings) out += wrap(w.where + ": " + w.message, 92, "  ");
    out += "\n";
  }
  int met = 0, judged = 0;
  for (const auto& s : r.sifs)
    if (s.meets_target) {
      ++judged;
      met += *s.meets_target ? 1 : 0;
    }
  if (!r.scenarios.empty()) {
    int tolerable = 0;
    for (const auto& s : r.scenarios) tolerable += s.meets_target.value_or(false) ? 1 : 0;
    out += "Scenarios: " + std::to_string(tolerable) + " of " + std::to_string(r.scenarios.size()) +
           " reach their tolerable frequency\n";
  }
  out += "Summary: " + std::to_string(met) + " of " + std::to_string(judged) + " judged SIFs meet their targets";
  if (judged < static_cast<int>(r.sifs.size()))
    out += " (" + std::to_string(r.sifs.size() - static_cast<std::size_t>(judged)) + " without a target)";
  out += "\n\n" + wrapped_caution();
  return out;
}

}  // namespace sifter::report
