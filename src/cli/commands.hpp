#pragma once
// The subcommands of the sifter program; each file adds one and returns its action.
#include <CLI/CLI.hpp>
#include <functional>
#include <memory>
#include <string>
#include <type_traits>
#include <vector>

#include "sifter/model/civil_date.hpp"
#include "sifter/model/model.hpp"

namespace sifter::cli {

/// What a subcommand does once its options are parsed; returns the exit status.
using Action = std::function<int()>;

/// Moves a large value (a loaded register, its results) to the heap and keeps it until the
/// process ends: the operating system takes the memory back at exit far faster than a walk
/// of destructors over millions of small allocations. The value stays reachable from a
/// global, so leak checkers do not report it.
template <typename T>
const T& keep_until_exit(T&& value) {
  static auto* kept = new std::vector<std::shared_ptr<const void>>();
  auto held = std::make_shared<const std::decay_t<T>>(std::forward<T>(value));
  kept->push_back(held);
  return *held;
}

/// The SIF of that id, or a UsageError listing the ids there are.
const Sif& find_sif(const Project& project, const std::string& id);

/// `sifter check PROJECT`: verify every SIF and scenario.
Action add_check_command(CLI::App& app);

/// `sifter curve PROJECT --sif ID`: PFD(t) from the exact engine.
Action add_curve_command(CLI::App& app);
/// `sifter interval PROJECT --sif ID`: the longest proof-test interval that meets the target.
Action add_interval_command(CLI::App& app);

/// `sifter sweep PROJECT --sif ID --vary PARAM --from A --to B`: a parameter over a range.
Action add_sweep_command(CLI::App& app);

/// `sifter compare PROJECT --sif ID --subsystem NAME --votes LIST`: one subsystem re-voted.
Action add_compare_command(CLI::App& app);

/// `sifter sensitivity PROJECT --sif ID`: inputs ranked by the swing of the PFDavg.
Action add_sensitivity_command(CLI::App& app);

/// `sifter diff OLD NEW`: changed inputs, results and verdicts between two revisions.
Action add_diff_command(CLI::App& app);
/// `sifter report PROJECT -o FILE`: write the HTML or Markdown report.
Action add_report_command(CLI::App& app);
/// `sifter srs PROJECT -o FILE [--sif ID]`: write the safety requirements specification.
Action add_srs_command(CLI::App& app);

/// Today's date (UTC, ISO 8601), or that of SOURCE_DATE_EPOCH when set, so that a document
/// can be reproduced.
std::string run_date();

/// `sifter init FILE [--example]`: write a commented project and its library to start from.
Action add_init_command(CLI::App& app);
/// `sifter import DIR -o PROJECT`: a project from CSV tables.
Action add_import_command(CLI::App& app);
/// `sifter export PROJECT --csv-dir DIR`: a project as CSV tables.
Action add_export_command(CLI::App& app);

/// `sifter service PROJECT RECORDS`: in-service records against the design.
Action add_service_command(CLI::App& app);
/// The --as-of date: YYYY-MM-DD, or today (UTC; SOURCE_DATE_EPOCH when set) when empty.
CivilDate as_of_arg(const std::string& text);
/// `sifter options PROJECT --scenario ID`: the alternatives for a scenario, ranked by cost.
Action add_options_command(CLI::App& app);

}  // namespace sifter::cli
