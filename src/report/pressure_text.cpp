// The overpressure screening and the preliminary verdicts, for the terminal.
#include "sifter/report/pressure_text.hpp"

#include <algorithm>
#include <cstdio>

#include "sifter/model/format.hpp"
#include "sifter/model/pressure_units.hpp"
#include "sifter/report/text_table.hpp"
#include "sifter/results/project.hpp"

namespace sifter::report {

std::string render_pressure_text(const ProjectResult& r, std::size_t width) {
  std::string out;
  if (r.pressure) {
    out += "Overpressure screening (blocked outlet, no friction credit)\n";
    // The path goes under its row when the terminal is too narrow for it.
    TextTable t({"item", "max barg", "MAWP barg", "ratio", "category", "path"},
                {false, true, true, true, false, false});
    t.set_fit({Fit::kKeep, Fit::kKeep, Fit::kKeep, Fit::kKeep, Fit::kKeep, Fit::kBelow});
    char number[32];
    auto fixed = [&](double v, const char* format) {
      std::snprintf(number, sizeof number, format, v);
      return std::string(number);
    };
    for (const auto& e : r.pressure->equipment) {
      std::string path;
      for (const auto& p : e.path) path += (path.empty() ? "" : ">") + p;
      t.add_row({e.id, fixed(e.max_pressure_barg, "%.2f"), fixed(e.mawp_barg, "%.2f"), fixed(e.ratio, "%.3f"),
                 to_string(e.category), path + (e.preliminary() ? " *" : "")});
    }
    out += t.render("  ", width);
    for (const auto& id : r.pressure->not_reached) out += "  " + id + ": no source reaches it\n";
    for (const auto& id : r.pressure->generated) out += "  generated scenario " + id + "\n";
    out += "\n";
  }
  const auto preliminary = preliminary_verdicts(r);
  if (!preliminary.empty()) {
    out += "PRELIMINARY verdicts (rest on estimates; `check --final` refuses them)\n";
    for (const auto& p : preliminary) out += fit_line("* " + p, prose_width(width), "  ", "  ");
    out += "\n";
  }
  return out;
}

}  // namespace sifter::report

namespace sifter::report {
namespace {

std::string category_text(const std::optional<std::string>& category, const std::optional<double>& p,
                          bool preliminary) {
  if (!category) return "not screened";
  return *category + " at " + format_pressure(*p) + (preliminary ? " (preliminary)" : "");
}

}  // namespace

std::string render_equipment_diff(const std::vector<EquipmentDiff>& items) {
  if (items.empty()) return "";
  std::string out = "Overpressure verdicts\n";
  for (const auto& d : items) {
    const bool moved = d.old_category != d.new_category;
    out += "  " + d.id + (moved ? " MOVED: " : ": ") +
           category_text(d.old_category, d.old_max_pressure_barg, d.old_preliminary) + " -> " +
           category_text(d.new_category, d.new_max_pressure_barg, d.new_preliminary) + "\n";
  }
  return out + "\n";
}

nlohmann::json equipment_diff_json(const std::vector<EquipmentDiff>& items) {
  nlohmann::json j = nlohmann::json::array();
  auto opt = [](const auto& v) { return v ? nlohmann::json(*v) : nlohmann::json(nullptr); };
  for (const auto& d : items)
    j.push_back({{"id", d.id},
                 {"old_category", opt(d.old_category)},
                 {"new_category", opt(d.new_category)},
                 {"old_max_pressure_barg", opt(d.old_max_pressure_barg)},
                 {"new_max_pressure_barg", opt(d.new_max_pressure_barg)},
                 {"old_preliminary", d.old_preliminary},
                 {"new_preliminary", d.new_preliminary},
                 {"moved", d.old_category != d.new_category}});
  return j;
}

}  // namespace sifter::report
