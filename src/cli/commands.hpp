#pragma once
// The subcommands of the sifter program; each file adds one and returns its action.
#include <CLI/CLI.hpp>

#include <functional>

namespace sifter::cli {

/// What a subcommand does once its options are parsed; returns the exit status.
using Action = std::function<int()>;

/// `sifter check PROJECT`: verify every SIF and scenario.
Action add_check_command(CLI::App& app);

/// `sifter report PROJECT -o FILE`: write the HTML or Markdown report.
Action add_report_command(CLI::App& app);

}  // namespace sifter::cli
