#pragma once
/// Reading a `sifter-project/1` file (and the libraries it names) into a validated Project.
#include <optional>
#include <string>
#include <vector>

#include "sifter/engines/pressure.hpp"
#include "sifter/model/diagnostics.hpp"
#include "sifter/model/model.hpp"
#include "sifter/results/project.hpp"

namespace sifter {

/// The format names this version reads.
inline constexpr const char* kProjectFormat = "sifter-project/1";
inline constexpr const char* kLibraryFormat = "sifter-library/1";

/// A project that passed every check, with the plausibility warnings found on the way.
struct LoadedProject {
  Project project;
  std::vector<Warning> warnings;
  std::string sha256;               ///< of the project file's bytes, for the report
  std::vector<std::string> inputs;  ///< every file read: the project, then its libraries
  /// The components several SIFs share, found by the graph the loader validated (the graph
  /// itself is not kept); verify_project reports them. Reset it when changing the structure
  /// (SIFs, groups, channels) of `project`: verify_project then builds the graph again.
  std::optional<std::vector<SharedComponent>> shared_components;
  std::optional<PressureScreening> pressure;  ///< the overpressure screening, when the project has one
};

/// Reads, validates and resolves a project file. Throws InputError carrying every problem
/// found (file:line:column, pointer, expected, found, hint).
LoadedProject load_project_file(const std::string& path);

/// The same from text in memory; `name` is used in messages and `base_dir` resolves libraries.
LoadedProject load_project_text(const std::string& text, const std::string& name, const std::string& base_dir);

}  // namespace sifter
