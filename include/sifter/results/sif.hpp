#pragma once
/// Result structs: the numbers and the reasons, so that every writer can show them without computing.
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/diagnostics.hpp"
#include "sifter/model/model.hpp"
#include "sifter/results/constraints.hpp"
#include "sifter/results/shared_text.hpp"

namespace sifter {

/// The caution every output people read carries.
inline constexpr const char* kCaution =
    "sifter is a calculation aid, not a substitute for engineering judgement. Every result must be "
    "reviewed by a competent functional-safety practitioner before it is used; IEC 61511, local codes "
    "and licensed engineering practice take precedence. Failure data must be credible and traceable "
    "to their source.";

/// What an element's systematic result rests on.
enum class SystematicGround {
  kSystematicCapability,  ///< its SC (IEC 61508 compliance)
  kPriorUse,              ///< a prior-use claim above its SC (IEC 61511-1:2016 11.5.3)
  kNone,                  ///< neither: no systematic result
};

/// The words of the results file and the report: "systematic capability", "prior use", "none".
std::string to_string(SystematicGround ground);

/// On what an element's systematic result rests: its SC or a prior-use claim.
struct SystematicBasis {
  std::string component;
  SystematicGround basis = SystematicGround::kNone;
  std::optional<int> sil;  ///< the SC or the SIL claimed on prior use
  std::string evidence;    ///< the prior-use evidence, quoted
};

/// One step of a SIF's response time: a subsystem's time and the element that governs it.
struct ResponseTimeStep {
  std::string subsystem;
  std::optional<double> seconds;     ///< empty when an element's response time is not stated
  std::vector<std::string> path;     ///< the slowest channel's elements ("SOV-1", "XV-1")
  std::vector<double> path_seconds;  ///< their own times, same order
  bool stated_on_subsystem = false;  ///< "response_time" written on the subsystem itself
  std::vector<std::string> missing;  ///< elements without a response time
};

/// A computed check of a SIF against its stated requirements.
struct RequirementCheck {
  std::string check;  ///< "response_time_s", "spurious_trip_rate_per_yr", "proof_test_interval_h"
  bool ok = true;
  double value = 0.0;  ///< in the unit the check's name ends with
  double limit = 0.0;
  std::string message;
};

/// The figure a verdict rests on.
enum class JudgedOn { kSimplified, kExact };

/// Why the judged figure is the one it is.
enum class JudgedWhy {
  kOnlyFigure,        ///< no exact figure (not run, or the exact engine cannot model a group)
  kMoreConservative,  ///< the default rule: the larger of the two
  kProjectChoice,     ///< the project's "judge_on"
  kChannelsDiffer,    ///< the Annex B forms need identical channels
  kBeyondSimplified,  ///< the simplified figure is outside its validity (lDU T1 large, or above 1)
};

/// "simplified" or "exact"; and the reason in words.
std::string to_string(JudgedOn on);
std::string to_string(JudgedWhy why);

/// The result of one subsystem (voting group or vendor figure).
struct SubsystemResult {
  std::string name;
  std::string template_name;  ///< the subsystem template it was built from, empty if none
  Role role = Role::kSensor;
  std::string vote;                                ///< "2oo3", or "vendor" for a safety-manual figure
  std::optional<Vote> voting;                      ///< the vote as data; empty for a safety-manual figure
  std::vector<std::vector<std::string>> channels;  ///< component tags of each channel
  std::optional<double> pfd_avg;
  std::optional<double> pfh_per_hour;
  double share = 0.0;  ///< of the SIF's PFDavg (or PFH)
  double independent_undetected = 0.0;
  double independent_detected = 0.0;
  double common_cause = 0.0;
  double beta_effective = 0.0;
  double beta_d_effective = 0.0;
  std::string equation;
  FailureRates channel_rates;  ///< one channel's rates, series elements added
  Duration proof_test_interval;
  // Architectural constraints and systematic capability.
  std::optional<int> hft;
  std::optional<double> sff;
  int sil_architecture = 0;
  std::optional<int> systematic_capability;
  std::vector<std::string> constraint_notes;
  // Exact cross-check.
  std::optional<double> pfd_avg_exact;
  std::optional<double> pfh_exact_per_hour;
  // The judged figure (what the verdict rests on) and the simplified one kept for comparison.
  std::optional<double> pfd_avg_judged;
  std::optional<double> pfh_judged_per_hour;
  std::optional<double> pfd_avg_simplified;
  std::optional<double> pfh_simplified_per_hour;
  JudgedOn judged_on = JudgedOn::kSimplified;
  double test_duration_term = 0.0;  ///< PFD added by the channels' test duration (simplified)
  // Spurious trips.
  double spurious_trip_rate_per_yr = 0.0;
  std::optional<double> mttf_spurious_yr;
  std::vector<SystematicBasis> systematic_basis;  ///< each element once, in channel order
};

/// Monte Carlo summary of a SIF's PFDavg (or PFH).
struct UncertaintyResult {
  double mean = 0.0;
  double p05 = 0.0;
  double p50 = 0.0;
  double p95 = 0.0;
  double probability_meets_target = 0.0;
  int samples = 0;
  std::string method;
};

/// The verification of one SIF.
struct SifResult {
  std::string id;
  std::string title;
  DemandMode demand_mode = DemandMode::kLow;
  std::string demand_mode_basis;  ///< why this mode: stated, default, or from the LOPA demand rate
  std::optional<double> pfd_avg;
  std::optional<double> pfh_per_hour;
  std::optional<double> rrf;
  int sil_probability = 0;
  std::optional<int> sil_required;
  std::optional<double> required_rrf;
  std::optional<double> required_pfd;
  std::optional<double> required_pfh_per_hour;
  std::string target_text;  ///< the target as a reviewer reads it
  std::optional<bool> meets_target;
  int sil_architecture = 0;
  int sil_systematic = 0;
  int sil_achieved = 0;
  ConstraintBasis constraints = ConstraintBasis::kIec61511;
  std::vector<Limit> limits;
  std::vector<SubsystemResult> subsystems;
  Assumptions assumptions;             ///< the engines' texts held once per run (TextPool); the
                                       ///< uncertainty line, added later, is the SIF's own
  std::vector<std::string> warnings;   ///< the project's warnings about this SIF, also in `warnings`
  std::vector<std::string> scenarios;  ///< ids of the scenarios that feed it
  // Exact cross-check.
  std::optional<double> pfd_avg_exact;
  std::optional<double> pfh_exact_per_hour;
  std::optional<double> simplified_over_exact;
  // The judged figure: pfd_avg / pfh_per_hour above are it; these say which and why.
  std::optional<double> pfd_avg_simplified;
  std::optional<double> pfh_simplified_per_hour;
  JudgedOn judged_on = JudgedOn::kSimplified;
  JudgedWhy judged_why = JudgedWhy::kOnlyFigure;
  bool demand_mode_raised = false;   ///< stated low demand, demanded more than once a year: judged high
  std::optional<double> credit_pfd;  ///< the PFD (or PFH) its scenarios credit: judged, no better than its SIL band
  bool credit_capped = false;
  // Spurious trips.
  double spurious_trip_rate_per_yr = 0.0;
  std::optional<double> mttf_spurious_yr;
  std::optional<UncertaintyResult> uncertainty;
  // Stated requirements (the SRS) and the checks computed against them.
  std::optional<double> response_time_s;        ///< empty when an element's time is not stated
  std::optional<double> response_time_limit_s;  ///< fraction x process safety time; empty without one
  /// The subsystems in signal order; empty where the run prints no budget (`check`:
  /// VerifyOptions::response_budgets), the response time above computed from it all the same.
  std::vector<ResponseTimeStep> response_budget;
  std::vector<RequirementCheck> requirement_checks;
  // Data maturity: the verdict rests on these estimates (empty: it does not).
  bool preliminary = false;
  std::vector<std::string> preliminary_because;
  /// A figure below zero that no rounding explains came out of the engines (a defect of sifter):
  /// the SIF is judged short and credited nothing (probability_cap.hpp).
  bool figures_defective = false;
  /// The judged PFDavg as summed over the subsystems, where it was above 1: outside the validity
  /// of the rare-event sum, it is shown as 1, and the judge never passes it, whatever the target
  /// (probability_cap.hpp). The longest-interval solver measures this sum.
  std::optional<double> judged_sum_above_one;

  /// The measure the SIF is judged on in its demand mode: PFDavg (low) or PFH per hour (high);
  /// empty when a subsystem gives no figure for that mode. The SIL from probability, the verdict,
  /// the credit, the Monte Carlo, the what-ifs and the service ask here.
  std::optional<double> judged_figure() const { return demand_mode == DemandMode::kLow ? pfd_avg : pfh_per_hour; }
};

/// The value a SIF's figure must not exceed, as verify judges it: the required PFDavg (or PFH)
/// where one is set, or the upper edge of the required SIL's band, whichever is stricter.
struct Requirement {
  DemandMode mode = DemandMode::kLow;
  double value = 0.0;      ///< PFDavg, or PFH per hour
  bool band_edge = false;  ///< the band edge governs; it is exclusive (PFDavg 0.01 is SIL 1)
  std::string basis;       ///< for people: "SIL 2 band (PFDavg < 0.01)", "required PFDavg 0.00167"
};

/// The source cited in every output that shows a spurious trip rate.
inline constexpr const char* kSpuriousTripSource =
    "Gruhn & Cheddie, Safety Instrumented Systems, 2nd ed., 8.9 (from memory)";

/// The results (of probability, architecture and systematic) whose SIL equals the achieved one.
std::vector<std::string> limiting_results(const SifResult& sif);

/// The governing requirement of a verified SIF; empty when it has no target and no scenario.
std::optional<Requirement> governing_requirement(const SifResult& result);

}  // namespace sifter
