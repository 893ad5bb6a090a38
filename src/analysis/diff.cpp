// Revision comparison on the resolved model: inputs and results, SIF by SIF, scenario by scenario.
#include "sifter/analysis/diff.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <functional>
#include <map>
#include <set>

namespace sifter {
namespace {

bool same_number(double a, double b) {
  if (a == b) return true;
  return std::fabs(a - b) <= kDiffRelTol * std::max(std::fabs(a), std::fabs(b));
}

DiffValue num(double v) { return {v, {}}; }
DiffValue txt(std::string s) { return {std::nullopt, std::move(s)}; }

std::optional<DiffValue> opt_num(const std::optional<double>& v) { return v ? std::optional(num(*v)) : std::nullopt; }

bool same_value(const std::optional<DiffValue>& a, const std::optional<DiffValue>& b) {
  if (!a || !b) return !a && !b;
  if (a->number && b->number) return same_number(*a->number, *b->number);
  return !a->number && !b->number && a->text == b->text;
}

// Collects the differences of one item's fields, all under the same owner.
class Changes {
 public:
  explicit Changes(std::vector<InputChange>& out) : out_(out) {}
  void compare(const std::string& pointer, const std::string& what, const std::string& unit,
               const std::optional<DiffValue>& a, const std::optional<DiffValue>& b) {
    if (!same_value(a, b)) out_.push_back({pointer, what, unit, a, b});
  }
  void number(const std::string& pointer, const std::string& what, const std::string& unit, double a, double b) {
    compare(pointer, what, unit, num(a), num(b));
  }
  void text(const std::string& pointer, const std::string& what, const std::string& a, const std::string& b) {
    compare(pointer, what, "", txt(a), txt(b));
  }
  void added(const std::string& pointer, const std::string& what, const std::string& text) {
    out_.push_back({pointer, what, "", std::nullopt, txt(text)});
  }
  void removed(const std::string& pointer, const std::string& what, const std::string& text) {
    out_.push_back({pointer, what, "", txt(text), std::nullopt});
  }

 private:
  std::vector<InputChange>& out_;
};

std::string yes_no(bool b) { return b ? "true" : "false"; }

template <typename T, typename Key>
const T* find_by(const std::vector<T>& items, const std::string& key, Key key_of) {
  for (const auto& item : items)
    if (key_of(item) == key) return &item;
  return nullptr;
}

// Pairs items of two revisions by key: calls both(old, new), only_old(old), only_new(new).
template <typename T, typename Key>
void pair_up(const std::vector<T>& olds, const std::vector<T>& news, Key key_of,
             const std::function<void(const T&, const T&)>& both, const std::function<void(const T&)>& only_old,
             const std::function<void(const T&)>& only_new) {
  for (const auto& n : news) {
    if (const T* o = find_by(olds, key_of(n), key_of))
      both(*o, n);
    else
      only_new(n);
  }
  for (const auto& o : olds)
    if (!find_by(news, key_of(o), key_of)) only_old(o);
}

// ---- Inputs --------------------------------------------------------------------------------

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
    return x.systematic_capability ? std::optional(num(*x.systematic_capability)) : std::nullopt;
  };
  c.compare(p + "/systematic_capability", "systematic capability" + of, "", sc(a), sc(b));
  c.compare(p + "/sff", "declared SFF" + of, "", opt_num(a.sff_declared), opt_num(b.sff_declared));
  c.compare(p + "/data_confidence", "data confidence" + of, "", opt_num(a.data_confidence), opt_num(b.data_confidence));
  c.text(p + "/model", "library model" + of, a.model, b.model);
  c.text(p + "/data_source", "data source" + of, a.data_source, b.data_source);
}

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
    return s.partial_stroke ? std::optional(num(s.partial_stroke->interval.hours)) : std::nullopt;
  };
  auto pst_coverage = [](const Subsystem& s) {
    return s.partial_stroke ? std::optional(num(s.partial_stroke->coverage)) : std::nullopt;
  };
  c.compare(p + "/partial_stroke/interval", "partial stroke interval" + of, "h", pst_interval(a), pst_interval(b));
  c.compare(p + "/partial_stroke/coverage", "partial stroke coverage" + of, "", pst_coverage(a), pst_coverage(b));
  c.text(p + "/trip_on_detected", "trip on detected failures" + of, yes_no(a.trip_on_detected),
         yes_no(b.trip_on_detected));
  c.compare(p + "/pfd_avg", "PFDavg from the safety manual" + of, "", opt_num(a.vendor_pfd_avg),
            opt_num(b.vendor_pfd_avg));
  auto pfh = [](const Subsystem& s) {
    return s.vendor_pfh ? std::optional(num(s.vendor_pfh->per_hour)) : std::nullopt;
  };
  c.compare(p + "/pfh", "PFH from the safety manual" + of, "/h", pfh(a), pfh(b));
  auto int_value = [](const std::optional<int>& v) { return v ? std::optional(num(*v)) : std::nullopt; };
  c.compare(p + "/hft", "declared HFT" + of, "", int_value(a.hft_declared), int_value(b.hft_declared));
  c.compare(p + "/systematic_capability", "declared SC" + of, "", int_value(a.sc_declared), int_value(b.sc_declared));
  c.compare(p + "/sil_capability", "SIL capability" + of, "", int_value(a.sil_capability), int_value(b.sil_capability));
  c.text(p + "/diverse", "diverse" + of, yes_no(a.diverse), yes_no(b.diverse));
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
    auto pa = i < a.enabling.size() ? std::optional(num(a.enabling[i].probability)) : std::nullopt;
    auto pb = i < b.enabling.size() ? std::optional(num(b.enabling[i].probability)) : std::nullopt;
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
  auto time = [](const std::optional<Duration>& d) { return d ? std::optional(num(d->hours)) : std::nullopt; };
  c.compare(b.pointer + "/response_time", "response time" + of, "h", time(a.response_time), time(b.response_time));
  c.compare(b.pointer + "/time_available", "time available" + of, "h", time(a.time_available), time(b.time_available));
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
    return s.target_frequency ? std::optional(num(s.target_frequency->per_year())) : std::nullopt;
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
  auto duration = [](const std::optional<Duration>& d) { return d ? std::optional(num(d->hours)) : std::nullopt; };
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
      return sev == cat->second.end() ? std::nullopt : std::optional(num(sev->second.per_year()));
    };
    c.compare("/risk_criteria/" + key, "tolerable frequency " + key, "/yr", value(a), value(b));
  }
}

// ---- Results -------------------------------------------------------------------------------

void result_change(std::vector<ResultChange>& out, const std::string& key, const std::optional<DiffValue>& a,
                   const std::optional<DiffValue>& b, const std::string& unit = "") {
  if (!same_value(a, b)) out.push_back({key, a, b, unit});
}

std::optional<DiffValue> verdict_value(const std::optional<bool>& v) {
  return v ? std::optional(txt(*v ? "true" : "false")) : std::optional(txt("not judged"));
}

std::vector<ResultChange> sif_results(const SifResult& a, const SifResult& b) {
  std::vector<ResultChange> out;
  auto int_value = [](const std::optional<int>& v) { return v ? std::optional(num(*v)) : std::nullopt; };
  result_change(out, "demand_mode", txt(to_string(a.demand_mode)), txt(to_string(b.demand_mode)));
  result_change(out, "sil_required", int_value(a.sil_required), int_value(b.sil_required));
  result_change(out, "required_rrf", opt_num(a.required_rrf), opt_num(b.required_rrf));
  result_change(out, "required_pfh", opt_num(a.required_pfh_per_hour), opt_num(b.required_pfh_per_hour), "/h");
  result_change(out, "pfd_avg", opt_num(a.pfd_avg), opt_num(b.pfd_avg));
  result_change(out, "pfh", opt_num(a.pfh_per_hour), opt_num(b.pfh_per_hour), "/h");
  result_change(out, "sil_probability", num(a.sil_probability), num(b.sil_probability));
  result_change(out, "sil_architecture", num(a.sil_architecture), num(b.sil_architecture));
  result_change(out, "sil_systematic", num(a.sil_systematic), num(b.sil_systematic));
  result_change(out, "sil_achieved", num(a.sil_achieved), num(b.sil_achieved));
  result_change(out, "meets_target", verdict_value(a.meets_target), verdict_value(b.meets_target));
  return out;
}

std::vector<ResultChange> scenario_results(const ScenarioResult& a, const ScenarioResult& b) {
  std::vector<ResultChange> out;
  auto mode = [](const ScenarioResult& s) { return s.demand_mode ? txt(to_string(*s.demand_mode)) : txt("none"); };
  result_change(out, "frequency_without_sif_per_yr", num(a.frequency_without_sif_per_yr),
                num(b.frequency_without_sif_per_yr), "/yr");
  result_change(out, "required_rrf", num(a.required_rrf), num(b.required_rrf));
  result_change(out, "required_sil", num(a.required_sil), num(b.required_sil));
  result_change(out, "demand_rate_per_yr", opt_num(a.demand_rate_per_yr), opt_num(b.demand_rate_per_yr), "/yr");
  result_change(out, "demand_mode", mode(a), mode(b));
  result_change(out, "mitigated_frequency_per_yr", opt_num(a.mitigated_frequency_per_yr),
                opt_num(b.mitigated_frequency_per_yr), "/yr");
  result_change(out, "meets_target", verdict_value(a.meets_target), verdict_value(b.meets_target));
  return out;
}

VerdictChange verdict_change(const std::optional<bool>& before, const std::optional<bool>& after, bool existed_before) {
  if (after == std::optional(false) && (!existed_before || before != std::optional(false)))
    return VerdictChange::kWorsened;
  if (!existed_before) return VerdictChange::kNone;
  if (before == after) return VerdictChange::kNone;
  if (before == std::optional(false) && after == std::optional(true)) return VerdictChange::kImproved;
  return VerdictChange::kOther;
}

// Verdict changes first (worsened, improved, other), then other changes, then the rest; stable.
void order(std::vector<FunctionDiff>& items) {
  auto rank = [](const FunctionDiff& d) {
    switch (d.verdict) {
      case VerdictChange::kWorsened:
        return 0;
      case VerdictChange::kImproved:
        return 1;
      case VerdictChange::kOther:
        return 2;
      case VerdictChange::kNone:
        break;
    }
    return d.changed() ? 3 : 4;
  };
  std::stable_sort(items.begin(), items.end(), [&](const auto& x, const auto& y) { return rank(x) < rank(y); });
}

template <typename T>
const T* result_of(const std::vector<T>& results, const std::string& id) {
  for (const auto& r : results)
    if (r.id == id) return &r;
  return nullptr;
}

// Component changes, by id; each is listed under every SIF that uses it (in either revision).
struct ComponentChanges {
  std::vector<InputChange> changes;
  std::map<std::string, std::pair<std::size_t, std::size_t>> span;  // id -> [begin, end) in changes
};

ComponentChanges collect_component_changes(const Project& old_project, const Project& new_project) {
  ComponentChanges out;
  Changes cc(out.changes);
  auto mark = [&](const std::string& id, const std::function<void()>& body) {
    const std::size_t begin = out.changes.size();
    body();
    out.span[id] = {begin, out.changes.size()};
  };
  pair_up<Component>(
      old_project.components, new_project.components, [](const Component& c) { return c.id; },
      [&](const Component& a, const Component& b) { mark(b.id, [&] { compare_component(cc, a, b); }); },
      [&](const Component& a) { mark(a.id, [&] { cc.removed(a.pointer, "component " + a.id, a.id); }); },
      [&](const Component& b) { mark(b.id, [&] { cc.added(b.pointer, "component " + b.id, b.id); }); });
  return out;
}

// One scenario's entry; a is null when it was added, b when it was removed.
FunctionDiff scenario_diff(const Scenario* a, const Scenario* b, const ProjectResult& old_result,
                           const ProjectResult& new_result) {
  FunctionDiff d;
  d.id = b ? b->id : a->id;
  d.presence = a && b ? Presence::kBoth : b ? Presence::kAdded : Presence::kRemoved;
  Changes c(d.inputs);
  if (a && b) compare_scenario_inputs(c, *a, *b);
  const ScenarioResult* ra = a ? result_of(old_result.scenarios, a->id) : nullptr;
  const ScenarioResult* rb = b ? result_of(new_result.scenarios, b->id) : nullptr;
  if (ra) d.old_verdict = ra->meets_target;
  if (rb) d.new_verdict = rb->meets_target;
  if (ra && rb) d.results = scenario_results(*ra, *rb);
  d.verdict = verdict_change(d.old_verdict, d.new_verdict, a != nullptr);
  if (!b) d.verdict = VerdictChange::kNone;
  return d;
}

// Scenarios first: a SIF's entry names the changed scenarios that feed it. Returns the changed ones.
std::set<std::string> diff_scenarios(const Project& old_project, const ProjectResult& old_result,
                                     const Project& new_project, const ProjectResult& new_result,
                                     std::vector<FunctionDiff>& out) {
  std::set<std::string> changed_scenarios;
  auto add = [&](const Scenario* a, const Scenario* b) {
    FunctionDiff d = scenario_diff(a, b, old_result, new_result);
    if (!d.inputs.empty() || d.presence != Presence::kBoth) changed_scenarios.insert(d.id);
    out.push_back(std::move(d));
  };
  pair_up<Scenario>(
      old_project.scenarios, new_project.scenarios, [](const Scenario& s) { return s.id; },
      [&](const Scenario& a, const Scenario& b) { add(&a, &b); }, [&](const Scenario& a) { add(&a, nullptr); },
      [&](const Scenario& b) { add(nullptr, &b); });
  return changed_scenarios;
}

// Appends the changes of every component either revision of the SIF uses; notes those ids as used.
void add_component_changes(FunctionDiff& d, const Sif& a, const Sif& b, const ComponentChanges& components,
                           std::set<std::string>& used) {
  std::set<std::string> ids = component_ids_of(a);
  for (const auto& id : component_ids_of(b)) ids.insert(id);
  for (const auto& id : ids) {
    used.insert(id);
    if (auto it = components.span.find(id); it != components.span.end())
      for (std::size_t i = it->second.first; i < it->second.second; ++i) d.inputs.push_back(components.changes[i]);
  }
}

// What the SIF diff needs besides the two revisions of the SIF.
struct SifDiffContext {
  const ProjectResult& old_result;
  const ProjectResult& new_result;
  const ComponentChanges& components;
  const std::set<std::string>& changed_scenarios;
  std::set<std::string>& used;  // component ids some SIF uses
};

// One SIF's entry; a is null when it was added, b when it was removed.
FunctionDiff sif_diff(const Sif* a, const Sif* b, const SifDiffContext& ctx) {
  FunctionDiff d;
  d.id = b ? b->id : a->id;
  d.presence = a && b ? Presence::kBoth : b ? Presence::kAdded : Presence::kRemoved;
  Changes c(d.inputs);
  if (a && b) {
    compare_sif_inputs(c, *a, *b);
    add_component_changes(d, *a, *b, ctx.components, ctx.used);
  }
  const SifResult* ra = a ? result_of(ctx.old_result.sifs, a->id) : nullptr;
  const SifResult* rb = b ? result_of(ctx.new_result.sifs, b->id) : nullptr;
  if (ra) d.old_verdict = ra->meets_target;
  if (rb) d.new_verdict = rb->meets_target;
  if (ra && rb) d.results = sif_results(*ra, *rb);
  d.verdict = b ? verdict_change(d.old_verdict, d.new_verdict, a != nullptr) : VerdictChange::kNone;
  std::set<std::string> feeding;
  if (ra) feeding.insert(ra->scenarios.begin(), ra->scenarios.end());
  if (rb) feeding.insert(rb->scenarios.begin(), rb->scenarios.end());
  for (const auto& s : feeding)
    if (ctx.changed_scenarios.count(s)) d.related.push_back(s);
  return d;
}

}  // namespace

std::string to_string(VerdictChange change) {
  switch (change) {
    case VerdictChange::kNone:
      return "none";
    case VerdictChange::kWorsened:
      return "worsened";
    case VerdictChange::kImproved:
      return "improved";
    case VerdictChange::kOther:
      return "changed";
  }
  return {};
}

std::string to_string(Presence presence) {
  switch (presence) {
    case Presence::kBoth:
      return "both";
    case Presence::kAdded:
      return "added";
    case Presence::kRemoved:
      return "removed";
  }
  return {};
}

bool ProjectDiff::any_worsened() const {
  auto worse = [](const FunctionDiff& d) { return d.verdict == VerdictChange::kWorsened; };
  return std::any_of(sifs.begin(), sifs.end(), worse) || std::any_of(scenarios.begin(), scenarios.end(), worse);
}

ProjectDiff diff_projects(const Project& old_project, const ProjectResult& old_result, const Project& new_project,
                          const ProjectResult& new_result) {
  ProjectDiff out;
  out.old_file = old_project.file;
  out.new_file = new_project.file;
  Changes project_changes(out.project_inputs);
  compare_project_inputs(project_changes, old_project, new_project);

  const ComponentChanges components = collect_component_changes(old_project, new_project);
  std::set<std::string> used;
  const std::set<std::string> changed_scenarios =
      diff_scenarios(old_project, old_result, new_project, new_result, out.scenarios);

  const SifDiffContext ctx{old_result, new_result, components, changed_scenarios, used};
  auto add = [&](const Sif* a, const Sif* b) { out.sifs.push_back(sif_diff(a, b, ctx)); };
  pair_up<Sif>(
      old_project.sifs, new_project.sifs, [](const Sif& s) { return s.id; },
      [&](const Sif& a, const Sif& b) { add(&a, &b); }, [&](const Sif& a) { add(&a, nullptr); },
      [&](const Sif& b) { add(nullptr, &b); });

  // Components no SIF uses still changed an input of the project.
  for (const auto& [id, span] : components.span)
    if (!used.count(id))
      for (std::size_t i = span.first; i < span.second; ++i) out.project_inputs.push_back(components.changes[i]);
  order(out.sifs);
  order(out.scenarios);
  out.equipment = diff_equipment(old_result, new_result);
  return out;
}

}  // namespace sifter
