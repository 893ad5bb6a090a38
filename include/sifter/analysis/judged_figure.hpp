#pragma once
/// The figure a SIF's and each subsystem's verdict rests on: simplified or exact, by the
/// project's "judge_on" rule (default the more conservative), with the cases that force exact.
#include "sifter/model/model.hpp"
#include "sifter/results/sif.hpp"

namespace sifter {

/// Above this lDU T1 of a channel the Annex B linearisation overstates one channel by more than
/// about 3.4 % (1 - (1 - exp(-x))/x against x/2 at x = 0.1, computed): the simplified figure is
/// outside its validity and the exact figure decides where there is one (common practice).
inline constexpr double kSimplifiedLimitLambdaT = 0.1;

/// Sets pfd_avg (pfh_per_hour) of the SIF and of every subsystem to the judged figure, with
/// judged_on and judged_why, from the simplified figures (pfd_avg_simplified, ...) and the
/// exact ones where the cross-check ran. Groups of different channels, and groups whose
/// simplified figure is outside its validity, are judged on the exact figure whatever the rule.
/// Shares are recomputed from the judged figures; an assumption says what governs and why.
void choose_judged_figures(const Project& project, const Sif& sif, SifResult& result);

}  // namespace sifter
