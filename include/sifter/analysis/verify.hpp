#pragma once
/// Per-SIF orchestration: the one place that decides a SIF's verdict.
#include <cstdint>
#include <functional>
#include <map>
#include <vector>

#include "sifter/analysis/judge.hpp"
#include "sifter/engines/group_model.hpp"
#include "sifter/engines/lopa.hpp"
#include "sifter/engines/simplified.hpp"
#include "sifter/graph/dependency_graph.hpp"
#include "sifter/input/load.hpp"
#include "sifter/results/project.hpp"
#include "sifter/results/sif.hpp"

namespace sifter {

/// What the risk analysis asks of each SIF its scenarios credit, by SIF id (empty without
/// scenarios); the LOPA findings go to `warnings`. It does not depend on the SIFs' own figures.
std::map<std::string, SifRequirement> lopa_requirements(const Project& project, std::vector<Warning>& warnings);

/// Options of a verification run.
struct VerifyOptions {
  bool exact = true;  ///< run the exact time-dependent cross-check
  int samples = 0;    ///< Monte Carlo samples per SIF on the uncertain failure data; 0 = none
  std::uint64_t seed = 1;
  int threads = 0;  ///< 0 = every core
  /// Build each scenario's LOPA worksheet rows (ScenarioResult::worksheet). Only the writers of
  /// worksheets read them (the worksheet CSV, the workbook, the terminal's full blocks, the
  /// report's tables and diagrams), and the finiteness check, whose every row value is also a
  /// checked figure or bounded by one: a run that prints none may leave them out. No figure,
  /// credit, verdict or refusal depends on them.
  bool worksheet_rows = true;
  /// Keep each SIF's response-time budget (SifResult::response_budget: the subsystems' times and
  /// the slowest channel's elements). Only the SRS and the report print it; the response time,
  /// its check and its limit are computed from it either way.
  bool response_budgets = true;
  /// Called with (samples done, samples in all) during the Monte Carlo, for a progress bar.
  std::function<void(long long, long long)> progress;
};

/// The requirement a verified SIF was judged against, as its result records it.
SifTarget recorded_target(const SifResult& r);
/// What the verdict of a verified SIF rests on besides its figure (architecture, SC, the stated
/// requirement checks; `route_2h_confidence` from the Monte Carlo where the SIF is on Route 2H).
VerdictBasis verdict_basis(const SifResult& r, std::optional<double> route_2h_confidence = std::nullopt);
/// The PFD a verified SIF is credited with in its scenarios, set from its figures as they stand:
/// sif_credit of its judged figure, or none (a credit of 1) when its figures are defective. A
/// SIF without a judged figure is left without a credit. The one place the credit is set.
void apply_credit(SifResult& r);

/// Verifies one SIF: PFDavg or PFH of every subsystem and of the SIF, RRF, the SIL from
/// probability, the target and the verdict, with the assumptions applied.
SifResult verify_sif(const Project& project, const Sif& sif, const std::optional<SifRequirement>& lopa,
                     const VerifyOptions& options, std::vector<Warning>& warnings);

class ExactCache;
/// The same, sharing exact results between SIFs of identical architecture and data.
SifResult verify_sif(const Project& project, const Sif& sif, const std::optional<SifRequirement>& lopa,
                     const VerifyOptions& options, std::vector<Warning>& warnings, ExactCache& cache);

/// Throws InputError (exit 2) naming each SIF and scenario whose figures left the finite
/// numbers, as rates and durations far from physical values make them (1e300/h over 1e300 h,
/// or 1e-160/h squared below the smallest double); verify_project calls it before returning.
void refuse_figures_beyond_finite(const Project& project, const ProjectResult& result);

/// Verifies every SIF of a loaded project (and, once scenarios exist, its LOPA).
ProjectResult verify_project(const LoadedProject& loaded, const VerifyOptions& options = {});

}  // namespace sifter
