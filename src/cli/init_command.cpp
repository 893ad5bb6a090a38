// `sifter init FILE`: write a commented project (and its small library) to start from.
#include <filesystem>
#include <iostream>
#include <memory>

#include "commands.hpp"
#include "sifter/input/project_skeleton.hpp"
#include "sifter/model/diagnostics.hpp"
#include "sifter/report/output_file.hpp"

namespace sifter::cli {
namespace {
struct InitOptions {
  std::string project;
  bool example = false;
  bool force = false;
};

// "unit10.json" -> "unit10-library.json", beside the project.
std::filesystem::path library_path_for(const std::filesystem::path& project) {
  return project.parent_path() / (project.stem().string() + "-library.json");
}
}  // namespace

Action add_init_command(CLI::App& app) {
  auto opts = std::make_shared<InitOptions>();
  auto* cmd = app.add_subcommand(
      "init", "Write a commented project file (every section, one SIF, one scenario) and its library to start from");
  cmd->add_option("file", opts->project, "the project file to write; its library goes beside it as NAME-library.json")
      ->required();
  cmd->add_flag("--example", opts->example, "the README's worked example (titles filled in) instead of the skeleton");
  cmd->add_flag("--force", opts->force, "replace files that exist");
  return [opts]() {
    namespace fs = std::filesystem;
    const fs::path project = opts->project;
    const fs::path library = library_path_for(project);
    if (!opts->force)
      for (const auto& p : {project, library})
        if (fs::exists(p))
          throw UsageError("\"" + p.string() + "\" exists; sifter init writes only new files (--force replaces)");
    // Both files are rendered first and renamed into place together: all or nothing.
    report::AtomicOutput project_out(project.string()), library_out(library.string());
    project_out.stream() << project_skeleton(library.filename().string(), opts->example);
    library_out.stream() << library_skeleton();
    library_out.commit();
    project_out.commit();
    std::cout << "wrote " << project.string() << " and " << library.string() << "\n"
              << "next: sifter check " << project.string() << "\n";
    return static_cast<int>(ExitCode::kAllMet);
  };
}

}  // namespace sifter::cli
