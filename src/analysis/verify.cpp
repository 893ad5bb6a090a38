// Per-SIF verification: subsystem figures, the SIF sum, the target and the verdict.
#include "sifter/analysis/verify.hpp"

#include <algorithm>
#include <cmath>
#include <utility>

#include "analysis/verify_parts.hpp"
#include "sifter/analysis/judge.hpp"
#include "sifter/analysis/judged_figure.hpp"
#include "sifter/engines/constraints.hpp"
#include "sifter/engines/cross_check.hpp"
#include "sifter/engines/probability_cap.hpp"
#include "sifter/engines/requirements.hpp"
#include "sifter/engines/sil.hpp"
#include "sifter/engines/spurious.hpp"
#include "sifter/model/format.hpp"

namespace sifter {

std::string to_string(SystematicGround ground) {
  switch (ground) {
    case SystematicGround::kSystematicCapability:
      return "systematic capability";
    case SystematicGround::kPriorUse:
      return "prior use";
    case SystematicGround::kNone:
      break;
  }
  return "none";
}

namespace {

// Architectural constraints and systematic capability; the achieved SIL is the lowest of the
// three results (IEC 61508-2:2010 7.4.4, 7.4.3; IEC 61511-1:2016 11.4), and the verdict needs all three.
void apply_constraints(const Project& project, const Sif& sif, SifResult& r, const std::optional<double>& required,
                       const std::optional<double>& achieved) {
  SifConstraints c = sif_constraints(sif, project.components, r.constraints, r.demand_mode);
  r.sil_architecture = c.sil_architecture;
  r.sil_systematic = c.sil_systematic;
  r.sil_achieved = std::min({r.sil_probability, r.sil_architecture, r.sil_systematic});
  for (std::size_t i = 0; i < c.subsystems.size() && i < r.subsystems.size(); ++i) {
    auto& sc = c.subsystems[i];
    auto& sub = r.subsystems[i];
    sub.hft = sc.hft;
    sub.sff = sc.sff;
    sub.sil_architecture = sc.sil_architecture;
    sub.systematic_capability = sc.systematic_capability;
    sub.constraint_notes = std::move(sc.findings);  // limits_for below reads the caps and elements, not the findings
    sub.systematic_basis.reserve(sc.elements.size());
    for (const auto& e : sc.elements)
      sub.systematic_basis.push_back(
          {e.component,
           e.prior_use && e.prior_use->sil > e.systematic_capability.value_or(0) ? SystematicGround::kPriorUse
           : e.systematic_capability ? SystematicGround::kSystematicCapability
                                     : SystematicGround::kNone,
           e.prior_use && e.prior_use->sil > e.systematic_capability.value_or(0) ? std::optional(e.prior_use->sil)
                                                                                 : e.systematic_capability,
           e.prior_use ? e.prior_use->evidence : ""});
  }
  r.assumptions.push_back("architectural constraints on the basis " + to_string(r.constraints) + " (" +
                          (r.constraints == ConstraintBasis::kIec61511  ? "IEC 61511-1:2016 11.4, Table 6"
                           : r.constraints == ConstraintBasis::kRoute1H ? "IEC 61508-2:2010 7.4.4.2, Tables 2 and 3"
                                                                        : "IEC 61508-2:2010 7.4.4.3") +
                          ")");
  if (!r.sil_required || !achieved) return;
  ProbabilityCheck p;
  p.mode = r.demand_mode;
  p.sil = r.sil_probability;
  p.achieved = *achieved;
  p.required = required.value_or(sil_upper_limit(*r.sil_required, r.demand_mode));
  r.limits = limits_for(p, c, *r.sil_required);
}

void warn_beyond_simplified_range(const Sif& sif, const SifResult& r, std::vector<Warning>& warnings) {
  for (std::size_t i = 0; i < r.subsystems.size() && i < sif.subsystems.size(); ++i) {
    if (sif.subsystems[i].is_vendor()) continue;
    const double x = r.subsystems[i].channel_rates.lambda_du.per_hour * r.subsystems[i].proof_test_interval.hours;
    if (x > kSimplifiedLimitLambdaT)
      warnings.push_back({sif.subsystems[i].pointer, "lDU·T1 = " + sifter::figure(x) + " for a channel of " +
                                                         r.subsystems[i].name +
                                                         ": the simplified equations lose accuracy above lDU·T1 = 0.1; "
                                                         "see the exact cross-check"});
  }
}

}  // namespace

SifResult verify_sif(const Project& project, const Sif& sif, const std::optional<SifRequirement>& lopa,
                     const VerifyOptions& options, std::vector<Warning>& warnings) {
  ExactCache cache;
  return verify_sif(project, sif, lopa, options, warnings, cache);
}

namespace {

// Identity, constraint basis, demand mode and its reason. A SIF its scenarios demand more than
// once a year is judged in high demand whatever its stated mode (IEC 61511-1:2016 3.2.39).
SifResult start_result(const Project& project, const Sif& sif, const std::optional<SifRequirement>& lopa) {
  SifResult r;
  r.id = sif.id;
  r.title = sif.title;
  r.constraints = sif.constraints.value_or(project.constraints.value_or(ConstraintBasis::kIec61511));
  if (lopa) {
    r.demand_mode = lopa->demand_mode;
    r.demand_mode_basis = demand_basis(*lopa);
    r.scenarios = lopa->scenarios;
    r.demand_mode_raised = sif.demand_mode_stated == DemandMode::kLow && lopa->demand_mode == DemandMode::kHigh;
    if (r.demand_mode_raised)
      r.demand_mode_basis = "stated low demand, but " + r.demand_mode_basis + "; judged in high demand (the stricter)";
  } else {
    r.demand_mode = sif.demand_mode();
    r.demand_mode_basis = sif.demand_mode_stated ? "stated in the project" : "not stated; low demand assumed";
  }
  return r;
}

// Series subsystems: the SIF's simplified PFDavg (PFH) is the sum of theirs (IEC 61508-6:2010
// B.2.2, rare-event approximation of 1 - prod(1 - PFD_i)). False where a figure is missing.
bool sum_simplified(const Sif& sif, SifResult& r, std::vector<Warning>& warnings) {
  const bool low = r.demand_mode == DemandMode::kLow;
  double total = 0.0;
  bool complete = true;
  for (std::size_t i = 0; i < r.subsystems.size(); ++i) {
    const auto& v = low ? r.subsystems[i].pfd_avg : r.subsystems[i].pfh_per_hour;
    if (v) {
      total += *v;
      continue;
    }
    complete = false;
    warnings.push_back({sif.subsystems[i].pointer, "the supplier gives no " + std::string(low ? "PFDavg" : "PFH") +
                                                       " for " + r.demand_mode_basis +
                                                       " operation; the SIF cannot be verified"});
  }
  r.assumptions.insert(r.assumptions.begin(),
                       std::string("SIF ") + (low ? "PFDavg" : "PFH") +
                           " = sum over its subsystems in series (IEC 61508-6:2010 Annex B simplified equations)");
  if (!complete) return false;
  if (low)
    r.pfd_avg_simplified = total;
  else
    r.pfh_simplified_per_hour = total;
  return true;
}

void record_target(const SifTarget& t, SifResult& r) {
  r.target_text = t.text;
  r.sil_required = t.sil;
  r.required_pfd = t.required_pfd;
  r.required_pfh_per_hour = t.required_pfh_per_hour;
  if (t.required_rrf && r.demand_mode == DemandMode::kLow) r.required_rrf = t.required_rrf;
}

// The judged figure's SIL and RRF (the verdict is decided once, by sif_verdict, at the end).
void apply_probability(SifResult& r) {
  const bool low = r.demand_mode == DemandMode::kLow;
  const std::optional<double> figure = r.judged_figure();
  if (!figure) return;
  r.sil_probability = low ? sil_from_pfd_avg(*figure) : sil_from_pfh(*figure);
  if (low) r.rrf = *figure > 0.0 ? std::optional<double>(1.0 / *figure) : std::nullopt;
}

}  // namespace

SifTarget recorded_target(const SifResult& r) {
  SifTarget target;
  target.mode = r.demand_mode;
  target.sil = r.sil_required;
  target.required_pfd = r.required_pfd;
  target.required_pfh_per_hour = r.required_pfh_per_hour;
  target.required_rrf = r.required_rrf;
  target.text = r.target_text;
  return target;
}

VerdictBasis verdict_basis(const SifResult& r, std::optional<double> route_2h_confidence) {
  VerdictBasis basis;
  basis.sil_architecture = r.sil_architecture;
  basis.sil_systematic = r.sil_systematic;
  basis.stated_requirements_met = std::all_of(r.requirement_checks.begin(), r.requirement_checks.end(),
                                              [](const RequirementCheck& c) { return c.ok; });
  if (r.constraints == ConstraintBasis::kRoute2H) basis.route_2h_confidence = route_2h_confidence;
  basis.figures_sound = !r.figures_defective;
  basis.judged_within_validity = !r.judged_sum_above_one;
  return basis;
}

void apply_credit(SifResult& r) {
  const std::optional<double> judged = r.judged_figure();
  if (!judged) return;
  const SifCredit credit =
      r.figures_defective ? SifCredit{1.0, false} : sif_credit(*judged, r.sil_achieved, r.demand_mode);
  r.credit_pfd = credit.value;
  r.credit_capped = credit.capped;
}

SifResult verify_sif(const Project& project, const Sif& sif, const std::optional<SifRequirement>& lopa,
                     const VerifyOptions& options, std::vector<Warning>& warnings, ExactCache& cache) {
  SifResult r = start_result(project, sif, lopa);
  detail::DefaultsApplied defaults;
  r.subsystems.reserve(sif.subsystems.size());  // results are held for the whole run: no spare room
  for (const auto& sub : sif.subsystems)
    r.subsystems.push_back(detail::evaluate_subsystem(project, sub, r.demand_mode, r.assumptions, defaults));
  detail::describe_defaults(project, defaults, r.assumptions);
  warn_beyond_simplified_range(sif, r, warnings);
  const bool complete = sum_simplified(sif, r, warnings);
  const SifTarget target = sif_target(sif, r.demand_mode, lopa, warnings);
  record_target(target, r);
  if (!sif.target && !lopa)
    warnings.push_back({sif.pointer, "no target and no scenario names this SIF; it is computed but not judged"});
  if (options.exact && complete) apply_exact_cross_check(project, sif, r, warnings, cache);
  if (complete) choose_judged_figures(project, sif, r);
  const CapFindings capped = cap_figures(r);  // the judge, the SIL and the credit see figures in [0, 1]
  r.judged_sum_above_one = capped.judged_above_one;
  apply_probability(r);
  if (capped.defect) declare_defective(r);
  add_spurious_trips(project, sif, r);
  const std::optional<double> judged = r.judged_figure();
  apply_constraints(project, sif, r, target.limit(), judged);
  apply_credit(r);
  apply_requirement_checks(project, sif, r, warnings);
  r.meets_target = sif_verdict(target, judged, verdict_basis(r));  // the one verdict
  say_findings(sif, capped, r, warnings);
  r.assumptions.shrink_to_fit();
  if (!options.response_budgets) r.response_budget = {};  // read above, printed by no writer of this run
  return r;
}

}  // namespace sifter
