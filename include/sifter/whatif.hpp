#pragma once
/// What-ifs on one SIF: the longest proof-test interval, parameter sweeps, alternative votes and
/// the sensitivity ranking. Each one verifies modified copies of the project with verify_sif,
/// the engine of `check`, against the requirement the risk analysis set (which no what-if
/// changes). Pure functions: no I/O. A question that cannot be answered (no target, a vendor
/// figure asked to change its vote, a value out of range) throws UsageError.
#include <cstddef>
#include <map>
#include <optional>
#include <string>
#include <string_view>
#include <vector>

#include "sifter/model.hpp"
#include "sifter/results.hpp"
#include "sifter/verify.hpp"

namespace sifter {

/// A project prepared for what-if questions.
class WhatIf {
 public:
  /// Computes every SIF's requirement from the scenarios once.
  explicit WhatIf(Project project);
  [[nodiscard]] const Project& project() const { return project_; }
  /// Verifies SIF `sif` (an index into Project::sifs) of `modified`, a copy of project() with
  /// changes, exactly as `check` would (the exact engine on, so that groups of different channels
  /// are judged on the figure check judges them on).
  [[nodiscard]] SifResult verify(const Project& modified, std::size_t sif) const;
  /// The unmodified SIF's result.
  [[nodiscard]] SifResult baseline(std::size_t sif) const { return verify(project_, sif); }

 private:
  Project project_;
  std::map<std::string, RequirementFromLopa> requirements_;
};

/// The SIF's figure in its demand mode: PFDavg (low) or PFH per hour (high); empty when a
/// subsystem gives no figure for that mode.
std::optional<double> sif_measure(const SifResult& result);

/// The value a SIF's figure must not exceed, as verify judges it: the required PFDavg (or PFH)
/// where one is set, or the upper edge of the required SIL's band, whichever is stricter.
struct Requirement {
  DemandMode mode = DemandMode::kLow;
  double value = 0.0;      ///< PFDavg, or PFH per hour
  bool band_edge = false;  ///< the band edge governs; it is exclusive (PFDavg 0.01 is SIL 1)
  std::string basis;       ///< for people: "SIL 2 band (PFDavg < 0.01)", "required PFDavg 0.00167"
};

/// The governing requirement of a verified SIF; empty when it has no target and no scenario.
std::optional<Requirement> governing_requirement(const SifResult& result);

// ---- Longest proof-test interval -------------------------------------------------------

/// How the search for the longest interval ended.
enum class IntervalOutcome {
  kFound,         ///< the longest interval lies between zero and the mission time
  kNone,          ///< the terms that do not depend on the interval alone exceed the target
  kWholeMission,  ///< every interval up to the mission time meets the target
};

/// The longest proof-test interval with which a SIF still meets its requirement.
struct IntervalResult {
  std::string sif;
  std::optional<std::string> subsystem;      ///< empty: all of the SIF's tested subsystems together
  std::vector<std::string> varied;           ///< the subsystems whose interval was varied
  std::vector<Duration> current_intervals;   ///< their intervals in the project, same order
  Requirement requirement;
  double margin = 0.0;                       ///< kept below the requirement, fraction
  double allowed = 0.0;                      ///< requirement.value x (1 - margin)
  IntervalOutcome outcome = IntervalOutcome::kFound;
  Duration longest;                          ///< kFound: the solution; kWholeMission: the mission time
  int whole_months = 0;                      ///< the largest whole number of months that meets it
  double measure_at_longest = 0.0;           ///< PFDavg (PFH per hour) at `longest`
  std::optional<double> measure_at_whole_months;
  double measure_now = 0.0;                  ///< with the project's intervals
  double measure_at_zero = 0.0;              ///< at interval 0: the terms the interval does not touch
  Duration mission;                          ///< upper end of the search
  std::vector<std::string> notes;            ///< what the interval cannot fix, the method
};

/// Solves for the longest proof-test interval of one subsystem (or of every subsystem with
/// channels, set to the same interval) with which the SIF's PFDavg (PFH) stays at most
/// requirement x (1 - margin). The figure is increasing in the interval, so the root is
/// bracketed on [0, mission time] and found with Boost.Math's TOMS 748 to 1e-12 relative.
IntervalResult longest_proof_test_interval(const WhatIf& what_if, std::size_t sif, std::optional<std::size_t> subsystem,
                                           double margin);

// ---- Sweep -----------------------------------------------------------------------------

/// A parameter `sweep` can vary.
enum class SweepParameter { kProofTestInterval, kBeta, kMttr, kProofTestCoverage, kLambdaDuFactor };

/// "proof_test_interval", "beta", "mttr", "proof_test_coverage", "lambda_du_factor".
std::string to_string(SweepParameter parameter);
/// The parameter of a name as to_string writes it; empty for any other text.
std::optional<SweepParameter> parse_sweep_parameter(std::string_view name);
/// Every parameter name, comma-separated, for messages.
std::string sweep_parameter_names();
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

/// Sets `value` of a parameter on the chosen subsystems of SIF `sif` in `project`. MRT follows
/// MTTR where it was defaulted to it, and beta_D follows beta where it was; lambda_du_factor
/// scales the lambda_du of copies of the subsystems' components, so that no other subsystem
/// that shares a component changes.
void apply_parameter(Project& project, std::size_t sif, const std::vector<std::size_t>& subsystems,
                     SweepParameter parameter, double value);

/// Verifies the SIF at each value of the parameter.
SweepResult sweep(const WhatIf& what_if, const SweepRequest& request);

// ---- Compare votes ---------------------------------------------------------------------

/// Whether a vote needs a common-cause beta (K < N, or 1oo2D), as the loader requires.
bool vote_is_redundant(const Vote& vote);

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

/// Re-votes a subsystem: it keeps its first channels and gains identical copies of channel 0,
/// whose components are copies with derived ids ("XV-401~2"). `beta`, where given, replaces the
/// subsystem's beta (and beta_D where it was not stated separately). Throws UsageError for a
/// vendor subsystem, and for a redundant vote when the subsystem has no beta and none is given.
CompareResult compare_votes(const WhatIf& what_if, std::size_t sif, std::size_t subsystem,
                            const std::vector<Vote>& votes, std::optional<double> beta);

// ---- Sensitivity -----------------------------------------------------------------------

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

/// Divides and multiplies each input that feeds the SIF by `factor` (> 1), one at a time:
/// each component's four rates together, each redundant group's beta and beta_D, each
/// subsystem's proof-test interval, MTTR, MRT (where stated), proof-test coverage, partial
/// stroke interval and coverage, each vendor figure, and the mission time where a coverage
/// below 1 makes it count. Fractions are clamped to [0, 1].
SensitivityResult sensitivity(const WhatIf& what_if, std::size_t sif, double factor);

}  // namespace sifter
