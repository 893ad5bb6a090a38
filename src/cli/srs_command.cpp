// `sifter srs`: verify a project and write its safety requirements specification.
#include <filesystem>
#include <memory>

#include "commands.hpp"
#include "sifter/analysis/deliverable.hpp"
#include "sifter/analysis/verify.hpp"
#include "sifter/input/load.hpp"
#include "sifter/model/diagnostics.hpp"
#include "sifter/report/output_file.hpp"
#include "sifter/report/srs.hpp"

namespace sifter::cli {
namespace {

struct SrsCommandOptions {
  std::string project;
  std::string output;
  std::string sif;
  bool no_exact = false;
};

// Markdown for .md (or .markdown); HTML for .html, .htm, no extension or "-" (stdout).
bool is_markdown(const std::string& output) {
  if (output == "-") return false;
  const std::string ext = std::filesystem::path(output).extension().string();
  if (ext == ".md" || ext == ".markdown") return true;
  if (ext.empty() || ext == ".html" || ext == ".htm") return false;
  throw UsageError("cannot tell the format of " + output + ": expected a name ending in .html or .md, found \"" + ext +
                   "\"");
}

}  // namespace

Action add_srs_command(CLI::App& app) {
  auto opts = std::make_shared<SrsCommandOptions>();
  auto* cmd = app.add_subcommand("srs",
                                 "Write the safety requirements specification (HTML or Markdown), one "
                                 "section per SIF with its open items");
  cmd->add_option("project", opts->project, "the project file (sifter-project/1 JSON)")->required();
  cmd->add_option("-o,--output", opts->output, "the specification: NAME.html (default format) or NAME.md")->required();
  cmd->add_option("--sif", opts->sif, "only this SIF (by id)");
  cmd->add_flag("--no-exact", opts->no_exact, "skip the exact time-dependent cross-check");
  return [opts]() {
    report::refuse_overwriting_inputs({opts->output}, {opts->project});
    const bool markdown = is_markdown(opts->output);
    const LoadedProject loaded = load_project_file(opts->project);
    report::SrsOptions so;
    if (!opts->sif.empty()) {
      const Sif& wanted = find_sif(loaded.project, opts->sif);
      so.sifs.push_back(static_cast<std::size_t>(&wanted - loaded.project.sifs.data()));
    } else {
      for (std::size_t i = 0; i < loaded.project.sifs.size(); ++i) so.sifs.push_back(i);
    }
    VerifyOptions vo;
    vo.exact = !opts->no_exact;
    const ProjectResult result = verify_project(loaded, vo);
    const DeliverableData data = build_deliverable_data(loaded.project, result);
    so.date = run_date();
    so.tool_version = SIFTER_VERSION;
    const std::string text =
        markdown ? report::render_srs_markdown(result, data, so) : report::render_srs_html(result, data, so);
    report::write_output(opts->output, text);
    // Written whatever the verdicts; the status says, as for `report`, whether every SIF meets them.
    return static_cast<int>(result.all_met() ? ExitCode::kAllMet : ExitCode::kShortfall);
  };
}

}  // namespace sifter::cli
