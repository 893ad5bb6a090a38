// The Monte Carlo of one SIF on its uncertain failure data, on the resolved group models.
#include "sifter/analysis/sif_uncertainty.hpp"

#include "sifter/analysis/judge.hpp"
#include "sifter/analysis/verify.hpp"
#include "sifter/engines/group_model.hpp"

namespace sifter {
namespace {

// One subsystem as the sampler sees it: its resolved model, each channel's components with
// their stated rates, and the factor that carries the simplified form onto the judged figure.
struct SampledGroup {
  GroupData base;
  std::vector<std::vector<std::pair<std::size_t, FailureRates>>> channels;
  double scale = 1.0;        // judged figure / simplified form at the stated rates
  double fixed_value = 0.0;  // vendor figures
  bool vendor = false;
};

double group_value(const GroupData& g, bool low) { return low ? group_pfd_avg_value(g) : group_pfh(g).pfh_per_hour; }

// The group at one sample: every channel's own components scaled by their own sources' factors.
void sample_group(const SampledGroup& g, const UncertaintyPlan& plan, std::span<const double> factors, GroupData& out) {
  out = g.base;
  FailureRates mean;
  for (std::size_t i = 0; i < g.channels.size(); ++i) {
    FailureRates rates;
    for (const auto& [index, stated] : g.channels[i]) {
      const double f = factors.empty() ? 1.0 : component_factor(plan, factors, index);
      rates.lambda_du.per_hour += f * stated.lambda_du.per_hour;
      rates.lambda_dd.per_hour += f * stated.lambda_dd.per_hour;
      rates.lambda_su.per_hour += f * stated.lambda_su.per_hour;
      rates.lambda_sd.per_hour += f * stated.lambda_sd.per_hour;
    }
    out.channels[i] = rates;
    mean += rates;
  }
  const double n = static_cast<double>(g.channels.size());
  out.channel = FailureRates{Rate{mean.lambda_du.per_hour / n}, Rate{mean.lambda_dd.per_hour / n},
                             Rate{mean.lambda_su.per_hour / n}, Rate{mean.lambda_sd.per_hour / n}};
}

SampledGroup sampled_group(const Project& project, const Subsystem& sub, const SubsystemResult& verified, bool low) {
  SampledGroup g;
  if (sub.is_vendor()) {
    g.vendor = true;
    g.fixed_value = (low ? verified.pfd_avg : verified.pfh_per_hour).value_or(0.0);
    return g;
  }
  g.base = group_data_for(project, sub);
  g.base.channels.resize(sub.channels.size());  // every channel its own entry while sampling
  for (const auto& ch : sub.channels) {
    g.channels.emplace_back();
    for (auto c : ch.components) g.channels.back().emplace_back(c, project.components[c].rates);
  }
  GroupData stated;
  sample_group(g, UncertaintyPlan{}, {}, stated);  // no factors: the stated rates
  const double at_stated = group_value(stated, low);
  const std::optional<double> judged = low ? verified.pfd_avg : verified.pfh_per_hour;
  if (judged && at_stated > 0.0) g.scale = *judged / at_stated;
  return g;
}

}  // namespace

UncertaintyResult sif_uncertainty(const Project& project, const Sif& sif, const SifResult& verified,
                                  const UncertaintyPlan& plan, const MonteCarloOptions& options) {
  const bool low = verified.demand_mode == DemandMode::kLow;
  std::vector<SampledGroup> groups;
  for (std::size_t i = 0; i < sif.subsystems.size(); ++i)
    groups.push_back(sampled_group(project, sif.subsystems[i], verified.subsystems.at(i), low));
  // The SIF's judged figure may be its exact one (judged_figure.hpp): carry each sample onto it.
  double subsystem_sum = 0.0;
  for (const auto& s : verified.subsystems) subsystem_sum += (low ? s.pfd_avg : s.pfh_per_hour).value_or(0.0);
  const std::optional<double> judged = verified.judged_figure();
  const double sif_scale = judged && subsystem_sum > 0.0 ? *judged / subsystem_sum : 1.0;
  // Each sample takes the SIF's one verdict (sif_verdict): its figure judged against the
  // target, with the architecture, SC and stated requirements the point verdict rests on.
  const SifTarget target = recorded_target(verified);
  const VerdictBasis basis = verdict_basis(verified);
  MonteCarloOptions used = options;
  for (const auto& g : groups)
    for (const auto& ch : g.channels)
      for (const auto& [index, rates] : ch)
        if (index < plan.source_of_component.size() && plan.source_of_component[index] != kNoSource)
          used.sources.push_back(plan.source_of_component[index]);
  if (used.sources.empty()) used.sources.push_back(0);  // nothing uncertain: draw one pair, use none
  const auto evaluate = [&groups, &plan, low, sif_scale](std::span<const double> factors) {
    // Copy-assigning into a per-thread scratch reuses its storage: no allocation per sample.
    thread_local GroupData scratch;
    double total = 0.0;
    for (const auto& g : groups) {
      if (g.vendor) {
        total += g.fixed_value;
        continue;
      }
      sample_group(g, plan, factors, scratch);
      total += g.scale * group_value(scratch, low);
    }
    return sif_scale * total;
  };
  const UncertaintySummary s = run_monte_carlo(
      plan, used, evaluate, [&target, &basis](double v) { return sif_verdict(target, v, basis).value_or(false); });
  UncertaintyResult out;
  out.mean = s.mean;
  out.p05 = s.p05;
  out.p50 = s.p50;
  out.p95 = s.p95;
  out.probability_meets_target = s.probability_meets_target;
  out.samples = s.samples;
  out.method =
      "Monte Carlo: each channel's components scaled by their own sources' lognormal factors (stated rates "
      "as means; components of one library model share one factor), each group evaluated on its resolved "
      "model with the simplified form and carried onto its judged figure by the ratio at the stated rates; "
      "every sample judged by the SIF's one verdict (band edge, required value, architecture, SC and stated "
      "requirements)";
  return out;
}

}  // namespace sifter
