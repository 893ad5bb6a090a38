// Per-SIF verification: subsystem figures, the SIF sum, the target and the verdict.
#include "sifter/analysis/verify.hpp"

#include <algorithm>
#include <atomic>
#include <cmath>
#include <cstdio>
#include <map>
#include <mutex>
#include <thread>

#include "sifter/analysis/judge.hpp"
#include "sifter/analysis/judged_figure.hpp"
#include "sifter/analysis/maturity.hpp"
#include "sifter/analysis/sif_uncertainty.hpp"
#include "sifter/engines/constraints.hpp"
#include "sifter/engines/cross_check.hpp"
#include "sifter/engines/group_model.hpp"
#include "sifter/engines/plausibility.hpp"
#include "sifter/engines/probability_cap.hpp"
#include "sifter/engines/requirements.hpp"
#include "sifter/engines/sil.hpp"
#include "sifter/engines/spurious.hpp"
#include "sifter/model/format.hpp"

namespace sifter {
namespace {

std::string num(double v) { return sifter::figure(v); }

// Defaults applied, gathered per kind so that the output names each once with its subsystems.
struct DefaultsApplied {
  std::vector<std::string> interval, mttr, mrt_equals_mttr, beta_d_equals_beta;
};

std::string joined(const std::vector<std::string>& names) {
  std::string out;
  for (const auto& n : names) out += (out.empty() ? "" : ", ") + n;
  return out;
}

void describe_defaults(const Project& project, const DefaultsApplied& d, std::vector<std::string>& assumptions) {
  if (!d.interval.empty() && project.defaults.proof_test_interval)
    assumptions.push_back("proof-test interval " + format_duration(*project.defaults.proof_test_interval) +
                          " from the project defaults: " + joined(d.interval));
  if (!d.mttr.empty() && project.defaults.mttr)
    assumptions.push_back("MTTR " + format_duration(*project.defaults.mttr) +
                          " from the project defaults: " + joined(d.mttr));
  if (!d.mrt_equals_mttr.empty())
    assumptions.push_back("MRT taken equal to MTTR (not given): " + joined(d.mrt_equals_mttr));
  if (!d.beta_d_equals_beta.empty())
    assumptions.push_back("beta_D taken equal to beta (not given): " + joined(d.beta_d_equals_beta));
}

bool p_test_duration(const Subsystem& sub) { return sub.test_duration && sub.test_duration->hours > 0.0; }

SubsystemResult evaluate_subsystem(const Project& project, const Subsystem& sub, DemandMode mode,
                                   std::vector<std::string>& assumptions, DefaultsApplied& defaults) {
  SubsystemResult r;
  r.name = sub.name;
  r.template_name = sub.template_name;
  r.role = sub.role;
  r.proof_test_interval = sub.proof_test_interval;
  for (const auto& ch : sub.channels) {
    std::vector<std::string> tags;
    for (auto c : ch.components) tags.push_back(project.components[c].id);
    r.channels.push_back(std::move(tags));
  }
  if (sub.is_vendor()) {
    r.vote = sub.hft_declared ? "vendor (HFT " + std::to_string(*sub.hft_declared) + ")" : "vendor";
    r.pfd_avg = sub.vendor_pfd_avg;
    if (sub.vendor_pfh) r.pfh_per_hour = sub.vendor_pfh->per_hour;
    r.equation = "figure from the safety manual";
    assumptions.push_back(sub.name + ": " + (sub.vendor_pfd_avg ? "PFDavg" : "PFH") +
                          " taken from the supplier's safety manual; its proof-test and repair assumptions apply");
    return r;
  }
  r.vote = sub.vote.text();
  r.voting = sub.vote;
  std::vector<std::size_t> seen;
  for (const auto& ch : sub.channels)
    for (auto c : ch.components) {
      if (std::find(seen.begin(), seen.end(), c) != seen.end()) continue;
      seen.push_back(c);
      if (const auto& fd = project.components[c].field_data)
        assumptions.push_back(
            sub.name + ": lambda_du of " + project.components[c].id + " from field data, " +
            std::to_string(fd->failures) + " failures in " + num(fd->device_hours.hours) + " device-hours at " +
            num(100 * fd->confidence) +
            "% confidence: chi-squared(c; 2n+2)/(2T) = " + format_rate(project.components[c].rates.lambda_du));
    }
  const GroupData g = group_data_for(project, sub);
  r.channel_rates = g.channel;
  r.beta_effective = g.beta;
  r.beta_d_effective = g.beta_d;
  if (mode == DemandMode::kLow) {
    const GroupPfd p = group_pfd_avg(g);
    r.pfd_avg = p.pfd_avg;
    r.pfd_avg_simplified = p.pfd_avg;
    r.test_duration_term = p.test_duration;
    r.independent_undetected = p.independent_undetected;
    r.independent_detected = p.independent_detected;
    r.common_cause = p.common_cause;
    r.equation = p.equation;
  } else {
    const GroupPfh p = group_pfh(g);
    r.pfh_per_hour = p.pfh_per_hour;
    r.pfh_simplified_per_hour = p.pfh_per_hour;
    r.common_cause = p.common_cause_per_hour;
    r.independent_undetected = p.pfh_per_hour - p.common_cause_per_hour;
    r.equation = p.equation;
  }
  const bool redundant = sub.vote.failures_to_fail() > 1 || sub.vote.diagnostic;
  if (redundant && sub.beta_d_defaulted) defaults.beta_d_equals_beta.push_back(sub.name);
  if (sub.mrt_defaulted) defaults.mrt_equals_mttr.push_back(sub.name);
  if (sub.interval_defaulted) defaults.interval.push_back(sub.name);
  if (sub.mttr_defaulted) defaults.mttr.push_back(sub.name);
  if (sub.ccf_scaling == CcfScaling::kIec61508TableD5 && redundant)
    assumptions.push_back(sub.name + ": beta scaled by " + num(ccf_multiplier_table_d5(sub.vote.k, sub.vote.n)) +
                          " for " + sub.vote.text() + " (IEC 61508-6:2010 Table D.5)");
  if (sub.proof_test_coverage < 1.0)
    assumptions.push_back(sub.name + ": proof-test coverage " + num(sub.proof_test_coverage * 100) +
                          "%; failures the test misses stay until the end of the mission (" +
                          format_duration(project.defaults.mission_time) + ")");
  if (p_test_duration(sub))
    assumptions.push_back(sub.name + ": each channel out of service " + format_duration(*sub.test_duration) +
                          " per proof test; the simplified figure adds it (1oo1/NooN: N TD/T1; KooN: N TD/T1 x the "
                          "Ko(N-1) group, common practice)");
  if (sub.alarm_only_on_detected && mode == DemandMode::kHigh)
    assumptions.push_back(sub.name +
                          ": a detected dangerous failure only raises an alarm, so it counts as dangerous "
                          "until restored (lDD and beta_D lDD in the PFH; the exact engine counts every failure)");
  if (sub.partial_stroke)
    assumptions.push_back(sub.name + ": partial stroke test every " + format_duration(sub.partial_stroke->interval) +
                          " reveals " + num(sub.partial_stroke->coverage * 100) + "% of lambda_du");
  return r;
}

// Architectural constraints and systematic capability; the achieved SIL is the lowest of the
// three results (IEC 61508-2:2010 7.4.4, 7.4.3; IEC 61511-1:2016 11.4), and the verdict needs all three.
void apply_constraints(const Project& project, const Sif& sif, SifResult& r, const std::optional<double>& required,
                       const std::optional<double>& achieved) {
  const SifConstraints c = sif_constraints(sif, project.components, r.constraints, r.demand_mode);
  r.sil_architecture = c.sil_architecture;
  r.sil_systematic = c.sil_systematic;
  r.sil_achieved = std::min({r.sil_probability, r.sil_architecture, r.sil_systematic});
  for (std::size_t i = 0; i < c.subsystems.size() && i < r.subsystems.size(); ++i) {
    const auto& sc = c.subsystems[i];
    auto& sub = r.subsystems[i];
    sub.hft = sc.hft;
    sub.sff = sc.sff;
    sub.sil_architecture = sc.sil_architecture;
    sub.systematic_capability = sc.systematic_capability;
    sub.constraint_notes = sc.findings;
    for (const auto& e : sc.elements)
      sub.systematic_basis.push_back(
          {e.component,
           e.prior_use && e.prior_use->sil > e.systematic_capability.value_or(0) ? "prior use"
           : e.systematic_capability                                             ? "systematic capability"
                                                                                 : "none",
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
      warnings.push_back({sif.subsystems[i].pointer, "lDU·T1 = " + num(x) + " for a channel of " +
                                                         r.subsystems[i].name +
                                                         ": the simplified equations lose accuracy above lDU·T1 = 0.1; "
                                                         "see the exact cross-check"});
  }
}

}  // namespace

SifResult verify_sif(const Project& project, const Sif& sif, const std::optional<RequirementFromLopa>& lopa,
                     const VerifyOptions& options, std::vector<Warning>& warnings) {
  ExactCache cache;
  return verify_sif(project, sif, lopa, options, warnings, cache);
}

namespace {

// Identity, constraint basis, demand mode and its reason. A SIF its scenarios demand more than
// once a year is judged in high demand whatever its stated mode (IEC 61511-1:2016 3.2.39).
SifResult start_result(const Project& project, const Sif& sif, const std::optional<RequirementFromLopa>& lopa) {
  SifResult r;
  r.id = sif.id;
  r.title = sif.title;
  r.constraints = sif.constraints.value_or(project.constraints.value_or(ConstraintBasis::kIec61511));
  if (lopa) {
    r.demand_mode = lopa->demand_mode;
    r.demand_mode_basis = lopa->demand_basis;
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
  const std::optional<double> figure = low ? r.pfd_avg : r.pfh_per_hour;
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
  return basis;
}

SifResult verify_sif(const Project& project, const Sif& sif, const std::optional<RequirementFromLopa>& lopa,
                     const VerifyOptions& options, std::vector<Warning>& warnings, ExactCache& cache) {
  SifResult r = start_result(project, sif, lopa);
  DefaultsApplied defaults;
  for (const auto& sub : sif.subsystems)
    r.subsystems.push_back(evaluate_subsystem(project, sub, r.demand_mode, r.assumptions, defaults));
  describe_defaults(project, defaults, r.assumptions);
  warn_beyond_simplified_range(sif, r, warnings);
  const bool complete = sum_simplified(sif, r, warnings);
  const SifTarget target = sif_target(sif, r.demand_mode, lopa, warnings);
  record_target(target, r);
  if (!sif.target && !lopa)
    warnings.push_back({sif.pointer, "no target and no scenario names this SIF; it is computed but not judged"});
  if (options.exact && complete) apply_exact_cross_check(project, sif, r, warnings, cache);
  if (complete) choose_judged_figures(project, sif, r);
  apply_probability(r);
  add_spurious_trips(project, sif, r);
  const std::optional<double> judged = r.demand_mode == DemandMode::kLow ? r.pfd_avg : r.pfh_per_hour;
  apply_constraints(project, sif, r, target.limit(), judged);
  if (judged) {
    const SifCredit credit = sif_credit(*judged, r.sil_achieved, r.demand_mode);
    r.credit_pfd = credit.value;
    r.credit_capped = credit.capped;
  }
  apply_requirement_checks(project, sif, r, warnings);
  r.meets_target = sif_verdict(target, judged, verdict_basis(r));  // the one verdict
  return r;
}

bool ProjectResult::all_met() const {
  for (const auto& s : sifs)
    if (s.meets_target.has_value() && !*s.meets_target) return false;
  for (const auto& s : scenarios)
    if (s.meets_target.has_value() && !*s.meets_target) return false;
  return true;
}

namespace {

// What the risk analysis asks of each SIF, from the scenarios that credit it.
std::map<std::string, RequirementFromLopa> requirements_from(const std::vector<ScenarioResult>& scenarios,
                                                             std::vector<Warning>& warnings) {
  std::map<std::string, RequirementFromLopa> out;
  for (const auto& req : sif_requirements(scenarios)) {
    RequirementFromLopa r;
    r.required_rrf = req.required_rrf;
    r.required_pfh_per_hour = req.required_pfh_per_hour;
    r.demand_mode = req.demand_mode;
    r.scenarios = req.scenarios;
    char buf[64];
    std::snprintf(buf, sizeof buf, "%.3g", req.demand_rate_per_yr);
    r.demand_basis = std::string("demand rate ") + buf + "/yr from scenario" + (req.scenarios.size() > 1 ? "s " : " ");
    for (std::size_t i = 0; i < req.scenarios.size(); ++i) r.demand_basis += (i ? ", " : "") + req.scenarios[i];
    r.demand_basis += req.demand_mode == DemandMode::kLow
                          ? "; at most once a year is low demand (IEC 61511-1:2016 3.2.39)"
                          : "; above once a year is high demand (IEC 61511-1:2016 3.2.39)";
    for (const auto& f : req.findings) warnings.push_back({req.sif, to_string(f.kind) + ": " + f.message});
    out.emplace(req.sif, std::move(r));
  }
  return out;
}

// Runs body(i) for i in [0, n) on up to `threads` threads (0 = every core); blocks until done.
// An exception thrown by body is re-raised here.
void parallel_for(std::size_t n, int threads, const std::function<void(std::size_t)>& body) {
  const unsigned cores = std::max(1u, std::thread::hardware_concurrency());
  const std::size_t workers = std::min<std::size_t>(n, threads > 0 ? static_cast<std::size_t>(threads) : cores);
  if (workers <= 1) {
    for (std::size_t i = 0; i < n; ++i) body(i);
    return;
  }
  std::atomic<std::size_t> next{0};
  std::exception_ptr failure;
  std::mutex failure_mutex;
  auto work = [&] {
    for (std::size_t i = next++; i < n; i = next++) {
      try {
        body(i);
      } catch (...) {
        std::lock_guard<std::mutex> lock(failure_mutex);
        if (!failure) failure = std::current_exception();
      }
    }
  };
  std::vector<std::thread> pool;
  for (std::size_t w = 1; w < workers; ++w) pool.emplace_back(work);
  work();
  for (auto& t : pool) t.join();
  if (failure) std::rethrow_exception(failure);
}

// The Monte Carlo of every judged SIF on one plan, so that a library model's factor is the
// same for every SIF in one sample. Under Route 2H a SIF meets its target only with at least
// 90 % probability (IEC 61508-2:2010 7.4.4.3.1, from memory).
// From this many SIFs on, the Monte Carlo runs SIFs in parallel rather than samples.
constexpr std::size_t kSifsForThreadsAcrossSifs = 8;

void run_uncertainty(const Project& project, const VerifyOptions& options, ProjectResult& out) {
  UncertaintyPlan plan = plan_uncertainty(project.components);
  if (plan.sources.empty()) {
    out.warnings.push_back({"", "--samples was given but no component carries an \"uncertainty\"; nothing to sample"});
    return;
  }
  const long long total = static_cast<long long>(options.samples) * static_cast<long long>(project.sifs.size());
  // Every SIF reads the same factors of sample i: drawn once here, shared by all. The SIFs run
  // on the threads (each SIF's samples on one), started once for the run; each value still
  // depends only on (seed, sample), so the results do not depend on the thread count.
  plan.drawn = {options.seed, options.samples, draw_factor_table(plan, options.samples, options.seed)};
  // A project of a few SIFs splits each SIF's samples over the threads instead.
  const bool across_sifs = project.sifs.size() >= kSifsForThreadsAcrossSifs;
  std::atomic<long long> done{0};
  std::mutex progress_mutex;
  parallel_for(project.sifs.size(), across_sifs ? options.threads : 1, [&](std::size_t i) {
    SifResult& r = out.sifs[i];
    if (!r.sil_required || !(r.pfd_avg || r.pfh_per_hour)) return;
    MonteCarloOptions mc;
    mc.samples = options.samples;
    mc.seed = options.seed;
    mc.threads = across_sifs ? 1 : options.threads;
    if (options.progress && !across_sifs) {
      const long long before = static_cast<long long>(i) * options.samples;
      mc.progress = [&options, before, total](int n) { options.progress(before + n, total); };
    }
    r.uncertainty = sif_uncertainty(project, project.sifs[i], r, plan, mc);
    if (options.progress && across_sifs) {
      const std::lock_guard lock(progress_mutex);
      options.progress(done += options.samples, total);
    }
  });
  if (options.progress) options.progress(total, total);
  for (std::size_t i = 0; i < project.sifs.size(); ++i) {
    SifResult& r = out.sifs[i];
    if (!r.uncertainty) continue;
    r.assumptions.push_back("uncertainty: " + std::to_string(options.samples) + " samples, seed " +
                            std::to_string(options.seed) + "; " + r.uncertainty->method);
    // Only a SIF that meets otherwise: then every sample's verdict is its figure's judgement,
    // and P(meets target) is the confidence Route 2H asks of the target failure measure.
    if (r.constraints == ConstraintBasis::kRoute2H && r.meets_target.value_or(false) &&
        r.uncertainty->probability_meets_target < kRoute2hMinConfidence) {
      // The one verdict again, now with the Monte Carlo's confidence (it is below 90 %: short).
      r.meets_target = sif_verdict(recorded_target(r), r.demand_mode == DemandMode::kLow ? r.pfd_avg : r.pfh_per_hour,
                                   verdict_basis(r, r.uncertainty->probability_meets_target));
      r.limits.push_back({"probability", std::nullopt, std::nullopt, r.sil_probability,
                          "Route 2H asks for at least 90% confidence that the target failure measure is met "
                          "(IEC 61508-2:2010 7.4.4.3.1); the Monte Carlo gives " +
                              num(100.0 * r.uncertainty->probability_meets_target) +
                              "%. To lift it: better-founded failure data (a smaller error factor) or more margin."});
    }
  }
}

}  // namespace

std::map<std::string, RequirementFromLopa> lopa_requirements(const Project& project, std::vector<Warning>& warnings) {
  if (project.scenarios.empty()) return {};
  return requirements_from(evaluate_scenarios(project, lopa_context_from_project(project)), warnings);
}

namespace {

// A SIF without a stated mode takes it from the LOPA; its supplier figures and target must be
// of that mode (the loader checked SIFs whose mode is stated or assumed).
void refuse_mode_mismatches_from_lopa(const Project& project,
                                      const std::map<std::string, RequirementFromLopa>& requirements) {
  std::vector<Diagnostic> problems;
  for (const auto& sif : project.sifs) {
    auto it = requirements.find(sif.id);
    if (sif.demand_mode_stated || it == requirements.end()) continue;
    for (const auto& p : demand_mode_mismatches(sif, it->second.demand_mode, it->second.demand_basis))
      problems.push_back({project.file, 0, 0, p.pointer, p.expected, p.found, p.hint});
  }
  if (!problems.empty()) throw InputError(problems);
}

}  // namespace

ProjectResult verify_project(const LoadedProject& loaded, const VerifyOptions& options) {
  const Project& project = loaded.project;
  ProjectResult out;
  out.title = project.title;
  out.file = project.file;
  out.sha256 = loaded.sha256;
  out.warnings = loaded.warnings;
  out.risk_criteria = project.risk_criteria;
  out.shared_components = loaded.graph ? loaded.graph->shared_components() : PlantGraph(project).shared_components();
  // The risk analysis first: it sets each SIF's requirement and demand mode, which do not
  // depend on the SIF's own figures; then the SIFs; then the scenarios again with the SIFs'
  // computed PFDavg (or PFH) for the mitigated frequencies.
  LopaContext context = lopa_context_from_project(project);
  const auto requirements = lopa_requirements(project, out.warnings);
  refuse_mode_mismatches_from_lopa(project, requirements);
  // SIFs are independent once their requirements are known: verify them on every core, each
  // with its own warnings, and merge in project order so the output does not depend on threads.
  const std::size_t n = project.sifs.size();
  out.sifs.resize(n);
  std::vector<std::vector<Warning>> sif_warnings(n);
  ExactCache cache;
  parallel_for(n, options.threads, [&](std::size_t i) {
    const Sif& sif = project.sifs[i];
    auto it = requirements.find(sif.id);
    out.sifs[i] = verify_sif(project, sif, it == requirements.end() ? std::nullopt : std::optional(it->second), options,
                             sif_warnings[i], cache);
  });
  for (std::size_t i = 0; i < n; ++i) {
    const Sif& sif = project.sifs[i];
    out.warnings.insert(out.warnings.end(), sif_warnings[i].begin(), sif_warnings[i].end());
    cap_probabilities(sif, out.sifs[i], out.warnings);
    const SifResult& r = out.sifs[i];
    auto& figures = context.sifs[sif.id];
    figures.pfd_avg = r.pfd_avg;
    if (r.pfh_per_hour) figures.pfh = Rate{*r.pfh_per_hour};
    figures.credit = r.credit_pfd;
    figures.credit_capped = r.credit_capped;
  }
  if (options.samples > 0) {
    run_uncertainty(project, options, out);
    for (std::size_t i = 0; i < n; ++i) cap_probabilities(project.sifs[i], out.sifs[i], out.warnings);
  }
  if (!project.scenarios.empty()) {
    out.scenarios = evaluate_scenarios(project, context);
    out.shared_devices = shared_devices(project);
  }
  out.pressure = loaded.pressure;
  mark_preliminary(project, out);
  refuse_figures_beyond_finite(project, out);
  attach_sif_warnings(project, out.warnings, out.sifs);
  return out;
}

}  // namespace sifter
