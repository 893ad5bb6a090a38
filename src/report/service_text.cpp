// The service assessment for the terminal: models, SIFs, counts, schedule, caution.
#include "sifter/model/format.hpp"
#include "sifter/report/service.hpp"
#include "sifter/report/text_table.hpp"
#include "sifter/results/sif.hpp"

namespace sifter::report {
namespace {

std::string verdict(const std::optional<bool>& meets) {
  return !meets ? "not judged" : *meets ? "meets" : "falls short";
}

std::string probability_text(const std::optional<double>& p) { return p ? percent(*p) : "-"; }

std::string exceeds_text(const RateEstimate& e) {
  return e.exceeds_design_at_90 ? "90%" : e.exceeds_design_at_70 ? "70%" : "-";
}

// Said under the table when a model's upper 90 % lies below its mean (see RateEstimate).
std::string skewed_posterior_note(const ServiceResult& r) {
  const std::string models = skewed_posterior_models(r);
  if (models.empty()) return "";
  return wrap("* " + models + ": the upper 90% lies below the posterior mean. " + kSkewedPosteriorNote, 78, "  ");
}

std::string models_text(const ServiceResult& r) {
  TextTable observed({"model", "dev", "fail", "dev-yr", "observed", "90% low", "90% high"},
                     {false, true, true, true, true, true, true});
  TextTable design({"model", "design", "posterior", "upper 90%", "P(>design)", "above"},
                   {false, true, true, true, true, true});
  for (const auto& m : r.models) {
    if (m.devices.empty()) continue;
    const RateEstimate& e = m.estimate;
    observed.add_row({m.model, std::to_string(m.devices.size()), std::to_string(e.failures),
                      plain(e.service_hours / kHoursPerYear), sci_or_dash(e.observed_per_hour),
                      sci_or_dash(e.ci90_low_per_hour), sci_or_dash(e.ci90_high_per_hour)});
    design.add_row({m.model, sci(e.design_per_hour), sci(e.posterior_mean_per_hour),
                    sci(e.posterior_upper90_per_hour) + (e.posterior_bound_below_mean() ? "*" : ""),
                    percent(e.probability_above_design), exceeds_text(e)});
  }
  return "Observed lambda_DU per hour by component model (devices in service pooled)\n" + observed.render() +
         "\nAgainst the design rate, per hour (prior: " + plain(r.prior_hours) + " h of service at the design rate)\n" +
         design.render() + skewed_posterior_note(r);
}

std::string sifs_text(const ServiceResult& r) {
  TextTable t({"SIF", "measure", "design", "with service", "verdict now", "changed"},
              {false, false, true, true, false, false});
  std::string advice;
  for (const auto& s : r.sifs) {
    t.add_row({s.id, s.demand_mode == DemandMode::kLow ? "PFDavg" : "PFH/h", sci_or_dash(s.measure_design),
               sci_or_dash(s.measure_judged), verdict(s.meets_judged),
               s.verdict_changed ? "yes, was " + verdict(s.meets_design) : "no"});
    if (s.meets_judged != false) continue;
    std::string line = s.id + " falls short with the service rates. ";
    if (s.restore && s.restore->outcome == IntervalOutcome::kFound)
      line += "It meets its requirement again with proof-test intervals of at most " +
              format_duration(s.restore->longest) + " (" + std::to_string(s.restore->whole_months) +
              " whole months) on all its tested subsystems.";
    else if (s.restore && s.restore->outcome == IntervalOutcome::kNone)
      line +=
          "No proof-test interval restores it: the terms the interval does not touch exceed the requirement; "
          "the design must change.";
    else if (s.restore)
      line += "Any interval up to the mission time meets it.";
    else
      line += s.restore_note;
    advice += wrap(line, 76, "  ");
  }
  return "SIFs re-verified with the posterior rates (same engine and judge as check)\n" + t.render() +
         (advice.empty() ? "" : "\n" + advice);
}

std::string counts_text(const ServiceResult& r) {
  TextTable t({"SIF", "years", "demands", "expected", "P(>=)", "trips", "expected", "P(>=)"},
              {false, true, true, true, true, true, true, true});
  std::string flags;
  for (const auto& s : r.sifs) {
    auto flag = [](const CountCheck& c) { return probability_text(c.probability_at_least) + (c.flagged ? " !" : ""); };
    t.add_row({s.id, plain(s.observed_years), std::to_string(s.demands.observed),
               s.demands.expected ? plain(*s.demands.expected) : "-", flag(s.demands),
               std::to_string(s.spurious_trips.observed),
               s.spurious_trips.expected ? plain(*s.spurious_trips.expected) : "-", flag(s.spurious_trips)});
    if (s.demands.flagged)
      flags += wrap(s.id + ": more demands than the LOPA predicts (probability of so many below " +
                        percent(r.flag_below) + "); revisit the initiating frequencies and the layers before it.",
                    76, "  ");
    if (s.spurious_trips.flagged)
      flags += wrap(s.id + ": more spurious trips than predicted (probability below " + percent(r.flag_below) + ").",
                    76, "  ");
  }
  return "Demands and spurious trips against the predicted rates (! below " + percent(r.flag_below) + ")\n" +
         t.render() + (flags.empty() ? "" : "\n" + flags);
}

std::string schedule_text(const ServiceResult& r) {
  TextTable t({"component", "last test", "interval", "next due", "status"}, {false, false, true, false, false});
  for (const auto& row : r.schedule)
    t.add_row({row.component, row.last_test ? to_iso(*row.last_test) : "none",
               format_duration(Duration{row.interval_hours}), to_iso(row.next_due), row.overdue ? "OVERDUE" : "due"});
  TextTable per_sif({"SIF", "earliest due", "component", "status"});
  for (const auto& s : r.sifs)
    if (s.earliest_due)
      per_sif.add_row({s.id, to_iso(*s.earliest_due), s.earliest_due_component, s.any_overdue ? "OVERDUE" : "due"});
  return "Proof-test schedule on " + to_iso(r.as_of) + "\n" + t.render() + "\n" + per_sif.render();
}

}  // namespace

std::string skewed_posterior_models(const ServiceResult& r) {
  std::string models;
  for (const auto& m : r.models)
    if (!m.devices.empty() && m.estimate.posterior_bound_below_mean()) models += (models.empty() ? "" : ", ") + m.model;
  return models;
}

std::string render_service(const ServiceResult& r) {
  std::string out = r.title + "\nIn service up to " + to_iso(r.as_of) + ": " + r.records_file + "\n\n";
  out += models_text(r) + "\n" + sifs_text(r) + "\n" + counts_text(r) + "\n" + schedule_text(r) + "\n";
  out += "How these figures were obtained\n";
  for (const auto& n : r.notes) out += wrap("- " + n, 76, "  ");
  out += "\n" + wrap(kCaution, 78, "") + "\n";
  return out;
}

}  // namespace sifter::report
