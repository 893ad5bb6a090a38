// The Monte Carlo of one SIF on its uncertain failure data.
#include "sifter/sif_uncertainty.hpp"

#include "sifter/sil.hpp"
#include "sifter/verify.hpp"

namespace sifter {
namespace {

// One subsystem as the sampler sees it: the base group data and, per component of one
// channel, its stated rates (the channels of a group are identical copies).
struct SampledGroup {
  GroupData base;
  std::vector<std::pair<std::size_t, FailureRates>> channel_components;
  double fixed_value = 0.0;  // vendor figures
  bool vendor = false;
};

}  // namespace

UncertaintyResult sif_uncertainty(const Project& project, const Sif& sif, const SifResult& verified,
                                  const UncertaintyPlan& plan, const MonteCarloOptions& options) {
  const bool low = verified.demand_mode == DemandMode::kLow;
  std::vector<SampledGroup> groups;
  for (std::size_t i = 0; i < sif.subsystems.size(); ++i) {
    const Subsystem& sub = sif.subsystems[i];
    SampledGroup g;
    if (sub.is_vendor()) {
      g.vendor = true;
      g.fixed_value = low ? verified.subsystems[i].pfd_avg.value_or(0.0) : verified.subsystems[i].pfh_per_hour.value_or(0.0);
    } else {
      g.base = group_data_for(project, sub);
      for (auto c : sub.channels.front().components) g.channel_components.emplace_back(c, project.components[c].rates);
    }
    groups.push_back(std::move(g));
  }
  const double required = low ? verified.required_pfd.value_or(sil_upper_limit(verified.sil_required.value_or(0), DemandMode::kLow))
                              : verified.required_pfh_per_hour.value_or(
                                    sil_upper_limit(verified.sil_required.value_or(0), DemandMode::kHigh));
  MonteCarloOptions used = options;
  for (const auto& g : groups)
    for (const auto& [index, rates] : g.channel_components)
      if (index < plan.source_of_component.size() && plan.source_of_component[index] != kNoSource)
        used.sources.push_back(plan.source_of_component[index]);
  if (used.sources.empty()) used.sources.push_back(0);  // nothing uncertain: draw one pair, use none
  const auto evaluate = [&groups, &plan, low](std::span<const double> factors) {
    // Copy-assigning into a per-thread scratch reuses its storage: no allocation per sample.
    thread_local GroupData scratch;
    double total = 0.0;
    for (const auto& g : groups) {
      if (g.vendor) {
        total += g.fixed_value;
        continue;
      }
      scratch = g.base;
      scratch.channel = FailureRates{};
      for (const auto& [index, rates] : g.channel_components) {
        const double f = component_factor(plan, factors, index);
        scratch.channel.lambda_du.per_hour += f * rates.lambda_du.per_hour;
        scratch.channel.lambda_dd.per_hour += f * rates.lambda_dd.per_hour;
        scratch.channel.lambda_su.per_hour += f * rates.lambda_su.per_hour;
        scratch.channel.lambda_sd.per_hour += f * rates.lambda_sd.per_hour;
      }
      total += low ? group_pfd_avg_value(scratch) : group_pfh(scratch).pfh_per_hour;
    }
    return total;
  };
  const UncertaintySummary s = run_monte_carlo(plan, used, evaluate, required);
  UncertaintyResult out;
  out.mean = s.mean;
  out.p05 = s.p05;
  out.p50 = s.p50;
  out.p95 = s.p95;
  out.probability_meets_target = s.probability_meets_target;
  out.samples = s.samples;
  out.method = "Monte Carlo on the IEC 61508-6 Annex B simplified equations; lognormal factors with the stated "
               "rates as means; components of one library model share one factor (state-of-knowledge dependence)";
  return out;
}

}  // namespace sifter
