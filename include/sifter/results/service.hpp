#pragma once
/// In-service comparison of proof-test records with the design, as results.
/// Plain data of the results contract: the standard library and the model only.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/civil_date.hpp"
#include "sifter/model/model.hpp"
#include "sifter/model/records.hpp"
#include "sifter/results/field.hpp"
#include "sifter/results/sif.hpp"
#include "sifter/results/whatif.hpp"

namespace sifter {

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

}  // namespace sifter
