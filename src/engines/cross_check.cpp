// The exact cross-check of every SIF, and its PFD(t) curve.
#include "sifter/engines/cross_check.hpp"

#include <algorithm>
#include <cmath>
#include <cstdio>
#include <cstdlib>

#include "sifter/engines/lopa.hpp"
#include "sifter/model/diagnostics.hpp"
#include "sifter/model/format.hpp"

namespace sifter {
namespace {

// The exact measure comparable with the simplified PFH under the same assumption: IEC
// 61508-6:2010 B.3.3.2 takes a detected failure to the safe state, so only failures whose last
// is undetected count; with "alarm_only" every failure counts.
double comparable_pfh(const ExactGroupResult& g, bool alarm_only) {
  return alarm_only ? g.failure_frequency_per_hour : g.undetected_failure_frequency_per_hour;
}

// The figure as printed (three significant digits), so that a ratio matches the printed pair.
double as_printed(double v) {
  char buf[32];
  std::snprintf(buf, sizeof buf, "%.3g", v);
  return std::strtod(buf, nullptr);
}

// The bytes of every number that defines a group: equal keys, equal exact results.
void append_key(std::string& key, const ExactGroupInput& g) {
  auto put = [&key](double v) { key.append(reinterpret_cast<const char*>(&v), sizeof v); };
  put(g.vote.k);
  put(g.vote.n);
  put(g.vote.diagnostic ? 1 : 0);
  for (const auto& c : g.channels) {
    put(c.lambda_du.per_hour);
    put(c.lambda_dd.per_hour);
    put(c.lambda_su.per_hour);
    put(c.lambda_sd.per_hour);
  }
  for (double v :
       {g.beta, g.beta_d, g.proof_test_interval.hours, g.mttr.hours, g.mrt.hours, g.proof_test_coverage,
        g.mission_time.hours, g.partial_stroke ? g.partial_stroke->interval.hours : -1.0,
        g.partial_stroke ? g.partial_stroke->coverage : -1.0, g.test_duration ? g.test_duration->hours : -1.0,
        g.staggered ? 1.0 : 0.0, g.track_each_channel ? 1.0 : 0.0})
    put(v);
  key += '|';
}

// Whether the mission is a whole number of every modelled group's proof-test interval.
bool mission_whole_intervals(const Project& project, const Sif& sif) {
  for (const auto& sub : sif.subsystems) {
    if (sub.is_vendor() || !(sub.proof_test_interval.hours > 0.0)) continue;
    const double n = project.defaults.mission_time.hours / sub.proof_test_interval.hours;
    if (std::abs(n - std::round(n)) > 1e-6 * std::max(1.0, n)) return false;
  }
  return true;
}

}  // namespace

std::shared_ptr<const SifExactResult> ExactCache::get(const std::vector<ExactGroupInput>& groups) {
  std::string key;
  for (const auto& g : groups) append_key(key, g);
  {
    std::lock_guard<std::mutex> lock(mutex_);
    if (auto it = results_.find(key); it != results_.end()) return it->second;
  }
  // Computed outside the lock; two threads may both compute a new key, and both get the same value.
  auto result = std::make_shared<const SifExactResult>(sif_exact(groups));
  std::lock_guard<std::mutex> lock(mutex_);
  return results_.emplace(std::move(key), std::move(result)).first->second;
}

std::vector<std::optional<ExactGroupInput>> exact_inputs(const Project& project, const Sif& sif) {
  std::vector<std::optional<ExactGroupInput>> out;
  for (const auto& sub : sif.subsystems) {
    if (sub.is_vendor()) {
      out.emplace_back();
      continue;
    }
    out.emplace_back(exact_group_input(sub, project.components, project.defaults.mission_time));
  }
  return out;
}

namespace {

// The groups the exact engine models and the vendor figures, constant in time, beside them.
struct ExactSplit {
  std::vector<ExactGroupInput> modelled;
  double vendor_constant = 0.0;  // PFD (PFH) of the vendor figures
  bool supported = true;         // false when a group cannot be modelled (named in the assumptions)
};

ExactSplit split_for_exact(const std::vector<std::optional<ExactGroupInput>>& inputs, SifResult& r, bool low) {
  ExactSplit split;
  for (std::size_t i = 0; i < inputs.size(); ++i) {
    const auto& sub = r.subsystems[i];
    if (!inputs[i]) {
      split.vendor_constant += low ? sub.pfd_avg.value_or(0.0) : sub.pfh_per_hour.value_or(0.0);
      continue;
    }
    const std::string why = exact_group_unsupported(*inputs[i]);
    if (!why.empty()) {
      r.assumptions.push_back(sub.name + ": no exact cross-check (" + why + ")");
      split.supported = false;
      return split;
    }
    split.modelled.push_back(*inputs[i]);
  }
  return split;
}

// Each modelled subsystem's exact figure and the exact engine's notes on it.
void record_group_figures(const Sif& sif, const std::vector<std::optional<ExactGroupInput>>& inputs,
                          const SifExactResult& exact, bool low, SifResult& r) {
  std::size_t k = 0;
  for (std::size_t i = 0; i < inputs.size(); ++i) {
    if (!inputs[i]) continue;
    auto& sub = r.subsystems[i];
    const ExactGroupResult& g = exact.groups[k++];
    if (low)
      sub.pfd_avg_exact = g.pfd_avg;
    else
      sub.pfh_exact_per_hour = comparable_pfh(g, sif.subsystems[i].alarm_only_on_detected);
    for (const auto& note : g.notes) r.assumptions.push_back(sub.name + " (exact engine): " + note);
  }
}

// The SIF's exact value: the product form of the modelled groups, with the vendor figures
// as constants: 1 - (1 - u_vendor)(1 - P(t)) averages to 1 - (1 - u_vendor)(1 - avg P).
double record_sif_figure(const SifExactResult& exact, double vendor_constant, bool low, SifResult& r) {
  double sif_exact_value = 0.0;
  if (low) {
    sif_exact_value = 1.0 - (1.0 - vendor_constant) * (1.0 - exact.pfd_avg);
    r.pfd_avg_exact = sif_exact_value;
  } else {
    // Subsystems in series: their failure frequencies add (each under its own assumption).
    for (const auto& sub : r.subsystems) sif_exact_value += sub.pfh_exact_per_hour.value_or(0.0);
    sif_exact_value += vendor_constant;
    r.pfh_exact_per_hour = sif_exact_value;
  }
  return sif_exact_value;
}

// The ratio in the assumptions, and a warning where the simplified figure is non-conservative
// or far from the exact one.
void judge_agreement(const Project& project, const Sif& sif, double ratio, bool low, SifResult& r,
                     std::vector<Warning>& warnings) {
  const bool whole = mission_whole_intervals(project, sif);
  r.assumptions.push_back(
      std::string("exact cross-check: multi-phase Markov model over the mission of ") +
      format_duration(project.defaults.mission_time) +
      (whole ? "" : " (not a whole number of proof-test intervals: the last interval is cut short)") +
      "; simplified/exact = " + sifter::ratio(ratio));
  if (ratio < 1.0 - kNonConservativeTolerance)
    warnings.push_back(
        {sif.pointer,
         "the simplified " + std::string(low ? "PFDavg" : "PFH") + " is " + sifter::percent(1.0 - ratio) +
             " below the exact value (non-conservative); the verdict rests on the exact figure unless the project's "
             "\"judge_on\" says otherwise"});
  else if (std::abs(ratio - 1.0) > kDisagreementTolerance)
    warnings.push_back({sif.pointer, "the simplified and exact " + std::string(low ? "PFDavg" : "PFH") + " differ by " +
                                         sifter::percent(std::abs(ratio - 1.0)) +
                                         " (simplified/exact = " + sifter::ratio(ratio) + ")"});
}

}  // namespace

void apply_exact_cross_check(const Project& project, const Sif& sif, SifResult& r, std::vector<Warning>& warnings,
                             ExactCache& cache) {
  const bool low = r.demand_mode == DemandMode::kLow;
  const auto inputs = exact_inputs(project, sif);
  const ExactSplit split = split_for_exact(inputs, r, low);
  if (!split.supported || split.modelled.empty()) return;
  const auto exact = cache.get(split.modelled);
  record_group_figures(sif, inputs, *exact, low, r);
  const double sif_exact_value = record_sif_figure(*exact, split.vendor_constant, low, r);
  const std::optional<double> simplified = low ? r.pfd_avg_simplified : r.pfh_simplified_per_hour;
  if (!simplified || !(sif_exact_value > 0.0)) return;
  // From the two figures as printed, so that the ratio reads as the printed pair gives.
  const double ratio = as_printed(*simplified) / as_printed(sif_exact_value);
  r.simplified_over_exact = ratio;
  judge_agreement(project, sif, ratio, low, r, warnings);
}

PfdPlot exact_curve(const Project& project, const Sif& sif, int points) {
  const auto inputs = exact_inputs(project, sif);
  std::vector<ExactGroupInput> modelled;
  std::vector<double> vendor;  // constant PFD per vendor subsystem
  for (std::size_t i = 0; i < inputs.size(); ++i) {
    if (!inputs[i]) {
      vendor.push_back(sif.subsystems[i].vendor_pfd_avg.value_or(0.0));
      continue;
    }
    const std::string why = exact_group_unsupported(*inputs[i]);
    if (!why.empty())
      throw UsageError("the exact engine cannot model subsystem \"" + sif.subsystems[i].name + "\": " + why);
    modelled.push_back(*inputs[i]);
  }
  PfdPlot c;
  c.engine =
      "exact multi-phase Markov model of every group (matrix exponential; Van Loan's form for the "
      "integrals); PFD_SIF(t) = 1 - prod(1 - PFD_i(t))";
  if (modelled.empty()) throw UsageError("SIF " + sif.id + " has only vendor figures: its PFD is constant");
  const SifExactResult exact = sif_curve(modelled, points);
  c.t_hours = exact.curve.time_hours;
  double vendor_total = 0.0;
  for (double v : vendor) vendor_total += v;
  for (double p : exact.curve.pfd) c.pfd_sif.push_back(1.0 - (1.0 - vendor_total) * (1.0 - p));
  std::size_t k = 0, v = 0;
  for (std::size_t i = 0; i < inputs.size(); ++i) {
    c.subsystem_names.push_back(sif.subsystems[i].name);
    if (!inputs[i])
      c.pfd_subsystems.emplace_back(c.t_hours.size(), vendor[v++]);
    else
      c.pfd_subsystems.push_back(exact.groups[k++].curve.pfd);
  }
  c.pfd_avg = 1.0 - (1.0 - vendor_total) * (1.0 - exact.pfd_avg);
  return c;
}

}  // namespace sifter
