#pragma once
/// The HTML report: one self-contained file (inline CSS and SVG, no script, nothing fetched),
/// for the screen and for A4 paper.
#include <string>

#include "sifter/results/project.hpp"
#include "sifter/results/report.hpp"

namespace sifter::report {

/// The whole report. Every piece of user text is escaped; verdicts read in words and symbols.
std::string render_html(const ProjectResult& result, const ReportData& data);

}  // namespace sifter::report
