// `sifter sweep`: one parameter of a SIF varied over a range, a row per value.
#include <iostream>
#include <memory>

#include "commands.hpp"
#include "sifter/input/load.hpp"
#include "sifter/model/printable.hpp"
#include "sifter/report/output_file.hpp"
#include "sifter/report/whatif_json.hpp"
#include "sifter/report/whatif_text.hpp"
#include "terminal_width.hpp"
#include "whatif_args.hpp"

namespace sifter::cli {
namespace {
struct SweepOptions {
  std::string project;
  std::string sif;
  std::string parameter;
  std::string subsystem;
  std::string from;
  std::string to;
  int steps = 11;
  bool log = false;
  std::string json_path;
  std::string csv_path;
};
}  // namespace

Action add_sweep_command(CLI::App& app) {
  auto opts = std::make_shared<SweepOptions>();
  auto* cmd = app.add_subcommand("sweep", "Vary one parameter of a SIF over a range and verify at each value");
  // The what-ifs answer a question; the verdict of check is not their exit status.
  cmd->footer(
      "Exit status: 0 the sweep was computed, whatever the verdicts at its values (each is in its row); "
      "2 bad input or usage.");
  cmd->add_option("project", opts->project, "the project file (sifter-project/1 JSON)")->required();
  cmd->add_option("--sif", opts->sif, "the SIF's id")->required();
  cmd->add_option("--vary", opts->parameter, "the parameter: " + sweep_parameter_names())->required();
  cmd->add_option("--subsystem", opts->subsystem, "vary this subsystem only (default: every subsystem with channels)");
  cmd->add_option("--from", opts->from, "first value: a duration (\"1 mo\"), a fraction (0.02, \"2%\") or a factor")
      ->required();
  cmd->add_option("--to", opts->to, "last value, in the same terms")->required();
  cmd->add_option("--steps", opts->steps, "number of values, ends included (default 11)");
  cmd->add_flag("--log", opts->log, "space the values evenly on a log scale");
  cmd->add_option("--json", opts->json_path, "write the points as JSON to FILE ('-' for stdout)");
  cmd->add_option("--csv", opts->csv_path, "write the points as CSV to FILE");
  return [opts]() {
    report::refuse_overwriting_inputs({opts->json_path, opts->csv_path}, {opts->project});
    const auto parameter = parse_sweep_parameter(opts->parameter);
    if (!parameter)
      throw UsageError("--vary: unknown parameter \"" + opts->parameter +
                       "\"; the parameters are: " + sweep_parameter_names());
    SweepRequest request;
    request.parameter = *parameter;
    request.from = sweep_value_arg(*parameter, "--from", opts->from);
    request.to = sweep_value_arg(*parameter, "--to", opts->to);
    request.steps = opts->steps;
    request.log = opts->log;
    const LoadedProject loaded = load_project_file(opts->project);
    report::refuse_overwriting_inputs({opts->json_path, opts->csv_path}, loaded.inputs);
    request.sif = sif_index(loaded.project, opts->sif);
    request.subsystem = subsystem_index(loaded.project.sifs[request.sif], opts->subsystem);
    const WhatIf what_if(loaded.project);
    const SweepResult result = sweep(what_if, request);
    const std::string json_text = opts->json_path.empty() ? "" : report::sweep_json(result).dump(2) + "\n";
    const std::string csv = opts->csv_path.empty() ? "" : report::sweep_csv(result);
    const std::string text = report::render_sweep(result, terminal_width());
    report::write_outputs({{opts->csv_path, csv}, {opts->json_path, json_text}});
    if (opts->json_path != "-") std::cout << escape_controls(text);
    return static_cast<int>(ExitCode::kAllMet);
  };
}

}  // namespace sifter::cli
