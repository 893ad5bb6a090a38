// Alternatives to a scenario judged on modified projects by the same LOPA and verification.
#include "sifter/analysis/options.hpp"

#include <algorithm>
#include <cmath>

#include "sifter/engines/lopa.hpp"

namespace sifter {
namespace {

const EquipmentScreening* screened_item(const LoadedProject& loaded, const Scenario& s, const PressureSource** source) {
  if (!s.generated || !loaded.pressure || !loaded.project.pressure) return nullptr;
  for (const auto& e : loaded.pressure->equipment) {
    if (overpressure_scenario_id(e.id, e.source) != s.id) continue;
    for (const auto& src : loaded.project.pressure->sources)
      if (src.id == e.source) *source = &src;
    return &e;
  }
  return nullptr;
}

// The scenario with its SIF under assessment removed (layers naming a SIF), plus `extra`.
LoadedProject with_layers(const LoadedProject& loaded, std::size_t index, std::optional<Layer> extra) {
  LoadedProject copy = loaded;
  auto& layers = copy.project.scenarios[index].layers;
  layers.erase(std::remove_if(layers.begin(), layers.end(), [](const Layer& l) { return !l.sif.empty(); }),
               layers.end());
  if (extra) layers.push_back(*extra);
  return copy;
}

const ScenarioResult* find_result(const ProjectResult& r, const std::string& id) {
  for (const auto& s : r.scenarios)
    if (s.id == id) return &s;
  return nullptr;
}

// Tolerable without a SIF: every consequence's frequency at or below its target.
bool tolerable_without_sif(const ScenarioResult& r) {
  return std::all_of(r.consequences.begin(), r.consequences.end(), [](const ConsequenceResult& c) {
    return c.frequency_without_sif_per_yr <= c.target_frequency_per_yr * (1.0 + 1e-12);
  });
}

void judge_layer(const LoadedProject& loaded, std::size_t index, const ScenarioOption& opt, LayerKind kind,
                 const VerifyOptions& vo, OptionResult& out) {
  Layer l;
  l.id = opt.id;
  l.title = opt.title;
  l.kind = kind;
  l.pfd = opt.pfd;
  l.pointer = opt.pointer;
  const LoadedProject modified = with_layers(loaded, index, l);
  const ProjectResult r = verify_project(modified, vo);
  const ScenarioResult* s = find_result(r, loaded.project.scenarios[index].id);
  if (!s) return;
  out.mitigated_frequency_per_yr = s->frequency_without_sif_per_yr;
  out.makes_tolerable = tolerable_without_sif(*s);
  if (!out.makes_tolerable)
    out.reason += std::string(out.reason.empty() ? "" : "; ") + "with PFD " + format_number(opt.pfd) +
                  " the frequency is " + format_number(s->frequency_without_sif_per_yr) + "/yr against a target of " +
                  format_number(s->target_frequency_per_yr) + "/yr";
}

void judge_sif(const LoadedProject& loaded, std::size_t index, const ScenarioOption& opt, const VerifyOptions& vo,
               OptionResult& out) {
  Layer l;
  l.id = opt.sif;
  l.sif = opt.sif;
  l.kind = LayerKind::kSif;
  l.pointer = opt.pointer;
  const LoadedProject modified = with_layers(loaded, index, l);
  const ProjectResult r = verify_project(modified, vo);
  const ScenarioResult* s = find_result(r, loaded.project.scenarios[index].id);
  const SifResult* sif = nullptr;
  for (const auto& x : r.sifs)
    if (x.id == opt.sif) sif = &x;
  if (!s || !sif) return;
  // The verdict `check` gives this SIF under this requirement: probability, architecture and
  // systematic capability (the logic solver's cap included), judged in one place (verify).
  out.feasible = sif->meets_target.value_or(false);
  out.makes_tolerable = out.feasible && s->meets_target.value_or(false);
  out.mitigated_frequency_per_yr = s->mitigated_frequency_per_yr;
  out.trips_per_yr = sif->spurious_trip_rate_per_yr;
  for (const auto& sub : loaded.project.sifs)
    if (sub.id == opt.sif)
      for (const auto& g : sub.subsystems)
        if (g.proof_test_interval.hours > 0.0) out.tests_per_yr += kHoursPerYear / g.proof_test_interval.hours;
  out.preliminary = sif->preliminary;
  out.preliminary_because = sif->preliminary_because;
  if (!out.feasible) {
    out.reason = opt.sif + " reaches SIL " + std::to_string(sif->sil_achieved) + " (probability " +
                 std::to_string(sif->sil_probability) + ", architecture " + std::to_string(sif->sil_architecture) +
                 ", systematic " + std::to_string(sif->sil_systematic) + ") against SIL " +
                 std::to_string(sif->sil_required.value_or(0)) + " required";
    for (const auto& limit : sif->limits) out.reason += "; " + limit.message;
  }
}

void judge_rerate(const ScenarioOption& opt, const EquipmentScreening* item, OptionResult& out) {
  if (!item) {
    out.reason = "a re-rate answers a generated overpressure scenario only";
    return;
  }
  const double mawp = opt.new_mawp->bar_gauge;
  // At or above the maximum credible pressure the category is "none": the scenario is gone.
  out.feasible = mawp >= item->max_pressure_barg;
  out.makes_tolerable = out.feasible;
  out.preliminary_because = item->estimates;
  out.preliminary = item->preliminary();
  if (out.feasible) {
    out.mitigated_frequency_per_yr = 0.0;
    out.reason = "new MAWP " + format_pressure(mawp) + " at or above the maximum credible pressure " +
                 format_pressure(item->max_pressure_barg) + ": the scenario no longer exists";
  } else {
    out.reason = "new MAWP " + format_pressure(mawp) + " is " + format_number(item->max_pressure_barg - mawp) +
                 " bar below the maximum credible pressure " + format_pressure(item->max_pressure_barg) +
                 ": the scenario remains";
  }
}

void judge_relief(const LoadedProject& loaded, const ScenarioOption& opt, const EquipmentScreening* item,
                  const PressureSource* pump, OptionResult& out) {
  if (!item || !pump) {
    out.reason = "a relief device is sized here for a generated overpressure scenario only";
    return;
  }
  const double set = opt.set_pressure->bar_gauge;
  const double accumulation = loaded.project.pressure->bands ? loaded.project.pressure->bands->accumulation : 0.10;
  const double relieving = set * (1.0 + accumulation);
  if (set > item->mawp_barg) {
    out.reason = "set pressure " + format_pressure(set) + " above the MAWP " + format_pressure(item->mawp_barg);
    return;
  }
  if (pump->kind != PressureSource::Kind::kCentrifugalPump || pump->curve.empty()) {
    out.reason = "no vendor curve of " + pump->id + " to read the relieving rate from";
    return;
  }
  const auto flow = relieving_flow_m3_per_hour(*pump, *item, relieving);
  if (!flow) {
    out.reason = "relieving at " + format_pressure(relieving) + " lies beyond the end of the curve of " + pump->id;
    return;
  }
  const double capacity = opt.receiver_capacity->m3_per_hour;
  out.feasible = *flow <= capacity;
  const std::string rate = "relieving at " + format_pressure(relieving) + " (set " + format_pressure(set) + " + " +
                           format_number(100.0 * accumulation) + " %) takes " + format_number(*flow) + " m3/h from " +
                           pump->id + " (its curve)";
  out.reason = out.feasible ? rate + ", within the " + format_number(capacity) + " m3/h " + opt.receiver + " takes"
                            : rate + ", more than the " + format_number(capacity) + " m3/h " + opt.receiver + " takes";
}

}  // namespace

double present_value_of_annuity(double annual, double rate, double years) {
  if (rate == 0.0) return annual * years;
  return annual * (1.0 - std::pow(1.0 + rate, -years)) / rate;
}

std::optional<double> relieving_flow_m3_per_hour(const PressureSource& pump, const EquipmentScreening& item,
                                                 double relieving_barg) {
  if (pump.curve.empty() || !pump.density_max) return std::nullopt;
  const double bar_per_metre = static_head_bar(*pump.density_max, Length{1.0});
  const double head_at_speed = (relieving_barg - pump.suction_max.bar_gauge - item.static_head_bar) / bar_per_metre;
  const double ratio = pump.speed_max_ratio;
  // Affinity laws: on the curve at rated speed the same point has head H / r^2 and flow Q / r.
  const auto q = curve_flow_m3_per_hour(pump.curve, head_at_speed / (ratio * ratio));
  if (!q) return std::nullopt;
  return *q * ratio;
}

namespace {

std::size_t scenario_index(const Project& project, const std::string& scenario) {
  std::size_t index = project.scenarios.size();
  for (std::size_t i = 0; i < project.scenarios.size(); ++i)
    if (project.scenarios[i].id == scenario) index = i;
  if (index == project.scenarios.size()) {
    std::string ids;
    for (const auto& o : project.options.alternatives)
      if (ids.find("\"" + o.scenario + "\"") == std::string::npos)
        ids += (ids.empty() ? "" : ", ") + ("\"" + o.scenario + "\"");
    throw UsageError("no scenario \"" + scenario + "\" in " + project.file +
                     "; scenarios with options: " + (ids.empty() ? "none" : ids));
  }
  return index;
}

// The scenario without its SIF and with no option added: its target and unprotected frequency.
void judge_bare_scenario(const LoadedProject& loaded, std::size_t index, const VerifyOptions& vo,
                         ScenarioOptions& out) {
  const ProjectResult bare = verify_project(with_layers(loaded, index, std::nullopt), vo);
  if (const ScenarioResult* r = find_result(bare, out.scenario)) {
    out.target_frequency_per_yr = r->target_frequency_per_yr;
    out.frequency_unprotected_per_yr = r->frequency_without_sif_per_yr;
  }
}

// The equipment item and pump the scenario is about, when the pressure screening generated it.
struct ScreenedBy {
  const EquipmentScreening* item = nullptr;
  const PressureSource* pump = nullptr;
};

void judge_option(const LoadedProject& loaded, std::size_t index, const ScenarioOption& opt, const ScreenedBy& screened,
                  const VerifyOptions& vo, OptionResult& r) {
  switch (opt.kind) {
    case ScenarioOption::Kind::kRerate:
      judge_rerate(opt, screened.item, r);
      break;
    case ScenarioOption::Kind::kRelief:
      judge_relief(loaded, opt, screened.item, screened.pump, r);
      if (r.feasible) judge_layer(loaded, index, opt, LayerKind::kReliefDevice, vo, r);
      break;
    case ScenarioOption::Kind::kLayer:
      r.feasible = true;
      judge_layer(loaded, index, opt, LayerKind::kOther, vo, r);
      break;
    case ScenarioOption::Kind::kSif:
      judge_sif(loaded, index, opt, vo, r);
      break;
  }
}

void add_lifecycle_cost(const ScenarioOption& opt, const ScenarioOptions& out, OptionResult& r) {
  if (opt.kind != ScenarioOption::Kind::kSif && opt.test_interval && opt.test_interval->hours > 0.0)
    r.tests_per_yr = kHoursPerYear / opt.test_interval->hours;
  const double factor = present_value_of_annuity(1.0, out.discount_rate, out.mission_years);
  r.capex = opt.capex;
  r.pv_annual_cost = opt.annual_cost * factor;
  r.pv_test_cost = opt.cost_per_test * r.tests_per_yr * factor;
  r.pv_trip_cost = opt.cost_per_spurious_trip * r.trips_per_yr * factor;
  r.lifecycle_cost = r.capex + r.pv_annual_cost + r.pv_test_cost + r.pv_trip_cost;
}

// Feasible options that make the scenario tolerable first, then the other feasible ones, then the
// rest; the cheapest over the life first within each group.
void rank_options(std::vector<OptionResult>& options) {
  auto group = [](const OptionResult& o) { return o.feasible ? (o.makes_tolerable ? 0 : 1) : 2; };
  std::stable_sort(options.begin(), options.end(), [&](const OptionResult& a, const OptionResult& b) {
    if (group(a) != group(b)) return group(a) < group(b);
    return a.lifecycle_cost < b.lifecycle_cost;
  });
}

}  // namespace

ScenarioOptions compare_options(const LoadedProject& loaded, const std::string& scenario, const VerifyOptions& vo) {
  const Project& project = loaded.project;
  const std::size_t index = scenario_index(project, scenario);
  const Scenario& s = project.scenarios[index];
  ScenarioOptions out;
  out.scenario = s.id;
  out.title = s.title;
  out.discount_rate = project.options.discount_rate;
  out.mission_years = project.defaults.mission_time.years();
  judge_bare_scenario(loaded, index, vo, out);
  ScreenedBy screened;
  screened.item = screened_item(loaded, s, &screened.pump);
  for (const auto& opt : project.options.alternatives) {
    if (opt.scenario != s.id) continue;
    OptionResult r;
    r.id = opt.id;
    r.title = opt.title;
    r.kind = opt.kind;
    judge_option(loaded, index, opt, screened, vo, r);
    add_lifecycle_cost(opt, out, r);
    out.options.push_back(std::move(r));
  }
  rank_options(out.options);
  return out;
}

std::vector<ScenarioOptions> compare_all_options(const LoadedProject& loaded, const VerifyOptions& vo) {
  std::vector<ScenarioOptions> out;
  for (const auto& s : loaded.project.scenarios) {
    const bool listed =
        std::any_of(loaded.project.options.alternatives.begin(), loaded.project.options.alternatives.end(),
                    [&](const ScenarioOption& o) { return o.scenario == s.id; });
    if (listed) out.push_back(compare_options(loaded, s.id, vo));
  }
  return out;
}

}  // namespace sifter
