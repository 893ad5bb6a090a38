#pragma once
/// The alternatives a project lists for a scenario (re-rate, relief device, SIF, other layer),
/// judged for feasibility and tolerability on modified projects through the same LOPA and SIF
/// verification `check` runs, and costed over the mission. Pure: no I/O.
#include <optional>
#include <string>
#include <vector>

#include "sifter/analysis/verify.hpp"
#include "sifter/input/load.hpp"
#include "sifter/results/options.hpp"

namespace sifter {

/// Present value of a cost `annual` paid at the end of each year for `years` years at the
/// discount `rate` per year: A (1 - (1 + r)^-n) / r, and A n at r = 0 (textbook engineering
/// economics, annuity present-worth factor).
double present_value_of_annuity(double annual, double rate, double years);

/// The flow a pump delivers when the item it overpressures relieves at `relieving_barg`: the
/// head left for the pump (relieving pressure - suction_max - static head) read on its curve at
/// its highest speed (affinity laws: Q ~ N, H ~ N^2). Empty without a curve, or when the head
/// lies below the curve's last point.
std::optional<double> relieving_flow_m3_per_hour(const PressureSource& pump, const EquipmentScreening& item,
                                                 double relieving_barg);

/// Judges and costs the alternatives listed for one scenario. Throws UsageError for an id
/// that is no scenario, listing those that have options.
ScenarioOptions compare_options(const LoadedProject& loaded, const std::string& scenario,
                                const VerifyOptions& verify_options);

/// The same for every scenario with options, in scenario order.
std::vector<ScenarioOptions> compare_all_options(const LoadedProject& loaded, const VerifyOptions& verify_options);

}  // namespace sifter
