#pragma once
/// The risk-reduction options of a scenario, ranked, as results.
/// Plain data of the results contract: the standard library and the model only.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/model.hpp"
#include "sifter/results/project.hpp"

namespace sifter {

/// One alternative judged and costed.
struct OptionResult {
  std::string id;
  std::string title;
  ScenarioOption::Kind kind = ScenarioOption::Kind::kLayer;
  bool feasible = false;
  bool makes_tolerable = false;
  double capex = 0.0;
  double pv_annual_cost = 0.0;
  double pv_test_cost = 0.0;
  double pv_trip_cost = 0.0;
  double tests_per_yr = 0.0;
  double trips_per_yr = 0.0;
  double lifecycle_cost = 0.0;                       ///< capex + the three present values
  std::string reason;                                ///< why infeasible or not tolerable; what it rests on otherwise
  std::optional<double> mitigated_frequency_per_yr;  ///< the scenario with this option
  bool preliminary = false;
  std::vector<std::string> preliminary_because;
};

/// The options of one scenario, ranked: feasible and tolerable first, then feasible only,
/// then infeasible; by lifecycle cost within each group.
struct ScenarioOptions {
  std::string scenario;
  std::string title;
  double target_frequency_per_yr = 0.0;
  double frequency_unprotected_per_yr = 0.0;  ///< without any SIF
  double discount_rate = 0.0;
  double mission_years = 0.0;
  std::vector<OptionResult> options;
};

}  // namespace sifter
