// Gathering what the deliverables show besides the results: document control, component
// data, subsystem parameters, the SRS checklist per SIF.
#include "sifter/analysis/deliverable.hpp"

#include <algorithm>
#include <cstdio>
#include <map>

#include "sifter/engines/constraints.hpp"
#include "sifter/engines/requirements.hpp"
#include "sifter/model/quantity.hpp"

namespace sifter {
namespace {

std::string per_year_text(Rate rate) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.3g/yr", rate.per_year());
  return buf;
}

std::string text_or_empty(const std::optional<Duration>& d) { return d ? format_duration(*d) : ""; }

// The items a safety requirements specification states of each SIF, IEC 61511-1:2016 10.3.2
// (from memory: the list, not its wording). A stated item carries its text; an empty one is
// an open item.
std::vector<RequirementItem> checklist(const Sif& sif, const SifResult& r) {
  const SifRequirements q = sif.requirements.value_or(SifRequirements{});
  std::vector<RequirementItem> items;
  const auto add = [&](std::string clause, std::string stated) {
    items.push_back({std::move(clause), std::move(stated)});
  };
  std::string hazard;
  for (const auto& s : r.scenarios) hazard += (hazard.empty() ? "scenario " : ", ") + s;
  add("the hazardous event the SIF protects against and its scenarios", hazard);
  add("the safe state of the process", q.safe_state);
  add("demand sources and demand rate", r.scenarios.empty() ? "" : r.demand_mode_basis);
  add("demand mode and required SIL, RRF, PFD or PFH",
      r.sil_required ? "SIL " + std::to_string(*r.sil_required) + " (" + r.target_text + ")" : "");
  add("process measurements and trip set points", q.trip_setpoint);
  add("output actions and the criterion of successful operation", q.action);
  add("functional relation of inputs to outputs", q.functional_relation);
  add("response time within the process safety time",
      q.process_safety_time && r.response_time_s
          ? format_seconds(*r.response_time_s) + " against " + format_seconds(*r.response_time_limit_s) +
                " allowed of " + format_seconds(q.process_safety_time->hours * kSecondsPerHour)
      : q.process_safety_time
          ? "process safety time " + format_seconds(q.process_safety_time->hours * kSecondsPerHour) +
                "; element response times incomplete"
          : "");
  add("proof-test interval required", text_or_empty(q.proof_test_interval));
  add("what the proof test must cover", q.proof_test_coverage);
  add("manual shutdown", q.manual_shutdown);
  add("energise or de-energise to trip", q.energize_to_trip);
  add("reset after a trip", q.reset ? (*q.reset == ResetKind::kManual ? "manual" : "automatic") : "");
  add("maximum spurious trip rate", q.max_spurious_trip_rate ? per_year_text(*q.max_spurious_trip_rate) : "");
  add("response to detected faults, with the repair time allowed", q.fault_response);
  add("start-up and restart after a trip", q.startup_restart);
  add("bypasses and overrides, and how they are cleared", q.bypass);
  add("interfaces with the BPCS and the operators", q.interfaces);
  add("environmental extremes", q.environment);
  add("modes of operation of the plant in which the SIF is needed", q.operating_modes);
  return items;
}

SubsystemParameters parameters_of(const Subsystem& sub) {
  SubsystemParameters p;
  p.name = sub.name;
  p.vendor = sub.is_vendor();
  p.beta = sub.beta;
  p.beta_d = sub.beta_d;
  p.proof_test_interval = sub.proof_test_interval;
  p.mttr = sub.mttr;
  p.mrt = sub.mrt;
  p.proof_test_coverage = sub.proof_test_coverage;
  p.partial_stroke = sub.partial_stroke;
  p.test_duration = sub.test_duration;
  p.staggered = sub.staggered;
  return p;
}

}  // namespace

std::vector<std::string> SifDeliverable::open_items() const {
  std::vector<std::string> out;
  for (const auto& i : items)
    if (i.stated.empty()) out.push_back(i.clause);
  return out;
}

DeliverableData build_deliverable_data(const Project& project, const ProjectResult& result) {
  DeliverableData d;
  d.project_title = project.title;
  d.document = project.document;
  std::map<std::size_t, std::vector<std::string>> users;
  for (const auto& sif : project.sifs)
    for (const auto& sub : sif.subsystems)
      for (const auto& ch : sub.channels)
        for (auto c : ch.components) {
          auto& u = users[c];
          if (std::find(u.begin(), u.end(), sif.id) == u.end()) u.push_back(sif.id);
        }
  for (std::size_t i = 0; i < project.components.size(); ++i) {
    const Component& c = project.components[i];
    ComponentDataRow row;
    row.id = c.id;
    row.model = c.model;
    row.rates = c.rates;
    const ElementSff sff = element_sff(c);
    row.sff = sff.value;
    row.sff_declared = sff.declared;
    row.type = c.element_type;
    row.systematic_capability = c.systematic_capability;
    row.prior_use = c.prior_use;
    row.source = c.data_source_line();
    if (c.source) row.source_kind = c.source->kind;
    if (c.response_time) row.response_time_s = c.response_time->hours * kSecondsPerHour;
    if (auto u = users.find(i); u != users.end()) row.sifs = u->second;
    d.components.push_back(std::move(row));
  }
  for (std::size_t i = 0; i < project.sifs.size() && i < result.sifs.size(); ++i) {
    const Sif& sif = project.sifs[i];
    SifDeliverable s;
    s.requirements = sif.requirements;
    for (const auto& sub : sif.subsystems) s.subsystems.push_back(parameters_of(sub));
    s.items = checklist(sif, result.sifs[i]);
    d.sifs.push_back(std::move(s));
  }
  return d;
}

}  // namespace sifter
