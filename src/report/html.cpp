// The HTML report: cover with the caution, summary, one section per SIF and per scenario, closing notes.
#include "sifter/report/html.hpp"

#include "sifter/model/format.hpp"
#include "sifter/report/charts.hpp"
#include "sifter/report/diagrams.hpp"
#include "sifter/report/html_deliverable.hpp"
#include "sifter/report/html_style.hpp"
#include "sifter/report/options_text.hpp"
#include "sifter/report/service.hpp"
#include "sifter/report/svg.hpp"
#include "sifter/report/tables.hpp"

namespace sifter::report {
namespace {

std::string esc(const std::string& text) { return escape_html(text); }

std::string figure_html(const std::string& svg, const std::string& caption) {
  return "<figure>" + svg + "<figcaption>" + esc(caption) + "</figcaption></figure>\n";
}

template <typename Texts>  // std::string or SharedText
std::string list_html(const Texts& items, const char* cls = "") {
  if (items.empty()) return "";
  std::string out = std::string("<ul") + (*cls ? std::string(" class=\"") + cls + "\"" : "") + ">\n";
  for (const std::string& i : items) out += "<li>" + esc(i) + "</li>\n";
  return out + "</ul>\n";
}

std::string absent(const std::string& words) { return "<p class=\"absent\">" + esc(words) + "</p>\n"; }

std::string verdict_html(const Cell& v, const std::string& tail) {
  return "<p class=\"verdict " + std::string(tone_class(v.tone)) + "\">" + esc(v.text) + esc(tail) + "</p>\n";
}

std::string sif_anchor(std::size_t i) { return "sif-" + std::to_string(i + 1); }
std::string scenario_anchor(std::size_t i) { return "scenario-" + std::to_string(i + 1); }

std::string exact_words(const ProjectResult& r, const ReportData& d) {
  for (const auto& s : r.sifs)
    if (s.pfd_avg_exact || s.pfh_exact_per_hour) return "run; its figures are in the SIF sections";
  return d.exact_requested ? "requested; no exact figures in these results" : "skipped (--no-exact)";
}

std::string cover(const ProjectResult& r, const ReportData& d) {
  std::string out = "<header>\n<p class=\"kind\">Safety instrumented functions: LOPA and SIL verification</p>\n";
  out += "<h1>" + esc(r.title.empty() ? r.file : r.title) + "</h1>\n<dl class=\"meta\">\n";
  const auto item = [&](const std::string& term, const std::string& value, bool mono = false) {
    out += "<dt>" + esc(term) + "</dt><dd" + (mono ? " class=\"mono\"" : "") + ">" + esc(value) + "</dd>\n";
  };
  item("date of the run", d.date);
  item("input file", r.file);
  item("SHA-256 of the input", r.sha256, true);
  item("tool", "sifter " + d.tool_version);
  item("exact cross-check", exact_words(r, d));
  out += "</dl>\n" + document_control_html(d.deliverable) + "</header>\n";
  out += "<aside class=\"caution\"><strong>Caution</strong><p>" + esc(kCaution) + "</p></aside>\n";
  out += "<nav class=\"contents\"><h3>Contents</h3><ol>\n<li><a href=\"#summary\">Summary</a></li>\n";
  for (std::size_t i = 0; i < r.sifs.size(); ++i)
    out += "<li><a href=\"#" + sif_anchor(i) + "\">" + esc(r.sifs[i].id) + "</a></li>\n";
  for (std::size_t i = 0; i < r.scenarios.size(); ++i)
    out += "<li><a href=\"#" + scenario_anchor(i) + "\">" + esc(r.scenarios[i].id) + "</a></li>\n";
  out += "<li><a href=\"#component-data\">Component data</a></li>\n";
  out += "<li><a href=\"#closing\">Assumptions, equations, warnings</a></li>\n</ol></nav>\n";
  return out;
}

std::string summary(const ProjectResult& r, const ReportData& d) {
  std::string out = "<section id=\"summary\">\n<h2>Summary</h2>\n";
  out += html_table(sif_summary_table(r, d));
  if (!r.scenarios.empty()) out += html_table(scenario_summary_table(r));
  if (!r.risk_criteria.empty()) out += html_table(risk_criteria_table(r.risk_criteria));
  return out + "</section>\n";
}

std::string probability_figures(const SifResult& s, const SifReportData& d) {
  std::string out = "<h3>Probability over time</h3>\n";
  if (d.pfd_curve)
    out += figure_html(pfd_curve_svg(s, *d.pfd_curve, d.required_pfd),
                       "PFD(t) over the mission, drawn by the " + d.pfd_curve->engine +
                           ". The dotted line is the PFDavg of the simplified equations; the dashed line the "
                           "required PFD." +
                           (s.uncertainty ? " The shaded band spans the 5th to 95th percentile of PFDavg." : ""));
  else
    out += absent("No PFD(t) curve: in high demand the PFH is the measure, or no PFDavg was computed.");
  out += "<h3>PFDavg against the proof-test interval</h3>\n";
  if (d.interval_sweep) {
    out += figure_html(interval_svg(s, *d.interval_sweep),
                       "Every proof-test interval of the SIF multiplied by the same factor, the verification re-run "
                       "at each factor; the longest allowed factor keeps PFDavg at or below the required PFD.");
    out += html_table(interval_table(*d.interval_sweep));
  } else {
    out += absent("Not drawn: the SIF has no required PFD in low demand.");
  }
  return out;
}

std::string further_figures(const SifResult& s, const SifReportData& d) {
  std::string out = "<h3>Sensitivity and uncertainty</h3>\n";
  if (d.sensitivity.empty()) {
    out += absent("Sensitivity ranking: not computed in this run.");
  } else {
    out += figure_html(sensitivity_svg(s, d.sensitivity),
                       "Sensitivity ranking: PFDavg with one input at its low and at its high value; largest swing "
                       "first.");
    out += html_table(sensitivity_table(d.sensitivity));
  }
  if (s.uncertainty)
    out += html_table(uncertainty_table(*s.uncertainty));
  else
    out += absent("Uncertainty: not run; the figures above use the stated failure data as point values.");
  return out;
}

std::string sif_section(const SifResult& s, const SifReportData& d, std::size_t i) {
  std::string out = "<section class=\"sif\" id=\"" + sif_anchor(i) + "\">\n";
  out += "<h2>" + esc(s.id) + (s.title.empty() ? "" : ": " + esc(s.title)) + "</h2>\n";
  out +=
      verdict_html(sif_verdict(s.meets_target), " · achieved " + sil_words(s.sil_achieved) +
                                                    (s.sil_required ? ", required " + sil_words(*s.sil_required) : ""));
  out += "<p class=\"facts\">Demand mode: " + esc(to_string(s.demand_mode)) + " (" + esc(s.demand_mode_basis) +
         "). Target: " + esc(s.target_text.empty() ? "none" : s.target_text) + ".</p>\n";
  out += "<h3>Architecture</h3>\n";
  out += figure_html(architecture_svg(s),
                     "Subsystems in signal order, each boxed with its vote; channels in parallel between the rails, "
                     "the elements of a channel in series.");
  out += html_table(sil_table(s, d));
  if (!s.limits.empty()) {
    out += "<h3>What keeps it below its target</h3>\n";
    std::vector<std::string> items;
    for (const auto& l : s.limits) items.push_back(l.kind + ": " + l.message);
    out += list_html(items, "limits");
  }
  out += html_table(subsystem_table(s)) + sif_requirements_html(s, d.deliverable);
  // The register (compact) leaves out the drawings whose numbers the tables above already hold.
  if (d.compact) return out + "</section>\n";
  out += figure_html(contribution_svg(s), "Share of each subsystem in the SIF's figure, with its own value.");
  out += probability_figures(s, d) + further_figures(s, d);
  return out + "</section>\n";
}

std::string findings_html(const ScenarioResult& s) {
  if (s.findings.empty()) return absent("No findings.");
  std::string out = "<ul class=\"findings\">\n";
  for (const auto& f : s.findings)
    out += "<li><strong>▲ " + esc(to_string(f.kind)) + "</strong>: " + esc(f.message) + "</li>\n";
  return out + "</ul>\n";
}

std::string scenario_section(const ScenarioResult& s, std::size_t i) {
  std::string out = "<section class=\"scenario\" id=\"" + scenario_anchor(i) + "\">\n";
  out += "<h2>" + esc(s.id) + (s.title.empty() ? "" : ": " + esc(s.title)) + "</h2>\n";
  std::string tail = " · required RRF " + plain(s.required_rrf) + ", SIL " + std::to_string(s.required_sil);
  out += verdict_html(scenario_verdict(s.meets_target), tail);
  std::string facts = "SIF under assessment: " + s.sif.value_or("none") + ". Frequency without it " +
                      sci(s.frequency_without_sif_per_yr) + "/yr against a tolerable " +
                      sci(s.target_frequency_per_yr) + "/yr; required PFD " + sci(s.required_pfd) + ".";
  if (s.demand_rate_per_yr)
    facts += " Demand on the SIF " + sci(*s.demand_rate_per_yr) + "/yr (" +
             to_string(s.demand_mode.value_or(DemandMode::kLow)) + " demand).";
  out += "<p class=\"facts\">" + esc(facts) + "</p>\n";
  out += html_table(worksheet_table(s));
  out += figure_html(staircase_svg(s),
                     "The frequency of each cause after each step, then all causes and, per consequence, after the "
                     "modifiers, without and with the SIF; the dashed line is the tolerable frequency.");
  out += "<h3>Findings</h3>\n" + findings_html(s);
  return out + "</section>\n";
}

std::string closing(const ProjectResult& r, const ReportData& d) {
  std::string out = "<section class=\"closing\" id=\"closing\">\n<h2>Assumptions, equations and warnings</h2>\n";
  out += "<h3>Assumptions</h3>\n";
  for (const auto& s : r.sifs)
    if (!s.assumptions.empty()) out += "<p><strong>" + esc(s.id) + "</strong></p>\n" + list_html(s.assumptions);
  for (const auto& s : r.scenarios)
    if (!s.assumptions.empty()) out += "<p><strong>" + esc(s.id) + "</strong></p>\n" + list_html(s.assumptions);
  out += "<h3>Equations</h3>\n" + html_table(equations_table(r, d));
  const Table shared = shared_table(r);
  if (!shared.rows.empty()) out += "<h3>Shared equipment</h3>\n" + html_table(shared);
  out += "<h3>Warnings</h3>\n";
  std::vector<std::string> warnings;
  for (const auto& w : r.warnings) warnings.push_back(place_name(r, d.deliverable, w.where) + ": " + w.message);
  out += warnings.empty() ? absent("None.") : list_html(warnings);
  return out + "</section>\n";
}

}  // namespace

std::string render_html(const ProjectResult& r, const ReportData& d) {
  std::string out = "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n";
  out += "<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n";
  out += "<title>" + esc(r.title.empty() ? r.file : r.title) + ": sifter report</title>\n";
  out += "<style>" + std::string(html_style()) + deliverable_css() +
         print_footer_css(d.deliverable, "SIL verification report") + "</style>\n</head>\n<body" +
         (d.compact ? " class=\"compact\"" : "") + ">\n";
  out += cover(r, d) + summary(r, d);
  for (std::size_t i = 0; i < r.sifs.size(); ++i)
    out += sif_section(r.sifs[i], i < d.sifs.size() ? d.sifs[i] : SifReportData{}, i);
  for (std::size_t i = 0; i < r.scenarios.size(); ++i) out += scenario_section(r.scenarios[i], i);
  out += component_data_html(d.deliverable);
  if (d.service) out += service_html(*d.service);
  out += options_sections_html(d.options);
  out += closing(r, d);
  out += "<footer>Written by sifter " + esc(d.tool_version) + " on " + esc(d.date) + " from " + esc(r.file) + ". " +
         esc(kCaution) + "</footer>\n</body>\n</html>\n";
  return out;
}

}  // namespace sifter::report
