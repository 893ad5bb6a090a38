// `sifter check`: verify a project and write the summary, JSON and CSV.
#include <unistd.h>

#include <iostream>
#include <memory>
#include <optional>

#include "commands.hpp"
#include "sifter/load.hpp"
#include "sifter/maturity.hpp"
#include "sifter/report/csv.hpp"
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
  std::string csv_path;
  bool quiet = false;
  bool no_exact = false;
  bool final = false;
  int samples = 0;
  std::uint64_t seed = 1;
  int threads = 0;
};

// A progress bar on stderr, only when it is a terminal and the run is long enough to need one.
std::function<void(long long, long long)> progress_bar() {
  if (!::isatty(STDERR_FILENO)) return {};
  auto last = std::make_shared<int>(-1);
  return [last](long long done, long long total) {
    const int percent = total > 0 ? static_cast<int>(100 * done / total) : 100;
    if (percent == *last) return;
    *last = percent;
    const int width = 40, filled = percent * width / 100;
    std::cerr << "\rMonte Carlo [" << std::string(static_cast<std::size_t>(filled), '#')
              << std::string(static_cast<std::size_t>(width - filled), '.') << "] " << percent << "%"
              << (done >= total ? "\n" : "") << std::flush;
  };
}
}  // namespace

Action add_check_command(CLI::App& app) {
  auto opts = std::make_shared<CheckOptions>();
  auto* cmd = app.add_subcommand("check", "Verify every SIF (and LOPA scenario) of a project file");
  cmd->add_option("project", opts->project, "the project file (sifter-project/1 JSON)")->required();
  cmd->add_option("--json", opts->json_path, "write sifter-results/1 JSON to FILE ('-' for stdout)");
  cmd->add_option("--worksheet-csv", opts->worksheet_csv_path, "write the LOPA worksheet rows as CSV to FILE");
  cmd->add_option("--csv", opts->csv_path, "write one CSV row per SIF with its key results to FILE");
  cmd->add_flag("--quiet,-q", opts->quiet, "print no summary (errors and warnings still go to stderr)");
  cmd->add_flag("--final", opts->final,
                "fail (exit 1) while any verdict rests on a datum marked \"estimate\", and list them");
  cmd->add_flag("--no-exact", opts->no_exact, "skip the exact time-dependent cross-check");
  cmd->add_option("--samples", opts->samples, "Monte Carlo samples per SIF on the uncertain failure data")
      ->check(CLI::Range(0, 10000000));
  cmd->add_option("--seed", opts->seed, "seed of the Monte Carlo (same seed, same results)");
  cmd->add_option("--threads", opts->threads, "threads for the Monte Carlo (default: every core)")
      ->check(CLI::Range(0, 256));
  return [opts]() {
    report::refuse_overwriting_inputs({opts->json_path, opts->worksheet_csv_path, opts->csv_path}, {opts->project});
    const LoadedProject loaded = load_project_file(opts->project);
    VerifyOptions vo;
    vo.exact = !opts->no_exact;
    vo.samples = opts->samples;
    vo.seed = opts->seed;
    vo.threads = opts->threads;
    if (opts->samples > 0) vo.progress = progress_bar();
    const ProjectResult result = verify_project(loaded, vo);
    // Render everything before any output is renamed into place, so that a failure leaves no
    // partial output. The JSON goes SIF by SIF into its temporary file: a register of
    // thousands of SIFs is never one tree in memory.
    std::optional<report::AtomicOutput> json_out, csv_out, rows_out;
    if (!opts->json_path.empty()) {
      json_out.emplace(opts->json_path);
      report::write_results_json(result, json_out->stream());
      json_out->stream() << "\n";
    }
    if (!opts->worksheet_csv_path.empty()) {
      csv_out.emplace(opts->worksheet_csv_path);
      csv_out->stream() << report::worksheet_csv(result);
    }
    if (!opts->csv_path.empty()) {
      rows_out.emplace(opts->csv_path);
      rows_out->stream() << report::sif_csv(result);
    }
    const bool summary_to_stdout = !opts->quiet && opts->json_path != "-";
    const std::string summary = summary_to_stdout ? report::render_terminal(result) : "";
    if (json_out) json_out->commit();
    if (csv_out) csv_out->commit();
    if (rows_out) rows_out->commit();
    if (summary_to_stdout) std::cout << summary;
    if (opts->final) {
      const auto preliminary = preliminary_verdicts(result);
      for (const auto& line : preliminary) std::cerr << "sifter: preliminary, not final: " << line << "\n";
      if (!preliminary.empty()) return static_cast<int>(ExitCode::kShortfall);
    }
    return static_cast<int>(result.all_met() ? ExitCode::kAllMet : ExitCode::kShortfall);
  };
}

}  // namespace sifter::cli
