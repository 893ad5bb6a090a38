#pragma once
/// The plant in service against its design: observed lambda_DU per model and per component,
/// every SIF re-verified with the updated rates by the same engine and judge as `check`, real
/// demands and spurious trips against the predicted rates, and the proof-test schedule.
/// Pure functions: no I/O.
#include <optional>
#include <string>
#include <vector>

#include "sifter/analysis/verify.hpp"
#include "sifter/analysis/whatif.hpp"
#include "sifter/engines/field_statistics.hpp"
#include "sifter/input/load.hpp"
#include "sifter/model/civil_date.hpp"
#include "sifter/model/records.hpp"
#include "sifter/results/service.hpp"

namespace sifter {

/// Options of a service assessment.
struct ServiceOptions {
  double prior_hours = kDefaultPriorHours;  ///< strength of the prior on each model's lambda_DU
  double flag_below = 0.05;                 ///< a count whose tail probability is below this is flagged
  VerifyOptions verify;                     ///< as `check` runs it (exact cross-check on)
};

/// A copy of `project` whose components carry ComponentService::lambda_du_judged.
Project project_with_judged_rates(const Project& project, const std::vector<ComponentService>& components);

/// Assesses the records against the project.
ServiceResult assess_service(const LoadedProject& loaded, const ServiceRecords& records, const ServiceOptions& options);

}  // namespace sifter
