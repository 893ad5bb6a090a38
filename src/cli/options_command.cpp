// `sifter options`: the alternatives listed for a scenario, judged and ranked by lifecycle cost.
#include <iostream>
#include <memory>
#include <optional>

#include "commands.hpp"
#include "sifter/analysis/options.hpp"
#include "sifter/input/load.hpp"
#include "sifter/report/options_text.hpp"
#include "sifter/report/output_file.hpp"

namespace sifter::cli {
namespace {
struct OptionsCommandOptions {
  std::string project;
  std::string scenario;
  std::string json_path;
  bool no_exact = false;
};
}  // namespace

Action add_options_command(CLI::App& app) {
  auto opts = std::make_shared<OptionsCommandOptions>();
  auto* cmd = app.add_subcommand("options", "Compare the alternatives a project lists for a scenario");
  cmd->add_option("project", opts->project, "the project file (sifter-project/1 JSON)")->required();
  cmd->add_option("--scenario", opts->scenario, "the scenario id (written, or generated: OP-<item>-by-<source>)")
      ->required();
  cmd->add_option("--json", opts->json_path, "write sifter-options/1 JSON to FILE ('-' for stdout)");
  cmd->add_flag("--no-exact", opts->no_exact, "skip the exact time-dependent cross-check");
  return [opts]() {
    report::refuse_overwriting_inputs({opts->json_path}, {opts->project});
    const LoadedProject loaded = load_project_file(opts->project);
    VerifyOptions vo;
    vo.exact = !opts->no_exact;
    const ScenarioOptions result = compare_options(loaded, opts->scenario, vo);
    std::optional<report::AtomicOutput> json_out;
    if (!opts->json_path.empty()) {
      json_out.emplace(opts->json_path);
      json_out->stream() << report::options_json(result).dump(2) << "\n";
    }
    const std::string text = opts->json_path == "-" ? "" : report::render_options_text(result);
    if (json_out) json_out->commit();
    std::cout << text;
    const bool any =
        !result.options.empty() && result.options.front().feasible && result.options.front().makes_tolerable;
    return static_cast<int>(any ? ExitCode::kAllMet : ExitCode::kShortfall);
  };
}

}  // namespace sifter::cli
