#pragma once
/// Writers of the options comparison: the terminal table, sifter-options/1 JSON, and the
/// report's section with a picture of our own comparing the options.
#include <nlohmann/json.hpp>
#include <string>
#include <vector>

#include "sifter/results/options.hpp"

namespace sifter::report {

/// The format name of the options JSON.
inline constexpr const char* kOptionsFormat = "sifter-options/1";

/// The ranked table, the reason of every option, and the caution; fits 80 columns.
std::string render_options_text(const ScenarioOptions& options);

/// sifter-options/1: {format, scenario, discount_rate, mission_years, options: [{id, kind,
/// feasible, makes_tolerable, lifecycle_cost, reason, ...}], caution}.
nlohmann::json options_json(const ScenarioOptions& options);

/// The report's sections, one per scenario with options (empty text when there are none).
std::string options_sections_html(const std::vector<ScenarioOptions>& all);

}  // namespace sifter::report
