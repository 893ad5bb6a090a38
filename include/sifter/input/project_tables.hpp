#pragma once
/// A project as CSV tables, one per kind, as an engineer keeps them in a workbook
/// (the layout is documented in data/csv-tables.md).
#include <string>
#include <vector>

namespace sifter {

/// One table of the layout and its text (CSV, CRLF line ends).
struct TableText {
  std::string file;  ///< e.g. "components.csv"
  std::string text;
};

/// Reads the tables in `dir` and returns the project file's text (sifter-project/1 JSON). The
/// project is checked by the loader as if it were written to `output_path` (libraries named in
/// project.csv are relative to `dir` and are rewritten relative to the output's folder).
/// Throws InputError naming file.csv:row:column and the column's header for every problem.
std::string import_project_tables(const std::string& dir, const std::string& output_path);

/// The tables of a project file (loaded and checked first; templates and catalogue entries are
/// written out in full); library paths are written relative to `dir`.
std::vector<TableText> export_project_tables(const std::string& project_path, const std::string& dir);

}  // namespace sifter
