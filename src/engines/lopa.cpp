// LOPA scenario arithmetic (CCPS 2001, 2013), demand mode on the SIF (IEC 61511-1:2016
// 3.2.39) and what the scenarios require of each SIF.
#include "sifter/engines/lopa.hpp"

#include <algorithm>
#include <array>
#include <cmath>
#include <cstdio>
#include <stdexcept>
#include <unordered_map>

#include "sifter/engines/sil.hpp"

namespace sifter {

std::string to_string(FindingKind kind) {
  switch (kind) {
    case FindingKind::kNotIndependent:
      return "not_independent";
    case FindingKind::kBpcsCreditCapped:
      return "bpcs_credit_capped";
    case FindingKind::kImplausiblyLowPfd:
      return "implausibly_low_pfd";
    case FindingKind::kTooManyBpcsLayers:
      return "too_many_bpcs_layers";
    case FindingKind::kResponseTime:
      return "response_time";
    case FindingKind::kNoSifNeeded:
      return "no_sif_needed";
    case FindingKind::kSil4Review:
      return "sil4_review";
    case FindingKind::kModeMismatch:
      return "mode_mismatch";
  }
  return "unknown";
}

bool modifier_applies(const Modifier& modifier, const std::string& category) {
  const auto& cats = modifier.applies_to;
  return cats.empty() || std::find(cats.begin(), cats.end(), category) != cats.end();
}

LopaContext lopa_context_from_project(const Project& project) {
  LopaContext context;
  for (std::size_t i = 0; i < project.sifs.size(); ++i) {
    context.sifs[project.sifs[i].id].demand_mode_stated = project.sifs[i].demand_mode_stated;
    context.sif_index.emplace(project.sifs[i].id, i);
  }
  return context;
}

namespace {

std::string mode_phrase(DemandMode mode) { return mode == DemandMode::kLow ? "low" : "high"; }

// A consequence with its target, before any arithmetic.
struct Rated {
  std::string category;
  std::string severity;
  double target_per_yr = 0.0;
};

std::vector<Rated> rated_consequences(const Project& project, const Scenario& scenario, ScenarioResult& r) {
  std::vector<Rated> out;
  if (scenario.target_frequency) {
    const double t = scenario.target_frequency->per_year();
    if (scenario.consequences.empty()) return {{"", "", t}};
    r.assumptions.push_back("The scenario's target frequency of " + format_number(t) +
                            "/yr is used for every consequence instead of the risk criteria.");
    for (const auto& c : scenario.consequences) out.push_back({c.category, c.severity, t});
    return out;
  }
  for (const auto& c : scenario.consequences) {
    auto cat = project.risk_criteria.find(c.category);
    if (cat == project.risk_criteria.end() || !cat->second.count(c.severity))
      throw std::invalid_argument("scenario " + scenario.id + ": consequence " + c.category + " " + c.severity +
                                  " is not in the risk criteria");
    out.push_back({c.category, c.severity, cat->second.at(c.severity).per_year()});
  }
  if (out.empty()) throw std::invalid_argument("scenario " + scenario.id + " has neither consequences nor a target");
  return out;
}

double modifier_product(const Scenario& scenario, const std::string& category) {
  double m = 1.0;
  for (const auto& mod : scenario.modifiers)
    if (modifier_applies(mod, category)) m *= mod.probability;
  return m;
}

// Per cause: IEF x enabling, then x the layers credited against it before the SIF (the demand
// on the SIF), then x those after it (the frequency without the SIF).
std::vector<CauseResult> cause_results(const Scenario& scenario, const LayerAssessment& a) {
  std::vector<CauseResult> out;
  for (std::size_t c = 0; c < scenario.causes.size(); ++c) {
    const Cause& cause = scenario.causes[c];
    CauseResult cr;
    cr.id = cause.id;
    cr.frequency_per_yr = cause.frequency.per_year();
    for (const auto& e : cause.enabling) cr.enabling_product *= e.probability;
    double before = 1.0;
    double after = 1.0;
    for (const auto& lc : a.layers)
      if (lc.for_cause[c]) (lc.before_sif ? before : after) *= lc.pfd_credited;
    cr.demand_rate_per_yr = cr.frequency_per_yr * cr.enabling_product * before;
    cr.frequency_without_sif_per_yr = cr.demand_rate_per_yr * after;
    cr.sif_credited = a.sif_for_cause.empty() || a.sif_for_cause[c];
    out.push_back(cr);
  }
  return out;
}

// The layers after the SIF that count in the required PFH: those credited against every cause
// (a layer credited against only some of them is left out, which is conservative).
double after_sif_product(const LayerAssessment& a) {
  double p = 1.0;
  for (const auto& lc : a.layers)
    if (!lc.before_sif && lc.credited &&
        std::all_of(lc.for_cause.begin(), lc.for_cause.end(), [](bool b) { return b; }))
      p *= lc.pfd_credited;
  return p;
}

void decide_demand_mode(ScenarioResult& r, double demand_per_yr) {
  r.demand_rate_per_yr = demand_per_yr;
  const DemandMode from_rate = at_most(demand_per_yr, kHighDemandAbovePerYear) ? DemandMode::kLow : DemandMode::kHigh;
  // The stricter applies: demanded more than once a year is high demand whatever is stated.
  r.demand_mode = from_rate == DemandMode::kHigh ? DemandMode::kHigh : r.demand_mode_stated.value_or(from_rate);
  if (!r.demand_mode_stated || *r.demand_mode_stated == from_rate) return;
  const bool high = from_rate == DemandMode::kHigh;
  r.findings.push_back({FindingKind::kModeMismatch,
                        *r.sif + " is stated to be in " + mode_phrase(*r.demand_mode_stated) +
                            " demand mode, but scenario " + r.id + " demands it " + format_number(demand_per_yr) +
                            " times a year, " +
                            (high ? "more than once a year (high" : "no more than once a year (low") +
                            " demand, IEC 61511-1:2016 3.2.39); " +
                            (high ? "it is judged in high demand (the stricter)." : "the stated mode is kept.")});
}

// Everything the consequences share: per cause, the split by SIF credit, the SIF's figures.
struct Flow {
  double total = 0.0;         // frequency without the SIF, before the modifiers
  double sif_credited = 0.0;  // share from causes the SIF is credited against
  double after_sif = 1.0;     // layers after the SIF counted in the PFH form
  bool has_sif = false;
  bool high = false;
  std::optional<double> pfd_avg;
  std::optional<double> pfh_per_hour;
};

ConsequenceResult consequence_result(const Rated& rated, const Scenario& scenario, const Flow& f) {
  ConsequenceResult c;
  c.category = rated.category;
  c.severity = rated.severity;
  c.target_frequency_per_yr = rated.target_per_yr;
  c.modifier_product = modifier_product(scenario, rated.category);
  c.frequency_without_sif_per_yr = f.total * c.modifier_product;
  c.required_rrf = c.frequency_without_sif_per_yr / c.target_frequency_per_yr;
  c.required_pfd = c.required_rrf > 1.0 ? 1.0 / c.required_rrf : 1.0;
  c.required_sil = sil_required_from_rrf(c.required_rrf);
  if (!f.has_sif) {
    c.mitigated_frequency_per_yr = c.frequency_without_sif_per_yr;
  } else {
    // IEC 61511-1:2016 3.2.39 high demand: the hazard rate is PFH x time x what acts after it.
    const double per_hour = rated.target_per_yr / kHoursPerYear;
    const double after = c.modifier_product * f.after_sif;
    if (after > 0.0) c.required_pfh_per_hour = per_hour / after;
    if (f.high && c.required_pfh_per_hour) c.required_sil = sil_required_from_pfh(*c.required_pfh_per_hour);
    const double uncredited = f.total - f.sif_credited;
    if (!f.high && f.pfd_avg)
      c.mitigated_frequency_per_yr = (f.sif_credited * *f.pfd_avg + uncredited) * c.modifier_product;
    if (f.high && f.pfh_per_hour) {
      const double through = *f.pfh_per_hour * kHoursPerYear * f.after_sif;
      c.mitigated_frequency_per_yr = (std::min(f.sif_credited, through) + uncredited) * c.modifier_product;
    }
  }
  if (c.mitigated_frequency_per_yr) c.meets_target = at_most(*c.mitigated_frequency_per_yr, c.target_frequency_per_yr);
  return c;
}

void summarise(ScenarioResult& r) {
  const auto& cs = r.consequences;
  std::size_t g = 0;
  for (std::size_t k = 1; k < cs.size(); ++k)
    if (cs[k].required_rrf > cs[g].required_rrf) g = k;
  r.governing_consequence = g;
  r.target_frequency_per_yr = cs[g].target_frequency_per_yr;
  r.frequency_without_sif_per_yr = cs[g].frequency_without_sif_per_yr;
  r.required_rrf = cs[g].required_rrf;
  r.required_pfd = cs[g].required_pfd;
  r.mitigated_frequency_per_yr = cs[g].mitigated_frequency_per_yr;
  r.required_sil = 0;
  bool all_known = true;
  bool all_met = true;
  for (const auto& c : cs) {
    r.required_sil = std::max(r.required_sil, c.required_sil);
    if (c.meets_target)
      all_met = all_met && *c.meets_target;
    else
      all_known = false;
    if (r.demand_mode == DemandMode::kHigh && c.required_pfh_per_hour &&
        (!r.required_pfh_per_hour || *c.required_pfh_per_hour < *r.required_pfh_per_hour))
      r.required_pfh_per_hour = c.required_pfh_per_hour;
  }
  if (all_known) r.meets_target = all_met;
}

// IEC 61511-1:2016 clause 9 (from memory): no SIF below a risk reduction of 10; above 10 000
// (SIL 4) the design is re-examined first.
void sil_findings(ScenarioResult& r) {
  const std::string review =
      ": re-examine the process design and the other layers before relying on a SIF "
      "(IEC 61511-1:2016 clause 9.2).";
  const std::string none = ": no SIF is needed at this risk level (IEC 61511-1:2016 clause 9).";
  const std::string who = "Scenario " + r.id;
  if (r.demand_mode == DemandMode::kHigh && r.required_pfh_per_hour) {
    const std::string pfh = format_number(*r.required_pfh_per_hour) + "/h from " + *r.sif;
    if (r.required_sil == 0)
      r.findings.push_back({FindingKind::kNoSifNeeded, who + " needs a PFH of " + pfh + ", not below 1e-5/h" + none});
    if (r.required_sil == 4)
      r.findings.push_back(
          {FindingKind::kSil4Review, who + " needs a PFH of " + pfh + ", below 1e-8/h (SIL 4)" + review});
    return;
  }
  const std::string rrf = format_number(r.required_rrf);
  if (r.required_sil == 0) {
    const std::string why = r.required_rrf <= 1.0
                                ? " meets its target without a SIF (" + format_number(r.frequency_without_sif_per_yr) +
                                      "/yr against " + format_number(r.target_frequency_per_yr) + "/yr)"
                                : " needs a risk reduction of " + rrf + ", no more than " + format_number(kNoSifRrf);
    r.findings.push_back({FindingKind::kNoSifNeeded, who + why + none});
  }
  if (r.required_sil == 4) {
    const std::string why = r.required_rrf > 10.0 * kSil4Rrf
                                ? ", beyond the " + format_number(10.0 * kSil4Rrf) + " that SIL 4 provides"
                                : ", above " + format_number(kSil4Rrf) + " (SIL 4)";
    r.findings.push_back({FindingKind::kSil4Review, who + " needs a risk reduction of " + rrf + why + review});
  }
}

void method_assumptions(ScenarioResult& r, const Scenario& scenario, const LayerAssessment& a, double multiple) {
  auto has = [&](auto pred) { return std::any_of(scenario.layers.begin(), scenario.layers.end(), pred); };
  if (has([](const Layer& l) { return l.kind == LayerKind::kOperatorResponse; }))
    r.assumptions.push_back("An operator response is credited only with at least 10 min available and at least " +
                            format_number(multiple) + " times its response time (common practice).");
  if (std::any_of(a.layers.begin(), a.layers.end(), [](const LayerCredit& lc) { return lc.bpcs_based; }))
    r.assumptions.push_back(
        "BPCS-based layers are the BPCS functions and the operator responses that share a device "
        "with one of them or with an initiating cause; at most two are credited per scenario.");
  const bool partial = std::any_of(a.layers.begin(), a.layers.end(), [](const LayerCredit& lc) {
    return lc.credited && std::find(lc.for_cause.begin(), lc.for_cause.end(), false) != lc.for_cause.end();
  });
  if (partial)
    r.assumptions.push_back(
        "A layer that shares a device with an initiating cause gets no credit against that cause "
        "only, and keeps its credit against the others.");
  if (r.demand_mode == DemandMode::kHigh)
    r.assumptions.push_back(
        "In high demand the required PFH is the target / (8760 h/yr x the modifiers x the PFD of "
        "the layers credited after the SIF): enabling conditions are ignored, which is conservative.");
}

void sif_figure_assumptions(ScenarioResult& r, Flow& f, const SifFigures* figures) {
  if (figures) {
    if (f.high && figures->pfh) f.pfh_per_hour = figures->pfh->per_hour;
    if (!f.high && figures->pfd_avg) f.pfd_avg = figures->pfd_avg;
  }
  r.sif_pfd_avg = f.pfd_avg;
  r.sif_pfh_per_hour = f.pfh_per_hour;
  // The SIF is credited for the SIL it achieves, no more (IEC 61511-1:2016 clause 9, from
  // memory): the credit replaces the figure in the mitigated frequency.
  if (figures && figures->credit && (f.high ? f.pfh_per_hour : f.pfd_avg)) {
    (f.high ? f.pfh_per_hour : f.pfd_avg) = figures->credit;
    r.sif_credit_capped = figures->credit_capped;
    if (figures->credit_capped)
      r.assumptions.push_back(
          *r.sif + " is credited with " + (f.high ? "a PFH of " : "a PFD of ") + format_number(*figures->credit) +
          (f.high ? "/h" : "") + ", the best of the SIL band it achieves, not its computed " +
          (f.high ? "PFH " : "PFDavg ") + format_number(*(f.high ? r.sif_pfh_per_hour : r.sif_pfd_avg)) +
          ": a SIF is credited only for the SIL it achieves (IEC 61511-1:2016 clause 9).");
  } else if (f.pfd_avg || f.pfh_per_hour) {
    r.sif_credit_capped = false;
  }
  r.sif_credit_pfd = f.high ? f.pfh_per_hour : f.pfd_avg;
  if (f.high && f.pfh_per_hour)
    r.assumptions.push_back(
        "In high demand the mitigated frequency is the PFH x 8760 h/yr x the PFD of the layers "
        "credited after the SIF x the modifiers, and no more than the frequency without the SIF.");
  if (!f.pfd_avg && !f.pfh_per_hour)
    r.assumptions.push_back(*r.sif + " has no computed " + (f.high ? "PFH" : "PFDavg") +
                            "; the mitigated frequency is not given.");
}

}  // namespace

ScenarioResult evaluate_scenario(const Project& project, const Scenario& scenario, const LopaContext& context) {
  ScenarioResult r;
  r.id = scenario.id;
  r.title = scenario.title;
  const LayerAssessment a = assess_layers(project, scenario, context);
  r.findings = a.findings;
  r.assumptions = a.assumptions;
  const auto rated = rated_consequences(project, scenario, r);
  r.causes = cause_results(scenario, a);

  Flow f;
  const SifFigures* figures = nullptr;
  if (a.sif_layer) {
    f.has_sif = true;
    r.sif = scenario.layers[*a.sif_layer].sif;
    auto it = context.sifs.find(*r.sif);
    if (it != context.sifs.end()) figures = &it->second;
    if (figures) r.demand_mode_stated = figures->demand_mode_stated;
    double demand = 0.0;
    for (const auto& c : r.causes) demand += c.demand_rate_per_yr;
    decide_demand_mode(r, demand);
    f.high = r.demand_mode == DemandMode::kHigh;
    f.after_sif = after_sif_product(a);
  }
  for (const auto& c : r.causes) {
    f.total += c.frequency_without_sif_per_yr;
    if (c.sif_credited) f.sif_credited += c.frequency_without_sif_per_yr;
  }
  if (f.has_sif) sif_figure_assumptions(r, f, figures);
  for (const auto& rc : rated) r.consequences.push_back(consequence_result(rc, scenario, f));
  summarise(r);
  sil_findings(r);
  if (!context.assumptions) return r;
  method_assumptions(r, scenario, a, project.operator_time_multiple);
  if (context.worksheet) r.worksheet = build_worksheet(scenario, a, r);
  return r;
}

std::vector<ScenarioResult> evaluate_scenarios(const Project& project, const LopaContext& context) {
  std::vector<ScenarioResult> out;
  out.reserve(project.scenarios.size());
  for (const auto& s : project.scenarios) out.push_back(evaluate_scenario(project, s, context));
  return out;
}

namespace {

std::string and_list(const std::vector<std::string>& items) {
  std::string out;
  for (std::size_t i = 0; i < items.size(); ++i) {
    if (i > 0) out += i + 1 == items.size() ? " and " : ", ";
    out += items[i];
  }
  return out;
}

void add_scenario(SifRequirement& req, const ScenarioResult& r) {
  if (req.scenarios.empty() || r.required_rrf > req.required_rrf) {
    req.required_rrf = r.required_rrf;
    req.governing_scenario = r.id;
  }
  req.scenarios.push_back(r.id);
  req.demand_rate_per_yr += r.demand_rate_per_yr.value_or(0.0);
  for (const auto& c : r.consequences)
    if (c.required_pfh_per_hour &&
        (!req.required_pfh_per_hour || *c.required_pfh_per_hour < *req.required_pfh_per_hour))
      req.required_pfh_per_hour = c.required_pfh_per_hour;
}

// Demands from every scenario on one SIF add up (IEC 61511-1:2016 3.2.39 counts the demands
// on the function, whatever their source).
void decide_sif_mode(SifRequirement& req, std::optional<DemandMode> stated, bool one_high) {
  const DemandMode from_rate =
      at_most(req.demand_rate_per_yr, kHighDemandAbovePerYear) ? DemandMode::kLow : DemandMode::kHigh;
  req.demand_mode = from_rate == DemandMode::kHigh ? DemandMode::kHigh : stated.value_or(from_rate);
  if (req.scenarios.size() > 1)
    req.assumptions.push_back("The demands of scenarios " + and_list(req.scenarios) + " on " + req.sif +
                              " are added (" + format_number(req.demand_rate_per_yr) +
                              " a year); scenarios that share a cause would count it twice, which is conservative.");
  // A single scenario's contradiction is reported with the scenario; here only the one that
  // appears when the scenarios' demands are added.
  if (stated == DemandMode::kLow && from_rate == DemandMode::kHigh && !one_high)
    req.findings.push_back({FindingKind::kModeMismatch,
                            req.sif + " is stated to be in low demand mode, but scenarios " + and_list(req.scenarios) +
                                " together demand it " + format_number(req.demand_rate_per_yr) +
                                " times a year, more than once a year (high demand, IEC 61511-1:2016 3.2.39); "
                                "it is judged in high demand (the stricter)."});
}

}  // namespace

std::vector<SifRequirement> sif_requirements(const std::vector<ScenarioResult>& results) {
  std::vector<SifRequirement> out;
  struct Seen {
    std::optional<DemandMode> stated;
    bool one_high = false;  // some scenario alone demands the SIF more than once a year
  };
  std::vector<Seen> seen;
  std::unordered_map<std::string, std::size_t> position;  // of each SIF in `out`: no scan per scenario
  for (const auto& r : results) {
    if (!r.sif) continue;
    auto [at, inserted] = position.try_emplace(*r.sif, out.size());
    if (inserted) {
      out.push_back({});
      out.back().sif = *r.sif;
      seen.push_back({r.demand_mode_stated, false});
    }
    add_scenario(out[at->second], r);
    const double rate = r.demand_rate_per_yr.value_or(0.0);
    if (!at_most(rate, kHighDemandAbovePerYear)) seen[at->second].one_high = true;
  }
  for (std::size_t i = 0; i < out.size(); ++i) {
    SifRequirement& req = out[i];
    decide_sif_mode(req, seen[i].stated, seen[i].one_high);
    req.required_pfd = req.required_rrf > 1.0 ? 1.0 / req.required_rrf : 1.0;
    req.sil_required = req.demand_mode == DemandMode::kHigh && req.required_pfh_per_hour
                           ? sil_required_from_pfh(*req.required_pfh_per_hour)
                           : sil_required_from_rrf(req.required_rrf);
    if (req.demand_mode == DemandMode::kLow) req.required_pfh_per_hour.reset();
  }
  return out;
}

}  // namespace sifter
