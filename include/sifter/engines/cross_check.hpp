#pragma once
/// The exact time-dependent cross-check of a SIF's simplified result (multi-phase Markov).
#include <memory>
#include <mutex>
#include <optional>
#include <string>
#include <unordered_map>
#include <vector>

#include "sifter/engines/markov.hpp"
#include "sifter/results/report.hpp"
#include "sifter/results/sif.hpp"

namespace sifter {

/// Where the simplified result is judged against the exact one (ISO/TR 12489 recommends exact
/// methods where the simplified assumptions fail; thresholds are common practice).
inline constexpr double kNonConservativeTolerance = 0.01;  ///< simplified below exact by more
inline constexpr double kDisagreementTolerance = 0.10;     ///< |simplified/exact - 1| above

/// The exact inputs of a SIF's subsystems; vendor figures have none (they stay constant).
std::vector<std::optional<ExactGroupInput>> exact_inputs(const Project& project, const Sif& sif);

/// Exact SIF results already computed, keyed by their inputs: a plant register repeats the same
/// architectures with the same data many times. Safe to share between threads.
class ExactCache {
 public:
  /// The exact result of these groups, computed once.
  std::shared_ptr<const SifExactResult> get(const std::vector<ExactGroupInput>& groups);

 private:
  std::mutex mutex_;
  std::unordered_map<std::string, std::shared_ptr<const SifExactResult>> results_;
};

/// Fills pfd_avg_exact (or pfh_exact) of the SIF and its subsystems and the ratio, and adds
/// warnings where the simplified value is non-conservative by more than 1 %, off by more
/// than 10 %, or where lDU T1 > 0.1. Groups of different channels take the exact value as
/// their PFDavg. Groups the exact engine cannot model are named in the assumptions.
void apply_exact_cross_check(const Project& project, const Sif& sif, SifResult& result, std::vector<Warning>& warnings,
                             ExactCache& cache);

/// The curve of one SIF from the exact engine: PFD(t) of the SIF and of each subsystem over the
/// mission, `points` evenly spaced samples plus every test instant (vendor figures as constant
/// lines), with the names of the subsystems and the SIF's exact mission average. Throws
/// UsageError when a group cannot be modelled.
PfdPlot exact_curve(const Project& project, const Sif& sif, int points);

}  // namespace sifter
