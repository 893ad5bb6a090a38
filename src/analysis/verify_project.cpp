// The whole project: the LOPA's requirements, every SIF in parallel, the Monte Carlo and the
// scenarios with the SIFs' figures.
#include <algorithm>
#include <atomic>
#include <cstdio>
#include <map>
#include <mutex>
#include <thread>

#include "sifter/analysis/judge.hpp"
#include "sifter/analysis/maturity.hpp"
#include "sifter/analysis/sif_uncertainty.hpp"
#include "sifter/analysis/verify.hpp"
#include "sifter/engines/cross_check.hpp"
#include "sifter/engines/probability_cap.hpp"
#include "sifter/engines/uncertainty.hpp"
#include "sifter/graph/plant_graph.hpp"
#include "sifter/input/plausibility.hpp"
#include "sifter/model/cores.hpp"
#include "sifter/model/format.hpp"

namespace sifter {

bool ProjectResult::all_met() const {
  for (const auto& s : sifs)
    if (s.meets_target.has_value() && !*s.meets_target) return false;
  for (const auto& s : scenarios)
    if (s.meets_target.has_value() && !*s.meets_target) return false;
  return true;
}

namespace {

// What the risk analysis asks of each SIF, from the scenarios that credit it.
std::map<std::string, SifRequirement> requirements_from(const std::vector<ScenarioResult>& scenarios,
                                                        std::vector<Warning>& warnings) {
  std::map<std::string, SifRequirement> out;
  for (auto& req : sif_requirements(scenarios)) {
    for (const auto& f : req.findings) warnings.push_back({req.sif, to_string(f.kind) + ": " + f.message});
    std::string id = req.sif;
    out.emplace(std::move(id), std::move(req));
  }
  return out;
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
    const CapFindings capped = cap_uncertainty(r);
    if (capped.defect) {  // the one verdict again: no verdict rests on a defective figure
      declare_defective(r);
      apply_credit(r);
      r.meets_target = sif_verdict(recorded_target(r), r.judged_figure(), verdict_basis(r));
    }
    say_findings(project.sifs[i], capped, r, out.warnings);
    // Only a SIF that meets otherwise: then every sample's verdict is its figure's judgement,
    // and P(meets target) is the confidence Route 2H asks of the target failure measure.
    if (r.constraints == ConstraintBasis::kRoute2H && r.meets_target.value_or(false) &&
        r.uncertainty->probability_meets_target < kRoute2hMinConfidence) {
      // The one verdict again, now with the Monte Carlo's confidence (it is below 90 %: short).
      r.meets_target =
          sif_verdict(recorded_target(r), r.judged_figure(), verdict_basis(r, r.uncertainty->probability_meets_target));
      r.limits.push_back({"probability", std::nullopt, std::nullopt, r.sil_probability,
                          "Route 2H asks for at least 90% confidence that the target failure measure is met "
                          "(IEC 61508-2:2010 7.4.4.3.1); the Monte Carlo gives " +
                              sifter::figure(100.0 * r.uncertainty->probability_meets_target) +
                              "%. To lift it: better-founded failure data (a smaller error factor) or more margin."});
    }
  }
}

// The scenarios are independent of each other once the context is set: evaluated on every core
// (or `threads`), each into its own place, so the results keep the project's order.
std::vector<ScenarioResult> evaluate_scenarios_on_cores(const Project& project, const LopaContext& context,
                                                        int threads) {
  std::vector<ScenarioResult> out(project.scenarios.size());
  parallel_for(out.size(), threads,
               [&](std::size_t i) { out[i] = evaluate_scenario(project, project.scenarios[i], context); });
  return out;
}

std::map<std::string, SifRequirement> lopa_requirements_on_cores(const Project& project, std::vector<Warning>& warnings,
                                                                 int threads) {
  if (project.scenarios.empty()) return {};
  LopaContext context = lopa_context_from_project(project);
  context.assumptions = false;  // this pass only sets the requirements
  context.worksheet = false;
  return requirements_from(evaluate_scenarios_on_cores(project, context, threads), warnings);
}

}  // namespace

std::map<std::string, SifRequirement> lopa_requirements(const Project& project, std::vector<Warning>& warnings) {
  return lopa_requirements_on_cores(project, warnings, 0);
}

namespace {

// A SIF without a stated mode takes it from the LOPA; its supplier figures and target must be
// of that mode (the loader checked SIFs whose mode is stated or assumed).
void refuse_mode_mismatches_from_lopa(const Project& project,
                                      const std::map<std::string, SifRequirement>& requirements) {
  std::vector<Diagnostic> problems;
  for (const auto& sif : project.sifs) {
    auto it = requirements.find(sif.id);
    if (sif.demand_mode_stated || it == requirements.end()) continue;
    for (const auto& p : demand_mode_mismatches(sif, it->second.demand_mode, demand_basis(it->second)))
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
  out.shared_components =
      loaded.shared_components ? *loaded.shared_components : PlantGraph(project).shared_components();
  // The risk analysis first: it sets each SIF's requirement and demand mode, which do not
  // depend on the SIF's own figures; then the SIFs; then the scenarios again with the SIFs'
  // computed PFDavg (or PFH) for the mitigated frequencies.
  LopaContext context = lopa_context_from_project(project);
  const auto requirements = lopa_requirements_on_cores(project, out.warnings, options.threads);
  refuse_mode_mismatches_from_lopa(project, requirements);
  // SIFs are independent once their requirements are known: verify them on every core, each
  // with its own warnings, and merge in project order so the output does not depend on threads.
  const std::size_t n = project.sifs.size();
  out.sifs.resize(n);
  std::vector<std::vector<Warning>> sif_warnings(n);
  ExactCache cache;
  TextPool assumptions;  // a register's SIFs state a few dozen distinct assumptions between them
  parallel_for(n, options.threads, [&](std::size_t i) {
    const Sif& sif = project.sifs[i];
    auto it = requirements.find(sif.id);
    out.sifs[i] = verify_sif(project, sif, it == requirements.end() ? std::nullopt : std::optional(it->second), options,
                             sif_warnings[i], cache);
    assumptions.share(out.sifs[i].assumptions);
  });
  for (std::size_t i = 0; i < n; ++i)
    out.warnings.insert(out.warnings.end(), sif_warnings[i].begin(), sif_warnings[i].end());
  if (options.samples > 0) run_uncertainty(project, options, out);
  // The scenarios take each SIF's figures and credit as they stand after the Monte Carlo, which
  // may find a figure only a defect explains and withdraw the credit.
  for (std::size_t i = 0; i < n; ++i) {
    const SifResult& r = out.sifs[i];
    auto& figures = context.sifs[project.sifs[i].id];
    figures.pfd_avg = r.pfd_avg;
    if (r.pfh_per_hour) figures.pfh = Rate{*r.pfh_per_hour};
    figures.credit = r.credit_pfd;
    figures.credit_capped = r.credit_capped;
  }
  if (!project.scenarios.empty()) {
    context.worksheet = options.worksheet_rows;
    out.scenarios = evaluate_scenarios_on_cores(project, context, options.threads);
    out.shared_devices = shared_devices(project);  // who shares which device: no figure needed
  }
  out.pressure = loaded.pressure;
  mark_preliminary(project, out);
  refuse_figures_beyond_finite(project, out);
  attach_sif_warnings(project, out.warnings, out.sifs);
  return out;
}

}  // namespace sifter
