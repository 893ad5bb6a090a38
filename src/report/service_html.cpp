// The report's "service" section: the plant in service against its design.
#include "sifter/model/format.hpp"
#include "sifter/report/html_deliverable.hpp"
#include "sifter/report/service.hpp"
#include "sifter/report/svg.hpp"
#include "sifter/results/sif.hpp"

namespace sifter::report {
namespace {

std::string esc(const std::string& text) { return escape_html(text); }

std::string verdict(const std::optional<bool>& meets) {
  return !meets ? "not judged" : *meets ? "meets" : "falls short";
}

// A table drawn as every table of the report (html_table): a cell starting with "!" is drawn
// as bad. Columns marked in `numeric` are right-aligned and never break inside a number
// ("2.00e-08" would break at "-"); no column is drawn as a key, as this section always was.
std::string table(const std::string& caption, const std::vector<std::string>& header,
                  const std::vector<std::vector<std::string>>& rows, const std::vector<bool>& numeric = {}) {
  Table t{caption, header, numeric, {}, std::vector<bool>(header.size(), false)};
  for (const auto& row : rows) {
    t.rows.emplace_back();
    for (const auto& c : row)
      t.rows.back().push_back(!c.empty() && c[0] == '!' ? Cell{c.substr(1), Tone::kBad} : Cell{c, Tone::kPlain});
  }
  return html_table(t);
}

// Two tables, as in the terminal: what was observed, then the rates against the design; each
// fits the A4 text column (tests/browser_test.sh measures them).
std::string models_table(const ServiceResult& r) {
  std::vector<std::vector<std::string>> observed, design;
  const std::string skewed = skewed_posterior_models(r);
  for (const auto& m : r.models) {
    if (m.devices.empty()) continue;
    const RateEstimate& e = m.estimate;
    observed.push_back({m.model, std::to_string(m.devices.size()), std::to_string(e.failures),
                        plain(e.service_hours / kHoursPerYear), sci_or_dash(e.observed_per_hour),
                        sci_or_dash(e.ci90_low_per_hour), sci_or_dash(e.ci90_high_per_hour)});
    design.push_back({m.model, sci(e.design_per_hour), sci(e.posterior_mean_per_hour),
                      sci(e.posterior_upper90_per_hour) + (e.posterior_bound_below_mean() ? "*" : ""),
                      percent(e.probability_above_design),
                      e.exceeds_design_at_90   ? "!at 90%"
                      : e.exceeds_design_at_70 ? "!at 70%"
                                               : "no"});
  }
  return table("Observed lambda_DU per hour by component model, devices in service pooled",
               {"model", "devices", "failures", "device-years", "observed", "90% low", "90% high"}, observed,
               {false, true, true, true, true, true, true}) +
         table("Against the design rate, per hour; posterior with a prior of " +
                   format_duration(Duration{r.prior_hours}) + " at the design rate",
               {"model", "design", "posterior mean", "posterior 90%", "P(>design)", "exceeds design"}, design,
               {false, true, true, true, true, false}) +
         (skewed.empty()
              ? ""
              : "<p class=\"facts\">* " + esc(skewed) + ": the posterior 90% lies below the posterior mean. " +
                    esc(kSkewedPosteriorNote) + "</p>\n");
}

// The SIFs' verdicts with the service rates, then their counts and due dates: two tables, so
// that each fits the A4 text column.
std::string sifs_table(const ServiceResult& r) {
  std::vector<std::vector<std::string>> verdicts, counts;
  for (const auto& s : r.sifs) {
    std::string restore = "-";
    if (s.restore && s.restore->outcome == IntervalOutcome::kFound)
      restore = "intervals at most " + format_duration(s.restore->longest);
    else if (s.restore && s.restore->outcome == IntervalOutcome::kNone)
      restore = "no interval restores it";
    auto count = [](const CountCheck& c) {
      std::string t = std::to_string(c.observed) + (c.expected ? " (expected " + plain(*c.expected) + ")" : "");
      return c.flagged ? "!" + t : t;
    };
    verdicts.push_back({s.id, sci_or_dash(s.measure_design), sci_or_dash(s.measure_judged),
                        (s.meets_judged == false ? "!" : "") + verdict(s.meets_judged),
                        s.verdict_changed ? "!yes" : "no", restore});
    counts.push_back({s.id, count(s.demands), count(s.spurious_trips),
                      s.earliest_due ? (s.any_overdue ? "!" : "") + to_iso(*s.earliest_due) : "-"});
  }
  return table("SIFs re-verified with the posterior rates (the engine and judge of check)",
               {"SIF", "PFDavg / PFH design", "with service", "verdict", "changed", "restored by"}, verdicts,
               {false, true, true, false, false, false}) +
         table("Demands and spurious trips against the predicted rates, flagged below " + percent(r.flag_below) +
                   "; the earliest proof test due",
               {"SIF", "demands", "spurious trips", "earliest due"}, counts);
}

std::string schedule_table(const ServiceResult& r) {
  std::vector<std::vector<std::string>> rows;
  for (const auto& row : r.schedule)
    rows.push_back({row.component, row.last_test ? to_iso(*row.last_test) : "none",
                    format_duration(Duration{row.interval_hours}), (row.overdue ? "!" : "") + to_iso(row.next_due),
                    row.overdue ? "!overdue" : "due"});
  return table("Proof-test schedule on " + to_iso(r.as_of),
               {"component", "last test", "interval", "next due", "status"}, rows);
}

}  // namespace

std::string service_html(const ServiceResult& r) {
  std::string out = "<section class=\"service\" id=\"service\">\n<h2>In service up to " + esc(to_iso(r.as_of)) +
                    "</h2>\n<p class=\"facts\">Records: " + esc(r.records_file) + ".</p>\n";
  out += models_table(r) + sifs_table(r) + schedule_table(r);
  out += "<ul>\n";
  for (const auto& n : r.notes) out += "<li>" + esc(n) + "</li>\n";
  out += "</ul>\n<aside class=\"caution\"><strong>Caution</strong><p>" + esc(kCaution) + "</p></aside>\n";
  return out + "</section>\n";
}

}  // namespace sifter::report
