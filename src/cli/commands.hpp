#pragma once
// The subcommands of the sifter program; each file adds one and returns its action.
#include <CLI/CLI.hpp>

#include <functional>
#include <string>

#include "sifter/model.hpp"

namespace sifter::cli {

/// What a subcommand does once its options are parsed; returns the exit status.
using Action = std::function<int()>;

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
/// `sifter options PROJECT --scenario ID`: the alternatives for a scenario, ranked by cost.
Action add_options_command(CLI::App& app);

}  // namespace sifter::cli
