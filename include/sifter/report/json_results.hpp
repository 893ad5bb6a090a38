#pragma once
/// The `sifter-results/1` JSON writer.
#include <nlohmann/json.hpp>
#include <ostream>

#include "sifter/report/json_stream.hpp"
#include "sifter/results/project.hpp"

namespace sifter::report {

/// The format name of the results file.
inline constexpr const char* kResultsFormat = "sifter-results/1";

/// The results as JSON; keys are a contract (extend, never rename).
nlohmann::json results_json(const ProjectResult& result);

/// The same keys and values as results_json(result), streamed without a tree (a register of
/// thousands of SIFs never sits in memory as JSON); compact unless `layout` asks for indents.
/// The SIFs and scenarios are rendered on two cores unless `threads` is 1; the text is the same.
void write_results_json(const ProjectResult& result, std::ostream& out, JsonLayout layout = JsonLayout::kCompact,
                        int threads = 0);

/// One SIF's results as JSON (also used by the what-if commands).
nlohmann::json sif_json(const SifResult& sif);

}  // namespace sifter::report
