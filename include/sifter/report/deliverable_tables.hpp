#pragma once
/// The deliverable's tables (report and SRS): component data with sources, subsystem
/// parameters, requirement checks, response budget, the specification's items, document
/// control. Plain text cells shared by the HTML and Markdown writers.
#include "sifter/report/tables.hpp"
#include "sifter/results/deliverable.hpp"

namespace sifter::report {

/// Every component: id, model, the four rates, SFF, type, SC or prior use, data source.
Table component_data_table(const DeliverableData& data, bool only_used = false);
/// Per subsystem: proof-test interval, coverage, partial stroke, test duration, MTTR, MRT,
/// beta, beta_D and its spurious trip rate.
Table subsystem_parameters_table(const SifResult& sif, const SifDeliverable& data);
/// The computed checks of the stated requirements, with their verdicts.
Table requirement_checks_table(const SifResult& sif);
/// The response time element by element, subsystem after subsystem.
Table response_budget_table(const SifResult& sif);
/// The specification's items (IEC 61511-1:2016 10.3.2 checklist): stated or OPEN.
Table requirement_items_table(const SifDeliverable& data);
/// Prepared, checked, approved: name, signature and date to be filled in by hand.
Table signature_table(const DocumentControl& document);
/// The revision history.
Table revision_table(const DocumentControl& document);
/// "SC 3", "prior use SIL 2", "SC 2; prior use SIL 3" or "none".
std::string systematic_words(const ComponentDataRow& row);

}  // namespace sifter::report
