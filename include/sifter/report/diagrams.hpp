#pragma once
/// The drawings of the HTML report, as inline SVG: a SIF's architecture and a scenario's
/// frequency staircase. They draw the results; they compute nothing.
#include <string>

#include "sifter/results/lopa.hpp"
#include "sifter/results/sif.hpp"

namespace sifter::report {

/// The SIF's subsystems left to right in signal order (sensors, logic, final elements), each
/// boxed with its vote, its channels stacked in parallel and a channel's series elements side
/// by side, each element labelled with its tag.
std::string architecture_svg(const SifResult& sif);

/// The frequency of each cause after each of its steps (enabling conditions, layers), then
/// all causes and, per consequence, the modifiers, the frequency without and with the SIF,
/// against the tolerable frequency: a staircase on a log axis.
std::string staircase_svg(const ScenarioResult& scenario);

}  // namespace sifter::report
