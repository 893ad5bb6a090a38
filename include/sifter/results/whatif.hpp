#pragma once
/// The what-if answers, as results: interval, sweep, compare and sensitivity.
/// Plain data of the results contract: the standard library and the model only.
#include <cstddef>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "sifter/model/model.hpp"
#include "sifter/results/sif.hpp"

namespace sifter {

/// How the search for the longest interval ended.
enum class IntervalOutcome {
  kFound,         ///< the longest interval lies between zero and the mission time
  kNone,          ///< the terms that do not depend on the interval alone exceed the target
  kWholeMission,  ///< every interval up to the mission time meets the target
};

/// The longest proof-test interval with which a SIF still meets its requirement.
struct IntervalResult {
  std::string sif;
  std::optional<std::string> subsystem;     ///< empty: all of the SIF's tested subsystems together
  std::vector<std::string> varied;          ///< the subsystems whose interval was varied
  std::vector<Duration> current_intervals;  ///< their intervals in the project, same order
  Requirement requirement;
  double margin = 0.0;   ///< kept below the requirement, fraction
  double allowed = 0.0;  ///< requirement.value x (1 - margin)
  IntervalOutcome outcome = IntervalOutcome::kFound;
  Duration longest;                 ///< kFound: the solution; kWholeMission: the mission time
  int whole_months = 0;             ///< the largest whole number of months that meets it
  double measure_at_longest = 0.0;  ///< PFDavg (PFH per hour) at `longest`
  std::optional<double> measure_at_whole_months;
  double measure_now = 0.0;        ///< with the project's intervals
  double measure_at_zero = 0.0;    ///< at interval 0: the terms the interval does not touch
  Duration mission;                ///< upper end of the search
  std::vector<std::string> notes;  ///< what the interval cannot fix, the method
};

/// A parameter `sweep` can vary.
enum class SweepParameter { kProofTestInterval, kBeta, kMttr, kProofTestCoverage, kLambdaDuFactor };

/// "proof_test_interval", "beta", "mttr", "proof_test_coverage", "lambda_du_factor".
std::string to_string(SweepParameter parameter);

/// Whether the parameter is a duration (its values are hours).
bool is_duration(SweepParameter parameter);

/// What to sweep. Values are hours for durations, fractions for beta and coverage, and a
/// multiplier of the project's lambda_du for lambda_du_factor.
struct SweepRequest {
  std::size_t sif = 0;
  std::optional<std::size_t> subsystem;  ///< empty: every subsystem with channels
  SweepParameter parameter = SweepParameter::kProofTestInterval;
  double from = 0.0;
  double to = 0.0;
  int steps = 11;    ///< number of points, ends included, 2..1000
  bool log = false;  ///< evenly spaced in log(value); needs positive ends
};

/// One point of a sweep: the value and what check says of the SIF there.
struct SweepPoint {
  double value = 0.0;
  SifResult result;
};

/// A sweep's points in order of the values.
struct SweepResult {
  std::string sif;
  std::optional<std::string> subsystem;
  std::vector<std::string> varied;
  SweepParameter parameter = SweepParameter::kProofTestInterval;
  DemandMode mode = DemandMode::kLow;
  std::vector<SweepPoint> points;
  std::vector<std::string> notes;  ///< what else follows the parameter (MRT with MTTR, beta_D with beta)
};

/// One alternative: the vote and the whole result of the SIF with the subsystem so voted.
struct CompareRow {
  std::string vote;      ///< "2oo3"
  bool current = false;  ///< the vote the project has
  SifResult result;      ///< result.subsystems[CompareResult::subsystem_index] is the re-voted one
};

/// The same subsystem re-voted, side by side.
struct CompareResult {
  std::string sif;
  std::string subsystem;
  std::size_t subsystem_index = 0;
  DemandMode mode = DemandMode::kLow;
  std::vector<CompareRow> rows;  ///< in the order the votes were asked
  std::vector<std::string> notes;
};

/// One bar of the tornado: an input, where it is written, and the SIF's figure with the input
/// divided and multiplied by the factor.
struct SensitivityInput {
  std::string name;         ///< "rates of LT-401A", "beta of 'level sensing'"
  std::string pointer;      ///< JSON pointer of the input, e.g. "/sifs/0/subsystems/0/beta"
  std::string unit;         ///< "h" for durations, "x" for a factor on a component's rates, "" for fractions
  double base_value = 0.0;  ///< as the project has it (1 for a component's rates factor)
  double low_value = 0.0;   ///< base / factor, clamped to [0, 1] for fractions
  double high_value = 0.0;  ///< base x factor, clamped to [0, 1] for fractions
  double at_low = 0.0;      ///< the SIF's PFDavg (PFH per hour in high demand) at low_value
  double at_high = 0.0;     ///< the same at high_value
  double swing = 0.0;       ///< |at_high - at_low|
  bool clamped = false;     ///< a fraction was held at 0 or 1
};

/// The tornado of one SIF, widest swing first.
struct SensitivityResult {
  std::string sif;
  DemandMode mode = DemandMode::kLow;
  double factor = 2.0;
  double base = 0.0;  ///< the SIF's PFDavg (PFH per hour) as the project stands
  std::optional<Requirement> requirement;
  std::vector<SensitivityInput> inputs;
  std::vector<std::string> notes;
};

}  // namespace sifter
