#pragma once
/// The plant in service against its design: observed lambda_DU per model and per component,
/// every SIF re-verified with the updated rates by the same engine and judge as `check`, real
/// demands and spurious trips against the predicted rates, and the proof-test schedule.
/// Pure functions: no I/O.
#include <optional>
#include <string>
#include <vector>

#include "sifter/civil_date.hpp"
#include "sifter/field_statistics.hpp"
#include "sifter/load.hpp"
#include "sifter/records.hpp"
#include "sifter/verify.hpp"
#include "sifter/whatif.hpp"

namespace sifter {

/// Options of a service assessment.
struct ServiceOptions {
  double prior_hours = kDefaultPriorHours;  ///< strength of the prior on each model's lambda_DU
  double flag_below = 0.05;                 ///< a count whose tail probability is below this is flagged
  VerifyOptions verify;                     ///< as `check` runs it (exact cross-check on)
};

/// The observed lambda_DU of one component model, pooled over its devices in service.
struct ModelService {
  std::string model;                 ///< library model id, or the component's own id when it has none
  std::vector<std::string> devices;  ///< components of the model with an in-service date
  RateEstimate estimate;             ///< design rate: the devices' lambda_DU weighted by service time
};

/// The observed lambda_DU of one component and the rate the re-verification gives it.
struct ComponentService {
  std::string component;
  std::string model;
  RateEstimate estimate;          ///< its own count and time (prior of the same strength)
  double lambda_du_judged = 0.0;  ///< per hour: its design lambda_DU x its model's posterior / design
};

/// A count of events against the count expected from a predicted rate.
struct CountCheck {
  int observed = 0;
  std::optional<double> expected;              ///< empty when no rate is predicted
  std::optional<double> probability_at_least;  ///< P(N >= observed | expected)
  bool flagged = false;                        ///< probability below ServiceOptions::flag_below
};

/// One SIF in service.
struct SifService {
  std::string id;
  DemandMode demand_mode = DemandMode::kLow;
  std::optional<double> measure_design;  ///< PFDavg (PFH per hour) with the project's rates
  std::optional<double> measure_judged;  ///< the same with the posterior rates
  std::optional<bool> meets_design;      ///< check's verdict on the project as it stands
  std::optional<bool> meets_judged;      ///< check's verdict with the posterior rates
  bool verdict_changed = false;
  std::optional<IntervalResult> restore;  ///< a verdict changed to short: the longest interval that meets it
  std::string restore_note;               ///< why no interval is given, when none is
  double observed_years = 0.0;            ///< from the first in-service date of its components
  CountCheck demands;                     ///< against the LOPA's demand rate
  CountCheck spurious_trips;              ///< against the predicted spurious trip rate
  std::optional<CivilDate> earliest_due;
  std::string earliest_due_component;
  bool any_overdue = false;
};

/// One component's proof tests.
struct ScheduleRow {
  std::string component;
  std::vector<std::string> sifs;
  CivilDate in_service_since;
  std::optional<CivilDate> last_test;  ///< the last proof test (any result)
  double interval_hours = 0.0;         ///< the shortest interval of the subsystems it serves
  CivilDate next_due;                  ///< last test (or in-service date) + interval
  bool overdue = false;                ///< next_due before the as-of date
};

/// The whole assessment.
struct ServiceResult {
  std::string title;
  std::string project_file;
  std::string records_file;
  CivilDate as_of;
  double prior_hours = kDefaultPriorHours;
  double flag_below = 0.05;
  std::vector<ModelService> models;
  std::vector<ComponentService> components;
  std::vector<SifService> sifs;
  std::vector<ScheduleRow> schedule;  ///< in order of next due date
  std::vector<std::string> notes;     ///< how the figures were obtained
};

/// A copy of `project` whose components carry ComponentService::lambda_du_judged.
Project project_with_judged_rates(const Project& project, const std::vector<ComponentService>& components);

/// Assesses the records against the project.
ServiceResult assess_service(const LoadedProject& loaded, const ServiceRecords& records, const ServiceOptions& options);

}  // namespace sifter
