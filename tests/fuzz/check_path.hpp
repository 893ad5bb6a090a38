#pragma once
// The whole `sifter check` path on text in memory, shared by the fuzz target and the replay test.
#include <cmath>
#include <memory>
#include <nlohmann/json.hpp>
#include <optional>
#include <stdexcept>
#include <string>
#include <string_view>

#include "input/json_tree.hpp"
#include "sifter/analysis/report_data.hpp"
#include "sifter/analysis/verify.hpp"
#include "sifter/analysis/whatif.hpp"
#include "sifter/input/json_source.hpp"
#include "sifter/input/load.hpp"
#include "sifter/report/csv.hpp"
#include "sifter/report/html.hpp"
#include "sifter/report/json_results.hpp"
#include "sifter/report/markdown.hpp"
#include "sifter/report/terminal.hpp"
#include "sifter/report/worksheet.hpp"

namespace sifter::fuzzing {

/// Properties every project the loader accepts must have; throws std::logic_error otherwise.
inline void check_loaded(const Project& project) {
  for (const auto& sif : project.sifs)
    for (const auto& sub : sif.subsystems) {
      if (sub.is_vendor()) continue;
      const auto n = static_cast<int>(sub.channels.size());
      if (sub.vote.k < 1 || sub.vote.k > sub.vote.n || sub.vote.n != n || n > 8)
        throw std::logic_error("accepted vote " + sub.vote.text() + " on " + std::to_string(n) + " channels");
    }
}

/// Properties every result must have: probabilities within [0, 1], rates and frequencies
/// finite and not negative, shares within 0..1, and no SIF judged to meet its target when a
/// component of it states no dangerous failure rate (issue "never silently wrong").
inline void check_results(const Project& project, const ProjectResult& result) {
  auto not_negative = [](const std::optional<double>& v, const char* what) {
    if (v && !(*v >= 0.0 && std::isfinite(*v))) throw std::logic_error(std::string("negative or non-finite ") + what);
  };
  auto probability = [](const std::optional<double>& v, const char* what) {
    if (v && !(*v >= 0.0 && *v <= 1.0)) throw std::logic_error(std::string(what) + " outside [0, 1]");
  };
  for (std::size_t i = 0; i < result.sifs.size(); ++i) {
    const auto& sif = result.sifs[i];
    probability(sif.pfd_avg, "SIF PFDavg");
    probability(sif.pfd_avg_exact, "SIF exact PFDavg");
    probability(sif.required_pfd, "SIF required PFD");
    not_negative(sif.pfh_per_hour, "SIF PFH");
    not_negative(sif.required_pfh_per_hour, "SIF required PFH");
    not_negative(sif.rrf, "SIF RRF");
    for (const auto& sub : sif.subsystems) {
      probability(sub.pfd_avg, "subsystem PFDavg");
      probability(sub.pfd_avg_exact, "subsystem exact PFDavg");
      not_negative(sub.pfh_per_hour, "subsystem PFH");
      if (!(sub.share >= 0.0 && sub.share <= 1.0 + 1e-12)) throw std::logic_error("share outside 0..1");
    }
    if (sif.meets_target.value_or(false) && i < project.sifs.size())
      for (const auto& sub : project.sifs[i].subsystems)
        for (const auto& ch : sub.channels)
          for (std::size_t c : ch.components)
            if (!project.components.at(c).dangerous_rates_stated)
              throw std::logic_error("a SIF meets its target with a component that states no failure data");
  }
  for (const auto& s : result.scenarios) {
    probability(s.required_pfd, "scenario required PFD");
    not_negative(s.frequency_without_sif_per_yr, "frequency without the SIF");
    not_negative(s.mitigated_frequency_per_yr, "mitigated frequency");
    not_negative(s.target_frequency_per_yr, "target frequency");
    for (const auto& c : s.consequences) {
      probability(c.required_pfd, "consequence required PFD");
      probability(c.modifier_product, "modifier product");
      not_negative(c.mitigated_frequency_per_yr, "mitigated frequency");
    }
  }
}

/// The same properties on what is written: in the results JSON every number under a key that
/// names a PFD lies in [0, 1], and every number under a key that names a frequency or a rate
/// ("*_per_yr", "*_per_hour", "*frequency*") is finite and not negative, however deep.
inline void check_written(const nlohmann::json& j, const std::string& key = {}) {
  if (j.is_object()) {
    for (auto it = j.begin(); it != j.end(); ++it) check_written(it.value(), it.key());
    return;
  }
  if (j.is_array()) {
    for (const auto& v : j) check_written(v, key);
    return;
  }
  if (!j.is_number()) return;
  const double v = j.get<double>();
  auto ends_with = [&](const char* tail) {
    const std::string t(tail);
    return key.size() >= t.size() && key.compare(key.size() - t.size(), t.size(), t) == 0;
  };
  if (key.find("pfd") != std::string::npos && !(v >= 0.0 && v <= 1.0))
    throw std::logic_error("written " + key + " outside [0, 1]");
  if ((ends_with("_per_yr") || ends_with("_per_hour") || key.find("frequency") != std::string::npos) &&
      !(std::isfinite(v) && v >= 0.0))
    throw std::logic_error("written " + key + " negative or non-finite");
}

/// The what-if engine on the first SIF: a sensitivity at factor 2 and a three-point sweep of
/// lambda_du; every figure must stay finite and every PFDavg within [0, 1]. A what-if that
/// has nothing to vary (UsageError) is a normal outcome.
inline void run_what_ifs(const Project& project) {
  if (project.sifs.empty()) return;
  const WhatIf what_if(project);
  auto figure = [](double v, bool low, const char* what) {
    if (!std::isfinite(v) || v < 0.0 || (low && v > 1.0)) throw std::logic_error(std::string("what-if ") + what);
  };
  try {
    const SensitivityResult s = sensitivity(what_if, 0, 2.0);
    const bool low = s.mode == DemandMode::kLow;
    for (const auto& in : s.inputs) {
      figure(in.at_low, low, "sensitivity figure");
      figure(in.at_high, low, "sensitivity figure");
    }
    SweepRequest request;
    request.parameter = SweepParameter::kLambdaDuFactor;
    request.from = 0.5;
    request.to = 2.0;
    request.steps = 3;
    for (const auto& p : sweep(what_if, request).points)
      if (auto m = p.result.judged_figure()) figure(*m, p.result.demand_mode == DemandMode::kLow, "sweep figure");
  } catch (const UsageError&) {
  }
}

/// What the check path made of one input.
enum class Outcome { kRejected, kComputed };

/// The loader's fast parse gives nlohmann's very tree or declines: a tree it builds from text
/// nlohmann refuses or the structure scan refuses, or one that dumps differently (number types
/// and bits included), is a finding.
inline void check_fast_tree(std::string_view text) {
  const auto fast = detail::fast_json_tree(text, kMaxNestingDepth);
  // The project's parse, which holds its long sections back and builds them element by element,
  // declines where the whole parse declines and builds the same tree.
  std::shared_ptr<detail::DeferredSections> held;
  auto deferring =
      detail::fast_json_tree_deferring(text, kMaxNestingDepth, 0, {"components", "sifs", "scenarios"}, held);
  if (deferring.has_value() != fast.has_value())
    throw std::logic_error(
        "the parse that holds sections back declines where the whole parse does not, or the reverse");
  if (deferring && held) {
    for (const char* section : {"components", "sifs", "scenarios"}) {
      if (!held->holds(section)) continue;
      auto& items = (*deferring)[section];
      for (std::size_t i = 0; i < items.size(); ++i) held->build(section, i, items[i]);
    }
  }
  if (!fast) return;
  if (deferring->dump() != fast->dump() ||
      std::hash<nlohmann::json>{}(*deferring) != std::hash<nlohmann::json>{}(*fast))
    throw std::logic_error("the parse that holds sections back built another tree than the whole parse");
  // It stands in for the structure scan: a text it takes, the scan passes.
  if (!scan_json_structure(text).empty())
    throw std::logic_error("the fast parse took a text the structure scan refuses");
  nlohmann::json slow;
  try {
    slow = nlohmann::json::parse(text);
  } catch (const nlohmann::json::exception&) {
    throw std::logic_error("the fast parse accepted a text nlohmann refuses");
  }
  // The hash of a value covers its type (signed, unsigned, double) at every place; dump its text.
  if (fast->dump() != slow.dump() || std::hash<nlohmann::json>{}(*fast) != std::hash<nlohmann::json>{}(slow))
    throw std::logic_error("the fast parse built another tree than nlohmann's");
}

/// Loads `text` as a project (libraries resolve against `base_dir`), verifies it and renders
/// the JSON results, the terminal summary, both CSV files, the HTML and Markdown reports, and
/// runs the what-ifs, as the program does. A refused input (InputError) is a normal outcome;
/// every other exception escapes: a non-finite number refused by a writer, a broken
/// invariant, or any other internal error, is a defect.
inline Outcome run_check_path(std::string_view text, const std::string& base_dir) {
  check_fast_tree(text);
  std::optional<LoadedProject> loaded;
  ProjectResult result;
  try {
    loaded.emplace(load_project_text(std::string(text), "fuzz.json", base_dir));
    check_loaded(loaded->project);
    result = verify_project(*loaded);  // refuses figures beyond the finite numbers
  } catch (const InputError&) {
    return Outcome::kRejected;
  }
  const Project& project = loaded->project;
  check_results(project, result);
  // The writers run in another translation unit; their work is not optimised away.
  const nlohmann::json written = report::results_json(result);
  check_written(written);
  written.dump(2);
  report::render_terminal(result);
  report::worksheet_csv(result);
  report::sif_csv(result);
  ReportOptions options;
  options.date = "2026-01-01";
  options.exact = true;
  const ReportData data = build_report_data(project, result, options);
  report::render_html(result, data);
  report::render_markdown(result, data);
  run_what_ifs(project);
  return Outcome::kComputed;
}

}  // namespace sifter::fuzzing
