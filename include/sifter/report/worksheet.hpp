#pragma once
/// The LOPA worksheet of each scenario, for the terminal and as CSV.
#include <string>

#include "sifter/results/project.hpp"

namespace sifter::report {

/// One scenario as a worksheet: causes, enabling conditions, each layer with its credit (or
/// why none), modifiers, the frequency after each step, the target and the gap; then findings.
/// Fitted to `width` columns (see TextTable::render).
std::string render_worksheet(const ScenarioResult& scenario, std::size_t width = 100);

/// Every scenario's worksheet rows as CSV (RFC 4180 quoting), one row per step.
std::string worksheet_csv(const ProjectResult& result);

/// Quotes one CSV field per RFC 4180 when it holds a comma, a quote or a line break.
std::string csv_field(const std::string& text);

}  // namespace sifter::report
