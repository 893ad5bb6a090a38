// The plant in service: pooled rates, re-verification with the posterior rates, counts, schedule.
#include "sifter/analysis/service.hpp"

#include <algorithm>
#include <map>
#include <set>

#include "sifter/engines/lopa.hpp"

namespace sifter {
namespace {

std::string model_key(const Component& c) { return c.model.empty() ? c.id : c.model; }

double service_hours(const ServiceRecords& records, std::size_t component) {
  auto it = records.in_service_since.find(component);
  if (it == records.in_service_since.end()) return 0.0;
  return 24.0 * static_cast<double>(std::max<std::int64_t>(0, days_between(it->second, records.as_of)));
}

std::vector<int> failures_per_component(const Project& project, const ServiceRecords& records) {
  std::vector<int> out(project.components.size(), 0);
  for (const auto& e : records.events)
    if ((e.kind == EventKind::kProofTest || e.kind == EventKind::kDemand) && e.counts_as_undetected_failure())
      ++out[e.component_index];
  return out;
}

// Pools the devices of each model: failures and time add; the design rate is the devices'
// lambda_DU weighted by their service time (their plain mean while none has any).
std::vector<ModelService> pool_models(const Project& project, const ServiceRecords& records,
                                      const std::vector<int>& failures, double prior_hours) {
  std::map<std::string, std::vector<std::size_t>> members;
  std::vector<std::string> order;
  for (std::size_t i = 0; i < project.components.size(); ++i) {
    const std::string key = model_key(project.components[i]);
    if (!members.count(key)) order.push_back(key);
    members[key].push_back(i);
  }
  std::vector<ModelService> out;
  for (const auto& key : order) {
    ModelService m;
    m.model = key;
    int n = 0;
    double hours = 0.0, weighted = 0.0, plain = 0.0;
    for (auto i : members[key]) {
      const double t = service_hours(records, i);
      const double rate = project.components[i].rates.lambda_du.per_hour;
      if (records.in_service_since.count(i)) m.devices.push_back(project.components[i].id);
      n += failures[i];
      hours += t;
      weighted += rate * t;
      plain += rate;
    }
    const double design = hours > 0.0 ? weighted / hours : plain / static_cast<double>(members[key].size());
    m.estimate = estimate_rate(n, hours, design, prior_hours);
    out.push_back(std::move(m));
  }
  return out;
}

// The components of a SIF's channels, each once.
std::vector<std::size_t> sif_components(const Sif& sif) {
  std::vector<std::size_t> out;
  for (const auto& sub : sif.subsystems)
    for (const auto& ch : sub.channels)
      for (auto c : ch.components)
        if (std::find(out.begin(), out.end(), c) == out.end()) out.push_back(c);
  return out;
}

CountCheck count_check(int observed, std::optional<double> expected, double flag_below) {
  CountCheck c;
  c.observed = observed;
  c.expected = expected;
  if (expected) {
    c.probability_at_least = poisson_at_least(observed, *expected);
    c.flagged = *c.probability_at_least < flag_below;
  }
  return c;
}

// Positions in records.events of each component's events, so that a SIF reads only its own
// components' events (a register's records hold hundreds of thousands).
std::vector<std::vector<std::size_t>> events_by_component(const ServiceRecords& records, std::size_t components) {
  std::vector<std::vector<std::size_t>> out(components);
  for (std::size_t k = 0; k < records.events.size(); ++k)
    if (records.events[k].component_index < components) out[records.events[k].component_index].push_back(k);
  return out;
}

// Distinct dates of events of one kind on the SIF's components: a demand seen by three
// transmitters is one demand.
int distinct_dates(const ServiceRecords& records, const std::vector<std::vector<std::size_t>>& events_of,
                   const std::vector<std::size_t>& components, EventKind kind) {
  std::set<CivilDate> dates;
  for (auto c : components)
    if (c < events_of.size())
      for (auto k : events_of[c])
        if (records.events[k].kind == kind) dates.insert(records.events[k].date);
  return static_cast<int>(dates.size());
}

std::vector<ScheduleRow> schedule_of(const Project& project, const ServiceRecords& records) {
  std::map<std::size_t, ScheduleRow> rows;
  for (const auto& sif : project.sifs)
    for (const auto& sub : sif.subsystems)
      for (const auto& ch : sub.channels)
        for (auto c : ch.components) {
          auto since = records.in_service_since.find(c);
          if (since == records.in_service_since.end()) continue;
          auto [it, fresh] = rows.try_emplace(c);
          ScheduleRow& row = it->second;
          if (fresh) {
            row.component = project.components[c].id;
            row.in_service_since = since->second;
            row.interval_hours = sub.proof_test_interval.hours;
          }
          row.interval_hours = std::min(row.interval_hours, sub.proof_test_interval.hours);
          if (std::find(row.sifs.begin(), row.sifs.end(), sif.id) == row.sifs.end()) row.sifs.push_back(sif.id);
        }
  for (const auto& e : records.events)
    if (e.kind == EventKind::kProofTest)
      if (auto it = rows.find(e.component_index); it != rows.end()) it->second.last_test = e.date;  // date order
  std::vector<ScheduleRow> out;
  for (auto& [_, row] : rows) {
    row.next_due = add_interval(row.last_test.value_or(row.in_service_since), row.interval_hours);
    row.overdue = row.next_due < records.as_of;
    out.push_back(std::move(row));
  }
  std::stable_sort(out.begin(), out.end(), [](const ScheduleRow& a, const ScheduleRow& b) {
    return a.next_due != b.next_due ? a.next_due < b.next_due : a.component < b.component;
  });
  return out;
}

// The longest proof-test interval (all the SIF's tested subsystems together) with which the SIF
// meets its requirement again, from the what-if engine on the project with the posterior rates
// (one engine for every SIF that needs the advice).
void advise_restore(const WhatIf& what_if, std::size_t index, SifService& s) {
  try {
    s.restore = longest_proof_test_interval(what_if, index, std::nullopt, 0.0);
  } catch (const UsageError& e) {
    s.restore_note = e.what();
  }
}

}  // namespace

Project project_with_judged_rates(const Project& project, const std::vector<ComponentService>& components) {
  Project out = project;
  for (std::size_t i = 0; i < out.components.size() && i < components.size(); ++i)
    out.components[i].rates.lambda_du.per_hour = components[i].lambda_du_judged;
  return out;
}

namespace {

std::vector<ComponentService> judge_components(const Project& project, const ServiceRecords& records,
                                               const std::vector<int>& failures,
                                               const std::vector<ModelService>& models, double prior_hours) {
  std::map<std::string, const ModelService*> by_model;
  for (const auto& m : models) by_model[m.model] = &m;
  std::vector<ComponentService> out;
  for (std::size_t i = 0; i < project.components.size(); ++i) {
    const Component& c = project.components[i];
    ComponentService s;
    s.component = c.id;
    s.model = model_key(c);
    const double design = c.rates.lambda_du.per_hour;
    s.estimate = estimate_rate(failures[i], service_hours(records, i), design, prior_hours);
    // Each device keeps its own design rate scaled by its model's posterior-to-design ratio, so
    // that a device whose project states its own lambda_DU keeps that difference.
    const RateEstimate& pooled = by_model.at(s.model)->estimate;
    s.lambda_du_judged = pooled.design_per_hour > 0.0 ? design * pooled.posterior_mean_per_hour / pooled.design_per_hour
                                                      : pooled.posterior_mean_per_hour;
    out.push_back(std::move(s));
  }
  return out;
}

// What the verification runs share: the project as it stands, with the posterior rates, and
// the LOPA's demand rates; and the indexes every SIF reads (its components' events, the
// schedule rows that name it).
struct Verifications {
  const LoadedProject& loaded;
  const LoadedProject& judged_loaded;
  const ProjectResult& design;
  const ProjectResult& judged;
  const std::map<std::string, double>& demand_rate_per_yr;
  const std::vector<std::vector<std::size_t>>& events_of_component;
  const std::map<std::string, std::vector<std::size_t>>& schedule_rows_of_sif;
};

void count_events(const Sif& sif, const ServiceRecords& records, const Verifications& v, std::size_t i,
                  double flag_below, SifService& s) {
  const auto components = sif_components(sif);
  std::optional<CivilDate> first;
  for (auto c : components)
    if (auto it = records.in_service_since.find(c); it != records.in_service_since.end())
      if (!first || it->second < *first) first = it->second;
  s.observed_years = first ? 24.0 * static_cast<double>(days_between(*first, records.as_of)) / kHoursPerYear : 0.0;
  std::optional<double> expected_demands, expected_trips;
  if (first) {
    if (auto it = v.demand_rate_per_yr.find(sif.id); it != v.demand_rate_per_yr.end())
      expected_demands = it->second * s.observed_years;
    expected_trips = v.design.sifs[i].spurious_trip_rate_per_yr * s.observed_years;
  }
  s.demands = count_check(distinct_dates(records, v.events_of_component, components, EventKind::kDemand),
                          expected_demands, flag_below);
  s.spurious_trips = count_check(distinct_dates(records, v.events_of_component, components, EventKind::kSpuriousTrip),
                                 expected_trips, flag_below);
}

SifService assess_sif(const Project& project, std::size_t i, const ServiceRecords& records, const Verifications& v,
                      const std::vector<ScheduleRow>& schedule, double flag_below, std::optional<WhatIf>& restore) {
  const Sif& sif = project.sifs[i];
  SifService s;
  s.id = sif.id;
  s.demand_mode = v.judged.sifs[i].demand_mode;
  s.measure_design = v.design.sifs[i].judged_figure();
  s.measure_judged = v.judged.sifs[i].judged_figure();
  s.meets_design = v.design.sifs[i].meets_target;
  s.meets_judged = v.judged.sifs[i].meets_target;
  s.verdict_changed = s.meets_design != s.meets_judged;
  if (s.meets_judged == false) {
    try {
      if (!restore) restore.emplace(v.judged_loaded.project);
      advise_restore(*restore, i, s);
    } catch (const UsageError& e) {
      s.restore_note = e.what();
    }
  }
  count_events(sif, records, v, i, flag_below, s);
  const auto rows = v.schedule_rows_of_sif.find(sif.id);
  if (rows == v.schedule_rows_of_sif.end()) return s;
  for (auto k : rows->second) {  // in schedule order
    const ScheduleRow& row = schedule[k];
    s.any_overdue = s.any_overdue || row.overdue;
    if (!s.earliest_due || row.next_due < *s.earliest_due) {
      s.earliest_due = row.next_due;
      s.earliest_due_component = row.component;
    }
  }
  return s;
}

std::vector<std::string> method_notes(double prior_hours) {
  return {
      "observed lambda_DU: dangerous failures found by proof tests and demands over the service time from each "
      "device's in-service date to the as-of date; 90% interval from chi-squared",
      "posterior: gamma prior centred on the design lambda_DU with the weight of " +
          format_duration(Duration{prior_hours}) + " of service, updated by the counts",
      "re-verification: each device's lambda_DU scaled by its model's posterior mean over design, then verified "
      "and judged as `sifter check` does",
      "above (exceeds design) at 70% (90%): the one-sided 70% (90%) lower confidence bound of the observed rate lies "
      "above "
      "the design rate"};
}

}  // namespace

ServiceResult assess_service(const LoadedProject& loaded, const ServiceRecords& records,
                             const ServiceOptions& options) {
  const Project& project = loaded.project;
  ServiceResult out;
  out.title = project.title;
  out.project_file = project.file;
  out.records_file = records.file;
  out.as_of = records.as_of;
  out.prior_hours = options.prior_hours;
  out.flag_below = options.flag_below;
  const std::vector<int> failures = failures_per_component(project, records);
  out.models = pool_models(project, records, failures, options.prior_hours);
  out.components = judge_components(project, records, failures, out.models, options.prior_hours);
  // The same verify and judge as `check`, on the project as it stands and with the posterior rates.
  LoadedProject judged_loaded = loaded;
  judged_loaded.project = project_with_judged_rates(project, out.components);
  const ProjectResult design = verify_project(loaded, options.verify);
  const ProjectResult judged = verify_project(judged_loaded, options.verify);
  std::map<std::string, double> demand_rate_per_yr;
  if (!project.scenarios.empty())
    for (const auto& req : sif_requirements(evaluate_scenarios(project, lopa_context_from_project(project))))
      demand_rate_per_yr[req.sif] = req.demand_rate_per_yr;
  out.schedule = schedule_of(project, records);
  std::map<std::string, std::vector<std::size_t>> rows_of_sif;
  for (std::size_t k = 0; k < out.schedule.size(); ++k)
    for (const auto& id : out.schedule[k].sifs) rows_of_sif[id].push_back(k);
  const auto events_of = events_by_component(records, project.components.size());
  const Verifications v{loaded, judged_loaded, design, judged, demand_rate_per_yr, events_of, rows_of_sif};
  std::optional<WhatIf> restore;  // made for the first SIF that falls short with the posterior rates
  for (std::size_t i = 0; i < project.sifs.size(); ++i)
    out.sifs.push_back(assess_sif(project, i, records, v, out.schedule, options.flag_below, restore));
  out.notes = method_notes(options.prior_hours);
  return out;
}

}  // namespace sifter
