// Revision comparison of the inputs: components, subsystems, SIFs, causes, layers, scenarios
// and the project's own settings, field by field.
#include "analysis/diff_parts.hpp"

namespace sifter::detail {
namespace {

std::string channels_text(const Subsystem& s) {
  std::string out;
  for (const auto& ch : s.channels) {
    std::string series;
    for (const auto& id : ch.component_ids) series += (series.empty() ? "" : "+") + id;
    out += (out.empty() ? "" : ", ") + series;
  }
  return out;
}

std::string target_text(const std::optional<Target>& t) {
  if (!t) return "none";
  char buf[48];
  switch (t->kind) {
    case Target::Kind::kSil:
      std::snprintf(buf, sizeof buf, "SIL %g", t->value);
      break;
    case Target::Kind::kRrf:
      std::snprintf(buf, sizeof buf, "RRF %g", t->value);
      break;
    case Target::Kind::kPfdAvg:
      std::snprintf(buf, sizeof buf, "PFDavg %g", t->value);
      break;
    case Target::Kind::kPfh:
      std::snprintf(buf, sizeof buf, "PFH %g/h", t->value);
      break;
  }
  return buf;
}

void compare_subsystem(Changes& c, const Subsystem& a, const Subsystem& b) {
  const std::string p = b.pointer;
  const std::string of = " of '" + b.name + "'";
  c.text(p + "/role", "role" + of, to_string(a.role), to_string(b.role));
  c.text(p + "/vote", "vote" + of, a.is_vendor() ? "vendor" : a.vote.text(), b.is_vendor() ? "vendor" : b.vote.text());
  c.text(p + "/channels", "channels" + of, channels_text(a), channels_text(b));
  c.number(p + "/beta", "beta" + of, "", a.beta, b.beta);
  c.number(p + "/beta_d", "beta_D" + of, "", a.beta_d, b.beta_d);
  auto scaling = [](const Subsystem& s) { return s.ccf_scaling == CcfScaling::kNone ? "none" : "iec61508-6-d5"; };
  c.text(p + "/ccf_scaling", "beta scaling" + of, scaling(a), scaling(b));
  c.number(p + "/proof_test_interval", "proof-test interval" + of, "h", a.proof_test_interval.hours,
           b.proof_test_interval.hours);
  c.number(p + "/mttr", "MTTR" + of, "h", a.mttr.hours, b.mttr.hours);
  c.number(p + "/mrt", "MRT" + of, "h", a.mrt.hours, b.mrt.hours);
  c.number(p + "/proof_test_coverage", "proof-test coverage" + of, "", a.proof_test_coverage, b.proof_test_coverage);
  auto pst_interval = [](const Subsystem& s) {
    return s.partial_stroke ? std::optional(number_value(s.partial_stroke->interval.hours)) : std::nullopt;
  };
  auto pst_coverage = [](const Subsystem& s) {
    return s.partial_stroke ? std::optional(number_value(s.partial_stroke->coverage)) : std::nullopt;
  };
  c.compare(p + "/partial_stroke/interval", "partial stroke interval" + of, "h", pst_interval(a), pst_interval(b));
  c.compare(p + "/partial_stroke/coverage", "partial stroke coverage" + of, "", pst_coverage(a), pst_coverage(b));
  c.text(p + "/trip_on_detected", "trip on detected failures" + of, yes_no(a.trip_on_detected),
         yes_no(b.trip_on_detected));
  c.compare(p + "/pfd_avg", "PFDavg from the safety manual" + of, "", optional_number(a.vendor_pfd_avg),
            optional_number(b.vendor_pfd_avg));
  auto pfh = [](const Subsystem& s) {
    return s.vendor_pfh ? std::optional(number_value(s.vendor_pfh->per_hour)) : std::nullopt;
  };
  c.compare(p + "/pfh", "PFH from the safety manual" + of, "/h", pfh(a), pfh(b));
  auto int_value = [](const std::optional<int>& v) { return v ? std::optional(number_value(*v)) : std::nullopt; };
  c.compare(p + "/hft", "declared HFT" + of, "", int_value(a.hft_declared), int_value(b.hft_declared));
  c.compare(p + "/systematic_capability", "declared SC" + of, "", int_value(a.sc_declared), int_value(b.sc_declared));
  c.compare(p + "/sil_capability", "SIL capability" + of, "", int_value(a.sil_capability), int_value(b.sil_capability));
  c.text(p + "/diverse", "diverse" + of, yes_no(a.diverse), yes_no(b.diverse));
}

void compare_cause(Changes& c, const Cause& a, const Cause& b) {
  const std::string of = " of cause " + b.id;
  c.text(b.pointer + "/title", "title" + of, a.title, b.title);
  c.number(b.pointer + "/frequency", "frequency" + of, "/yr", a.frequency.per_year(), b.frequency.per_year());
  std::string da, db;
  for (const auto& d : a.devices) da += (da.empty() ? "" : ", ") + d;
  for (const auto& d : b.devices) db += (db.empty() ? "" : ", ") + d;
  c.text(b.pointer + "/devices", "devices" + of, da, db);
  const std::size_t n = std::max(a.enabling.size(), b.enabling.size());
  for (std::size_t i = 0; i < n; ++i) {
    auto pa = i < a.enabling.size() ? std::optional(number_value(a.enabling[i].probability)) : std::nullopt;
    auto pb = i < b.enabling.size() ? std::optional(number_value(b.enabling[i].probability)) : std::nullopt;
    c.compare(b.pointer + "/enabling/" + std::to_string(i) + "/probability",
              "enabling condition " + std::to_string(i + 1) + of, "", pa, pb);
  }
}

std::string layer_key(const Layer& l) { return l.sif.empty() ? l.id : "sif:" + l.sif; }

void compare_layer(Changes& c, const Layer& a, const Layer& b) {
  const std::string of = " of layer " + (b.sif.empty() ? b.id : b.sif);
  c.text(b.pointer + "/kind", "kind" + of, to_string(a.kind), to_string(b.kind));
  if (b.sif.empty()) c.number(b.pointer + "/pfd", "PFD" + of, "", a.pfd, b.pfd);
  std::string da, db;
  for (const auto& d : a.devices) da += (da.empty() ? "" : ", ") + d;
  for (const auto& d : b.devices) db += (db.empty() ? "" : ", ") + d;
  c.text(b.pointer + "/devices", "devices" + of, da, db);
  auto time = [](const std::optional<Duration>& d) { return d ? std::optional(number_value(d->hours)) : std::nullopt; };
  c.compare(b.pointer + "/response_time", "response time" + of, "h", time(a.response_time), time(b.response_time));
  c.compare(b.pointer + "/time_available", "time available" + of, "h", time(a.time_available), time(b.time_available));
}

}  // namespace

void compare_component(Changes& c, const Component& a, const Component& b) {
  const std::string p = b.pointer;
  const std::string of = " of " + b.id;
  c.number(p + "/lambda_du", "lambda_du" + of, "/h", a.rates.lambda_du.per_hour, b.rates.lambda_du.per_hour);
  c.number(p + "/lambda_dd", "lambda_dd" + of, "/h", a.rates.lambda_dd.per_hour, b.rates.lambda_dd.per_hour);
  c.number(p + "/lambda_su", "lambda_su" + of, "/h", a.rates.lambda_su.per_hour, b.rates.lambda_su.per_hour);
  c.number(p + "/lambda_sd", "lambda_sd" + of, "/h", a.rates.lambda_sd.per_hour, b.rates.lambda_sd.per_hour);
  auto type = [](const Component& x) { return x.element_type ? (*x.element_type == ElementType::kA ? "A" : "B") : ""; };
  c.text(p + "/element_type", "element type" + of, type(a), type(b));
  auto sc = [](const Component& x) {
    return x.systematic_capability ? std::optional(number_value(*x.systematic_capability)) : std::nullopt;
  };
  c.compare(p + "/systematic_capability", "systematic capability" + of, "", sc(a), sc(b));
  c.compare(p + "/sff", "declared SFF" + of, "", optional_number(a.sff_declared), optional_number(b.sff_declared));
  c.compare(p + "/data_confidence", "data confidence" + of, "", optional_number(a.data_confidence),
            optional_number(b.data_confidence));
  c.text(p + "/model", "library model" + of, a.model, b.model);
  c.text(p + "/data_source", "data source" + of, a.data_source_line(), b.data_source_line());
}

void compare_sif_inputs(Changes& c, const Sif& a, const Sif& b) {
  c.text(b.pointer + "/title", "title", a.title, b.title);
  auto mode = [](const Sif& s) { return s.demand_mode_stated ? to_string(*s.demand_mode_stated) : "not stated"; };
  c.text(b.pointer + "/demand_mode", "stated demand mode", mode(a), mode(b));
  c.text(b.pointer + "/target", "target", target_text(a.target), target_text(b.target));
  auto basis = [](const Sif& s) { return s.constraints ? to_string(*s.constraints) : "project's"; };
  c.text(b.pointer + "/constraints", "constraints basis", basis(a), basis(b));
  pair_up<Subsystem>(
      a.subsystems, b.subsystems, [](const Subsystem& s) { return s.name; },
      [&](const Subsystem& x, const Subsystem& y) { compare_subsystem(c, x, y); },
      [&](const Subsystem& x) {
        c.removed(x.pointer, "subsystem '" + x.name + "'", x.is_vendor() ? "vendor" : x.vote.text());
      },
      [&](const Subsystem& y) {
        c.added(y.pointer, "subsystem '" + y.name + "'", y.is_vendor() ? "vendor" : y.vote.text());
      });
}

std::set<std::string> component_ids_of(const Sif& sif) {
  std::set<std::string> out;
  for (const auto& sub : sif.subsystems)
    for (const auto& ch : sub.channels)
      for (const auto& id : ch.component_ids) out.insert(id);
  return out;
}

void compare_scenario_inputs(Changes& c, const Scenario& a, const Scenario& b) {
  c.text(b.pointer + "/title", "title", a.title, b.title);
  auto consequences = [](const Scenario& s) {
    std::string out;
    for (const auto& q : s.consequences) out += (out.empty() ? "" : ", ") + q.category + " " + q.severity;
    return out;
  };
  c.text(b.pointer + "/consequences", "consequences", consequences(a), consequences(b));
  auto target = [](const Scenario& s) {
    return s.target_frequency ? std::optional(number_value(s.target_frequency->per_year())) : std::nullopt;
  };
  c.compare(b.pointer + "/target_frequency", "target frequency", "/yr", target(a), target(b));
  pair_up<Cause>(
      a.causes, b.causes, [](const Cause& x) { return x.id; },
      [&](const Cause& x, const Cause& y) { compare_cause(c, x, y); },
      [&](const Cause& x) { c.removed(x.pointer, "cause " + x.id, x.title); },
      [&](const Cause& y) { c.added(y.pointer, "cause " + y.id, y.title); });
  pair_up<Layer>(
      a.layers, b.layers, layer_key, [&](const Layer& x, const Layer& y) { compare_layer(c, x, y); },
      [&](const Layer& x) { c.removed(x.pointer, "layer " + layer_key(x), x.title); },
      [&](const Layer& y) { c.added(y.pointer, "layer " + layer_key(y), y.title); });
  pair_up<Modifier>(
      a.modifiers, b.modifiers, [](const Modifier& m) { return m.title; },
      [&](const Modifier& x, const Modifier& y) {
        c.number(y.pointer + "/probability", "probability of modifier '" + y.title + "'", "", x.probability,
                 y.probability);
      },
      [&](const Modifier& x) { c.removed(x.pointer, "modifier '" + x.title + "'", x.title); },
      [&](const Modifier& y) { c.added(y.pointer, "modifier '" + y.title + "'", y.title); });
}

void compare_project_inputs(Changes& c, const Project& a, const Project& b) {
  c.number("/defaults/mission_time", "mission time", "h", a.defaults.mission_time.hours, b.defaults.mission_time.hours);
  auto duration = [](const std::optional<Duration>& d) {
    return d ? std::optional(number_value(d->hours)) : std::nullopt;
  };
  c.compare("/defaults/proof_test_interval", "default proof-test interval", "h",
            duration(a.defaults.proof_test_interval), duration(b.defaults.proof_test_interval));
  c.compare("/defaults/mttr", "default MTTR", "h", duration(a.defaults.mttr), duration(b.defaults.mttr));
  c.compare("/defaults/mrt", "default MRT", "h", duration(a.defaults.mrt), duration(b.defaults.mrt));
  auto basis = [](const Project& p) { return p.constraints ? to_string(*p.constraints) : "iec61511 (default)"; };
  c.text("/constraints", "constraints basis", basis(a), basis(b));
  c.number("/operator_time_multiple", "operator time multiple", "", a.operator_time_multiple, b.operator_time_multiple);
  std::set<std::string> keys;
  for (const auto* p : {&a, &b})
    for (const auto& [category, levels] : p->risk_criteria)
      for (const auto& [severity, rate] : levels) keys.insert(category + "/" + severity);
  for (const auto& key : keys) {
    auto value = [&](const Project& p) -> std::optional<DiffValue> {
      const auto slash = key.find('/');
      auto cat = p.risk_criteria.find(key.substr(0, slash));
      if (cat == p.risk_criteria.end()) return std::nullopt;
      auto sev = cat->second.find(key.substr(slash + 1));
      return sev == cat->second.end() ? std::nullopt : std::optional(number_value(sev->second.per_year()));
    };
    c.compare("/risk_criteria/" + key, "tolerable frequency " + key, "/yr", value(a), value(b));
  }
}

}  // namespace sifter::detail
