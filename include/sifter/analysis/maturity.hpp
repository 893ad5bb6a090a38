#pragma once
/// Data maturity: which verdicts rest on an estimate, and which estimate.
#include <string>
#include <vector>

#include "sifter/analysis/verify.hpp"
#include "sifter/model/model.hpp"

namespace sifter {

/// The estimates a scenario's verdict rests on: a generated scenario's screening estimates
/// and every cause whose frequency is marked "estimate".
std::vector<std::string> scenario_estimates(const Scenario& scenario);

/// The estimates a SIF's verdict rests on: its components marked "estimate" and the
/// preliminary scenarios that set its requirement.
std::vector<std::string> sif_estimates(const Project& project, const Sif& sif, const SifResult& result,
                                       const std::vector<ScenarioResult>& scenarios);

/// Marks every scenario and SIF result preliminary (or not) with the estimates named.
void mark_preliminary(const Project& project, ProjectResult& result);

}  // namespace sifter
