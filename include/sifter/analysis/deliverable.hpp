#pragma once
/// What the signed deliverables (report, safety requirements specification) show besides the
/// verification results: document control, the component data with their sources, each
/// subsystem's test and repair parameters, each SIF's stated requirements and the items of the
/// specification not yet stated. Gathered once from the project, so that writers only format.
#include <optional>
#include <string>
#include <vector>

#include "sifter/analysis/verify.hpp"
#include "sifter/model/model.hpp"
#include "sifter/results/deliverable.hpp"

namespace sifter {

/// Gathers the deliverable data. `result` must come from verify_project on `project`.
DeliverableData build_deliverable_data(const Project& project, const ProjectResult& result);

}  // namespace sifter
