// Revision comparison on the resolved model: inputs and results, SIF by SIF, scenario by scenario.
#include "sifter/analysis/diff.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <functional>
#include <map>
#include <set>

#include "analysis/diff_parts.hpp"

namespace sifter {
namespace {

using detail::Changes;
using detail::compare_component;
using detail::compare_project_inputs;
using detail::compare_scenario_inputs;
using detail::compare_sif_inputs;
using detail::component_ids_of;
using detail::number_value;
using detail::optional_number;
using detail::pair_up;
using detail::same_value;
using detail::text_value;

// ---- Results -------------------------------------------------------------------------------

void result_change(std::vector<ResultChange>& out, const std::string& key, const std::optional<DiffValue>& a,
                   const std::optional<DiffValue>& b, const std::string& unit = "") {
  if (!same_value(a, b)) out.push_back({key, a, b, unit});
}

std::optional<DiffValue> verdict_value(const std::optional<bool>& v) {
  return v ? std::optional(text_value(*v ? "true" : "false")) : std::optional(text_value("not judged"));
}

std::vector<ResultChange> sif_results(const SifResult& a, const SifResult& b) {
  std::vector<ResultChange> out;
  auto int_value = [](const std::optional<int>& v) { return v ? std::optional(number_value(*v)) : std::nullopt; };
  result_change(out, "demand_mode", text_value(to_string(a.demand_mode)), text_value(to_string(b.demand_mode)));
  result_change(out, "sil_required", int_value(a.sil_required), int_value(b.sil_required));
  result_change(out, "required_rrf", optional_number(a.required_rrf), optional_number(b.required_rrf));
  result_change(out, "required_pfh", optional_number(a.required_pfh_per_hour), optional_number(b.required_pfh_per_hour),
                "/h");
  result_change(out, "pfd_avg", optional_number(a.pfd_avg), optional_number(b.pfd_avg));
  result_change(out, "pfh", optional_number(a.pfh_per_hour), optional_number(b.pfh_per_hour), "/h");
  result_change(out, "sil_probability", number_value(a.sil_probability), number_value(b.sil_probability));
  result_change(out, "sil_architecture", number_value(a.sil_architecture), number_value(b.sil_architecture));
  result_change(out, "sil_systematic", number_value(a.sil_systematic), number_value(b.sil_systematic));
  result_change(out, "sil_achieved", number_value(a.sil_achieved), number_value(b.sil_achieved));
  result_change(out, "meets_target", verdict_value(a.meets_target), verdict_value(b.meets_target));
  return out;
}

std::vector<ResultChange> scenario_results(const ScenarioResult& a, const ScenarioResult& b) {
  std::vector<ResultChange> out;
  auto mode = [](const ScenarioResult& s) {
    return s.demand_mode ? text_value(to_string(*s.demand_mode)) : text_value("none");
  };
  result_change(out, "frequency_without_sif_per_yr", number_value(a.frequency_without_sif_per_yr),
                number_value(b.frequency_without_sif_per_yr), "/yr");
  result_change(out, "required_rrf", number_value(a.required_rrf), number_value(b.required_rrf));
  result_change(out, "required_sil", number_value(a.required_sil), number_value(b.required_sil));
  result_change(out, "demand_rate_per_yr", optional_number(a.demand_rate_per_yr), optional_number(b.demand_rate_per_yr),
                "/yr");
  result_change(out, "demand_mode", mode(a), mode(b));
  result_change(out, "mitigated_frequency_per_yr", optional_number(a.mitigated_frequency_per_yr),
                optional_number(b.mitigated_frequency_per_yr), "/yr");
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
