#pragma once
// Small builders for LOPA tests: projects, causes and layers written in a line each.
// All tags, ids and frequencies are invented for the tests.
#include <gtest/gtest.h>

#include <cmath>
#include <string>
#include <vector>

#include "sifter/engines/lopa.hpp"
#include "support/tolerance.hpp"

namespace sifter::testing {

// An invented risk matrix: safety 3 and 4, asset 3.
inline Project project_with_criteria() {
  Project p;
  p.risk_criteria["safety"]["3"] = Rate::from_per_year(1e-4);
  p.risk_criteria["safety"]["4"] = Rate::from_per_year(1e-5);
  p.risk_criteria["asset"]["3"] = Rate::from_per_year(1e-4);
  return p;
}

// A SIF of one 1oo1 channel whose components carry the given tags.
inline void add_sif(Project& p, const std::string& id, const std::vector<std::string>& tags) {
  Sif sif;
  sif.id = id;
  Subsystem sub;
  Channel channel;
  for (const auto& tag : tags) {
    Component c;
    c.id = tag;
    channel.components.push_back(p.components.size());
    p.components.push_back(c);
  }
  sub.channels.push_back(channel);
  sif.subsystems.push_back(sub);
  p.sifs.push_back(sif);
}

inline Cause cause(const std::string& id, double per_year, std::vector<std::string> devices = {},
                   std::vector<EnablingCondition> enabling = {}) {
  Cause c;
  c.id = id;
  c.title = "cause " + id;
  c.frequency = Rate::from_per_year(per_year);
  c.devices = std::move(devices);
  c.enabling = std::move(enabling);
  return c;
}

inline Layer layer(const std::string& id, LayerKind kind, double pfd, std::vector<std::string> devices = {}) {
  Layer l;
  l.id = id;
  l.title = "layer " + id;
  l.kind = kind;
  l.pfd = pfd;
  l.devices = std::move(devices);
  return l;
}

inline Layer sif_layer(const std::string& sif) {
  Layer l;
  l.kind = LayerKind::kSif;
  l.sif = sif;
  return l;
}

inline Layer operator_layer(const std::string& id, double pfd, double response_min, double available_min,
                            std::vector<std::string> devices = {}) {
  Layer l = layer(id, LayerKind::kOperatorResponse, pfd, std::move(devices));
  l.response_time = Duration{response_min / 60.0};
  l.time_available = Duration{available_min / 60.0};
  return l;
}

inline Scenario scenario_with_target(const std::string& id, double target_per_year) {
  Scenario s;
  s.id = id;
  s.title = "scenario " + id;
  s.target_frequency = Rate::from_per_year(target_per_year);
  return s;
}

inline std::vector<std::string> messages_of(const ScenarioResult& r, FindingKind kind) {
  std::vector<std::string> out;
  for (const auto& f : r.findings)
    if (f.kind == kind) out.push_back(f.message);
  return out;
}

template <typename Texts>  // a scenario's (std::string) or a SIF's (SharedText)
bool has_assumption_containing(const Texts& assumptions, const std::string& text) {
  for (const std::string& a : assumptions)
    if (a.find(text) != std::string::npos) return true;
  return false;
}

}  // namespace sifter::testing
