// `sifter curve`: PFD(t) of a SIF and its subsystems over the mission, from the exact engine.
#include <cstdio>
#include <iostream>
#include <memory>
#include <nlohmann/json.hpp>

#include "commands.hpp"
#include "sifter/engines/cross_check.hpp"
#include "sifter/input/load.hpp"
#include "sifter/model/format.hpp"
#include "sifter/model/printable.hpp"
#include "sifter/report/output_file.hpp"
#include "sifter/report/terminal.hpp"
#include "sifter/report/text_table.hpp"
#include "sifter/report/worksheet.hpp"
#include "terminal_width.hpp"

namespace sifter::cli {
namespace {

struct CurveOptions {
  std::string project;
  std::string sif;
  int points = 200;
  std::string csv_path;
  std::string json_path;
};

std::string curve_csv(const PfdPlot& c) {
  std::string out = "time_h,pfd_sif";
  for (const auto& n : c.subsystem_names) out += "," + report::csv_field("pfd " + n);
  out += "\r\n";
  char buf[40];
  for (std::size_t i = 0; i < c.t_hours.size(); ++i) {
    std::snprintf(buf, sizeof buf, "%.6g", sifter::checked(c.t_hours[i], "time"));
    out += buf;
    std::snprintf(buf, sizeof buf, ",%.6e", sifter::checked(c.pfd_sif[i], "pfd"));
    out += buf;
    for (const auto& sub : c.pfd_subsystems) {
      std::snprintf(buf, sizeof buf, ",%.6e", sifter::checked(sub[i], "pfd"));
      out += buf;
    }
    out += "\r\n";
  }
  return out;
}

nlohmann::json curve_json(const std::string& sif, const PfdPlot& c) {
  nlohmann::json j{{"sif", sif},
                   {"pfd_avg_exact", sifter::checked(c.pfd_avg.value_or(0.0), "pfd")},
                   {"time_h", c.t_hours},
                   {"pfd_sif", c.pfd_sif},
                   {"subsystems", nlohmann::json::array()}};
  for (std::size_t i = 0; i < c.subsystem_names.size(); ++i)
    j["subsystems"].push_back({{"name", c.subsystem_names[i]}, {"pfd", c.pfd_subsystems[i]}});
  return j;
}

}  // namespace

const Sif& find_sif(const Project& project, const std::string& id) {
  std::string known;
  for (const auto& s : project.sifs) {
    if (s.id == id) return s;
    known += (known.empty() ? "" : ", ") + s.id;
  }
  throw UsageError("no SIF \"" + id + "\" in " + project.file + "; its SIFs are: " + known);
}

Action add_curve_command(CLI::App& app) {
  auto opts = std::make_shared<CurveOptions>();
  auto* cmd = app.add_subcommand("curve", "PFD(t) of a SIF and its subsystems over the mission (exact engine)");
  // The what-ifs answer a question; the verdict of check is not their exit status.
  cmd->footer("Exit status: 0 the curve was computed, whatever the SIF's verdict; 2 bad input or usage.");
  cmd->add_option("project", opts->project, "the project file")->required();
  cmd->add_option("--sif", opts->sif, "the SIF's id")->required();
  cmd->add_option("--points", opts->points, "evenly spaced samples (every test instant is added)")
      ->check(CLI::Range(2, 100000));
  cmd->add_option("--csv", opts->csv_path, "write the curve as CSV to FILE ('-' for stdout)");
  cmd->add_option("--json", opts->json_path, "write the curve as JSON to FILE ('-' for stdout)");
  return [opts]() {
    report::refuse_overwriting_inputs({opts->csv_path, opts->json_path}, {opts->project});
    const LoadedProject loaded = load_project_file(opts->project);
    report::refuse_overwriting_inputs({opts->csv_path, opts->json_path}, loaded.inputs);
    const Sif& sif = find_sif(loaded.project, opts->sif);
    const PfdPlot c = exact_curve(loaded.project, sif, opts->points);
    const std::string csv = opts->csv_path.empty() ? "" : curve_csv(c);
    const std::string json = opts->json_path.empty() ? "" : curve_json(sif.id, c).dump() + "\n";
    report::write_outputs({{opts->csv_path, csv}, {opts->json_path, json}});
    if (opts->csv_path != "-" && opts->json_path != "-") {
      double peak = 0.0;
      for (double p : c.pfd_sif) peak = std::max(peak, p);
      const std::size_t width = report::prose_width(terminal_width());
      std::cout << report::wrap(escape_controls("PFD(t) of " + sif.id + " over " +
                                                format_duration(loaded.project.defaults.mission_time) + ": " +
                                                std::to_string(c.t_hours.size()) + " points, average " +
                                                sifter::sci(c.pfd_avg.value_or(0.0)) + ", peak " + sifter::sci(peak) +
                                                " (exact multi-phase Markov engine)"),
                                width, "")
                << "\n"
                << report::wrapped_caution(width);
    }
    return 0;
  };
}

}  // namespace sifter::cli
