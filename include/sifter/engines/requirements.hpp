#pragma once
/// A SIF's stated safety requirements against its computed figures: the response time within
/// the allowed share of the process safety time, the spurious trip rate within its limit, the
/// proof-test intervals within the one required (IEC 61511-1:2016 10.3.2, from memory). Pure
/// functions: no I/O.
#include <string>
#include <vector>

#include "sifter/model/model.hpp"
#include "sifter/model/vocabulary.hpp"
#include "sifter/results/sif.hpp"

namespace sifter {

/// The share of the process safety time the SIF may take when the project does not say:
/// half, common practice (no single source).
inline constexpr double kDefaultResponseTimeFraction = 0.5;

/// The response time of each subsystem in signal order: a series channel adds its elements'
/// times, a voting group takes its slowest channel, a subsystem's own "response_time" stands
/// for its elements. A step without a time lists the elements that have none.
std::vector<ResponseTimeStep> response_budget(const Project& project, const Sif& sif);

/// The SIF's response time in seconds: the sum of its steps; empty when any step is unknown.
std::optional<double> response_time_s(const std::vector<ResponseTimeStep>& budget);

/// Computes the checks of the SIF's stated requirements into `r` (response_time_s,
/// response_time_limit_s, response_budget, requirement_checks). A failed check adds a limit
/// naming the slowest element or the largest trip contributor; the verdict that follows from it
/// is sif_verdict's (judge.hpp), which verify_sif applies after these checks.
/// `r` must hold the SIF's verified figures (spurious trips included). Also warns of each
/// component the SIF uses whose failure data name no source.
void apply_requirement_checks(const Project& project, const Sif& sif, SifResult& r, std::vector<Warning>& warnings);

}  // namespace sifter
