// `sifter service`: in-service records against the design: rates, verdicts, counts, schedule.
#include <cstdlib>
#include <ctime>
#include <iostream>
#include <memory>
#include <optional>

#include "commands.hpp"
#include "sifter/analysis/service.hpp"
#include "sifter/input/load.hpp"
#include "sifter/model/records.hpp"
#include "sifter/report/output_file.hpp"
#include "sifter/report/service.hpp"

namespace sifter::cli {
namespace {
struct ServiceCommandOptions {
  std::string project;
  std::string records;
  std::string as_of;
  std::string json_path;
  std::string csv_path;
  std::string ics_path;
  double prior_hours = kDefaultPriorHours;
  bool no_exact = false;
};
}  // namespace

CivilDate as_of_arg(const std::string& text) {
  if (text.empty()) {
    // Today (UTC), or the day of SOURCE_DATE_EPOCH when set, so that a run can be reproduced.
    std::time_t now = std::time(nullptr);
    if (const char* epoch = std::getenv("SOURCE_DATE_EPOCH"); epoch && *epoch) {
      char* end = nullptr;
      const long long v = std::strtoll(epoch, &end, 10);
      if (end && *end == '\0' && v >= 0) now = static_cast<std::time_t>(v);
    }
    std::tm utc{};
    gmtime_r(&now, &utc);
    return CivilDate{utc.tm_year + 1900, utc.tm_mon + 1, utc.tm_mday};
  }
  if (auto d = parse_iso_date(text)) return *d;
  throw UsageError("--as-of: expected a date written YYYY-MM-DD (ISO 8601), found \"" + text + "\"");
}

Action add_service_command(CLI::App& app) {
  auto opts = std::make_shared<ServiceCommandOptions>();
  auto* cmd = app.add_subcommand("service", "Compare in-service records (proof tests, demands, trips) with the design");
  cmd->add_option("project", opts->project, "the project file (sifter-project/1 JSON)")->required();
  cmd->add_option("records", opts->records, "the records: sifter-records/1 JSON, or CSV (NAME.csv)")->required();
  cmd->add_option("--as-of", opts->as_of, "the date of the review, YYYY-MM-DD (default: today, UTC)");
  cmd->add_option("--json", opts->json_path, "write sifter-service/1 JSON to FILE ('-' for stdout)");
  cmd->add_option("--csv", opts->csv_path, "write one CSV row per component model to FILE");
  cmd->add_option("--ics", opts->ics_path, "write the due proof tests as an iCalendar file (RFC 5545) to FILE");
  cmd->add_option("--prior-hours", opts->prior_hours,
                  "weight of the design rate in the posterior, in equivalent service hours (default 1e6)")
      ->check(CLI::Range(1.0, 1e12));
  cmd->add_flag("--no-exact", opts->no_exact, "skip the exact time-dependent cross-check");
  return [opts]() {
    report::refuse_overwriting_inputs({opts->json_path, opts->csv_path, opts->ics_path},
                                      {opts->project, opts->records});
    const CivilDate as_of = as_of_arg(opts->as_of);
    const LoadedProject loaded = load_project_file(opts->project);
    const ServiceRecords records = load_records_file(opts->records, loaded.project, as_of);
    ServiceOptions so;
    so.prior_hours = opts->prior_hours;
    so.verify.exact = !opts->no_exact;
    const ServiceResult result = assess_service(loaded, records, so);
    // Everything is rendered before anything is renamed into place: all or nothing.
    std::optional<report::AtomicOutput> json_out, csv_out, ics_out;
    if (!opts->json_path.empty()) {
      json_out.emplace(opts->json_path);
      json_out->stream() << report::service_json(result).dump(2) << "\n";
    }
    if (!opts->csv_path.empty()) {
      csv_out.emplace(opts->csv_path);
      csv_out->stream() << report::service_csv(result);
    }
    if (!opts->ics_path.empty()) {
      ics_out.emplace(opts->ics_path);
      ics_out->stream() << report::service_ics(result);
    }
    const bool to_stdout = opts->json_path != "-" && opts->csv_path != "-" && opts->ics_path != "-";
    const std::string text = to_stdout ? report::render_service(result) : "";
    if (json_out) json_out->commit();
    if (csv_out) csv_out->commit();
    if (ics_out) ics_out->commit();
    if (to_stdout) std::cout << text;
    bool act = false;
    for (const auto& s : result.sifs) act = act || s.meets_judged == false || s.any_overdue;
    return static_cast<int>(act ? ExitCode::kShortfall : ExitCode::kAllMet);
  };
}

}  // namespace sifter::cli
