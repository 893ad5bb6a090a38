// `sifter sensitivity`: which input moves a SIF's PFDavg most (a tornado table).
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
struct SensitivityOptions {
  std::string project;
  std::string sif;
  std::string factor = "2";
  std::string json_path;
};
}  // namespace

Action add_sensitivity_command(CLI::App& app) {
  auto opts = std::make_shared<SensitivityOptions>();
  auto* cmd = app.add_subcommand("sensitivity", "Rank a SIF's inputs by how much they move its PFDavg (tornado)");
  // The what-ifs answer a question; the verdict of check is not their exit status.
  cmd->footer(
      "Exit status: 0 the ranking was computed, whether the SIF meets its target or not; 2 bad input or usage.");
  cmd->add_option("project", opts->project, "the project file (sifter-project/1 JSON)")->required();
  cmd->add_option("--sif", opts->sif, "the SIF's id")->required();
  cmd->add_option("--factor", opts->factor, "divide and multiply each input by this (default 2)");
  cmd->add_option("--json", opts->json_path, "write the ranking as JSON to FILE ('-' for stdout)");
  return [opts]() {
    report::refuse_overwriting_inputs({opts->json_path}, {opts->project});
    const double factor = number_arg("--factor", opts->factor);
    const LoadedProject loaded = load_project_file(opts->project);
    report::refuse_overwriting_inputs({opts->json_path}, loaded.inputs);
    const std::size_t sif = sif_index(loaded.project, opts->sif);
    const WhatIf what_if(loaded.project);
    const SensitivityResult result = sensitivity(what_if, sif, factor);
    emit(opts->json_path, report::sensitivity_json(result).dump(2) + "\n",
         report::render_sensitivity(result, terminal_width()));
    return static_cast<int>(ExitCode::kAllMet);
  };
}

}  // namespace sifter::cli
