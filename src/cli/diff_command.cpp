// `sifter diff`: what changed between two revisions of a project, and whose verdict moved.
#include <memory>

#include "commands.hpp"
#include "sifter/analysis/diff.hpp"
#include "sifter/input/load.hpp"
#include "sifter/report/diff_text.hpp"
#include "sifter/report/output_file.hpp"
#include "terminal_width.hpp"
#include "whatif_args.hpp"

namespace sifter::cli {
namespace {
struct DiffOptions {
  std::string old_project;
  std::string new_project;
  std::string json_path;
};
}  // namespace

Action add_diff_command(CLI::App& app) {
  auto opts = std::make_shared<DiffOptions>();
  auto* cmd = app.add_subcommand("diff", "Compare two revisions of a project: changed inputs, results and verdicts");
  cmd->add_option("old", opts->old_project, "the earlier revision")->required();
  cmd->add_option("new", opts->new_project, "the later revision")->required();
  cmd->add_option("--json", opts->json_path, "write the differences as JSON to FILE ('-' for stdout)");
  cmd->footer("Exit status: 0 no verdict worsened; 1 some SIF or scenario now falls short; 2 bad input or usage.");
  return [opts]() {
    report::refuse_overwriting_inputs({opts->json_path}, {opts->old_project, opts->new_project});
    const LoadedProject old_loaded = load_project_file(opts->old_project);
    const LoadedProject new_loaded = load_project_file(opts->new_project);
    std::vector<std::string> inputs = old_loaded.inputs;
    inputs.insert(inputs.end(), new_loaded.inputs.begin(), new_loaded.inputs.end());
    report::refuse_overwriting_inputs({opts->json_path}, inputs);
    VerifyOptions vo;
    vo.exact = false;
    const ProjectDiff diff = diff_projects(old_loaded.project, verify_project(old_loaded, vo), new_loaded.project,
                                           verify_project(new_loaded, vo));
    emit(opts->json_path, report::diff_json(diff).dump(2) + "\n", report::render_diff(diff, terminal_width()));
    return static_cast<int>(diff.any_worsened() ? ExitCode::kShortfall : ExitCode::kAllMet);
  };
}

}  // namespace sifter::cli
