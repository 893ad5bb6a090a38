// How overpressure verdicts moved between two revisions.
#include <algorithm>
#include <cmath>
#include <map>

#include "sifter/analysis/diff.hpp"

namespace sifter {

std::vector<EquipmentDiff> diff_equipment(const ProjectResult& old_result, const ProjectResult& new_result) {
  std::map<std::string, const EquipmentScreening*> old_items;
  if (old_result.pressure)
    for (const auto& e : old_result.pressure->equipment) old_items[e.id] = &e;
  std::vector<EquipmentDiff> out;
  auto same = [](double a, double b) { return std::fabs(a - b) <= kDiffRelTol * std::max(std::fabs(a), std::fabs(b)); };
  if (new_result.pressure) {
    for (const auto& e : new_result.pressure->equipment) {
      EquipmentDiff d;
      d.id = e.id;
      d.new_category = to_string(e.category);
      d.new_max_pressure_barg = e.max_pressure_barg;
      d.new_preliminary = e.preliminary();
      auto it = old_items.find(e.id);
      if (it != old_items.end()) {
        d.old_category = to_string(it->second->category);
        d.old_max_pressure_barg = it->second->max_pressure_barg;
        d.old_preliminary = it->second->preliminary();
        old_items.erase(it);
        if (d.old_category == d.new_category && same(*d.old_max_pressure_barg, e.max_pressure_barg) &&
            d.old_preliminary == d.new_preliminary)
          continue;
      }
      out.push_back(d);
    }
  }
  for (const auto& [id, e] : old_items) {
    EquipmentDiff d;
    d.id = id;
    d.old_category = to_string(e->category);
    d.old_max_pressure_barg = e->max_pressure_barg;
    d.old_preliminary = e->preliminary();
    out.push_back(d);
  }
  return out;
}

}  // namespace sifter
