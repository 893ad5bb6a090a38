#pragma once
/// The `sifter-results/1` JSON writer.
#include <nlohmann/json.hpp>

#include <ostream>

#include "sifter/verify.hpp"

namespace sifter::report {

/// The format name of the results file.
inline constexpr const char* kResultsFormat = "sifter-results/1";

/// The results as JSON; keys are a contract (extend, never rename).
nlohmann::json results_json(const ProjectResult& result);

/// The same text as results_json(result).dump(2), written SIF by SIF so that a register of
/// thousands of SIFs never holds its whole results as one JSON tree in memory.
void write_results_json(const ProjectResult& result, std::ostream& out);

/// One SIF's results as JSON (also used by the what-if commands).
nlohmann::json sif_json(const SifResult& sif);

}  // namespace sifter::report
