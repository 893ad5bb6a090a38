// Data maturity: a verdict resting on an estimate is preliminary, and says which estimate.
#include "sifter/analysis/maturity.hpp"

#include <algorithm>
#include <map>
#include <string_view>
#include <unordered_map>

namespace sifter {
namespace {

void add_once(std::vector<std::string>& list, const std::string& text) {
  if (std::find(list.begin(), list.end(), text) == list.end()) list.push_back(text);
}

std::string joined(const std::vector<std::string>& items) {
  std::string out;
  for (const auto& i : items) out += (out.empty() ? "" : "; ") + i;
  return out;
}

}  // namespace

std::vector<std::string> scenario_estimates(const Scenario& scenario) {
  std::vector<std::string> out = scenario.estimates;
  for (const auto& c : scenario.causes)
    if (c.status == DataStatus::kEstimate) add_once(out, "frequency of cause " + c.id + " (status estimate)");
  return out;
}

namespace {

// Scenario results by id, so that a register of thousands of SIFs and scenarios is marked in
// time proportional to its size.
using ScenarioIndex = std::unordered_map<std::string_view, std::vector<const ScenarioResult*>>;

ScenarioIndex index_by_id(const std::vector<ScenarioResult>& scenarios) {
  ScenarioIndex index;
  index.reserve(scenarios.size());
  for (const auto& s : scenarios) index[s.id].push_back(&s);
  return index;
}

std::vector<std::string> sif_estimates(const Project& project, const Sif& sif, const SifResult& result,
                                       const ScenarioIndex& scenarios) {
  std::vector<std::string> out;
  for (const auto& sub : sif.subsystems)
    for (const auto& ch : sub.channels)
      for (std::size_t c : ch.components)
        if (c < project.components.size() && project.components[c].status == DataStatus::kEstimate)
          add_once(out, "data of component " + project.components[c].id + " (status estimate)");
  for (const auto& id : result.scenarios) {
    auto found = scenarios.find(id);
    if (found == scenarios.end()) continue;
    for (const ScenarioResult* s : found->second)
      if (s->preliminary) add_once(out, "requirement from scenario " + id + ": " + joined(s->preliminary_because));
  }
  return out;
}

}  // namespace

std::vector<std::string> sif_estimates(const Project& project, const Sif& sif, const SifResult& result,
                                       const std::vector<ScenarioResult>& scenarios) {
  return sif_estimates(project, sif, result, index_by_id(scenarios));
}

void mark_preliminary(const Project& project, ProjectResult& result) {
  std::map<std::string, const Scenario*> written;
  for (const auto& s : project.scenarios) written[s.id] = &s;
  for (auto& r : result.scenarios) {
    auto it = written.find(r.id);
    if (it == written.end()) continue;
    r.generated = it->second->generated;
    r.preliminary_because = scenario_estimates(*it->second);
    r.preliminary = !r.preliminary_because.empty();
  }
  const ScenarioIndex scenarios = index_by_id(result.scenarios);
  for (std::size_t i = 0; i < result.sifs.size() && i < project.sifs.size(); ++i) {
    auto& r = result.sifs[i];
    r.preliminary_because = sif_estimates(project, project.sifs[i], r, scenarios);
    r.preliminary = !r.preliminary_because.empty();
  }
}

std::vector<std::string> preliminary_verdicts(const ProjectResult& result) {
  std::vector<std::string> out;
  if (result.pressure)
    for (const auto& e : result.pressure->equipment)
      if (e.preliminary())
        out.push_back("equipment " + e.id + " (" + to_string(e.category) + "): " + joined(e.estimates));
  for (const auto& s : result.scenarios)
    if (s.preliminary) out.push_back("scenario " + s.id + ": " + joined(s.preliminary_because));
  for (const auto& s : result.sifs)
    if (s.preliminary) out.push_back("SIF " + s.id + ": " + joined(s.preliminary_because));
  return out;
}

}  // namespace sifter
