#pragma once
/// The results as a spreadsheet workbook (.xlsx, written with libxlsxwriter).
#include <string>
#include <vector>

#include "sifter/model/model.hpp"
#include "sifter/results/project.hpp"

namespace sifter::report {

/// The sheets of the workbook, in order; the first carries the caution above its table.
inline constexpr const char* kWorkbookSheets[] = {"SIF summary", "Subsystems", "LOPA worksheet", "Components",
                                                  "Requirement checks"};

/// The workbook's bytes: one sheet per kind of result, numbers as numbers, units in the
/// headers, header rows frozen, column widths set. `components` are the project's component
/// data as loaded (inputs shown as they are, nothing computed from them). Every text cell is
/// written as a string, never as a formula, and neutralised by spreadsheet_text().
/// Throws OutputError when the library cannot build the workbook.
std::string workbook_xlsx(const ProjectResult& result, const std::vector<Component>& components);

/// Text that a spreadsheet could take for a formula (starting with = + - @, a tab or a carriage
/// return, and not a number) gets a leading apostrophe, the common practice for exports.
std::string spreadsheet_text(const std::string& text);

}  // namespace sifter::report
