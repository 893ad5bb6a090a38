// `sifter check`: verify a project and write the summary, JSON and CSV.
#include <iostream>
#include <memory>
#include <optional>

#include "commands.hpp"
#include "sifter/load.hpp"
#include "sifter/report/json_results.hpp"
#include "sifter/report/output_file.hpp"
#include "sifter/report/terminal.hpp"
#include "sifter/report/worksheet.hpp"
#include "sifter/verify.hpp"

namespace sifter::cli {
namespace {
struct CheckOptions {
  std::string project;
  std::string json_path;
  std::string worksheet_csv_path;
  bool quiet = false;
  bool no_exact = false;
};
}  // namespace

Action add_check_command(CLI::App& app) {
  auto opts = std::make_shared<CheckOptions>();
  auto* cmd = app.add_subcommand("check", "Verify every SIF (and LOPA scenario) of a project file");
  cmd->add_option("project", opts->project, "the project file (sifter-project/1 JSON)")->required();
  cmd->add_option("--json", opts->json_path, "write sifter-results/1 JSON to FILE ('-' for stdout)");
  cmd->add_option("--worksheet-csv", opts->worksheet_csv_path, "write the LOPA worksheet rows as CSV to FILE");
  cmd->add_flag("--quiet,-q", opts->quiet, "print no summary (errors and warnings still go to stderr)");
  cmd->add_flag("--no-exact", opts->no_exact, "skip the exact time-dependent cross-check");
  return [opts]() {
    report::refuse_overwriting_inputs({opts->json_path, opts->worksheet_csv_path}, {opts->project});
    const LoadedProject loaded = load_project_file(opts->project);
    VerifyOptions vo;
    vo.exact = !opts->no_exact;
    const ProjectResult result = verify_project(loaded, vo);
    // Render everything before any output is renamed into place, so that a failure leaves no
    // partial output. The JSON goes SIF by SIF into its temporary file: a register of
    // thousands of SIFs is never one tree in memory.
    std::optional<report::AtomicOutput> json_out, csv_out;
    if (!opts->json_path.empty()) {
      json_out.emplace(opts->json_path);
      report::write_results_json(result, json_out->stream());
      json_out->stream() << "\n";
    }
    if (!opts->worksheet_csv_path.empty()) {
      csv_out.emplace(opts->worksheet_csv_path);
      csv_out->stream() << report::worksheet_csv(result);
    }
    const bool summary_to_stdout = !opts->quiet && opts->json_path != "-";
    const std::string summary = summary_to_stdout ? report::render_terminal(result) : "";
    if (json_out) json_out->commit();
    if (csv_out) csv_out->commit();
    if (summary_to_stdout) std::cout << summary;
    return static_cast<int>(result.all_met() ? ExitCode::kAllMet : ExitCode::kShortfall);
  };
}

}  // namespace sifter::cli
