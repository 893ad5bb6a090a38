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

}  // namespace sifter::cli
