#pragma once
/// Overpressure screening: the maximum credible pressure at each equipment item on a blocked
/// outlet, over a Boost.Graph of sources, connections and equipment; its category against the
/// rating; and the LOPA scenarios it generates. Pure functions: no I/O.
///
/// Methods (DEVELOPERS.md, "Overpressure screening"): static head rho*g*h with g = 9.80665 m/s^2
/// (ISO 80000-3, seen); centrifugal pump at zero flow p = p_suction,max + rho_max*g*H_shutoff*
/// (n_max/n)^2 (affinity laws, textbook pump hydraulics, memory); bands common practice.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/model.hpp"
#include "sifter/results/pressure.hpp"

namespace sifter {

/// The band of a ratio p / MAWP, with `test_ratio` = test pressure / MAWP. Edges belong to the
/// lower band (at MAWP: none; at MAWP x 1.1: minor; at the test pressure: leak possible).
OverpressureCategory category_for_ratio(double ratio, double accumulation, double test_ratio);

/// Head at a flow on a curve, by linear interpolation; beyond the last point: nullopt.
std::optional<double> curve_head_m(const std::vector<CurvePoint>& curve, double flow_m3_per_hour);
/// The flow at which the curve delivers a head (head falling with flow), by linear interpolation;
/// 0 at or above the shutoff head; nullopt below the last point's head.
std::optional<double> curve_flow_m3_per_hour(const std::vector<CurvePoint>& curve, double head_m);

/// The pump's shutoff head at rated speed: the curve's head at zero flow, or the estimate
/// rated differential x (1 + margin).
double shutoff_head_m(const PressureSource& source);
/// The source's maximum pressure at its own elevation, bar gauge: pump suction_max +
/// rho_max g H_shutoff (n_max/n)^2, or a fixed source's pressure.
double source_max_pressure_barg(const PressureSource& source);

/// The first cycle among the connections, as ids "A -> B -> A"; empty when there is none.
std::vector<std::string> connection_cycle(const PressureSection& section);

/// The maximum credible pressure at every item: the highest over the sources that reach it of
/// the source's maximum plus rho g (z_source - z_item), no credit for friction (the flow is
/// blocked). A path does not pass through another source (its suction states what is upstream).
/// Precondition (checked by the loader): ids resolve and the connections have no cycle.
PressureScreening screen_pressure(const PressureSection& section);

/// The id of the scenario generated for an item overpressured by a source.
std::string overpressure_scenario_id(const std::string& item, const std::string& source);

/// One LOPA scenario per item above its MAWP (generated: true): the blocked-outlet cause at the
/// project's frequency, the consequence of its band, its relief devices and SIFs. Records the
/// ids in `screening.generated`, or why none could be made in `screening.missing`.
std::vector<Scenario> overpressure_scenarios(const PressureSection& section, PressureScreening& screening);

}  // namespace sifter
