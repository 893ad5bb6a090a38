// The sifter program: parse the command line, run one subcommand, map errors to exit codes.
#include <iostream>
#include <map>
#include <memory>

#include "commands.hpp"
#include "help_format.hpp"
#include "process_heap.hpp"
#include "sifter/model/diagnostics.hpp"
#include "sifter/model/printable.hpp"

int main(int argc, char** argv) {
  // First of all: this call may replace the process by the same program under glibc's heap
  // tunables (src/cli/process_heap.hpp) and returns only when it does not, so nothing may read
  // or write before it. It changes no result.
  sifter::cli::restart_with_heap_tunables(argv);
  CLI::App app{"sifter: LOPA and SIL verification of safety instrumented functions (IEC 61511 / IEC 61508)"};
  app.set_version_flag("--version", std::string("sifter ") + SIFTER_VERSION);
  app.require_subcommand(1);
  app.formatter(std::make_shared<sifter::cli::NarrowHelp>());  // before the commands, which inherit it
  app.footer(
      "Exit status: 0 every SIF meets its target; 1 at least one falls short; 2 bad input or usage.\n"
      "sifter is a calculation aid: results must be reviewed by a competent functional-safety practitioner.");
  std::map<const CLI::App*, sifter::cli::Action> actions;
  auto add = [&](sifter::cli::Action (*adder)(CLI::App&)) {
    auto action = adder(app);
    actions[app.get_subcommands({}).back()] = std::move(action);
  };
  add(&sifter::cli::add_check_command);
  add(&sifter::cli::add_curve_command);
  add(&sifter::cli::add_interval_command);
  add(&sifter::cli::add_sweep_command);
  add(&sifter::cli::add_compare_command);
  add(&sifter::cli::add_sensitivity_command);
  add(&sifter::cli::add_diff_command);
  add(&sifter::cli::add_report_command);
  add(&sifter::cli::add_init_command);
  add(&sifter::cli::add_import_command);
  add(&sifter::cli::add_export_command);
  add(&sifter::cli::add_srs_command);
  add(&sifter::cli::add_service_command);
  add(&sifter::cli::add_options_command);
  try {
    app.parse(argc, argv);
  } catch (const CLI::CallForHelp& e) {
    return app.exit(e);
  } catch (const CLI::CallForAllHelp& e) {
    return app.exit(e);
  } catch (const CLI::CallForVersion& e) {
    return app.exit(e);
  } catch (const CLI::ParseError& e) {
    app.exit(e);
    return static_cast<int>(sifter::ExitCode::kBadInput);
  }
  try {
    for (auto* sub : app.get_subcommands())
      if (auto it = actions.find(sub); it != actions.end()) return it->second();
    return static_cast<int>(sifter::ExitCode::kBadInput);
  } catch (const sifter::Error& e) {
    std::cerr << "sifter: " << sifter::escape_controls(e.what()) << "\n";
    return static_cast<int>(e.exit_code());
  } catch (const std::exception& e) {
    std::cerr << "sifter: internal error: " << sifter::escape_controls(e.what()) << "\n";
    return static_cast<int>(sifter::ExitCode::kInternal);
  }
}
