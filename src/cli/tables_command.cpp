// `sifter import DIR -o PROJECT` and `sifter export PROJECT --csv-dir DIR`: a project to and from CSV tables.
#include <filesystem>
#include <iostream>
#include <memory>
#include <optional>

#include "commands.hpp"
#include "sifter/input/project_tables.hpp"
#include "sifter/model/diagnostics.hpp"
#include "sifter/report/output_file.hpp"

namespace sifter::cli {
namespace {
struct TablesOptions {
  std::string input;
  std::string output;
};
}  // namespace

Action add_import_command(CLI::App& app) {
  auto opts = std::make_shared<TablesOptions>();
  auto* cmd = app.add_subcommand("import", "Read CSV tables (data/csv-tables.md) into a project file");
  cmd->add_option("dir", opts->input, "the folder holding project.csv, components.csv, sifs.csv, ...")->required();
  cmd->add_option("-o,--output", opts->output, "the project file to write")->required();
  cmd->footer("Exit status: 0 written; 2 a problem in the tables (each named file.csv:row:column); nothing written.");
  return [opts]() {
    report::refuse_overwriting_inputs({opts->output}, {});
    const std::string text = import_project_tables(opts->input, opts->output);
    report::write_output(opts->output, text);
    if (opts->output != "-") std::cerr << "wrote " << opts->output << "\n";
    return static_cast<int>(ExitCode::kAllMet);
  };
}

Action add_export_command(CLI::App& app) {
  auto opts = std::make_shared<TablesOptions>();
  auto* cmd = app.add_subcommand("export", "Write a project as the CSV tables that sifter import reads");
  cmd->add_option("project", opts->input, "the project file (sifter-project/1 JSON)")->required();
  cmd->add_option("--csv-dir", opts->output, "the folder to write the tables into (made if missing)")->required();
  return [opts]() {
    namespace fs = std::filesystem;
    const auto tables = export_project_tables(opts->input, opts->output);
    std::error_code ec;
    fs::create_directories(opts->output, ec);
    if (ec) throw OutputError("cannot make the folder \"" + opts->output + "\": " + ec.message());
    // Every table is rendered before the first is renamed into place.
    std::vector<std::unique_ptr<report::AtomicOutput>> outs;
    for (const auto& t : tables) {
      outs.push_back(std::make_unique<report::AtomicOutput>((fs::path(opts->output) / t.file).string()));
      outs.back()->stream() << t.text;
    }
    for (auto& o : outs) o->commit();
    std::cerr << "wrote " << tables.size() << " tables to " << opts->output << "\n";
    return static_cast<int>(ExitCode::kAllMet);
  };
}

}  // namespace sifter::cli
