// `sifter check`: verify a project and write the summary, JSON and CSV.
#include <unistd.h>

#include <future>
#include <iostream>
#include <memory>
#include <optional>

#include "commands.hpp"
#include "sifter/analysis/maturity.hpp"
#include "sifter/analysis/verify.hpp"
#include "sifter/input/load.hpp"
#include "sifter/model/cores.hpp"
#include "sifter/model/printable.hpp"
#include "sifter/report/csv.hpp"
#include "sifter/report/json_results.hpp"
#include "sifter/report/output_file.hpp"
#include "sifter/report/terminal.hpp"
#include "sifter/report/worksheet.hpp"
#include "sifter/report/xlsx.hpp"
#include "terminal_width.hpp"

namespace sifter::cli {
namespace {
struct CheckOptions {
  std::string project;
  std::string json_path;
  std::string worksheet_csv_path;
  std::string csv_path;
  std::string xlsx_path;
  std::vector<std::string> sifs;
  bool summary = false;
  bool quiet = false;
  bool no_exact = false;
  bool pretty = false;
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

// Verifies, renders every output, then commits them all: nothing is written if any fails.
VerifyOptions verify_options(const CheckOptions& options) {
  VerifyOptions vo;
  vo.exact = !options.no_exact;
  vo.samples = options.samples;
  vo.seed = options.seed;
  vo.threads = options.threads;
  if (options.samples > 0) vo.progress = progress_bar();
  return vo;
}

// The files check writes, each whole in its temporary file until they are renamed together.
struct CheckFiles {
  std::optional<report::AtomicOutput> json, worksheet, rows, xlsx;
  void commit() {
    report::commit_all(
        {json ? &*json : nullptr, worksheet ? &*worksheet : nullptr, rows ? &*rows : nullptr, xlsx ? &*xlsx : nullptr});
  }
};

// The JSON goes SIF by SIF into its temporary file: a register of thousands of SIFs is never
// one tree in memory.
void write_files(const CheckOptions& options, const LoadedProject& loaded, const ProjectResult& result,
                 CheckFiles& files) {
  if (!options.json_path.empty()) {
    files.json.emplace(options.json_path);
    report::write_results_json(result, files.json->stream(),
                               options.pretty ? report::JsonLayout::kPretty : report::JsonLayout::kCompact,
                               options.threads);
    files.json->stream() << "\n";
  }
  if (!options.worksheet_csv_path.empty()) {
    files.worksheet.emplace(options.worksheet_csv_path);
    files.worksheet->stream() << report::worksheet_csv(result);
  }
  if (!options.csv_path.empty()) {
    files.rows.emplace(options.csv_path);
    files.rows->stream() << report::sif_csv(result);
  }
  if (!options.xlsx_path.empty()) {
    const std::string workbook = report::workbook_xlsx(result, loaded.project.components);
    files.xlsx.emplace(options.xlsx_path);
    files.xlsx->stream() << workbook;
  }
}

int run_check(const CheckOptions& options) {
  report::refuse_overwriting_inputs(
      {options.json_path, options.worksheet_csv_path, options.csv_path, options.xlsx_path}, {options.project});
  const LoadedProject& loaded = keep_until_exit(load_project_file(options.project));
  report::refuse_overwriting_inputs(
      {options.json_path, options.worksheet_csv_path, options.csv_path, options.xlsx_path}, loaded.inputs);
  for (const auto& id : options.sifs) find_sif(loaded.project, id);  // an unknown id is a usage error
  const bool summary_to_stdout = !options.quiet && options.json_path != "-";
  report::TerminalOptions terminal;
  terminal.width = terminal_width();
  terminal.sifs = options.sifs;
  terminal.summary = options.summary;
  VerifyOptions verify = verify_options(options);
  // The LOPA worksheet rows only where something prints them: the worksheet CSV, the workbook,
  // or the terminal's full blocks. A register's run (one line per SIF, the results JSON) is
  // spared building and holding them; nothing else depends on them.
  verify.worksheet_rows = !options.worksheet_csv_path.empty() || !options.xlsx_path.empty() ||
                          (summary_to_stdout && report::shows_full_blocks(loaded.project.sifs.size(), terminal));
  verify.response_budgets = false;  // printed by the SRS and the report, by no output of check
  const ProjectResult& result = keep_until_exit(verify_project(loaded, verify));
  // Render everything before any output is renamed into place, so that a failure leaves no
  // partial output. The terminal text is rendered on a second core while the files are written
  // (both only read the results); it is printed after every file is in place.
  auto summary_text = alongside(summary_to_stdout ? options.threads : 1, [&]() -> std::string {
    return summary_to_stdout ? escape_controls(report::render_terminal(result, terminal)) : "";
  });
  CheckFiles files;
  write_files(options, loaded, result, files);
  const std::string summary = summary_text.get();
  files.commit();
  if (summary_to_stdout) {
    std::cout << summary;
  } else {
    // Without the summary the warnings still reach the user, as --quiet promises.
    for (const auto& w : result.warnings)
      std::cerr << "sifter: warning: " << escape_controls(w.where) << ": " << escape_controls(w.message) << "\n";
  }
  if (options.final) {
    const auto preliminary = preliminary_verdicts(result);
    for (const auto& line : preliminary)
      std::cerr << "sifter: preliminary, not final: " << escape_controls(line) << "\n";
    if (!preliminary.empty()) return static_cast<int>(ExitCode::kShortfall);
  }
  return static_cast<int>(result.all_met() ? ExitCode::kAllMet : ExitCode::kShortfall);
}
}  // namespace

Action add_check_command(CLI::App& app) {
  auto opts = std::make_shared<CheckOptions>();
  auto* cmd = app.add_subcommand("check", "Verify every SIF (and LOPA scenario) of a project file");
  cmd->add_option("project", opts->project, "the project file (sifter-project/1 JSON)")->required();
  cmd->add_option("--json", opts->json_path, "write sifter-results/1 JSON to FILE ('-' for stdout)");
  cmd->add_option("--worksheet-csv", opts->worksheet_csv_path, "write the LOPA worksheet rows as CSV to FILE");
  cmd->add_option("--csv", opts->csv_path, "write one CSV row per SIF with its key results to FILE");
  cmd->add_option("--xlsx", opts->xlsx_path, "write the results as a spreadsheet workbook (.xlsx) to FILE");
  cmd->add_option("--sif", opts->sifs, "show only this SIF (full block) and its scenarios; repeatable")
      ->allow_extra_args(false)  // one id per --sif, so that a project named after it is not taken for one
      ->multi_option_policy(CLI::MultiOptionPolicy::TakeAll);
  cmd->add_flag(
      "--summary", opts->summary,
      "one line per SIF and scenario (the default above " + std::to_string(report::kSummaryAboveSifs) + " SIFs)");
  cmd->add_flag("--pretty", opts->pretty, "indent the --json output for reading (compact by default)");
  cmd->add_flag("--quiet,-q", opts->quiet, "print no summary (errors and warnings still go to stderr)");
  cmd->add_flag("--final", opts->final,
                "fail (exit 1) while any verdict rests on a datum marked \"estimate\", and list them");
  cmd->add_flag("--no-exact", opts->no_exact, "skip the exact time-dependent cross-check");
  cmd->add_option("--samples", opts->samples, "Monte Carlo samples per SIF on the uncertain failure data")
      ->check(CLI::Range(0, 10000000));
  cmd->add_option("--seed", opts->seed, "seed of the Monte Carlo (same seed, same results)");
  cmd->add_option("--threads", opts->threads, "threads for verification and the Monte Carlo (default: every core)")
      ->check(CLI::Range(0, 256));
  return [opts]() { return run_check(*opts); };
}

}  // namespace sifter::cli
