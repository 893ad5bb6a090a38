#pragma once
/// Terminal text and JSON of `sifter diff`.
#include <cstddef>
#include <nlohmann/json.hpp>
#include <string>

#include "sifter/report/text_table.hpp"
#include "sifter/results/diff.hpp"

namespace sifter::report {

/// The changed SIFs and scenarios, verdict changes first, then the unchanged by name; ends
/// with the caution. `width` is the terminal's: prose stops at 96 columns, tables give way.
std::string render_diff(const ProjectDiff& diff, std::size_t width = kProseWidth);

/// {format, old, new, any_worsened, sifs: [{id, presence, changed, verdict_change, old_verdict,
/// new_verdict, inputs: [{pointer, what, unit, old, new}], results: [{quantity, old, new}],
/// related_scenarios}], scenarios: [...], project_inputs: [...]}.
nlohmann::json diff_json(const ProjectDiff& diff);

}  // namespace sifter::report
