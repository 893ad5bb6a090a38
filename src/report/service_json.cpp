// `sifter-service/1` JSON and the CSV of the models: every number finite, absent values as null.
#include <cstdio>

#include "sifter/model/format.hpp"
#include "sifter/report/service.hpp"
#include "sifter/results/sif.hpp"

namespace sifter::report {
namespace {

using nlohmann::json;

json opt(const std::optional<double>& v, const char* what) { return v ? json(checked(*v, what)) : json(nullptr); }
json opt(const std::optional<bool>& v) { return v ? json(*v) : json(nullptr); }

json estimate_json(const RateEstimate& e) {
  return {{"failures", e.failures},
          {"service_hours", checked(e.service_hours, "service hours")},
          {"observed_rate_per_h", opt(e.observed_per_hour, "observed rate")},
          {"ci90_low_per_h", opt(e.ci90_low_per_hour, "interval")},
          {"ci90_high_per_h", opt(e.ci90_high_per_hour, "interval")},
          {"posterior_mean_per_h", checked(e.posterior_mean_per_hour, "posterior mean")},
          {"posterior_upper90_per_h", checked(e.posterior_upper90_per_hour, "posterior bound")},
          {"design_rate_per_h", checked(e.design_per_hour, "design rate")},
          {"exceeds_design_at_70", e.exceeds_design_at_70},
          {"exceeds_design_at_90", e.exceeds_design_at_90},
          {"posterior_probability_above_design", checked(e.probability_above_design, "probability")},
          {"posterior_upper90_below_mean", e.posterior_bound_below_mean()}};
}

json count_json(const CountCheck& c) {
  return {{"observed", c.observed},
          {"expected", opt(c.expected, "expected count")},
          {"probability_at_least", opt(c.probability_at_least, "probability")},
          {"flagged", c.flagged}};
}

json sif_json(const SifService& s) {
  const bool low = s.demand_mode == DemandMode::kLow;
  json j = {{"id", s.id}};
  j[low ? "pfd_avg_judged" : "pfh_judged"] = opt(s.measure_judged, "judged measure");
  j[low ? "pfd_avg_design" : "pfh_design"] = opt(s.measure_design, "design measure");
  j["meets_target"] = opt(s.meets_judged);
  j["meets_target_design"] = opt(s.meets_design);
  j["verdict_changed"] = s.verdict_changed;
  j["demands"] = s.demands.observed;
  j["expected_demands"] = opt(s.demands.expected, "expected demands");
  j["spurious_trips"] = s.spurious_trips.observed;
  j["expected_spurious_trips"] = opt(s.spurious_trips.expected, "expected trips");
  j["demands_check"] = count_json(s.demands);
  j["spurious_trips_check"] = count_json(s.spurious_trips);
  j["observed_years"] = checked(s.observed_years, "years");
  j["earliest_due"] = s.earliest_due ? json(to_iso(*s.earliest_due)) : json(nullptr);
  j["earliest_due_component"] = s.earliest_due ? json(s.earliest_due_component) : json(nullptr);
  j["overdue"] = s.any_overdue;
  if (s.restore) {
    j["restore"] = {{"longest_interval_h", checked(s.restore->longest.hours, "interval")},
                    {"whole_months", s.restore->whole_months},
                    {"outcome", s.restore->outcome == IntervalOutcome::kFound  ? "found"
                                : s.restore->outcome == IntervalOutcome::kNone ? "none"
                                                                               : "whole_mission"}};
  } else {
    j["restore"] = nullptr;
  }
  return j;
}

std::string csv_cell(const json& v) {
  if (v.is_null()) return "";
  if (v.is_boolean()) return v.get<bool>() ? "true" : "false";
  if (v.is_number_float()) {
    char buf[32];
    std::snprintf(buf, sizeof buf, "%.6g", v.get<double>());
    return buf;
  }
  if (v.is_number()) return v.dump();
  std::string s = v.get<std::string>(), out = "\"";
  for (char c : s) out += c == '"' ? std::string("\"\"") : std::string(1, c);
  return out + "\"";
}

}  // namespace

json service_json(const ServiceResult& r) {
  json out = {{"format", kServiceFormat},
              {"title", r.title},
              {"project", r.project_file},
              {"records", r.records_file},
              {"as_of", to_iso(r.as_of)},
              {"prior_hours", checked(r.prior_hours, "prior strength")},
              {"flag_below", checked(r.flag_below, "flag level")},
              {"caution", kCaution}};
  json models = json::array();
  for (const auto& m : r.models) {
    json j = {{"model", m.model}, {"devices", m.devices.size()}, {"device_ids", m.devices}};
    j.update(estimate_json(m.estimate));
    models.push_back(std::move(j));
  }
  out["models"] = std::move(models);
  json components = json::array();
  for (const auto& c : r.components) {
    json j = {{"component", c.component}, {"model", c.model}};
    j.update(estimate_json(c.estimate));
    j["lambda_du_judged_per_h"] = checked(c.lambda_du_judged, "judged rate");
    components.push_back(std::move(j));
  }
  out["components"] = std::move(components);
  json sifs = json::array();
  for (const auto& s : r.sifs) sifs.push_back(sif_json(s));
  out["sifs"] = std::move(sifs);
  json schedule = json::array();
  for (const auto& row : r.schedule)
    schedule.push_back({{"component", row.component},
                        {"last_test", row.last_test ? json(to_iso(*row.last_test)) : json(nullptr)},
                        {"interval_h", checked(row.interval_hours, "interval")},
                        {"next_due", to_iso(row.next_due)},
                        {"overdue", row.overdue},
                        {"in_service_since", to_iso(row.in_service_since)},
                        {"sifs", row.sifs}});
  out["schedule"] = std::move(schedule);
  out["notes"] = r.notes;
  return out;
}

std::string service_csv(const ServiceResult& r) {
  static const char* kColumns[] = {"model",
                                   "devices",
                                   "failures",
                                   "service_hours",
                                   "observed_rate_per_h",
                                   "ci90_low_per_h",
                                   "ci90_high_per_h",
                                   "posterior_mean_per_h",
                                   "posterior_upper90_per_h",
                                   "design_rate_per_h",
                                   "exceeds_design_at_70",
                                   "exceeds_design_at_90",
                                   "posterior_upper90_below_mean"};
  std::string out;
  for (const char* c : kColumns) out += std::string(out.empty() ? "" : ",") + c;
  out += "\r\n";
  const json whole = service_json(r);  // kept alive while its models are read
  for (const auto& m : whole["models"]) {
    std::string line;
    for (const char* c : kColumns) {
      const json& v = m[c];
      line += (line.empty() ? "" : ",") + csv_cell(v);
    }
    out += line + "\r\n";
  }
  return out;
}

}  // namespace sifter::report
