// `sifter report`: verify a project and write the report a reviewer reads, as HTML or Markdown.
#include <cstdint>
#include <cstdlib>
#include <ctime>
#include <filesystem>
#include <memory>
#include <optional>

#include "commands.hpp"
#include "sifter/analysis/report_data.hpp"
#include "sifter/analysis/service.hpp"
#include "sifter/analysis/verify.hpp"
#include "sifter/input/load.hpp"
#include "sifter/model/diagnostics.hpp"
#include "sifter/report/html.hpp"
#include "sifter/report/markdown.hpp"
#include "sifter/report/output_file.hpp"

namespace sifter::cli {
namespace {

struct ReportCommandOptions {
  std::string project;
  std::string output;
  bool no_exact = false;
  int samples = 0;
  std::uint64_t seed = 1;
  bool compact = false;
  std::string records;  ///< in-service records for the "service" section
  std::string as_of;
};

enum class ReportFormat { kHtml, kMarkdown };

// The format from the output's extension: .md (or .markdown) is Markdown; .html, .htm, none or
// "-" (stdout) is HTML.
ReportFormat format_of(const std::string& output) {
  if (output == "-") return ReportFormat::kHtml;
  const std::string ext = std::filesystem::path(output).extension().string();
  if (ext == ".md" || ext == ".markdown") return ReportFormat::kMarkdown;
  if (ext.empty() || ext == ".html" || ext == ".htm") return ReportFormat::kHtml;
  throw UsageError("cannot tell the format of " + output + ": expected a name ending in .html or .md, found \"" + ext +
                   "\"");
}

}  // namespace

std::string run_date() {
  std::time_t now = std::time(nullptr);
  if (const char* epoch = std::getenv("SOURCE_DATE_EPOCH"); epoch && *epoch) {
    char* end = nullptr;
    const long long v = std::strtoll(epoch, &end, 10);
    if (end && *end == '\0' && v >= 0) now = static_cast<std::time_t>(v);
  }
  std::tm utc{};
  gmtime_r(&now, &utc);
  char buf[16];
  std::strftime(buf, sizeof buf, "%Y-%m-%d", &utc);
  return buf;
}

Action add_report_command(CLI::App& app) {
  auto opts = std::make_shared<ReportCommandOptions>();
  auto* cmd =
      app.add_subcommand("report", "Write a self-contained report (HTML or Markdown) of a project's verification");
  cmd->add_option("project", opts->project, "the project file (sifter-project/1 JSON)")->required();
  cmd->add_option("-o,--output", opts->output, "the report file: NAME.html (default format) or NAME.md")->required();
  cmd->add_flag("--no-exact", opts->no_exact, "skip the exact time-dependent cross-check");
  cmd->add_option("--samples", opts->samples, "Monte Carlo samples per SIF on the uncertain failure data (0: none)")
      ->check(CLI::Range(0, 10000000));
  cmd->add_option("--seed", opts->seed, "seed of the Monte Carlo (the same seed gives the same report)");
  cmd->add_flag("--compact", opts->compact,
                "register mode: each SIF's tables without its curves and rankings, for long registers");
  cmd->add_option("--records", opts->records, "in-service records (as for `sifter service`): adds a service section");
  cmd->add_option("--as-of", opts->as_of, "the date of the records' review, YYYY-MM-DD (default: today, UTC)");
  return [opts]() {
    report::refuse_overwriting_inputs({opts->output}, {opts->project, opts->records});
    const ReportFormat format = format_of(opts->output);
    const LoadedProject loaded = load_project_file(opts->project);
    std::vector<std::string> inputs = loaded.inputs;
    if (!opts->records.empty()) inputs.push_back(opts->records);
    report::refuse_overwriting_inputs({opts->output}, inputs);
    if (!opts->records.empty() && format == ReportFormat::kMarkdown)
      throw UsageError("--records: the service section is written in the HTML report; name the output NAME.html");
    std::optional<ServiceRecords> records;  // read before anything is computed
    if (!opts->records.empty()) records = load_records_file(opts->records, loaded.project, as_of_arg(opts->as_of));
    VerifyOptions vo;
    vo.exact = !opts->no_exact;
    vo.samples = opts->samples;
    vo.seed = opts->seed;
    const ProjectResult result = verify_project(loaded, vo);
    ReportOptions ro;
    ro.date = run_date();
    ro.exact = vo.exact;
    ro.compact = opts->compact;
    ReportData data = build_report_data(loaded.project, result, ro);
    if (records) {
      ServiceOptions so;
      so.verify = vo;
      data.service = std::make_shared<const ServiceResult>(assess_service(loaded, *records, so));
    }
    data.options = compare_all_options(loaded, vo);
    const std::string text =
        format == ReportFormat::kMarkdown ? report::render_markdown(result, data) : report::render_html(result, data);
    report::write_output(opts->output, text);
    return static_cast<int>(result.all_met() ? ExitCode::kAllMet : ExitCode::kShortfall);
  };
}

}  // namespace sifter::cli
