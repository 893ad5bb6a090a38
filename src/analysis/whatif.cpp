// What-ifs on one SIF: the shared machinery and the longest proof-test interval.
#include "sifter/analysis/whatif.hpp"

#include <algorithm>
#include <boost/math/tools/toms748_solve.hpp>
#include <cmath>
#include <cstdio>

#include "analysis/whatif_parts.hpp"
#include "sifter/engines/sil.hpp"
#include "sifter/model/format.hpp"

namespace sifter {

namespace detail {

std::string quoted_name(const std::string& name) { return "'" + name + "'"; }

std::vector<std::size_t> subsystems_to_vary(const Sif& sif, std::optional<std::size_t> subsystem,
                                            const std::string& what) {
  if (subsystem) {
    if (sif.subsystems[*subsystem].is_vendor())
      throw UsageError("subsystem " + quoted_name(sif.subsystems[*subsystem].name) + " of " + sif.id +
                       " is a figure from the safety manual; it has no " + what + " to change");
    return {*subsystem};
  }
  std::vector<std::size_t> out;
  for (std::size_t i = 0; i < sif.subsystems.size(); ++i)
    if (!sif.subsystems[i].is_vendor()) out.push_back(i);
  if (out.empty())
    throw UsageError(sif.id + " has only figures from safety manuals; there is no " + what + " to change");
  return out;
}

std::string derived_component_id(const Project& project, const std::string& base) {
  for (int n = 2;; ++n) {
    std::string id = base + "~" + std::to_string(n);
    const bool taken = std::any_of(project.components.begin(), project.components.end(),
                                   [&](const Component& c) { return c.id == id; });
    if (!taken) return id;
  }
}

std::size_t copy_component(Project& project, std::size_t index) {
  Component copy = project.components[index];
  copy.id = derived_component_id(project, copy.id);
  copy.pointer = "(copy of " + copy.pointer + ")";
  project.components.push_back(std::move(copy));
  return project.components.size() - 1;
}

void copy_components_of(Project& project, Subsystem& subsystem) {
  for (auto& channel : subsystem.channels)
    for (std::size_t i = 0; i < channel.components.size(); ++i) {
      channel.components[i] = copy_component(project, channel.components[i]);
      channel.component_ids[i] = project.components[channel.components[i]].id;
    }
}

}  // namespace detail

WhatIf::WhatIf(Project project) : project_(std::move(project)) {
  std::vector<Warning> ignored;  // check reports them; a what-if does not repeat them
  requirements_ = lopa_requirements(project_, ignored);
}

SifResult WhatIf::verify_variant(const Sif& variant) const {
  auto it = requirements_.find(variant.id);
  std::vector<Warning> ignored;
  VerifyOptions options;  // as verify(): check's options on one thread
  options.threads = 1;
  SifResult r = verify_sif(project_, variant, it == requirements_.end() ? std::nullopt : std::optional(it->second),
                           options, ignored);
  return r;
}

SifResult WhatIf::verify(const Project& modified, std::size_t sif) const {
  const Sif& s = modified.sifs.at(sif);
  auto it = requirements_.find(s.id);
  std::vector<Warning> ignored;
  // The same options as check: the exact engine runs, so that the judged figure, and so every
  // answer, is the one check gives (groups of different channels are judged on it).
  VerifyOptions options;
  options.threads = 1;
  SifResult r =
      verify_sif(modified, s, it == requirements_.end() ? std::nullopt : std::optional(it->second), options, ignored);
  return r;
}

namespace {

// What the interval solver holds against the allowed value: the SIF's figure, or the sum above
// 1 that the judge never passes (the figure shown as 1 would meet a required PFD of 1).
std::optional<double> solver_measure(const SifResult& r) {
  return r.judged_sum_above_one ? r.judged_sum_above_one : r.judged_figure();
}

}  // namespace

std::optional<Requirement> governing_requirement(const SifResult& r) {
  Requirement q;
  q.mode = r.demand_mode;
  const bool low = q.mode == DemandMode::kLow;
  const std::optional<double> value = low ? r.required_pfd : r.required_pfh_per_hour;
  const char* measure = low ? "PFDavg" : "PFH";
  const char* unit = low ? "" : "/h";
  if (value) {
    q.value = *value;
    q.basis = std::string("required ") + measure + " " + sifter::figure(*value) + unit;
  }
  if (r.sil_required && *r.sil_required > 0) {
    const double edge = sil_upper_limit(*r.sil_required, q.mode);
    if (!value || edge <= *value) {
      q.value = edge;
      q.band_edge = true;
      q.basis =
          "SIL " + std::to_string(*r.sil_required) + " band (" + measure + " < " + sifter::figure(edge) + unit + ")";
    }
  }
  if (!value && !q.band_edge) return std::nullopt;
  return q;
}

namespace {

// Half-open bands: a value within kEdgeRelTol of the edge reads as the edge itself (sil.hpp),
// so the answer must stay that far inside.
double allowed_for_solver(const Requirement& q, double allowed) {
  return q.band_edge ? allowed * (1.0 - 2.0 * kEdgeRelTol) : allowed;
}

}  // namespace

namespace {

// Brackets the root of measure(T) - allowed on [0, mission] and solves it; fills the outcome,
// the longest interval and the whole months. The figure is increasing in T.
template <typename Measure>
void solve_interval(IntervalResult& out, const Measure& measure_at, double allowed) {
  const double top = out.mission.hours;
  out.measure_at_zero = measure_at(0.0);
  const double at_top = measure_at(top);
  const char* m = out.requirement.mode == DemandMode::kLow ? "PFDavg" : "PFH";
  if (out.requirement.mode == DemandMode::kLow && out.measure_at_zero > 1.0) {
    // A sum above 1 over the subsystems (solver_measure): shown as 1, never a pass.
    out.outcome = IntervalOutcome::kNone;
    out.notes.push_back("even with an interval of zero the subsystems' PFDavg sum to " +
                        sifter::figure(out.measure_at_zero) +
                        ", outside the validity of the rare-event sum (shown as 1): the SIF is judged short "
                        "whatever the interval");
    out.measure_at_zero = 1.0;
    return;
  }
  if (out.measure_at_zero > allowed) {
    out.outcome = IntervalOutcome::kNone;
    out.notes.push_back("even with an interval of zero the SIF's " + std::string(m) + " is " +
                        sifter::figure(out.measure_at_zero) +
                        ": the terms the proof-test interval does not touch (detected failures and MTTR, repair "
                        "times, failures the proof test misses, common cause in high demand, the other subsystems) "
                        "already exceed " +
                        sifter::figure(out.allowed));
    return;
  }
  if (at_top <= allowed) {
    out.outcome = IntervalOutcome::kWholeMission;
    out.longest = out.mission;
    out.measure_at_longest = at_top;
    out.notes.push_back("every interval up to the mission time (" + format_duration(out.mission) + ") meets it");
  } else {
    boost::uintmax_t iterations = 200;
    auto excess = [&](double hours) { return measure_at(hours) - allowed; };
    const auto bracket =
        boost::math::tools::toms748_solve(excess, 0.0, top, out.measure_at_zero - allowed, at_top - allowed,
                                          boost::math::tools::eps_tolerance<double>(40), iterations);
    // The lower end of the bracket is on the side that meets the requirement.
    out.outcome = IntervalOutcome::kFound;
    out.longest = Duration{bracket.first};
    out.measure_at_longest = measure_at(bracket.first);
    out.notes.push_back("solved on the equations of check (Boost.Math TOMS 748, " + std::to_string(iterations) +
                        (iterations == 1 ? " step)" : " steps)"));
  }
  int months = static_cast<int>(std::floor(out.longest.hours / kHoursPerMonth * (1.0 + 1e-12)));
  while (months > 0 && measure_at(months * kHoursPerMonth) > allowed) --months;
  out.whole_months = months;
  if (months > 0) out.measure_at_whole_months = measure_at(months * kHoursPerMonth);
}

// What the interval does not change, said next to the answer.
void add_context_notes(IntervalResult& out, const Sif& s, const SifResult& now) {
  if (out.varied.size() > 1) out.notes.push_back("every subsystem listed is given the same interval, tested together");
  for (const auto& sub : s.subsystems)
    if (sub.is_vendor())
      out.notes.push_back(detail::quoted_name(sub.name) +
                          " is a figure from the safety manual; its own test interval applies");
  const int required = now.sil_required.value_or(0);
  if (now.sil_architecture < required || now.sil_systematic < required)
    out.notes.push_back("the architecture or systematic capability still falls short of SIL " +
                        std::to_string(required) + "; no proof-test interval changes that");
}

}  // namespace

IntervalResult longest_proof_test_interval(const WhatIf& what_if, std::size_t sif, std::optional<std::size_t> subsystem,
                                           double margin) {
  const Project& base = what_if.project();
  const Sif& s = base.sifs.at(sif);
  if (!(margin >= 0.0 && margin < 1.0)) throw UsageError("the margin must be a fraction from 0 to below 1");
  const std::vector<std::size_t> vary = detail::subsystems_to_vary(s, subsystem, "proof-test interval");
  const SifResult now = what_if.baseline(sif);
  const auto requirement = governing_requirement(now);
  if (!requirement)
    throw UsageError(s.id + " has no target and no scenario that credits it; there is no requirement to solve against");
  const auto measure_now = now.judged_figure();  // as shown; the solver measures solver_measure
  if (!measure_now) throw UsageError(s.id + " cannot be verified (a supplier figure is missing for its demand mode)");

  IntervalResult out;
  out.sif = s.id;
  if (subsystem) out.subsystem = s.subsystems[*subsystem].name;
  for (auto i : vary) {
    out.varied.push_back(s.subsystems[i].name);
    out.current_intervals.push_back(s.subsystems[i].proof_test_interval);
  }
  out.requirement = *requirement;
  out.margin = margin;
  out.allowed = requirement->value * (1.0 - margin);
  out.measure_now = *measure_now;
  out.mission = base.defaults.mission_time;
  Sif variant = s;  // only this SIF's intervals change: the project is not copied per step
  auto measure_at = [&](double hours) {
    for (auto i : vary) variant.subsystems[i].proof_test_interval = Duration{hours};
    return solver_measure(what_if.verify_variant(variant)).value_or(0.0);
  };
  solve_interval(out, measure_at, allowed_for_solver(*requirement, out.allowed));
  add_context_notes(out, s, now);
  return out;
}

}  // namespace sifter
