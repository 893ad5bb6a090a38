// The terminal summary: one block per SIF (or one line per SIF on a register), then warnings,
// shared devices, what falls short and the caution, fitted to the terminal's width.
#include "sifter/report/terminal.hpp"

#include <algorithm>
#include <set>

#include "sifter/model/format.hpp"
#include "sifter/model/vocabulary.hpp"
#include "sifter/report/pressure_text.hpp"
#include "sifter/report/requirements_text.hpp"
#include "sifter/report/tables.hpp"
#include "sifter/report/text_table.hpp"
#include "sifter/report/worksheet.hpp"
#include "sifter/results/report.hpp"

namespace sifter::report {
namespace {

std::string verdict_words(const std::optional<bool>& meets) {
  if (!meets) return "NOT JUDGED (no target)";
  return *meets ? "MEETS TARGET" : "FALLS SHORT";
}

std::string joined(const std::vector<std::string>& items) {
  std::string out;
  for (const auto& i : items) out += (out.empty() ? "" : ", ") + i;
  return out;
}

// The spurious trips in one line: the SIF's rate and MTTF, then each subsystem's rate.
std::string spurious_line(const SifResult& s, std::size_t width) {
  std::string text = "spurious trips " + sci(s.spurious_trip_rate_per_yr) + "/yr";
  if (s.mttf_spurious_yr) text += ", MTTF spurious " + plain(*s.mttf_spurious_yr) + " yr";
  std::string parts;
  for (const auto& sub : s.subsystems) {
    // A supplier's figure carries no safe failure rates (spurious.hpp counts it as zero).
    const bool vendor = !sub.voting;
    parts += (parts.empty() ? "" : ", ") + sub.name + " " + (vendor ? "not given" : sci(sub.spurious_trip_rate_per_yr));
  }
  if (!parts.empty()) text += " (" + parts + ")";
  return fit_line(text, prose_width(width), "  ", "    ");
}

// What keeps the SIF where it is, in a few words: its limits, else the results that set the
// achieved SIL.
std::string limit_words(const SifResult& s) {
  if (!s.limits.empty()) return limits_words(s);
  return sil_words(s.sil_achieved) + " set by " + joined(limiting_results(s));
}

// The figure the verdict rests on, with its unit.
std::string figure_text(const SifResult& s) {
  return sci_or_dash(s.judged_figure()) + (s.demand_mode == DemandMode::kLow ? "" : "/h");
}

std::string sif_lines(const ProjectResult& r, std::size_t width) {
  TextTable t({"SIF", "mode", "SIL req", "SIL ach", "PFDavg or PFH", "verdict", "limited by"},
              {false, false, true, true, true, false, false});
  t.set_fit({Fit::kKeep, Fit::kKeep, Fit::kKeep, Fit::kKeep, Fit::kKeep, Fit::kKeep, Fit::kWrap});
  for (const auto& s : r.sifs)
    t.add_row({s.id, to_string(s.demand_mode), s.sil_required ? std::to_string(*s.sil_required) : "-",
               std::to_string(s.sil_achieved), figure_text(s),
               s.meets_target ? (*s.meets_target ? "meets" : "FALLS SHORT") : "not judged", limit_words(s)});
  return "SIFs (one line each; --sif ID for the full block)\n" + t.render("  ", width);
}

std::string scenario_lines(const ProjectResult& r, std::size_t width) {
  TextTable t({"scenario", "SIF", "req SIL", "required RRF", "with SIF [/yr]", "target [/yr]", "verdict"},
              {false, false, true, true, true, true, false});
  for (const auto& s : r.scenarios)
    t.add_row({s.id, s.sif.value_or("-"), std::to_string(s.required_sil), plain(s.required_rrf),
               sci_or_dash(s.mitigated_frequency_per_yr), sci(s.target_frequency_per_yr),
               s.meets_target ? (*s.meets_target ? "tolerable" : "NOT TOLERABLE") : "not judged"});
  return "Scenarios (one line each)\n" + t.render("  ", width);
}

// Every SIF and scenario of the project that falls short, so the end of a long run says
// which, not only how many.
std::string shortfalls(const ProjectResult& r, std::size_t width) {
  std::string out;
  for (const auto& s : r.sifs)
    if (s.meets_target && !*s.meets_target)
      out += fit_line("- SIF " + s.id + ": achieved " + sil_words(s.sil_achieved) +
                          (s.sil_required ? ", required " + sil_words(*s.sil_required) : std::string()) + "; " +
                          limit_words(s),
                      prose_width(width), "  ");
  for (const auto& s : r.scenarios)
    if (s.meets_target && !*s.meets_target)
      out += fit_line("- scenario " + s.id + ": " + sci_or_dash(s.mitigated_frequency_per_yr) +
                          "/yr with the SIF against a target of " + sci(s.target_frequency_per_yr) + "/yr",
                      prose_width(width), "  ");
  return out.empty() ? "" : "Falling short\n" + out;
}

std::string users_list(const std::string& title,
                       const std::vector<std::pair<std::string, std::vector<std::string>>>& items, std::size_t width) {
  if (items.empty()) return "";
  std::string out = fit_line(title, width, "");
  for (const auto& [name, users] : items) out += fit_line(name + ": " + joined(users), width, "  ", "    ");
  return out + "\n";
}

// The subsystems with their figures and constraints, and the SIF's sum.
std::string subsystem_table(const SifResult& s, std::size_t width) {
  const bool low = s.demand_mode == DemandMode::kLow;
  TextTable t({"subsystem", "role", "vote", low ? "PFDavg" : "PFH [1/h]", "exact", "share", "HFT", "SIL arch", "SC"},
              {false, false, false, true, true, true, true, true, true});
  t.set_fit(
      {Fit::kWrap, Fit::kKeep, Fit::kKeep, Fit::kKeep, Fit::kKeep, Fit::kKeep, Fit::kKeep, Fit::kKeep, Fit::kKeep});
  for (const auto& sub : s.subsystems) {
    t.add_row({sub.name, to_string(sub.role), sub.vote, sci_or_dash(low ? sub.pfd_avg : sub.pfh_per_hour),
               sci_or_dash(low ? sub.pfd_avg_exact : sub.pfh_exact_per_hour), percent(sub.share),
               sub.hft ? std::to_string(*sub.hft) : "-", std::to_string(sub.sil_architecture),
               sub.systematic_capability ? std::to_string(*sub.systematic_capability) : "-"});
  }
  t.add_rule();
  t.add_row({"SIF", "", "", sci_or_dash(s.judged_figure()), sci_or_dash(low ? s.pfd_avg_exact : s.pfh_exact_per_hour),
             percent(1.0), "", "", ""});
  return t.render("  ", width);
}

// RRF or PFH against the requirement, the three SILs, the exact cross-check, the uncertainty.
std::string figure_lines(const SifResult& s, std::size_t width) {
  std::string figures;
  if (s.demand_mode == DemandMode::kLow) {
    figures = "RRF " + (s.rrf ? plain(*s.rrf) : std::string("-"));
    if (s.required_rrf) figures += "   required RRF " + plain(*s.required_rrf);
  } else {
    figures = "PFH " + sci_or_dash(s.pfh_per_hour) + "/h";
    if (s.required_pfh_per_hour) figures += "   required PFH <= " + sci(*s.required_pfh_per_hour) + "/h";
  }
  std::string out = fit_line(figures, width, "  ");
  // The three SILs, then the outcome; on a narrow terminal the outcome takes the next line.
  const std::string sils = "SIL  probability " + sil_words(s.sil_probability) + " | architecture " +
                           sil_words(s.sil_architecture) + " | systematic " + sil_words(s.sil_systematic);
  const std::string outcome = "->  achieved " + sil_words(s.sil_achieved) +
                              (s.sil_required ? ", required " + sil_words(*s.sil_required) : std::string());
  if (2 + display_width(sils) + 2 + display_width(outcome) <= width)
    out += "  " + sils + "  " + outcome + "\n";
  else
    out += fit_line(sils, width, "  ", "     ") + fit_line(outcome, width, "       ", "    ");
  if (s.simplified_over_exact)
    out += fit_line("exact cross-check  simplified/exact = " + sifter::ratio(*s.simplified_over_exact) +
                        " (multi-phase Markov over the mission)",
                    width, "  ", "    ");
  if (s.uncertainty)
    out +=
        fit_line("uncertainty  mean " + sci(s.uncertainty->mean) + ", 5%-95% " + sci(s.uncertainty->p05) + " to " +
                     sci(s.uncertainty->p95) + ", P(meets target) " + percent(s.uncertainty->probability_meets_target) +
                     " (" + std::to_string(s.uncertainty->samples) + " samples)",
                 width, "  ", "    ");
  return out;
}

// The counts of the whole project, then which SIFs and scenarios fall short.
std::string counts(const ProjectResult& r, std::size_t width) {
  std::string out;
  int met = 0, judged = 0;
  for (const auto& s : r.sifs)
    if (s.meets_target) {
      ++judged;
      met += *s.meets_target ? 1 : 0;
    }
  if (!r.scenarios.empty()) {
    int tolerable = 0;
    for (const auto& s : r.scenarios) tolerable += s.meets_target.value_or(false) ? 1 : 0;
    out += fit_line("Scenarios: " + std::to_string(tolerable) + " of " + std::to_string(r.scenarios.size()) +
                        " reach their tolerable frequency",
                    width, "");
  }
  std::string summary =
      "Summary: " + std::to_string(met) + " of " + std::to_string(judged) + " judged SIFs meet their targets";
  if (judged < static_cast<int>(r.sifs.size()))
    summary += " (" + std::to_string(r.sifs.size() - static_cast<std::size_t>(judged)) + " without a target)";
  out += fit_line(summary, width, "");
  const std::string short_list = shortfalls(r, width);
  if (!short_list.empty()) out += "\n" + short_list;
  return out;
}

}  // namespace

std::string wrapped_caution(std::size_t width) { return wrap(std::string("CAUTION: ") + kCaution, width, ""); }

std::string render_sif(const SifResult& s, std::size_t width) {
  std::string out = fit_line(s.id + (s.title.empty() ? "" : "  " + s.title), width, "");
  const std::string under_value(13, ' ');  // continuation lines start under the value
  out +=
      fit_line("demand mode  " + to_string(s.demand_mode) + " (" + s.demand_mode_basis + ")", width, "  ", under_value);
  out += fit_line("target       " + (s.target_text.empty() ? std::string("none") : s.target_text), width, "  ",
                  under_value) +
         "\n";
  out += subsystem_table(s, width) + "\n";
  out += figure_lines(s, width);
  out += "  verdict  " + verdict_words(s.meets_target) + "\n";
  out += spurious_line(s, width);
  out += requirements_lines(s, width);
  const std::size_t prose = prose_width(width);
  if (!s.limits.empty()) {
    out += "  limited by\n";
    for (const auto& l : s.limits) out += fit_line("[" + l.kind + "] " + l.message, prose, "    ", "  ");
  }
  if (!s.assumptions.empty()) {
    out += "  assumptions\n";
    for (const std::string& a : s.assumptions) out += fit_line("- " + a, prose, "    ");
  }
  if (!s.warnings.empty()) {
    out += "  warnings\n";
    for (const auto& w : s.warnings) out += fit_line("! " + w, prose, "    ");
  }
  return out;
}

bool shows_full_blocks(std::size_t sifs, const TerminalOptions& options) {
  return !options.sifs.empty() || (!options.summary && sifs <= kSummaryAboveSifs);
}

std::string render_terminal(const ProjectResult& r, const TerminalOptions& options) {
  const std::size_t width = std::max<std::size_t>(options.width, 20);
  std::string out = fit_line("sifter " SIFTER_VERSION " check: " + r.file, width, "");
  if (!r.title.empty()) out += fit_line(r.title, width, "");
  out += "\n";
  const std::set<std::string> chosen(options.sifs.begin(), options.sifs.end());
  const bool filtered = !chosen.empty();
  const bool one_line_each = !shows_full_blocks(r.sifs.size(), options);
  if (one_line_each) {
    if (!r.scenarios.empty()) out += scenario_lines(r, width) + "\n";
    out += sif_lines(r, width) + "\n";
  } else {
    for (const auto& s : r.scenarios)
      if (!filtered || (s.sif && chosen.count(*s.sif))) out += render_worksheet(s, width) + "\n";
    for (const auto& s : r.sifs)
      if (!filtered || chosen.count(s.id)) out += render_sif(s, width) + "\n";
  }
  out += render_pressure_text(r, width);
  std::vector<std::pair<std::string, std::vector<std::string>>> shared;
  for (const auto& c : r.shared_components) shared.emplace_back(c.component, c.sifs);
  out += users_list("Components shared between SIFs (check their independence)", shared, width);
  shared.clear();
  for (const auto& d : r.shared_devices) shared.emplace_back(d.tag, d.users);
  out += users_list("Devices several SIFs or scenarios rely on", shared, width);
  if (!r.warnings.empty()) {
    out += "Warnings\n";
    for (const auto& w : r.warnings) out += fit_line(w.where + ": " + w.message, prose_width(width), "  ", "    ");
    out += "\n";
  }
  out += counts(r, width);
  out += "\n" + wrapped_caution(prose_width(width));
  return out;
}

}  // namespace sifter::report
