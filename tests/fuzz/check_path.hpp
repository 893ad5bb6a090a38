#pragma once
// The whole `sifter check` path on text in memory, shared by the fuzz target and the replay test.
#include <optional>
#include <stdexcept>
#include <string>
#include <string_view>

#include "sifter/load.hpp"
#include "sifter/report/json_results.hpp"
#include "sifter/report/terminal.hpp"
#include "sifter/report/worksheet.hpp"
#include "sifter/verify.hpp"

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

/// Properties every result must have: probabilities and rates not negative, shares within 0..1.
inline void check_results(const ProjectResult& result) {
  auto not_negative = [](const std::optional<double>& v, const char* what) {
    if (v && !(*v >= 0.0)) throw std::logic_error(std::string("negative ") + what);
  };
  for (const auto& sif : result.sifs) {
    not_negative(sif.pfd_avg, "SIF PFDavg");
    not_negative(sif.pfh_per_hour, "SIF PFH");
    for (const auto& sub : sif.subsystems) {
      not_negative(sub.pfd_avg, "subsystem PFDavg");
      not_negative(sub.pfh_per_hour, "subsystem PFH");
      if (!(sub.share >= 0.0 && sub.share <= 1.0 + 1e-12)) throw std::logic_error("share outside 0..1");
    }
  }
}

/// What the check path made of one input.
enum class Outcome { kRejected, kComputed };

/// Loads `text` as a project (libraries resolve against `base_dir`), verifies it and renders
/// the JSON results, the terminal summary and the worksheet CSV, as `sifter check` does.
/// A refused input (InputError) is a normal outcome; every other exception escapes: a
/// non-finite number refused by a writer, or any other internal error, is a defect.
inline Outcome run_check_path(std::string_view text, const std::string& base_dir) {
  ProjectResult result;
  try {
    const LoadedProject loaded = load_project_text(std::string(text), "fuzz.json", base_dir);
    check_loaded(loaded.project);
    result = verify_project(loaded);  // refuses figures beyond the finite numbers
  } catch (const InputError&) {
    return Outcome::kRejected;
  }
  check_results(result);
  // The writers run in another translation unit; their work is not optimised away.
  report::results_json(result).dump(2);
  report::render_terminal(result);
  report::worksheet_csv(result);
  return Outcome::kComputed;
}

}  // namespace sifter::fuzzing
