// The Markdown report: the HTML report's tables and words, without its drawings.
#include "sifter/report/markdown.hpp"

#include <string_view>

#include "sifter/model/format.hpp"
#include "sifter/model/printable.hpp"
#include "sifter/report/deliverable_tables.hpp"

namespace sifter::report {
namespace {

std::string md(const std::string& text) { return escape_markdown(text); }

template <typename Texts>  // std::string or SharedText
std::string list_md(const Texts& items) {
  std::string out;
  for (const std::string& i : items) out += "- " + md(i) + "\n";
  return out.empty() ? out : out + "\n";
}

std::string absent(const std::string& words) { return "*" + md(words) + "*\n\n"; }

std::string cover(const ProjectResult& r, const ReportData& d) {
  std::string out = "# " + md(r.title.empty() ? r.file : r.title) + "\n\n";
  out += "Safety instrumented functions: LOPA and SIL verification\n\n";
  out += "- date of the run: " + md(d.date) + "\n";
  out += "- input file: " + md(r.file) + "\n";
  out += "- SHA-256 of the input: `" + r.sha256 + "`\n";
  out += "- tool: sifter " + md(d.tool_version) + "\n\n";
  if (d.deliverable.document)
    out += "Document " + md(d.deliverable.document->number) + ", revision " + md(d.deliverable.document->revision) +
           "\n\n" + markdown_table(signature_table(*d.deliverable.document));
  out += "> **Caution.** " + md(kCaution) + "\n\n";
  return out;
}

std::string sif_section(const SifResult& s, const SifReportData& d) {
  std::string out = "## " + md(s.id) + (s.title.empty() ? "" : ": " + md(s.title)) + "\n\n";
  out += "**" + md(sif_verdict(s.meets_target).text) + "** · achieved " + sil_words(s.sil_achieved) +
         (s.sil_required ? ", required " + sil_words(*s.sil_required) : "") + "\n\n";
  out += "Demand mode: " + md(to_string(s.demand_mode)) + " (" + md(s.demand_mode_basis) +
         "). Target: " + md(s.target_text.empty() ? "none" : s.target_text) + ".\n\n";
  out += markdown_table(sil_table(s, d));
  if (!s.limits.empty()) {
    out += "What keeps it below its target:\n\n";
    std::vector<std::string> items;
    for (const auto& l : s.limits) items.push_back(l.kind + ": " + l.message);
    out += list_md(items);
  }
  out += markdown_table(subsystem_table(s)) + markdown_table(subsystem_parameters_table(s, d.deliverable));
  if (!s.requirement_checks.empty()) out += markdown_table(requirement_checks_table(s));
  if (d.pfd_curve) out += "PFD(t) curve drawn in the HTML report by the " + md(d.pfd_curve->engine) + ".\n\n";
  if (d.interval_sweep) out += markdown_table(interval_table(*d.interval_sweep));
  if (d.sensitivity.empty())
    out += "Sensitivity ranking: " + absent("not computed in this run.");
  else
    out += markdown_table(sensitivity_table(d.sensitivity));
  if (s.uncertainty)
    out += markdown_table(uncertainty_table(*s.uncertainty));
  else
    out += "Uncertainty: " + absent("not run.");
  return out;
}

std::string scenario_section(const ScenarioResult& s) {
  std::string out = "## " + md(s.id) + (s.title.empty() ? "" : ": " + md(s.title)) + "\n\n";
  out += "**" + md(scenario_verdict(s.meets_target).text) + "** · required RRF " + plain(s.required_rrf) + ", SIL " +
         std::to_string(s.required_sil) + "; SIF under assessment: " + md(s.sif.value_or("none")) + "\n\n";
  out += markdown_table(worksheet_table(s));
  out += "Findings:\n\n";
  std::vector<std::string> items;
  for (const auto& f : s.findings) items.push_back(to_string(f.kind) + ": " + f.message);
  out += items.empty() ? absent("none.") : list_md(items);
  return out;
}

std::string closing(const ProjectResult& r, const ReportData& d) {
  std::string out = "## Assumptions, equations and warnings\n\n### Assumptions\n\n";
  for (const auto& s : r.sifs)
    if (!s.assumptions.empty()) out += "**" + md(s.id) + "**\n\n" + list_md(s.assumptions);
  for (const auto& s : r.scenarios)
    if (!s.assumptions.empty()) out += "**" + md(s.id) + "**\n\n" + list_md(s.assumptions);
  out += "### Equations\n\n" + markdown_table(equations_table(r, d));
  const Table shared = shared_table(r);
  if (!shared.rows.empty()) out += "### Shared equipment\n\n" + markdown_table(shared);
  out += "### Warnings\n\n";
  std::vector<std::string> warnings;
  for (const auto& w : r.warnings) warnings.push_back(w.where + ": " + w.message);
  out += warnings.empty() ? absent("None.") : list_md(warnings);
  return out;
}

}  // namespace

std::string escape_markdown(const std::string& text) {
  static constexpr std::string_view kSpecial = "\\`*_[]<>|#~&";
  std::string out;
  out.reserve(text.size());
  for (char c : text) {
    if (c == '\n' || c == '\r') {
      out += ' ';
      continue;
    }
    if (kSpecial.find(c) != std::string_view::npos) out += '\\';
    out += c;
  }
  return out;
}

std::string markdown_table(const Table& t) {
  std::string out = "**" + md(t.caption) + "**\n\n|";
  for (const auto& h : t.header) out += " " + md(h) + " |";
  out += "\n|";
  for (std::size_t i = 0; i < t.header.size(); ++i) out += i < t.numeric.size() && t.numeric[i] ? " ---: |" : " --- |";
  out += "\n";
  for (const auto& row : t.rows) {
    out += "|";
    for (const auto& cell : row) out += " " + md(cell.text) + " |";
    out += "\n";
  }
  return out + "\n";
}

std::string render_markdown(const ProjectResult& r, const ReportData& d) {
  std::string out = cover(r, d);
  out += "## Summary\n\n" + markdown_table(sif_summary_table(r, d));
  if (!r.scenarios.empty()) out += markdown_table(scenario_summary_table(r));
  if (!r.risk_criteria.empty()) out += markdown_table(risk_criteria_table(r.risk_criteria));
  for (std::size_t i = 0; i < r.sifs.size(); ++i)
    out += sif_section(r.sifs[i], i < d.sifs.size() ? d.sifs[i] : SifReportData{});
  for (const auto& s : r.scenarios) out += scenario_section(s);
  out += "## Component data\n\n" + markdown_table(component_data_table(d.deliverable)) + closing(r, d);
  // User text reaches the page as written: its control characters are shown escaped, so that a
  // title cannot hide or rewrite a line for a reader who opens the file in a terminal.
  return escape_controls(out + "---\n\nWritten by sifter " + md(d.tool_version) + " on " + md(d.date) + ".\n");
}

}  // namespace sifter::report
