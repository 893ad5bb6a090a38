// `sifter compare`: one subsystem re-voted, side by side.
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
struct CompareOptions {
  std::string project;
  std::string sif;
  std::string subsystem;
  std::string votes;
  std::string beta;
  std::string json_path;
};
}  // namespace

Action add_compare_command(CLI::App& app) {
  auto opts = std::make_shared<CompareOptions>();
  auto* cmd = app.add_subcommand("compare", "Compare votes of one subsystem: PFDavg, SILs and spurious trips");
  // The what-ifs answer a question; the verdict of check is not their exit status.
  cmd->footer(
      "Exit status: 0 the votes were compared, whatever their verdicts (each is in its row); 2 bad input or usage.");
  cmd->add_option("project", opts->project, "the project file (sifter-project/1 JSON)")->required();
  cmd->add_option("--sif", opts->sif, "the SIF's id")->required();
  cmd->add_option("--subsystem", opts->subsystem, "the subsystem to re-vote")->required();
  cmd->add_option("--votes", opts->votes, "the votes, e.g. 1oo1,1oo2,2oo3")->required();
  cmd->add_option("--beta", opts->beta, "common-cause fraction for the redundant votes, e.g. 5% (needed if none)");
  cmd->add_option("--json", opts->json_path, "write the comparison as JSON to FILE ('-' for stdout)");
  return [opts]() {
    report::refuse_overwriting_inputs({opts->json_path}, {opts->project});
    const std::vector<Vote> votes = votes_arg(opts->votes);
    const std::optional<double> beta =
        opts->beta.empty() ? std::nullopt : std::optional(fraction_arg("--beta", opts->beta));
    const LoadedProject loaded = load_project_file(opts->project);
    report::refuse_overwriting_inputs({opts->json_path}, loaded.inputs);
    const std::size_t sif = sif_index(loaded.project, opts->sif);
    const auto subsystem = subsystem_index(loaded.project.sifs[sif], opts->subsystem);
    const WhatIf what_if(loaded.project);
    const CompareResult result = compare_votes(what_if, sif, *subsystem, votes, beta);
    emit(opts->json_path, report::compare_json(result).dump(2) + "\n",
         report::render_compare(result, terminal_width()));
    return static_cast<int>(ExitCode::kAllMet);
  };
}

}  // namespace sifter::cli
