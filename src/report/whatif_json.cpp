// JSON and CSV of the what-if commands: every number finite, absent values as null.
#include "sifter/report/whatif_json.hpp"

#include <cstdio>

#include "sifter/model/format.hpp"
#include "sifter/report/worksheet.hpp"
#include "sifter/results/sif.hpp"

namespace sifter::report {
namespace {

using nlohmann::json;

json opt(const std::optional<double>& v, const char* what) { return v ? json(checked(*v, what)) : json(nullptr); }
json opt(const std::optional<bool>& v) { return v ? json(*v) : json(nullptr); }
json opt(const std::optional<std::string>& v) { return v ? json(*v) : json(nullptr); }

const char* measure_key(DemandMode mode) { return mode == DemandMode::kLow ? "pfd_avg" : "pfh"; }

std::string outcome_text(IntervalOutcome o) {
  switch (o) {
    case IntervalOutcome::kFound:
      return "found";
    case IntervalOutcome::kNone:
      return "none";
    case IntervalOutcome::kWholeMission:
      return "whole_mission";
  }
  return {};
}

json requirement_json(const Requirement& q) {
  return {{"value", checked(q.value, "requirement")}, {"band_edge", q.band_edge}, {"basis", q.basis}};
}

json point_json(double value, const SifResult& s) {
  return {{"value", checked(value, "value")},     {"pfd_avg", opt(s.pfd_avg, "pfd_avg")},
          {"pfh", opt(s.pfh_per_hour, "pfh")},    {"rrf", opt(s.rrf, "rrf")},
          {"sil_probability", s.sil_probability}, {"sil_achieved", s.sil_achieved},
          {"meets_target", opt(s.meets_target)}};
}

std::string csv_number(const std::optional<double>& v) {
  if (!v) return "";
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.6g", checked(*v, "sweep value"));
  return buf;
}

}  // namespace

json interval_json(const IntervalResult& r) {
  const bool low = r.requirement.mode == DemandMode::kLow;
  const bool found = r.outcome != IntervalOutcome::kNone;
  json j;
  j["format"] = "sifter-interval/1";
  j["sif"] = r.sif;
  j["subsystem"] = opt(r.subsystem);
  j["subsystems_varied"] = r.varied;
  j["demand_mode"] = to_string(r.requirement.mode);
  j["outcome"] = outcome_text(r.outcome);
  j["longest_proof_test_interval_h"] = found ? json(checked(r.longest.hours, "interval")) : json(nullptr);
  j["longest_whole_months"] = found ? json(r.whole_months) : json(nullptr);
  j["pfd_avg_at_interval"] = found && low ? json(checked(r.measure_at_longest, "pfd")) : json(nullptr);
  j["pfh_at_interval"] = found && !low ? json(checked(r.measure_at_longest, "pfh")) : json(nullptr);
  j[low ? "pfd_avg_at_whole_months" : "pfh_at_whole_months"] = opt(r.measure_at_whole_months, "measure");
  j["required_pfd"] = low ? json(checked(r.requirement.value, "required")) : json(nullptr);
  j["required_pfh"] = low ? json(nullptr) : json(checked(r.requirement.value, "required"));
  j["required_basis"] = r.requirement.basis;
  j["margin"] = checked(r.margin, "margin");
  j["allowed"] = checked(r.allowed, "allowed");
  j[std::string(measure_key(r.requirement.mode)) + "_now"] = checked(r.measure_now, "measure");
  j[std::string(measure_key(r.requirement.mode)) + "_at_zero_interval"] = checked(r.measure_at_zero, "measure");
  j["current_intervals_h"] = json::array();
  for (const auto& d : r.current_intervals) j["current_intervals_h"].push_back(checked(d.hours, "interval"));
  j["mission_time_h"] = checked(r.mission.hours, "mission");
  j["notes"] = r.notes;
  j["caution"] = kCaution;
  return j;
}

json sweep_json(const SweepResult& r) {
  json j;
  j["format"] = "sifter-sweep/1";
  j["sif"] = r.sif;
  j["subsystem"] = opt(r.subsystem);
  j["subsystems_varied"] = r.varied;
  j["parameter"] = to_string(r.parameter);
  j["value_unit"] = is_duration(r.parameter)                         ? "h"
                    : r.parameter == SweepParameter::kLambdaDuFactor ? "factor"
                                                                     : "fraction";
  j["demand_mode"] = to_string(r.mode);
  j["points"] = json::array();
  for (const auto& p : r.points) j["points"].push_back(point_json(p.value, p.result));
  j["notes"] = r.notes;
  j["caution"] = kCaution;
  return j;
}

std::string sweep_csv(const SweepResult& r) {
  std::string out = csv_field(to_string(r.parameter) + (is_duration(r.parameter) ? "_h" : "")) +
                    ",pfd_avg,pfh,rrf,sil_probability,sil_achieved,meets_target\r\n";
  for (const auto& p : r.points) {
    const SifResult& s = p.result;
    out += csv_number(p.value) + "," + csv_number(s.pfd_avg) + "," + csv_number(s.pfh_per_hour) + "," +
           csv_number(s.rrf) + "," + std::to_string(s.sil_probability) + "," + std::to_string(s.sil_achieved) + "," +
           (s.meets_target ? (*s.meets_target ? "true" : "false") : "") + "\r\n";
  }
  return out;
}

json compare_json(const CompareResult& r) {
  json j;
  j["format"] = "sifter-compare/1";
  j["sif"] = r.sif;
  j["subsystem"] = r.subsystem;
  j["demand_mode"] = to_string(r.mode);
  j["rows"] = json::array();
  for (const auto& row : r.rows) {
    const SifResult& s = row.result;
    const SubsystemResult& sub = s.subsystems.at(r.subsystem_index);
    json x = point_json(0.0, s);
    x.erase("value");
    x["vote"] = row.vote;
    x["current"] = row.current;
    x["subsystem_pfd_avg"] = opt(sub.pfd_avg, "pfd_avg");
    x["subsystem_pfh"] = opt(sub.pfh_per_hour, "pfh");
    x["hft"] = sub.hft ? json(*sub.hft) : json(nullptr);
    x["subsystem_sil_architecture"] = sub.sil_architecture;
    x["sil_architecture"] = s.sil_architecture;
    x["subsystem_spurious_trip_rate_per_yr"] = checked(sub.spurious_trip_rate_per_yr, "spurious");
    x["spurious_trip_rate_per_yr"] = checked(s.spurious_trip_rate_per_yr, "spurious");
    x["mttf_spurious_yr"] = opt(s.mttf_spurious_yr, "mttf");
    x["channels"] = sub.channels;
    j["rows"].push_back(std::move(x));
  }
  j["notes"] = r.notes;
  j["caution"] = kCaution;
  return j;
}

json sensitivity_json(const SensitivityResult& r) {
  json j;
  j["format"] = "sifter-sensitivity/1";
  j["sif"] = r.sif;
  j["demand_mode"] = to_string(r.mode);
  j["measure"] = measure_key(r.mode);
  j["factor"] = checked(r.factor, "factor");
  j["base"] = checked(r.base, "base");
  j["requirement"] = r.requirement ? requirement_json(*r.requirement) : json(nullptr);
  j["inputs"] = json::array();
  for (const auto& in : r.inputs)
    j["inputs"].push_back({{"input", in.name},
                           {"pointer", in.pointer},
                           {"unit", in.unit},
                           {"base_value", checked(in.base_value, "base value")},
                           {"low_value", checked(in.low_value, "low value")},
                           {"high_value", checked(in.high_value, "high value")},
                           {"at_low", checked(in.at_low, "at low")},
                           {"at_high", checked(in.at_high, "at high")},
                           {"swing", checked(in.swing, "swing")},
                           {"clamped", in.clamped}});
  j["notes"] = r.notes;
  j["caution"] = kCaution;
  return j;
}

}  // namespace sifter::report
