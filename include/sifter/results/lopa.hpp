#pragma once
/// A scenario's LOPA, as results: findings, worksheet rows, consequences, causes, and what it asks of its SIF.
/// Plain data of the results contract: the standard library and the model only.
#include <cstddef>
#include <optional>
#include <string>
#include <vector>

#include "sifter/model/model.hpp"

namespace sifter {

/// What a finding is about.
enum class FindingKind {
  kNotIndependent,     ///< a layer shares a device with a cause, another layer or the SIF
  kBpcsCreditCapped,   ///< a BPCS function or operator response claimed a PFD below 0.1
  kTooManyBpcsLayers,  ///< more than two BPCS-based layers in one scenario
  kResponseTime,       ///< an operator response has too little time
  kNoSifNeeded,        ///< required risk reduction of 10 or less
  kSil4Review,         ///< required risk reduction above 10 000
  kModeMismatch,       ///< the stated demand mode contradicts the demand rate
  kImplausiblyLowPfd,  ///< a credited layer claims a PFD below 1e-5
};

/// The output name of a finding kind: "not_independent", "bpcs_credit_capped", ...
std::string to_string(FindingKind kind);

/// One finding, in plain English naming the tags and both parties.
struct Finding {
  FindingKind kind = FindingKind::kNotIndependent;
  std::string message;
};

/// The kind of a worksheet row.
enum class WorksheetStep {
  kCause,        ///< an initiating cause: value = IEF per year
  kEnabling,     ///< an enabling condition of the cause above: value = probability
  kLayer,        ///< a protection layer: value = PFD credited (claimed when not credited)
  kSif,          ///< the SIF under assessment, not credited in the frequency without it
  kNotCredited,  ///< a layer the author considered and did not credit (Scenario::not_credited)
  kTotal,        ///< the causes summed, before the modifiers
  kModifier,     ///< a conditional modifier of the consequence: value = probability
  kTarget,       ///< value = target per year; frequency = without the SIF; gap = required RRF
  kWithSif,      ///< value = the SIF's PFDavg (or PFH per hour); frequency = mitigated
};

/// The output name of a step: "cause", "enabling", "layer", "sif", "not_credited", "total",
/// "modifier", "target", "with_sif".
std::string to_string(WorksheetStep step);

/// One row of the LOPA worksheet, ready to print: writers compute nothing.
struct WorksheetRow {
  WorksheetStep step = WorksheetStep::kCause;
  std::string consequence;  ///< category of modifier, target and with-SIF rows; else empty
  std::string cause;        ///< the cause a cause, enabling, layer or SIF row belongs to
  std::string item;         ///< id of the cause, layer or SIF; empty for conditions and modifiers
  std::string title;
  std::optional<double> value;             ///< see WorksheetStep
  bool credited = true;                    ///< false for a layer given no credit
  std::string note;                        ///< why no credit, the cap, the independence note
  std::optional<double> frequency_per_yr;  ///< frequency after this step
  std::optional<double> gap;               ///< target rows: frequency / target (required RRF)
};

/// The figures of one consequence of a scenario.
struct ConsequenceResult {
  std::string category;  ///< empty when the scenario gives its target frequency directly
  std::string severity;
  double target_frequency_per_yr = 0.0;
  double modifier_product = 1.0;  ///< the modifiers that apply to this category, multiplied
  double frequency_without_sif_per_yr = 0.0;
  double required_pfd = 1.0;                         ///< target / frequency without the SIF, at most 1
  double required_rrf = 0.0;                         ///< frequency without the SIF / target (below 1: met already)
  int required_sil = 0;                              ///< from the RRF (low demand) or the required PFH (high)
  std::optional<double> required_pfh_per_hour;       ///< whenever there is a SIF
  std::optional<double> mitigated_frequency_per_yr;  ///< with the SIF's computed figure
  std::optional<bool> meets_target;
};

/// What one initiating cause contributes, before the modifiers.
struct CauseResult {
  std::string id;
  double frequency_per_yr = 0.0;              ///< initiating event frequency
  double enabling_product = 1.0;              ///< its enabling conditions, multiplied
  double demand_rate_per_yr = 0.0;            ///< x the layers credited before the SIF: demands on it
  double frequency_without_sif_per_yr = 0.0;  ///< x every layer credited against it
  bool sif_credited = true;                   ///< the SIF is independent of this cause (or justified)
};

/// The result of one scenario. The top-level figures are those of the governing consequence
/// (largest required RRF); required_rrf and required_sil are the largest over consequences.
struct ScenarioResult {
  std::string id;
  std::string title;
  std::optional<std::string> sif;  ///< the SIF under assessment
  double target_frequency_per_yr = 0.0;
  double frequency_without_sif_per_yr = 0.0;
  double required_pfd = 1.0;
  double required_rrf = 0.0;
  int required_sil = 0;
  std::optional<double> demand_rate_per_yr;      ///< demands on the SIF
  std::optional<DemandMode> demand_mode;         ///< decided: the stated mode, else the rate's
  std::optional<DemandMode> demand_mode_stated;  ///< as the SIF states it
  std::optional<double> required_pfh_per_hour;   ///< high demand: the smallest over consequences
  std::optional<double> sif_pfd_avg;             ///< the SIF's computed PFDavg used (low demand)
  std::optional<double> sif_pfh_per_hour;        ///< the SIF's computed PFH used (high demand)
  std::optional<double> sif_credit_pfd;          ///< what the SIF is credited with (PFD, or PFH high demand)
  std::optional<bool> sif_credit_capped;         ///< the band of its achieved SIL caps the credit
  std::optional<double> mitigated_frequency_per_yr;
  std::optional<bool> meets_target;       ///< every consequence meets its target
  std::size_t governing_consequence = 0;  ///< index into consequences
  std::vector<ConsequenceResult> consequences;
  std::vector<CauseResult> causes;
  std::vector<Finding> findings;
  std::vector<std::string> assumptions;
  /// Empty where the run prints no worksheet (VerifyOptions::worksheet_rows); every figure
  /// above is the same either way.
  std::vector<WorksheetRow> worksheet;
  bool generated = false;  ///< made by the overpressure screening
  // Data maturity: the verdict rests on these estimates (empty: it does not).
  bool preliminary = false;
  std::vector<std::string> preliminary_because;
};

/// What the scenarios require of one SIF.
struct SifRequirement {
  std::string sif;
  std::vector<std::string> scenarios;  ///< the scenarios that assess it, in order
  std::string governing_scenario;      ///< the one with the largest required RRF
  double required_rrf = 0.0;           ///< the largest over its scenarios
  double required_pfd = 1.0;           ///< 1 / required_rrf, at most 1
  int sil_required = 0;                ///< from required_rrf (low) or required PFH (high demand)
  double demand_rate_per_yr = 0.0;     ///< summed over its scenarios
  DemandMode demand_mode = DemandMode::kLow;
  std::optional<double> required_pfh_per_hour;  ///< high demand: smallest over its scenarios
  std::vector<Finding> findings;
  std::vector<std::string> assumptions;
};

}  // namespace sifter
