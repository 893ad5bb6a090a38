// Sensitivity: each input that feeds a SIF divided and multiplied by a factor, ranked by swing.
#include <algorithm>
#include <cmath>
#include <functional>

#include "analysis/whatif_parts.hpp"
#include "sifter/analysis/whatif.hpp"
#include "sifter/model/format.hpp"

namespace sifter {
namespace {

// Which subsystems take a value from elsewhere, for the notes.
struct Provenance {
  std::vector<std::string> interval_default, mttr_default, mrt_follows, beta_d_follows;
};

std::string listed(const std::vector<std::string>& names) {
  std::string out;
  for (const auto& n : names) out += (out.empty() ? "" : ", ") + n;
  return out;
}

// One input to vary: how to name and find it, its value, and how to set it in a copy.
struct Probe {
  std::string name;
  std::string pointer;
  std::string unit;
  double base = 0.0;
  bool fraction = false;
  std::function<void(Project&, double)> set;
};

std::vector<std::size_t> components_of(const Sif& sif) {
  std::vector<std::size_t> out;
  for (const auto& sub : sif.subsystems)
    for (const auto& ch : sub.channels)
      for (auto c : ch.components)
        if (std::find(out.begin(), out.end(), c) == out.end()) out.push_back(c);
  return out;
}

void add_vendor_probe(std::vector<Probe>& probes, const Subsystem& sub, std::size_t sif, std::size_t i) {
  const std::string q = detail::quoted_name(sub.name);
  if (sub.vendor_pfd_avg)
    probes.push_back({"PFDavg of " + q, sub.pointer + "/pfd_avg", "", *sub.vendor_pfd_avg, true,
                      [sif, i](Project& p, double v) { p.sifs[sif].subsystems[i].vendor_pfd_avg = v; }});
  if (sub.vendor_pfh)
    probes.push_back({"PFH of " + q, sub.pointer + "/pfh", "/h", sub.vendor_pfh->per_hour, false,
                      [sif, i](Project& p, double v) { p.sifs[sif].subsystems[i].vendor_pfh = Rate{v}; }});
}

void add_subsystem_probes(std::vector<Probe>& probes, Provenance& provenance, const Subsystem& sub, std::size_t sif,
                          std::size_t i) {
  const std::string q = detail::quoted_name(sub.name);
  auto at = [sif, i](Project& p) -> Subsystem& { return p.sifs[sif].subsystems[i]; };
  if (vote_is_redundant(sub.vote)) {
    const bool follows = sub.beta_d_defaulted;
    if (follows) provenance.beta_d_follows.push_back(q);
    probes.push_back({"beta of " + q, sub.pointer + "/beta", "", sub.beta, true, [at, follows](Project& p, double v) {
                        at(p).beta = v;
                        if (follows) at(p).beta_d = v;
                      }});
    if (!follows)
      probes.push_back({"beta_D of " + q, sub.pointer + "/beta_d", "", sub.beta_d, true,
                        [at](Project& p, double v) { at(p).beta_d = v; }});
  }
  if (sub.interval_defaulted) provenance.interval_default.push_back(q);
  if (sub.mttr_defaulted) provenance.mttr_default.push_back(q);
  probes.push_back({"interval of " + q, sub.pointer + "/proof_test_interval", "h", sub.proof_test_interval.hours, false,
                    [at](Project& p, double v) { at(p).proof_test_interval = Duration{v}; }});
  const bool mrt_follows = sub.mrt_defaulted;
  if (mrt_follows) provenance.mrt_follows.push_back(q);
  probes.push_back(
      {"MTTR of " + q, sub.pointer + "/mttr", "h", sub.mttr.hours, false, [at, mrt_follows](Project& p, double v) {
         at(p).mttr = Duration{v};
         if (mrt_follows) at(p).mrt = Duration{v};
       }});
  if (!mrt_follows)
    probes.push_back({"MRT of " + q, sub.pointer + "/mrt", "h", sub.mrt.hours, false,
                      [at](Project& p, double v) { at(p).mrt = Duration{v}; }});
  probes.push_back({"coverage of " + q, sub.pointer + "/proof_test_coverage", "", sub.proof_test_coverage, true,
                    [at](Project& p, double v) { at(p).proof_test_coverage = v; }});
  if (sub.partial_stroke) {
    probes.push_back({"PST interval of " + q, sub.pointer + "/partial_stroke/interval", "h",
                      sub.partial_stroke->interval.hours, false,
                      [at](Project& p, double v) { at(p).partial_stroke->interval = Duration{v}; }});
    probes.push_back({"PST coverage of " + q, sub.pointer + "/partial_stroke/coverage", "",
                      sub.partial_stroke->coverage, true,
                      [at](Project& p, double v) { at(p).partial_stroke->coverage = v; }});
  }
}

std::vector<Probe> probes_for(const Project& project, std::size_t sif, Provenance& provenance) {
  const Sif& s = project.sifs[sif];
  std::vector<Probe> probes;
  for (auto c : components_of(s))
    probes.push_back({"rates of " + project.components[c].id, project.components[c].pointer, "x", 1.0, false,
                      [c](Project& p, double v) {
                        FailureRates& r = p.components[c].rates;
                        for (Rate* rate : {&r.lambda_du, &r.lambda_dd, &r.lambda_su, &r.lambda_sd}) rate->per_hour *= v;
                      }});
  bool imperfect = false;
  for (std::size_t i = 0; i < s.subsystems.size(); ++i) {
    const Subsystem& sub = s.subsystems[i];
    if (sub.is_vendor()) {
      add_vendor_probe(probes, sub, sif, i);
      continue;
    }
    add_subsystem_probes(probes, provenance, sub, sif, i);
    imperfect = imperfect || sub.proof_test_coverage < 1.0;
  }
  if (imperfect)
    probes.push_back({"mission time", "/defaults/mission_time", "h", project.defaults.mission_time.hours, false,
                      [](Project& p, double v) { p.defaults.mission_time = Duration{v}; }});
  return probes;
}

constexpr double kMaxSensitivityFactor = 10.0;

// Above 10 the varied inputs leave the physical range (and an interval divided by 1e200 would
// ask the exact engine for 1e200 tests); README "Limits".
void check_factor(double factor) {
  if (!(factor > 1.0) || !(factor <= kMaxSensitivityFactor))
    throw UsageError(
        "the factor must be a number above 1 and at most 10 (each input is divided and multiplied by "
        "it), found " +
        sifter::figure(factor));
}

// The SIF's measure with one input divided and multiplied by the factor, the others held; a
// fraction is held at 1 where the factor would lift it above.
SensitivityInput vary(const WhatIf& what_if, std::size_t sif, const Probe& probe, double factor) {
  SensitivityInput in;
  in.name = probe.name;
  in.pointer = probe.pointer;
  in.unit = probe.unit;
  in.base_value = probe.base;
  in.low_value = probe.base / factor;
  in.high_value = probe.base * factor;
  if (probe.fraction && in.high_value > 1.0) {
    in.high_value = 1.0;
    in.clamped = true;
  }
  auto at = [&](double v) {
    Project p = what_if.project();
    probe.set(p, v);
    return what_if.verify(p, sif).judged_figure().value_or(0.0);
  };
  in.at_low = at(in.low_value);
  in.at_high = at(in.high_value);
  in.swing = std::fabs(in.at_high - in.at_low);
  return in;
}

// The components of a group's second and later channels, which the simplified equations do not read.
std::string later_channel_components(const Project& project, const Sif& sif) {
  std::string out;
  for (const auto& sub : sif.subsystems)
    for (std::size_t ch = 1; ch < sub.channels.size(); ++ch)
      for (auto c : sub.channels[ch].components) out += (out.empty() ? "" : ", ") + project.components[c].id;
  return out;
}

// What the reader needs to read the bars: how the inputs were varied, and where a value came
// from elsewhere or moves nothing.
std::vector<std::string> sensitivity_notes(const Project& project, const Sif& sif, double factor,
                                           const std::string& clamped, const Provenance& provenance) {
  std::vector<std::string> notes;
  notes.push_back("each input is divided and multiplied by " + sifter::figure(factor) +
                  " alone, the others held at the project's values");
  notes.push_back("a component's four rates are scaled together, so its SFF and DC stay the same");
  if (!clamped.empty()) notes.push_back("fractions held at 1 where the factor would exceed it: " + clamped);
  const std::string later_channels = later_channel_components(project, sif);
  if (!later_channels.empty())
    notes.push_back(
        "the simplified equations take a group's rates from its first channel (the channels are "
        "identical), so these move nothing here: " +
        later_channels);
  std::string defaults;
  if (!provenance.interval_default.empty()) defaults += "the interval of " + listed(provenance.interval_default);
  if (!provenance.mttr_default.empty())
    defaults += (defaults.empty() ? "" : "; ") + std::string("the MTTR of ") + listed(provenance.mttr_default);
  if (!defaults.empty()) notes.push_back("from the project defaults, varied here for one subsystem only: " + defaults);
  if (!provenance.mrt_follows.empty())
    notes.push_back("MRT follows MTTR where it was not given: " + listed(provenance.mrt_follows));
  if (!provenance.beta_d_follows.empty())
    notes.push_back("beta_D follows beta where it was not given: " + listed(provenance.beta_d_follows));
  return notes;
}

}  // namespace

SensitivityResult sensitivity(const WhatIf& what_if, std::size_t sif, double factor) {
  check_factor(factor);
  const Project& base = what_if.project();
  const SifResult now = what_if.baseline(sif);
  const auto measure_now = now.judged_figure();
  if (!measure_now) throw UsageError(now.id + " cannot be verified (a supplier figure is missing for its demand mode)");
  SensitivityResult out;
  out.sif = now.id;
  out.mode = now.demand_mode;
  out.factor = factor;
  out.base = *measure_now;
  out.requirement = governing_requirement(now);
  std::string clamped;
  Provenance provenance;
  for (const Probe& probe : probes_for(base, sif, provenance)) {
    out.inputs.push_back(vary(what_if, sif, probe, factor));
    if (out.inputs.back().clamped) clamped += (clamped.empty() ? "" : ", ") + probe.name;
  }
  std::stable_sort(out.inputs.begin(), out.inputs.end(),
                   [](const SensitivityInput& a, const SensitivityInput& b) { return a.swing > b.swing; });
  out.notes = sensitivity_notes(base, base.sifs[sif], factor, clamped, provenance);
  return out;
}

}  // namespace sifter
