#pragma once
/// The Markdown report: the same tables as the HTML report, without the drawings.
#include <string>

#include "sifter/report/tables.hpp"
#include "sifter/results/project.hpp"
#include "sifter/results/report.hpp"

namespace sifter::report {

/// The whole report as CommonMark with pipe tables.
std::string render_markdown(const ProjectResult& result, const ReportData& data);

/// Escapes user text for Markdown: backslash before the characters that would start markup
/// (\ ` * _ [ ] < > | # ~ &), line breaks as spaces, so a table cell stays one cell.
std::string escape_markdown(const std::string& text);

/// One table as a pipe table, its caption as a bold line above it.
std::string markdown_table(const Table& table);

}  // namespace sifter::report
