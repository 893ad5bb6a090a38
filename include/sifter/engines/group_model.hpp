#pragma once
/// The one resolved model of each voting group, built from the project once and read by the
/// simplified equations, the exact engine's feed, the Monte Carlo and the what-ifs.
#include <cstddef>
#include <vector>

#include "sifter/engines/simplified.hpp"
#include "sifter/model/model.hpp"

namespace sifter {

/// Shares of lambda_du and the interval that reveals each: the proof test (its coverage), the
/// partial stroke test before it, the rest at the mission (IEC 61508-6:2010 B.3.2.5, from memory).
std::vector<TestSlice> test_slices(const Subsystem& sub, Duration mission);

/// The rates of one channel: its series elements added.
FailureRates channel_rates(const Project& project, const Channel& channel);

/// The resolved group: every channel's own rates (field-data rates are already in the
/// components), the effective beta and beta_D after Table D.5, the test slices, T1, test
/// duration, staggering, MTTR, MRT and what a detected failure does. Where channels differ,
/// `channel` holds their mean (used only by the common-cause term; see simplified.hpp).
GroupData group_data_for(const Project& project, const Subsystem& sub);

/// The components of each channel of a group, by index into Project::components, so that a
/// sampler scales each channel by its own sources.
std::vector<std::vector<std::size_t>> channel_components(const Subsystem& sub);

}  // namespace sifter
