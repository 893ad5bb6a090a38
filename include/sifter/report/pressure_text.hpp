#pragma once
/// The terminal's overpressure screening and preliminary-verdict sections.
#include <cstddef>
#include <nlohmann/json.hpp>
#include <string>

#include "sifter/report/text_table.hpp"
#include "sifter/results/diff.hpp"
#include "sifter/results/project.hpp"

namespace sifter::report {

/// The screening table (item, max pressure, MAWP, ratio, category, source, path) and the list
/// of verdicts resting on estimates; empty when the project has neither.
std::string render_pressure_text(const ProjectResult& result, std::size_t width = kProseWidth);

/// The diff's "Overpressure verdicts" section; empty when none moved.
std::string render_equipment_diff(const std::vector<EquipmentDiff>& items);
/// The same as JSON: [{id, old_category, new_category, old_max_pressure_barg, ...}].
nlohmann::json equipment_diff_json(const std::vector<EquipmentDiff>& items);

}  // namespace sifter::report
