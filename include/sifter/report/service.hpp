#pragma once
/// Writers of a service assessment: terminal text, `sifter-service/1` JSON, CSV of the models,
/// iCalendar of the due proof tests, and the report's "service" section.
#include <nlohmann/json.hpp>
#include <string>
#include <string_view>

#include "sifter/results/service.hpp"

namespace sifter::report {

/// The format name of the service JSON.
inline constexpr const char* kServiceFormat = "sifter-service/1";

/// Said of a model whose posterior upper 90 % lies below its mean (RateEstimate), after the
/// words naming it.
inline constexpr const char* kSkewedPosteriorNote =
    "The prior and the records together weigh a small fraction of one failure at the design rate, so the "
    "posterior puts most of its weight near zero and a long tail above it: its upper 90% says "
    "little. Read P(>design) and the observed 90% interval instead.";

/// The models in service (with devices: the terminal and the HTML show no others) whose
/// posterior upper 90 % lies below the mean, "A, B" in the result's order; empty when none.
/// Those writers mark the bound with "*" and say, once under the table, these names and
/// kSkewedPosteriorNote. The JSON and the CSV carry the flag for every model.
std::string skewed_posterior_models(const ServiceResult& result);

/// The assessment for a person at an 80-column terminal, with the caution.
std::string render_service(const ServiceResult& result);
/// `sifter-service/1`: models[], sifs[], schedule[] (and components[]); every number finite.
nlohmann::json service_json(const ServiceResult& result);
/// One row per model with the columns of models[] in the JSON; CRLF line ends (RFC 4180).
std::string service_csv(const ServiceResult& result);
/// The due proof tests as an iCalendar file (RFC 5545): one all-day VEVENT per component.
std::string service_ics(const ServiceResult& result);
/// The report's "service" section (HTML), with its own heading and caution.
std::string service_html(const ServiceResult& result);

/// RFC 5545 3.3.11 TEXT escaping: backslash, semicolon, comma and line breaks.
std::string escape_ical_text(std::string_view text);
/// RFC 5545 3.1 folding: lines of at most 75 octets, continued after CRLF and one space; a
/// UTF-8 character is never split. Returns the line with its CRLF.
std::string fold_ical_line(std::string_view line);

}  // namespace sifter::report
