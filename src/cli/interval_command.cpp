// `sifter interval`: the longest proof-test interval with which a SIF still meets its target.
#include <memory>

#include "commands.hpp"
#include "sifter/input/load.hpp"
#include "sifter/report/output_file.hpp"
#include "sifter/report/whatif_json.hpp"
#include "sifter/report/whatif_text.hpp"
#include "terminal_width.hpp"
#include "whatif_args.hpp"

namespace sifter::cli {
namespace {
struct IntervalOptions {
  std::string project;
  std::string sif;
  std::string subsystem;
  std::string margin = "0";
  std::string json_path;
};
}  // namespace

Action add_interval_command(CLI::App& app) {
  auto opts = std::make_shared<IntervalOptions>();
  auto* cmd = app.add_subcommand("interval", "Longest proof-test interval with which a SIF still meets its target");
  // The what-ifs answer a question; the verdict of check is not their exit status.
  cmd->footer(
      "Exit status: 0 an interval up to the mission time meets the requirement (also when the present one does not); "
      "1 no interval does; 2 bad input or usage.");
  cmd->add_option("project", opts->project, "the project file (sifter-project/1 JSON)")->required();
  cmd->add_option("--sif", opts->sif, "the SIF's id")->required();
  cmd->add_option("--subsystem", opts->subsystem, "vary this subsystem's interval only (default: all, together)");
  cmd->add_option("--margin", opts->margin, "keep this fraction below the requirement, e.g. 0.2 or 20%");
  cmd->add_option("--json", opts->json_path, "write the answer as JSON to FILE ('-' for stdout)");
  return [opts]() {
    report::refuse_overwriting_inputs({opts->json_path}, {opts->project});
    const double margin = fraction_arg("--margin", opts->margin);
    const LoadedProject loaded = load_project_file(opts->project);
    report::refuse_overwriting_inputs({opts->json_path}, loaded.inputs);
    const std::size_t sif = sif_index(loaded.project, opts->sif);
    const auto subsystem = subsystem_index(loaded.project.sifs[sif], opts->subsystem);
    const WhatIf what_if(loaded.project);
    const IntervalResult result = longest_proof_test_interval(what_if, sif, subsystem, margin);
    emit(opts->json_path, report::interval_json(result).dump(2) + "\n",
         report::render_interval(result, terminal_width()));
    return static_cast<int>(result.outcome == IntervalOutcome::kNone ? ExitCode::kShortfall : ExitCode::kAllMet);
  };
}

}  // namespace sifter::cli
