// One subsystem's figure and the assumptions behind it, for verify.
#include <algorithm>

#include "analysis/verify_parts.hpp"
#include "sifter/engines/group_model.hpp"
#include "sifter/engines/simplified.hpp"
#include "sifter/model/format.hpp"

namespace sifter::detail {
namespace {

std::string joined(const std::vector<std::string>& names) {
  std::string out;
  for (const auto& n : names) out += (out.empty() ? "" : ", ") + n;
  return out;
}

bool p_test_duration(const Subsystem& sub) { return sub.test_duration && sub.test_duration->hours > 0.0; }

// Name, role, interval and the component tags of each channel.
SubsystemResult start_subsystem(const Project& project, const Subsystem& sub) {
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
  return r;
}

// A supplier's figure, taken as its safety manual states it.
void take_vendor_figure(const Subsystem& sub, SubsystemResult& r, Assumptions& assumptions) {
  r.vote = sub.hft_declared ? "vendor (HFT " + std::to_string(*sub.hft_declared) + ")" : "vendor";
  r.pfd_avg = sub.vendor_pfd_avg;
  if (sub.vendor_pfh) r.pfh_per_hour = sub.vendor_pfh->per_hour;
  r.equation = "figure from the safety manual";
  assumptions.push_back(sub.name + ": " + (sub.vendor_pfd_avg ? "PFDavg" : "PFH") +
                        " taken from the supplier's safety manual; its proof-test and repair assumptions apply");
}

// Each component whose lambda_du comes from field data, once, with the estimate used.
void describe_field_data(const Project& project, const Subsystem& sub, Assumptions& assumptions) {
  std::vector<std::size_t> seen;
  for (const auto& ch : sub.channels)
    for (auto c : ch.components) {
      if (std::find(seen.begin(), seen.end(), c) != seen.end()) continue;
      seen.push_back(c);
      if (const auto& fd = project.components[c].field_data)
        assumptions.push_back(
            sub.name + ": lambda_du of " + project.components[c].id + " from field data, " +
            std::to_string(fd->failures) + " failures in " + sifter::figure(fd->device_hours.hours) +
            " device-hours at " + sifter::figure(100 * fd->confidence) +
            "% confidence: chi-squared(c; 2n+2)/(2T) = " + format_rate(project.components[c].rates.lambda_du));
    }
}

// The Annex B figures of the resolved group: PFDavg and its terms, or PFH.
void apply_simplified(const GroupData& g, DemandMode mode, SubsystemResult& r) {
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
}

bool redundant(const Subsystem& sub) { return sub.vote.failures_to_fail() > 1 || sub.vote.diagnostic; }

void note_defaults(const Subsystem& sub, DefaultsApplied& defaults) {
  if (redundant(sub) && sub.beta_d_defaulted) defaults.beta_d_equals_beta.push_back(sub.name);
  if (sub.mrt_defaulted) defaults.mrt_equals_mttr.push_back(sub.name);
  if (sub.interval_defaulted) defaults.interval.push_back(sub.name);
  if (sub.mttr_defaulted) defaults.mttr.push_back(sub.name);
}

// What the group's figure rests on beyond the plain equations: scaled beta, an imperfect proof
// test, test duration, alarm-only detection, a partial stroke test.
void describe_group_assumptions(const Project& project, const Subsystem& sub, DemandMode mode,
                                Assumptions& assumptions) {
  if (sub.ccf_scaling == CcfScaling::kIec61508TableD5 && redundant(sub))
    assumptions.push_back(sub.name + ": beta scaled by " +
                          sifter::figure(ccf_multiplier_table_d5(sub.vote.k, sub.vote.n)) + " for " + sub.vote.text() +
                          " (IEC 61508-6:2010 Table D.5)");
  if (sub.proof_test_coverage < 1.0)
    assumptions.push_back(sub.name + ": proof-test coverage " + sifter::figure(sub.proof_test_coverage * 100) +
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
                          " reveals " + sifter::figure(sub.partial_stroke->coverage * 100) + "% of lambda_du");
}

}  // namespace

SubsystemResult evaluate_subsystem(const Project& project, const Subsystem& sub, DemandMode mode,
                                   Assumptions& assumptions, DefaultsApplied& defaults) {
  SubsystemResult r = start_subsystem(project, sub);
  if (sub.is_vendor()) {
    take_vendor_figure(sub, r, assumptions);
    return r;
  }
  r.vote = sub.vote.text();
  r.voting = sub.vote;
  describe_field_data(project, sub, assumptions);
  apply_simplified(group_data_for(project, sub), mode, r);
  note_defaults(sub, defaults);
  describe_group_assumptions(project, sub, mode, assumptions);
  return r;
}

void describe_defaults(const Project& project, const DefaultsApplied& d, Assumptions& assumptions) {
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

}  // namespace sifter::detail
