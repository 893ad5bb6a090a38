#pragma once
/// JSON and CSV of the what-if commands; keys are a contract (extend, never rename).
#include <nlohmann/json.hpp>
#include <string>

#include "sifter/results/whatif.hpp"

namespace sifter::report {

/// {sif, subsystem, longest_proof_test_interval_h, pfd_avg_at_interval, required_pfd, ...}.
nlohmann::json interval_json(const IntervalResult& result);

/// {sif, parameter, points: [{value, pfd_avg, pfh, rrf, sil_probability, meets_target}]};
/// values in hours for durations.
nlohmann::json sweep_json(const SweepResult& result);

/// The sweep's points as CSV (RFC 4180), one row per value.
std::string sweep_csv(const SweepResult& result);

/// {sif, subsystem, rows: [{vote, pfd_avg, ..., spurious_trip_rate_per_yr, mttf_spurious_yr}]}.
nlohmann::json compare_json(const CompareResult& result);

/// {sif, measure, factor, base, inputs: [{input, pointer, unit, base_value, low_value,
/// high_value, at_low, at_high, swing, clamped}]}, widest swing first.
nlohmann::json sensitivity_json(const SensitivityResult& result);

}  // namespace sifter::report
