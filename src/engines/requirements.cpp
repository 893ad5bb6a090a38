// A SIF's stated requirements against its computed figures.
#include "sifter/engines/requirements.hpp"

#include <algorithm>
#include <cstdio>

#include "sifter/engines/constraints.hpp"
#include "sifter/engines/sil.hpp"
#include "sifter/model/format.hpp"
#include "sifter/model/quantity.hpp"

namespace sifter {
namespace {

ResponseTimeStep step_of(const Project& project, const Subsystem& sub) {
  ResponseTimeStep step;
  step.subsystem = sub.name;
  if (sub.response_time) {
    step.seconds = sub.response_time->hours * kSecondsPerHour;
    step.stated_on_subsystem = true;
    return step;
  }
  if (sub.channels.empty()) {
    step.missing.push_back(sub.name);  // a vendor figure: only the subsystem can state it
    return step;
  }
  // A voting group acts when its slowest needed channel has acted; taking the slowest of all
  // channels is the conservative reading for any KooN (common practice).
  std::optional<double> slowest;
  for (const auto& ch : sub.channels) {
    double sum = 0.0;
    std::vector<std::string> path;
    std::vector<double> times;
    bool complete = true;
    for (auto c : ch.components) {
      const Component& comp = project.components[c];
      if (!comp.response_time) {
        complete = false;
        if (std::find(step.missing.begin(), step.missing.end(), comp.id) == step.missing.end())
          step.missing.push_back(comp.id);
        continue;
      }
      const double s = comp.response_time->hours * kSecondsPerHour;
      sum += s;  // elements of a channel act one after the other
      path.push_back(comp.id);
      times.push_back(s);
    }
    if (complete && (!slowest || sum > *slowest)) {
      slowest = sum;
      step.path = std::move(path);
      step.path_seconds = std::move(times);
    }
  }
  if (step.missing.empty()) step.seconds = slowest;
  return step;
}

// The element with the largest own time on the governing paths, with its subsystem.
std::pair<std::string, std::string> slowest_element(const std::vector<ResponseTimeStep>& budget) {
  std::pair<std::string, std::string> out;
  double longest = -1.0;
  for (const auto& step : budget) {
    if (step.stated_on_subsystem && step.seconds && *step.seconds > longest) {
      longest = *step.seconds;
      out = {step.subsystem, ""};
    }
    for (std::size_t i = 0; i < step.path.size(); ++i)
      if (step.path_seconds[i] > longest) {
        longest = step.path_seconds[i];
        out = {step.subsystem, step.path[i]};
      }
  }
  return out;
}

void check_response_time(const SifRequirements& q, SifResult& r, std::vector<Limit>& limits) {
  if (!q.process_safety_time || !r.response_time_s) return;
  const double pst = q.process_safety_time->hours * kSecondsPerHour;
  const double limit = q.response_time_fraction * pst;
  r.response_time_limit_s = limit;
  const double t = *r.response_time_s;
  RequirementCheck c;
  c.check = "response_time_s";
  c.value = t;
  c.limit = limit;
  c.ok = at_most(t, limit);
  const std::string share = sifter::figure(100.0 * q.response_time_fraction) + "% of the process safety time " +
                            format_seconds(pst) +
                            (q.response_time_fraction_stated ? "" : ", the common-practice share when none is stated");
  c.message = "response time " + format_seconds(t) + (c.ok ? " within " : " exceeds ") + "the allowed " +
              format_seconds(limit) + " (" + share + ")";
  if (!c.ok) {
    const auto [subsystem, element] = slowest_element(r.response_budget);
    const std::string who = element.empty() ? "subsystem '" + subsystem + "'" : element + " in '" + subsystem + "'";
    c.message += "; the slowest element is " + who;
    limits.push_back({"response time", subsystem, element.empty() ? std::nullopt : std::optional(element), 0,
                      "The SIF takes " + format_seconds(t) + " to act, more than the allowed " + format_seconds(limit) +
                          " (" + share + "); the slowest element is " + who +
                          ". To lift it: a faster element there, a shorter signal path, or a process safety time "
                          "confirmed longer by the process design."});
  }
  r.requirement_checks.push_back(std::move(c));
}

void check_spurious(const Project& project, const Sif& sif, const SifRequirements& q, SifResult& r,
                    std::vector<Limit>& limits) {
  if (!q.max_spurious_trip_rate) return;
  RequirementCheck c;
  c.check = "spurious_trip_rate_per_yr";
  c.value = r.spurious_trip_rate_per_yr;
  c.limit = q.max_spurious_trip_rate->per_year();
  c.ok = at_most(c.value, c.limit);
  c.message = "spurious trip rate " + sifter::figure(c.value) + "/yr " + (c.ok ? "within" : "above") + " the limit " +
              sifter::figure(c.limit) + "/yr";
  if (!c.ok && !r.subsystems.empty()) {
    const auto largest = std::max_element(r.subsystems.begin(), r.subsystems.end(), [](const auto& a, const auto& b) {
      return a.spurious_trip_rate_per_yr < b.spurious_trip_rate_per_yr;
    });
    const std::size_t i = static_cast<std::size_t>(largest - r.subsystems.begin());
    // Within it, the element whose safe failures are most frequent.
    std::optional<std::string> element;
    double most = -1.0;
    if (i < sif.subsystems.size())
      for (const auto& ch : sif.subsystems[i].channels)
        for (auto k : ch.components)
          if (project.components[k].rates.lambda_s() > most) {
            most = project.components[k].rates.lambda_s();
            element = project.components[k].id;
          }
    c.message += "; the largest contributor is '" + largest->name + "' (" +
                 sifter::figure(largest->spurious_trip_rate_per_yr) + "/yr)";
    limits.push_back({"spurious trips", largest->name, element, 0,
                      "The SIF trips without a demand " + sifter::figure(c.value) + " times a year, more than the " +
                          sifter::figure(c.limit) + "/yr allowed; the largest contributor is '" + largest->name +
                          "' (" + sifter::figure(largest->spurious_trip_rate_per_yr) + "/yr" +
                          (element ? ", most of it " + *element : "") +
                          "). To lift it: a voting that needs two channels to trip (2oo2, 2oo3) or elements with "
                          "fewer safe failures there."});
  }
  r.requirement_checks.push_back(std::move(c));
}

void check_interval(const Sif& sif, const SifRequirements& q, SifResult& r, std::vector<Limit>& limits) {
  if (!q.proof_test_interval) return;
  const Subsystem* longest = nullptr;
  for (const auto& sub : sif.subsystems)
    if (!sub.is_vendor() && (!longest || sub.proof_test_interval.hours > longest->proof_test_interval.hours))
      longest = &sub;
  if (!longest) return;
  RequirementCheck c;
  c.check = "proof_test_interval_h";
  c.value = longest->proof_test_interval.hours;
  c.limit = q.proof_test_interval->hours;
  c.ok = at_most(c.value, c.limit);
  c.message = "longest proof-test interval " + format_duration(longest->proof_test_interval) + " ('" + longest->name +
              "') " + (c.ok ? "within" : "longer than") + " the required " + format_duration(*q.proof_test_interval);
  if (!c.ok)
    limits.push_back({"proof-test interval", longest->name, std::nullopt, 0,
                      "Subsystem '" + longest->name + "' is tested every " +
                          format_duration(longest->proof_test_interval) + ", longer than the " +
                          format_duration(*q.proof_test_interval) +
                          " the requirements allow. To lift it: test it at the required interval, or revise the "
                          "requirement with the verification that supports it."});
  r.requirement_checks.push_back(std::move(c));
}

void warn_untraced(const Project& project, const Sif& sif, std::vector<Warning>& warnings) {
  std::vector<std::string> untraced;
  for (const auto& sub : sif.subsystems)
    for (const auto& ch : sub.channels)
      for (auto k : ch.components) {
        const Component& c = project.components[k];
        if (c.data_source_untold() && !c.field_data &&
            std::find(untraced.begin(), untraced.end(), c.id) == untraced.end())
          untraced.push_back(c.id);
      }
  if (untraced.empty()) return;
  std::string names;
  for (const auto& n : untraced) names += (names.empty() ? "" : ", ") + n;
  warnings.push_back({sif.id, "failure data without a \"data_source\": " + names +
                                  "; name the certificate, FMEDA, handbook or field record each rests on"});
}

// Every element whose systematic result rests on prior use is named with its evidence.
void describe_prior_use(SifResult& r) {
  for (const auto& sub : r.subsystems)
    for (const auto& e : sub.systematic_basis)
      if (e.basis == SystematicGround::kPriorUse)
        r.assumptions.push_back(e.component + " ('" + sub.name + "'): systematic result SIL " +
                                std::to_string(e.sil.value_or(0)) +
                                " on prior use (IEC 61511-1:2016 11.5.3), evidence: \"" + e.evidence + "\"");
}

}  // namespace

std::vector<ResponseTimeStep> response_budget(const Project& project, const Sif& sif) {
  std::vector<ResponseTimeStep> out;
  out.reserve(sif.subsystems.size());  // held with the results for the whole run
  for (const auto& sub : sif.subsystems) out.push_back(step_of(project, sub));
  return out;
}

std::optional<double> response_time_s(const std::vector<ResponseTimeStep>& budget) {
  double total = 0.0;
  for (const auto& step : budget) {
    if (!step.seconds) return std::nullopt;
    total += *step.seconds;  // subsystems in series act in signal order
  }
  return total;
}

void apply_requirement_checks(const Project& project, const Sif& sif, SifResult& r, std::vector<Warning>& warnings) {
  warn_untraced(project, sif, warnings);
  describe_prior_use(r);
  r.response_budget = response_budget(project, sif);
  r.response_time_s = response_time_s(r.response_budget);
  if (!sif.requirements) return;
  const SifRequirements& q = *sif.requirements;
  std::vector<Limit> limits;
  check_response_time(q, r, limits);
  if (q.process_safety_time && !r.response_time_s) {
    std::string missing;
    for (const auto& step : r.response_budget)
      for (const auto& m : step.missing) missing += (missing.empty() ? "" : ", ") + m;
    warnings.push_back({sif.id, "a process safety time is stated but the response time of " + missing +
                                    " is not; the response time cannot be checked"});
  }
  check_spurious(project, sif, q, r, limits);
  check_interval(sif, q, r, limits);
  if (limits.empty()) return;
  // A failed check (ok false in requirement_checks) makes the SIF fall short, target or not:
  // sif_verdict (judge.hpp) decides it with the figure and the constraints.
  r.limits.insert(r.limits.end(), limits.begin(), limits.end());
}

}  // namespace sifter
