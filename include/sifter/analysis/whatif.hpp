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

#include "sifter/analysis/verify.hpp"
#include "sifter/model/model.hpp"
#include "sifter/results/sif.hpp"
#include "sifter/results/whatif.hpp"

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
  /// Verifies `variant`, a changed copy of one of project()'s SIFs (same id), against the
  /// unchanged rest of the project: what verify() gives for a project copy holding it, without
  /// copying the project (verification of a SIF reads no other SIF).
  [[nodiscard]] SifResult verify_variant(const Sif& variant) const;

 private:
  Project project_;
  std::map<std::string, SifRequirement> requirements_;
};

// ---- Longest proof-test interval -------------------------------------------------------

/// Solves for the longest proof-test interval of one subsystem (or of every subsystem with
/// channels, set to the same interval) with which the SIF's PFDavg (PFH) stays at most
/// requirement x (1 - margin). The figure is increasing in the interval, so the root is
/// bracketed on [0, mission time] and found with Boost.Math's TOMS 748 to 1e-12 relative.
IntervalResult longest_proof_test_interval(const WhatIf& what_if, std::size_t sif, std::optional<std::size_t> subsystem,
                                           double margin);

// ---- Sweep -----------------------------------------------------------------------------

/// The parameter of a name as to_string writes it; empty for any other text.
std::optional<SweepParameter> parse_sweep_parameter(std::string_view name);
/// Every parameter name, comma-separated, for messages.
std::string sweep_parameter_names();
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

/// Re-votes a subsystem: it keeps its first channels and gains identical copies of channel 0,
/// whose components are copies with derived ids ("XV-401~2"). `beta`, where given, replaces the
/// subsystem's beta (and beta_D where it was not stated separately). Throws UsageError for a
/// vendor subsystem, and for a redundant vote when the subsystem has no beta and none is given.
CompareResult compare_votes(const WhatIf& what_if, std::size_t sif, std::size_t subsystem,
                            const std::vector<Vote>& votes, std::optional<double> beta);

// ---- Sensitivity -----------------------------------------------------------------------

/// Divides and multiplies each input that feeds the SIF by `factor` (> 1), one at a time:
/// each component's four rates together, each redundant group's beta and beta_D, each
/// subsystem's proof-test interval, MTTR, MRT (where stated), proof-test coverage, partial
/// stroke interval and coverage, each vendor figure, and the mission time where a coverage
/// below 1 makes it count. Fractions are clamped to [0, 1].
SensitivityResult sensitivity(const WhatIf& what_if, std::size_t sif, double factor);

}  // namespace sifter
